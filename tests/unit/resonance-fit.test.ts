/**
 * The resonance fit against synthetic sweeps made from known parameters and noise
 * (tests/support/resonator-synth.ts), and the coverage of its stated sds by seeded Monte Carlo.
 * Source of the model: the complex Lorentzian of the physics notes §8 (Woillez et al. 2023 use the
 * same form); coverage is checked by pulls (fit − truth)/sd, which must have unit width.
 */
import { describe, expect, it } from 'vitest';
import { ConvergenceError, fitResonance, InvalidInputError, resonanceAt } from '../../src/physics';
import { type ResonanceTruth, responseAt, synthSweep } from '../support/resonator-synth';
import { gaussian, seededRandom } from '../support/synthetic-trace';

const TRUTH: ResonanceTruth = { f0_Hz: 5123.4, width_Hz: 3.2, amplitude: 1e-3, phase_rad: 0.7, background: { re: 1e-4, im: -3e-4, slopeRe: 2e-6, slopeIm: -1e-6 } };

describe('a resonance fitted from a synthetic sweep with known parameters and noise', () => {
  const sweep = synthSweep(TRUTH, { from_Hz: 5103.4, to_Hz: 5143.4, points: 2000, noise: 2e-5, seed: 3 });
  const fit = fitResonance(sweep);

  it.each([
    ['centre', () => fit.frequency_Hz - TRUTH.f0_Hz, () => fit.frequencySd_Hz],
    ['width', () => fit.width_Hz - TRUTH.width_Hz, () => fit.widthSd_Hz],
    ['amplitude', () => fit.amplitude - TRUTH.amplitude, () => fit.amplitudeSd],
    ['phase', () => (fit.phase_rad as number) - TRUTH.phase_rad, () => fit.phaseSd_rad as number],
  ])('finds the %s within 4 of its stated sds', (_, error, sd) => {
    // 4 sd: one draw from a unit normal lies beyond 4 with probability 6e-5.
    expect(Math.abs(error())).toBeLessThan(4 * sd());
    expect(sd()).toBeGreaterThan(0);
  });

  it('states sds of the size the noise implies (centre: about σ√(2Δ/(π N df))/A, within a factor 2)', () => {
    // For a Lorentzian sampled densely the centre's sd is σ/A · √(Δ/(π ρ)) with ρ = points per Hz
    // (common practice, derived for white noise): 2e-5/1e-3 · √(3.2/(π·50)) ≈ 2.9e-3 Hz.
    const expected = (2e-5 / 1e-3) * Math.sqrt(3.2 / (Math.PI * 50));
    expect(fit.frequencySd_Hz / expected).toBeGreaterThan(0.5);
    expect(fit.frequencySd_Hz / expected).toBeLessThan(2);
  });

  it('finds the noise from the residuals and sees them uncorrelated', () => {
    expect(fit.residualSd / 2e-5).toBeGreaterThan(0.95);
    expect(fit.residualSd / 2e-5).toBeLessThan(1.05);
    expect(Math.abs(fit.residualCorrelation)).toBeLessThan(0.1);
    expect(fit.warnings).toEqual([]);
  });

  it('gives Q = f₀/Δ and the model back through resonanceAt', () => {
    expect(fit.q).toBeCloseTo(fit.frequency_Hz / fit.width_Hz, 9);
    const at = resonanceAt(fit, TRUTH.f0_Hz + 1);
    const truth = responseAt(TRUTH, TRUTH.f0_Hz + 1);
    expect(Math.hypot(at.re - truth.re, at.im - truth.im)).toBeLessThan(2e-5);
  });

  it('reads a falling sweep the same as a rising one', () => {
    const reversed = { frequency_Hz: sweep.frequency_Hz.slice().reverse(), x: sweep.x.slice().reverse(), y: sweep.y.slice().reverse() };
    const back = fitResonance(reversed);
    expect(back.frequency_Hz).toBeCloseTo(fit.frequency_Hz, 6);
    expect(back.width_Hz).toBeCloseTo(fit.width_Hz, 6);
  });

  it('fits an amplitude alone (magnitude on a real background) within 4 sd of the truth', () => {
    const clean = { ...TRUTH, background: { re: 0, im: 0, slopeRe: 0, slopeIm: 0 } };
    const normal = gaussian(seededRandom(11));
    const f = sweep.frequency_Hz;
    const amplitude = Float64Array.from(f, (fr) => {
      const z = responseAt(clean, fr);
      return Math.hypot(z.re, z.im) + 2e-5 * normal();
    });
    const a = fitResonance({ frequency_Hz: f, amplitude });
    expect(a.kind).toBe('amplitude');
    expect(a.phase_rad).toBeNull();
    expect(Math.abs(a.frequency_Hz - TRUTH.f0_Hz)).toBeLessThan(4 * a.frequencySd_Hz);
    expect(Math.abs(a.width_Hz - TRUTH.width_Hz)).toBeLessThan(4 * a.widthSd_Hz);
    expect(Math.abs(a.amplitude - TRUTH.amplitude)).toBeLessThan(4 * a.amplitudeSd);
  });
});

describe('coverage of the stated sds (seeded Monte Carlo, 300 sweeps)', () => {
  // 300 pulls: the sd of a unit normal sample is known to ±0.041 (1/√600); 3 of those: 0.12.
  // The fraction inside ±1 sd: 0.683 ± 0.027, so ±0.08 at 3 sd. Means: ±3/√300 = ±0.17.
  const TRIALS = 300;
  const pulls = { f0: [] as number[], width: [] as number[], amplitude: [] as number[], phase: [] as number[] };
  for (let k = 0; k < TRIALS; k++) {
    const s = synthSweep(TRUTH, { from_Hz: 5113.4, to_Hz: 5133.4, points: 401, noise: 5e-5, seed: 1000 + k });
    const fit = fitResonance(s);
    pulls.f0.push((fit.frequency_Hz - TRUTH.f0_Hz) / fit.frequencySd_Hz);
    pulls.width.push((fit.width_Hz - TRUTH.width_Hz) / fit.widthSd_Hz);
    pulls.amplitude.push((fit.amplitude - TRUTH.amplitude) / fit.amplitudeSd);
    pulls.phase.push(((fit.phase_rad as number) - TRUTH.phase_rad) / (fit.phaseSd_rad as number));
  }
  it.each(Object.entries(pulls))('pulls of %s have unit width, zero mean and 68 % inside ±1', (_, p) => {
    const mean = p.reduce((a, b) => a + b, 0) / p.length;
    const sd = Math.sqrt(p.reduce((a, b) => a + (b - mean) ** 2, 0) / (p.length - 1));
    const inside = p.filter((x) => Math.abs(x) < 1).length / p.length;
    expect(Math.abs(mean)).toBeLessThan(0.17);
    expect(sd).toBeGreaterThan(0.88);
    expect(sd).toBeLessThan(1.12);
    expect(Math.abs(inside - 0.6827)).toBeLessThan(0.08);
  });
});

describe('refusals and cautions', () => {
  const base = synthSweep(TRUTH, { from_Hz: 5113.4, to_Hz: 5133.4, points: 101, noise: 2e-5, seed: 5 });
  it('needs 12 points', () => {
    expect(() => fitResonance({ frequency_Hz: base.frequency_Hz.slice(0, 5), x: base.x.slice(0, 5), y: base.y.slice(0, 5) })).toThrow(/at least 12 points, got 5/);
  });
  it('refuses frequencies out of order, naming the point', () => {
    const f = base.frequency_Hz.slice();
    f[10] = f[3] as number;
    expect(() => fitResonance({ frequency_Hz: f, x: base.x, y: base.y })).toThrow(/point 11/);
  });
  it('refuses a flat signal', () => {
    const flat = new Float64Array(base.x.length).fill(1);
    expect(() => fitResonance({ frequency_Hz: base.frequency_Hz, x: flat, y: flat })).toThrow(InvalidInputError);
  });
  it('refuses a sweep without signal columns', () => {
    expect(() => fitResonance({ frequency_Hz: base.frequency_Hz })).toThrow(/give x and y/);
  });
  it('says when the sweep misses the peak and is narrow', () => {
    const side = synthSweep(TRUTH, { from_Hz: 5124.5, to_Hz: 5126.5, points: 60, noise: 1e-6, seed: 9 });
    let fit: ReturnType<typeof fitResonance> | null = null;
    try {
      fit = fitResonance(side);
    } catch (error) {
      expect(error).toBeInstanceOf(ConvergenceError);
    }
    if (fit) expect(fit.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['centre-outside', 'narrow-sweep']));
  });
  it('says when residuals are correlated (a slow lock-in), where the sds are too small', () => {
    const s = synthSweep(TRUTH, { from_Hz: 5113.4, to_Hz: 5133.4, points: 401, noise: 0, seed: 1 });
    const normal = gaussian(seededRandom(21));
    let ex = 0;
    let ey = 0;
    for (let i = 0; i < s.x.length; i++) {
      ex = 0.9 * ex + 2e-5 * normal();
      ey = 0.9 * ey + 2e-5 * normal();
      s.x[i] = (s.x[i] as number) + ex;
      s.y[i] = (s.y[i] as number) + ey;
    }
    const fit = fitResonance(s);
    expect(fit.warnings.map((w) => w.code)).toContain('correlated-residuals');
  });
});
