import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { secondSoundSdUnchecked, secondSoundUnchecked } from './second-sound';
import { BRANCHES, type BranchTable, branchEnd, solveOnBranch } from './second-sound-branches';
import { SECOND_SOUND_EXTREMA } from './second-sound-extrema';

/*
 * Temperature intervals from a measured speed (PHYSICS notes §6): the set of T on the curve with
 * |u2(T) − u| ≤ k·σ_u(T), σ_u(T) = √(σ_meas² + σ_curve(T)²) — the measurement's sd (distance,
 * timing, offset) and the u2 curve's own sd at T, kept apart until here. Near the extrema of u2
 * the map from speed to temperature is a square root, so a first-order sd misleads there; this
 * set is exact whatever the curve's shape: the true temperature lies in it exactly when the
 * speed's error is within k·σ_u, so its coverage is that of the normal distribution.
 * On each monotonic branch the set is one stretch, bounded where u2 = u ± k·σ_u; stretches of two
 * branches that both reach their common extremum join into one (the interval then spans both
 * branches, and says it reaches that extremum). σ_curve depends on T (it grows steeply near Tλ and
 * steps at the region boundaries of the curve's data), so each bound is found as the crossing of
 * |u2(T) − u| − k·σ_u(T) walking out from the root, not from σ at the root alone.
 */

/** Normal quantiles of the two reported levels: 68.27 % (k = 1) and 95.00 % (k = 1.95996). */
export const INTERVAL_K = { p68: 1, p95: 1.959963984540054 } as const;

/** What an interval runs into: an extremum of u2 (joining two branches), Tλ, or the model's lower limit (0.3 K). */
export type IntervalReach = 'minimum' | 'maximum' | 'Tλ' | 'model limit';

export interface TemperatureInterval {
  low_K: number;
  high_K: number;
  /** Ends and turns of the curve inside the interval, coldest first. */
  reaches: IntervalReach[];
  /** True when no temperature has a speed within k·σ_u (a speed beyond an extremum by more than that). */
  empty: boolean;
}

interface Stretch {
  low_K: number;
  high_K: number;
  /** The stretch runs to the branch's cold / warm end. */
  atCold: boolean;
  atWarm: boolean;
}

/** Bounds are found to 1 nK, far below any sd this kernel states. */
const BOUND_TOLERANCE_K = 1e-9;
const BOUND_MAX_ITERATIONS = 80;

/** |u2(T) − u| − k·σ_u(T): ≤ 0 inside the band. */
function excess(T: number, u: number, k: number, sdMeasurement: number): number {
  const at = secondSoundUnchecked(T);
  return Math.abs(at.value - u) - k * Math.hypot(sdMeasurement, secondSoundSdUnchecked(T, at.value, at.slope));
}

/**
 * Walking from `inside` (in the band) towards `end` along one branch: the first temperature where
 * the band ends, or `end` when it never does. Bracketed regula falsi (Illinois variant); on a
 * branch |u2 − u| grows away from the root, so the crossing is the bound.
 */
function boundTowards(inside: number, end: number, u: number, k: number, sdMeasurement: number): number {
  let fb = excess(end, u, k, sdMeasurement);
  if (fb <= 0) return end;
  let a = inside;
  let b = end;
  let fa = Math.min(excess(a, u, k, sdMeasurement), 0);
  let side = 0;
  for (let i = 0; i < BOUND_MAX_ITERATIONS && Math.abs(b - a) > BOUND_TOLERANCE_K; i++) {
    let c = fb !== fa ? b - (fb * (b - a)) / (fb - fa) : (a + b) / 2;
    // Keep the step inside the bracket and away from its ends, so a step in σ cannot stall it.
    const lo = Math.min(a, b);
    const hi = Math.max(a, b);
    if (!(c > lo && c < hi)) c = (a + b) / 2;
    const fc = excess(c, u, k, sdMeasurement);
    if (fc <= 0) {
      a = c;
      fa = fc;
      if (side === -1) fb /= 2;
      side = -1;
    } else {
      b = c;
      fb = fc;
      if (side === 1) fa /= 2;
      side = 1;
    }
  }
  // The outer end of the last bracket: the bound errs on the wide side, by under 1 nK.
  return b;
}

function stretchOn(b: BranchTable, u: number, k: number, sdMeasurement: number): Stretch | null {
  let seed: number;
  if (u >= b.slowest && u <= b.fastest) seed = solveOnBranch(b, u).T;
  else {
    seed = branchEnd(b, u < b.slowest ? 'slowest' : 'fastest');
    if (excess(seed, u, k, sdMeasurement) > 0) return null;
  }
  const low_K = boundTowards(seed, b.lo, u, k, sdMeasurement);
  const high_K = boundTowards(seed, b.hi, u, k, sdMeasurement);
  return { low_K, high_K, atCold: low_K <= b.lo, atWarm: high_K >= b.hi };
}

/**
 * Every stretch of temperature (K) whose u2 lies within k·σ_u of the speed u, coldest first, with
 * stretches joined across an extremum both sides reach. No range checks (kernel-internal).
 * @param u measured speed, m/s.  @param sdMeasurement measurement part of σ_u, m/s (≥ 0).
 * @param k half-width of the band in sd (INTERVAL_K).
 */
export function speedBandTemperatures(u: number, sdMeasurement: number, k: number): TemperatureInterval[] {
  const stretches = BRANCHES.map((b) => stretchOn(b, u, k, sdMeasurement));
  const turns: IntervalReach[] = ['minimum', 'maximum'];
  const out: TemperatureInterval[] = [];
  let open: TemperatureInterval | null = null;
  stretches.forEach((s, i) => {
    if (!s) {
      if (open) out.push(open);
      open = null;
      return;
    }
    const joins = open !== null && (stretches[i - 1] as Stretch | null)?.atWarm === true && s.atCold;
    if (open && joins) {
      open.high_K = s.high_K;
      open.reaches.push(turns[i - 1] as IntervalReach);
    } else {
      if (open) out.push(open);
      open = { low_K: s.low_K, high_K: s.high_K, reaches: [], empty: false };
      // A stretch that runs into an extremum from one side only still touches it.
      if (i > 0 && s.atCold) open.reaches.push(turns[i - 1] as IntervalReach);
    }
    if (i === 0 && s.atCold && s.low_K <= MODEL_MIN_K) open.reaches.unshift('model limit');
    const next = stretches[i + 1];
    if (i < 2 && s.atWarm && !(next?.atCold === true)) open.reaches.push(turns[i] as IntervalReach);
    if (i === 2 && s.atWarm && s.high_K >= T_LAMBDA_K) open.reaches.push('Tλ');
  });
  if (open) out.push(open);
  return out;
}

/** The stretch of `band` holding T (K), or an empty interval at T when none does. */
export function intervalHolding(band: readonly TemperatureInterval[], T: number): TemperatureInterval {
  const tolerance = 1e-9;
  const found = band.find((s) => s.low_K - tolerance <= T && T <= s.high_K + tolerance);
  return found ? { ...found, reaches: [...found.reaches] } : { low_K: T, high_K: T, reaches: [], empty: true };
}

/** Temperatures of the two extrema, for callers naming what an interval reaches. */
export const EXTREMUM_TEMPERATURES_K = {
  minimum: SECOND_SOUND_EXTREMA.minimum.temperature_K,
  maximum: SECOND_SOUND_EXTREMA.maximum.temperature_K,
} as const;
