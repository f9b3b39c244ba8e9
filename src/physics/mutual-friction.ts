import { CubicBSpline } from './bspline';
import { T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';
import { MUTUAL_FRICTION_B_PRIME_SPLINE, MUTUAL_FRICTION_B_SPLINE } from './reference-splines';

/*
 * The Hall–Vinen mutual friction coefficients B and B′ along SVP, as Donnelly & Barenghi (1998)
 * represent them (their source: Barenghi, Donnelly & Vinen, J. Low Temp. Phys. 52, 189 (1983)):
 * cubic B-splines in x = log10(t), t = 1 − T/Tλ, of log10(B) and log10(B′ + 15), and near Tλ the
 * power laws they state, B = 0.47 t^−0.33 above 2.167 K and B′ = 1.01 − 0.34 t^−0.33 above
 * 2.134 K. The splines end at t = 1e-5 (20 µK below Tλ) and at t = 0.41 (1.2858 K for B, 1.278 K
 * for B′): below 1.2858 K the representation gives no B, and nothing here extrapolates it.
 * At the joins the spline and the power law differ by 0.8 % (B, 2.167 K) and 0.3 % (B′, 2.134 K);
 * tests/unit/mutual-friction.test.ts checks the spline's Tλ end against the power laws.
 */

const bSpline = new CubicBSpline(MUTUAL_FRICTION_B_SPLINE);
const bPrimeSpline = new CubicBSpline(MUTUAL_FRICTION_B_PRIME_SPLINE);

/** Above this temperature B follows the power law 0.47 t^−0.33, K (Donnelly & Barenghi 1998). */
export const MUTUAL_FRICTION_B_POWER_LAW_FROM_K = 2.167;
/** Above this temperature B′ follows 1.01 − 0.34 t^−0.33, K (Donnelly & Barenghi 1998). */
export const MUTUAL_FRICTION_B_PRIME_POWER_LAW_FROM_K = 2.134;
/** Prefactor and exponent of B near Tλ: B = 0.47 t^−0.33 (Donnelly & Barenghi 1998). */
export const MUTUAL_FRICTION_B_POWER_LAW = { prefactor: 0.47, exponent: -0.33 } as const;
/** B′ near Tλ: B′ = 1.01 − 0.34 t^−0.33 (Donnelly & Barenghi 1998). */
export const MUTUAL_FRICTION_B_PRIME_POWER_LAW = { offset: 1.01, prefactor: -0.34, exponent: -0.33 } as const;
/** Offset of the B′ spline's variable: the spline gives log10(B′ + 15). */
const B_PRIME_OFFSET = 15;

/**
 * Temperatures where B and B′ are given, K: from the splines' cold end (t = 10^−0.388) to their
 * warm end (t = 1e-5, 22 µK below Tλ).
 */
export const MUTUAL_FRICTION_RANGE_K = [
  T_LAMBDA_K * (1 - 10 ** MUTUAL_FRICTION_B_SPLINE.range[1]),
  T_LAMBDA_K * (1 - 10 ** MUTUAL_FRICTION_B_SPLINE.range[0]),
] as const;

function reducedLog(T: number): number {
  return Math.log10(1 - T / T_LAMBDA_K);
}

/** B at T without the range check (kernel-internal), T in {@link MUTUAL_FRICTION_RANGE_K}. */
export function mutualFrictionBUnchecked(T: number): number {
  const t = 1 - T / T_LAMBDA_K;
  if (T > MUTUAL_FRICTION_B_POWER_LAW_FROM_K) return MUTUAL_FRICTION_B_POWER_LAW.prefactor * t ** MUTUAL_FRICTION_B_POWER_LAW.exponent;
  return 10 ** bSpline.value(reducedLog(T));
}

/** B′ at T without the range check (kernel-internal). */
export function mutualFrictionBPrimeUnchecked(T: number): number {
  const t = 1 - T / T_LAMBDA_K;
  const law = MUTUAL_FRICTION_B_PRIME_POWER_LAW;
  if (T > MUTUAL_FRICTION_B_PRIME_POWER_LAW_FROM_K) return law.offset + law.prefactor * t ** law.exponent;
  return 10 ** bPrimeSpline.value(reducedLog(T)) - B_PRIME_OFFSET;
}

/** The published spline alone (no power law), for the tests that check its Tλ end. */
export function mutualFrictionBSplineOnly(T: number): number {
  return 10 ** bSpline.value(reducedLog(T));
}

/**
 * Hall–Vinen mutual friction coefficient B (dimensionless) at T along SVP.
 * @param T temperature, K, 1.2858 K – 2.17678 K ({@link MUTUAL_FRICTION_RANGE_K}).
 * Source: Donnelly & Barenghi, J. Phys. Chem. Ref. Data 27, 1217 (1998) (spline and power law);
 * data: Barenghi, Donnelly & Vinen, JLTP 52, 189 (1983). About 1.02 at 1.8 K, minimum 0.98 near 1.9 K.
 * Throws OutOfRangeError / NonFiniteInputError naming the range.
 */
export function mutualFrictionB(T: number): number {
  requireInRange('temperature for mutual friction B', T, MUTUAL_FRICTION_RANGE_K[0], MUTUAL_FRICTION_RANGE_K[1], 'K', 'the published B representation');
  return mutualFrictionBUnchecked(T);
}

/**
 * Hall–Vinen coefficient B′ (dimensionless) at T along SVP; same range and source as
 * {@link mutualFrictionB}. Small (about 0.05 at 1.8 K), negative above about 2.07 K.
 */
export function mutualFrictionBPrime(T: number): number {
  requireInRange('temperature for mutual friction B′', T, MUTUAL_FRICTION_RANGE_K[0], MUTUAL_FRICTION_RANGE_K[1], 'K', 'the published B′ representation');
  return mutualFrictionBPrimeUnchecked(T);
}
