import { InvalidInputError } from './errors';

/*
 * Least-squares parabola y = a + b·u + c·u² through points (u, y), with the covariance of its
 * coefficients for a given noise sd, and its vertex with the vertex's sd by first-order error
 * propagation (standard weighted least squares; e.g. Bevington & Robinson ch. 7).
 */

export interface Parabola {
  a: number;
  b: number;
  c: number;
  /** Inverse normal matrix (covariance per unit noise variance) of (a, b, c). */
  inverse: number[][];
  /** Root-mean-square residual. */
  rms: number;
  n: number;
}

function invert3(m: number[][]): number[][] {
  const g = (i: number, j: number) => m[i]?.[j] ?? 0;
  const det =
    g(0, 0) * (g(1, 1) * g(2, 2) - g(1, 2) * g(2, 1)) -
    g(0, 1) * (g(1, 0) * g(2, 2) - g(1, 2) * g(2, 0)) +
    g(0, 2) * (g(1, 0) * g(2, 1) - g(1, 1) * g(2, 0));
  if (!(Math.abs(det) > 0)) throw new InvalidInputError('points', 'do not fix a parabola (too few distinct positions)');
  const cof = (i: number, j: number) => {
    const r = [0, 1, 2].filter((k) => k !== i);
    const c = [0, 1, 2].filter((k) => k !== j);
    const [r0, r1] = r as [number, number];
    const [c0, c1] = c as [number, number];
    return ((i + j) % 2 === 0 ? 1 : -1) * (g(r0, c0) * g(r1, c1) - g(r0, c1) * g(r1, c0));
  };
  return [0, 1, 2].map((i) => [0, 1, 2].map((j) => cof(j, i) / det));
}

/** Fits y = a + b u + c u² to at least three points at distinct u. */
export function fitParabola(u: ArrayLike<number>, y: ArrayLike<number>): Parabola {
  const n = u.length;
  if (n < 3) throw new InvalidInputError('points', `a parabola needs at least 3, got ${n}`);
  const S = [0, 0, 0, 0, 0];
  const Sy = [0, 0, 0];
  for (let i = 0; i < n; i++) {
    const ui = u[i] as number;
    const yi = y[i] as number;
    let p = 1;
    for (let k = 0; k < 5; k++) {
      S[k] = (S[k] as number) + p;
      if (k < 3) Sy[k] = (Sy[k] as number) + yi * p;
      p *= ui;
    }
  }
  const s = (k: number) => S[k] as number;
  const inverse = invert3([
    [s(0), s(1), s(2)],
    [s(1), s(2), s(3)],
    [s(2), s(3), s(4)],
  ]);
  const [a, b, c] = [0, 1, 2].map((i) => [0, 1, 2].reduce((acc, j) => acc + (inverse[i]?.[j] ?? 0) * (Sy[j] as number), 0)) as [number, number, number];
  let sq = 0;
  for (let i = 0; i < n; i++) {
    const ui = u[i] as number;
    sq += ((y[i] as number) - a - b * ui - c * ui * ui) ** 2;
  }
  const rms = Math.sqrt(sq / n);
  if (![a, b, c, rms, ...inverse.flat()].every(Number.isFinite)) {
    throw new InvalidInputError('points', 'do not fix a parabola (positions too close together or values not finite)');
  }
  return { a, b, c, inverse, rms, n };
}

export interface Vertex {
  u: number;
  y: number;
  uSd: number;
  ySd: number;
}

/** Vertex (u*, y*) of a fitted parabola and their sds for noise sd σ on each y. */
export function parabolaVertex(p: Parabola, sigma: number): Vertex {
  const u = -p.b / (2 * p.c);
  const y = p.a - (p.b * p.b) / (4 * p.c);
  const cov = (i: number, j: number) => sigma * sigma * (p.inverse[i]?.[j] ?? 0);
  // Gradients of u* and y* with respect to (a, b, c).
  const gu = [0, -1 / (2 * p.c), p.b / (2 * p.c * p.c)];
  const gy = [1, -p.b / (2 * p.c), (p.b * p.b) / (4 * p.c * p.c)];
  const variance = (g: number[]) => {
    let v = 0;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) v += (g[i] as number) * (g[j] as number) * cov(i, j);
    return Math.max(0, v);
  };
  return { u, y, uSd: Math.sqrt(variance(gu)), ySd: Math.sqrt(variance(gy)) };
}
