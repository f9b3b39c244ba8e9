import { InvalidInputError, requireInRange } from './errors';
import type { Vec3 } from './image-sources';
import { invert, type Matrix, multiply, symmetricEigen, transpose, zeros } from './small-matrix';

/*
 * Locating a heat source from second-sound arrival times at several sensors (multilateration).
 * Model: t_i = t0 + |x − s_i|/u. Minimise Σ_i ((t_i − t0 − |x − s_i|/u)/σ_i)² over the source
 * position x, the emission time or common offset t0, and optionally the speed u (a fitted
 * "effective speed" is common practice because strong sources often arrive early). Solver:
 * Levenberg–Marquardt (Marquardt, J. SIAM 11, 431 (1963)) with analytic Jacobian, from several
 * starts (a linearised closed-form guess when it exists, the sensors' centroid, a grid on a
 * constraining surface) to avoid wrong minima. The source may be constrained to a sphere, a
 * cylinder or a plane (a cavity wall), which leaves two free coordinates.
 * Covariance: (JᵀJ)⁻¹ of the weighted residuals, inflated by χ²/dof when that exceeds 1 (the
 * Birge ratio; common practice). Confidence regions use the χ² quantiles for the number of free
 * position coordinates (3: Δχ² = 3.53 for 68.3 %, 8.02 for 95.4 %; 2: 2.30 and 6.18).
 */

export type SurfaceConstraint =
  | { kind: 'none' }
  | { kind: 'sphere'; centre_m: Vec3; radius_m: number }
  | { kind: 'cylinder'; axisPoint_m: Vec3; axisDirection: Vec3; radius_m: number }
  | { kind: 'plane'; point_m: Vec3; normal: Vec3 };

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
  speedSd_m_s: number | null;
  residuals_s: number[];
  /** Residual over its sd, per sensor. */
  normalisedResiduals: number[];
  /** Sensors whose normalised residual exceeds the limit (indices into the input). */
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
const MAX_ITERATIONS = 200;
const OUTLIER_SIGMA = 3;

/** Builds a vector from its three components. */
function vec3(f: (k: 0 | 1 | 2) => number): Vec3 {
  return [f(0), f(1), f(2)];
}
function sub(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}
function norm(a: Vec3): number {
  return Math.sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);
}
function unit(a: Vec3, field: string): Vec3 {
  const n = norm(a);
  if (!(n > 0)) throw new InvalidInputError(field, 'needs a non-zero direction');
  return [a[0] / n, a[1] / n, a[2] / n];
}
/** Two unit vectors completing `d` to an orthonormal basis. */
function basisAround(d: Vec3): [Vec3, Vec3] {
  const helper: Vec3 = Math.abs(d[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
  const e1raw: Vec3 = [d[1] * helper[2] - d[2] * helper[1], d[2] * helper[0] - d[0] * helper[2], d[0] * helper[1] - d[1] * helper[0]];
  const e1 = unit(e1raw, 'direction');
  const e2: Vec3 = [d[1] * e1[2] - d[2] * e1[1], d[2] * e1[0] - d[0] * e1[2], d[0] * e1[1] - d[1] * e1[0]];
  return [e1, e2];
}

/** Maps the free coordinates q to a position and its Jacobian ∂x/∂q (3 × k). */
interface Parametrisation {
  dims: 2 | 3;
  position(q: readonly number[]): Vec3;
  jacobian(q: readonly number[]): Matrix;
  /** The free coordinates of the surface point nearest to x. */
  project(x: Vec3): number[];
}

function parametrise(c: SurfaceConstraint): Parametrisation {
  switch (c.kind) {
    case 'none':
      return {
        dims: 3,
        position: (q) => [q[0] as number, q[1] as number, q[2] as number],
        jacobian: () => [
          [1, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ],
        project: (x) => [...x],
      };
    case 'sphere': {
      requireInRange('sphere radius', c.radius_m, 1e-6, 100, 'm');
      const [cx, cy, cz] = c.centre_m;
      const R = c.radius_m;
      return {
        dims: 2,
        position: ([th = 0, ph = 0]) => [cx + R * Math.sin(th) * Math.cos(ph), cy + R * Math.sin(th) * Math.sin(ph), cz + R * Math.cos(th)],
        jacobian: ([th = 0, ph = 0]) => [
          [R * Math.cos(th) * Math.cos(ph), -R * Math.sin(th) * Math.sin(ph)],
          [R * Math.cos(th) * Math.sin(ph), R * Math.sin(th) * Math.cos(ph)],
          [-R * Math.sin(th), 0],
        ],
        project: (x) => {
          const d = sub(x, c.centre_m);
          const r = norm(d) || 1;
          return [Math.acos(Math.max(-1, Math.min(1, d[2] / r))), Math.atan2(d[1], d[0])];
        },
      };
    }
    case 'cylinder': {
      requireInRange('cylinder radius', c.radius_m, 1e-6, 100, 'm');
      const d = unit(c.axisDirection, 'cylinder axis');
      const [e1, e2] = basisAround(d);
      const a = c.axisPoint_m;
      const R = c.radius_m;
      return {
        dims: 2,
        position: ([ph = 0, h = 0]) => vec3((k) => a[k] + h * d[k] + R * (Math.cos(ph) * e1[k] + Math.sin(ph) * e2[k])),
        jacobian: ([ph = 0]) => ([0, 1, 2] as const).map((k) => [R * (-Math.sin(ph) * e1[k] + Math.cos(ph) * e2[k]), d[k]]),
        project: (x) => {
          const v = sub(x, a);
          const h = v[0] * d[0] + v[1] * d[1] + v[2] * d[2];
          return [Math.atan2(v[0] * e2[0] + v[1] * e2[1] + v[2] * e2[2], v[0] * e1[0] + v[1] * e1[1] + v[2] * e1[2]), h];
        },
      };
    }
    case 'plane': {
      const n = unit(c.normal, 'plane normal');
      const [e1, e2] = basisAround(n);
      const p = c.point_m;
      return {
        dims: 2,
        position: ([al = 0, be = 0]) => vec3((k) => p[k] + al * e1[k] + be * e2[k]),
        jacobian: () => ([0, 1, 2] as const).map((k) => [e1[k], e2[k]]),
        project: (x) => {
          const v = sub(x, p);
          return [v[0] * e1[0] + v[1] * e1[1] + v[2] * e1[2], v[0] * e2[0] + v[1] * e2[1] + v[2] * e2[2]];
        },
      };
    }
  }
}

interface Problem {
  sensors: Vec3[];
  times: number[];
  sds: number[];
  param: Parametrisation;
  fitSpeed: boolean;
  speed: number;
}

/** Parameter vector: q (2 or 3), t0, and u when fitted. */
function unpack(p: Problem, v: readonly number[]): { x: Vec3; t0: number; u: number; q: number[] } {
  const k = p.param.dims;
  const q = v.slice(0, k);
  return { x: p.param.position(q), t0: v[k] as number, u: p.fitSpeed ? (v[k + 1] as number) : p.speed, q };
}

function residualsAndJacobian(p: Problem, v: readonly number[]): { r: number[]; J: Matrix } {
  const { x, t0, u, q } = unpack(p, v);
  const dxdq = p.param.jacobian(q);
  const k = p.param.dims;
  const r: number[] = [];
  const J: Matrix = [];
  p.sensors.forEach((s, i) => {
    const sd = p.sds[i] as number;
    const d = sub(x, s);
    const dist = Math.max(norm(d), 1e-12);
    r.push(((p.times[i] as number) - t0 - dist / u) / sd);
    // ∂r/∂x = −(x − s)/(|x − s| u σ); chain to q.
    const g = ([0, 1, 2] as const).map((c) => -d[c] / (dist * u * sd));
    const row = Array.from({ length: k }, (_, j) => g.reduce((acc, gc, c) => acc + gc * ((dxdq[c] as number[])[j] as number), 0));
    row.push(-1 / sd);
    if (p.fitSpeed) row.push(dist / (u * u * sd));
    J.push(row);
  });
  return { r, J };
}

function chi2(r: readonly number[]): number {
  return r.reduce((a, b) => a + b * b, 0);
}

/** Levenberg–Marquardt from one start; returns the parameters, χ² and iterations. */
function levenbergMarquardt(p: Problem, start: number[]): { v: number[]; chi: number; iterations: number } {
  let v = [...start];
  let { r, J } = residualsAndJacobian(p, v);
  let chi = chi2(r);
  let lambda = 1e-3;
  let it = 0;
  for (; it < MAX_ITERATIONS; it++) {
    const Jt = transpose(J);
    const A = multiply(Jt, J);
    const g = Jt.map((row) => row.reduce((acc, x, i) => acc + x * (r[i] as number), 0));
    let improved = false;
    for (let tries = 0; tries < 20 && !improved; tries++) {
      const damped = A.map((row, i) => row.map((x, j) => (i === j ? x * (1 + lambda) + 1e-30 : x)));
      const inv = invert(damped);
      if (!inv) {
        lambda *= 10;
        continue;
      }
      const step = inv.map((row) => -row.reduce((acc, x, j) => acc + x * (g[j] as number), 0));
      const trial = v.map((x, i) => x + (step[i] as number));
      if (p.fitSpeed && !((trial[trial.length - 1] as number) > 0)) {
        lambda *= 10;
        continue;
      }
      const next = residualsAndJacobian(p, trial);
      const nextChi = chi2(next.r);
      if (nextChi < chi) {
        const small = step.every((s, i) => Math.abs(s) <= 1e-12 * Math.max(1e-9, Math.abs(v[i] as number)) + 1e-15);
        v = trial;
        r = next.r;
        J = next.J;
        const gain = chi - nextChi;
        chi = nextChi;
        lambda = Math.max(lambda / 10, 1e-12);
        improved = true;
        if (small || gain < 1e-14 * Math.max(1, chi)) return { v, chi, iterations: it + 1 };
      } else {
        lambda *= 10;
      }
    }
    if (!improved) break;
  }
  return { v, chi, iterations: it };
}

function centroid(points: readonly Vec3[]): Vec3 {
  const n = points.length;
  return vec3((k) => points.reduce((a, s) => a + s[k], 0) / n);
}

/**
 * Closed-form guess for a free source with known speed from five or more sensors:
 * |x − s_i|² = u²(t_i − t0)² is linear in (x, t0, |x|² − u²t0²).
 */
function linearGuess(p: Problem): { x: Vec3; t0: number } | null {
  if (p.sensors.length < 5) return null;
  const u2 = p.speed * p.speed;
  const A: Matrix = p.sensors.map((s, i) => [-2 * s[0], -2 * s[1], -2 * s[2], 2 * u2 * (p.times[i] as number), 1]);
  const b = p.sensors.map((s, i) => u2 * (p.times[i] as number) ** 2 - (s[0] * s[0] + s[1] * s[1] + s[2] * s[2]));
  const At = transpose(A);
  const inv = invert(multiply(At, A));
  if (!inv) return null;
  const Atb = At.map((row) => row.reduce((acc, x, i) => acc + x * (b[i] as number), 0));
  const z = inv.map((row) => row.reduce((acc, x, j) => acc + x * (Atb[j] as number), 0));
  return { x: [z[0] as number, z[1] as number, z[2] as number], t0: z[3] as number };
}

function starts(p: Problem): number[][] {
  const c = centroid(p.sensors);
  const spread = Math.max(...p.sensors.map((s) => norm(sub(s, c))), 1e-3);
  const tFirst = Math.min(...p.times);
  // The closed-form guess first: when it exists it is usually already in the right basin.
  const lin = p.param.dims === 3 ? linearGuess(p) : null;
  const guesses: Vec3[] = lin?.x.every(Number.isFinite) ? [lin.x, c] : [c];
  for (const s of p.sensors) guesses.push(vec3((k) => c[k] * 0.3 + s[k] * 0.7));
  for (const dir of [[1, 0, 0], [-1, 0, 0], [0, 1, 0], [0, -1, 0], [0, 0, 1], [0, 0, -1]] as const) {
    guesses.push([c[0] + dir[0] * spread, c[1] + dir[1] * spread, c[2] + dir[2] * spread]);
  }
  const qs: number[][] = [];
  if (p.param.dims === 3) {
    for (const g of guesses) qs.push([...g]);
  } else {
    for (const g of guesses) qs.push(p.param.project(g));
    // A coarse grid over the surface's own coordinates as well.
    const [a0 = 0, b0 = 0] = p.param.project(c);
    for (let i = 0; i < 8; i++) {
      for (let j = -2; j <= 2; j++) qs.push([a0 + (i * Math.PI) / 4, b0 + (j * spread) / 2]);
    }
  }
  return qs.map((q) => {
    const x = p.param.position(q);
    const nearest = Math.min(...p.sensors.map((s, i) => (p.times[i] as number) - norm(sub(x, s)) / p.speed));
    const t0 = Number.isFinite(nearest) ? nearest : tFirst;
    return p.fitSpeed ? [...q, t0, p.speed] : [...q, t0];
  });
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

/** Speeds of the front the location takes, m/s (wide: an effective speed may be anything sensible). */
export const LOCATE_SPEED_RANGE_M_S = [1e-3, 1e4] as const;

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
  const free = param.dims + 1 + (options.fitSpeed ? 1 : 0);
  if (arrivals.length < free + 1) {
    throw new InvalidInputError('sensors', `need at least ${free + 1} sensors to fit ${free} unknowns with a check, got ${arrivals.length}`);
  }
  const limit = options.outlierSigma ?? OUTLIER_SIGMA;
  let active = arrivals.map((_, i) => i);
  const dropped: number[] = [];
  for (;;) {
    const result = fitOnce(arrivals, active, options, param);
    const worst = result.normalisedResidualsActive.reduce((w, r, k) => (Math.abs(r) > Math.abs(result.normalisedResidualsActive[w] ?? 0) ? k : w), 0);
    const canDrop = active.length - 1 >= free + 1;
    if (options.dropOutliers && canDrop && Math.abs(result.normalisedResidualsActive[worst] ?? 0) > limit) {
      dropped.push(active[worst] as number);
      active = active.filter((_, k) => k !== worst);
      continue;
    }
    return finish(arrivals, active, dropped, options, param, result, limit);
  }
}

interface FitOnce {
  v: number[];
  chi: number;
  iterations: number;
  problem: Problem;
  normalisedResidualsActive: number[];
}

function fitOnce(arrivals: readonly SensorArrival[], active: number[], options: LocateOptions, param: Parametrisation): FitOnce {
  const used = active.map((i) => arrivals[i] as SensorArrival);
  const problem: Problem = {
    sensors: used.map((a) => a.position_m),
    times: used.map((a) => a.arrival_s),
    sds: used.map((a) => a.arrivalSd_s ?? options.arrivalSd_s),
    param,
    fitSpeed: options.fitSpeed,
    speed: options.speed_m_s,
  };
  let best: { v: number[]; chi: number; iterations: number } | null = null;
  // A fit whose χ² is within three standard deviations of its expectation is as good as the
  // data allow: later starts cannot do meaningfully better, so stop there.
  const dof = problem.sensors.length - (param.dims + 1 + (options.fitSpeed ? 1 : 0));
  const goodEnough = dof + 3 * Math.sqrt(2 * Math.max(dof, 1));
  for (const s of starts(problem)) {
    const r = levenbergMarquardt(problem, s);
    if (Number.isFinite(r.chi) && (!best || r.chi < best.chi)) best = r;
    if (best && best.chi <= goodEnough) break;
  }
  if (!best) throw new InvalidInputError('sensors', 'no start of the fit converged');
  const { r } = residualsAndJacobian(problem, best.v);
  return { ...best, problem, normalisedResidualsActive: r.map((x) => -x) };
}

function finish(
  arrivals: readonly SensorArrival[],
  active: number[],
  dropped: number[],
  options: LocateOptions,
  param: Parametrisation,
  fit: FitOnce,
  limit: number,
): LocateResult {
  const { problem, v } = fit;
  const { x, t0, u, q } = unpack(problem, v);
  const { J } = residualsAndJacobian(problem, v);
  const n = active.length;
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
    const uVar = options.fitSpeed ? ((inv[k + 1] as number[])[k + 1] as number) * inflation : 0;
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
      if (options.fitSpeed) uSd = Math.sqrt(Math.max(0, uVar));
    }
  }
  if (!covPos && !notes.some((n) => n.includes('cannot fix'))) notes.push('The fit is singular: the layout cannot fix the source.');
  if (inflation > 1 && !degenerate) notes.push(`The residuals scatter ${Math.sqrt(inflation).toFixed(2)}× more than the stated timing sd; the uncertainties are scaled up by that.`);
  // Residuals for every sensor, dropped ones included.
  const residuals_s = arrivals.map((a) => a.arrival_s - t0 - norm(sub(x, a.position_m)) / u);
  const normalised = residuals_s.map((r, i) => r / ((arrivals[i] as SensorArrival).arrivalSd_s ?? options.arrivalSd_s));
  const outliers = normalised.flatMap((r, i) => (Math.abs(r) > limit ? [i] : []));
  const cov = covPos;
  return {
    source_m: x,
    sourceSd_m: cov ? vec3((i) => Math.sqrt(Math.max(0, (cov[i] as number[])[i] as number))) : null,
    covariance_m2: cov,
    offset_s: t0,
    offsetSd_s: t0Sd,
    speed_m_s: u,
    speedSd_m_s: uSd,
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

export interface LayoutOptions {
  speed_m_s: number;
  arrivalSd_s: number;
  fitSpeed: boolean;
  constraint: SurfaceConstraint;
}

/**
 * Expected position uncertainty (m, √ of the trace of the position covariance) for a source at
 * each of `sources`, from the timing sd and the geometry alone (Jacobian at the true position).
 * Infinity where the layout cannot fix the source.
 */
export function layoutQuality(sensors: readonly Vec3[], sources: readonly Vec3[], o: LayoutOptions): number[] {
  requireInRange('speed', o.speed_m_s, LOCATE_SPEED_RANGE_M_S[0], LOCATE_SPEED_RANGE_M_S[1], 'm/s');
  requireInRange('arrival sd', o.arrivalSd_s, 1e-12, 10, 's');
  const param = parametrise(o.constraint);
  const problem: Problem = { sensors: [...sensors], times: sensors.map(() => 0), sds: sensors.map(() => o.arrivalSd_s), param, fitSpeed: o.fitSpeed, speed: o.speed_m_s };
  return sources.map((src) => {
    const q = param.project(src);
    const v = o.fitSpeed ? [...q, 0, o.speed_m_s] : [...q, 0];
    const { J } = residualsAndJacobian(problem, v);
    const inv = invert(multiply(transpose(J), J));
    if (!inv) return Number.POSITIVE_INFINITY;
    const covQ = inv.slice(0, param.dims).map((row) => row.slice(0, param.dims));
    const dxdq = param.jacobian(q);
    const cov = multiply(multiply(dxdq, covQ), transpose(dxdq));
    const trace = cov.reduce((acc, row, i) => acc + (row[i] as number), 0);
    return trace >= 0 && Number.isFinite(trace) ? Math.sqrt(trace) : Number.POSITIVE_INFINITY;
  });
}

/** How well a layout serves a region: the mean expected sd over the sources it can fix, and how many it cannot. */
export interface LayoutScore {
  /** Mean expected position sd over the sources the layout fixes, m (Infinity if it fixes none). */
  meanSd_m: number;
  /** Sources the layout cannot fix at all (sensors on a line through them, and the like). */
  unfixable: number;
}

function score(values: readonly number[]): LayoutScore {
  const finite = values.filter(Number.isFinite);
  return {
    meanSd_m: finite.length > 0 ? finite.reduce((a, b) => a + b, 0) / finite.length : Number.POSITIVE_INFINITY,
    unfixable: values.length - finite.length,
  };
}

/** True when layout score a beats b: fewer unfixable sources first, then the smaller mean sd. */
function better(a: LayoutScore, b: LayoutScore): boolean {
  return a.unfixable < b.unfixable || (a.unfixable === b.unfixable && a.meanSd_m < b.meanSd_m);
}

/**
 * Which one of `candidates`, added to the sensors, serves the region of `sources` best: first by
 * how many sources it leaves unfixable, then by the mean expected position sd over the rest.
 * Returns its index and the score before and after.
 */
export function bestAddedSensor(
  sensors: readonly Vec3[],
  candidates: readonly Vec3[],
  sources: readonly Vec3[],
  o: LayoutOptions,
): { index: number; meanSd_m: number; unfixable: number; baselineMeanSd_m: number; baselineUnfixable: number } {
  if (candidates.length === 0) throw new InvalidInputError('candidate positions', 'give at least one');
  if (sources.length === 0) throw new InvalidInputError('source positions', 'give at least one');
  const baseline = score(layoutQuality(sensors, sources, o));
  let best = { index: 0, s: { meanSd_m: Number.POSITIVE_INFINITY, unfixable: Number.POSITIVE_INFINITY } as LayoutScore };
  candidates.forEach((c, i) => {
    const s = score(layoutQuality([...sensors, c], sources, o));
    if (better(s, best.s)) best = { index: i, s };
  });
  return {
    index: best.index,
    meanSd_m: best.s.meanSd_m,
    unfixable: best.s.unfixable,
    baselineMeanSd_m: baseline.meanSd_m,
    baselineUnfixable: baseline.unfixable,
  };
}
