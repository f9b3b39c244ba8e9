import { convertDelay } from './invert-delay';
import type { PickerKind } from './pickers';
import type { PlanWarning } from './plan-result';
import type { SensorRecordModel } from './synthetic-record';

/*
 * What a rehearsal says per sensor: the picked arrivals of N synthetic records against the planned
 * one, and the temperatures they give.
 *
 * The true (planned) arrival is the planner's second-sound arrival: the direct path over u₂ plus
 * the sensor's lag, counted from the heater onset. The picked delay is measured like with like, as
 * the converter does with a heater channel (src/io/trace-pick.ts): onset to onset for threshold,
 * fraction and cross-correlation (from the drive's 50 % rise), peak to peak for the peak picker (from
 * the drive's centre at half height). For a pulse that reaches the sensor with the drive's own shape,
 * delayed, every picker then measures the planned arrival; where the shape changes on the way (a
 * finite heater's edge wave, a point source's dP/dt, the lag's smoothing, a low threshold on a slow
 * edge) each picker's feature moves, by `noiseFreeBias_s`: the same picker on the noise-free record.
 * `arrivalBias_s` (mean picked − planned) holds that part and what noise adds; a t0 calibrated
 * with the same picker absorbs the first.
 *
 * Temperatures: each picked delay goes through the converter's own inversion (`convertDelay`) with
 * the planned cold path and the sensor's lag as t0, and the candidate nearest the plan's bath
 * temperature is kept; bias and sd are against the plan's temperature. The planner's analytic
 * figures beside them are its timing sd for the picker rehearsed (picker-timing.ts: the same pulse,
 * noise and digitiser through that picker's rule; recomputed with the rehearsal's threshold,
 * fraction and quantisation where they differ from the planner's) and the temperature sd of a
 * change between readings that timing gives (timing alone: the rehearsal has no distance error).
 */

/** Ratio of rehearsed to analytic timing sd beyond which (either way) the sensor gets a note. */
export const SD_RATIO_NOTE = 1.5;
/** Below this averaged SNR the planner's small-noise timing figure is not expected to hold (common practice, no source). */
const LOW_SNR_FOR_NOTE = 10;
/** What moves each picker off its feature on noise-free samples. */
const METHOD_CAUSE: Record<PickerKind, string> = {
  threshold: 'linear interpolation between samples on a curved edge',
  fraction: 'linear interpolation between samples on a curved edge, and the peak taken at a sample',
  peak: 'a parabola over the whole top of a lopsided pulse, or over at most 201 samples of a long one',
  xcorr: "the correlation's peak interpolated between lags, and the drive template cut at 2 % of its height",
};
/** Failure messages kept per sensor. */
const REASONS_KEPT = 3;

export interface SensorPicks {
  /** The planner's analytic timing sd for this picker and these settings (picker-timing.ts), s. */
  analytic_s: number | null;
  /** Cramér–Rao bound for the delay of the predicted direct pulse in this record's noise (delay-bound.ts), s. */
  bound_s: number | null;
  /** True delay of the picker's feature (picker-features.ts), s, or null when the prediction has none. */
  true_s: number | null;
  /** Picked delay per trial, s (NaN: the picker refused). */
  delays_s: Float64Array;
  /** Why picks failed: message → count. */
  failures: Map<string, number>;
  /** The same picker on the noise-free record, s, or null when it refused there too. */
  noiseFree_s: number | null;
}

export interface RehearsalSensorSummary {
  id: string;
  label: string;
  /**
   * The true arrival of the feature this picker measures (picker-features.ts), as a delay from the
   * drive's matching feature, s; the planner's arrival when the prediction has no such feature.
   */
  arrival_s: number;
  /** The planner's second-sound arrival (direct path / u₂ + lag), s after the heater onset. */
  plannedArrival_s: number;
  /** arrival_s − plannedArrival_s: where this picker's feature sits on the predicted pulse, s (null: no feature). */
  featureOffset_s: number | null;
  /** Mean picked − true arrival, s (null when every pick failed). */
  arrivalBias_s: number | null;
  /** Sample sd of the picked arrivals, s. */
  arrivalSd_s: number | null;
  /** The same picker on the noise-free digitised record − true arrival, s: what sampling and the picker's own method add. */
  noiseFreeBias_s: number | null;
  /** Share of records where the picker refused (0–1). */
  failedShare: number;
  /** Mean temperature − the plan's, K; sample sd, K. */
  temperatureBias_K: number | null;
  temperatureSd_K: number | null;
  /**
   * The planner's analytic timing sd for the picker rehearsed (its `timingSdByPicker_s`, or the
   * same computation with the rehearsal's threshold, fraction and quantisation), s; and the
   * temperature sd of a change that timing gives alone, K.
   */
  analyticTimingSd_s: number | null;
  analyticTemperatureSd_K: number | null;
  /** arrivalSd_s / analyticTimingSd_s. */
  sdRatio: number | null;
  /**
   * The Cramér–Rao bound for the delay of the predicted direct pulse in this noise, s: what a
   * matched cross-correlation reaches at high SNR (delay-bound.ts).
   */
  boundTimingSd_s: number | null;
  picks: number;
  /** The commonest reasons picks failed, with counts. */
  failureReasons: { message: string; count: number }[];
  /** Why the figures may differ from the plan's, one sentence each (empty when nothing to say). */
  notes: string[];
}

function meanSd(values: readonly number[]): { mean: number; sd: number } | null {
  const n = values.length;
  if (n === 0) return null;
  let sum = 0;
  for (const v of values) sum += v;
  const mean = sum / n;
  if (n === 1) return { mean, sd: 0 };
  let sq = 0;
  for (const v of values) sq += (v - mean) ** 2;
  return { mean, sd: Math.sqrt(sq / (n - 1)) };
}

/** Delay → temperature as the converter does it (planned path, offset t0); the candidate nearest `T_K`, or null. */
export function delayTemperature(delay_s: number, path: { pathLength_m: number; offset_s: number }, T_K: number): number | null {
  try {
    const c = convertDelay({ distance_m: path.pathLength_m, delay_s, distanceSd_m: 0, delaySd_s: 0, offset_s: path.offset_s, offsetSd_s: 0 }).candidates;
    let best: number | null = null;
    for (const k of c) if (best === null || Math.abs(k.temperature_K - T_K) < Math.abs(best - T_K)) best = k.temperature_K;
    return best;
  } catch {
    return null;
  }
}

const us = (t_s: number): string => `${Number((t_s * 1e6).toPrecision(3))} µs`;

/** Per-sensor figures of a rehearsal from its picks. `warnings`: the plan's, for the notes. */
export function summariseSensor(
  s: SensorRecordModel,
  picks: SensorPicks,
  context: { temperature_K: number; picker: PickerKind; sampleInterval_s: number; searchWindow: { from_s: number; to_s: number }; warnings: readonly PlanWarning[] },
): RehearsalSensorSummary {
  const good: number[] = [];
  const temperatures: number[] = [];
  const truth = picks.true_s ?? s.planned_s;
  // t0 as a lab calibrated with this picker would have it: the feature's delay less the transit d/u₂.
  const path = { pathLength_m: s.pathLength_m, offset_s: truth - s.transit_s };
  for (const d of picks.delays_s) {
    if (!Number.isFinite(d)) continue;
    good.push(d);
    const T = delayTemperature(d, path, context.temperature_K);
    if (T !== null) temperatures.push(T);
  }
  const trials = picks.delays_s.length;
  const arrival = meanSd(good);
  const temperature = meanSd(temperatures);
  const analytic = picks.analytic_s;
  // The change sd is linear in the timing sd (temperature-resolution.ts, below its cap): scaled from the headline's.
  const headline = s.plan.timingSd_s;
  const analyticT = analytic !== null && headline !== null && headline > 0 && s.plan.temperatureChangeSd_K !== null ? (s.plan.temperatureChangeSd_K * analytic) / headline : null;
  const sd = arrival?.sd ?? null;
  const ratio = sd !== null && analytic !== null && analytic > 0 ? sd / analytic : null;
  const failedShare = trials > 0 ? (trials - good.length) / trials : 0;
  const reasons = [...picks.failures.entries()].sort((a, b) => b[1] - a[1]).slice(0, REASONS_KEPT).map(([message, count]) => ({ message, count }));
  const summary: RehearsalSensorSummary = {
    id: s.id,
    label: s.label,
    arrival_s: truth,
    plannedArrival_s: s.planned_s,
    featureOffset_s: picks.true_s === null ? null : picks.true_s - s.planned_s,
    arrivalBias_s: arrival ? arrival.mean - truth : null,
    arrivalSd_s: sd,
    noiseFreeBias_s: picks.noiseFree_s === null ? null : picks.noiseFree_s - truth,
    failedShare,
    temperatureBias_K: temperature ? temperature.mean - context.temperature_K : null,
    temperatureSd_K: temperature?.sd ?? null,
    analyticTimingSd_s: analytic,
    analyticTemperatureSd_K: analyticT,
    sdRatio: ratio,
    boundTimingSd_s: picks.bound_s,
    picks: good.length,
    failureReasons: reasons,
    notes: [],
  };
  summary.notes = sensorNotes(s, summary, context);
  return summary;
}

function sensorNotes(
  s: SensorRecordModel,
  r: RehearsalSensorSummary,
  c: { picker: PickerKind; sampleInterval_s: number; searchWindow: { from_s: number; to_s: number }; warnings: readonly PlanWarning[] },
): string[] {
  const notes: string[] = [];
  const mine = c.warnings.filter((w) => w.sensorId === s.id);
  const shock = mine.find((w) => w.code === 'shock');
  if (shock) notes.push(`The plan warns of a shock (${shock.message.split(': ').slice(1).join(': ')}). These records follow linear theory, so the moved edge is not in them: real picks will be biased beyond these figures.`);
  if (r.picks === 0) {
    notes.push(`Every pick failed${r.failureReasons[0] ? `: ${r.failureReasons[0].message}` : ''}.`);
    return notes;
  }
  const ratio = r.sdRatio;
  if (ratio !== null && (ratio > SD_RATIO_NOTE || ratio < 1 / SD_RATIO_NOTE)) {
    const causes: string[] = [];
    if (r.failedShare > 0) causes.push(`${Number((r.failedShare * 100).toPrecision(2))} % of picks failed${r.failureReasons[0] ? ` (${r.failureReasons[0].message})` : ''}, and the rest include near-misses`);
    const snr = s.plan.snrAveraged;
    if (snr !== null && snr < LOW_SNR_FOR_NOTE) causes.push(`the SNR after averaging is only ${Number(snr.toPrecision(2))}: the planner's σ/slope is a small-noise figure, and noise crossings and outliers widen the spread`);
    const inWindow = s.plan.echoes.filter((e) => e.arrival_s < c.searchWindow.to_s);
    if (inWindow.length > 0 || mine.some((w) => w.code === 'echo-overlap')) {
      const e = inWindow[0] ?? s.plan.echoes[0];
      causes.push(`an echo${e ? ` (${e.path.join(' → ') || 'reflection'}, ${us(e.arrival_s - s.planned_s)} after the direct pulse)` : ''} overlaps the direct pulse inside the picker's window`);
    }
    if (s.step_V !== null && s.step_V > s.recordNoise_V) causes.push(`the digitiser's step (${Number((s.step_V * 1e6).toPrecision(3))} µV) is coarser than the averaged noise, so rounding, not noise, sets the scatter`);
    if (ratio > 1 && r.failedShare === 0 && (snr ?? 0) >= LOW_SNR_FOR_NOTE && inWindow.length === 0) {
      causes.push('a few picks far from the rest (a noise crossing before the edge, another sample taken as the top): the analytic figure is the small-noise spread around the feature and has no such tail');
    }
    const direction = ratio > 1 ? 'wider' : 'narrower';
    notes.push(
      `The rehearsed timing sd is ${Number(ratio.toPrecision(2))} × the planner's analytic figure for this picker (${direction} than a factor ${SD_RATIO_NOTE} allows)${causes.length > 0 ? `; likely: ${causes.join('; ')}` : '; no cause found among failures, SNR, echoes and quantisation'}.`,
    );
  }
  const bound = r.boundTimingSd_s;
  if (c.picker === 'xcorr' && bound !== null && r.arrivalSd_s !== null && r.arrivalSd_s > SD_RATIO_NOTE * bound && (s.plan.snrAveraged ?? 0) >= LOW_SNR_FOR_NOTE) {
    notes.push(
      `The cross-correlation's sd is ${Number((r.arrivalSd_s / bound).toPrecision(2))} × the Cramér–Rao bound (${us(bound)}): its template is the heater drive, and the pulse reaches this sensor in another shape (the lag, the heater's size), so the match is not the best possible.`,
    );
  }
  const method = r.noiseFreeBias_s;
  if (method !== null && Math.abs(method) > Math.max(2 * (r.arrivalSd_s ?? 0), c.sampleInterval_s / 20)) {
    notes.push(
      `Without noise the picker lands ${us(method)} from its own feature (${METHOD_CAUSE[c.picker]}): a bias that no averaging removes.`,
    );
  }
  if (r.featureOffset_s === null) notes.push("The predicted pulse has no such feature (a threshold above its peak?): the bias is counted from the planner's arrival.");
  else if (Math.abs(r.featureOffset_s) > Math.max(r.analyticTimingSd_s ?? 0, c.sampleInterval_s)) {
    notes.push(
      `This picker's feature sits ${us(r.featureOffset_s)} from the planner's arrival (the pulse's shape at the sensor: the heater's size, the lag, the picker's level). Temperatures here use a t0 calibrated with the same picker; with the lag alone as t0 they would be off by that much of the transit.`,
    );
  }
  return notes;
}
