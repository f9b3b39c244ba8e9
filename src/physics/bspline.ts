import type { SplineData } from './reference-splines';

/** Value and first derivative of a curve at one point. */
export interface ValueAndSlope {
  value: number;
  slope: number;
}

/**
 * A cubic B-spline on a clamped knot vector, evaluated with de Boor's algorithm
 * (C. de Boor, "A Practical Guide to Splines", Springer 1978, ch. X).
 * Built once per curve; evaluation allocates nothing.
 * The caller checks the range; outside it the end polynomial pieces are extended.
 */
export class CubicBSpline {
  readonly min: number;
  readonly max: number;
  private readonly t: Float64Array;
  private readonly c: Float64Array;
  /** Index of the last knot interval that has positive length (for x at the right end). */
  private readonly lastSpan: number;
  private readonly firstSpan = 3;
  /** Working values of de Boor's triangle, reused so evaluation allocates nothing. */
  private readonly scratch = new Float64Array(4);

  constructor(data: SplineData) {
    this.t = Float64Array.from(data.knots);
    this.c = Float64Array.from(data.coefficients);
    if (this.c.length !== this.t.length - 4) {
      throw new Error(`spline has ${this.c.length} coefficients for ${this.t.length} knots`);
    }
    this.min = data.range[0];
    this.max = data.range[1];
    let last = this.c.length - 1;
    while (last > this.firstSpan && !((this.t[last + 1] as number) > (this.t[last] as number))) last--;
    this.lastSpan = last;
  }

  /** Knot span index k with t[k] ≤ x < t[k+1] (clamped to the spline's spans). */
  private span(x: number): number {
    const t = this.t;
    let lo = this.firstSpan;
    let hi = this.lastSpan;
    if (x >= (t[hi] as number)) return hi;
    if (x < (t[lo + 1] as number)) return lo;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (x >= (t[mid] as number)) lo = mid;
      else hi = mid;
    }
    return lo;
  }

  /** Spline value at x. */
  value(x: number): number {
    return this.deBoor(x, this.span(x), 3, false);
  }

  /** Spline value and first derivative at x. */
  valueAndSlope(x: number): ValueAndSlope {
    const k = this.span(x);
    return { value: this.deBoor(x, k, 3, false), slope: this.deBoor(x, k, 2, true) };
  }

  /**
   * de Boor's recurrence on knot span k. With `derivative`, it runs on the derivative spline:
   * degree 2, coefficients 3(c_i − c_{i−1})/(t_{i+3} − t_i) on the inner knots.
   */
  private deBoor(x: number, k: number, degree: 2 | 3, derivative: boolean): number {
    const t = this.t;
    const c = this.c;
    const d = this.scratch;
    for (let j = 0; j <= degree; j++) {
      const i = k - degree + j;
      if (derivative) {
        const h = (t[i + 3] as number) - (t[i] as number);
        d[j] = h > 0 ? (3 * ((c[i] as number) - (c[i - 1] as number))) / h : 0;
      } else {
        d[j] = c[i] as number;
      }
    }
    for (let r = 1; r <= degree; r++) {
      for (let j = degree; j >= r; j--) {
        const i = k - degree + j;
        const left = t[i] as number;
        const right = t[i + degree + 1 - r] as number;
        const alpha = right > left ? (x - left) / (right - left) : 0;
        d[j] = (1 - alpha) * (d[j - 1] as number) + alpha * (d[j] as number);
      }
    }
    return d[degree] as number;
  }
}
