import { InvalidInputError } from './errors';
import type { Vec3 } from './image-sources';
import { invert, type Matrix, multiply, transpose } from './small-matrix';
import type { Parametrisation } from './surface-constraint';
import { centroid, norm, sub, vec3 } from './vector3';

/*
 * The least-squares fit behind source location: t_i = t0 + |x − s_i|/u, minimising
 * Σ ((t_i − t0 − |x − s_i|/u)/σ_i)² over the free position coordinates, t0 and optionally u, by
 * Levenberg–Marquardt (Marquardt, J. SIAM 11, 431 (1963)) with an analytic Jacobian from several
 * starts (a linearised closed-form guess when it exists, the sensors' centroid, a grid on a
 * constraining surface). A speed prior adds the row (u − u_prior)/σ_prior: the speed is then
 * fitted but held near the table's value within its own uncertainty (Gaussian prior; e.g.
 * Bevington & Robinson ch. 8 on a priori constraints in least squares).
 */

export interface SpeedPrior {
  /** Prior speed, m/s, and its one-sigma uncertainty, m/s. */
  speed_m_s: number;
  sd_m_s: number;
}

/** One fit's data: sensors, arrival times and sds, the surface, and how the speed is treated. */
export interface Problem {
  sensors: Vec3[];
  times: number[];
  sds: number[];
  param: Parametrisation;
  /** The speed is a parameter (freely, or under `prior`). */
  fitSpeed: boolean;
  /** Fixed speed, or the start of a fitted one, m/s. */
  speed: number;
  prior: SpeedPrior | null;
}

const MAX_ITERATIONS = 200;

/** Parameter vector: q (2 or 3), t0, and u when fitted. */
export function unpack(p: Problem, v: readonly number[]): { x: Vec3; t0: number; u: number; q: number[] } {
  const k = p.param.dims;
  const q = v.slice(0, k);
  return { x: p.param.position(q), t0: v[k] as number, u: p.fitSpeed ? (v[k + 1] as number) : p.speed, q };
}

/**
 * Weighted residuals r_i = (t_i − t0 − |x − s_i|/u)/σ_i and their Jacobian; with a speed prior, one
 * more row (u − u_prior)/σ_prior.
 */
export function residualsAndJacobian(p: Problem, v: readonly number[]): { r: number[]; J: Matrix } {
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
  if (p.prior) {
    r.push((u - p.prior.speed_m_s) / p.prior.sd_m_s);
    const row = new Array<number>(v.length).fill(0);
    row[v.length - 1] = 1 / p.prior.sd_m_s;
    J.push(row);
  }
  return { r, J };
}

export function chi2(r: readonly number[]): number {
  return r.reduce((a, b) => a + b * b, 0);
}

/** Levenberg–Marquardt from one start; returns the parameters, χ² and iterations. */
export function levenbergMarquardt(p: Problem, start: number[]): { v: number[]; chi: number; iterations: number } {
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

export function starts(p: Problem): number[][] {
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

/** The best of the fits from every start (stops early once χ² is as good as the data allow). */
export function bestFit(problem: Problem): { v: number[]; chi: number; iterations: number } {
  let best: { v: number[]; chi: number; iterations: number } | null = null;
  // A fit whose χ² is within three standard deviations of its expectation is as good as the
  // data allow: later starts cannot do meaningfully better, so stop there.
  const dof = problem.sensors.length - (problem.param.dims + 1 + (problem.fitSpeed && !problem.prior ? 1 : 0));
  const goodEnough = dof + 3 * Math.sqrt(2 * Math.max(dof, 1));
  for (const s of starts(problem)) {
    const r = levenbergMarquardt(problem, s);
    if (Number.isFinite(r.chi) && (!best || r.chi < best.chi)) best = r;
    if (best && best.chi <= goodEnough) break;
  }
  if (!best) throw new InvalidInputError('sensors', 'no start of the fit converged');
  return best;
}
