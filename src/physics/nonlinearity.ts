import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';
import { heatCapacityUnchecked } from './heat-capacity';
import { secondSoundUnchecked } from './second-sound';

/*
 * Second-sound nonlinearity coefficient (I. M. Khalatnikov, "An Introduction to the Theory of
 * Superfluidity", 1965): α2 = ∂/∂T ln(u2³ c_p / T) = 3 u2′/u2 + c_p′/c_p − 1/T, in 1/K.
 * A wave element of temperature amplitude δT travels at u2 (1 + α2 δT): for α2 > 0 the leading
 * edge of a heat pulse steepens into a shock, for α2 < 0 (above about 1.88–1.90 K) the trailing
 * edge does. Published sign change: 1.88 K (Kolmakov 2003); these splines put it near 1.90 K.
 */

/** α2 in 1/K with no range check (kernel-internal; He II only). */
export function nonlinearityUnchecked(T: number): number {
  const u = secondSoundUnchecked(T);
  const c = heatCapacityUnchecked(T);
  return (3 * u.slope) / u.value + c.slope / c.value - 1 / T;
}

/**
 * Nonlinearity coefficient α2 of second sound, 1/K.
 * @param T temperature T90, K, 0.3 K to just below Tλ (it diverges at Tλ).
 * Throws OutOfRangeError / NonFiniteInputError.
 */
export function nonlinearity(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, T_LAMBDA_K * (1 - 1e-9), 'K');
  return nonlinearityUnchecked(T);
}
