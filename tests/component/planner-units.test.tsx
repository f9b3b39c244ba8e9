import { act, screen, waitFor, within } from '@testing-library/react';
import { vi } from 'vitest';
import { computePlan } from '../../src/physics';
import { planFileToInput } from '../../src/io/plan-file';
import { lastDraw } from './fake-plotly';
import { demoPlan, field, openPlanner, repaste, retype, store, shown } from './planner-helpers';

/**
 * The planner follows the header's display units: values typed and shown for temperatures,
 * lengths, times, pressures and heat fluxes are in the chosen unit; the plan itself (SI) never
 * changes when only the unit does. Unit factors: SI prefixes and 1 torr = 101325/760 Pa (the
 * definition of the torr).
 */
describe('planner in the chosen display units', () => {
  function choose(...pairs: Parameters<ReturnType<typeof store>['setDisplayUnit']>[]) {
    act(() => {
      for (const [kind, unit] of pairs) store().setDisplayUnit(kind, unit);
    });
  }

  it('shows the fields in the chosen unit and leaves the plan as it was', async () => {
    await openPlanner();
    const before = store().plannerPlan;
    // The usual units first: ms and mm.
    expect(shown('Pulse width')).toBe('0.1 ms');
    choose(['time', 'µs'], ['length', 'cm'], ['heatFlux', 'W/m2']);
    expect(shown('Pulse width')).toBe('100 µs');
    expect(shown('Record length')).toBe(`${Number((before.digitiser.recordLength_s * 1e6).toPrecision(6))} µs`);
    expect(shown('Sensor 1 distance')).toBe(`${Number(((before.sensors[0]?.distance_m as number) * 100).toPrecision(6))} cm`);
    expect(shown('Peak heat flux')).toBe(`${Number((before.heater.flux_W_m2 as number).toPrecision(6))} W/m²`);
    // Uncertainties and time constants keep the unit that suits them.
    expect(shown('Sensor 1 distance sd')).toMatch(/^\d+(\.\d+)? (mm|µm)$/);
    choose(['time', 's']);
    expect(shown('Pulse width')).toBe('0.0001 s');
    expect(shown('Sensor 1 lag')).toMatch(/^\d+(\.\d+)? (ms|µs|ns)$/);
    expect(shown('Rise time')).toMatch(/^\d+(\.\d+)? (ms|µs|ns)$/);
    expect(store().plannerPlan).toBe(before);
  });

  it('reads a typed bare quantity with its unit as before, whatever unit is shown', async () => {
    const { user } = await openPlanner();
    choose(['length', 'm']);
    await retype(user, 'Sensor 1 distance', '12 mm');
    expect(store().plannerPlan.sensors[0]?.distance_m).toBeCloseTo(0.012, 12);
    await user.tab();
    expect(shown('Sensor 1 distance')).toBe('0.012 m');
  });

  it('keeps a refused draft and its message when the unit changes under it', async () => {
    const { user } = await openPlanner();
    const before = store().plannerPlan;
    await repaste(user, 'Pulse width', '20 s');
    expect(screen.getByRole('alert')).toBeInTheDocument();
    choose(['time', 's']);
    expect(field('Pulse width')).toHaveValue('20 s');
    expect(screen.getByRole('alert')).toBeInTheDocument();
    expect(store().plannerPlan).toBe(before);
    await user.click(field('Pulse width'));
    await user.keyboard('{Escape}');
    expect(shown('Pulse width')).toBe('0.0001 s');
  });

  it('shows the results, the heater summary and the charts in the chosen units', async () => {
    await openPlanner();
    const result = computePlan(planFileToInput(demoPlan()));
    choose(['temperature', 'mK'], ['time', 'µs'], ['length', 'cm'], ['pressure', 'torr']);
    const table = screen.getByRole('table', { name: /predicted arrivals/i });
    const headers = within(table)
      .getAllByRole('columnheader')
      .map((h) => h.textContent);
    expect(headers).toContain('Second sound (µs)');
    expect(headers).toContain('Cold path (cm)');
    const first = result.sensors[0];
    if (!first || first.secondSoundArrival_s === null) throw new Error('demo sensor 1 has no second sound');
    const second = table.querySelector('td[data-column="second"]');
    expect(Number(second?.textContent)).toBeCloseTo(first.secondSoundArrival_s * 1e6, 0);
    expect(screen.getByText(/Linear theory at \d+\.\d mK/)).toBeInTheDocument();

    const summary = screen.getByRole('region', { name: 'Heater and bath' });
    const value = (term: string) => within(summary).getByText(term).nextElementSibling?.querySelector('.summary-list__value')?.textContent;
    expect(value('Bath temperature')).toBe(`${(result.temperature_K * 1e3).toFixed(1)} mK`);
    expect(value('Head pressure at the setup')).toMatch(/ torr$/);
    expect(value('Pulse length')).toMatch(/ µs$/);

    await waitFor(() => expect(lastDraw('planner-timeline')?.layout.xaxis?.title).toMatchObject({ text: expect.stringContaining('(µs)') }));
    const timeline = lastDraw('planner-timeline');
    const line = timeline?.data.find((t) => t.name?.startsWith(first.label));
    const xs = (line?.x ?? []) as number[];
    // The x values are µs now: the direct arrival (µs) lies within the drawn span.
    expect(Math.max(...xs)).toBeGreaterThan(first.secondSoundArrival_s * 1e6);

    await waitFor(() => expect(lastDraw('planner-resolution-map')?.layout.xaxis?.title).toMatchObject({ text: expect.stringContaining('(mK)') }));
    const map = lastDraw('planner-resolution-map');
    expect(map?.layout.yaxis?.title).toMatchObject({ text: expect.stringContaining('(cm)') });
    const planned = map?.data.find((t) => t.name === 'Planned');
    expect(planned?.x[0]).toBeCloseTo(result.temperature_K * 1e3, 6);
    expect(planned?.y[0]).toBeCloseTo(first.pathLength_m * 100, 6);
  });

  it('downloads the warnings as a CSV table, values in SI with their unit', async () => {
    const files: { name: string; blob: Blob }[] = [];
    const blobs = new Map<string, Blob>();
    vi.stubGlobal('URL', Object.assign(URL, {
      createObjectURL: (blob: Blob) => {
        const url = `blob:test/${blobs.size + 1}`;
        blobs.set(url, blob);
        return url;
      },
      revokeObjectURL: () => undefined,
    }));
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      const blob = blobs.get(this.href);
      if (blob) files.push({ name: this.download, blob });
    });
    try {
      const { user } = await openPlanner();
      await retype(user, 'Record length', '2 ms');
      const count = screen.getByRole('list', { name: 'Plan warnings' }).querySelectorAll('li').length;
      await user.click(screen.getByRole('button', { name: "Download the plan's warnings as CSV" }));
      expect(files.map((f) => f.name)).toEqual(['plan-warnings.csv']);
      const lines = (await (files[0] as { blob: Blob }).blob.text()).trim().split('\r\n');
      expect(lines[0]).toBe('severity,code,sensor_id,sensor_label,message,what,value,limit_what,limit,unit');
      expect(lines).toHaveLength(count + 1);
      expect(lines.some((line) => line.startsWith('caution,record-too-short,b25,') && line.endsWith(',s'))).toBe(true);
    } finally {
      vi.restoreAllMocks();
      vi.unstubAllGlobals();
    }
  });
});
