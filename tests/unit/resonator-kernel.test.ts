/**
 * Resonator planning, temperature from a resonance, line density and the lock-in inverse plane,
 * against their formulas and sources (physics notes §8; each check names its own).
 */
import { describe, expect, it } from 'vitest';
import {
  analyseLockin,
  fitResonance,
  lineDensityFromAmplitude,
  lineDensityFromWidth,
  modeFromNeighbour,
  mutualFrictionB,
  noiseFromDifferences,
  OutOfRangeError,
  planResonator,
  QUANTUM_OF_CIRCULATION_M2_S,
  SECOND_SOUND_EXTREMA,
  secondSound,
  secondSoundSlope,
  TANGLE_GEOMETRIES,
  temperatureFromResonance,
} from '../../src/physics';
import { type ResonanceTruth, synthLockin, synthSweep } from '../support/resonator-synth';

describe('modes of a plane-parallel resonator (f_n = n u₂/(2d), physics notes §8; Wang, Wagner & Donnelly 1987 use this ideal-plate relation)', () => {
  const plan = planResonator({ gap_m: 2e-3, spacerId: null, temperature_K: 1.8, modes: 20, plateDiameter_m: 0.02, targetSd_K: 1e-5 });
  it('puts mode n at n u₂/(2d) and spaces them by u₂/(2d)', () => {
    const u2 = secondSound(1.8);
    for (const m of plan.modes) expect(m.frequency_Hz).toBeCloseTo((m.n * u2) / (2 * 2e-3), 8);
    expect(plan.modeSpacing_Hz).toBeCloseTo(u2 / 4e-3, 8);
    expect(plan.modes).toHaveLength(20);
  });
  it('gives df_n/dT = f_n (du₂/dT)/u₂', () => {
    const m = plan.modes[6];
    expect(m?.dfdT_Hz_K).toBeCloseTo(((m?.frequency_Hz ?? 0) * secondSoundSlope(1.8)) / secondSound(1.8), 8);
  });
  it('has df/dT vanish at the u₂ minimum and maximum (Donnelly & Barenghi 1998, Table 4.1: near 1.12 K and 1.65 K)', () => {
    for (const T of [SECOND_SOUND_EXTREMA.minimum.temperature_K, SECOND_SOUND_EXTREMA.maximum.temperature_K]) {
      const p = planResonator({ gap_m: 2e-3, spacerId: null, temperature_K: T, modes: 3, targetSd_K: 1e-4 });
      expect(Math.abs(p.modes[0]?.dfdT_Hz_K ?? 1)).toBeLessThan(1e-3);
      // Second order there: the step of 0.1 mK is ½|f″|δT², not zero.
      expect(p.modes[0]?.frequencyStep_Hz).toBeGreaterThan(0);
      expect(p.notes.map((n) => n.code)).toContain('extremum');
    }
    expect(plan.insensitiveAt_K.minimum).toBeCloseTo(1.12, 1);
    expect(plan.insensitiveAt_K.maximum).toBeCloseTo(1.65, 1);
  });
  it('needs δf = |df/dT| δT away from the extremes (first order)', () => {
    const m = plan.modes[0];
    expect(Math.abs((m?.frequencyStep_Hz ?? 0) / (Math.abs(m?.dfdT_Hz_K ?? 0) * 1e-5) - 1)).toBeLessThan(1e-3);
  });
  it('gives the Fresnel number a²/(λd) = n a²/(2d²) and a caution below 1', () => {
    expect(plan.modes[0]?.fresnelNumber).toBeCloseTo((1 * 0.01 ** 2) / (2 * 2e-3 ** 2), 9);
    const wide = planResonator({ gap_m: 0.02, spacerId: null, temperature_K: 1.8, modes: 2, plateDiameter_m: 0.01 });
    expect(wide.notes.find((n) => n.code === 'diffraction-limited')?.value).toBeCloseTo(0.005 ** 2 / (2 * 0.02 ** 2), 9);
  });
  it('contracts a gap measured warm with the spacer, like the planner (L_cold = L_warm (1 − ε))', () => {
    const p = planResonator({ gap_m: 0.01, spacerId: 'stainless-304', temperature_K: 1.8, modes: 1 });
    expect(p.gapCold_m).toBeCloseTo(0.01 * (1 - 0.003), 12);
    expect(p.notes.map((n) => n.code)).toContain('spacer');
  });
  it('gives the smallest line density from the amplitude noise: 6πΔ₀/(Bκ) · r/(1 − r)', () => {
    const p = planResonator({ gap_m: 0.01, spacerId: null, temperature_K: 1.85, modes: 1, width0_Hz: 2, amplitudeNoise: 1e-3 });
    const k = (6 * Math.PI * 2) / (mutualFrictionB(1.85) * QUANTUM_OF_CIRCULATION_M2_S);
    expect(p.lineDensityNoise_m2).toBeCloseTo((k * 1e-3) / (1 - 1e-3), 0);
    expect(p.lineDensityDetectable_m2).toBeCloseTo((k * 3e-3) / (1 - 3e-3), 0);
  });
  it('has no line density below the B range, and says why', () => {
    const p = planResonator({ gap_m: 0.01, spacerId: null, temperature_K: 1.1, modes: 1, width0_Hz: 2, amplitudeNoise: 1e-3 });
    expect(p.lineDensityNoise_m2).toBeNull();
    expect(p.notes.map((n) => n.code)).toContain('no-mutual-friction');
  });
  it.each([
    [{ gap_m: 0 }, /gap/],
    [{ temperature_K: 2.2 }, /temperature/],
    [{ modes: 0 }, /modes/],
    [{ plateDiameter_m: Number.NaN }, /plate diameter/],
  ])('refuses %o', (bad, message) => {
    expect(() => planResonator({ gap_m: 2e-3, spacerId: null, temperature_K: 1.8, modes: 3, ...bad })).toThrow(message);
  });
});

describe('temperature from a resonance (u₂ = 2 d f₀/n, then the delay inversion)', () => {
  it('round-trips a mode made at 1.85 K, with the chosen candidate near it', () => {
    const f = (8 * secondSound(1.85)) / (2 * 0.00997);
    const r = temperatureFromResonance({ frequency_Hz: f, frequencySd_Hz: 0.005, gap_m: 0.00997, gapSd_m: 1e-6, mode: 8 });
    expect(r.speed_m_s).toBeCloseTo(secondSound(1.85), 10);
    expect(r.speedSd_m_s / r.speed_m_s).toBeCloseTo(Math.hypot(0.005 / f, 1e-6 / 0.00997), 12);
    const near = r.candidates.find((c) => Math.abs(c.temperature_K - 1.85) < 1e-6);
    expect(near).toBeDefined();
  });
  it('refuses a mode that is not a whole number, or a speed no second sound has', () => {
    expect(() => temperatureFromResonance({ frequency_Hz: 1000, frequencySd_Hz: 0, gap_m: 0.01, gapSd_m: 0, mode: 2.5 })).toThrow(/whole number/);
    expect(() => temperatureFromResonance({ frequency_Hz: 1e7, frequencySd_Hz: 0, gap_m: 0.01, gapSd_m: 0, mode: 1 })).toThrow(OutOfRangeError);
  });
  it('finds n from a neighbouring resonance, for either neighbour', () => {
    const spacing = secondSound(1.8) / (2 * 0.01);
    expect(modeFromNeighbour(7 * spacing, 0.01, 8 * spacing, 0.01).mode).toBe(7);
    expect(modeFromNeighbour(8 * spacing, 0.01, 7 * spacing, 0.01).mode).toBe(8);
  });
  it('does not choose n when the ratio is far from a whole number or too uncertain (the data cannot decide)', () => {
    const spacing = 1000;
    // An end correction shifts the ratio a little: 7.1 is still n = 7; 7.4 is no neighbour pair of ideal plates.
    expect(modeFromNeighbour(7.1 * spacing, 0.01, 8.1 * spacing, 0.01).mode).toBe(7);
    expect(modeFromNeighbour(7.4 * spacing, 0.01, 8.4 * spacing, 0.01).mode).toBeNull();
    expect(modeFromNeighbour(7000, 50, 8000, 50).mode).toBeNull();
  });
});

describe('line density (L = (6πΔ₀/(Bκ))(A₀/A − 1), Vinen 1957; geometry factors 4π/⟨sin²θ⟩)', () => {
  it('has the factors 6π (isotropic), 4π (perpendicular: Hall & Vinen 1956) and 8π (in planes holding the wave)', () => {
    expect(TANGLE_GEOMETRIES.map((g) => [g.id, g.factor / Math.PI])).toEqual([
      ['isotropic', 6],
      ['perpendicular', 4],
      ['in-plane', 8],
    ]);
    for (const g of TANGLE_GEOMETRIES) expect(g.factor).toBeCloseTo((4 * Math.PI) / g.meanSin2, 12);
  });
  it('agrees between the amplitude form and the width form when A Δ is constant', () => {
    const W0 = 2.4;
    const A0 = 2e-3;
    const W = 4;
    const a = lineDensityFromAmplitude({ amplitude: (A0 * W0) / W, amplitudeSd: 1e-6, amplitude0: A0, amplitude0Sd: 1e-6, width0_Hz: W0, width0Sd_Hz: 0.004, temperature_K: 1.85 });
    const w = lineDensityFromWidth(W, 0.01, W0, 0.004, 1.85);
    expect(a.lineDensity_m2).toBeCloseTo(w.lineDensity_m2, 0);
    expect(a.lineDensity_m2).toBeCloseTo((6 * Math.PI * (W - W0)) / (mutualFrictionB(1.85) * QUANTUM_OF_CIRCULATION_M2_S), 0);
    expect(a.sd_m2).toBeCloseTo(Math.hypot(a.sdMeasurement_m2, a.sdReference_m2), 6);
  });
  it('refuses a temperature outside the B range', () => {
    expect(() => lineDensityFromWidth(3, 0, 2, 0, 1.2)).toThrow(/mutual friction B/);
  });
});

describe('the lock-in inverse plane (Woillez et al. 2023): L(t) and the drift of f₀, with covered sds', () => {
  const REF: ResonanceTruth = { f0_Hz: 7809.4, width_Hz: 2.4, amplitude: 2e-3, phase_rad: 0.6, background: { re: 5e-5, im: -3e-5, slopeRe: 2e-7, slopeIm: 1e-7 } };
  const T = 1.85;
  const k = (6 * Math.PI) / (mutualFrictionB(T) * QUANTUM_OF_CIRCULATION_M2_S);
  const L_TRUE = 2e8;
  const SHIFT = -0.1;
  const times = Float64Array.from({ length: 400 }, (_, i) => i * 0.1);

  it('recovers a known width and shift from a noiseless record exactly', () => {
    const sweep = synthSweep(REF, { from_Hz: REF.f0_Hz - 15, to_Hz: REF.f0_Hz + 15, points: 401, noise: 0, seed: 1 });
    const fit = fitResonance(sweep);
    const rec = synthLockin(REF, { drive_Hz: REF.f0_Hz + 0.3, times_s: times, width: () => REF.width_Hz + L_TRUE / k, centre: () => REF.f0_Hz + SHIFT, noise: 0, seed: 1 });
    const s = analyseLockin(rec, fit, { temperature_K: T, drive_Hz: REF.f0_Hz + 0.3, noise: 1e-9 });
    expect(s.lineDensity_m2[10] as number).toBeCloseTo(L_TRUE, -3);
    expect(s.frequencyShift_Hz[10] as number).toBeCloseTo(SHIFT, 6);
  });

  it('covers the truth: pulls of L and δf₀ (first row of 200 seeded records, each against its own reference sweep) have unit width', () => {
    // 200 pulls: sd known to ±0.05; 3 of those: ±0.15.
    const pullsL: number[] = [];
    const pullsF: number[] = [];
    const scatter: number[] = [];
    for (let trial = 0; trial < 200; trial++) {
      const sweep = synthSweep(REF, { from_Hz: REF.f0_Hz - 10, to_Hz: REF.f0_Hz + 10, points: 201, noise: 2e-5, seed: 500 + trial });
      const fit = fitResonance(sweep);
      const rec = synthLockin(REF, { drive_Hz: REF.f0_Hz, times_s: times, width: () => REF.width_Hz + L_TRUE / k, centre: () => REF.f0_Hz + SHIFT, noise: 2e-5, seed: 9000 + trial });
      const s = analyseLockin(rec, fit, { temperature_K: T, drive_Hz: REF.f0_Hz });
      pullsL.push(((s.lineDensity_m2[0] as number) - L_TRUE) / (s.lineDensitySd_m2[0] as number));
      pullsF.push(((s.frequencyShift_Hz[0] as number) - SHIFT) / (s.frequencyShiftSd_Hz[0] as number));
      if (trial < 20) {
        // Within one record the rows share the reference: their scatter is the measurement part alone.
        let mean = 0;
        for (let i = 0; i < s.lineDensity_m2.length; i++) mean += s.lineDensity_m2[i] as number;
        mean /= s.lineDensity_m2.length;
        for (let i = 0; i < s.lineDensity_m2.length; i++) scatter.push(((s.lineDensity_m2[i] as number) - mean) / (s.lineDensitySdMeasurement_m2[i] as number));
      }
    }
    for (const p of [pullsL, pullsF]) {
      const mean = p.reduce((a, b) => a + b, 0) / p.length;
      const sd = Math.sqrt(p.reduce((a, b) => a + (b - mean) ** 2, 0) / (p.length - 1));
      expect(Math.abs(mean)).toBeLessThan(0.22);
      expect(sd).toBeGreaterThan(0.85);
      expect(sd).toBeLessThan(1.15);
    }
    const sdScatter = Math.sqrt(scatter.reduce((a, b) => a + b * b, 0) / scatter.length);
    // 8000 rows: the noise estimate from differences itself scatters by a few %; 10 %.
    expect(Math.abs(sdScatter - 1)).toBeLessThan(0.1);
  });

  it('estimates white noise from successive differences within 5 %', () => {
    const rec = synthLockin(REF, { drive_Hz: REF.f0_Hz, times_s: Float64Array.from({ length: 20000 }, (_, i) => i), width: () => 2.4, centre: () => REF.f0_Hz, noise: 3e-5, seed: 4 });
    expect(Math.abs(noiseFromDifferences(rec) / 3e-5 - 1)).toBeLessThan(0.05);
  });

  it('refuses an amplitude-only reference and a temperature outside the B range', () => {
    const sweep = synthSweep(REF, { from_Hz: REF.f0_Hz - 10, to_Hz: REF.f0_Hz + 10, points: 201, noise: 2e-5, seed: 1 });
    const fit = fitResonance(sweep);
    const amp = fitResonance({ frequency_Hz: sweep.frequency_Hz, amplitude: Float64Array.from(sweep.x, (x, i) => Math.hypot(x, sweep.y[i] as number)) });
    const rec = { time_s: new Float64Array([0, 1]), x: new Float64Array([1e-3, 1e-3]), y: new Float64Array([0, 0]) };
    expect(() => analyseLockin(rec, amp, { temperature_K: T })).toThrow(/x and y/);
    expect(() => analyseLockin(rec, fit, { temperature_K: 1.0 })).toThrow(OutOfRangeError);
  });
});
