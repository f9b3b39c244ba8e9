/**
 * Locating a heat source from arrival times: synthetic scenarios generated here (known source,
 * seeded Gaussian timing noise) from the model t_i = t0 + |x − s_i|/u. Coverage of the stated 2σ
 * region is what any honest least-squares fit must show (e.g. Bevington & Robinson ch. 8); the
 * Δχ² levels are the χ² quantiles for 3 (or 2) free coordinates.
 */
import { describe, expect, it } from 'vitest';
import { bestAddedSensor, type LocateResult, layoutQuality, locateSource, type SensorArrival, type SurfaceConstraint, type Vec3 } from '../../src/physics';
import { invert } from '../../src/physics/small-matrix';
import { SCENARIO_SENSORS as SENSORS, SCENARIO_U2_M_S as U2 } from '../support/locate-scenario';
import { gaussian, seededRandom } from '../support/synthetic-trace';

const SD = 5e-6; // s, timing sd

/** Length of the per-coordinate sd vector; the fit must have fixed the source. */
function sdOf(r: LocateResult): number {
  if (!r.sourceSd_m) throw new Error('the fit reported a degenerate layout');
  return Math.hypot(...r.sourceSd_m);
}

function dist(a: Vec3, b: Vec3): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

function arrivals(source: Vec3, sensors: readonly Vec3[], speed: number, noise: () => number, t0 = 1e-4): SensorArrival[] {
  return sensors.map((s) => ({ position_m: s, arrival_s: t0 + dist(s, source) / speed + SD * noise() }));
}

/** (x − x̂)ᵀ C⁻¹ (x − x̂) over the free directions (the covariance may have rank 2 on a surface). */
function mahalanobis(truth: Vec3, found: Vec3, cov: number[][], dims: 2 | 3, directions: number[][]): number {
  const d = [0, 1, 2].map((k) => (truth[k as 0] as number) - (found[k as 0] as number));
  // Project onto the region's own axes (columns of `directions`).
  const coords = Array.from({ length: dims }, (_, j) => d.reduce((acc, x, i) => acc + x * ((directions[i] as number[])[j] as number), 0));
  const sub = Array.from({ length: dims }, (_, a) =>
    Array.from({ length: dims }, (_, b) => {
      let s = 0;
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) s += ((directions[i] as number[])[a] as number) * ((cov[i] as number[])[j] as number) * ((directions[j] as number[])[b] as number);
      return s;
    }),
  );
  const inv = invert(sub);
  if (!inv) return Number.POSITIVE_INFINITY;
  let m = 0;
  for (let a = 0; a < dims; a++) for (let b = 0; b < dims; b++) m += (coords[a] as number) * ((inv[a] as number[])[b] as number) * (coords[b] as number);
  return m;
}

describe('multilateration on synthetic scenarios', () => {
  it('recovers the source within the stated 2σ region in at least 95 % of 1000 seeded trials', () => {
    const normal = gaussian(seededRandom(2024));
    const random = seededRandom(99);
    let inside = 0;
    const trials = 1000;
    for (let k = 0; k < trials; k++) {
      const source: Vec3 = [(random() - 0.5) * 0.1, (random() - 0.5) * 0.1, random() * 0.15];
      const r = locateSource(arrivals(source, SENSORS, U2, normal), { speed_m_s: U2, fitSpeed: false, arrivalSd_s: SD, constraint: { kind: 'none' }, dropOutliers: false });
      if (!r.covariance_m2 || !r.regions) throw new Error('degenerate fit in a well-spread layout');
      const m = mahalanobis(source, r.source_m, r.covariance_m2, 3, r.regions.sigma2.directions);
      if (m <= r.regions.sigma2.deltaChiSquare) inside++;
    }
    expect(inside / trials).toBeGreaterThanOrEqual(0.95);
  });

  it('a fitted speed recovers a known effective speed (strong sources arrive early)', () => {
    const normal = gaussian(seededRandom(5));
    const effective = 21.3;
    const source: Vec3 = [0.01, 0.02, 0.06];
    const r = locateSource(arrivals(source, SENSORS, effective, normal), { speed_m_s: U2, fitSpeed: true, arrivalSd_s: SD, constraint: { kind: 'none' }, dropOutliers: false });
    expect(Math.abs((r.speed_m_s - effective) / (r.speedSd_m_s as number))).toBeLessThan(3);
    expect(r.speedSd_m_s as number).toBeLessThan(0.5);
    expect(dist(r.source_m, source)).toBeLessThan(3 * sdOf(r));
  });

  it('a source on a sphere (a cavity wall) is found on that sphere', () => {
    const normal = gaussian(seededRandom(8));
    const R = 0.1;
    const theta = 1.1;
    const phi = 0.7;
    const source: Vec3 = [R * Math.sin(theta) * Math.cos(phi), R * Math.sin(theta) * Math.sin(phi), R * Math.cos(theta)];
    const sensors: Vec3[] = [[0.15, 0, 0], [0, 0.15, 0], [-0.15, 0, 0], [0, -0.15, 0], [0, 0, 0.15], [0.1, 0.1, 0.1]];
    const constraint: SurfaceConstraint = { kind: 'sphere', centre_m: [0, 0, 0], radius_m: R };
    const r = locateSource(arrivals(source, sensors, U2, normal), { speed_m_s: U2, fitSpeed: false, arrivalSd_s: SD, constraint, dropOutliers: false });
    expect(Math.abs(Math.hypot(...r.source_m) - R)).toBeLessThan(1e-9);
    expect(dist(r.source_m, source)).toBeLessThan(4 * sdOf(r));
    expect(r.regions?.sigma1.semiAxes_m.length).toBe(2);
  });

  it('a source on a cylinder is found on that cylinder', () => {
    const normal = gaussian(seededRandom(13));
    const R = 0.05;
    const source: Vec3 = [R * Math.cos(2.0), R * Math.sin(2.0), 0.08];
    const sensors: Vec3[] = [[0.08, 0, 0], [-0.08, 0, 0.05], [0, 0.08, 0.1], [0, -0.08, 0.15], [0.06, 0.06, 0.2], [-0.06, -0.06, 0.02]];
    const constraint: SurfaceConstraint = { kind: 'cylinder', axisPoint_m: [0, 0, 0], axisDirection: [0, 0, 1], radius_m: R };
    const r = locateSource(arrivals(source, sensors, U2, normal), { speed_m_s: U2, fitSpeed: false, arrivalSd_s: SD, constraint, dropOutliers: false });
    expect(Math.abs(Math.hypot(r.source_m[0], r.source_m[1]) - R)).toBeLessThan(1e-9);
    expect(dist(r.source_m, source)).toBeLessThan(4 * sdOf(r));
  });

  it('an outlier sensor is flagged, and the robust refit drops it', () => {
    const normal = gaussian(seededRandom(21));
    const source: Vec3 = [0.02, -0.01, 0.05];
    const data = arrivals(source, SENSORS, U2, normal);
    const bad = data[4] as SensorArrival;
    data[4] = { ...bad, arrival_s: bad.arrival_s + 200e-6 };
    const plain = locateSource(data, { speed_m_s: U2, fitSpeed: false, arrivalSd_s: SD, constraint: { kind: 'none' }, dropOutliers: false });
    expect(plain.outliers).toContain(4);
    const robust = locateSource(data, { speed_m_s: U2, fitSpeed: false, arrivalSd_s: SD, constraint: { kind: 'none' }, dropOutliers: true });
    expect(robust.dropped).toEqual([4]);
    expect(dist(robust.source_m, source)).toBeLessThan(4 * sdOf(robust));
    expect(Math.abs(robust.normalisedResiduals[4] as number)).toBeGreaterThan(10);
  });
});

describe('degenerate layouts are reported, not hidden', () => {
  it('sensors on a line', () => {
    const line: Vec3[] = [0, 1, 2, 3, 4].map((i) => [0.05 * i, 0, 0]);
    const data = line.map((s) => ({ position_m: s, arrival_s: dist(s, [0.1, 0.05, 0.02]) / U2 }));
    const r = locateSource(data, { speed_m_s: U2, fitSpeed: false, arrivalSd_s: SD, constraint: { kind: 'none' }, dropOutliers: false });
    expect(r.degenerate).toBe(true);
    expect(r.notes.join(' ')).toMatch(/on a line/);
    expect(r.sourceSd_m).toBeNull();
    expect(r.regions).toBeNull();
  });

  it('coplanar sensors: the mirror ambiguity is stated', () => {
    const flat: Vec3[] = [[0.1, 0, 0], [-0.1, 0, 0], [0, 0.1, 0], [0, -0.1, 0], [0.07, 0.07, 0], [-0.05, 0.08, 0]];
    const data = flat.map((s) => ({ position_m: s, arrival_s: dist(s, [0.01, 0.02, 0.05]) / U2 }));
    const r = locateSource(data, { speed_m_s: U2, fitSpeed: false, arrivalSd_s: SD, constraint: { kind: 'none' }, dropOutliers: false });
    expect(r.notes.join(' ')).toMatch(/mirror/);
    expect(Math.abs(r.source_m[2])).toBeCloseTo(0.05, 6);
  });

  it('too few sensors for the unknowns is refused with the count needed', () => {
    const data = SENSORS.slice(0, 4).map((s) => ({ position_m: s, arrival_s: 0.005 }));
    expect(() => locateSource(data, { speed_m_s: U2, fitSpeed: true, arrivalSd_s: SD, constraint: { kind: 'none' }, dropOutliers: false })).toThrow(/at least 6 sensors/);
  });
});

describe('layout quality before cooldown', () => {
  const options = { speed_m_s: U2, arrivalSd_s: SD, fitSpeed: false, constraint: { kind: 'none' } as const };

  it('the expected uncertainty matches the scatter of repeated fits (seeded Monte Carlo)', () => {
    const source: Vec3 = [0.02, 0.01, 0.07];
    const [expected] = layoutQuality(SENSORS, [source], options);
    const normal = gaussian(seededRandom(3));
    let sq = 0;
    const n = 300;
    for (let k = 0; k < n; k++) {
      const r = locateSource(arrivals(source, SENSORS, U2, normal), { ...options, dropOutliers: false });
      sq += dist(r.source_m, source) ** 2;
    }
    expect(Math.sqrt(sq / n) / (expected as number)).toBeGreaterThan(0.85);
    expect(Math.sqrt(sq / n) / (expected as number)).toBeLessThan(1.15);
  });

  it('sensors on a line cannot fix a source: infinite expected uncertainty', () => {
    const line: Vec3[] = [0, 1, 2, 3, 4].map((i) => [0.05 * i, 0, 0]);
    expect(layoutQuality(line, [[0.1, 0.05, 0.02]], options)[0]).toBe(Number.POSITIVE_INFINITY);
  });

  it('the best added sensor is the one off the plane of a flat layout', () => {
    const flat: Vec3[] = [[0.1, 0, 0], [-0.1, 0, 0], [0, 0.1, 0], [0, -0.1, 0], [0.07, 0.07, 0]];
    const sources: Vec3[] = [[0, 0, 0.05], [0.02, 0.03, 0.08], [-0.03, 0.01, 0.1]];
    const candidates: Vec3[] = [[0.12, 0.02, 0], [0, 0, 0.2], [-0.08, -0.08, 0]];
    const best = bestAddedSensor(flat, candidates, sources, options);
    expect(best.index).toBe(1);
    expect(best.meanSd_m).toBeLessThan(best.baselineMeanSd_m);
  });
});

describe('best added sensor with sources the layout cannot fix', () => {
  it('prefers the candidate that fixes every source, then the smaller mean sd', () => {
    const options = { speed_m_s: U2, arrivalSd_s: SD, fitSpeed: false, constraint: { kind: 'none' } as const };
    const line: Vec3[] = [0, 1, 2, 3].map((i) => [0.05 * i, 0, 0]);
    // Sensors on a line fix no source. Adding one on the line changes nothing; adding one off it
    // makes the layout planar: sources off that plane become fixable, those in it stay unfixable.
    const sources: Vec3[] = [[0.07, 0, 0], [0.05, 0.05, 0.05]];
    const candidates: Vec3[] = [[0.2, 0, 0], [0.05, 0.1, -0.03]];
    const best = bestAddedSensor(line, candidates, sources, options);
    expect(best.baselineUnfixable).toBe(2);
    expect(best.index).toBe(1);
    expect(best.unfixable).toBe(1);
    expect(Number.isFinite(best.meanSd_m)).toBe(true);
  });
});
