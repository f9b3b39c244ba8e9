import { secondSoundSdUnchecked, secondSoundUnchecked } from './second-sound';

/*
 * How well a second-sound speed pins the temperature. With u = d/t,
 *   σ_T = (u2/|du2/dT|) · √((σ_d/d)² + (σ_t/t)²)                 (first order; PHYSICS notes §6)
 * At the extremes of u2 (1.12 K, 1.65 K) du2/dT → 0 and the first-order form diverges; there the
 * second-order bound σ_T ≈ √(2 σ_u/|u2″|) holds instead. The smaller of the two is the honest
 * answer, and when the second-order one is smaller the spot is "insensitive": a change of speed
 * far below the uncertainty moves the temperature by a lot.
 */

/** Step for the numerical second derivative of u2, K. */
const CURVATURE_STEP_K = 1e-4;

export interface TemperatureSpread {
  /** One-sigma temperature uncertainty, K. */
  sd_K: number;
  /** True where the second-order bound governs: near an extremum of u2. */
  insensitive: boolean;
}

/** u2″ (m/s/K²) by central difference of the slope; kernel-internal, 0.3 K + step ≤ T ≤ Tλ − step. */
export function secondSoundCurvature(T: number): number {
  const h = CURVATURE_STEP_K;
  return (secondSoundUnchecked(T + h).slope - secondSoundUnchecked(T - h).slope) / (2 * h);
}

/**
 * Temperature spread that follows from a relative speed uncertainty at T (He II, 0.3 K – Tλ).
 * @param T temperature, K.  @param relSpeedSd σ_u/u, dimensionless (≥ 0).
 */
export function temperatureSpread(T: number, relSpeedSd: number): TemperatureSpread {
  const { value: u, slope } = secondSoundUnchecked(T);
  const sigmaU = relSpeedSd * u;
  const firstOrder = Math.abs(slope) > 0 ? sigmaU / Math.abs(slope) : Number.POSITIVE_INFINITY;
  const curvature = Math.abs(secondSoundCurvature(T));
  const secondOrder = curvature > 0 ? Math.sqrt((2 * sigmaU) / curvature) : Number.POSITIVE_INFINITY;
  if (secondOrder < firstOrder) return { sd_K: secondOrder, insensitive: true };
  return { sd_K: firstOrder, insensitive: false };
}

/** Relative uncertainty of the tabulated u2 at T (the model's own share of a temperature sd). */
export function secondSoundRelativeSd(T: number): number {
  const { value, slope } = secondSoundUnchecked(T);
  return secondSoundSdUnchecked(T, value, slope) / value;
}

/**
 * Shortest heater–sensor distance (m) that reaches a target temperature sd with the given timing
 * and distance uncertainties, at T: σ_T = k/d · √(σ_d² + (σ_t u2)²), k = u2/|du2/dT|, so
 * d = k √(σ_d² + (σ_t u2)²)/σ_target. Infinity where du2/dT = 0.
 */
export function shortestDistanceForResolution(T: number, targetSd_K: number, timingSd_s: number, distanceSd_m: number): number {
  const { value: u, slope } = secondSoundUnchecked(T);
  if (slope === 0) return Number.POSITIVE_INFINITY;
  const k = u / Math.abs(slope);
  return (k * Math.hypot(distanceSd_m, timingSd_s * u)) / targetSd_K;
}
