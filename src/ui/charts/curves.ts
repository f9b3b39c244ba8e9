import { heliumProperties, PROPERTIES_RANGE_K, T_LAMBDA_K } from '../../physics';

/*
 * The curves behind the charts: one sweep of the kernel over its whole range, computed on first
 * use and kept (about 1 700 temperatures, a few tens of milliseconds), never per render.
 */

/** Spacing of the even grid, K: finer than any feature of the curves away from Tλ. */
const GRID_STEP_K = 0.0025;
/** Extra points just below Tλ, K below it: u2 and ρs/ρ fall to zero steeply in the last millikelvin. */
const NEAR_LAMBDA_OFFSETS_K = [3e-3, 1e-3, 3e-4, 1e-4, 3e-5, 1e-5, 3e-6, 1e-6];

/** Property curves over the kernel's range; null where a property does not exist (u2 in He I). */
export interface PropertyCurves {
  temperature_K: readonly number[];
  secondSound_m_s: readonly (number | null)[];
  secondSoundSlope_m_s_K: readonly (number | null)[];
  firstSound_m_s: readonly number[];
  superfluidFraction: readonly number[];
  normalFraction: readonly number[];
}

let cached: PropertyCurves | null = null;

/** The sweep, computed once. */
export function propertyCurves(): PropertyCurves {
  cached ??= sweep(sweepTemperatures());
  return cached;
}

function sweepTemperatures(): number[] {
  const [min, max] = PROPERTIES_RANGE_K;
  const steps = Math.round((max - min) / GRID_STEP_K);
  const grid = Array.from({ length: steps + 1 }, (_, i) => min + ((max - min) * i) / steps);
  const nearLambda = NEAR_LAMBDA_OFFSETS_K.map((offset) => T_LAMBDA_K - offset);
  return [...grid, ...nearLambda, T_LAMBDA_K].sort((a, b) => a - b);
}

function sweep(temperatures: readonly number[]): PropertyCurves {
  const rows = temperatures.map(heliumProperties);
  return {
    temperature_K: temperatures,
    secondSound_m_s: rows.map((p) => p.secondSound_m_s),
    secondSoundSlope_m_s_K: rows.map((p) => p.secondSoundSlope_m_s_K),
    firstSound_m_s: rows.map((p) => p.firstSound_m_s),
    superfluidFraction: rows.map((p) => p.superfluidFraction),
    normalFraction: rows.map((p) => p.normalFraction),
  };
}

/**
 * Below this |du2/dT| a time-of-flight measurement pins the temperature poorly, m/s/K.
 * Planning convention, no published source: a 0.1 % error in the delay (≈ 0.02 m/s of u2 near
 * 20 m/s) then moves the inferred temperature by more than 10 mK.
 */
export const INSENSITIVE_SLOPE_M_S_K = 2;

/** A closed temperature interval, K. */
export interface TemperatureInterval {
  from_K: number;
  to_K: number;
}

/**
 * Intervals where |slope| < threshold, from sampled slopes (null samples end an interval);
 * ends are placed by linear interpolation between samples.
 */
export function insensitiveIntervals(
  temperature_K: readonly number[],
  slope: readonly (number | null)[],
  threshold: number,
): TemperatureInterval[] {
  const intervals: TemperatureInterval[] = [];
  let start: number | null = null;
  for (let i = 0; i < temperature_K.length; i += 1) {
    const T = temperature_K[i];
    const s = slope[i];
    if (T === undefined) continue;
    const inside = s !== null && s !== undefined && Math.abs(s) < threshold;
    if (inside && start === null) start = i === 0 ? T : crossing(temperature_K, slope, i - 1, i, threshold);
    if (!inside && start !== null) {
      intervals.push({ from_K: start, to_K: crossing(temperature_K, slope, i - 1, i, threshold) });
      start = null;
    }
  }
  const last = temperature_K[temperature_K.length - 1];
  if (start !== null && last !== undefined) intervals.push({ from_K: start, to_K: last });
  return intervals;
}

/** Where |slope| crosses the threshold between samples i and j (linear in |slope|). */
function crossing(
  temperature_K: readonly number[],
  slope: readonly (number | null)[],
  i: number,
  j: number,
  threshold: number,
): number {
  const Ti = temperature_K[i] ?? 0;
  const Tj = temperature_K[j] ?? Ti;
  const si = slope[i];
  const sj = slope[j];
  if (si == null || sj == null) return si == null ? Tj : Ti;
  const ai = Math.abs(si);
  const aj = Math.abs(sj);
  if (ai === aj) return Ti;
  return Ti + ((threshold - ai) / (aj - ai)) * (Tj - Ti);
}

/** A local minimum or maximum of u2. */
export interface SecondSoundExtreme {
  kind: 'minimum' | 'maximum';
  temperature_K: number;
  secondSound_m_s: number;
}

/** Local extremes of u2 in He II: where the sampled slope changes sign (interpolated). */
export function secondSoundExtremes(curves: PropertyCurves): SecondSoundExtreme[] {
  const extremes: SecondSoundExtreme[] = [];
  const { temperature_K: T, secondSound_m_s: u2, secondSoundSlope_m_s_K: slope } = curves;
  for (let i = 1; i < T.length; i += 1) {
    const s0 = slope[i - 1];
    const s1 = slope[i];
    const T0 = T[i - 1];
    const T1 = T[i];
    const u0 = u2[i - 1];
    const u1 = u2[i];
    if (s0 == null || s1 == null || T0 === undefined || T1 === undefined || u0 == null || u1 == null) continue;
    if (Math.sign(s0) === Math.sign(s1) || s0 === 0) continue;
    const f = s0 / (s0 - s1);
    extremes.push({
      kind: s0 < 0 ? 'minimum' : 'maximum',
      temperature_K: T0 + f * (T1 - T0),
      secondSound_m_s: u0 + f * (u1 - u0),
    });
  }
  return extremes;
}
