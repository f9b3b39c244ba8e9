/*
 * Symmetric positive definite systems of a few unknowns (the normal equations of a least-squares
 * fit), row-major in Float64Arrays: Cholesky factorisation, a solve, and an inverse equilibrated
 * first (parameters whose scales differ by many orders). Null, never a guess, when the matrix is
 * not positive definite. (Golub & Van Loan, Matrix Computations, §4.2.)
 */

/** Solves A x = b for symmetric positive definite A (row-major m×m) by Cholesky; null if A is not. */
export function solveSymmetric(a: Float64Array, b: Float64Array, m: number): Float64Array | null {
  const l = cholesky(a, m);
  if (!l) return null;
  const x = Float64Array.from(b);
  for (let i = 0; i < m; i++) {
    let sum = x[i] as number;
    for (let k = 0; k < i; k++) sum -= (l[i * m + k] as number) * (x[k] as number);
    x[i] = sum / (l[i * m + i] as number);
  }
  for (let i = m - 1; i >= 0; i--) {
    let sum = x[i] as number;
    for (let k = i + 1; k < m; k++) sum -= (l[k * m + i] as number) * (x[k] as number);
    x[i] = sum / (l[i * m + i] as number);
  }
  return x;
}

function cholesky(a: Float64Array, m: number): Float64Array | null {
  const l = new Float64Array(m * m);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = a[i * m + j] as number;
      for (let k = 0; k < j; k++) sum -= (l[i * m + k] as number) * (l[j * m + k] as number);
      if (i === j) {
        if (!(sum > 0)) return null;
        l[i * m + i] = Math.sqrt(sum);
      } else l[i * m + j] = sum / (l[j * m + j] as number);
    }
  }
  return l;
}

/** The inverse of a symmetric positive definite matrix (row-major), or null. */
export function invertSymmetric(a: Float64Array): Float64Array | null {
  const m = Math.round(Math.sqrt(a.length));
  // Equilibrate first: the parameters' scales differ by many orders.
  const d = new Float64Array(m);
  for (let i = 0; i < m; i++) d[i] = 1 / Math.sqrt(a[i * m + i] as number);
  const scaled = new Float64Array(m * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) scaled[i * m + j] = (a[i * m + j] as number) * (d[i] as number) * (d[j] as number);
  const out = new Float64Array(m * m);
  for (let col = 0; col < m; col++) {
    const e = new Float64Array(m);
    e[col] = 1;
    const x = solveSymmetric(scaled, e, m);
    if (!x) return null;
    for (let row = 0; row < m; row++) out[row * m + col] = (x[row] as number) * (d[row] as number) * (d[col] as number);
  }
  return out;
}

