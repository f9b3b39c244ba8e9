import { type Problem, residualsAndJacobian } from './arrival-fit';
import { InvalidInputError, requireInRange } from './errors';
import type { Vec3 } from './image-sources';
import { LOCATE_SPEED_RANGE_M_S } from './locate-limits';
import { invert, multiply, transpose } from './small-matrix';
import { insideBody, parametrise, type SurfaceConstraint } from './surface-constraint';

/*
 * How well a layout of sensors can locate a source, from the timing sd and the geometry alone
 * (the Jacobian of the arrival-time model at the source), and which one added sensor would help
 * most — among the places a sensor can actually go.
 */

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
  const problem: Problem = { sensors: [...sensors], times: sensors.map(() => 0), sds: sensors.map(() => o.arrivalSd_s), param, fitSpeed: o.fitSpeed, speed: o.speed_m_s, prior: null };
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
 * Where an added sensor may go: outside the body of a sphere or cylinder (a sensor cannot sit in
 * the cavity or on its beam axis), and inside a box the user gives. Null parts do not restrict.
 */
export interface SensorPlacement {
  body: SurfaceConstraint | null;
  box: { min_m: Vec3; max_m: Vec3 } | null;
}

/** True when a sensor can go at `p` under `placement`. */
export function sensorPlaceAllowed(p: Vec3, placement: SensorPlacement): boolean {
  if (placement.body && insideBody(p, placement.body)) return false;
  const box = placement.box;
  if (box && !([0, 1, 2] as const).every((k) => p[k] >= box.min_m[k] && p[k] <= box.max_m[k])) return false;
  return true;
}

/**
 * Which one of `candidates`, added to the sensors, serves the region of `sources` best: first by
 * how many sources it leaves unfixable, then by the mean expected position sd over the rest.
 * Only candidates a sensor can go to under `placement` are weighed (default: anywhere).
 * Returns its index (into `candidates`) and the score before and after; throws
 * InvalidInputError when no candidate is allowed.
 */
export function bestAddedSensor(
  sensors: readonly Vec3[],
  candidates: readonly Vec3[],
  sources: readonly Vec3[],
  o: LayoutOptions,
  placement: SensorPlacement = { body: null, box: null },
): { index: number; meanSd_m: number; unfixable: number; baselineMeanSd_m: number; baselineUnfixable: number } {
  if (candidates.length === 0) throw new InvalidInputError('candidate positions', 'give at least one');
  if (sources.length === 0) throw new InvalidInputError('source positions', 'give at least one');
  const allowed = candidates.flatMap((c, i) => (sensorPlaceAllowed(c, placement) ? [i] : []));
  if (allowed.length === 0) {
    throw new InvalidInputError('candidate positions', 'none lies where a sensor can go (outside the body, inside the region given); widen the region');
  }
  const baseline = score(layoutQuality(sensors, sources, o));
  let best = { index: allowed[0] as number, s: { meanSd_m: Number.POSITIVE_INFINITY, unfixable: Number.POSITIVE_INFINITY } as LayoutScore };
  for (const i of allowed) {
    const s = score(layoutQuality([...sensors, candidates[i] as Vec3], sources, o));
    if (better(s, best.s)) best = { index: i, s };
  }
  return {
    index: best.index,
    meanSd_m: best.s.meanSd_m,
    unfixable: best.s.unfixable,
    baselineMeanSd_m: baseline.meanSd_m,
    baselineUnfixable: baseline.unfixable,
  };
}
