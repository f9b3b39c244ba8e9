import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';
import { secondSoundSdUnchecked, secondSoundUnchecked } from './second-sound';

/*
 * How well a second-sound speed pins the temperature. With u = d/t and σ_u/u =
 * √((σ_d/d)² + (σ_t/t)²), the first-order answer is σ_T = σ_u/|u2′| (PHYSICS notes §6).
 * At the extremes of u2 (1.12 K, 1.65 K) u2′ → 0 and that diverges; there the second-order bound
 * σ_T ≈ √(2σ_u/|u2″|) holds instead. One smooth form has both limits:
 *   σ_T = σ_u / (u2′⁴ + (u2″σ_u/2)²)^(1/4),
 * equal to σ_u/|u2′| up to a relative (u2″σ_u)²/(16 u2′⁴) (below 1e-5 at 1.8 K for 0.04 %), and to
 * √(2σ_u/|u2″|) at an extremum. Where the curvature term is the larger (|u2″|σ_u/2 > u2′²) the spot
 * is "insensitive": a change of speed within the uncertainty moves the temperature a long way.
 * Above 2.17 K, where u2 plunges towards Tλ (|u2′| > 290 m/s/K), the curvature is left out.
 */

/** Step for the numerical second derivative of u2, K. */
const CURVATURE_STEP_K = 1e-4;

export interface TemperatureSpread {
  /** One-sigma temperature uncertainty, K. */
  sd_K: number;
  /** True where the curvature term governs: near an extremum of u2. */
  insensitive: boolean;
}

/**
 * u2″ (m/s/K²) by central difference of the slope, 0.3 K ≤ T < Tλ; the step shrinks near the
 * ends so both points stay inside the curve.
 */
export function secondSoundCurvature(T: number): number {
  const h = Math.min(CURVATURE_STEP_K, (T_LAMBDA_K - T) / 2, Math.max(T - MODEL_MIN_K, 1e-9));
  if (!(h > 0)) return 0;
  const lo = Math.max(MODEL_MIN_K, T - h);
  return (secondSoundUnchecked(T + h).slope - secondSoundUnchecked(lo).slope) / (T + h - lo);
}

/**
 * |u2″| tabulated every 1 mK from 0.3 to 2.17 K, so sweeps need no extra evaluations. Built on
 * first use (3 700 evaluations of u2): a program that never asks for a spread (the command line's
 * `props`) does not pay for it.
 */
const CURVATURE_TABLE_STEP_K = 1e-3;
const CURVATURE_TABLE_MAX_K = 2.17;
let curvatureTableBuilt: Float64Array | null = null;

function curvatureTable(): Float64Array {
  curvatureTableBuilt ??= Float64Array.from(
    { length: Math.round((CURVATURE_TABLE_MAX_K - MODEL_MIN_K) / CURVATURE_TABLE_STEP_K) + 1 },
    (_, i) => Math.abs(secondSoundCurvature(MODEL_MIN_K + i * CURVATURE_TABLE_STEP_K)),
  );
  return curvatureTableBuilt;
}

function absCurvature(T: number): number {
  if (T > CURVATURE_TABLE_MAX_K) return 0;
  const table = curvatureTable();
  const x = (T - MODEL_MIN_K) / CURVATURE_TABLE_STEP_K;
  const i = Math.min(table.length - 2, Math.max(0, Math.floor(x)));
  const f = x - i;
  return (1 - f) * (table[i] as number) + f * (table[i + 1] as number);
}

/**
 * Temperature spread that follows from a relative speed uncertainty at T (He II, 0.3 K – Tλ).
 * @param T temperature, K.  @param relSpeedSd σ_u/u, dimensionless (≥ 0).
 * @param at u2 and its slope at T when the caller has them (saves an evaluation).
 */
export function temperatureSpread(T: number, relSpeedSd: number, at?: { value: number; slope: number }): TemperatureSpread {
  requireInRange('temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K');
  requireInRange('relative speed uncertainty', relSpeedSd, 0, 1, '');
  return temperatureSpreadUnchecked(T, relSpeedSd, at ?? secondSoundUnchecked(T));
}

/** {@link temperatureSpread} without range checks (kernel-internal). */
export function temperatureSpreadUnchecked(T: number, relSpeedSd: number, at: { value: number; slope: number }): TemperatureSpread {
  const sigmaU = relSpeedSd * at.value;
  const s = Math.abs(at.slope);
  if (!Number.isFinite(s)) return { sd_K: 0, insensitive: false };
  const s2 = s * s;
  const curved = (absCurvature(T) * sigmaU) / 2;
  const denominator = Math.sqrt(Math.sqrt(s2 * s2 + curved * curved));
  return { sd_K: denominator > 0 ? sigmaU / denominator : 0, insensitive: curved > s2 };
}

/**
 * Relative uncertainty of the tabulated u2 at T (the model's own share of a temperature sd).
 * @param T temperature, K, 0.3 K – Tλ. Throws on bad input.
 */
export function secondSoundRelativeSd(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K');
  return secondSoundRelativeSdUnchecked(T, secondSoundUnchecked(T));
}

/** {@link secondSoundRelativeSd} without the range check, given u2 and its slope at T. */
export function secondSoundRelativeSdUnchecked(T: number, at: { value: number; slope: number }): number {
  return at.value > 0 ? secondSoundSdUnchecked(T, at.value, at.slope) / at.value : 0;
}

/**
 * Shortest heater–sensor distance (m) that reaches a target temperature sd with the given timing
 * and distance uncertainties, at T: σ_T = k/d · √(σ_d² + (σ_t u2)²), k = u2/|du2/dT|, so
 * d = k √(σ_d² + (σ_t u2)²)/σ_target. Infinity where du2/dT = 0.
 */
export function shortestDistanceForResolution(T: number, targetSd_K: number, timingSd_s: number, distanceSd_m: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K');
  requireInRange('target temperature sd', targetSd_K, 1e-12, 10, 'K');
  requireInRange('timing sd', timingSd_s, 0, 1e3, 's');
  requireInRange('distance sd', distanceSd_m, 0, 100, 'm');
  const { value: u, slope } = secondSoundUnchecked(T);
  if (slope === 0) return Number.POSITIVE_INFINITY;
  const k = u / Math.abs(slope);
  return (k * Math.hypot(distanceSd_m, timingSd_s * u)) / targetSd_K;
}

/** Shortest distance for a target, or why there is none. */
export type ShortestDistance =
  | { ok: true; distance_m: number }
  | { ok: false; reason: 'model-sd' | 'insensitive' | 'beyond-range'; figure: number };

/**
 * Shortest heater–sensor distance (m) at which one reading meets a temperature target at T.
 * absolute: σ_T² = (k/d)²(σ_d² + (σ_t u2)²) + σ_model², k = u2/|du2/dT|, σ_model the u2 curve's own
 * share, which no distance removes — not reachable when it is at or above the target. change:
 * σ_T = k σ_t u2/d (the distance error is common to every reading). Not reachable at an extremum
 * of u2 (du2/dT = 0), or beyond `maxDistance_m`. Inputs SI; throws on bad input.
 */
export function shortestDistanceForTarget(
  T: number,
  target: { sd_K: number; kind: 'absolute' | 'change' },
  timingSd_s: number,
  distanceSd_m: number,
  maxDistance_m: number,
): ShortestDistance {
  requireInRange('temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K');
  requireInRange('target temperature sd', target.sd_K, 1e-12, 10, 'K');
  requireInRange('timing sd', timingSd_s, 0, 1e3, 's');
  requireInRange('distance sd', distanceSd_m, 0, 100, 'm');
  const at = secondSoundUnchecked(T);
  if (at.slope === 0) return { ok: false, reason: 'insensitive', figure: 0 };
  const k = at.value / Math.abs(at.slope);
  let d: number;
  if (target.kind === 'change') d = (k * timingSd_s * at.value) / target.sd_K;
  else {
    const model = k * secondSoundRelativeSdUnchecked(T, at);
    if (model >= target.sd_K) return { ok: false, reason: 'model-sd', figure: model };
    d = (k * Math.hypot(distanceSd_m, timingSd_s * at.value)) / Math.sqrt(target.sd_K ** 2 - model ** 2);
  }
  if (!(d <= maxDistance_m)) return { ok: false, reason: 'beyond-range', figure: d };
  return { ok: true, distance_m: d };
}
