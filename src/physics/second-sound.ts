import { CubicBSpline } from './bspline';
import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { densityUnchecked_g_cm3, DENSITY_G_CM3_TO_KG_M3 } from './density';
import { requireInRange } from './errors';
import { landauSecondSoundUnchecked } from './landau';
import { SECOND_SOUND_SPLINE } from './reference-splines';

/*
 * Second-sound speed u2(T) along SVP, in three pieces:
 *  - 0.5517 K to 2.176795 K: the published B-spline of Donnelly & Barenghi (1998), fitted to the
 *    adopted measurements (Peshkov below 1.13 K; several sets above, Wang, Wagner & Donnelly 1987
 *    at the maximum).
 *  - 2.176795 K to Tλ (the last 5 µK): the spline's end coefficient leaves u2 at 0.106 m/s at Tλ,
 *    where the superfluid fraction vanishes; there the critical scaling u2 = A t^(1/3) (1 + B t),
 *    t = 1 − T/Tλ, takes over, so u2 → 0 at Tλ. A and B are fixed so that value and slope meet the
 *    spline at the join: the plain power law would meet it in value only, its slope 10 % off
 *    (−21 600 against −24 100 m/s/K). B t is the first analytic correction to the leading power
 *    (common practice for critical fits); here B t ≤ 0.04, so the correction stays small.
 *  - 0.3 K to 0.5517 K (model region): Landau's phonon–roton two-fluid u2, scaled by a smooth factor
 *    g(T) = 1 + a x⁴ + b x⁵ (x = T/0.5517 K) fixed so that value and slope meet the measured curve;
 *    g → 1 as T → 0, so u2 → u1(0)/√3. Below about 0.5 K second sound stops being a hydrodynamic
 *    wave (phonon mean free paths grow), so this region is an extrapolation.
 */

const spline = new CubicBSpline(SECOND_SOUND_SPLINE);

/** Lowest temperature of the measured curve, K (first knot of the published spline). */
export const SECOND_SOUND_MEASURED_MIN_K = SECOND_SOUND_SPLINE.range[0];
/** Where the critical power law takes over from the spline, K. */
export const SECOND_SOUND_CRITICAL_JOIN_K = 2.176795;
const CRITICAL_EXPONENT = 1 / 3;

/** Which representation supplies u2 at a temperature. */
export type SecondSoundRegion = 'Landau model' | 'measured' | 'critical scaling';

/*
 * u = A t^p (1 + B t) gives du/dt = u (p/t + B/(1 + B t)). With the spline's value u_j and slope
 * du/dT at the join (du/dt = −Tλ du/dT): r = (du/dt)/u_j − p/t_j = B/(1 + B t_j), so
 * B = r/(1 − r t_j) and A = u_j/(t_j^p (1 + B t_j)).
 */
const tJoin = 1 - SECOND_SOUND_CRITICAL_JOIN_K / T_LAMBDA_K;
const criticalJoin = (() => {
  const at = spline.valueAndSlope(SECOND_SOUND_CRITICAL_JOIN_K);
  const r = (-T_LAMBDA_K * at.slope) / at.value - CRITICAL_EXPONENT / tJoin;
  const B = r / (1 - r * tJoin);
  return { A: at.value / (tJoin ** CRITICAL_EXPONENT * (1 + B * tJoin)), B };
})();

function landauU2(T: number): number {
  return landauSecondSoundUnchecked(T, densityUnchecked_g_cm3(T) * DENSITY_G_CM3_TO_KG_M3);
}

const MODEL_STEP_K = 1e-6;
const modelJoin = (() => {
  const Tj = SECOND_SOUND_MEASURED_MIN_K;
  const measured = spline.valueAndSlope(Tj);
  const uL = landauU2(Tj);
  const duL = (landauU2(Tj + MODEL_STEP_K) - landauU2(Tj - MODEL_STEP_K)) / (2 * MODEL_STEP_K);
  const ratio = measured.value / uL;
  const gSlope = (measured.slope - duL * ratio) / uL;
  const R = ratio - 1;
  const G = Tj * gSlope;
  const b = G - 4 * R;
  const a = R - b;
  return { Tj, a, b, ratio };
})();

function modelFactor(T: number): { g: number; dg: number } {
  const x = T / modelJoin.Tj;
  const x4 = x * x * x * x;
  return {
    g: 1 + modelJoin.a * x4 + modelJoin.b * x4 * x,
    dg: (4 * modelJoin.a * x * x * x + 5 * modelJoin.b * x4) / modelJoin.Tj,
  };
}

/** Region that supplies u2 at T (no range check). */
export function secondSoundRegion(T: number): SecondSoundRegion {
  if (T < SECOND_SOUND_MEASURED_MIN_K) return 'Landau model';
  if (T > SECOND_SOUND_CRITICAL_JOIN_K) return 'critical scaling';
  return 'measured';
}

/** u2 (m/s) and du2/dT (m/s/K) with no range check (kernel-internal; 0.3 K ≤ T ≤ Tλ). */
export function secondSoundUnchecked(T: number): { value: number; slope: number } {
  if (T < SECOND_SOUND_MEASURED_MIN_K) {
    const u = landauU2(T);
    const du = (landauU2(T + MODEL_STEP_K) - landauU2(T - MODEL_STEP_K)) / (2 * MODEL_STEP_K);
    const { g, dg } = modelFactor(T);
    return { value: u * g, slope: du * g + u * dg };
  }
  if (T > SECOND_SOUND_CRITICAL_JOIN_K) {
    const t = 1 - T / T_LAMBDA_K;
    if (t <= 0) return { value: 0, slope: Number.NEGATIVE_INFINITY };
    const { A, B } = criticalJoin;
    const value = A * t ** CRITICAL_EXPONENT * (1 + B * t);
    return { value, slope: -(value * (CRITICAL_EXPONENT / t + B / (1 + B * t))) / T_LAMBDA_K };
  }
  return spline.valueAndSlope(T);
}

/** Fast u2 alone (m/s), no range check: the hot path of sweeps and inversions. */
export function secondSoundValueUnchecked(T: number): number {
  if (T >= SECOND_SOUND_MEASURED_MIN_K && T <= SECOND_SOUND_CRITICAL_JOIN_K) return spline.value(T);
  return secondSoundUnchecked(T).value;
}

const ABOVE_LAMBDA = 'above Tλ = 2.1768 K helium is He I, a normal fluid without a superfluid component, so there is no second sound';

function checkT(T: number): void {
  requireInRange('temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K', T > T_LAMBDA_K ? ABOVE_LAMBDA : undefined);
}

/**
 * Second-sound speed u2 in He II at SVP, m/s.
 * @param T temperature T90, K, 0.3 K – Tλ (0.3–0.5517 K is the Landau model region). u2(Tλ) = 0.
 * Source: Donnelly & Barenghi (1998) spline; Landau model below 0.5517 K. Throws OutOfRangeError
 * (naming He I above Tλ) or NonFiniteInputError.
 */
export function secondSound(T: number): number {
  checkT(T);
  return secondSoundValueUnchecked(T);
}

/** du2/dT, m/s per K; same range, source and errors as {@link secondSound}. −∞ at Tλ itself. */
export function secondSoundSlope(T: number): number {
  checkT(T);
  return secondSoundUnchecked(T).slope;
}

/*
 * Uncertainty of u2, one standard deviation, from the stated uncertainties of the data behind
 * each part of the curve (Donnelly & Barenghi 1998, Table 4.1):
 *  - below 1.13 K: Peshkov's measurements, stated 0.75 %;
 *  - 1.60–1.70 K: Wang, Wagner & Donnelly (1987), stated 0.07 %; the spline sits 0.025 % above
 *    their points, so 0.075 % in all;
 *  - elsewhere up to Tλ: 0.25 %, the scatter of the published representation about its data;
 *  - near Tλ, add |du2/dT| × 0.2 mK × w: the end of the curve is uncertain by about 0.2 mK
 *    (the reference's own caution), and u2 changes fastest there. w = 1 within 1 mK of Tλ and
 *    falls about as (1 mK/(Tλ − T))² beyond, to 0 at 30 mK, so the sd is continuous (no step
 *    where the term starts: it used to switch on at Tλ − 1 mK, a 33-fold step) and the term fades
 *    where the curve is pinned by data at absolute temperatures (common practice, no source for
 *    the shape of the fade; at 2.17 K it adds under 1 % to the sd). The term is not
 *    capped: within 67 µK of Tλ it exceeds u2 itself, and a temperature read there is uncertain
 *    by the full 0.2 mK, never less;
 *  - model region (below 0.5517 K): 3 % — the Landau sums differ from the measured curve by 2.1 %
 *    at 0.5517 K (common practice, no source: a margin over that mismatch).
 */
const REL_SD_PESHKOV = 0.0075;
const PESHKOV_MAX_K = 1.13;
const REL_SD_WANG = 0.00075;
const WANG_RANGE_K = [1.6, 1.7] as const;
const REL_SD_REPRESENTATION = 0.0025;
const REL_SD_MODEL = 0.03;
const NEAR_LAMBDA_K = 1e-3;
const LAMBDA_END_SD_K = 2e-4;

/** Temperatures where the relative sd of u2 changes from one data set to the next, K. */
export const SECOND_SOUND_SD_EDGES_K: readonly number[] = [SECOND_SOUND_MEASURED_MIN_K, PESHKOV_MAX_K, WANG_RANGE_K[0], WANG_RANGE_K[1]];

/** Beyond this distance below Tλ the end term is zero (its weight falls to 0 there, continuously), K. */
export const LAMBDA_END_REACH_K = 30 * NEAR_LAMBDA_K;

/** The relative sd of u2 from the data behind the curve at T (without the end term near Tλ). */
export function secondSoundBaseRelativeSd(T: number): number {
  if (T < SECOND_SOUND_MEASURED_MIN_K) return REL_SD_MODEL;
  if (T < PESHKOV_MAX_K) return REL_SD_PESHKOV;
  if (T >= WANG_RANGE_K[0] && T <= WANG_RANGE_K[1]) return REL_SD_WANG;
  return REL_SD_REPRESENTATION;
}

/**
 * Weight of the end term at x = (Tλ − T)/1 mK: 1 up to x = 1, then (1/x² − 1/X²)/(1 − 1/X²) down
 * to 0 at X = 30 (continuous at both ends; 1/x² is how |du2/dT| × 0.2 mK would be diluted by a
 * curve pinned at absolute temperatures further out).
 */
function endWeight(x: number): number {
  const X = LAMBDA_END_REACH_K / NEAR_LAMBDA_K;
  if (x <= 1) return 1;
  if (x >= X) return 0;
  return (1 / (x * x) - 1 / (X * X)) / (1 - 1 / (X * X));
}

/** One-sigma uncertainty of u2 at T (m/s), no range check. */
export function secondSoundSdUnchecked(T: number, u2: number, slope: number): number {
  const base = secondSoundBaseRelativeSd(T) * u2;
  const weight = endWeight((T_LAMBDA_K - T) / NEAR_LAMBDA_K);
  if (weight === 0) return base;
  const end = Number.isFinite(slope) ? Math.abs(slope) * LAMBDA_END_SD_K * weight : u2;
  return Math.hypot(base, end);
}

/**
 * One-sigma uncertainty of the tabulated u2, m/s; same range and errors as {@link secondSound}.
 * See the comment above for the basis of each region.
 */
export function secondSoundSd(T: number): number {
  checkT(T);
  const { value, slope } = secondSoundUnchecked(T);
  return secondSoundSdUnchecked(T, value, slope);
}
