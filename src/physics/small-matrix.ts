/*
 * Small dense matrices (a handful of rows) for least-squares fits: Gauss–Jordan inversion with
 * partial pivoting and the cyclic Jacobi eigenvalue method for symmetric matrices (Golub & Van
 * Loan, "Matrix Computations", §8.5). Matrices are arrays of rows.
 */

export type Matrix = number[][];

export function zeros(rows: number, cols: number): Matrix {
  return Array.from({ length: rows }, () => new Array<number>(cols).fill(0));
}

export function identity(n: number): Matrix {
  const m = zeros(n, n);
  for (let i = 0; i < n; i++) (m[i] as number[])[i] = 1;
  return m;
}

function at(m: Matrix, i: number, j: number): number {
  return (m[i] as number[])[j] as number;
}

export function multiply(a: Matrix, b: Matrix): Matrix {
  const n = a.length;
  const k = b.length;
  const p = (b[0] ?? []).length;
  const out = zeros(n, p);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < p; j++) {
      let s = 0;
      for (let r = 0; r < k; r++) s += at(a, i, r) * at(b, r, j);
      (out[i] as number[])[j] = s;
    }
  }
  return out;
}

export function transpose(a: Matrix): Matrix {
  const rows = a.length;
  const cols = (a[0] ?? []).length;
  return Array.from({ length: cols }, (_, j) => Array.from({ length: rows }, (_, i) => at(a, i, j)));
}

/** Inverse of a square matrix, or null when it is singular to working precision. */
export function invert(m: Matrix): Matrix | null {
  const n = m.length;
  const a = m.map((row) => [...row]);
  const inv = identity(n);
  const scale = Math.max(...m.flat().map(Math.abs), Number.MIN_VALUE);
  for (let c = 0; c < n; c++) {
    let pivot = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(at(a, r, c)) > Math.abs(at(a, pivot, c))) pivot = r;
    if (Math.abs(at(a, pivot, c)) <= 1e-14 * scale) return null;
    [a[c], a[pivot]] = [a[pivot] as number[], a[c] as number[]];
    [inv[c], inv[pivot]] = [inv[pivot] as number[], inv[c] as number[]];
    const p = at(a, c, c);
    for (let j = 0; j < n; j++) {
      (a[c] as number[])[j] = at(a, c, j) / p;
      (inv[c] as number[])[j] = at(inv, c, j) / p;
    }
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = at(a, r, c);
      if (f === 0) continue;
      for (let j = 0; j < n; j++) {
        (a[r] as number[])[j] = at(a, r, j) - f * at(a, c, j);
        (inv[r] as number[])[j] = at(inv, r, j) - f * at(inv, c, j);
      }
    }
  }
  return inv;
}

export interface Eigen {
  /** Eigenvalues, largest first. */
  values: number[];
  /** Unit eigenvectors, as columns matching `values`. */
  vectors: Matrix;
}

/** Eigen-decomposition of a symmetric matrix by cyclic Jacobi rotations. */
export function symmetricEigen(m: Matrix): Eigen {
  const n = m.length;
  const a = m.map((row) => [...row]);
  const v = identity(n);
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) off += at(a, i, j) ** 2;
    if (off < 1e-30 * Math.max(1e-300, ...a.map((row, i) => (row[i] as number) ** 2))) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = at(a, p, q);
        if (apq === 0) continue;
        const theta = (at(a, q, q) - at(a, p, p)) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = at(a, k, p);
          const akq = at(a, k, q);
          (a[k] as number[])[p] = c * akp - s * akq;
          (a[k] as number[])[q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = at(a, p, k);
          const aqk = at(a, q, k);
          (a[p] as number[])[k] = c * apk - s * aqk;
          (a[q] as number[])[k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = at(v, k, p);
          const vkq = at(v, k, q);
          (v[k] as number[])[p] = c * vkp - s * vkq;
          (v[k] as number[])[q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => at(a, j, j) - at(a, i, i));
  return {
    values: order.map((i) => at(a, i, i)),
    vectors: Array.from({ length: n }, (_, r) => order.map((i) => at(v, r, i))),
  };
}
