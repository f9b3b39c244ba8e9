/**
 * Geometry for the source-location charts: confidence ellipses of a projection, the grid of the
 * layout-quality map and the candidate positions for one more sensor. Pure functions, SI units.
 */
import { bestAddedSensor, type LayoutOptions, layoutQuality, type SensorPlacement, sensorPlaceAllowed, type Vec3 } from '../../physics';
import { axesOf, type PlanePair } from './locate-inputs';

/**
 * Δχ² of the joint regions of two coordinates (χ² quantiles for 2 degrees of freedom):
 * 68.27 % → 2.30, 95.45 % → 6.18 (−2 ln(1 − p); any table of the χ² distribution).
 */
export const ELLIPSE_DCHI2 = { sigma1: 2.3, sigma2: 6.18 } as const;

/** The 2 × 2 covariance of the pair's two coordinates (the marginal of the 3 × 3 covariance). */
export function marginalCovariance(cov: readonly (readonly number[])[], pair: PlanePair): [number, number, number] {
  const { a, b } = axesOf(pair);
  const at = (i: number, j: number) => cov[i]?.[j] ?? 0;
  return [at(a, a), at(b, b), (at(a, b) + at(b, a)) / 2];
}

/** Semi-axes (largest first) and the angle of the major axis of the region Δχ² = `dchi2`. */
export function ellipseAxes([p, q, r]: readonly [number, number, number], dchi2: number): { major: number; minor: number; angle: number } {
  const mean = (p + q) / 2;
  const half = Math.sqrt(((p - q) / 2) ** 2 + r * r);
  const l1 = Math.max(0, mean + half);
  const l2 = Math.max(0, mean - half);
  return { major: Math.sqrt(l1 * dchi2), minor: Math.sqrt(l2 * dchi2), angle: 0.5 * Math.atan2(2 * r, p - q) };
}

/** Points of the closed ellipse around `centre` (the pair's two coordinates), `n` segments. */
export function ellipsePoints(centre: readonly [number, number], cov2: readonly [number, number, number], dchi2: number, n = 96): { x: number[]; y: number[] } {
  const { major, minor, angle } = ellipseAxes(cov2, dchi2);
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const x: number[] = [];
  const y: number[] = [];
  for (let k = 0; k <= n; k++) {
    const t = (2 * Math.PI * k) / n;
    const u = major * Math.cos(t);
    const v = minor * Math.sin(t);
    x.push(centre[0] + u * c - v * s);
    y.push(centre[1] + u * s + v * c);
  }
  return { x, y };
}

/** The pair's two coordinates of a point. */
export function project(p: Vec3, pair: PlanePair): [number, number] {
  const { a, b } = axesOf(pair);
  return [p[a], p[b]];
}

/** A square grid in the pair's plane through `through`, covering `points` with a margin. */
export interface MapGrid {
  pair: PlanePair;
  /** The coordinate held fixed (the third one), m. */
  level_m: number;
  /** Grid lines along the pair's first and second axes, m. */
  u: number[];
  v: number[];
  /** Every grid point in 3-D, row by row (v outer, u inner). */
  points: Vec3[];
}

export function mapGrid(points: readonly Vec3[], through: Vec3, pair: PlanePair, n: number): MapGrid {
  const { a, b, c } = axesOf(pair);
  const all = points.length > 0 ? points : [through];
  const span = (k: 0 | 1 | 2) => {
    const xs = all.map((p) => p[k]);
    return [Math.min(...xs, through[k]), Math.max(...xs, through[k])] as const;
  };
  const [a0, a1] = span(a);
  const [b0, b1] = span(b);
  const half = Math.max(a1 - a0, b1 - b0, 0.01) * 0.53;
  const ca = (a0 + a1) / 2;
  const cb = (b0 + b1) / 2;
  const line = (centre: number) => Array.from({ length: n }, (_, i) => centre - half + (2 * half * i) / (n - 1));
  const u = line(ca);
  const v = line(cb);
  const pointsOut: Vec3[] = [];
  for (const vb of v) {
    for (const ua of u) {
      const p: [number, number, number] = [0, 0, 0];
      p[a] = ua;
      p[b] = vb;
      p[c] = through[c];
      pointsOut.push(p);
    }
  }
  return { pair, level_m: through[c], u, v, points: pointsOut };
}

/**
 * Candidate places for one more sensor: a grid on the faces of the box around the sensors,
 * widened by a tenth of its largest side (at least 10 mm), `perEdge` points along each edge.
 */
export function boxCandidates(sensors: readonly Vec3[], perEdge: number, padded = true): Vec3[] {
  if (sensors.length === 0) return [];
  const lo = [0, 1, 2].map((k) => Math.min(...sensors.map((s) => s[k as 0])));
  const hi = [0, 1, 2].map((k) => Math.max(...sensors.map((s) => s[k as 0])));
  const pad = padded ? Math.max(0.01, 0.1 * Math.max(...hi.map((h, k) => h - (lo[k] ?? 0)))) : 0;
  const ticks = [0, 1, 2].map((k) => {
    const from = (lo[k] ?? 0) - pad;
    const to = (hi[k] ?? 0) + pad;
    return Array.from({ length: perEdge }, (_, i) => from + ((to - from) * i) / (perEdge - 1));
  });
  const out: Vec3[] = [];
  const [tx = [], ty = [], tz = []] = ticks;
  tx.forEach((x, i) => {
    ty.forEach((y, j) => {
      tz.forEach((z, k) => {
        const onFace = [i, j, k].some((idx) => idx === 0 || idx === perEdge - 1);
        if (onFace) out.push([x, y, z]);
      });
    });
  });
  return out;
}

/** The layout-quality map and the best place for one more sensor. */
export interface QualityMap {
  grid: MapGrid;
  /** Expected position sd at each grid point, m; Infinity where the layout cannot fix a source. */
  sd_m: number[];
  /** Grid points within the sensors' extent in this plane: where a source is looked for. */
  inside: boolean[];
  /** The candidate that helps most, with the mean sd inside before and after; null if none helps. */
  best: { position_m: Vec3; meanSd_m: number; baselineMeanSd_m: number } | null;
  candidates: number;
}

/** Grid points per side of the map, and per edge of the candidate box. */
export const MAP_POINTS_PER_SIDE = 31;
export const CANDIDATES_PER_EDGE = 5;
/** Most grid points that count toward the best added sensor (cost: candidates × sources layouts, ~30 µs each). */
const MAX_BEST_SOURCES = 36;

/**
 * The map over the pair's plane through `through` (covering the sensors and the candidate box),
 * and the candidate that lowers the mean expected sd most over the points inside the sensors'
 * extent in that plane (all points when the sensors have no extent there).
 */
export function qualityMap(sensors: readonly Vec3[], through: Vec3, pair: PlanePair, o: LayoutOptions, placement: SensorPlacement = { body: null, box: null }): QualityMap {
  // Candidates on a box around the sensors (or the user's region), only where a sensor can go.
  const candidates = (placement.box ? boxCandidates([placement.box.min_m, placement.box.max_m], CANDIDATES_PER_EDGE, false) : boxCandidates(sensors, CANDIDATES_PER_EDGE)).filter((c) =>
    sensorPlaceAllowed(c, placement),
  );
  const grid = mapGrid([...sensors, ...candidates], through, pair, MAP_POINTS_PER_SIDE);
  const sd_m = sensors.length === 0 ? grid.points.map(() => Number.POSITIVE_INFINITY) : layoutQuality(sensors, grid.points, o);
  const { a, b } = axesOf(pair);
  const extent = (k: 0 | 1 | 2) => [Math.min(...sensors.map((s) => s[k])), Math.max(...sensors.map((s) => s[k]))] as const;
  const [a0, a1] = extent(a);
  const [b0, b1] = extent(b);
  const flat = !(a1 - a0 > 1e-9 && b1 - b0 > 1e-9);
  const inside = grid.points.map((p) => flat || (p[a] >= a0 && p[a] <= a1 && p[b] >= b0 && p[b] <= b1));
  // Sources for the comparison sit a fraction of a cell off the grid, so none lands exactly on a
  // plane of symmetry of the layout, where the sd is infinite and would swamp every mean.
  const cellA = (grid.u[1] ?? 0) - (grid.u[0] ?? 0);
  const cellB = (grid.v[1] ?? 0) - (grid.v[0] ?? 0);
  const insidePoints = grid.points.filter((_, i) => inside[i]);
  const stride = Math.max(1, Math.ceil(insidePoints.length / MAX_BEST_SOURCES));
  const sources = insidePoints
    .filter((_, i) => i % stride === Math.floor(stride / 2))
    .map((p) => {
      const q: [number, number, number] = [p[0], p[1], p[2]];
      q[a] += 0.37 * cellA;
      q[b] += 0.29 * cellB;
      return q;
    });
  let best: QualityMap['best'] = null;
  if (candidates.length > 0 && sources.length > 0) {
    const found = bestAddedSensor(sensors, candidates, sources, o, placement);
    const position = candidates[found.index];
    const improves = found.unfixable < found.baselineUnfixable || (found.unfixable === found.baselineUnfixable && found.meanSd_m < found.baselineMeanSd_m);
    if (position && Number.isFinite(found.meanSd_m) && improves) {
      best = { position_m: position, meanSd_m: found.meanSd_m, baselineMeanSd_m: found.baselineMeanSd_m };
    }
  }
  return { grid, sd_m, inside, best, candidates: candidates.length };
}

/** The median of a list (the middle value, or the mean of the two middle values). */
export function median(xs: readonly number[]): number {
  const sorted = [...xs].sort((p, q) => p - q);
  const mid = Math.floor(sorted.length / 2);
  if (sorted.length === 0) return Number.NaN;
  return sorted.length % 2 === 1 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}
