/**
 * Delay → temperature: round trips, the three-root region, the sd formula, the extremes, the
 * distance fit and the path calibration. Reference facts: u2 minimum 18.34 m/s near 1.12 K and
 * maximum 20.37 m/s near 1.65 K on the Donnelly & Barenghi (1998) curve (PHYSICS notes §6).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  calibratePathFromSweep,
  chooseAlongSeries,
  chooseCandidate,
  convertDelay,
  fitDistances,
  MODEL_MIN_K,
  NonFiniteInputError,
  OutOfRangeError,
  SECOND_SOUND_EXTREMA,
  secondSound,
  secondSoundSd,
  secondSoundSlope,
  SPEED_RANGE_M_S,
  T_LAMBDA_K,
  temperatureCandidates,
  vapourPressure,
} from '../../src/physics';
import { gaussian, seededRandom } from '../support/synthetic-trace';

describe('every candidate temperature for a speed', () => {
  it('round trip T → u2(T) → candidates contains T (to 1e-9 K) over the whole range (property test)', () => {
    fc.assert(
      fc.property(fc.double({ min: MODEL_MIN_K, max: T_LAMBDA_K * (1 - 1e-7), noNaN: true }), (T) => {
        const candidates = temperatureCandidates(secondSound(T), 0);
        const best = Math.min(...candidates.map((c) => Math.abs(c.temperature_K - T)));
        expect(best).toBeLessThan(1e-9);
        // Every candidate has the speed: to within what 1e-9 K of temperature moves it.
        for (const c of candidates.filter((x) => x.kind === 'root')) {
          expect(Math.abs(secondSound(c.temperature_K) - secondSound(T))).toBeLessThan(Math.abs(c.slope_m_s_K) * 1e-9 + 1e-12);
        }
      }),
      { numRuns: 3000 },
    );
  });

  it('a speed between the extremes has three roots, one on each branch (PHYSICS notes §6)', () => {
    const c = temperatureCandidates(19.5, 1e-4);
    expect(c.map((x) => x.branch)).toEqual(['low', 'middle', 'high']);
    expect(c[0]?.temperature_K).toBeLessThan(SECOND_SOUND_EXTREMA.minimum.temperature_K);
    expect(c[1]?.temperature_K).toBeGreaterThan(SECOND_SOUND_EXTREMA.minimum.temperature_K);
    expect(c[1]?.temperature_K).toBeLessThan(SECOND_SOUND_EXTREMA.maximum.temperature_K);
    expect(c[2]?.temperature_K).toBeGreaterThan(SECOND_SOUND_EXTREMA.maximum.temperature_K);
  });

  it('above the maximum: one root below 0.93 K; below the minimum: one root above about 1.92 K (PHYSICS notes §6)', () => {
    const fast = temperatureCandidates(25, 1e-4);
    expect(fast.length).toBe(1);
    expect(fast[0]?.temperature_K).toBeLessThan(0.93);
    const slow = temperatureCandidates(15, 1e-4);
    expect(slow.length).toBe(1);
    expect(slow[0]?.temperature_K).toBeGreaterThan(1.92);
  });

  it('the minimum 18.34 m/s lies near 1.12 K and the maximum 20.37 m/s near 1.65 K (D&B 1998 Table 4.1)', () => {
    expect(SECOND_SOUND_EXTREMA.minimum.temperature_K).toBeCloseTo(1.12, 2);
    expect(SECOND_SOUND_EXTREMA.minimum.speed_m_s).toBeCloseTo(18.34, 2);
    expect(SECOND_SOUND_EXTREMA.maximum.temperature_K).toBeCloseTo(1.65, 2);
    expect(SECOND_SOUND_EXTREMA.maximum.speed_m_s).toBeCloseTo(20.37, 2);
  });

  it('branches are monotonic: candidates come out coldest first and each has the slope sign of its branch', () => {
    for (const u of [18.5, 19, 19.9, 20.3]) {
      const c = temperatureCandidates(u, 1e-4);
      expect(c[0]?.slope_m_s_K).toBeLessThan(0);
      expect(c[1]?.slope_m_s_K).toBeGreaterThan(0);
      expect(c[2]?.slope_m_s_K).toBeLessThan(0);
    }
  });

  it('refuses speeds no second sound has, and NaN', () => {
    expect(() => temperatureCandidates(SPEED_RANGE_M_S[1] * 1.01, 0)).toThrow(OutOfRangeError);
    expect(() => temperatureCandidates(0, 0)).toThrow(OutOfRangeError);
    expect(() => temperatureCandidates(Number.NaN, 0)).toThrow(NonFiniteInputError);
    expect(() => temperatureCandidates(19, -1)).toThrow(OutOfRangeError);
  });
});

describe('sd of a candidate (PHYSICS notes §6)', () => {
  it('σ_T = (u2/|du2/dT|)·√((σ_d/d)² + (σ_t/(t−t0))² + (σ_model/u2)²) away from the extremes', () => {
    const d = 0.05;
    const T = 1.9;
    const t = d / secondSound(T);
    const r = convertDelay({ distance_m: d, delay_s: t + 30e-6, distanceSd_m: 20e-6, delaySd_s: 1e-6, offset_s: 30e-6, offsetSd_s: 2e-6 });
    const c = r.candidates.find((x) => Math.abs(x.temperature_K - T) < 1e-6);
    expect(c).toBeDefined();
    const rel = Math.hypot(20e-6 / d, Math.hypot(1e-6, 2e-6) / t, secondSoundSd(T) / secondSound(T));
    const expected = (secondSound(T) / Math.abs(secondSoundSlope(T))) * rel;
    // The kernel keeps a curvature term that changes this by under 1e-4 relative here.
    expect(Math.abs((c?.sd_K as number) / expected - 1)).toBeLessThan(1e-4);
    expect(c?.insensitive).toBe(false);
    expect(r.speedSd_m_s / r.speed_m_s).toBeCloseTo(Math.hypot(20e-6 / d, Math.hypot(1e-6, 2e-6) / t), 12);
  });

  it('at an extremum: no division by zero, the second-order bound √(2σ_u/|u2″|), and "insensitive"', () => {
    const { temperature_K: T, speed_m_s: u } = SECOND_SOUND_EXTREMA.maximum;
    const rel = 1e-4;
    const c = temperatureCandidates(u, rel).find((x) => x.branch === 'middle');
    expect(c?.insensitive).toBe(true);
    expect(Number.isFinite(c?.sd_K)).toBe(true);
    const sigmaU = u * Math.hypot(rel, secondSoundSd(T) / u);
    const h = 1e-3;
    const curvature = Math.abs((secondSoundSlope(T + h) - secondSoundSlope(T - h)) / (2 * h));
    expect(Math.abs((c?.sd_K as number) / Math.sqrt((2 * sigmaU) / curvature) - 1)).toBeLessThan(0.02);
  });

  it('a speed just beyond an extremum, within its sd, is read as the extremum itself', () => {
    const { speed_m_s: uMax, temperature_K: Tmax } = SECOND_SOUND_EXTREMA.maximum;
    const c = temperatureCandidates(uMax * (1 + 0.0005), 1e-3);
    expect(c.some((x) => x.temperature_K === Tmax && x.insensitive && x.kind === 'extremum')).toBe(true);
    // Far beyond (10 sd): only the low-branch root.
    expect(temperatureCandidates(uMax * 1.01, 1e-4).map((x) => x.branch)).toEqual(['low']);
  });

  it('sd is finite and positive everywhere in the range (property test)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 130, noNaN: true }), fc.double({ min: 1e-6, max: 0.05, noNaN: true }), (u, rel) => {
        for (const c of temperatureCandidates(u, rel)) {
          expect(Number.isFinite(c.sd_K)).toBe(true);
          expect(c.sd_K).toBeGreaterThan(0);
        }
      }),
      { numRuns: 2000 },
    );
  });
});

describe('delay readings', () => {
  it('50 mm in 2.5 ms is 20 m/s: three candidates (worked example)', () => {
    const r = convertDelay({ distance_m: 0.05, delay_s: 2.5e-3, distanceSd_m: 20e-6, delaySd_s: 1e-6, offset_s: 0, offsetSd_s: 0 });
    expect(r.speed_m_s).toBeCloseTo(20, 12);
    expect(r.candidates.length).toBe(3);
  });

  it('the offset is subtracted: u = d/(t − t0)', () => {
    const r = convertDelay({ distance_m: 0.05, delay_s: 2.6e-3, distanceSd_m: 0, delaySd_s: 0, offset_s: 0.1e-3, offsetSd_s: 0 });
    expect(r.speed_m_s).toBeCloseTo(20, 12);
  });

  it('names the field when a reading is impossible', () => {
    const base = { distance_m: 0.05, delay_s: 2.5e-3, distanceSd_m: 0, delaySd_s: 0, offset_s: 0, offsetSd_s: 0 };
    expect(() => convertDelay({ ...base, delay_s: -1 })).toThrow(/delay/);
    expect(() => convertDelay({ ...base, offset_s: 3e-3 })).toThrow(/offset/);
    expect(() => convertDelay({ ...base, delay_s: 1e-9 })).toThrow(/speed/);
    expect(() => convertDelay({ ...base, distance_m: Number.NaN })).toThrow(NonFiniteInputError);
  });
});

describe('choosing among candidates', () => {
  const candidates = temperatureCandidates(secondSound(1.8), 1e-4);

  it('by an ITS-90 vapour-pressure reading (1638.2 Pa ↔ 1.800 K)', () => {
    const choice = chooseCandidate(candidates, { kind: 'pressure', pressure_Pa: vapourPressure(1.8).pressure_Pa });
    expect(candidates[choice.index as number]?.temperature_K).toBeCloseTo(1.8, 8);
    expect(choice.reason).toMatch(/ITS-90/);
  });

  it('by an expected temperature or a range; an ambiguous range decides nothing', () => {
    expect(candidates[chooseCandidate(candidates, { kind: 'near', temperature_K: 1.0 }).index as number]?.branch).toBe('low');
    expect(chooseCandidate(candidates, { kind: 'range', min_K: 1.7, max_K: 2.0 }).index).toBe(2);
    const none = chooseCandidate(candidates, { kind: 'range', min_K: 0.3, max_K: 2.1 });
    expect(none.index).toBeNull();
    expect(none.reason).toMatch(/3 lie/);
  });

  it('by continuity along a slow drift through the three-root region', () => {
    const temps = Array.from({ length: 40 }, (_, i) => 1.75 + i * 0.002);
    const series = temps.map((T) => temperatureCandidates(secondSound(T), 1e-4));
    const choices = chooseAlongSeries(series, { kind: 'near', temperature_K: 1.75 });
    choices.forEach((c, i) => {
      expect(series[i]?.[c.index as number]?.temperature_K).toBeCloseTo(temps[i] as number, 6);
    });
  });
});

describe('several distances: weighted straight-line fit (Bevington & Robinson ch. 6)', () => {
  it('recovers speed and offset from exact data', () => {
    const u = secondSound(1.9);
    const t0 = 40e-6;
    const points = [0.01, 0.02, 0.035, 0.05].map((d) => ({ distance_m: d, delay_s: t0 + d / u, delaySd_s: 1e-6 }));
    const fit = fitDistances(points);
    expect(fit.speed_m_s).toBeCloseTo(u, 9);
    expect(fit.offset_s).toBeCloseTo(t0, 12);
    expect(fit.residuals_s.every((r) => Math.abs(r) < 1e-12)).toBe(true);
    expect(fit.candidates.some((c) => Math.abs(c.temperature_K - 1.9) < 1e-6)).toBe(true);
  });

  it('the stated sd matches the scatter of repeated noisy fits (seeded Monte Carlo)', () => {
    const u = 19.0;
    const sd = 2e-6;
    const normal = gaussian(seededRandom(7));
    const distances = [0.01, 0.02, 0.03, 0.04, 0.05];
    const speeds: number[] = [];
    let stated = 0;
    for (let k = 0; k < 400; k++) {
      const fit = fitDistances(distances.map((d) => ({ distance_m: d, delay_s: 10e-6 + d / u + sd * normal(), delaySd_s: sd })));
      speeds.push(fit.speed_m_s);
      stated = fit.speedSd_m_s;
    }
    const mean = speeds.reduce((a, b) => a + b, 0) / speeds.length;
    const scatter = Math.sqrt(speeds.reduce((a, b) => a + (b - mean) ** 2, 0) / (speeds.length - 1));
    expect(Math.abs(scatter / stated - 1)).toBeLessThan(0.15);
    expect(Math.abs(mean - u)).toBeLessThan(3 * (stated / Math.sqrt(speeds.length)) + 1e-9);
  });

  it('refuses too few points, one distance, mixed sds, and a falling line', () => {
    expect(() => fitDistances([{ distance_m: 0.01, delay_s: 1e-3 }, { distance_m: 0.02, delay_s: 2e-3 }])).toThrow(/at least 3/);
    expect(() => fitDistances([0, 1, 2].map(() => ({ distance_m: 0.01, delay_s: 1e-3 })))).toThrow(/two different distances/);
    expect(() =>
      fitDistances([
        { distance_m: 0.01, delay_s: 1e-3, delaySd_s: 1e-6 },
        { distance_m: 0.02, delay_s: 2e-3 },
        { distance_m: 0.03, delay_s: 3e-3 },
      ]),
    ).toThrow(/every row or for none/);
    expect(() => fitDistances([0.01, 0.02, 0.03].map((d) => ({ distance_m: d, delay_s: 1 - d })))).toThrow(/does not grow/);
  });
});

describe('path calibration through the u2 maximum (Wang, Wagner & Donnelly 1987)', () => {
  it('a sweep through 1.65 K returns the path to within its stated sd', () => {
    const L = 0.04;
    const t0 = 20e-6;
    const normal = gaussian(seededRandom(11));
    const sweep = Array.from({ length: 41 }, (_, i) => {
      const T = 1.6 + i * 0.0025;
      return { x: i, delay_s: t0 + L / secondSound(T) + 0.2e-6 * normal() };
    });
    const cal = calibratePathFromSweep(sweep, t0, 0);
    expect(Math.abs(cal.pathLength_m - L)).toBeLessThan(3 * cal.pathLengthSd_m);
    expect(cal.pathLengthSd_m / L).toBeLessThan(0.002);
    expect(cal.maximumSpeed_m_s).toBeCloseTo(20.37, 2);
  });

  it('refuses a sweep that does not pass through the maximum', () => {
    const falling = Array.from({ length: 10 }, (_, i) => ({ x: i, delay_s: 0.04 / secondSound(1.7 + i * 0.01) }));
    expect(() => calibratePathFromSweep(falling)).toThrow(/end of the sweep/);
  });
});
