import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import type { Unit } from '../../src/io/quantity';
import type { TraceInfo } from '../../src/ui/converter/trace/trace-protocol';
import { readFieldText } from '../../src/ui/fields/field-spec';
import { locateFieldKey } from '../../src/ui/locate/locate-fields';
import { type TraceSettingKey, traceSettingKey, traceSettingSpec } from '../../src/ui/locate/trace-fields';
import { PICKS_TRACE } from '../../src/ui/locate/locate-trace-figure';
import { TRACES_CHART_ID } from '../../src/ui/locate/LocateTraces';
import { lastDraw } from './fake-plotly';
import { DEMO_SENSORS, openLocate, shownSource, store } from './locate-helpers';

// jsdom has no Web Workers: the worker's boundary is replaced by the same service run in-process.
vi.mock('../../src/ui/converter/trace/trace-port', async () => {
  const { inProcessPort } = await import('./converter-trace-port');
  return { createTracePort: inProcessPort };
});

/*
 * Synthetic traces (invented): 5 µs steps from −0.5 ms to 15 ms; each pulsed channel rises
 * linearly from its arrival t_a to 10 mV in 20 µs and decays with a 300 µs time constant, over
 * ±0.2 mV of fixed pseudo-random noise (sd 0.115 mV). The fraction picker at 0.5 crosses 5 mV on
 * the linear rise, 10 µs after t_a (to the noise over the slope: 0.115 mV / 0.5 mV/µs ≈ 0.2 µs).
 * A channel given no arrival holds noise only.
 */
const STEP_S = 5e-6;
const RISE_S = 20e-6;
const HALF_RISE_S = RISE_S / 2;

function tracesCsv(channels: readonly { name: string; arrival_s: number | null }[], seed = 11): string {
  let state = seed;
  const noise = () => {
    state = (state * 16807) % 2147483647;
    return (state / 2147483647 - 0.5) * 0.4e-3;
  };
  const pulse = (t: number, ta: number | null) => {
    if (ta === null || t <= ta) return 0;
    const dt = t - ta;
    return dt < RISE_S ? (10e-3 * dt) / RISE_S : 10e-3 * Math.exp(-(dt - RISE_S) / 300e-6);
  };
  const lines = ['# Invented test traces', `time_s,${channels.map((c) => c.name).join(',')}`];
  for (let i = -100; i <= 3000; i++) {
    const t = i * STEP_S;
    lines.push(`${t.toPrecision(8)},${channels.map((c) => (pulse(t, c.arrival_s) + noise()).toPrecision(6)).join(',')}`);
  }
  return `${lines.join('\n')}\n`;
}

const csvFile = (text: string, name: string) => new File([text], name, { type: 'text/csv' });
const sensorSelect = (channel: string) => screen.getByRole('combobox', { name: `Sensor of channel ${channel}` });
const row = (label: string) => {
  const found = store().locateRows.find((r) => r.label === label);
  if (!found) throw new Error(`no sensor ${label}`);
  return found;
};
const demoArrival = (label: string) => DEMO_SENSORS.find((s) => s.label === label)?.arrival_s ?? Number.NaN;

async function openTraces(text: string, name = 'shot.csv') {
  const opened = await openLocate();
  await opened.user.upload(screen.getByLabelText('Open a trace file'), csvFile(text, name));
  await screen.findByRole('table', { name: 'Channels, their sensors and picked arrivals' }, { timeout: 10_000 });
  return opened;
}

const applyButton = () => screen.getByRole('button', { name: 'Use these arrivals' });

describe('locate view: arrival times from traces', () => {
  it('matches channels to sensors by name whatever the case, and lets a channel go to another sensor or none', async () => {
    const ta = { u0: 6e-3, U90: 7e-3, L45: 8e-3 };
    const { user } = await openTraces(
      tracesCsv([
        { name: 'u0', arrival_s: ta.u0 },
        { name: 'U90', arrival_s: ta.U90 },
        { name: 'trigger', arrival_s: null },
        { name: 'L45', arrival_s: ta.L45 },
      ]),
    );
    expect(sensorSelect('u0')).toHaveDisplayValue('U0');
    expect(sensorSelect('U90')).toHaveDisplayValue('U90');
    expect(sensorSelect('trigger')).toHaveDisplayValue('not used');
    expect(sensorSelect('L45')).toHaveDisplayValue('L45');

    // U90's channel goes to L135 instead; L45's channel is left out.
    await user.selectOptions(sensorSelect('U90'), 'L135');
    await user.selectOptions(sensorSelect('L45'), 'not used');
    expect(screen.getByText(/2 channels to their sensors; 2 not used/)).toBeInTheDocument();
    await waitFor(() => expect(applyButton()).toBeEnabled());
    await user.click(applyButton());

    expect(row('U0').arrival_s).toBeCloseTo(ta.u0 + HALF_RISE_S, 6);
    expect(row('L135').arrival_s).toBeCloseTo(ta.U90 + HALF_RISE_S, 6);
    // Sensors whose channel went elsewhere, was left out, or that have none keep what they had.
    for (const label of ['U90', 'L45', 'U180', 'U270', 'L225', 'L315']) expect(row(label).arrival_s).toBe(demoArrival(label));
    expect(screen.getByText('Arrivals and timing sds written for 2 sensors: U0, L135.')).toHaveAttribute('role', 'status');
    // The sensor table shows the picked arrival (ms) and the pick's sd (µs).
    expect(screen.getByLabelText('Arrival at U0 (ms)')).toHaveValue(String(Number(((row('U0').arrival_s ?? 0) * 1e3).toPrecision(6))));
    // The picker's stated sd: here its floor, a sample step over √12 (the noise over the slope, 0.2 µs, is less).
    const sd = row('U0').arrivalSd_s ?? 0;
    expect(sd).toBeCloseTo(STEP_S / Math.sqrt(12), 12);
    expect(screen.getByLabelText('Timing sd of U0')).toHaveValue(String(Number((sd * 1e6).toPrecision(6))));
  });

  it('refuses to write when two channels would go to one sensor, naming both', async () => {
    const { user } = await openTraces(
      tracesCsv([
        { name: 'U0', arrival_s: 6e-3 },
        { name: 'U90', arrival_s: 7e-3 },
      ]),
    );
    await user.selectOptions(sensorSelect('U90'), 'U0');
    expect(screen.getByRole('alert')).toHaveTextContent('Channels “U0” and “U90” are all matched to sensor U0: choose one, and set the others to “not used”.');
    expect(applyButton()).toBeDisabled();
  });

  it('writes the demo traces’ picks into every sensor row, and the source comes out where the typed demo puts it', async () => {
    const bytes = readFileSync(join(process.cwd(), 'public/demo-locate-traces.csv'));
    const fetchMock = vi.fn(async (url: string) => (url === 'demo-locate-traces.csv' ? new Response(bytes) : new Response('', { status: 404 })));
    vi.stubGlobal('fetch', fetchMock);
    try {
      // The speed held at u₂ (no prior): the two fits then differ only by the arrivals and their sds.
      const { user } = await openLocate(undefined, { speedPrior: false });
      const typed = { source: store().locateRows.map((r) => r.arrival_s), shown: shownSource() };
      await user.click(screen.getByRole('button', { name: 'Load the demo traces' }));
      await screen.findByRole('table', { name: 'Channels, their sensors and picked arrivals' }, { timeout: 10_000 });
      await waitFor(() => expect(applyButton()).toBeEnabled(), { timeout: 10_000 });
      await user.click(applyButton());
      for (const s of DEMO_SENSORS) {
        const r = row(s.label);
        // The demo traces are made so the half-height pick meets each demo arrival within 1 µs
        // (tests/support/locate-demo-traces.ts); the demo's own timing sd is 50 µs.
        expect(Math.abs((r.arrival_s ?? 0) - (s.arrival_s ?? 0))).toBeLessThan(1e-6);
        expect(r.arrivalSd_s).toBeGreaterThan(0.5e-6);
        expect(r.arrivalSd_s).toBeLessThan(10e-6);
      }
      expect(typed.source).toHaveLength(8);
      // Each coordinate within the typed demo's 1σ (about 2 mm; the summary shows mm with 0.1 mm).
      await waitFor(() => expect(shownSource()).not.toEqual(typed.shown));
      const picked = shownSource().map((t) => Number(t.replace('\u2212', '-').split(' ')[0]));
      const before = typed.shown.map((t) => Number(t.replace('\u2212', '-').split(' ')[0]));
      picked.forEach((x, k) => {
        expect(Math.abs(x - (before[k] ?? Number.NaN))).toBeLessThan(1.8);
      });
      // Each pick is marked on its trace.
      await waitFor(() => expect(lastDraw(TRACES_CHART_ID)?.data.find((t) => t.name === PICKS_TRACE)?.x).toHaveLength(8));
      const marks = lastDraw(TRACES_CHART_ID)?.data.find((t) => t.name === PICKS_TRACE)?.x ?? [];
      DEMO_SENSORS.forEach((s, i) => {
        expect(marks[i]).toBeCloseTo((s.arrival_s ?? 0) * 1e3, 2);
      });
    } finally {
      vi.unstubAllGlobals();
    }
  });

  it('names the channel whose pick failed and leaves its sensor as it was', async () => {
    const { user } = await openTraces(
      tracesCsv([
        { name: 'U0', arrival_s: 6e-3 },
        { name: 'L45', arrival_s: null },
      ]),
    );
    await user.selectOptions(screen.getByRole('combobox', { name: 'Picker' }), 'threshold');
    // A threshold out of range is refused with the field and its range; the last good value stays.
    const k = screen.getByRole('textbox', { name: 'Threshold k (noise sd)' });
    fireEvent.change(k, { target: { value: '0.5' } });
    expect(screen.getByText('Threshold k must be 1–1000 (noise sd); “0.5” is outside.')).toBeInTheDocument();
    expect(store().locateTracePicker.threshold).toBe(5);
    // Noise within ±0.2 mV (sd 0.115 mV) never reaches 8 sd.
    fireEvent.change(k, { target: { value: '8' } });
    fireEvent.blur(k);
    expect(store().locateTracePicker.threshold).toBe(8);
    const table = screen.getByRole('table', { name: 'Channels, their sensors and picked arrivals' });
    await within(table).findByText(/no pick:/, {}, { timeout: 10_000 });
    await waitFor(() => expect(applyButton()).toBeEnabled());
    await user.click(applyButton());
    const alert = screen.getAllByRole('alert').find((a) => a.textContent?.includes('Channel “L45” (sensor L45): no arrival picked'));
    expect(alert).toBeDefined();
    expect(alert).toHaveTextContent('That sensor keeps what it had.');
    expect(row('L45').arrival_s).toBe(demoArrival('L45'));
    expect(row('L45').arrivalSd_s).toBe(DEMO_SENSORS.find((s) => s.label === 'L45')?.arrivalSd_s);
    expect(row('U0').arrival_s).not.toBe(demoArrival('U0'));
    expect(screen.getByText('Arrivals and timing sds written for 1 sensor: U0.')).toHaveAttribute('role', 'status');
  });

  it('refuses a file that is not a trace, naming the problem, and changes nothing', async () => {
    const { user } = await openLocate();
    const rows = store().locateRows;
    const shown = shownSource();
    await user.upload(screen.getByLabelText('Open a trace file'), csvFile('label,x_m\nU0,abc\n', 'sensors-by-mistake.csv'));
    const alert = await screen.findByText(/sensors-by-mistake\.csv could not be read as a trace: /, {}, { timeout: 10_000 });
    expect(alert).toHaveAttribute('role', 'alert');
    expect(alert).toHaveTextContent(/Nothing was changed\.$/);
    expect(store().locateRows).toBe(rows);
    expect(shownSource()).toEqual(shown);
    expect(screen.queryByRole('table', { name: 'Channels, their sensors and picked arrivals' })).toBeNull();
  });

  it('keeps the traces read before when a later file is refused', async () => {
    const { user } = await openTraces(tracesCsv([{ name: 'U0', arrival_s: 6e-3 }]), 'good.csv');
    const rows = store().locateRows;
    await user.upload(screen.getByLabelText('Open a trace file'), csvFile('time_s,U0\n0,1\n-1,2\n1,3\n', 'backwards.csv'));
    const alert = await screen.findByText(/backwards\.csv could not be read as a trace: /, {}, { timeout: 10_000 });
    expect(alert).toHaveTextContent(/The traces shown before are kept\.$/);
    expect(screen.getByText('good.csv')).toBeInTheDocument();
    expect(sensorSelect('U0')).toHaveDisplayValue('U0');
    expect(store().locateRows).toBe(rows);
  });

  it('shows the reading’s progress and stops it on cancel, changing nothing', async () => {
    const { user } = await openLocate();
    const rows = store().locateRows;
    // About 24 MiB: read in 1 MiB slices with a pause between them, so the cancel arrives mid-file.
    const cells = ',0.0001'.repeat(15);
    const lines = Array.from({ length: 24 * 11000 }, (_, i) => `${i}${cells}`);
    const big = csvFile(`time_us,${Array.from({ length: 15 }, (_, i) => `c${i}`).join(',')}\n${lines.join('\n')}\n`, 'long-record.csv');
    await user.upload(screen.getByLabelText('Open a trace file'), big);
    expect(screen.getByRole('progressbar', { name: 'Reading long-record.csv' })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Cancel reading' }));
    expect(await screen.findByText('Reading long-record.csv was cancelled; nothing was changed.', {}, { timeout: 10_000 })).toHaveAttribute('role', 'alert');
    expect(screen.queryByRole('progressbar')).toBeNull();
    expect(store().locateTraceFile).toBeNull();
    expect(store().locateRows).toBe(rows);
  });

  it('refuses a file over the size limit before reading it', async () => {
    const { user } = await openLocate();
    const big = csvFile('time_s,U0\n', 'huge.csv');
    Object.defineProperty(big, 'size', { value: 300 * 1024 * 1024 });
    await user.upload(screen.getByLabelText('Open a trace file'), big);
    expect(await screen.findByRole('alert')).toHaveTextContent('huge.csv is 300 MiB, over the 256 MiB limit for a trace file; nothing was changed.');
  });
});

describe('locate traces: the picker settings in the store', () => {
  const info: TraceInfo = { rows: 10, channels: ['U0'], timeColumn: 'time_s', timeUnit: 's', fields: {}, firstTime_s: 0, lastTime_s: 1, bytes: 100 };

  /** Types a setting's text as its field does (src/ui/fields): the draft, then the value if it reads. */
  function typeSetting(setting: TraceSettingKey, text: string, unit: Unit | null = 'ms') {
    const key = locateFieldKey(traceSettingKey(setting));
    store().setFieldDraft(key, { text, unit, message: null });
    const read = readFieldText(traceSettingSpec(setting), text, unit);
    const message = read.ok ? store().setLocateTraceSetting(setting, read.value) : read.message;
    if (message !== null) store().setFieldDraft(key, { text, unit, message });
  }
  const draft = (setting: TraceSettingKey) => store().fieldDrafts[locateFieldKey(traceSettingKey(setting))];

  it('keeps a refused setting with its message when a new file is read, and drops the old file message', () => {
    typeSetting('from', '−20000 s');
    expect(draft('from')?.message).toMatch(/Search from/);
    store().refuseLocate('traces.file', 'the last file could not be read');
    store().setLocateTraceFile({ id: 'locate-trace-9', name: 'next.csv', size: 100, info });
    expect(draft('from')?.text).toBe('−20000 s');
    expect(draft('from')?.message).toMatch(/Search from/);
    expect(store().locateErrors['traces.file']).toBeUndefined();
  });

  it('checks the other end of the search window again once it can hold', () => {
    typeSetting('from', '5');
    typeSetting('to', '10');
    typeSetting('from', '20');
    expect(draft('from')?.message).toMatch(/must end after it starts/);
    expect(store().locateTracePicker.from_s).toBeCloseTo(5e-3, 12);
    typeSetting('to', '30');
    expect(store().locateTracePicker.to_s).toBeCloseTo(30e-3, 12);
    expect(store().locateTracePicker.from_s).toBeCloseTo(20e-3, 12);
    expect(draft('from')).toBeUndefined();
  });
});
