import { MODEL_MIN_K } from './constants';
import { requireInRange } from './errors';
import { secondSoundRegion, secondSoundUnchecked, secondSoundValueUnchecked } from './second-sound';
import { type Branch, branches, type Root, solveOnBranch } from './second-sound-branches';
import { SECOND_SOUND_EXTREMA } from './second-sound-extrema';
import { INTERVAL_K, type IntervalReach, intervalHolding, speedBandTemperatures } from './temperature-interval';
import { secondSoundRelativeSd, secondSoundRelativeSdUnchecked, temperatureSpreadUnchecked } from './temperature-resolution';

/*
 * Speed → every temperature with u2(T) = u (PHYSICS notes §6). u2 is not monotonic, so the curve
 * splits into three monotonic branches (second-sound-branches.ts): a speed between the extremes
 * has three roots; above the maximum one (low branch, below 0.93 K); below the minimum one (high
 * branch, above 1.92 K).
 * Near an extremum du2/dT → 0: the sd uses the second-order bound there and the candidate says it
 * is insensitive; a speed just beyond an extremum (within two sd) yields the extremum itself.
 * Each candidate carries its sd in two parts — the measurement's (distance, timing, offset: what
 * limits a change between readings) and the u2 curve's own (common to every reading) — with the
 * total, and its 68 % and 95 % intervals mapped through the curve (temperature-interval.ts).
 */

export type { Branch } from './second-sound-branches';

export interface SpeedUncertainty {
  /** Relative uncertainty of the measured speed from distance and timing, σ_u/u. */
  relative: number;
}

export interface TemperatureCandidate {
  temperature_K: number;
  /** One-sigma temperature from distance, timing, offset and the u2 table, K (the total). */
  sd_K: number;
  /** The measurement's part of sd_K (distance, timing, offset), K: what limits a change between readings. */
  sdMeasurement_K: number;
  /** The u2 curve's own part of sd_K, K: the same for every reading at this temperature. */
  sdCurve_K: number;
  /**
   * 68.27 % and 95 % intervals, K, [low, high]: every T with |u2(T) − u| ≤ k·σ_u on the stretch of
   * the curve holding the candidate (k = 1, 1.96). Asymmetric near an extremum, where they may run
   * across it into the next branch (see `reaches68`, `reaches95`).
   */
  interval68_K: [number, number];
  interval95_K: [number, number];
  /** What each interval runs into: an extremum of u2 ("minimum", "maximum"), "Tλ", or "model limit". */
  reaches68: IntervalReach[];
  reaches95: IntervalReach[];
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

interface Bands {
  p68: ReturnType<typeof speedBandTemperatures>;
  p95: ReturnType<typeof speedBandTemperatures>;
}

function candidateAt({ T, at }: Root, branch: Branch, relSd: number, bands: Bands, kind: TemperatureCandidate['kind'] = 'root'): TemperatureCandidate {
  const table = secondSoundRelativeSdUnchecked(T, at);
  const spread = temperatureSpreadUnchecked(T, Math.sqrt(relSd * relSd + table * table), at);
  const i68 = intervalHolding(bands.p68, T);
  const i95 = intervalHolding(bands.p95, T);
  return {
    temperature_K: T,
    sd_K: spread.sd_K,
    sdMeasurement_K: temperatureSpreadUnchecked(T, relSd, at).sd_K,
    sdCurve_K: temperatureSpreadUnchecked(T, table, at).sd_K,
    interval68_K: [i68.low_K, i68.high_K],
    interval95_K: [i95.low_K, i95.high_K],
    reaches68: i68.reaches,
    reaches95: i95.reaches,
    slope_m_s_K: at.slope,
    branch,
    insensitive: spread.insensitive,
    region: secondSoundRegion(T),
    kind,
  };
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
  const sdMeasurement = relativeSpeedSd * speed_m_s;
  const bands: Bands = { p68: speedBandTemperatures(speed_m_s, sdMeasurement, INTERVAL_K.p68), p95: speedBandTemperatures(speed_m_s, sdMeasurement, INTERVAL_K.p95) };
  for (const b of branches()) {
    if (speed_m_s >= b.slowest && speed_m_s <= b.fastest) out.push(candidateAt(solveOnBranch(b, speed_m_s), b.branch, relativeSpeedSd, bands));
  }
  const sigmaU = (u: number, tableRelSd: number) => u * Math.sqrt(relativeSpeedSd * relativeSpeedSd + tableRelSd * tableRelSd);
  // Just below the minimum: the low and middle branches have no root, but the minimum is within reach.
  if (speed_m_s < minimum.speed_m_s && minimum.speed_m_s - speed_m_s <= EXTREMUM_REACH_SD * sigmaU(speed_m_s, EXTREMA_TABLE_REL_SD.minimum)) {
    out.push(candidateAt(extremumRoot(minimum.temperature_K), 'middle', relativeSpeedSd, bands, 'extremum'));
  }
  if (speed_m_s > maximum.speed_m_s && speed_m_s - maximum.speed_m_s <= EXTREMUM_REACH_SD * sigmaU(speed_m_s, EXTREMA_TABLE_REL_SD.maximum)) {
    out.push(candidateAt(extremumRoot(maximum.temperature_K), 'middle', relativeSpeedSd, bands, 'extremum'));
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
 * The checks {@link convertDelay} makes before it converts, in its order, with its errors: a
 * caller that must refuse a whole batch before writing any of it (a streamed table) checks every
 * row first. Throws typed errors naming the field.
 */
export function checkDelayReading(r: DelayReading): void {
  const L = DELAY_LIMITS;
  requireInRange('distance', r.distance_m, L.distance_m[0], L.distance_m[1], 'm');
  requireInRange('delay', r.delay_s, L.delay_s[0], L.delay_s[1], 's');
  requireInRange('distance sd', r.distanceSd_m, L.distanceSd_m[0], L.distanceSd_m[1], 'm');
  requireInRange('delay sd', r.delaySd_s, L.delaySd_s[0], L.delaySd_s[1], 's');
  requireInRange('offset', r.offset_s, L.offset_s[0], r.delay_s * (1 - 1e-12), 's', 'the offset must be less than the delay');
  requireInRange('offset sd', r.offsetSd_s, L.offsetSd_s[0], L.offsetSd_s[1], 's');
  const speed = r.distance_m / (r.delay_s - r.offset_s);
  requireInRange('speed d/(t − t0)', speed, SPEED_RANGE_M_S[0], SPEED_RANGE_M_S[1], 'm/s', 'no second sound that fast or slow');
}

/**
 * Delay → speed u = d/(t − t0) with its sd, and every candidate temperature.
 * sd: σ_u/u = √((σ_d/d)² + (σ_t² + σ_t0²)/(t − t0)²). Throws typed errors naming the field
 * ({@link checkDelayReading}).
 */
export function convertDelay(r: DelayReading): DelayConversion {
  checkDelayReading(r);
  const transit = r.delay_s - r.offset_s;
  const speed = r.distance_m / transit;
  const rel = Math.hypot(r.distanceSd_m / r.distance_m, Math.hypot(r.delaySd_s, r.offsetSd_s) / transit);
  return { speed_m_s: speed, speedSd_m_s: speed * rel, candidates: temperatureCandidates(speed, Math.min(rel, 1)) };
}
