/**
 * A rehearsal of a planned measurement: N synthetic records (the kernel's `syntheticRecord`) put
 * through the converter's own picking (`pickTraceArrival`: heater-onset alignment, the drive as the
 * cross-correlation template, like-with-like references), then summarised per sensor by the kernel
 * (`summariseSensor`). Shared by the page's worker and `sekundo rehearse`: no node-only imports.
 *
 * Search window, as a person would set it for each sensor: the planned arrival ± the pulse's own
 * length at the sensor (drive, spread over the heater face, six lags), starting no earlier than half
 * the planned arrival (past the heater's electrical pickup and first sound, which arrives about ten
 * times sooner).
 * Polarity: the sign of the direct pulse's extreme in the prediction.
 */
import {
  DEFAULT_FRACTION,
  DEFAULT_RECORD_SETTINGS,
  DEFAULT_THRESHOLD_SIGMA,
  pickerTiming,
  delayBound,
  featureDelay,
  predictionSpan,
  noiseFreeRecord,
  PICKER_KINDS,
  PICKER_LIMITS,
  type PickerKind,
  type PlanInput,
  type PlanResult,
  type RecordModel,
  type RecordSettings,
  type RehearsalSensorSummary,
  recordModel,
  recordTimes,
  requireInRange,
  requireSeed,
  type SensorPicks,
  type SensorRecordModel,
  summariseSensor,
  type SyntheticRecord,
  syntheticRecord,
  InvalidInputError,
} from '../physics';
import { pickTraceArrival } from './trace-pick';
import type { TraceCsv } from './trace-csv';


/** Trials a rehearsal takes, and its default. */
export const REHEARSAL_TRIALS_RANGE = [2, 100_000] as const;
export const DEFAULT_REHEARSAL_TRIALS = 200;
export const DEFAULT_REHEARSAL_SEED = 1;
export const DEFAULT_REHEARSAL_PICKER: PickerKind = 'xcorr';
/** Name of the drive column in records and trace files (another name if a sensor has this id). */
export const HEATER_COLUMN = 'heater';
/** Records kept whole (their search windows) for a chart. */
export const RECORDS_KEPT = 3;
/** Most samples of one kept window (longer windows are thinned evenly). */
const KEPT_WINDOW_SAMPLES = 4000;

export interface RehearsalOptions extends RecordSettings {
  picker: PickerKind;
  trials: number;
  seed: number;
  /** Threshold picker: noise sd (default 5); fraction picker: share of the peak (default 0.5). */
  thresholdSigma?: number;
  fraction?: number;
}

export const DEFAULT_REHEARSAL_OPTIONS: RehearsalOptions = {
  ...DEFAULT_RECORD_SETTINGS,
  picker: DEFAULT_REHEARSAL_PICKER,
  trials: DEFAULT_REHEARSAL_TRIALS,
  seed: DEFAULT_REHEARSAL_SEED,
};

/** One kept record of one sensor, for a chart: its search window, s after the heater onset, V. */
export interface KeptWindow {
  trial: number;
  time_s: Float64Array;
  values: Float64Array;
  /** Picked arrival, s after the heater onset, or null when the pick failed. */
  pick_s: number | null;
  /** The picked delay (from the drive's matching feature), s, or null. */
  delay_s: number | null;
}

export interface RehearsalSensorResult extends RehearsalSensorSummary {
  window: { from_s: number; to_s: number };
  polarity: 'positive' | 'negative';
  kept: KeptWindow[];
}

export interface RehearsalResult {
  picker: PickerKind;
  trials: number;
  seed: number;
  temperature_K: number;
  sampleInterval_s: number;
  samples: number;
  /** Sensors with no second-sound pulse to pick (He I, behind a plane), by id. */
  skipped: string[];
  sensors: RehearsalSensorResult[];
}

export interface RehearsalHooks {
  /** Called after each trial with the trials done. */
  progress?: (done: number, total: number) => void;
  /** Checked before each trial; true stops the run with a RehearsalCancelled error. */
  cancelled?: () => boolean;
}

export class RehearsalCancelled extends Error {
  override name = 'RehearsalCancelled';
  constructor() {
    super('the rehearsal was cancelled');
  }
}

/** Throws the kernel's typed errors naming the option and its range. */
export function checkRehearsalOptions(o: RehearsalOptions): void {
  if (!PICKER_KINDS.includes(o.picker)) throw new InvalidInputError('picker', `must be one of ${PICKER_KINDS.join(', ')}`);
  requireInRange('trials', o.trials, REHEARSAL_TRIALS_RANGE[0], REHEARSAL_TRIALS_RANGE[1], '');
  if (!Number.isInteger(o.trials)) throw new InvalidInputError('trials', `must be a whole number ${REHEARSAL_TRIALS_RANGE[0]}–${REHEARSAL_TRIALS_RANGE[1]}`);
  requireSeed(o.seed);
  if (o.thresholdSigma !== undefined) requireInRange('threshold', o.thresholdSigma, ...PICKER_LIMITS.thresholdSigma, 'noise sd');
  if (o.fraction !== undefined) requireInRange('fraction', o.fraction, ...PICKER_LIMITS.fraction, 'of the peak');
}

/** The drive column's name: "heater", unless a sensor is called that. */
export function heaterColumn(model: RecordModel): string {
  const taken = new Set(model.sensors.map((s) => s.id.trim().toLowerCase()));
  let name = HEATER_COLUMN;
  for (let k = 2; taken.has(name.toLowerCase()); k++) name = `${HEATER_COLUMN} ${k}`;
  return name;
}

/** A record as the trace reader would give it, for the converter's picking. */
export function recordAsTrace(model: RecordModel, record: SyntheticRecord, heater = heaterColumn(model)): TraceCsv {
  const columns = ['time_s', heater, ...model.sensors.map((s) => s.id)];
  return {
    time_s: record.time_s,
    channels: [{ name: heater, values: record.heater }, ...model.sensors.map((s, j) => ({ name: s.id, values: record.sensors[j] as Float64Array }))],
    timeUnit: 's',
    metadata: {
      headerLines: [],
      fields: {},
      delimiter: ',',
      decimalComma: false,
      encoding: 'utf-8',
      timeColumn: 'time_s',
      columns,
      firstDataLine: 2,
      lastLine: record.time_s.length + 1,
      rows: record.time_s.length,
      skippedLines: 0,
      bytes: 0,
      timeCountsSamples: false,
    },
  };
}

/** The search window a rehearsal gives this sensor, s after the heater onset. */
export function searchWindow(model: RecordModel, s: SensorRecordModel): { from_s: number; to_s: number } {
  const end = model.start_s + (model.samples - 1) * model.step_s;
  return { from_s: Math.max(0.5 * s.planned_s, s.planned_s - s.pulseWindow_s), to_s: Math.min(end, s.planned_s + s.pulseWindow_s) };
}

/**
 * The samples a pick reads in one sensor's channel: the pre-trigger part (baseline and noise) and
 * the search window widened by the drive's length (the correlation's template runs past the last
 * start it tries) and a tenth of the window (the chart's margin), as sample index ranges.
 */
export function pickedSamples(model: RecordModel, window: { from_s: number; to_s: number }): [number, number][] {
  const index = (t: number) => Math.round((t - model.start_s) / model.step_s);
  const margin = Math.max(model.profile.duration_s, 0.1 * (window.to_s - window.from_s)) + 10 * model.step_s;
  const last = model.samples - 1;
  const clamp = (i: number) => Math.max(0, Math.min(last, i));
  return [
    [0, clamp(index(model.step_s * 2))],
    [clamp(index(window.from_s - margin)), clamp(index(window.to_s + margin))],
  ];
}

/**
 * The planner's analytic timing sd for the rehearsed picker: its own figure when the rehearsal
 * uses the planner's settings (threshold 5σ, fraction 0.5, no quantisation), else the same
 * computation (picker-timing.ts) with the rehearsal's threshold, fraction and digitiser step (noise
 * that dithers the step adds q²/12 per shot; rounding it does not dither is applied to the pulse).
 */
export function analyticTiming(model: RecordModel, s: SensorRecordModel, window: { from_s: number; to_s: number }, o: RehearsalOptions): number | null {
  const k = o.thresholdSigma ?? DEFAULT_THRESHOLD_SIGMA;
  const f = o.fraction ?? DEFAULT_FRACTION;
  const planned = s.plan.timingSdByPicker_s;
  if (s.step_V === null && k === DEFAULT_THRESHOLD_SIGMA && f === DEFAULT_FRACTION && planned) return planned[o.picker];
  const span = predictionSpan(s.prediction, window.from_s, window.to_s + model.profile.duration_s);
  if (!span) return null;
  const q = s.step_V;
  const dithered = q === null || s.shotNoise_V >= q / 2;
  return pickerTiming({
    span,
    profile: model.profile,
    polarity: s.polarity,
    noise: q !== null && dithered ? Math.sqrt(s.shotNoise_V ** 2 + (q * q) / 12) / Math.sqrt(model.shots) : s.recordNoise_V,
    sampleInterval_s: model.step_s,
    baselineSamples: Math.round(-model.start_s / model.step_s),
    thresholdSigma: k,
    fraction: f,
    roundingStep: dithered ? null : q,
  }).sd_s[o.picker];
}

/** The converter's pick: the delay from the drive's matching feature, and the arrival on the file's axis, s. */
function pickOne(trace: TraceCsv, heater: string, s: SensorRecordModel, window: { from_s: number; to_s: number }, o: RehearsalOptions): { delay_s: number; arrival_s: number } {
  const pick = pickTraceArrival(trace, {
    picker: o.picker,
    sensor: s.id,
    heater,
    from_s: window.from_s,
    to_s: window.to_s,
    polarity: s.polarity,
    thresholdSigma: o.picker === 'threshold' ? o.thresholdSigma : undefined,
    fraction: o.picker === 'fraction' ? o.fraction : undefined,
  });
  return { delay_s: pick.delay_s, arrival_s: pick.arrival_s };
}

function keepWindow(record: SyntheticRecord, j: number, window: { from_s: number; to_s: number }, pick_s: number | null, delay_s: number | null): KeptWindow {
  const t = record.time_s;
  const v = record.sensors[j] as Float64Array;
  // On the heater-onset axis; a little before and after the window.
  const span = window.to_s - window.from_s;
  const lo = window.from_s - 0.1 * span;
  const hi = window.to_s + 0.1 * span;
  const indices: number[] = [];
  for (let i = 0; i < t.length; i++) {
    const x = (t[i] as number) - record.onset_s;
    if (x >= lo && x <= hi) indices.push(i);
  }
  const stride = Math.max(1, Math.ceil(indices.length / KEPT_WINDOW_SAMPLES));
  const kept = indices.filter((_, k) => k % stride === 0);
  return {
    trial: record.trial,
    time_s: Float64Array.from(kept, (i) => (t[i] as number) - record.onset_s),
    values: Float64Array.from(kept, (i) => v[i] as number),
    pick_s,
    delay_s,
  };
}

function failureText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/**
 * Rehearses the plan: `options.trials` records through the chosen picker. `plan` and `result`
 * are the kernel's input and `computePlan` result for it. Throws the kernel's typed errors for bad
 * options or a plan with nothing to rehearse, and RehearsalCancelled when `hooks.cancelled` says so.
 */
export function rehearse(plan: PlanInput, result: PlanResult, options: RehearsalOptions, hooks: RehearsalHooks = {}): RehearsalResult {
  checkRehearsalOptions(options);
  const model = recordModel(plan, result, options, options.seed);
  const times = recordTimes(model);
  const heater = heaterColumn(model);
  const windows = model.sensors.map((s) => searchWindow(model, s));
  const picks: SensorPicks[] = model.sensors.map((s, j) => {
    const w = windows[j] as { from_s: number; to_s: number };
    // Past the window's end by the drive's length: the cross-correlation's template starts inside the window.
    const span = predictionSpan(s.prediction, w.from_s, w.to_s + model.profile.duration_s + 4 * model.step_s);
    const true_s = span
      ? featureDelay(span, model.profile, {
          picker: options.picker,
          thresholdLevel_V: (options.thresholdSigma ?? DEFAULT_THRESHOLD_SIGMA) * s.recordNoise_V,
          fraction: options.fraction ?? DEFAULT_FRACTION,
          polarity: s.polarity,
          sampleInterval_s: model.step_s,
        })
      : null;
    // The bound for the direct pulse alone: from its arrival to the end of its own length.
    const direct = predictionSpan(s.prediction, s.planned_s - s.lag_s - 2 * model.step_s, s.planned_s + s.pulseWindow_s);
    const bound_s = direct ? delayBound(direct, s.recordNoise_V, model.step_s) : null;
    return { true_s, bound_s, analytic_s: analyticTiming(model, s, w, options), delays_s: new Float64Array(options.trials).fill(Number.NaN), failures: new Map(), noiseFree_s: null };
  });
  const kept: KeptWindow[][] = model.sensors.map(() => []);

  const bare = recordAsTrace(model, noiseFreeRecord(model, times), heater);
  model.sensors.forEach((s, j) => {
    try {
      (picks[j] as SensorPicks).noiseFree_s = pickOne(bare, heater, s, windows[j] as { from_s: number; to_s: number }, options).delay_s;
    } catch {
      // Left null: the summary says the picker refused the bare prediction.
    }
  });

  const ranges = model.sensors.map((_, j) => pickedSamples(model, windows[j] as { from_s: number; to_s: number }));
  for (let trial = 0; trial < options.trials; trial++) {
    if (hooks.cancelled?.()) throw new RehearsalCancelled();
    // Noise only where the picker and the chart read (the pre-trigger part and around the window):
    // the same numbers there as in the whole record a trace file holds.
    const record = syntheticRecord(model, trial, times, ranges);
    const trace = recordAsTrace(model, record, heater);
    model.sensors.forEach((s, j) => {
      const p = picks[j] as SensorPicks;
      const window = windows[j] as { from_s: number; to_s: number };
      let arrival: number | null = null;
      let delay: number | null = null;
      try {
        const pick = pickOne(trace, heater, s, window, options);
        p.delays_s[trial] = pick.delay_s;
        delay = pick.delay_s;
        arrival = pick.arrival_s - record.onset_s;
      } catch (error) {
        const why = failureText(error);
        p.failures.set(why, (p.failures.get(why) ?? 0) + 1);
      }
      if (trial < RECORDS_KEPT) (kept[j] as KeptWindow[]).push(keepWindow(record, j, window, arrival, delay));
    });
    hooks.progress?.(trial + 1, options.trials);
  }

  const sensors = model.sensors.map((s, j) => ({
    ...summariseSensor(s, picks[j] as SensorPicks, {
      temperature_K: result.temperature_K,
      picker: options.picker,
      sampleInterval_s: model.step_s,
      searchWindow: windows[j] as { from_s: number; to_s: number },
      warnings: result.warnings,
    }),
    window: windows[j] as { from_s: number; to_s: number },
    polarity: s.polarity,
    kept: kept[j] as KeptWindow[],
  }));
  const used = new Set(model.sensors.map((s) => s.id));
  return {
    picker: options.picker,
    trials: options.trials,
    seed: options.seed,
    temperature_K: result.temperature_K,
    sampleInterval_s: model.step_s,
    samples: model.samples,
    skipped: result.sensors.filter((s) => !used.has(s.id)).map((s) => s.id),
    sensors,
  };
}
