/**
 * The figure of the "from traces" panel: every channel of the file, one above the other, each
 * decimated to min/max per pixel column (as the converter draws a trace) and scaled to its own
 * largest excursion from the baseline; time in the view's unit on the file's clock. Each pick is marked on its
 * channel by a line with its ± sd band, and by a point that names the channel, its sensor and the
 * arrival.
 */
import type { TracePick } from '../../io/trace-pick';
import { axis, baseLayout, CHART_COLOURS } from '../charts/chart-theme';
import { decimateMinMax } from '../converter/decimate';
import { formatSignificant } from '../units/format-number';
import type { TraceSamples } from '../converter/trace/trace-protocol';
import type { PlotLayout, PlotShape, PlotTrace } from '../plot/plotly-types';

/** Name of the markers trace that holds one point per picked arrival (tests read it). */
export const PICKS_TRACE = 'picked arrivals';
/** Name of a channel's pick line (shape). */
export const pickShapeName = (channel: string) => `pick:${channel}`;

/** Height of one channel's band, in band units; the excursion is drawn over this much of it. */
const EXCURSION = 0.8;
/** Pixels per channel band, and for the axes and margins, of the chart's height. */
export const BAND_PX = 34;
export const FRAME_PX = 96;

export interface TraceChannelRow {
  channel: string;
  /** The sensor the channel gives its arrival to; null when not used. */
  sensor: string | null;
  pick: TracePick | null;
}

export interface LocateTraceFigureInput {
  samples: TraceSamples;
  rows: readonly TraceChannelRow[];
  /** The span shown, s on the file's clock; null: the whole record. */
  span: [number, number] | null;
  search: { from_s: number | null; to_s: number | null };
  /** Pixel columns of the plot area. */
  columns: number;
  /** Time axis: display units per second, and the unit as printed. */
  time: { scale: number; shown: string };
}

/** The whole record, or the picks with a margin either side (a fifth of their spread, at least 0.5 ms). */
export function spanAroundPicks(samples: TraceSamples, picks: readonly (TracePick | null)[]): [number, number] | null {
  const times = picks.filter((p): p is TracePick => p !== null).map((p) => p.arrival_s);
  if (times.length === 0) return null;
  const t = samples.time_s;
  const lo = Math.min(...times);
  const hi = Math.max(...times);
  const margin = Math.max(0.2 * (hi - lo), 5e-4);
  return [Math.max(t[0] ?? lo, lo - margin), Math.min(t[t.length - 1] ?? hi, hi + margin)];
}

/** Baseline (mean of the samples before t = 0, else of the first tenth) and the largest excursion from it. */
function levelAndSize(time_s: Float64Array, values: Float32Array, pick: TracePick | null): { level: number; size: number } {
  let level = pick?.baseline.level;
  if (level === undefined) {
    let end = 0;
    while (end < time_s.length && (time_s[end] as number) < 0) end++;
    if (end < 8) end = Math.max(1, Math.floor(values.length / 10));
    let sum = 0;
    for (let i = 0; i < end; i++) sum += values[i] as number;
    level = sum / end;
  }
  let size = 0;
  for (let i = 0; i < values.length; i++) size = Math.max(size, Math.abs((values[i] as number) - level));
  return { level, size: size > 0 ? size : 1 };
}

export function locateTraceFigure({ samples, rows, span, search, columns, time }: LocateTraceFigureInput): { data: PlotTrace[]; layout: PlotLayout } {
  const t = samples.time_s;
  const [from, to] = span ?? [t[0] ?? 0, t[t.length - 1] ?? 1];
  const n = rows.length;
  const data: PlotTrace[] = [];
  const shapes: PlotShape[] = [];
  const points = { x: [] as number[], y: [] as number[], text: [] as string[], customdata: [] as string[] };
  rows.forEach((row, i) => {
    const values = samples.channels.find((c) => c.name === row.channel)?.values;
    if (!values) return;
    // The first channel on top.
    const centre = n - 1 - i;
    const { level, size } = levelAndSize(t, values, row.pick);
    const sign = row.pick ? (row.pick.peak >= 0 ? 1 : -1) : 1;
    // The baseline sits below the middle of the band for an upward pulse, above it for a downward one.
    const base = centre - (sign * EXCURSION) / 2;
    const line = decimateMinMax(t, values, from, to, columns, time.scale);
    data.push({
      type: 'scatter',
      name: row.channel,
      x: line.x,
      y: line.y.map((v) => (v === null ? null : base + (EXCURSION * (v - level)) / size)),
      mode: 'lines',
      line: { color: row.sensor ? CHART_COLOURS.secondSound : CHART_COLOURS.inkMuted, width: 1 },
      opacity: row.sensor ? 1 : 0.55,
      showlegend: false,
      hoverinfo: 'skip',
    });
    if (!row.pick) return;
    const at = row.pick.arrival_s * time.scale;
    const sd = row.pick.arrivalSd_s * time.scale;
    const y0 = centre - 0.5;
    const y1 = centre + 0.5;
    shapes.push(
      { name: `${pickShapeName(row.channel)}:sd`, type: 'rect', xref: 'x', yref: 'y', x0: at - sd, x1: at + sd, y0, y1, fillcolor: 'rgba(217, 119, 43, 0.25)', line: { width: 0 }, layer: 'below' },
      { name: pickShapeName(row.channel), type: 'line', xref: 'x', yref: 'y', x0: at, x1: at, y0, y1, line: { color: CHART_COLOURS.chosen, width: 2 }, layer: 'above' },
    );
    points.x.push(at);
    points.y.push(base + (EXCURSION * sign) / 2);
    points.text.push(`${row.channel}${row.sensor ? ` → ${row.sensor}` : ' (not used)'}`);
    points.customdata.push(`${formatSignificant(at, 7)} ${time.shown} ± ${formatSignificant(row.pick.arrivalSd_s * 1e6, 2)} µs`);
  });
  if (points.x.length > 0) {
    data.push({
      type: 'scatter',
      name: PICKS_TRACE,
      x: points.x,
      y: points.y,
      text: points.text,
      customdata: points.customdata,
      mode: 'markers',
      marker: { color: CHART_COLOURS.chosen, size: 7, symbol: 'diamond' },
      hovertemplate: '%{text}<br>%{customdata}<extra></extra>',
      showlegend: false,
    });
  }
  shapes.push({ name: 'time-zero', type: 'line', xref: 'x', yref: 'paper', x0: 0, x1: 0, y0: 0, y1: 1, line: { color: CHART_COLOURS.lambda, width: 1, dash: 'dash' }, layer: 'below' });
  if (search.from_s !== null || search.to_s !== null) {
    const lo = (search.from_s ?? 0) * time.scale;
    const hi = (search.to_s ?? (t[t.length - 1] ?? 0)) * time.scale;
    shapes.push({ name: 'search-window', type: 'rect', xref: 'x', yref: 'paper', x0: lo, x1: hi, y0: 0, y1: 1, fillcolor: 'rgba(11, 122, 118, 0.06)', line: { width: 0 }, layer: 'below' });
  }
  return {
    data,
    layout: {
      ...baseLayout(),
      margin: { l: 72, r: 16, t: 12, b: 46 },
      showlegend: false,
      xaxis: axis(`Time on the file’s clock (${time.shown})`, { range: [from * time.scale, to * time.scale] }),
      yaxis: axis('', {
        range: [-0.7, n - 0.3],
        tickvals: rows.map((_, i) => n - 1 - i),
        ticktext: rows.map((r) => r.channel),
        gridcolor: 'rgba(0,0,0,0)',
        fixedrange: true,
        ticks: '',
      }),
      shapes,
      uirevision: `locate-traces|${span === null ? 'record' : 'picks'}`,
    },
  };
}
