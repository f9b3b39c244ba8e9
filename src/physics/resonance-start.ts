import { InvalidInputError } from './errors';

/*
 * Where the resonance fit starts (resonance-fit.ts): a straight background through the means of the
 * first and last twentieth of the sweep, the peak of what stands above it (centre, amplitude,
 * phase) and its half-power points (width; twice one side when the other is off the sweep, and
 * at least two frequency steps). Levenberg–Marquardt takes it from there.
 */

/** The columns of a sweep (the shape of resonance-fit.ts's SweepData). */
interface SweepColumns {
  frequency_Hz: Float64Array;
  x?: Float64Array;
  y?: Float64Array;
  amplitude?: Float64Array;
}

export interface Start {
  s0: number;
  width_Hz: number;
  A: number;
  phase: number;
  b0r: number;
  b0i: number;
  /** Background slopes per Hz. */
  b1r: number;
  b1i: number;
}

export function initialGuess(data: SweepColumns, complex: boolean, centre: number): Start {
  const f = data.frequency_Hz;
  const n = f.length;
  const x = (complex ? data.x : data.amplitude) as Float64Array;
  const y = complex ? (data.y as Float64Array) : null;
  const k = Math.max(2, Math.floor(n / 20));
  const mean = (arr: Float64Array | null, from: number, to: number) => {
    if (!arr) return 0;
    let sum = 0;
    for (let i = from; i < to; i++) sum += arr[i] as number;
    return sum / (to - from);
  };
  const fa = mean(f, 0, k);
  const fb = mean(f, n - k, n);
  const xa = mean(x, 0, k);
  const xb = mean(x, n - k, n);
  const ya = mean(y, 0, k);
  const yb = mean(y, n - k, n);
  const slopeX = (xb - xa) / (fb - fa);
  const slopeY = (yb - ya) / (fb - fa);
  const bx = (i: number) => xa + slopeX * ((f[i] as number) - fa);
  const by = (i: number) => ya + slopeY * ((f[i] as number) - fa);
  const mag = new Float64Array(n);
  let peak = 0;
  let at = 0;
  for (let i = 0; i < n; i++) {
    const dx = (x[i] as number) - bx(i);
    const dy = y ? (y[i] as number) - by(i) : 0;
    const m = complex ? Math.hypot(dx, dy) : Math.abs(dx);
    mag[i] = m;
    if (m > peak) {
      peak = m;
      at = i;
    }
  }
  if (!(peak > 0)) throw new InvalidInputError('sweep', 'the signal is flat: no resonance to fit');
  const half = peak / Math.SQRT2;
  const edge = (dir: 1 | -1): number | null => {
    for (let i = at; i >= 0 && i < n; i += dir) {
      if ((mag[i] as number) < half) {
        const j = i - dir;
        const mi = mag[i] as number;
        const mj = mag[j] as number;
        const frac = (mj - half) / (mj - mi);
        return (f[j] as number) + frac * ((f[i] as number) - (f[j] as number));
      }
    }
    return null;
  };
  const lo = edge(-1);
  const hi = edge(1);
  const fPeak = f[at] as number;
  const step = medianStep(f);
  let width: number;
  if (lo !== null && hi !== null) width = Math.abs(hi - lo);
  else if (lo !== null) width = 2 * Math.abs(fPeak - lo);
  else if (hi !== null) width = 2 * Math.abs(hi - fPeak);
  else width = Math.abs((f[n - 1] as number) - (f[0] as number)) / 2;
  width = Math.max(width, 2 * step);
  const dx = (x[at] as number) - bx(at);
  const dy = y ? (y[at] as number) - by(at) : 0;
  return {
    s0: (fPeak - centre) / width,
    width_Hz: width,
    A: complex ? peak : dx,
    phase: Math.atan2(dy, dx),
    b0r: xa + slopeX * (centre - fa),
    b0i: ya + slopeY * (centre - fa),
    b1r: slopeX,
    b1i: slopeY,
  };
}

export function medianStep(f: Float64Array): number {
  const steps = new Float64Array(f.length - 1);
  for (let i = 1; i < f.length; i++) steps[i - 1] = Math.abs((f[i] as number) - (f[i - 1] as number));
  steps.sort();
  return steps[steps.length >> 1] as number;
}

