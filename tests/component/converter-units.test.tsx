import { act, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { convertDelay, secondSound, vapourPressure } from '../../src/physics';
import { FIELD_SPECS } from '../../src/ui/converter/converter-fields';
import { shownFieldUnit } from '../../src/ui/fields/field-spec';
import { unitViewsOf } from '../../src/ui/units/unit-views';
import { buildSeries, seriesTable } from '../../src/ui/converter/series';
import { ARRIVAL_SHAPE, traceFigure } from '../../src/ui/converter/trace/trace-figure';
import type { TracePick } from '../../src/io/trace-pick';
import { useSekundoStore } from '../../src/ui/store';
import { DEFAULT_DISPLAY_UNITS, type DisplayUnitOf, type DisplayUnits, UNIT_KINDS, type UnitKind } from '../../src/ui/units/unit-choices';
import { lastDraw } from './fake-plotly';

/*
 * The converter follows the header's display units: results and exports are shown in them, value
 * fields follow them until someone picks a unit in the field's own menu, and the values (SI in the
 * store) never change with the units.
 *
 * The reading on screen is the converter's starting one (invented): 50 mm ± 0.1 mm in
 * 2.5 ms ± 2 µs, so u = 20.00 m/s, between the extrema of u₂: three candidates, the warmest
 * 1.7851 K (the kernel's root; ITS-90 puts 1638.2 Pa at 1.8000 K, nearest that one).
 */

type User = ReturnType<typeof userEvent.setup>;
const store = () => useSekundoStore.getState();
const START = { distance_m: 0.05, delay_s: 2.5e-3, distanceSd_m: 1e-4, delaySd_s: 2e-6, offset_s: 0, offsetSd_s: 0 };

async function openConverter(): Promise<User> {
  const user = userEvent.setup();
  render(<App />);
  await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
  return user;
}

function choose<K extends UnitKind>(kind: K, unit: DisplayUnitOf<K>) {
  act(() => store().setDisplayUnit(kind, unit));
}

const field = (name: string) => screen.getByRole('textbox', { name });
const unitOf = (name: string) => screen.getByRole('combobox', { name: `${name} unit` });

function candidateRows() {
  return within(screen.getByRole('table', { name: /every temperature with u₂/i })).getAllByRole('row').slice(1);
}

/** Catches what an export downloads: the Blobs behind the object URLs. */
function captureDownloads() {
  const blobs: Blob[] = [];
  URL.createObjectURL = vi.fn((blob: Blob) => {
    blobs.push(blob);
    return `blob:test/${blobs.length}`;
  }) as typeof URL.createObjectURL;
  URL.revokeObjectURL = vi.fn();
  const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
  return { blobs, restore: () => click.mockRestore() };
}

describe('converter fields and the header units', () => {
  it('offers every header unit in the menu of every field of its kind', () => {
    for (const spec of Object.values(FIELD_SPECS)) {
      const kind = spec.kind?.follows;
      if (kind === undefined) continue;
      for (const { unit } of UNIT_KINDS[kind].choices) expect(spec.units, `${spec.label} menu`).toContain(unit);
    }
  });

  it('a value field takes the header unit; an sd or the offset sits on its ladder, whatever the header says', () => {
    const units = { ...DEFAULT_DISPLAY_UNITS, length: 'm', time: 's' } as const;
    const shown = (key: keyof typeof FIELD_SPECS, header: DisplayUnits = units) => shownFieldUnit(FIELD_SPECS[key], FIELD_SPECS[key].initial, header);
    expect(shown('delay')).toBe('s');
    expect(shown('distance')).toBe('m');
    // 2 µs and 0.1 mm = 100 µm: the units where their numbers read at least 1.
    expect(shown('delaySd')).toBe('µs');
    expect(shown('distanceSd')).toBe('µm');
    expect(shown('delaySd', { ...units, time: 'µs' })).toBe('µs');
    // The instrument offset t₀ is a few µs: zero shows in µs, so a bare "20" means 20 µs.
    expect(shown('offset')).toBe('µs');
    expect(shown('offset', { ...units, time: 'ms' })).toBe('µs');
    expect(shown('offsetSd')).toBe('µs');
    expect(shown('fraction')).toBeNull();
  });

  it('switching the header units re-shows the following fields; no value changes', async () => {
    await openConverter();
    const before = store().converterValues;
    expect(field('Delay')).toHaveValue('2.5');
    expect(unitOf('Delay')).toHaveValue('ms');
    choose('time', 'µs');
    choose('length', 'cm');
    choose('temperature', 'mK');
    expect(field('Delay')).toHaveValue('2500');
    expect(unitOf('Delay')).toHaveValue('µs');
    expect(field('Distance')).toHaveValue('5');
    expect(unitOf('Distance')).toHaveValue('cm');
    expect(field('Offset t₀')).toHaveValue('0');
    expect(unitOf('Offset t₀')).toHaveValue('µs');
    // The sds keep the units of their ladders (µs, µm) whatever the header says.
    expect(field('Delay sd')).toHaveValue('2');
    expect(unitOf('Delay sd')).toHaveValue('µs');
    expect(field('Distance sd')).toHaveValue('100');
    expect(unitOf('Distance sd')).toHaveValue('µm');
    expect(field('Expected temperature')).toHaveValue('1800');
    expect(unitOf('Expected temperature')).toHaveValue('mK');
    choose('time', 's');
    expect(field('Delay')).toHaveValue('0.0025');
    expect(field('Delay sd')).toHaveValue('2');
    expect(store().converterValues).toEqual(before);
  });

  it('a unit picked in a field’s own menu stays when the header changes', async () => {
    const user = await openConverter();
    await user.selectOptions(unitOf('Delay'), 's');
    expect(field('Delay')).toHaveValue('0.0025');
    choose('time', 'µs');
    expect(field('Delay')).toHaveValue('0.0025');
    expect(unitOf('Delay')).toHaveValue('s');
    // Its neighbour still follows.
    expect(unitOf('Offset t₀')).toHaveValue('µs');
  });

  it('keeps a draft being typed, and a refused entry with its message, until it is left or dropped', async () => {
    const user = await openConverter();
    await user.clear(field('Delay'));
    await user.type(field('Delay'), '2.7');
    // A good value applies as it is typed (the same rule in every view).
    expect(store().converterValues.delay).toBeCloseTo(2.7e-3, 15);
    choose('time', 'µs');
    // The draft keeps its text and the unit it was typed against.
    expect(field('Delay')).toHaveValue('2.7');
    expect(unitOf('Delay')).toHaveValue('ms');
    await user.type(field('Delay'), '{Enter}');
    // Left, the field follows the header again.
    expect(field('Delay')).toHaveValue('2700');
    expect(unitOf('Delay')).toHaveValue('µs');

    await user.clear(field('Distance'));
    await user.type(field('Distance'), '-3{Enter}');
    const message = screen.getByRole('alert').textContent;
    expect(message).toMatch(/^Distance must be .*; “-3” is outside\.$/);
    choose('length', 'm');
    expect(field('Distance')).toHaveValue('-3');
    expect(screen.getByRole('alert').textContent).toBe(message);
    expect(store().converterValues.distance).toBe(0.05);
    // Escape drops the refused entry: the good value, in the header's unit.
    await user.type(field('Distance'), '{Escape}');
    expect(field('Distance')).toHaveValue('0.05');
    expect(unitOf('Distance')).toHaveValue('m');
  });

  it('follows the units kept from the last visit', async () => {
    await openConverter();
    act(() => store().applyPreferences({ 'unit.time': 'µs', 'unit.pressure': 'mbar' }));
    expect(field('Delay')).toHaveValue('2500');
    expect(unitOf('Vapour pressure')).toHaveValue('mbar');
  });
});

describe('converter results in the header units', () => {
  it('shows the candidates, the chosen temperature and the u₂ chart in mK, each value rounded with its sd', async () => {
    const user = await openConverter();
    await user.type(field('Vapour pressure'), '1638.2{Enter}');
    const values = store().converterValues;
    choose('temperature', 'mK');
    const candidates = convertDelay(START).candidates;
    // sds 5.7, 15.8 and 10.9 mK from the kernel (the 0.1 mm distance sd dominates): whole mK.
    expect(candidateRows().map((r) => within(r).getAllByRole('cell')[0]?.textContent)).toEqual(['946 mK', '1492 mK', '1785 mK']);
    expect(candidateRows().map((r) => within(r).getAllByRole('cell')[1]?.textContent)).toEqual(['± 6 mK', '± 16 mK', '± 11 mK']);
    expect(screen.getByTestId('chosen-temperature')).toHaveTextContent(/^1785$/);
    expect(screen.getByTestId('chosen-temperature').nextElementSibling).toHaveTextContent('± 11 mK');
    // The reasons name temperatures in mK too: ITS-90 puts 1638.2 Pa at 1800.0 mK.
    expect(screen.getByText(/Nearest to 1800\.0 mK from the vapour pressure \(ITS-90\)/)).toBeInTheDocument();
    expect(candidateRows()[0]).toHaveTextContent(/−854 mK from the vapour-pressure temperature 1800\.0 mK/);
    await waitFor(() => expect(lastDraw('converter-speed')?.layout.xaxis?.title?.text).toBe('Temperature T (mK)'));
    const chosen = lastDraw('converter-speed')?.data.find((t) => t.name === 'Chosen');
    expect(chosen?.x[0]).toBeCloseTo((candidates[2]?.temperature_K ?? Number.NaN) * 1e3, 9);
    // The speed is no temperature: still m/s.
    expect(screen.getByTestId('speed')).toHaveTextContent('20.00');
    expect(store().converterValues).toEqual(values);
  });

  it('exports the reading with its columns named and valued in the display units', async () => {
    const user = await openConverter();
    await user.type(field('Vapour pressure'), '1638.2{Enter}');
    choose('temperature', 'mK');
    choose('time', 'µs');
    choose('length', 'm');
    choose('pressure', 'mbar');
    const downloads = captureDownloads();
    await user.click(screen.getByRole('button', { name: 'Export the result as CSV' }));
    downloads.restore();
    const lines = ((await downloads.blobs[0]?.text()) ?? '').trimEnd().split('\n');
    expect(lines[0]).toBe(
      'distance_m,distance_sd_m,delay_us,delay_sd_us,offset_us,offset_sd_us,speed_m_s,speed_sd_m_s,rule,candidate,T_mK,T_sd_mK,T_sd_meas_mK,T_sd_curve_mK,T_lo68_mK,T_hi68_mK,T_lo95_mK,T_hi95_mK,reaches95,evidence_sd,slope_m_s_K,branch,region,kind,insensitive,chosen,choice',
    );
    const c = convertDelay(START).candidates[2];
    const cells = lines[3]?.split(',') ?? [];
    expect(cells.slice(0, 6).map(Number)).toEqual([0.05, 0.0001, 2500, 2, 0, 0]);
    // 1638.2 Pa = 16.382 mbar (1 mbar = 100 Pa, SI).
    expect(cells[8]).toBe('vapour pressure 16.382 mbar');
    expect(Number(cells[10])).toBeCloseTo((c?.temperature_K ?? Number.NaN) * 1e3, 9);
    expect(Number(cells[11])).toBeCloseTo((c?.sd_K ?? Number.NaN) * 1e3, 12);
    expect(Number(cells[12])).toBeCloseTo((c?.sdMeasurement_K ?? Number.NaN) * 1e3, 12);
    expect(Number(cells[16])).toBeCloseTo((c?.interval95_K[0] ?? Number.NaN) * 1e3, 9);
    expect(cells[26]).toBe('nearest to 1800.0 mK from the vapour pressure (ITS-90)');
  });

  it('shows and exports a batch in the display units', async () => {
    const user = await openConverter();
    await user.click(screen.getByRole('tab', { name: 'Batch file' }));
    // Invented: 50 mm in 50 mm / u₂(T) at 1.90 and 1.86 K, the first row with its ITS-90 vapour pressure.
    const rows = [1.9, 1.86].map((T, i) => `${((0.05 / secondSound(T)) * 1e3).toPrecision(12)},${i === 0 ? vapourPressure(T).pressure_Pa.toPrecision(12) : ''}`);
    await user.upload(screen.getByLabelText('Choose a CSV file'), new File([`delay_ms,pressure_Pa\n${rows.join('\n')}\n`], 'two.csv', { type: 'text/csv' }));
    await screen.findByText(/2 readings; 2 with a chosen temperature/);
    choose('temperature', 'mK');
    choose('time', 'µs');
    choose('pressure', 'mbar');
    const table = screen.getByRole('table', { name: /each reading’s speed and temperature/i });
    const headers = within(table).getAllByRole('columnheader').map((h) => h.textContent);
    expect(headers).toEqual(['Line', 'Delay (µs)', 'Pressure (mbar)', 'Speed (m/s)', 'T (mK)', 'sd (mK)', '95 % interval (mK)', 'Chosen by', 'All candidates (mK)']);
    const first = within(table).getAllByRole('row')[1];
    const cells = first ? within(first).getAllByRole('cell') : [];
    expect(Number(cells[0]?.textContent)).toBeCloseTo((0.05 / secondSound(1.9)) * 1e6, 2);
    // Rounded to its sd (a few mK): the model's 1900 mK to within the rounding.
    expect(Math.abs(Number(cells[3]?.textContent) - 1900)).toBeLessThanOrEqual(0.5);
    await waitFor(() => expect(lastDraw('converter-batch')?.layout.yaxis?.title?.text).toBe('Temperature T (mK)'));
    expect(lastDraw('converter-batch')?.data.find((t) => t.name === 'Chosen temperature')?.y[0]).toBeCloseTo(1900, 6);

    const downloads = captureDownloads();
    await user.click(screen.getByRole('button', { name: 'Export the batch results as CSV' }));
    downloads.restore();
    const lines = ((await downloads.blobs[0]?.text()) ?? '').trimEnd().split('\n');
    expect(lines[0]?.split(',').slice(0, 13)).toEqual(['line', 'delay_us', 'distance_mm', 'pressure_mbar', 'speed_m_s', 'speedSd_m_s', 'candidates', 'chosen', 'chosen_by', 'T_mK', 'T_sd_mK', 'T_sd_meas_mK', 'T_sd_curve_mK']);
    const out = lines[1]?.split(',') ?? [];
    expect(Number(out[1])).toBeCloseTo((0.05 / secondSound(1.9)) * 1e6, 6);
    expect(Number(out[3])).toBeCloseTo(vapourPressure(1.9).pressure_Pa / 100, 6);
    expect(Number(out[9])).toBeCloseTo(1900, 6);
  });
});

/** A pick at the exact transit time of 50 mm at `T` (invented), sd 1 µs. */
function exactPick(T: number): TracePick {
  const delay_s = 0.05 / secondSound(T);
  return { arrival_s: delay_s, arrivalSd_s: 1e-6, delay_s, delaySd_s: 1e-6, timeZero_s: 0, timeZeroSd_s: 0, timeZero: 'file t = 0', reference: "from the file's t = 0", referenceTime_s: 0, picker: 'fraction', sensor: 's', heater: null, template: null, baseline: { level: 0, noise: 1, samples: 10 }, peak: 10, snr: 10 };
}

describe('trace series and trace chart in the header units', () => {
  const mK_us = unitViewsOf({ temperature: 'mK', length: 'mm', time: 'µs', pressure: 'mbar' });

  it('names and fills the series table’s columns in the display units', () => {
    const model = [1.86, 1.84];
    const files = model.map((T, i) => ({ id: `f${i}`, name: `f${i}.csv`, fields: (i === 0 ? { bath_vapour_pressure_Pa: String(vapourPressure(T).pressure_Pa) } : {}) as Record<string, string> }));
    const picks = new Map(model.map((T, i) => [`f${i}`, exactPick(T)]));
    const rows = buildSeries(files, picks, new Map(), { distance_m: 0.05, distanceSd_m: 0, offset_s: 0, offsetSd_s: 0 }, null);
    const table = seriesTable(rows, mK_us);
    const col = (name: string) => table.header.indexOf(name);
    for (const name of ['pressure_mbar', 'delay_us', 'delay_sd_us', 'T_mK', 'T_sd_mK', 'T1_mK', 'T3_sd_mK']) expect(table.header).toContain(name);
    table.rows.forEach((row, i) => {
      const T = model[i] as number;
      expect(row[col('delay_us')] as number).toBeCloseTo((0.05 / secondSound(T)) * 1e6, 6);
      expect(row[col('delay_sd_us')]).toBeCloseTo(1, 12);
      expect(row[col('T_mK')] as number).toBeCloseTo(T * 1e3, 6);
    });
    // 1 mbar = 100 Pa (SI).
    expect(table.rows[0]?.[col('pressure_mbar')] as number).toBeCloseTo(vapourPressure(1.86).pressure_Pa / 100, 9);
  });

  it('a file whose own pressure cannot be used says why; the files after it go on by continuity', () => {
    const model = [1.86, 1.85, 1.84];
    const files = model.map((_, i) => ({ id: `f${i}`, name: `f${i}.csv`, fields: (i === 1 ? { bath_vapour_pressure_Pa: '1e9' } : {}) as Record<string, string> }));
    const picks = new Map(model.map((T, i) => [`f${i}`, exactPick(T)]));
    const rows = buildSeries(files, picks, new Map(), { distance_m: 0.05, distanceSd_m: 0, offset_s: 0, offsetSd_s: 0 }, { kind: 'near', temperature_K: 1.86 });
    expect(rows.map((r) => r.chosenBy)).toEqual(['expected', null, 'continuity']);
    expect(rows[1]?.problem).toMatch(/vapour pressure .* outside the valid range/i);
    const last = rows[2];
    expect(last?.conversion?.candidates[last.chosen as number]?.temperature_K).toBeCloseTo(1.84, 9);
  });

  it('draws a trace against time in µs: samples, picked arrival and axis title', () => {
    const time_s = Float64Array.from({ length: 4001 }, (_, i) => i * 1e-6);
    const sensor = Float32Array.from(time_s, (t) => (t > 2.5e-3 ? 1 : 0));
    const pick = { ...exactPick(1.8), delay_s: 2.5e-3, arrival_s: 2.5e-3 };
    const figure = traceFigure({ samples: { time_s, channels: [{ name: 's', values: sensor }] }, sensor: 's', heater: null, pick, level: null, search: { from_s: null, to_s: null }, view: 'record', columns: 400, timeUnit: 'µs' });
    expect(figure.layout.xaxis?.title?.text).toBe('Time (µs)');
    expect(figure.layout.shapes?.find((s) => s.name === ARRIVAL_SHAPE)?.x0).toBeCloseTo(2500, 9);
    // The whole record, 0–4 ms, is 0–4000 µs; every sample drawn lies inside it.
    expect(figure.layout.xaxis?.range).toEqual([0, expect.closeTo(4000, 9)]);
    const x = figure.data.find((t) => t.name === 's (sensor)')?.x ?? [];
    expect(Math.max(...x)).toBeGreaterThan(3900);
    expect(Math.max(...x)).toBeLessThanOrEqual(4000 + 1e-9);
    expect(figure.layout.annotations?.[0]?.text).toBe('arrival 2500.0 µs');
  });
});
