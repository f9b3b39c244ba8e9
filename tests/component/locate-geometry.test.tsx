/**
 * Geometry behind the locate charts. The χ² distribution with 2 degrees of freedom has the CDF
 * 1 − exp(−x/2) (any statistics text, e.g. Bevington & Robinson, Data Reduction and Error
 * Analysis, ch. 11), so the regions Δχ² = 2.30 and 6.18 hold 68.3 % and 95.4 % of a 2-D Gaussian.
 */
import type { Vec3 } from '../../src/physics';
import { surfaceOutline } from '../../src/ui/locate/locate-figures';
import { boxCandidates, ELLIPSE_DCHI2, ellipseAxes, ellipsePoints, mapGrid, marginalCovariance, qualityMap } from '../../src/ui/locate/locate-geometry';
import { gaussian, seededRandom } from '../support/synthetic-trace';

describe('confidence ellipses of a projection', () => {
  it('Δχ² levels hold 68.3 % and 95.4 % for two coordinates: 1 − exp(−Δχ²/2)', () => {
    expect(1 - Math.exp(-ELLIPSE_DCHI2.sigma1 / 2)).toBeCloseTo(0.683, 3);
    expect(1 - Math.exp(-ELLIPSE_DCHI2.sigma2 / 2)).toBeCloseTo(0.9545, 3);
  });

  it('takes the marginal 2 × 2 block of the pair from the 3 × 3 covariance', () => {
    const cov = [
      [1, 0.2, 0.3],
      [0.2, 2, 0.5],
      [0.3, 0.5, 3],
    ];
    expect(marginalCovariance(cov, 'xy')).toEqual([1, 2, 0.2]);
    expect(marginalCovariance(cov, 'xz')).toEqual([1, 3, 0.3]);
    expect(marginalCovariance(cov, 'yz')).toEqual([2, 3, 0.5]);
  });

  it('semi-axes are √(λ·Δχ²) along the eigenvectors (a covariance rotated by 30°)', () => {
    const t = Math.PI / 6;
    const [l1, l2] = [9, 1];
    const p = l1 * Math.cos(t) ** 2 + l2 * Math.sin(t) ** 2;
    const q = l1 * Math.sin(t) ** 2 + l2 * Math.cos(t) ** 2;
    const r = (l1 - l2) * Math.sin(t) * Math.cos(t);
    const axes = ellipseAxes([p, q, r], 2.3);
    expect(axes.major).toBeCloseTo(3 * Math.sqrt(2.3), 12);
    expect(axes.minor).toBeCloseTo(Math.sqrt(2.3), 12);
    expect(axes.angle).toBeCloseTo(t, 12);
  });

  it('every drawn point lies on dᵀC⁻¹d = Δχ²', () => {
    const cov: [number, number, number] = [4, 1, 1.2];
    const det = cov[0] * cov[1] - cov[2] * cov[2];
    const { x, y } = ellipsePoints([10, -5], cov, 6.18);
    x.forEach((xi, i) => {
      const dx = xi - 10;
      const dy = (y[i] as number) + 5;
      expect((cov[1] * dx * dx - 2 * cov[2] * dx * dy + cov[0] * dy * dy) / det).toBeCloseTo(6.18, 9);
    });
    expect(x[0]).toBeCloseTo(x.at(-1) as number, 12);
  });

  it('a seeded 2-D Gaussian falls inside the 1σ and 2σ ellipses 68.3 % and 95.4 % of the time', () => {
    const normal = gaussian(seededRandom(7));
    const cov: [number, number, number] = [2, 0.5, 0.6];
    // Cholesky factor of [[2, 0.6], [0.6, 0.5]].
    const a = Math.sqrt(cov[0]);
    const b = cov[2] / a;
    const c = Math.sqrt(cov[1] - b * b);
    const det = cov[0] * cov[1] - cov[2] * cov[2];
    let in1 = 0;
    let in2 = 0;
    const n = 20_000;
    for (let k = 0; k < n; k++) {
      const z1 = normal();
      const z2 = normal();
      const dx = a * z1;
      const dy = b * z1 + c * z2;
      const m = (cov[1] * dx * dx - 2 * cov[2] * dx * dy + cov[0] * dy * dy) / det;
      if (m <= ELLIPSE_DCHI2.sigma1) in1++;
      if (m <= ELLIPSE_DCHI2.sigma2) in2++;
    }
    // Binomial sd at n = 20 000: 0.33 % and 0.15 %; allow about three.
    expect(Math.abs(in1 / n - 0.6827)).toBeLessThan(0.01);
    expect(Math.abs(in2 / n - 0.9545)).toBeLessThan(0.005);
  });
});

describe('surface outlines in a projection (mm)', () => {
  it('a sphere is a circle of its radius in any projection', () => {
    const o = surfaceOutline({ kind: 'sphere', centre_m: [0.01, 0.02, 0.03], radius_m: 0.1 }, 'xz');
    o?.x.forEach((x, i) => {
      expect(Math.hypot(x - 10, (o.y[i] as number) - 30)).toBeCloseTo(100, 9);
    });
  });

  it('a cylinder along z: a circle seen from above, two lines at ±R seen from the side', () => {
    const c = { kind: 'cylinder', axisPoint_m: [0, 0, 0], axisDirection: [0, 0, 3], radius_m: 0.05 } as const;
    const top = surfaceOutline(c, 'xy');
    top?.x.forEach((x, i) => {
      expect(Math.hypot(x, top.y[i] as number)).toBeCloseTo(50, 9);
    });
    const side = surfaceOutline(c, 'xz', 0.2);
    expect(side?.x.map((x) => Math.round(Math.abs(x)))).toEqual([50, 50, 50, 50, 50]);
    expect(side?.y[2]).toBeNull();
  });

  it('a plane is drawn only edge-on', () => {
    const plane = { kind: 'plane', point_m: [0, 0, 0.02], normal: [0, 0, 1] } as const;
    expect(surfaceOutline(plane, 'xy')).toBeNull();
    expect(surfaceOutline(plane, 'xz', 0.2)?.y).toEqual([20, 20]);
  });
});

describe('layout-quality map', () => {
  const FRAME: Vec3[] = [
    [0.15, 0, 0.05],
    [0, 0.15, 0.05],
    [-0.15, 0, 0.05],
    [0, -0.15, 0.05],
    [0.1, 0.1, -0.05],
    [-0.1, 0.1, -0.05],
    [-0.1, -0.1, -0.05],
    [0.1, -0.1, -0.05],
  ];
  const options = { speed_m_s: 19.9, arrivalSd_s: 1e-5, fitSpeed: false, constraint: { kind: 'none' } as const };

  it('a square grid in the chosen plane at the level of the point it passes through', () => {
    const grid = mapGrid(FRAME, [0, 0, 0.01], 'xz', 11);
    expect(grid.points).toHaveLength(121);
    expect(grid.points.every((p) => p[1] === 0)).toBe(true);
    expect(grid.level_m).toBe(0);
    expect((grid.u.at(-1) as number) - (grid.u[0] as number)).toBeCloseTo((grid.v.at(-1) as number) - (grid.v[0] as number), 12);
  });

  it('candidates lie on the faces of the widened box around the sensors', () => {
    const c = boxCandidates(FRAME, 5);
    expect(c).toHaveLength(5 ** 3 - 3 ** 3);
    expect(Math.max(...c.map((p) => p[0]))).toBeCloseTo(0.15 + 0.03, 12);
  });

  it('the best added sensor lowers the mean expected sd inside the layout', () => {
    const flat = FRAME.map((p) => [p[0], p[1], 0] as Vec3);
    const map = qualityMap(flat, [0, 0, 0.03], 'xy', options);
    expect(map.sd_m).toHaveLength(31 * 31);
    expect(map.best).not.toBeNull();
    expect(map.best?.meanSd_m).toBeLessThan(map.best?.baselineMeanSd_m ?? 0);
    // Sensors all at z = 0: the help comes from leaving that plane.
    expect(Math.abs(map.best?.position_m[2] ?? 0)).toBeGreaterThan(0.01);
  });
});
