import { fitParabola } from './parabola';
import type { PickerKind } from './pickers';
import type { PulseProfile } from './pulse-shape';
import type { SampledSignal } from './received-pulse';

/*
 * The true arrival of the feature each picker measures, found on the planner's own prediction (its
 * fine grid, no noise, no digitiser), as a delay measured like with like the way the converter
 * measures it with a heater channel (src/io/trace-pick.ts):
 *  - threshold: where the predicted pulse first reaches k × the record's noise rms, from the
 *    drive's 50 % rise;
 *  - fraction:  where it reaches f × its peak on the leading edge of the peak, from the drive's 50 % rise;
 *  - peak:      the vertex of the least-squares parabola through the run of points above half the
 *    extreme around it, at most 200 sample intervals long, grown first backwards then forwards as
 *    the peak picker grows it (src/physics/pickers.ts), from the drive's centre at half height;
 *  - xcorr:     the shift that best lays the drive f(t) over the prediction (the cross-correlation's
 *    maximum, parabola-refined): the drive's onset to its copy in the sensor.
 * Linear interpolation between the grid's points; the grid resolves the edges to a tenth of the
 * rise (sensor-plan.ts), so these times hold to about a hundredth of the rise.
 */

export interface FeatureSettings {
  picker: PickerKind;
  /** Threshold level, V (k × the record's noise rms). */
  thresholdLevel_V: number;
  /** Fraction of the peak. */
  fraction: number;
  polarity: 'positive' | 'negative';
  /** The digitiser's sample interval, s (the peak picker's longest run is counted in samples). */
  sampleInterval_s: number;
}

/** The peak picker's longest run, sample intervals (PEAK_MAX_POINTS − 1 in pickers.ts). */
const PEAK_RUN_INTERVALS = 200;
/** Points per sample interval for the peak's run, and the most points refined. */
const PEAK_REFINE = 32;
const MAX_REFINED_POINTS = 400_000;

/** The span on a finer grid, by linear interpolation (at most {@link MAX_REFINED_POINTS} points). */
function refined(span: SampledSignal, step_s: number): SampledSignal {
  const n = span.values.length;
  const factor = Math.max(1, Math.min(Math.ceil(span.step_s / step_s), Math.floor(MAX_REFINED_POINTS / n)));
  const h = span.step_s / factor;
  const values = new Float64Array((n - 1) * factor + 1);
  for (let i = 0; i < values.length; i++) {
    const k = Math.min(n - 2, Math.floor(i / factor));
    const f = i / factor - k;
    values[i] = (1 - f) * (span.values[k] as number) + f * (span.values[k + 1] as number);
  }
  return { start_s: span.start_s, step_s: h, values };
}

/** The prediction between `from_s` and `to_s` on one grid (segments on one step, gaps filled with 0). */
export function predictionSpan(segments: readonly SampledSignal[], from_s: number, to_s: number): SampledSignal | null {
  const first = segments[0];
  if (!first) return null;
  const step = first.step_s;
  const i0 = Math.floor(from_s / step);
  const i1 = Math.ceil(to_s / step);
  if (!(i1 > i0 + 2)) return null;
  const values = new Float64Array(i1 - i0 + 1);
  for (const s of segments) {
    const k0 = Math.round(s.start_s / step);
    for (let k = 0; k < s.values.length; k++) {
      const i = k0 + k - i0;
      if (i >= 0 && i < values.length) values[i] = (values[i] as number) + (s.values[k] as number);
    }
  }
  return { start_s: i0 * step, step_s: step, values };
}

/** Where f rises through half its peak for the first time, s after the onset. */
export function driveHalfRise(profile: PulseProfile): number {
  return driveCrossings(profile).rise_s;
}

function driveCrossings(profile: PulseProfile): { rise_s: number; fall_s: number } {
  const n = 20000;
  const h = profile.duration_s / n;
  let rise = Number.NaN;
  let fall = Number.NaN;
  let previous = profile.value(0);
  for (let i = 1; i <= n; i++) {
    const v = profile.value(i * h);
    if (Number.isNaN(rise) && previous < 0.5 && v >= 0.5) rise = (i - 1 + (0.5 - previous) / (v - previous)) * h;
    if (!Number.isNaN(rise) && previous >= 0.5 && v < 0.5) fall = (i - 1 + (previous - 0.5) / (previous - v)) * h;
    previous = v;
  }
  return { rise_s: rise, fall_s: Number.isNaN(fall) ? profile.duration_s : fall };
}

/** The drive's centre at half height (midpoint of its 50 % rise and last 50 % fall), s after the onset. */
export function driveCentre(profile: PulseProfile): number {
  const c = driveCrossings(profile);
  return (c.rise_s + c.fall_s) / 2;
}

function vertexOffset(ym: number, y0: number, yp: number): number {
  const c = ym - 2 * y0 + yp;
  return c !== 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (ym - yp)) / c)) : 0;
}

/**
 * The true delay of the picker's feature in the prediction `span` (V, s after the heater onset),
 * or null when the feature is not there (a threshold above the pulse).
 */
export function featureDelay(span: SampledSignal, profile: PulseProfile, f: FeatureSettings): number | null {
  // A flat top makes the peak's parabola hang on the ends of its run: resolve them finely.
  if (f.picker === 'peak' && span.step_s > f.sampleInterval_s / PEAK_REFINE) return featureDelay(refined(span, f.sampleInterval_s / PEAK_REFINE), profile, f);
  const v = span.values;
  const h = span.step_s;
  const sign = f.polarity === 'negative' ? -1 : 1;
  const y = (i: number) => sign * (v[i] as number);
  const at = (i: number) => span.start_s + i * h;
  let iPeak = 0;
  for (let i = 1; i < v.length; i++) if (y(i) > y(iPeak)) iPeak = i;
  const top = y(iPeak);
  if (!(top > 0)) return null;
  const crossingBefore = (level: number, from: number): number | null => {
    let i = from;
    while (i > 0 && y(i - 1) >= level) i--;
    if (i === 0) return null;
    return at(i - 1) + ((level - y(i - 1)) / (y(i) - y(i - 1))) * h;
  };
  switch (f.picker) {
    case 'threshold': {
      for (let i = 1; i < v.length; i++) {
        if (y(i) >= f.thresholdLevel_V) return y(i - 1) < f.thresholdLevel_V ? at(i - 1) + ((f.thresholdLevel_V - y(i - 1)) / (y(i) - y(i - 1))) * h - driveHalfRise(profile) : null;
      }
      return null;
    }
    case 'fraction': {
      const t = crossingBefore(f.fraction * top, iPeak);
      return t === null ? null : t - driveHalfRise(profile);
    }
    case 'peak': {
      if (iPeak === 0 || iPeak === v.length - 1) return null;
      const longest = Math.max(2, Math.floor((PEAK_RUN_INTERVALS * f.sampleInterval_s) / h));
      let lo = iPeak;
      let hi = iPeak;
      while (lo > 0 && hi - lo < longest && y(lo - 1) >= 0.5 * top) lo--;
      while (hi < v.length - 1 && hi - lo < longest && y(hi + 1) >= 0.5 * top) hi++;
      lo = Math.min(lo, iPeak - 1);
      hi = Math.max(hi, iPeak + 1);
      const u = Float64Array.from({ length: hi - lo + 1 }, (_, k) => lo + k - iPeak);
      const p = fitParabola(u, Float64Array.from(u, (k) => y(iPeak + k)));
      const vertex = p.c < 0 ? Math.max(u[0] as number, Math.min(u[u.length - 1] as number, -p.b / (2 * p.c))) : 0;
      return at(iPeak) + vertex * h - driveCentre(profile);
    }
    case 'xcorr': {
      const m = Math.max(3, Math.ceil(profile.duration_s / h) + 1);
      const template = new Float64Array(m);
      for (let j = 0; j < m; j++) template[j] = profile.value(j * h);
      const lags = v.length - m + 1;
      if (lags < 3) return null;
      const scores = new Float64Array(lags);
      let best = 0;
      for (let k = 0; k < lags; k++) {
        let acc = 0;
        for (let j = 0; j < m; j++) acc += (template[j] as number) * y(k + j);
        scores[k] = acc;
        if (acc > (scores[best] as number)) best = k;
      }
      const off = best > 0 && best < lags - 1 ? vertexOffset(scores[best - 1] as number, scores[best] as number, scores[best + 1] as number) : 0;
      return at(best) + off * h;
    }
  }
}
