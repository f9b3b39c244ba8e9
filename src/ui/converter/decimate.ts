/**
 * Min/max decimation for drawing a long sampled record: the view [from, to] is cut into `columns`
 * equal columns (one per pixel); each column keeps only its lowest and its highest sample, in the
 * order they occur, so every spike survives and at most two points per column are drawn. One
 * sample either side of the view is kept so the line runs to the edges. When the view holds no more
 * than two samples per column, every sample in it is returned as it is.
 *
 * (The planner's decimateSegments draws synthetic pulses on a zero baseline from uniform segments;
 * a recorded trace has its own time column and baseline, hence this function.)
 */

/** Points to draw, in time order. */
export interface DecimatedLine {
  x: number[];
  y: number[];
}

/** Index of the first element of the increasing array `a` that is ≥ `value` (a.length if none). */
export function lowerBound(a: ArrayLike<number>, value: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if ((a[mid] as number) < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * Decimates (x, y) to at most 2·columns points (+2 at the edges) over x in [from, to].
 * `x` must increase; `y` has the same length. Pure; allocates only the output.
 * On output x becomes (x − shift)·scale (e.g. shift = time zero, scale = 1e3 for milliseconds).
 */
export function decimateMinMax(x: ArrayLike<number>, y: ArrayLike<number>, from: number, to: number, columns: number, scale = 1, shift = 0): DecimatedLine {
  const out: DecimatedLine = { x: [], y: [] };
  const n = Math.min(x.length, y.length);
  if (n === 0 || !(to > from)) return out;
  const count = Math.max(1, Math.floor(columns));
  const start = lowerBound(x, from);
  let end = lowerBound(x, to);
  if (end < n && (x[end] as number) === to) end++;
  const first = Math.max(0, start - 1);
  const last = Math.min(n - 1, end);
  const push = (i: number) => {
    out.x.push(((x[i] as number) - shift) * scale);
    out.y.push(y[i] as number);
  };
  if (end - start <= 2 * count) {
    for (let i = first; i <= last; i++) push(i);
    return out;
  }
  if (first < start) push(first);
  const width = (to - from) / count;
  let column = -1;
  let iMin = -1;
  let iMax = -1;
  const flush = () => {
    if (iMin < 0) return;
    const a = Math.min(iMin, iMax);
    const b = Math.max(iMin, iMax);
    push(a);
    if (b !== a) push(b);
  };
  for (let i = start; i < end; i++) {
    const c = Math.min(count - 1, Math.floor(((x[i] as number) - from) / width));
    const v = y[i] as number;
    if (c !== column) {
      flush();
      column = c;
      iMin = i;
      iMax = i;
    } else {
      if (v < (y[iMin] as number)) iMin = i;
      if (v > (y[iMax] as number)) iMax = i;
    }
  }
  flush();
  if (last >= end) push(last);
  return out;
}
