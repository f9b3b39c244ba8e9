import { bestFit, type Problem, residualsAndJacobian, type SpeedPrior, unpack } from './arrival-fit';
import { InvalidInputError, requireInRange } from './errors';
import type { Vec3 } from './image-sources';
import { LOCATE_SPEED_RANGE_M_S } from './locate-limits';
import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { secondSoundSdUnchecked, secondSoundUnchecked } from './second-sound';
import { invert, type Matrix, multiply, symmetricEigen, transpose, zeros } from './small-matrix';
import { type Parametrisation, parametrise, type SurfaceConstraint } from './surface-constraint';
import { centroid, norm, sub, vec3 } from './vector3';

/*
 * Locating a heat source from second-sound arrival times at several sensors (multilateration):
 * t_i = t0 + |x − s_i|/u, fitted by weighted least squares (arrival-fit.ts) over the source
 * position x, the emission time or common offset t0, and optionally the speed u (a fitted
 * "effective speed" is common practice because strong sources often arrive early). With a speed
 * from the bath temperature, the speed is by default fitted under a prior of the u2 curve's sd and
 * the temperature's sd, so the regions hold when the helium's real speed differs from the table
 * by its own uncertainty. The source may be held on a sphere, a cylinder or a plane
 * (surface-constraint.ts). Outliers come from a robust fit (the worst sensor left out while one
 * exceeds the limit), whether or not the reported fit leaves them out.
 * Covariance: (JᵀJ)⁻¹ of the weighted residuals, inflated by χ²/dof when that exceeds 1 (the
 * Birge ratio; common practice). Confidence regions use the χ² quantiles for the number of free
 * position coordinates (3: Δχ² = 3.53 for 68.3 %, 8.02 for 95.4 %; 2: 2.30 and 6.18).
 */

export { LOCATE_SPEED_RANGE_M_S } from './locate-limits';
export type { SpeedPrior } from './arrival-fit';

export interface SensorArrival {
  position_m: Vec3;
  arrival_s: number;
  /** One-sigma timing uncertainty, s; the default of the options when absent. */
  arrivalSd_s?: number;
}

export interface LocateOptions {
  /** Speed of second sound, m/s (fixed, or the starting value when fitted). */
  speed_m_s: number;
  fitSpeed: boolean;
  /** Timing sd for sensors that give none, s. */
  arrivalSd_s: number;
  constraint: SurfaceConstraint;
  /** Refit without sensors whose normalised residual exceeds the outlier limit. */
  dropOutliers: boolean;
  /** Normalised residual (in sd) above which a sensor is an outlier; default 3. */
  outlierSigma?: number;
  /**
   * With a fixed speed (fitSpeed false): fit the speed too, held near `speed_m_s` by this sd (the
   * u2 curve's own sd, and the bath temperature's sd through du2/dT: {@link speedPriorAt}), so the
   * stated regions hold when the real speed differs from the table by its own uncertainty.
   * Null or absent: the speed stays fixed.
   */
  speedPrior?: SpeedPrior | null;
}

export interface ConfidenceRegion {
  /** Semi-axes of the region, m, largest first. */
  semiAxes_m: number[];
  /** Unit directions of the semi-axes (columns, Cartesian). */
  directions: Matrix;
  /** Δχ² that bounds it. */
  deltaChiSquare: number;
}

export interface LocateResult {
  source_m: Vec3;
  /** One-sigma per coordinate, m; null when the layout cannot fix the source (degenerate). */
  sourceSd_m: Vec3 | null;
  /** Covariance of the source position (Cartesian), m²; null when degenerate. */
  covariance_m2: Matrix | null;
  offset_s: number;
  offsetSd_s: number | null;
  speed_m_s: number;
  /** Sd of a fitted speed (free, or under the prior); null for a fixed speed or a degenerate fit. */
  speedSd_m_s: number | null;
  /** The prior the speed was held to, or null. */
  speedPrior: SpeedPrior | null;
  residuals_s: number[];
  /** Residual over its sd, per sensor. */
  normalisedResiduals: number[];
  /**
   * Sensors the robust fit finds beyond the limit (indices into the input): the worst is left out
   * and the rest refitted while one exceeds it, so one late sensor cannot make others look bad.
   * The same whether or not the reported fit leaves them out (dropOutliers).
   */
  outliers: number[];
  /** Sensors left out of the final fit by the robust refit (indices into the input). */
  dropped: number[];
  chiSquare: number;
  degreesOfFreedom: number;
  /** 1σ (68.3 %) and 2σ (95.4 %) joint regions of the free position coordinates; null when degenerate. */
  regions: { sigma1: ConfidenceRegion; sigma2: ConfidenceRegion } | null;
  /** The layout cannot fix the source (sensors on a line, too few, or a singular fit). */
  degenerate: boolean;
  /** Plain statements about the geometry and the fit. */
  notes: string[];
  iterations: number;
}

const REGION_DCHI2 = { 3: [3.53, 8.02], 2: [2.3, 6.18] } as const;
const OUTLIER_SIGMA = 3;

/**
 * The speed prior for a bath at T (K) known to `temperatureSd_K`: u2(T), with the curve's own sd
 * and |du2/dT|·σ_T added in quadrature (D&B 1998 curve and its stated uncertainty). T in 0.3 K – Tλ.
 */
export function speedPriorAt(T_K: number, temperatureSd_K: number): SpeedPrior {
  requireInRange('temperature', T_K, MODEL_MIN_K, T_LAMBDA_K, 'K');
  requireInRange('temperature sd', temperatureSd_K, 0, 1, 'K');
  const at = secondSoundUnchecked(T_K);
  return { speed_m_s: at.value, sd_m_s: Math.hypot(secondSoundSdUnchecked(T_K, at.value, at.slope), Math.abs(at.slope) * temperatureSd_K) };
}

function region(cov: Matrix, dims: 2 | 3, level: 0 | 1): ConfidenceRegion {
  const e = symmetricEigen(cov);
  const dchi = REGION_DCHI2[dims][level];
  // A constrained source moves on a surface: its Cartesian covariance has rank 2.
  const used = e.values.slice(0, dims);
  return {
    semiAxes_m: used.map((l) => Math.sqrt(Math.max(0, l) * dchi)),
    directions: e.vectors.map((row) => row.slice(0, dims)),
    deltaChiSquare: dchi,
  };
}

/** Geometry statements: sensors on a line, coplanar sensors (mirror ambiguity), too few. */
function geometryNotes(sensors: readonly Vec3[], constraint: SurfaceConstraint): { notes: string[]; degenerate: boolean } {
  const c = centroid(sensors);
  const cov = zeros(3, 3);
  for (const s of sensors) {
    const d = sub(s, c);
    for (const i of [0, 1, 2] as const) {
      for (const j of [0, 1, 2] as const) (cov[i] as number[])[j] = ((cov[i] as number[])[j] as number) + d[i] * d[j];
    }
  }
  const { values } = symmetricEigen(cov);
  const [l1 = 0, l2 = 0, l3 = 0] = values;
  const notes: string[] = [];
  let degenerate = false;
  if (l2 <= 1e-10 * l1) {
    notes.push('The sensors lie on a line: a source anywhere on a circle around that line gives the same arrival times, so its position is not determined.');
    degenerate = true;
  } else if (l3 <= 1e-10 * l1 && constraint.kind === 'none') {
    notes.push('The sensors lie in one plane: the source and its mirror image across that plane fit equally well; the result is the one on the side the fit started from. Add a sensor out of the plane or constrain the source to a surface.');
  }
  return { notes, degenerate };
}

/**
 * Locates a source from arrival times at three or more sensors (enough to leave at least one
 * degree of freedom). Throws typed errors for bad input; reports degenerate layouts in the result.
 */
export function locateSource(arrivals: readonly SensorArrival[], options: LocateOptions): LocateResult {
  requireInRange('speed', options.speed_m_s, LOCATE_SPEED_RANGE_M_S[0], LOCATE_SPEED_RANGE_M_S[1], 'm/s');
  requireInRange('arrival sd', options.arrivalSd_s, 1e-12, 10, 's');
  arrivals.forEach((a, i) => {
    a.position_m.forEach((x, k) => {
      requireInRange(`sensor ${i + 1} ${'xyz'[k]}`, x, -100, 100, 'm');
    });
    requireInRange(`sensor ${i + 1} arrival`, a.arrival_s, -1e3, 1e3, 's');
    if (a.arrivalSd_s !== undefined) requireInRange(`sensor ${i + 1} arrival sd`, a.arrivalSd_s, 1e-12, 10, 's');
  });
  const param = parametrise(options.constraint);
  const prior = options.fitSpeed ? null : (options.speedPrior ?? null);
  if (prior) {
    requireInRange('prior speed', prior.speed_m_s, LOCATE_SPEED_RANGE_M_S[0], LOCATE_SPEED_RANGE_M_S[1], 'm/s');
    requireInRange('prior speed sd', prior.sd_m_s, 1e-9, LOCATE_SPEED_RANGE_M_S[1], 'm/s');
  }
  // A prior adds the speed and one row: the count of sensors needed is that of a fixed speed.
  const free = param.dims + 1 + (options.fitSpeed ? 1 : 0);
  if (arrivals.length < free + 1) {
    throw new InvalidInputError('sensors', `need at least ${free + 1} sensors to fit ${free} unknowns with a check, got ${arrivals.length}`);
  }
  const limit = options.outlierSigma ?? OUTLIER_SIGMA;
  const all = arrivals.map((_, i) => i);
  const plain = fitOnce(arrivals, all, options, param, prior);
  // The robust fit: leave out the worst sensor and refit while one lies beyond the limit.
  let active = all;
  let result = plain;
  const dropped: number[] = [];
  for (;;) {
    const worst = result.normalisedResidualsActive.reduce((w, r, k) => (Math.abs(r) > Math.abs(result.normalisedResidualsActive[w] ?? 0) ? k : w), 0);
    const canDrop = active.length - 1 >= free + 1;
    if (!canDrop || !(Math.abs(result.normalisedResidualsActive[worst] ?? 0) > limit)) break;
    dropped.push(active[worst] as number);
    active = active.filter((_, k) => k !== worst);
    result = fitOnce(arrivals, active, options, param, prior);
  }
  // Outliers: those the robust fit left out, and any it still finds beyond the limit.
  const robust = residualsOf(arrivals, result, options);
  const outliers = all.filter((i) => dropped.includes(i) || Math.abs(robust[i] as number) > limit);
  return options.dropOutliers ? finish(arrivals, active, dropped, outliers, options, param, result, prior) : finish(arrivals, all, [], outliers, options, param, plain, prior);
}

/** Every sensor's residual over its sd under a fit (left-out sensors included). */
function residualsOf(arrivals: readonly SensorArrival[], fit: FitOnce, options: LocateOptions): number[] {
  const { x, t0, u } = unpack(fit.problem, fit.v);
  return arrivals.map((a) => (a.arrival_s - t0 - norm(sub(x, a.position_m)) / u) / (a.arrivalSd_s ?? options.arrivalSd_s));
}

interface FitOnce {
  v: number[];
  chi: number;
  iterations: number;
  problem: Problem;
  normalisedResidualsActive: number[];
}

function fitOnce(arrivals: readonly SensorArrival[], active: number[], options: LocateOptions, param: Parametrisation, prior: SpeedPrior | null): FitOnce {
  const used = active.map((i) => arrivals[i] as SensorArrival);
  const problem: Problem = {
    sensors: used.map((a) => a.position_m),
    times: used.map((a) => a.arrival_s),
    sds: used.map((a) => a.arrivalSd_s ?? options.arrivalSd_s),
    param,
    fitSpeed: options.fitSpeed || prior !== null,
    speed: options.speed_m_s,
    prior,
  };
  const best = bestFit(problem);
  const { r } = residualsAndJacobian(problem, best.v);
  return { ...best, problem, normalisedResidualsActive: r.slice(0, used.length).map((x) => -x) };
}

function finish(
  arrivals: readonly SensorArrival[],
  active: number[],
  dropped: number[],
  outliers: number[],
  options: LocateOptions,
  param: Parametrisation,
  fit: FitOnce,
  prior: SpeedPrior | null,
): LocateResult {
  const { problem, v } = fit;
  const { x, t0, u, q } = unpack(problem, v);
  const { J } = residualsAndJacobian(problem, v);
  const n = active.length + (prior ? 1 : 0);
  const dof = n - v.length;
  const inflation = Math.max(1, dof > 0 ? fit.chi / dof : 1);
  const inv = invert(multiply(transpose(J), J));
  const geometry = geometryNotes(problem.sensors, options.constraint);
  const notes = [...geometry.notes];
  let degenerate = geometry.degenerate || inv === null;
  const k = param.dims;
  let covPos: Matrix | null = null;
  let t0Sd: number | null = null;
  let uSd: number | null = null;
  if (inv) {
    const covQ = inv.slice(0, k).map((row) => row.slice(0, k).map((c) => c * inflation));
    const dxdq = param.jacobian(q);
    const candidate = multiply(multiply(dxdq, covQ), transpose(dxdq));
    const t0Var = ((inv[k] as number[])[k] as number) * inflation;
    const speedFitted = problem.fitSpeed;
    const uVar = speedFitted ? ((inv[k + 1] as number[])[k + 1] as number) * inflation : 0;
    const spread = Math.max(...problem.sensors.map((s) => norm(sub(s, centroid(problem.sensors)))));
    const largest = Math.sqrt(Math.max(0, symmetricEigen(candidate).values[0] ?? 0));
    if (![...candidate.flat(), t0Var, uVar].every(Number.isFinite)) {
      degenerate = true;
    } else if (largest > 1e3 * Math.max(spread, 1e-6)) {
      degenerate = true;
      notes.push('The fit leaves the position almost free in one direction: the layout cannot fix the source.');
    } else {
      covPos = candidate;
      t0Sd = Math.sqrt(Math.max(0, t0Var));
      if (speedFitted) uSd = Math.sqrt(Math.max(0, uVar));
    }
  }
  if (!covPos && !notes.some((n) => n.includes('cannot fix'))) notes.push('The fit is singular: the layout cannot fix the source.');
  if (inflation > 1 && !degenerate) notes.push(`The residuals scatter ${Math.sqrt(inflation).toFixed(2)}× more than the stated timing sd; the uncertainties are scaled up by that.`);
  // Residuals for every sensor, dropped ones included.
  const residuals_s = arrivals.map((a) => a.arrival_s - t0 - norm(sub(x, a.position_m)) / u);
  const normalised = residuals_s.map((r, i) => r / ((arrivals[i] as SensorArrival).arrivalSd_s ?? options.arrivalSd_s));
  const cov = covPos;
  if (prior && uSd !== null) {
    const pull = (u - prior.speed_m_s) / prior.sd_m_s;
    if (Math.abs(pull) > 3) notes.push(`The fitted speed lies ${Math.abs(pull).toFixed(1)} sd from the table's u₂: the bath temperature, the path or the arrival picks may be off, or the front is not second sound at small amplitude.`);
  }
  return {
    source_m: x,
    sourceSd_m: cov ? vec3((i) => Math.sqrt(Math.max(0, (cov[i] as number[])[i] as number))) : null,
    covariance_m2: cov,
    offset_s: t0,
    offsetSd_s: t0Sd,
    speed_m_s: u,
    speedSd_m_s: uSd,
    speedPrior: prior,
    residuals_s,
    normalisedResiduals: normalised,
    outliers,
    dropped,
    chiSquare: fit.chi,
    degreesOfFreedom: dof,
    regions: cov ? { sigma1: region(cov, param.dims, 0), sigma2: region(cov, param.dims, 1) } : null,
    degenerate,
    notes,
    iterations: fit.iterations,
  };
}

