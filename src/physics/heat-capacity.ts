import { CubicBSpline } from './bspline';
import { MODEL_MIN_K, MOLAR_MASS_KG_MOL, PROPERTIES_MAX_K, T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';
import { HEAT_CAPACITY_HE1_SPLINE, HEAT_CAPACITY_HE2_SPLINE } from './reference-splines';

/*
 * Heat capacity along SVP from the published splines of log10 C (J/(mol·K)) below and above Tλ
 * (Donnelly & Barenghi 1998). Along SVP the saturated heat capacity and c_p differ by far less
 * than the data's uncertainty below 2.5 K, so the curve is used as c_p (Donnelly & Barenghi 1998).
 * C diverges logarithmically at Tλ; the two splines stop 0.04 µK below and 0.13 µK above it, and
 * between those ends the nearer end's value is used.
 */

const he2 = new CubicBSpline(HEAT_CAPACITY_HE2_SPLINE);
const he1 = new CubicBSpline(HEAT_CAPACITY_HE1_SPLINE);
const LN10 = Math.LN10;

/** Lowest temperature of the published heat-capacity curve, K. */
export const HEAT_CAPACITY_MIN_K = HEAT_CAPACITY_HE2_SPLINE.range[0];

/** c_p in J/(kg·K) and its temperature slope in J/(kg·K²); no range check (kernel-internal). */
export function heatCapacityUnchecked(T: number): { value: number; slope: number } {
  const spline = T < T_LAMBDA_K ? he2 : he1;
  const x = Math.min(Math.max(T, spline.min), spline.max);
  const { value: logC, slope: dLogC } = spline.valueAndSlope(x);
  const c = 10 ** logC / MOLAR_MASS_KG_MOL;
  return { value: c, slope: c * LN10 * dLogC };
}

/**
 * Specific heat capacity c_p of liquid helium-4 at SVP, J/(kg·K).
 * @param T temperature T90, K, 0.3–4.24. Source: Donnelly & Barenghi (1998) heat-capacity splines.
 * Throws OutOfRangeError / NonFiniteInputError.
 */
export function specificHeat(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, PROPERTIES_MAX_K, 'K');
  return heatCapacityUnchecked(T).value;
}
