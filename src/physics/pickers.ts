import { InvalidInputError, requireInRange } from './errors';
import { fitParabola, parabolaVertex } from './parabola';

/*
 * Arrival pickers for a digitised sensor trace (PHYSICS notes §7). Baseline and noise come from
 * the pre-trigger part (t < 0). Each picker returns the arrival time and its one-sigma
 * uncertainty, σ_V/|dV/dt| at the picked point for the edge pickers (the usual timing-jitter
 * estimate), the parabola's own error propagation for the peak, and the Cramér–Rao bound for a
 * delay in white noise, σ/√(Σ ṡ²), for the cross-correlation (ṡ the template's slope).
 *  - threshold: first crossing of baseline + kσ after the search start, linear interpolation;
 *  - fraction:  crossing of baseline + f·(peak − baseline) on the leading edge of the peak;
 *  - peak:      a least-squares parabola through the samples above half the peak around the
 *               extreme sample; its vertex;
 *  - xcorr:     the lag that best matches a template, refined by a parabola through the
 *               correlation peak (sub-sample).
 * Signals may be positive- or negative-going; 'auto' follows the larger excursion.
 * A pick always lies inside its search window, or the picker refuses with a message saying why
 * (times in µs or ms, as a person reads them, never raw seconds).
 */

export interface Trace {
  time_s: Float64Array;
  values: Float64Array;
}

export interface Baseline {
  level: number;
  /** Standard deviation of the pre-trigger samples. */
  noise: number;
  samples: number;
}

export type PickerKind = 'threshold' | 'fraction' | 'peak' | 'xcorr';
export const PICKER_KINDS: readonly PickerKind[] = ['threshold', 'fraction', 'peak', 'xcorr'];

/** Settings the pickers take: threshold in noise sd, fraction of the peak. */
export const PICKER_LIMITS = { thresholdSigma: [1, 1000], fraction: [0.05, 0.95] } as const;

export interface PickOptions {
  kind: PickerKind;
  /** Threshold in noise sd (threshold picker); default 5. */
  thresholdSigma?: number;
  /** Fraction of the peak (fraction picker), 0.05–0.95; default 0.5. */
  fraction?: number;
  /** Template sampled on the trace's own step, starting at its onset (xcorr picker). */
  template?: Float64Array;
  /** Search window, s (default: from 0 to the end of the trace). */
  from_s?: number;
  to_s?: number;
  /** End of the baseline window, s (default 0: the pre-trigger part). */
  baselineEnd_s?: number;
  polarity?: 'positive' | 'negative' | 'auto';
}

export interface Pick {
  arrival_s: number;
  arrivalSd_s: number;
  picker: PickerKind;
  baseline: Baseline;
  /** Signal excursion at the peak above the baseline (signed), in the trace's units. */
  peak: number;
  /** |peak| / noise. */
  snr: number;
}

/** Fewest pre-trigger samples that give a usable baseline. */
export const MIN_BASELINE_SAMPLES = 8;
const UNIFORM_TOLERANCE = 1e-3;

/** A time as a person reads it: µs below 1 ms, ms below 1 s, else s; 3 significant digits; a true minus. */
export function timeText(t_s: number): string {
  const a = Math.abs(t_s);
  const [scale, unit] = a < 1e-3 ? [1e6, 'µs'] : a < 1 ? [1e3, 'ms'] : [1, 's'];
  const text = Number((t_s * scale).toPrecision(3)).toString();
  return `${text.replace(/^-/, '−')} ${unit}`;
}

function indexAtOrAfter(time: Float64Array, t: number): number {
  let lo = 0;
  let hi = time.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((time[mid] as number) < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Mean and standard deviation of the samples with t < end_s. Throws if fewer than 8. */
export function baselineOf(trace: Trace, end_s = 0): Baseline {
  const n = indexAtOrAfter(trace.time_s, end_s);
  if (n < MIN_BASELINE_SAMPLES) {
    throw new InvalidInputError('pre-trigger', `needs at least ${MIN_BASELINE_SAMPLES} samples before t = ${timeText(end_s)} to measure the baseline, found ${n}`);
  }
  let sum = 0;
  for (let i = 0; i < n; i++) sum += trace.values[i] as number;
  const level = sum / n;
  let sq = 0;
  for (let i = 0; i < n; i++) sq += ((trace.values[i] as number) - level) ** 2;
  return { level, noise: Math.sqrt(sq / (n - 1)), samples: n };
}

function checkTrace(trace: Trace): void {
  if (trace.time_s.length !== trace.values.length) throw new InvalidInputError('trace', 'time and value columns differ in length');
  if (trace.time_s.length < 2 * MIN_BASELINE_SAMPLES) throw new InvalidInputError('trace', `needs at least ${2 * MIN_BASELINE_SAMPLES} samples`);
}

/** The trace's sample step, s; throws unless the time column is uniform to 0.1 %. */
export function uniformStep(trace: Trace): number {
  const t = trace.time_s;
  const n = t.length;
  const step = ((t[n - 1] as number) - (t[0] as number)) / (n - 1);
  if (!(step > 0)) throw new InvalidInputError('time', 'the time column must increase');
  for (let i = 1; i < n; i++) {
    const d = (t[i] as number) - (t[i - 1] as number);
    if (Math.abs(d - step) > UNIFORM_TOLERANCE * step) {
      throw new InvalidInputError('time', `samples must be evenly spaced (row ${i + 1} breaks the ${timeText(step)} step)`);
    }
  }
  return step;
}

interface Window {
  i0: number;
  i1: number;
  /** The window's ends in time, s. */
  from_s: number;
  to_s: number;
  sign: number;
  /** Index of the extreme excursion (in sign) inside the search range. */
  iPeak: number;
}

function searchWindow(trace: Trace, base: Baseline, o: PickOptions): Window {
  const t = trace.time_s;
  const i0 = Math.max(indexAtOrAfter(t, o.from_s ?? 0), 1);
  const i1 = Math.min(o.to_s === undefined ? t.length - 1 : indexAtOrAfter(t, o.to_s), t.length - 1);
  if (i1 - i0 < 3) throw new InvalidInputError('search window', 'holds fewer than 3 samples after the trigger');
  let iMax = i0;
  let iMin = i0;
  for (let i = i0; i <= i1; i++) {
    if ((trace.values[i] as number) > (trace.values[iMax] as number)) iMax = i;
    if ((trace.values[i] as number) < (trace.values[iMin] as number)) iMin = i;
  }
  const up = (trace.values[iMax] as number) - base.level;
  const down = base.level - (trace.values[iMin] as number);
  const polarity = o.polarity ?? 'auto';
  const sign = polarity === 'positive' ? 1 : polarity === 'negative' ? -1 : up >= down ? 1 : -1;
  return { i0, i1, from_s: o.from_s ?? 0, to_s: Math.min(o.to_s ?? Number.POSITIVE_INFINITY, t[t.length - 1] as number), sign, iPeak: sign > 0 ? iMax : iMin };
}

/** Linear crossing of `level` (in signed units) going up between i−1 and i; with its sd from the local slope. */
function crossing(trace: Trace, sign: number, base: Baseline, level: number, i: number): { t: number; sd: number } {
  const t0 = trace.time_s[i - 1] as number;
  const t1 = trace.time_s[i] as number;
  const v0 = sign * ((trace.values[i - 1] as number) - base.level);
  const v1 = sign * ((trace.values[i] as number) - base.level);
  const slope = (v1 - v0) / (t1 - t0);
  const t = slope > 0 ? t0 + ((level - v0) * (t1 - t0)) / (v1 - v0) : t1;
  // Timing jitter σ_V/|dV/dt|, at least the quantisation of one sample interval (Δt/√12) when the
  // edge is steeper than one sample.
  const sd = Math.max(slope > 0 ? base.noise / slope : t1 - t0, (t1 - t0) / Math.sqrt(12));
  return { t, sd };
}

function pickThreshold(trace: Trace, base: Baseline, w: Window, k: number): { t: number; sd: number } {
  const level = k * base.noise;
  if (w.sign * ((trace.values[w.i0] as number) - base.level) >= level) {
    throw new InvalidInputError(
      'threshold',
      `the signal is already ${k} noise sd above the baseline at the start of the search window, ${timeText(trace.time_s[w.i0] as number)}, so its crossing lies before the window; start the window earlier, before the pulse, or raise the threshold`,
    );
  }
  for (let i = w.i0; i <= w.i1; i++) {
    if (w.sign * ((trace.values[i] as number) - base.level) >= level) return crossing(trace, w.sign, base, level, i);
  }
  throw new InvalidInputError('threshold', `the signal never rises ${k} noise sd above the baseline in the search window`);
}

function pickFraction(trace: Trace, base: Baseline, w: Window, f: number): { t: number; sd: number } {
  const peak = w.sign * ((trace.values[w.iPeak] as number) - base.level);
  const level = f * peak;
  // Walk back from the peak to the last sample below the level: the leading edge of this peak.
  let i = w.iPeak;
  while (i > w.i0 && w.sign * ((trace.values[i - 1] as number) - base.level) >= level) i--;
  if (i <= w.i0) throw new InvalidInputError('fraction', 'the pulse starts before the search window; move its start earlier');
  return crossing(trace, w.sign, base, level, i);
}

function threePointVertex(ym: number, y0: number, yp: number): { offset: number; curvature: number } {
  const curvature = ym - 2 * y0 + yp;
  const offset = curvature !== 0 ? (0.5 * (ym - yp)) / curvature : 0;
  return { offset: Math.max(-0.5, Math.min(0.5, offset)), curvature };
}

/** Most samples the peak picker fits (its longest run, in sample intervals). */
export const PEAK_MAX_POINTS = 201;
/** The peak picker fits the samples above this fraction of the peak around it. */
export const PEAK_FIT_LEVEL = 0.5;
/**
 * Drive samples above this fraction of the drive's peak make the cross-correlation's template
 * (with one sample beyond each edge; src/io/trace-pick.ts cuts it, picker-timing.ts follows it).
 */
export const TEMPLATE_EDGE_FRACTION = 0.02;

function pickPeak(trace: Trace, base: Baseline, w: Window, step: number): { t: number; sd: number } {
  const y = (k: number) => w.sign * ((trace.values[k] as number) - base.level);
  const top = y(w.iPeak);
  // The contiguous run of samples above half the peak around the extreme sample (at least ±1).
  let lo = w.iPeak;
  let hi = w.iPeak;
  while (lo > w.i0 && hi - lo < PEAK_MAX_POINTS && y(lo - 1) >= PEAK_FIT_LEVEL * top) lo--;
  while (hi < w.i1 && hi - lo < PEAK_MAX_POINTS && y(hi + 1) >= PEAK_FIT_LEVEL * top) hi++;
  lo = Math.max(0, Math.min(lo, w.iPeak - 1));
  hi = Math.min(trace.values.length - 1, Math.max(hi, w.iPeak + 1));
  const centre = trace.time_s[w.iPeak] as number;
  const n = hi - lo + 1;
  const u = new Float64Array(n);
  const v = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    u[k] = ((trace.time_s[lo + k] as number) - centre) / step;
    v[k] = y(lo + k);
  }
  const p = fitParabola(u, v);
  if (!(p.c < 0)) return { t: centre, sd: step };
  const vertex = parabolaVertex(p, base.noise);
  // A vertex outside the fitted run is not a peak of these samples.
  const offset = Math.max(u[0] as number, Math.min(u[n - 1] as number, vertex.u));
  return { t: centre + offset * step, sd: Math.max(vertex.uSd * step, step / Math.sqrt(12 * n)) };
}

/**
 * Multiply-adds above which the cross-correlation first searches every k-th lag and then every lag
 * around the best coarse one. k is at most an eighth of the template: the correlation of a pulse
 * with its template has a main lobe about as wide as the template, so such a stride cannot step
 * over it.
 */
const XCORR_FULL_SEARCH_WORK = 2e7;

function pickXcorr(trace: Trace, base: Baseline, w: Window, step: number, template: Float64Array): { t: number; sd: number } {
  const m = template.length;
  if (m < 3) throw new InvalidInputError('template', 'needs at least 3 samples');
  const n = trace.values.length;
  const lastStart = Math.min(w.i1, n - m);
  if (lastStart < w.i0) throw new InvalidInputError('template', 'is longer than the search window');
  const score = (start: number): number => {
    let acc = 0;
    for (let j = 0; j < m; j++) acc += (template[j] as number) * w.sign * ((trace.values[start + j] as number) - base.level);
    return acc;
  };
  const lags = lastStart - w.i0 + 1;
  const stride = Math.max(1, Math.min(Math.floor(m / 8), Math.ceil((lags * m) / XCORR_FULL_SEARCH_WORK)));
  let coarseBest = w.i0;
  let coarseScore = Number.NEGATIVE_INFINITY;
  for (let start = w.i0; start <= lastStart; start += stride) {
    const acc = score(start);
    if (acc > coarseScore) {
      coarseScore = acc;
      coarseBest = start;
    }
  }
  // Every lag within two strides of the coarse best (all lags when the stride is 1).
  const lo = stride === 1 ? w.i0 : Math.max(w.i0, coarseBest - 2 * stride);
  const hi = stride === 1 ? lastStart : Math.min(lastStart, coarseBest + 2 * stride);
  let best = lo;
  let bestScore = Number.NEGATIVE_INFINITY;
  const scores = new Float64Array(hi - lo + 1);
  for (let start = lo; start <= hi; start++) {
    const acc = score(start);
    scores[start - lo] = acc;
    if (acc > bestScore) {
      bestScore = acc;
      best = start;
    }
  }
  const k = best - lo;
  const ym = k > 0 ? (scores[k - 1] as number) : bestScore;
  const yp = k < scores.length - 1 ? (scores[k + 1] as number) : bestScore;
  const { offset } = threePointVertex(ym, bestScore, yp);
  // Cramér–Rao bound for a delay in white noise: σ_τ = σ / √(Σ (dŝ/dt)²), ŝ the template scaled
  // to the observed amplitude.
  let energy = 0;
  let slopes = 0;
  for (let j = 0; j < m; j++) {
    energy += (template[j] as number) ** 2;
    const d = j > 0 && j < m - 1 ? ((template[j + 1] as number) - (template[j - 1] as number)) / (2 * step) : 0;
    slopes += d * d;
  }
  const amplitude = energy > 0 ? bestScore / energy : 0;
  const sd = slopes > 0 && amplitude > 0 ? base.noise / (amplitude * Math.sqrt(slopes)) : step;
  return { t: (trace.time_s[best] as number) + offset * step, sd: Math.max(sd, step / Math.sqrt(12) / Math.sqrt(m)) };
}

/**
 * Picks the arrival in a trace with the chosen picker. Time zero of the trace is the trigger
 * (or the heater onset); baseline from t < 0 unless `baselineEnd_s` says otherwise.
 * Throws InvalidInputError naming what is missing (baseline samples, a crossing, a template).
 */
export function pickArrival(trace: Trace, options: PickOptions): Pick {
  checkTrace(trace);
  const base = baselineOf(trace, options.baselineEnd_s ?? 0);
  if (!(base.noise > 0)) throw new InvalidInputError('pre-trigger', 'is perfectly flat: noise cannot be measured (is the channel connected?)');
  const w = searchWindow(trace, base, options);
  const step = options.kind === 'xcorr' || options.kind === 'peak' ? uniformStep(trace) : 0;
  let r: { t: number; sd: number };
  switch (options.kind) {
    case 'threshold':
      r = pickThreshold(trace, base, w, requireInRange('threshold', options.thresholdSigma ?? 5, ...PICKER_LIMITS.thresholdSigma, 'noise sd'));
      break;
    case 'fraction':
      r = pickFraction(trace, base, w, requireInRange('fraction', options.fraction ?? 0.5, ...PICKER_LIMITS.fraction, 'of the peak'));
      break;
    case 'peak':
      r = pickPeak(trace, base, w, step);
      break;
    case 'xcorr':
      if (!options.template) throw new InvalidInputError('template', 'the cross-correlation picker needs a template');
      r = pickXcorr(trace, base, w, step, options.template);
      break;
  }
  requireInsideWindow(r.t, w, options.kind);
  const peak = (trace.values[w.iPeak] as number) - base.level;
  return { arrival_s: r.t, arrivalSd_s: r.sd, picker: options.kind, baseline: base, peak, snr: Math.abs(peak) / base.noise };
}

/**
 * Refuses a pick outside its search window (an interpolation or refinement that ran past an end):
 * the message gives the pick and the window in µs or ms.
 */
export function requireInsideWindow(t_s: number, w: { from_s: number; to_s: number }, picker: string): void {
  // Half a nanosecond of slack for the rounding of interpolated times.
  const slack = 5e-10;
  if (t_s >= w.from_s - slack && t_s <= w.to_s + slack) return;
  throw new InvalidInputError(
    'pick',
    `the ${picker} pick ${timeText(t_s)} falls ${t_s < w.from_s ? 'before' : 'after'} its search window ${timeText(w.from_s)} – ${timeText(w.to_s)}; ` +
      `${t_s < w.from_s ? 'start the window earlier, before the pulse' : 'end the window later, after the pulse'}`,
  );
}

/**
 * Centre of the heater pulse, s: the midpoint of the 50 % crossings of its rise and its fall (for
 * a flat-topped or symmetric drive, where its peak lies; the feature a peak pick on the sensor is
 * to be measured from, peak to peak). Throws when the drive does not fall back below half height.
 */
export function heaterCentre(trace: Trace): { centre_s: number; centreSd_s: number } {
  checkTrace(trace);
  const t = trace.time_s;
  const base = baselineOf(trace, t[MIN_BASELINE_SAMPLES] as number);
  const b = { ...base, noise: Math.max(base.noise, 1e-300) };
  const w = searchWindow(trace, b, { kind: 'fraction', from_s: t[MIN_BASELINE_SAMPLES] as number });
  const rise = pickFraction(trace, b, w, 0.5);
  const peak = w.sign * ((trace.values[w.iPeak] as number) - b.level);
  let i = w.iPeak;
  while (i < trace.values.length - 1 && w.sign * ((trace.values[i + 1] as number) - b.level) >= 0.5 * peak) i++;
  if (i >= trace.values.length - 1) throw new InvalidInputError('heater', 'the drive pulse does not fall back below half height before the end of the trace, so its centre is not known');
  const v0 = w.sign * ((trace.values[i] as number) - b.level);
  const v1 = w.sign * ((trace.values[i + 1] as number) - b.level);
  const t0 = t[i] as number;
  const t1 = t[i + 1] as number;
  const fall = v0 !== v1 ? t0 + ((v0 - 0.5 * peak) * (t1 - t0)) / (v0 - v1) : t1;
  const fallSd = Math.max(v0 > v1 ? b.noise / ((v0 - v1) / (t1 - t0)) : t1 - t0, (t1 - t0) / Math.sqrt(12));
  return { centre_s: (rise.t + fall) / 2, centreSd_s: Math.hypot(rise.sd, fallSd) / 2 };
}

/**
 * Heater pulse onset in a heater-drive trace: the 50 % crossing of its first rise (robust to
 * noise; for a fast rectangular drive it lies half a rise time after the true start, which a
 * path-length calibration made the same way absorbs into t0).
 */
export function heaterOnset(trace: Trace): { onset_s: number; onsetSd_s: number } {
  checkTrace(trace);
  const t = trace.time_s;
  // The heater channel may have no pre-trigger noise to speak of: baseline from the first 8 samples.
  const base = baselineOf(trace, t[MIN_BASELINE_SAMPLES] as number);
  const w = searchWindow(trace, base, { kind: 'fraction', from_s: t[MIN_BASELINE_SAMPLES] as number });
  const r = pickFraction(trace, { ...base, noise: Math.max(base.noise, 1e-300) }, w, 0.5);
  return { onset_s: r.t, onsetSd_s: r.sd };
}

/**
 * Where the heater drive starts to leave its baseline, s: the first sample more than 2 % of the
 * pulse's height from it (before that sample no heater pickup can reach a sensor channel).
 */
export function heaterStart(trace: Trace): number {
  checkTrace(trace);
  const t = trace.time_s;
  const base = baselineOf(trace, t[MIN_BASELINE_SAMPLES] as number);
  let peak = 0;
  for (let i = 0; i < trace.values.length; i++) peak = Math.max(peak, Math.abs((trace.values[i] as number) - base.level));
  for (let i = 0; i < trace.values.length; i++) if (Math.abs((trace.values[i] as number) - base.level) > 0.02 * peak) return t[i] as number;
  return t[t.length - 1] as number;
}
