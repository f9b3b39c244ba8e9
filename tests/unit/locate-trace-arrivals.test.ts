import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseTraceCsv } from '../../src/io/trace-csv';
import { type TracePick, pickTraceArrival } from '../../src/io/trace-pick';
import type { PickState } from '../../src/ui/converter/trace/trace-picks';
import type { LocateRowInput } from '../../src/ui/locate/locate-inputs';
import {
  arrivalsFromPicks,
  DEFAULT_TRACE_PICKER,
  matchChannels,
  matchConflicts,
  sensorNamed,
  withArrivals,
} from '../../src/ui/locate/trace-arrivals';
import { readFieldText } from '../../src/ui/fields/field-spec';
import { editTraceSetting, traceSettingSpec } from '../../src/ui/locate/trace-fields';
import { DEMO_TRACES_PATH, demoSensors, locateDemoTracesCsv } from '../support/locate-demo-traces';

const rowOf = (key: string, label: string, arrival_s: number | null = null): LocateRowInput => ({ key, label, position_m: [0, 0, 0], arrival_s, arrivalSd_s: null });
const ROWS: readonly LocateRowInput[] = [rowOf('a', 'U0', 1e-3), rowOf('b', 'u90', 2e-3), rowOf('c', 'L45', 3e-3), rowOf('d', 'l45', 4e-3)];

/** A pick as the worker gives it (only the arrival and sd matter here). */
function picked(arrival_s: number, arrivalSd_s: number): PickState {
  const pick: TracePick = {
    arrival_s,
    arrivalSd_s,
    delay_s: arrival_s,
    delaySd_s: arrivalSd_s,
    timeZero_s: 0,
    timeZeroSd_s: 0,
    timeZero: 'file t = 0',
    reference: "from the file's t = 0",
    referenceTime_s: 0,
    picker: 'fraction',
    sensor: 'x',
    heater: null,
    template: null,
    baseline: { level: 0, noise: 1, samples: 100 },
    peak: 10,
    snr: 10,
  };
  return { status: 'picked', pick };
}

describe('matching channels to sensors', () => {
  it('finds the sensor of the same label, whatever the case and surrounding spaces', () => {
    expect(sensorNamed('u0', ROWS)?.key).toBe('a');
    expect(sensorNamed(' U90 ', ROWS)?.key).toBe('b');
    expect(sensorNamed('trigger', ROWS)).toBeNull();
  });

  it('prefers the label written the same over one that differs only in case', () => {
    expect(sensorNamed('l45', ROWS)?.key).toBe('d');
    expect(sensorNamed('L45', ROWS)?.key).toBe('c');
  });

  it('follows a choice, leaves a channel out on null, and falls back to the name when the chosen sensor is gone', () => {
    const matches = matchChannels(['U0', 'u90', 'L45', 'spare'], ROWS, { U0: 'c', u90: null, L45: 'gone' });
    expect(matches.map((m) => [m.channel, m.row?.key ?? null, m.byName])).toEqual([
      ['U0', 'c', false],
      ['u90', null, false],
      ['L45', 'c', true],
      ['spare', null, true],
    ]);
  });

  it('names the channels that would write to one sensor', () => {
    const matches = matchChannels(['U0', 'L45', 'u90'], ROWS, { U0: 'c' });
    expect(matchConflicts(matches)).toEqual(['Channels “U0” and “L45” are all matched to sensor L45: choose one, and set the others to “not used”.']);
    expect(matchConflicts(matchChannels(['U0', 'L45'], ROWS, {}))).toEqual([]);
  });
});

describe('turning picks into arrivals', () => {
  const matches = matchChannels(['U0', 'u90', 'L45', 'spare'], ROWS, {});

  it('gives each matched, picked channel its sensor’s arrival and sd, and skips channels still picking or not used', () => {
    const picks = new Map<string, PickState>([
      ['U0', picked(0.0115, 2e-6)],
      ['u90', { status: 'picking' }],
      ['spare', picked(0.005, 1e-6)],
    ]);
    expect(arrivalsFromPicks(matches, picks)).toEqual({ updates: [{ key: 'a', arrival_s: 0.0115, arrivalSd_s: 2e-6 }], failures: [] });
  });

  it('names the channel and its sensor for a failed pick, and for a pick outside the arrival or sd range', () => {
    const picks = new Map<string, PickState>([
      ['U0', { status: 'failed', message: 'threshold: the signal never rises 5 noise sd above the baseline in the search window' }],
      ['u90', picked(2000, 1e-6)],
      ['L45', picked(0.01, 0)],
    ]);
    const { updates, failures } = arrivalsFromPicks(matches, picks);
    expect(updates).toEqual([]);
    expect(failures).toEqual([
      'Channel “U0” (sensor U0): no arrival picked — threshold: the signal never rises 5 noise sd above the baseline in the search window.',
      'Channel “u90” (sensor u90): the pick at 2000 s is outside the arrival range −1000 to 1000 s.',
      'Channel “L45” (sensor L45): the pick’s sd 0 s is outside the timing-sd range: above 0, up to 10 s.',
    ]);
  });

  it('writes arrivals and sds into the given rows only; the other rows stay the same objects', () => {
    const rows = withArrivals(ROWS, [{ key: 'b', arrival_s: 0.007, arrivalSd_s: 3e-6 }]);
    expect(rows[1]).toEqual({ ...ROWS[1], arrival_s: 0.007, arrivalSd_s: 3e-6 });
    for (const i of [0, 2, 3]) expect(rows[i]).toBe(ROWS[i]);
  });
});

describe('picker settings typed in the traces panel', () => {
  it('takes a threshold in range and refuses one outside, naming the field and the range', () => {
    const good = editTraceSetting(DEFAULT_TRACE_PICKER, 'threshold', 8);
    expect(good.ok && good.settings.threshold).toBe(8);
    expect(readFieldText(traceSettingSpec('threshold'), '0.5', null)).toEqual({ ok: false, message: 'Threshold k must be 1–1000 (noise sd); “0.5” is outside.' });
    expect(readFieldText(traceSettingSpec('fraction'), '1.2', null)).toEqual({ ok: false, message: 'Fraction of the peak must be 0.05–0.95; “1.2” is outside.' });
  });

  it('reads a bare search time in the shown unit, a blank as no limit, and refuses a window that runs backwards', () => {
    expect(readFieldText(traceSettingSpec('from'), '2', 'ms')).toEqual({ ok: true, value: 2e-3 });
    expect(readFieldText(traceSettingSpec('to'), '1500 us', 'ms')).toEqual({ ok: true, value: 1.5e-3 });
    expect(readFieldText(traceSettingSpec('from'), ' ', 'ms')).toEqual({ ok: true, value: null });
    const cleared = editTraceSetting({ ...DEFAULT_TRACE_PICKER, from_s: 2e-3 }, 'from', null);
    expect(cleared.ok && cleared.settings.from_s).toBeNull();
    expect(editTraceSetting({ ...DEFAULT_TRACE_PICKER, from_s: 2e-3 }, 'to', 1e-3)).toEqual({
      ok: false,
      message: 'Search to: the search window must end after it starts (from 2 ms to 1 ms).',
    });
  });
});

describe('the demo traces (public/demo-locate-traces.csv)', () => {
  const sensors = demoSensors();
  const text = readFileSync(join(process.cwd(), DEMO_TRACES_PATH), 'utf8');

  it('are what tests/support/locate-demo-traces.ts makes (run it again after changing the model)', () => {
    expect(locateDemoTracesCsv(sensors)).toBe(text);
  });

  it('give each demo sensor its demo arrival with the panel’s default picker, within 1 µs (the demo’s timing sd is 50 µs)', () => {
    const trace = parseTraceCsv(text);
    expect(trace.channels.map((c) => c.name)).toEqual(sensors.map((s) => s.label));
    for (const s of sensors) {
      const pick = pickTraceArrival(trace, { picker: DEFAULT_TRACE_PICKER.picker, fraction: DEFAULT_TRACE_PICKER.fraction, polarity: 'auto', sensor: s.label });
      expect(Math.abs(pick.arrival_s - (s.arrival_s ?? Number.NaN))).toBeLessThan(1e-6);
      expect(pick.arrivalSd_s).toBeLessThan(s.arrivalSd_s ?? 0);
    }
  });
});
