import type { SampledSignal } from '../../physics';

/** Points to draw: times (s) and values, same length, in time order. */
export interface DrawnLine {
  t: number[];
  v: number[];
}

/**
 * Min/max decimation for drawing a signal given as sampled segments (zero between and outside
 * them, as the planner's waveforms are). The view [from_s, to_s] is cut into `columns` equal
 * columns, one per pixel; each column keeps only its lowest and highest sample, in the order they
 * occur, so every peak survives and at most two points per column (and per segment in a column)
 * are left. The line starts and ends on the zero baseline at the view's edges when no segment
 * covers them. Pure; samples outside the view are skipped.
 */
export function decimateSegments(segments: readonly SampledSignal[], from_s: number, to_s: number, columns: number): DrawnLine {
  const out: DrawnLine = { t: [], v: [] };
  const count = Math.max(1, Math.floor(columns));
  if (!(to_s > from_s)) return out;
  const width = (to_s - from_s) / count;
  const sorted = [...segments].sort((a, b) => a.start_s - b.start_s);
  const inView = sorted.filter((s) => s.values.length > 0 && s.start_s <= to_s && s.start_s + (s.values.length - 1) * s.step_s >= from_s);
  const first = inView[0];
  if (!first || first.start_s > from_s) push(out, from_s, 0);
  for (const segment of inView) decimateOne(segment, from_s, to_s, width, count, out);
  const last = inView[inView.length - 1];
  if (!last || last.start_s + (last.values.length - 1) * last.step_s < to_s) push(out, to_s, 0);
  return out;
}

function push(out: DrawnLine, t: number, v: number): void {
  out.t.push(t);
  out.v.push(v);
}

function decimateOne(s: SampledSignal, from_s: number, to_s: number, width: number, count: number, out: DrawnLine): void {
  const n = s.values.length;
  const i0 = Math.max(0, Math.ceil((from_s - s.start_s) / s.step_s - 1e-9));
  const i1 = Math.min(n - 1, Math.floor((to_s - s.start_s) / s.step_s + 1e-9));
  let column = -1;
  let minI = -1;
  let maxI = -1;
  const flush = (): void => {
    if (minI < 0) return;
    const a = Math.min(minI, maxI);
    const b = Math.max(minI, maxI);
    push(out, s.start_s + a * s.step_s, s.values[a] as number);
    if (b !== a) push(out, s.start_s + b * s.step_s, s.values[b] as number);
  };
  for (let i = i0; i <= i1; i++) {
    const t = s.start_s + i * s.step_s;
    const c = Math.min(count - 1, Math.max(0, Math.floor((t - from_s) / width)));
    const v = s.values[i] as number;
    if (c !== column) {
      flush();
      column = c;
      minI = i;
      maxI = i;
    } else {
      if (v < (s.values[minI] as number)) minI = i;
      if (v > (s.values[maxI] as number)) maxI = i;
    }
  }
  flush();
}
