/**
 * Published facts and physical limits the kernel must honour. Each check names its source.
 */
import { describe, expect, it } from 'vitest';
import {
  density,
  FIRST_SOUND_T0_M_S,
  firstSound,
  ITS90_PRESSURE_RANGE_PA,
  landauSecondSound,
  nonlinearity,
  normalFraction,
  secondSound,
  secondSoundSlope,
  T_LAMBDA_K,
  temperatureFromVapourPressure,
  twoFluidSecondSound,
  vapourPressure,
} from '../../src/physics';

/** Extremum of f on [a, b] by golden-section search (test helper). */
function extremum(f: (x: number) => number, a: number, b: number, kind: 'min' | 'max'): { x: number; y: number } {
  const sign = kind === 'min' ? 1 : -1;
  const g = (Math.sqrt(5) - 1) / 2;
  let lo = a;
  let hi = b;
  for (let i = 0; i < 100; i++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    if (sign * f(x1) < sign * f(x2)) hi = x2;
    else lo = x1;
  }
  const x = (lo + hi) / 2;
  return { x, y: f(x) };
}

/** Root of f on [a, b] by bisection (test helper; f(a), f(b) of opposite sign). */
function root(f: (x: number) => number, a: number, b: number): number {
  let lo = a;
  let hi = b;
  const fLo = Math.sign(f(lo));
  for (let i = 0; i < 100; i++) {
    const m = (lo + hi) / 2;
    if (Math.sign(f(m)) === fLo) lo = m;
    else hi = m;
  }
  return (lo + hi) / 2;
}

describe('ITS-90 helium-4 vapour pressure (Preston-Thomas, Metrologia 27, 3 (1990))', () => {
  it('both ranges meet at Tλ = 2.1768 K near 5041.8 Pa (ITS-90 range boundary)', () => {
    const below = temperatureFromVapourPressure(5041.8 * (1 - 1e-9));
    const above = temperatureFromVapourPressure(5041.8);
    // The scale's coefficients are printed to six decimals: agreement to 0.1 mK is what they carry.
    expect(below.temperature_K).toBeCloseTo(2.1768, 4);
    expect(above.temperature_K).toBeCloseTo(2.1768, 4);
    expect(below.scale).toBe('ITS-90');
  });

  it('1 atm (101 325 Pa) is 4.2221 K, the normal boiling point of helium-4 (ITS-90; from memory)', () => {
    expect(temperatureFromVapourPressure(101325).temperature_K).toBeCloseTo(4.2221, 4);
  });

  it('p(Tλ) is 5041.8 Pa within 0.05 Pa (ITS-90 range boundary)', () => {
    expect(Math.abs(vapourPressure(T_LAMBDA_K).pressure_Pa - 5041.8)).toBeLessThan(0.05);
  });

  it('ITS-90 spans 1.25–5.0 K; below 1.25 K the reference spline is labelled not ITS-90', () => {
    expect(vapourPressure(1.25).scale).toBe('ITS-90');
    expect(vapourPressure(1.2499).scale).toBe('reference spline (not ITS-90)');
    expect(temperatureFromVapourPressure(ITS90_PRESSURE_RANGE_PA[0] * 0.99).scale).toBe('reference spline (not ITS-90)');
  });

  it('the reference spline agrees with ITS-90 to 0.1 % from 1.3 to 4.2 K, so the join at 1.25 K is small (D&B 1998)', () => {
    // Just below and at 1.25 K the two realisations differ by the spline's agreement with the scale.
    const spline = vapourPressure(1.25 - 1e-9).pressure_Pa;
    const its = vapourPressure(1.25).pressure_Pa;
    expect(Math.abs(spline / its - 1)).toBeLessThan(0.002);
  });
});

describe('second-sound extremes (D&B 1998 Table 4.1; Wang, Wagner & Donnelly, JLTP 68, 409 (1987))', () => {
  it('minimum of about 18.3 m/s near 1.12 K', () => {
    const { x, y } = extremum(secondSound, 1.0, 1.3, 'min');
    expect(Math.abs(x - 1.12)).toBeLessThan(0.01);
    // Peshkov's points here carry 0.75 %.
    expect(Math.abs(y / 18.3 - 1)).toBeLessThan(0.0075);
  });

  it('maximum of about 20.36 m/s near 1.65 K (Wang et al.: 20.3648 m/s at 1.653 K, ±0.07 %)', () => {
    const { x, y } = extremum(secondSound, 1.5, 1.8, 'max');
    expect(Math.abs(x - 1.653)).toBeLessThan(0.005);
    expect(Math.abs(y / 20.3648 - 1)).toBeLessThan(0.0007);
  });

  it('slope is zero at both extremes and changes sign across them', () => {
    expect(secondSoundSlope(1.05)).toBeLessThan(0);
    expect(secondSoundSlope(1.2)).toBeGreaterThan(0);
    expect(secondSoundSlope(1.6)).toBeGreaterThan(0);
    expect(secondSoundSlope(1.7)).toBeLessThan(0);
  });
});

describe('two-fluid consistency (Landau two-fluid relation; PHYSICS notes: about 1 % with these curves)', () => {
  // Measured u2 against (ρs/ρn)·T·s²/c_p from the kernel's own fractions, entropy and c_p.
  const TOL = 0.015;
  const temperatures = Array.from({ length: 65 }, (_, i) => 1.52 + i * 0.01); // 1.52 … 2.16 K

  it.each(temperatures.map((T) => [Number(T.toFixed(2))]))('within 1.5 %% at %f K', (T) => {
    expect(Math.abs(twoFluidSecondSound(T) / secondSound(T) - 1)).toBeLessThan(TOL);
  });

  it('at 1.50 K the curves give 1.65 %: recorded, not hidden (below 1.5 K ρ − ρs loses accuracy)', () => {
    const d = twoFluidSecondSound(1.5) / secondSound(1.5) - 1;
    expect(d).toBeGreaterThan(0.015);
    expect(d).toBeLessThan(0.02);
  });
});

describe('nonlinearity coefficient α2 (Khalatnikov; Kolmakov, Low Temp. Phys. 29, 495 (2003))', () => {
  it('changes sign between 1.85 and 1.95 K (published 1.88 K)', () => {
    expect(nonlinearity(1.85)).toBeGreaterThan(0);
    expect(nonlinearity(1.95)).toBeLessThan(0);
    const crossing = root(nonlinearity, 1.85, 1.95);
    expect(crossing).toBeGreaterThan(1.85);
    expect(crossing).toBeLessThan(1.95);
    // The reference splines put it near 1.90 K (PHYSICS notes).
    expect(Math.abs(crossing - 1.9)).toBeLessThan(0.01);
  });
});

describe('limits', () => {
  it('u2 → 0 at Tλ (critical scaling u2 ∝ t^(1/3); reference README)', () => {
    expect(secondSound(T_LAMBDA_K)).toBe(0);
    expect(secondSound(T_LAMBDA_K - 1e-9)).toBeLessThan(0.05);
    expect(secondSound(T_LAMBDA_K - 1e-6)).toBeLessThan(secondSound(T_LAMBDA_K - 1e-5));
  });

  it('ρn/ρ → 1 at Tλ (superfluid fraction vanishes; D&B 1998)', () => {
    expect(normalFraction(T_LAMBDA_K - 1e-7)).toBeGreaterThan(0.999);
    expect(normalFraction(T_LAMBDA_K)).toBe(1);
    expect(normalFraction(3)).toBe(1);
  });

  it('u2 → u1/√3 as T → 0 in the Landau model (phonon gas; Landau 1941)', () => {
    const limit = FIRST_SOUND_T0_M_S / Math.sqrt(3);
    expect(limit).toBeCloseTo(137.58, 2);
    for (const T of [0.02, 0.05, 0.1]) {
      expect(Math.abs(landauSecondSound(T, density(0.3)) / limit - 1)).toBeLessThan(1e-3);
    }
    // The kernel's lowest temperature is already within 1.5 % of the limit.
    expect(Math.abs(secondSound(0.3) / limit - 1)).toBeLessThan(0.015);
  });

  it('first sound: about 238 m/s as T → 0 and a cusp minimum of about 217 m/s at Tλ (reference README)', () => {
    expect(firstSound(0.3)).toBeCloseTo(238.2, 0);
    expect(Math.abs(firstSound(T_LAMBDA_K) - 217.5)).toBeLessThan(0.5);
    expect(firstSound(T_LAMBDA_K)).toBeLessThan(firstSound(T_LAMBDA_K - 0.01));
    expect(firstSound(T_LAMBDA_K)).toBeLessThan(firstSound(T_LAMBDA_K + 0.01));
  });
});
