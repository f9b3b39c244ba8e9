import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';
import { secondSoundRegion, secondSoundUnchecked, secondSoundValueUnchecked } from './second-sound';
import { SECOND_SOUND_EXTREMA } from './second-sound-extrema';
import { secondSoundRelativeSd, secondSoundRelativeSdUnchecked, temperatureSpreadUnchecked } from './temperature-resolution';

/*
 * Speed → every temperature with u2(T) = u (PHYSICS notes §6). u2 is not monotonic: it falls from
 * 136 m/s at 0.3 K to a minimum of 18.34 m/s near 1.12 K, rises to a maximum of 20.37 m/s near
 * 1.65 K, and falls to 0 at Tλ. So the curve splits into three monotonic branches:
 *   low    0.3 K – T_min   (falling),
 *   middle T_min – T_max   (rising),
 *   high   T_max – Tλ      (falling).
 * A speed between the extremes has three roots; above the maximum one (low branch, below 0.93 K);
 * below the minimum one (high branch, above 1.92 K). Each root is found by Newton's method from a
 * tabulated inverse of its branch, safeguarded by the branch's bracket.
 * Near an extremum du2/dT → 0: the sd uses the second-order bound there and the candidate says it
 * is insensitive; a speed just beyond an extremum (within two sd) yields the extremum itself.
 */

export type Branch = 'low' | 'middle' | 'high';

const T_MIN = SECOND_SOUND_EXTREMA.minimum.temperature_K;
const T_MAX = SECOND_SOUND_EXTREMA.maximum.temperature_K;

interface BranchTable {
  branch: Branch;
  lo: number;
  hi: number;
  /** Speeds at the table nodes, increasing. */
  speeds: Float64Array;
  temps: Float64Array;
}

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
  const speeds = Float64Array.from(temps, (T) => secondSoundValueUnchecked(T));
  // Each branch is monotonic, so the nodes are already in order of speed (reversed on a falling
  // branch); only where rounding breaks strict order are they sorted, as pairs (a stable sort).
  const falling = (speeds[0] as number) > (speeds[TABLE_NODES - 1] as number);
  const ordered = falling ? speeds.reverse() : speeds;
  const orderedTemps = Float64Array.from(temps);
  if (falling) orderedTemps.reverse();
  let strict = true;
  for (let i = 1; i < TABLE_NODES && strict; i++) strict = (ordered[i] as number) > (ordered[i - 1] as number);
  if (strict) return { branch, lo, hi, speeds: ordered, temps: orderedTemps };
  const pairs = temps.map((T) => [secondSoundValueUnchecked(T), T] as const).sort((a, b) => a[0] - b[0]);
  return {
    branch,
    lo,
    hi,
    speeds: Float64Array.from(pairs, (p) => p[0]),
    temps: Float64Array.from(pairs, (p) => p[1]),
  };
}

let branchTables: readonly BranchTable[] | null = null;

/**
 * The three branch tables, built on first use (12 000 evaluations of u2): a program that loads
 * the kernel without inverting a speed (the command line's `props`, the page's explorer) does
 * not pay for them.
 */
function branches(): readonly BranchTable[] {
  branchTables ??= [buildBranch('low', MODEL_MIN_K, T_MIN), buildBranch('middle', T_MIN, T_MAX), buildBranch('high', T_MAX, T_LAMBDA_K)];
  return branchTables;
}

/** A Newton step this small leaves an error far below 1e-12 K (quadratic convergence). */
const NEWTON_ACCEPT_STEP_K = 1e-7;
const NEWTON_MAX_ITERATIONS = 60;

interface Root {
  T: number;
  at: { value: number; slope: number };
}

function solveOnBranch(b: BranchTable, u: number): Root {
  const s = b.speeds;
  const n = s.length;
  let i = 0;
  let j = n - 1;
  while (j - i > 1) {
    const mid = (i + j) >> 1;
    if (u >= (s[mid] as number)) i = mid;
    else j = mid;
  }
  const s0 = s[i] as number;
  const s1 = s[j] as number;
  const t0 = b.temps[i] as number;
  const t1 = b.temps[j] as number;
  // Bracket in temperature, and a linear first guess.
  let lo = Math.min(t0, t1);
  let hi = Math.max(t0, t1);
  let T = s1 > s0 ? t0 + ((u - s0) * (t1 - t0)) / (s1 - s0) : t0;
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

export interface SpeedUncertainty {
  /** Relative uncertainty of the measured speed from distance and timing, σ_u/u. */
  relative: number;
}

export interface TemperatureCandidate {
  temperature_K: number;
  /** One-sigma temperature from distance, timing, offset and the u2 table, K. */
  sd_K: number;
  /** du2/dT at the candidate, m/s/K. */
  slope_m_s_K: number;
  branch: Branch;
  /** True near an extremum of u2, where the second-order bound sets the sd. */
  insensitive: boolean;
  /** "Landau model" below 0.5517 K, "critical scaling" in the last 5 µK below Tλ, else "measured". */
  region: 'measured' | 'Landau model' | 'critical scaling';
  /**
   * "root": u2 equals the speed here. "extremum": the speed lies just beyond an extremum of u2
   * (within two sd), so no root exists nearby but the extremum itself is consistent with it.
   */
  kind: 'root' | 'extremum';
}

/** Speeds accepted by {@link temperatureCandidates}, m/s: above 0 up to u2 at 0.3 K. */
export const SPEED_RANGE_M_S = [1e-6, secondSoundValueUnchecked(MODEL_MIN_K)] as const;

/** How many sd beyond an extremum a speed may lie and still be read as that extremum. */
const EXTREMUM_REACH_SD = 2;
const EXTREMA_TABLE_REL_SD = {
  minimum: secondSoundRelativeSd(SECOND_SOUND_EXTREMA.minimum.temperature_K),
  maximum: secondSoundRelativeSd(SECOND_SOUND_EXTREMA.maximum.temperature_K),
};

function candidateAt({ T, at }: Root, branch: Branch, relSd: number, kind: TemperatureCandidate['kind'] = 'root'): TemperatureCandidate {
  const table = secondSoundRelativeSdUnchecked(T, at);
  const spread = temperatureSpreadUnchecked(T, Math.sqrt(relSd * relSd + table * table), at);
  return { temperature_K: T, sd_K: spread.sd_K, slope_m_s_K: at.slope, branch, insensitive: spread.insensitive, region: secondSoundRegion(T), kind };
}

function extremumRoot(T: number): Root {
  return { T, at: secondSoundUnchecked(T) };
}

/**
 * Every temperature (K, 0.3 K – Tλ) at which second sound travels at `speed_m_s`, coldest first,
 * each with its sd (from the relative speed uncertainty given plus the u2 table's own), slope and
 * branch. A speed within two sd beyond an extremum of u2 gives that extremum as a candidate.
 * @param speed_m_s measured speed, m/s, 1e-6 to 136.2 (u2 at 0.3 K).
 * @param relativeSpeedSd σ_u/u from distance and timing (≥ 0).
 * Throws OutOfRangeError / NonFiniteInputError naming the speed range.
 */
export function temperatureCandidates(speed_m_s: number, relativeSpeedSd: number): TemperatureCandidate[] {
  requireInRange('second-sound speed', speed_m_s, SPEED_RANGE_M_S[0], SPEED_RANGE_M_S[1], 'm/s');
  requireInRange('relative speed uncertainty', relativeSpeedSd, 0, 1, '');
  const out: TemperatureCandidate[] = [];
  const { minimum, maximum } = SECOND_SOUND_EXTREMA;
  for (const b of branches()) {
    const first = b.speeds[0] as number;
    const last = b.speeds[b.speeds.length - 1] as number;
    if (speed_m_s >= first && speed_m_s <= last) out.push(candidateAt(solveOnBranch(b, speed_m_s), b.branch, relativeSpeedSd));
  }
  const sigmaU = (u: number, tableRelSd: number) => u * Math.sqrt(relativeSpeedSd * relativeSpeedSd + tableRelSd * tableRelSd);
  // Just below the minimum: the low and middle branches have no root, but the minimum is within reach.
  if (speed_m_s < minimum.speed_m_s && minimum.speed_m_s - speed_m_s <= EXTREMUM_REACH_SD * sigmaU(speed_m_s, EXTREMA_TABLE_REL_SD.minimum)) {
    out.push(candidateAt(extremumRoot(minimum.temperature_K), 'middle', relativeSpeedSd, 'extremum'));
  }
  if (speed_m_s > maximum.speed_m_s && speed_m_s - maximum.speed_m_s <= EXTREMUM_REACH_SD * sigmaU(speed_m_s, EXTREMA_TABLE_REL_SD.maximum)) {
    out.push(candidateAt(extremumRoot(maximum.temperature_K), 'middle', relativeSpeedSd, 'extremum'));
  }
  return out.sort((a, b) => a.temperature_K - b.temperature_K);
}

export interface DelayReading {
  /** Heater–sensor path, m. */
  distance_m: number;
  /** Measured delay from trigger to arrival, s. */
  delay_s: number;
  distanceSd_m: number;
  delaySd_s: number;
  /** Offset t0 (heater and sensor lag, electronics), s, subtracted from the delay. */
  offset_s: number;
  offsetSd_s: number;
}

export interface DelayConversion {
  speed_m_s: number;
  speedSd_m_s: number;
  candidates: TemperatureCandidate[];
}

/** Limits of a delay reading (SI). */
export const DELAY_LIMITS = {
  distance_m: [1e-6, 100],
  delay_s: [1e-9, 1e4],
  distanceSd_m: [0, 1],
  delaySd_s: [0, 1e3],
  offset_s: [-1e3, 1e3],
  offsetSd_s: [0, 1e3],
} as const;

/**
 * Delay → speed u = d/(t − t0) with its sd, and every candidate temperature.
 * sd: σ_u/u = √((σ_d/d)² + (σ_t² + σ_t0²)/(t − t0)²). Throws typed errors naming the field.
 */
export function convertDelay(r: DelayReading): DelayConversion {
  const L = DELAY_LIMITS;
  requireInRange('distance', r.distance_m, L.distance_m[0], L.distance_m[1], 'm');
  requireInRange('delay', r.delay_s, L.delay_s[0], L.delay_s[1], 's');
  requireInRange('distance sd', r.distanceSd_m, L.distanceSd_m[0], L.distanceSd_m[1], 'm');
  requireInRange('delay sd', r.delaySd_s, L.delaySd_s[0], L.delaySd_s[1], 's');
  requireInRange('offset', r.offset_s, L.offset_s[0], r.delay_s * (1 - 1e-12), 's', 'the offset must be less than the delay');
  requireInRange('offset sd', r.offsetSd_s, L.offsetSd_s[0], L.offsetSd_s[1], 's');
  const transit = r.delay_s - r.offset_s;
  const speed = r.distance_m / transit;
  const rel = Math.hypot(r.distanceSd_m / r.distance_m, Math.hypot(r.delaySd_s, r.offsetSd_s) / transit);
  requireInRange('speed d/(t − t0)', speed, SPEED_RANGE_M_S[0], SPEED_RANGE_M_S[1], 'm/s', 'no second sound that fast or slow');
  return { speed_m_s: speed, speedSd_m_s: speed * rel, candidates: temperatureCandidates(speed, Math.min(rel, 1)) };
}
