import { InvalidInputError, requireInRange } from './errors';
import { DELAY_LIMITS, SPEED_RANGE_M_S, type TemperatureCandidate, temperatureCandidates } from './invert-delay';

/*
 * Several distances, one temperature: t_i = t0 + d_i/u2 (PHYSICS notes §6). A weighted
 * straight-line fit of delay against distance gives the slope 1/u2 and the common offset t0, with
 * their covariance (e.g. Bevington & Robinson, "Data Reduction and Error Analysis", ch. 6; the
 * standard weighted least squares). Weights are 1/σ_i²; without stated σ_i all weights are equal
 * and the covariance is scaled by the residual variance (χ²/(n − 2)).
 */

export interface DistanceDelay {
  distance_m: number;
  delay_s: number;
  /** One-sigma delay uncertainty, s; 0 or absent for "unknown" (all must be given or none). */
  delaySd_s?: number;
}

export interface DistanceFit {
  speed_m_s: number;
  speedSd_m_s: number;
  offset_s: number;
  offsetSd_s: number;
  /** Covariance of (slope 1/u2 in s/m, offset in s). */
  covariance: [[number, number], [number, number]];
  /** Correlation of speed and offset, −1…1. */
  correlation: number;
  residuals_s: number[];
  chiSquare: number;
  degreesOfFreedom: number;
  /** True when the σ_i were given; false when scaled by the scatter. */
  weighted: boolean;
  candidates: TemperatureCandidate[];
}

/**
 * Fits t = t0 + d/u over at least three points at two or more distinct distances.
 * Throws InvalidInputError for too few points, mixed or zero sds, or a non-positive slope.
 */
export function fitDistances(points: readonly DistanceDelay[]): DistanceFit {
  if (points.length < 3) throw new InvalidInputError('points', `need at least 3 (distance, delay) pairs, got ${points.length}`);
  points.forEach((p, i) => {
    requireInRange(`distance (row ${i + 1})`, p.distance_m, DELAY_LIMITS.distance_m[0], DELAY_LIMITS.distance_m[1], 'm');
    requireInRange(`delay (row ${i + 1})`, p.delay_s, -DELAY_LIMITS.delay_s[1], DELAY_LIMITS.delay_s[1], 's');
    if (p.delaySd_s !== undefined) requireInRange(`delay sd (row ${i + 1})`, p.delaySd_s, 1e-15, DELAY_LIMITS.delaySd_s[1], 's', 'above 0');
  });
  const given = points.filter((p) => p.delaySd_s !== undefined).length;
  if (given !== 0 && given !== points.length) throw new InvalidInputError('delay sd', 'give a delay sd for every row or for none');
  const weighted = given === points.length;
  const w = points.map((p) => (weighted ? 1 / (p.delaySd_s as number) ** 2 : 1));
  let S = 0;
  let Sx = 0;
  let Sy = 0;
  points.forEach((p, i) => {
    const wi = w[i] as number;
    S += wi;
    Sx += wi * p.distance_m;
    Sy += wi * p.delay_s;
  });
  const xm = Sx / S;
  const ym = Sy / S;
  let Stt = 0;
  let Sty = 0;
  points.forEach((p, i) => {
    const t = p.distance_m - xm;
    Stt += (w[i] as number) * t * t;
    Sty += (w[i] as number) * t * (p.delay_s - ym);
  });
  if (!(Stt > 0)) throw new InvalidInputError('distances', 'need at least two different distances');
  const slope = Sty / Stt;
  const offset = ym - slope * xm;
  if (!(slope > 0)) throw new InvalidInputError('points', 'the delay does not grow with distance: no speed can be fitted');
  const residuals = points.map((p) => p.delay_s - offset - slope * p.distance_m);
  const chiSquare = residuals.reduce((acc, r, i) => acc + (w[i] as number) * r * r, 0);
  const dof = points.length - 2;
  const scale = weighted ? 1 : chiSquare / dof;
  const varSlope = scale / Stt;
  const varOffset = scale * (1 / S + (xm * xm) / Stt);
  const cov = (-scale * xm) / Stt;
  const speed = 1 / slope;
  requireInRange('fitted speed', speed, SPEED_RANGE_M_S[0], SPEED_RANGE_M_S[1], 'm/s', 'no second sound that fast or slow');
  const speedSd = Math.sqrt(varSlope) / (slope * slope);
  return {
    speed_m_s: speed,
    speedSd_m_s: speedSd,
    offset_s: offset,
    offsetSd_s: Math.sqrt(varOffset),
    covariance: [
      [varSlope, cov],
      [cov, varOffset],
    ],
    // Speed is 1/slope, so its correlation with the offset has the opposite sign to the slope's.
    correlation: varSlope > 0 && varOffset > 0 ? -cov / Math.sqrt(varSlope * varOffset) : 0,
    residuals_s: residuals,
    chiSquare,
    degreesOfFreedom: dof,
    weighted,
    candidates: temperatureCandidates(speed, Math.min(1, speedSd / speed)),
  };
}
