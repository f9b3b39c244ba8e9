import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { secondSoundUnchecked, secondSoundValueUnchecked } from './second-sound';
import { SECOND_SOUND_EXTREMA } from './second-sound-extrema';

/*
 * The three monotonic branches of u2(T) and the inverse on each (PHYSICS notes §6). u2 falls from
 * 136 m/s at 0.3 K to a minimum of 18.34 m/s near 1.12 K, rises to a maximum of 20.37 m/s near
 * 1.65 K, and falls to 0 at Tλ:
 *   low    0.3 K – T_min   (falling),
 *   middle T_min – T_max   (rising),
 *   high   T_max – Tλ      (falling).
 * Each root is found by Newton's method from a tabulated inverse of its branch, safeguarded by the
 * branch's bracket.
 */

export type Branch = 'low' | 'middle' | 'high';

export interface BranchTable {
  branch: Branch;
  /** Temperature ends of the branch, K. */
  lo: number;
  hi: number;
  /** Speeds at the table nodes, increasing. */
  speeds: Float64Array;
  temps: Float64Array;
  /** Slowest and fastest speed on the branch, m/s. */
  slowest: number;
  fastest: number;
  /** u2 at the cold and the warm end, m/s. */
  speedAtLo: number;
  speedAtHi: number;
  /**
   * Where to start the search for a speed: for each of {@link SPEED_BUCKETS} equal steps of speed
   * from `slowest`, the table step holding the step's start (so a search spans a few nodes, not
   * the whole table); `bucketsPerSpeed` converts a speed offset into a step number.
   */
  bucketStart: Int32Array;
  bucketsPerSpeed: number;
}

/** Equal speed steps per branch in {@link BranchTable.bucketStart}. */
const SPEED_BUCKETS = 4096;

// With 4097 nodes the interpolated first guess is within about 1e-8 K of the root, so one Newton
// step lands far below 1e-12 K and the evaluation made for it also serves the candidate's sd.
const TABLE_NODES = 4097;

function buildBranch(branch: Branch, lo: number, hi: number): BranchTable {
  // Nodes denser near the ends, where the curve turns (extrema) or plunges (Tλ).
  const temps: number[] = [];
  for (let i = 0; i < TABLE_NODES; i++) {
    const x = i / (TABLE_NODES - 1);
    temps.push(lo + (hi - lo) * (0.5 - 0.5 * Math.cos(Math.PI * x)));
  }
  const { speeds, temps: orderedTemps } = inOrderOfSpeed(temps);
  const slowest = speeds[0] as number;
  const fastest = speeds[speeds.length - 1] as number;
  const risingWithT = branch === 'middle';
  const bucketsPerSpeed = SPEED_BUCKETS / (fastest - slowest);
  const bucketStart = new Int32Array(SPEED_BUCKETS + 2);
  let i = 0;
  for (let q = 0; q < bucketStart.length; q++) {
    const start = slowest + q / bucketsPerSpeed;
    while (i < speeds.length - 2 && (speeds[i + 1] as number) <= start) i++;
    bucketStart[q] = i;
  }
  return {
    branch,
    lo,
    hi,
    speeds,
    temps: orderedTemps,
    slowest,
    fastest,
    speedAtLo: risingWithT ? slowest : fastest,
    speedAtHi: risingWithT ? fastest : slowest,
    bucketStart,
    bucketsPerSpeed,
  };
}

/**
 * The nodes in order of increasing speed. A branch is monotonic, so they already are (reversed on a
 * falling branch); only where rounding breaks strict order are they sorted, as pairs (a stable sort).
 */
function inOrderOfSpeed(temps: readonly number[]): { speeds: Float64Array; temps: Float64Array } {
  const n = temps.length;
  const speeds = Float64Array.from(temps, (T) => secondSoundValueUnchecked(T));
  const falling = (speeds[0] as number) > (speeds[n - 1] as number);
  const orderedTemps = Float64Array.from(temps);
  if (falling) {
    speeds.reverse();
    orderedTemps.reverse();
  }
  let strict = true;
  for (let i = 1; i < n && strict; i++) strict = (speeds[i] as number) > (speeds[i - 1] as number);
  if (strict) return { speeds, temps: orderedTemps };
  const pairs = temps.map((T) => [secondSoundValueUnchecked(T), T] as const).sort((a, b) => a[0] - b[0]);
  return { speeds: Float64Array.from(pairs, (p) => p[0]), temps: Float64Array.from(pairs, (p) => p[1]) };
}

let branchTables: readonly BranchTable[] | null = null;

/**
 * The branches, coldest first, built on first use (about 12 000 evaluations of u2): a program that
 * loads the kernel without inverting a speed (the command line's `props`, the page's explorer)
 * does not pay for them.
 */
export function branches(): readonly BranchTable[] {
  branchTables ??= [
    buildBranch('low', MODEL_MIN_K, SECOND_SOUND_EXTREMA.minimum.temperature_K),
    buildBranch('middle', SECOND_SOUND_EXTREMA.minimum.temperature_K, SECOND_SOUND_EXTREMA.maximum.temperature_K),
    buildBranch('high', SECOND_SOUND_EXTREMA.maximum.temperature_K, T_LAMBDA_K),
  ];
  return branchTables;
}

/** A Newton step this small leaves an error far below 1e-12 K (quadratic convergence). */
const NEWTON_ACCEPT_STEP_K = 1e-7;
const NEWTON_MAX_ITERATIONS = 60;

export interface Root {
  T: number;
  at: { value: number; slope: number };
}

/**
 * The temperature on branch `b` where u2 = u (m/s); u must lie within the branch's speeds
 * (b.slowest ≤ u ≤ b.fastest). Value and slope of u2 at the root come with it.
 */
export function solveOnBranch(b: BranchTable, u: number): Root {
  // Bracket in temperature, and a linear first guess.
  const i = tableIndex(b, u);
  const t0 = b.temps[i] as number;
  const t1 = b.temps[i + 1] as number;
  let lo = Math.min(t0, t1);
  let hi = Math.max(t0, t1);
  let T = stepGuess(b, i, u);
  const rising = b.branch === 'middle';
  let at = secondSoundUnchecked(T);
  for (let k = 0; k < NEWTON_MAX_ITERATIONS; k++) {
    const f = at.value - u;
    // Keep the bracket: on a rising branch f > 0 means T is too high.
    if (f > 0 === rising) hi = Math.min(hi, T);
    else lo = Math.max(lo, T);
    let next = at.slope !== 0 && Number.isFinite(at.slope) ? T - f / at.slope : (lo + hi) / 2;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    // Value and slope at T stand for those at the root, a step below 1e-7 K away.
    if (Math.abs(next - T) < NEWTON_ACCEPT_STEP_K) return { T: next, at };
    T = next;
    at = secondSoundUnchecked(T);
  }
  return { T, at };
}

/** The temperature end of branch `b` where u2 is slowest (`'slowest'`) or fastest. */
export function branchEnd(b: BranchTable, which: 'slowest' | 'fastest'): number {
  // Falling branches (low, high) are slowest at their warm end; the rising middle one at its cold end.
  const warmIsSlow = b.branch !== 'middle';
  return which === 'slowest' === warmIsSlow ? b.hi : b.lo;
}

/**
 * The table's inverse on branch `b` alone (binary search and linear interpolation, no Newton
 * step): within about 1e-8 K of the root, enough for an interval bound. u within the branch's speeds.
 */
export function interpolateOnBranch(b: BranchTable, u: number): number {
  return stepGuess(b, tableIndex(b, u), u);
}

/**
 * The table step holding speed u: the last node i ≤ n − 2 with speeds[i] ≤ u (u ≥ slowest). One
 * answer whatever the search's start: the speed step's bracket ({@link BranchTable.bucketStart})
 * narrows it, checked, then a binary search inside; the whole table when the check fails.
 */
function tableIndex(b: BranchTable, u: number): number {
  const s = b.speeds;
  const last = s.length - 1;
  let i = 0;
  let j = last;
  const q = Math.floor((u - b.slowest) * b.bucketsPerSpeed);
  if (q >= 0 && q <= SPEED_BUCKETS) {
    const from = b.bucketStart[q] as number;
    const to = (b.bucketStart[q + 1] as number) + 1;
    // Bracket invariant: speeds[i] ≤ u, and j = last or speeds[j] > u.
    if ((s[from] as number) <= u && (to >= last || (s[to] as number) > u)) {
      i = from;
      j = Math.min(to, last);
    }
  }
  while (j - i > 1) {
    const mid = (i + j) >> 1;
    if (u >= (s[mid] as number)) i = mid;
    else j = mid;
  }
  return i;
}

/** The straight-line guess at speed u between the ends of table step i (nodes i and i + 1). */
function stepGuess(b: BranchTable, i: number, u: number): number {
  const s0 = b.speeds[i] as number;
  const s1 = b.speeds[i + 1] as number;
  const t0 = b.temps[i] as number;
  const t1 = b.temps[i + 1] as number;
  return s1 > s0 ? t0 + ((u - s0) * (t1 - t0)) / (s1 - s0) : t0;
}
