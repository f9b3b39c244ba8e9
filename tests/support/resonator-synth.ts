/**
 * Synthetic second-sound resonator data from a stated model, for tests, benchmarks and the demo:
 * the complex Lorentzian of src/physics/resonance-fit.ts with a complex linear background, plus
 * white Gaussian noise of a given sd on each of x and y, from a seeded generator.
 */
import { gaussian, seededRandom } from './synthetic-trace';

export interface ResonanceTruth {
  f0_Hz: number;
  width_Hz: number;
  amplitude: number;
  phase_rad: number;
  /** Background b₀ (complex) at f0 and its slope per Hz. */
  background: { re: number; im: number; slopeRe: number; slopeIm: number };
}

/** The noiseless complex response at f. */
export function responseAt(t: ResonanceTruth, f: number): { re: number; im: number } {
  const g = t.width_Hz / 2;
  const u = f - t.f0_Hz;
  const d2 = g * g + u * u;
  const qr = (g * g) / d2;
  const qi = (-g * u) / d2;
  const er = t.amplitude * Math.cos(t.phase_rad);
  const ei = t.amplitude * Math.sin(t.phase_rad);
  const off = f - t.f0_Hz;
  return { re: er * qr - ei * qi + t.background.re + t.background.slopeRe * off, im: er * qi + ei * qr + t.background.im + t.background.slopeIm * off };
}

/** A sweep of `points` from `from_Hz` to `to_Hz` with noise `noise` per component. */
export function synthSweep(t: ResonanceTruth, o: { from_Hz: number; to_Hz: number; points: number; noise: number; seed: number }) {
  const normal = gaussian(seededRandom(o.seed));
  const frequency_Hz = new Float64Array(o.points);
  const x = new Float64Array(o.points);
  const y = new Float64Array(o.points);
  for (let i = 0; i < o.points; i++) {
    const f = o.from_Hz + ((o.to_Hz - o.from_Hz) * i) / (o.points - 1);
    const z = responseAt(t, f);
    frequency_Hz[i] = f;
    x[i] = z.re + o.noise * normal();
    y[i] = z.im + o.noise * normal();
  }
  return { frequency_Hz, x, y };
}

/**
 * A lock-in record at a fixed drive: at each time the resonance has width `width(t)` and centre
 * `centre(t)`, with A·Δ held at the reference's (a constant drive), the reference's phase and
 * background, and noise `noise` per component.
 */
export function synthLockin(
  reference: ResonanceTruth,
  o: { drive_Hz: number; times_s: Float64Array; width: (t: number) => number; centre: (t: number) => number; noise: number; seed: number },
) {
  const normal = gaussian(seededRandom(o.seed));
  const n = o.times_s.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const product = reference.amplitude * reference.width_Hz;
  for (let i = 0; i < n; i++) {
    const t = o.times_s[i] as number;
    const w = o.width(t);
    const z = responseAt({ ...reference, width_Hz: w, amplitude: product / w, f0_Hz: o.centre(t) }, o.drive_Hz);
    // The background is the reference's, at the drive (responseAt measured it from the moving centre).
    const shift = o.centre(t) - reference.f0_Hz;
    x[i] = z.re + reference.background.slopeRe * shift + o.noise * normal();
    y[i] = z.im + reference.background.slopeIm * shift + o.noise * normal();
  }
  return { time_s: o.times_s, x, y };
}
