import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { LAMBDA_END_REACH_K, SECOND_SOUND_SD_EDGES_K, secondSoundBaseRelativeSd, secondSoundSdUnchecked, secondSoundUnchecked } from './second-sound';
import { type BranchTable, branches, branchEnd, interpolateOnBranch } from './second-sound-branches';
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
 * Fast path: away from Tλ the curve's sd is a piecewise-constant fraction r of u2, so at a bound
 * (u2 = v = u ± kσ) σ² = σ_meas² + r²v² is a quadratic in σ, solved exactly, and the bound is the
 * branch table's inverse at v; the walk is only needed where r changes between root and bound or
 * the bound lies within 30 mK of Tλ (where the curve's sd grows with |du2/dT|).
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

/** Bounds are found to 1 nK, far below any sd this kernel states. */
const BOUND_TOLERANCE_K = 1e-9;
const BOUND_MAX_ITERATIONS = 80;

/** |u2(T) − u| − k·σ_u(T): ≤ 0 inside the band. */
function excess(T: number, u: number, k: number, sdMeasurement: number): number {
  const at = secondSoundUnchecked(T);
  return Math.abs(at.value - u) - k * Math.hypot(sdMeasurement, secondSoundSdUnchecked(T, at.value, at.slope));
}

/** First step of the outward march, K; it doubles until the band ends. */
const MARCH_FIRST_STEP_K = 1e-6;

/**
 * Walking from `inside` (in the band) towards `end` along one branch: the first temperature where
 * the band ends, or `end` when it never does. A march with doubling steps brackets the first
 * crossing (so a sliver of the band further out — within µK of Tλ the curve's sd exceeds any
 * speed — is not mistaken for it), then bracketed regula falsi (Illinois variant) finds it.
 */
function boundTowards(inside: number, end: number, u: number, k: number, sdMeasurement: number): number {
  const dir = end > inside ? 1 : -1;
  let a = inside;
  let fa = Math.min(excess(a, u, k, sdMeasurement), 0);
  let b = end;
  let fb = 0;
  for (let h = MARCH_FIRST_STEP_K; ; h *= 2) {
    const next = (end - (a + dir * h)) * dir <= 0 ? end : a + dir * h;
    const f = excess(next, u, k, sdMeasurement);
    if (f > 0) {
      b = next;
      fb = f;
      break;
    }
    if (next === end) return end;
    a = next;
    fa = f;
  }
  let side = 0;
  for (let i = 0; i < BOUND_MAX_ITERATIONS && Math.abs(b - a) > BOUND_TOLERANCE_K; i++) {
    let c = fb !== fa ? b - (fb * (b - a)) / (fb - fa) : (a + b) / 2;
    // Keep the step inside the bracket, so a step in σ cannot stall it.
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

const FAST_LIMIT_K = T_LAMBDA_K - LAMBDA_END_REACH_K;
/** u2 at each temperature where the curve's relative sd changes. */
const EDGES_K = Float64Array.from(SECOND_SOUND_SD_EDGES_K).sort();
const EDGE_SPEEDS = EDGES_K.map((T) => secondSoundUnchecked(T).value);
const EDGE_NUDGE_K = 1e-9;
/** The curve's relative sd just below and just above each edge. */
const EDGE_R_BELOW = EDGES_K.map((T) => secondSoundBaseRelativeSd(T - EDGE_NUDGE_K));
const EDGE_R_ABOVE = EDGES_K.map((T) => secondSoundBaseRelativeSd(T + EDGE_NUDGE_K));

/** |v − u| − k·√(σm² + (r v)²): the band's excess at a point where u2 = v and the curve's relative sd is r. */
function excessAt(v: number, r: number, u: number, k: number, sdMeasurement: number): number {
  const rv = r * v;
  return Math.abs(v - u) - k * Math.sqrt(sdMeasurement * sdMeasurement + rv * rv);
}

/**
 * Where u2 = u + side·kσ with σ² = σm² + r²(u2)²: the positive root of
 * (1 − r²k²)σ² − 2·side·r²uk·σ − (σm² + r²u²) = 0, as the speed v = u + side·kσ.
 */
function bandSpeed(u: number, side: 1 | -1, k: number, sdMeasurement: number, r: number): number {
  const a = 1 - r * r * k * k;
  const bq = -2 * side * r * r * u * k;
  const c = -(sdMeasurement * sdMeasurement + r * r * u * u);
  const sigma = a > 0 ? (-bq + Math.sqrt(bq * bq - 4 * a * c)) / (2 * a) : Number.POSITIVE_INFINITY;
  return u + side * k * sigma;
}

/**
 * The bound from `seed` towards `end` (a branch end) by the fast path, or null where it does not
 * apply (within 30 mK of Tλ). The set may step where the curve's sd steps (a region with a larger
 * sd can let the band back in further out): the bound is the outermost point of the set on this
 * side, so the stretch is the hull of the set on the branch (never narrower than the set).
 */
function fastBound(b: BranchTable, u: number, k: number, sdMeasurement: number, seed: number, end: number): number | null {
  if (seed > FAST_LIMIT_K) return null;
  const dir = end > seed ? 1 : -1;
  // Towards Tλ the quadratic holds only up to 30 mK below it: a bound found beyond that is redone by the walk.
  if (end > FAST_LIMIT_K) {
    const T = fastBoundWithin(b, u, k, sdMeasurement, seed, end);
    return T < FAST_LIMIT_K ? T : null;
  }
  const endSpeed = end === b.lo ? b.speedAtLo : b.speedAtHi;
  if (excessAt(endSpeed, secondSoundBaseRelativeSd(end - dir * EDGE_NUDGE_K), u, k, sdMeasurement) <= 0) return end;
  return fastBoundWithin(b, u, k, sdMeasurement, seed, end);
}

/** {@link fastBound} past the check of the branch end: the region edges, farthest first. */
function fastBoundWithin(b: BranchTable, u: number, k: number, sdMeasurement: number, seed: number, end: number): number {
  const dir = end > seed ? 1 : -1;
  // Region edges between seed and end, farthest first; `outer` is the far limit of each region.
  let outer = end;
  let vOuter = end === b.lo ? b.speedAtLo : end === b.hi ? b.speedAtHi : secondSoundUnchecked(end).value;
  const n = EDGES_K.length;
  for (let j = 0; j < n; j++) {
    const i = dir > 0 ? n - 1 - j : j;
    const T = EDGES_K[i] as number;
    if (!((T - seed) * dir > 0 && (end - T) * dir > 0)) continue;
    const r = (dir > 0 ? EDGE_R_ABOVE[i] : EDGE_R_BELOW[i]) as number;
    const v = EDGE_SPEEDS[i] as number;
    if (excessAt(v, r, u, k, sdMeasurement) <= 0) return boundInRegion(b, u, k, sdMeasurement, r, T, outer, vOuter);
    outer = T;
    vOuter = v;
  }
  return boundInRegion(b, u, k, sdMeasurement, secondSoundBaseRelativeSd(seed), seed, outer, vOuter);
}

/** The band's bound between `from` (inside the set) and `to` (where u2 = vTo), the curve's relative sd r throughout. */
function boundInRegion(b: BranchTable, u: number, k: number, sdMeasurement: number, r: number, from: number, to: number, vTo: number): number {
  // Walking towards `to`, u2 moves away from u on one side: which side follows from u2 at `to`.
  const side: 1 | -1 = vTo > u ? 1 : -1;
  const v = bandSpeed(u, side, k, sdMeasurement, r);
  if ((v - vTo) * side >= 0) return to;
  const T = v <= b.slowest ? branchEnd(b, 'slowest') : v >= b.fastest ? branchEnd(b, 'fastest') : interpolateOnBranch(b, v);
  const lo = Math.min(from, to);
  const hi = Math.max(from, to);
  return Math.min(hi, Math.max(lo, T));
}

/** Seeds per branch for one speed: a temperature in the band (the root, or a branch end), or NaN where the band misses the branch. */
const seeds = new Float64Array(3);
const lows = new Float64Array(3);
const highs = new Float64Array(3);
const TURNS: readonly IntervalReach[] = ['minimum', 'maximum'];

function seedOn(b: BranchTable, u: number, k: number, sdMeasurement: number): number {
  if (u >= b.slowest && u <= b.fastest) return interpolateOnBranch(b, u);
  const end = branchEnd(b, u < b.slowest ? 'slowest' : 'fastest');
  const outside = end > FAST_LIMIT_K ? excess(end, u, k, sdMeasurement) : excessAt(u < b.slowest ? b.slowest : b.fastest, secondSoundBaseRelativeSd(end), u, k, sdMeasurement);
  return outside > 0 ? Number.NaN : end;
}

/**
 * Every stretch of temperature (K) whose u2 lies within k·σ_u of the speed u, coldest first, with
 * stretches joined across an extremum both sides reach. No range checks (kernel-internal).
 * @param u measured speed, m/s.  @param sdMeasurement measurement part of σ_u, m/s (≥ 0).
 * @param k half-width of the band in sd (INTERVAL_K).
 */
export function speedBandTemperatures(u: number, sdMeasurement: number, k: number): TemperatureInterval[] {
  for (let i = 0; i < 3; i++) {
    const b = branches()[i] as BranchTable;
    const seed = seedOn(b, u, k, sdMeasurement);
    seeds[i] = seed;
    if (Number.isNaN(seed)) continue;
    lows[i] = fastBound(b, u, k, sdMeasurement, seed, b.lo) ?? boundTowards(seed, b.lo, u, k, sdMeasurement);
    highs[i] = fastBound(b, u, k, sdMeasurement, seed, b.hi) ?? boundTowards(seed, b.hi, u, k, sdMeasurement);
  }
  const out: TemperatureInterval[] = [];
  let open: TemperatureInterval | null = null;
  for (let i = 0; i < 3; i++) {
    const b = branches()[i] as BranchTable;
    if (Number.isNaN(seeds[i] as number)) {
      if (open) out.push(open);
      open = null;
      continue;
    }
    const low = lows[i] as number;
    const high = highs[i] as number;
    const atCold = low <= b.lo;
    const atWarm = high >= b.hi;
    const previousAtWarm = i > 0 && !Number.isNaN(seeds[i - 1] as number) && (highs[i - 1] as number) >= (branches()[i - 1] as BranchTable).hi;
    if (open && previousAtWarm && atCold) {
      open.high_K = high;
      open.reaches.push(TURNS[i - 1] as IntervalReach);
    } else {
      if (open) out.push(open);
      open = { low_K: low, high_K: high, reaches: [], empty: false };
      // A stretch that runs into an extremum from one side only still touches it.
      if (i > 0 && atCold) open.reaches.push(TURNS[i - 1] as IntervalReach);
    }
    if (i === 0 && atCold && low <= MODEL_MIN_K) open.reaches.unshift('model limit');
    if (i < 2 && atWarm) {
      const next = branches()[i + 1] as BranchTable;
      // The next branch's stretch is found in the next pass; it joins when it starts at its cold end.
      const nextJoins = !Number.isNaN(seeds[i + 1] as number) && (lows[i + 1] as number) <= next.lo;
      if (!nextJoins) open.reaches.push(TURNS[i] as IntervalReach);
    }
    if (i === 2 && atWarm && high >= T_LAMBDA_K) open.reaches.push('Tλ');
  }
  if (open) out.push(open);
  return out;
}

/** The stretch of `band` holding T (K), or an empty interval at T when none does. Shares the stretch's `reaches`. */
export function intervalHolding(band: readonly TemperatureInterval[], T: number): TemperatureInterval {
  const tolerance = 1e-9;
  for (const s of band) if (s.low_K - tolerance <= T && T <= s.high_K + tolerance) return s;
  return { low_K: T, high_K: T, reaches: [], empty: true };
}

/** Temperatures of the two extrema, for callers naming what an interval reaches. */
export const EXTREMUM_TEMPERATURES_K = {
  minimum: SECOND_SOUND_EXTREMA.minimum.temperature_K,
  maximum: SECOND_SOUND_EXTREMA.maximum.temperature_K,
} as const;
