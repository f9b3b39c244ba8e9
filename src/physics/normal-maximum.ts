/*
 * The largest of independent normal deviates with different means and one sd: the fraction picker
 * divides by the top of a noisy pulse, i.e. by the largest of the samples near its peak.
 *  - Φ(x) from erfc by Abramowitz & Stegun (1964) 7.1.26 (absolute error below 1.5 × 10⁻⁷).
 *  - The maximum's distribution is P(max ≤ x) = Πⱼ Φ((x − μⱼ)/σ) (independent samples, the
 *    textbook order-statistics identity); its mean and variance are integrated on a grid of
 *    GRID_POINTS across ±GRID_SIGMAS σ around the largest mean. Means more than CANDIDATE_SIGMAS σ
 *    below the largest cannot win and are left out; the rest are binned to BIN_SIGMAS σ so that a
 *    flat top of thousands of samples costs no more than a sharp one.
 */

const GRID_POINTS = 241;
const GRID_SIGMAS = 7;
const CANDIDATE_SIGMAS = 6;
const BIN_SIGMAS = 0.05;

/** Standard normal cumulative distribution Φ(x) (A&S 7.1.26 through erfc; |error| < 1.5e-7). */
export function normalCdf(x: number): number {
  const z = Math.abs(x) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * z);
  const poly = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  const erfc = poly * Math.exp(-z * z);
  return x >= 0 ? 1 - erfc / 2 : erfc / 2;
}

/**
 * Mean and variance of max(μⱼ + σ·zⱼ) for independent standard normal zⱼ, in units of σ relative to
 * the largest mean: `{ meanShift, variance }` with E[max] = max μ + meanShift·σ and
 * Var[max] = variance·σ². `means` and `sd` in any one unit (sd > 0). One mean gives (0, 1);
 * 40 equal means give about (2.16, 0.26) (Tippett 1925 tables).
 */
export function normalMaximum(means: ArrayLike<number>, sd: number): { meanShift: number; variance: number } {
  let top = Number.NEGATIVE_INFINITY;
  for (let j = 0; j < means.length; j++) top = Math.max(top, means[j] as number);
  if (!(sd > 0) || !Number.isFinite(top)) return { meanShift: 0, variance: 1 };
  // Counts of candidate means per bin below the top, in σ.
  const bins = new Float64Array(Math.ceil(CANDIDATE_SIGMAS / BIN_SIGMAS) + 1);
  for (let j = 0; j < means.length; j++) {
    const d = (top - (means[j] as number)) / sd;
    if (d <= CANDIDATE_SIGMAS) {
      const b = Math.round(d / BIN_SIGMAS);
      bins[b] = (bins[b] as number) + 1;
    }
  }
  const cdf = (x: number): number => {
    let p = 1;
    for (let b = 0; b < bins.length; b++) {
      const n = bins[b] as number;
      if (n > 0) p *= normalCdf(x + b * BIN_SIGMAS) ** n;
    }
    return p;
  };
  const lo = -GRID_SIGMAS;
  const h = (2 * GRID_SIGMAS) / (GRID_POINTS - 1);
  let previous = cdf(lo);
  let m1 = 0;
  let m2 = 0;
  let mass = 0;
  for (let k = 1; k < GRID_POINTS; k++) {
    const x = lo + k * h;
    const c = cdf(x);
    const p = c - previous;
    const mid = x - h / 2;
    m1 += p * mid;
    m2 += p * mid * mid;
    mass += p;
    previous = c;
  }
  const mean = m1 / mass;
  // The grid's binning adds h²/12 to the variance (Sheppard's correction, removed).
  return { meanShift: mean, variance: Math.max(0, m2 / mass - mean * mean - (h * h) / 12) };
}
