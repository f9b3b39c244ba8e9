/**
 * The layout-quality map of the source-location view: the expected position sd over a plane as
 * coloured squares, with the sensors and the best added sensor (colours and scale from
 * locate-figures.ts).
 */
import type { Vec3 } from '../../physics';
import { axis, baseLayout, } from '../charts/chart-theme';
import type { PlotAnnotation, PlotLayout, PlotTrace } from '../plot/plotly-types';
import { fmt, LOCATE_COLOURS, type LengthScale, MM_SCALE, TRACE_NAMES } from './locate-figures';
import type { QualityMap } from './locate-geometry';
import { AXIS_NAMES, axesOf } from './locate-inputs';

/** Colour scale of the map: teal where the layout is good, amber to rust where it is poor. */
const QUALITY_COLOURS: readonly (readonly [number, string])[] = [
  [0, '#0b6d69'],
  [0.35, '#6cc3b6'],
  [0.6, '#f1e3b5'],
  [0.8, '#e39a52'],
  [1, '#a4401f'],
];

export interface QualityFigureInput {
  map: QualityMap;
  positions: readonly Vec3[];
  labels: readonly string[];
  source: Vec3 | null;
  /** Marker size that tiles the plot area, px. */
  cellPx: number;
  /** Unit of the axes and the sd (mm when absent). */
  length?: LengthScale;
}

/** Tick values (log10 of a length) across [lo, hi]: 1, 2, 5 × 10ⁿ, or finer steps when the range is narrow. */
function logTicks(lo: number, hi: number): number[] {
  const ladders = [[1, 2, 5], [1, 1.5, 2, 3, 5, 7], [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8]];
  let out: number[] = [];
  for (const ladder of ladders) {
    out = [];
    for (let e = Math.floor(lo) - 1; e <= Math.ceil(hi) + 1; e++) {
      for (const m of ladder) {
        const v = Math.log10(m) + e;
        if (v >= lo - 1e-9 && v <= hi + 1e-9) out.push(v);
      }
    }
    if (out.length >= 4) return out;
  }
  if (out.length >= 3) return out;
  // A narrow range: even steps (0.1, 0.2, 0.25, 0.5 × 10ⁿ), about five of them.
  const from = 10 ** lo;
  const to = 10 ** hi;
  const raw = (to - from) / 5;
  const p10 = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * p10 >= raw) ?? 10) * p10;
  const linear: number[] = [];
  for (let t = Math.ceil(from / step) * step; t <= to + 1e-12; t += step) linear.push(Math.log10(t));
  return linear.length > 0 ? linear : [lo, hi];
}

/** The layout-quality map: expected position sd as coloured squares, sensors, the best added sensor. */
export function qualityFigure(q: QualityFigureInput): { data: PlotTrace[]; layout: PlotLayout } {
  const { pair, u, v } = q.map.grid;
  const { a, b } = axesOf(pair);
  const L = q.length ?? MM_SCALE;
  const mm = (m: number) => m * L.perMetre;
  const unit = L.shown;
  const d = Math.max(0, L.decimals - 1);
  const xs: number[] = [];
  const ys: number[] = [];
  const logs: number[] = [];
  const insideLogs: number[] = [];
  const texts: string[] = [];
  const bad = { x: [] as number[], y: [] as number[] };
  q.map.grid.points.forEach((p, i) => {
    const sd = q.map.sd_m[i] ?? Number.POSITIVE_INFINITY;
    const x = mm(p[a]);
    const y = mm(p[b]);
    if (!Number.isFinite(sd) || sd <= 0) {
      bad.x.push(x);
      bad.y.push(y);
      return;
    }
    xs.push(x);
    ys.push(y);
    const log = Math.log10(mm(sd));
    logs.push(log);
    if (q.map.inside[i]) insideLogs.push(log);
    texts.push(fmt(mm(sd), 2));
  });
  // The colours span the sds inside the sensors' extent; farther out they saturate.
  const sorted = [...(insideLogs.length > 0 ? insideLogs : logs)].sort((p, r) => p - r);
  const lo = sorted[Math.floor(0.02 * (sorted.length - 1))] ?? 0;
  const hi = sorted[Math.floor(0.98 * (sorted.length - 1))] ?? 1;
  const cmax = hi - lo > 0.05 ? hi : lo + 0.05;
  const ticks = logTicks(lo, cmax);
  const data: PlotTrace[] = [
    {
      type: 'scatter',
      name: TRACE_NAMES.map,
      x: xs,
      y: ys,
      mode: 'markers',
      marker: {
        symbol: 'square',
        size: q.cellPx,
        color: logs,
        colorscale: QUALITY_COLOURS,
        cmin: lo,
        cmax,
        showscale: true,
        colorbar: {
          title: { text: `expected sd (${unit})`, side: 'right' },
          tickvals: ticks,
          ticktext: ticks.map((t) => fmt(10 ** t, 2)),
          thickness: 14,
          outlinewidth: 0,
        },
        line: { width: 0 },
      },
      text: texts,
      hovertemplate: `${AXIS_NAMES[a]} %{x:.${d}f} ${unit}, ${AXIS_NAMES[b]} %{y:.${d}f} ${unit}: sd %{text} ${unit}<extra></extra>`,
      showlegend: false,
    },
  ];
  if (bad.x.length > 0) {
    data.push({
      type: 'scatter',
      name: TRACE_NAMES.unfixed,
      x: bad.x,
      y: bad.y,
      mode: 'markers',
      marker: { symbol: 'square', size: q.cellPx, color: '#d8d4ca', line: { width: 0 } },
      hovertemplate: `${AXIS_NAMES[a]} %{x:.${d}f} ${unit}, ${AXIS_NAMES[b]} %{y:.${d}f} ${unit}: the layout cannot fix a source here<extra></extra>`,
    });
  }
  data.push({
    type: 'scatter',
    name: TRACE_NAMES.sensors,
    x: q.positions.map((p) => mm(p[a])),
    y: q.positions.map((p) => mm(p[b])),
    mode: 'markers',
    marker: { symbol: 'circle', size: 9, color: '#ffffff', line: { color: LOCATE_COLOURS.sensor, width: 2 } },
    text: [...q.labels],
    hovertemplate: '%{text}<extra>sensor (projected)</extra>',
  });
  if (q.source) {
    data.push({
      type: 'scatter',
      name: TRACE_NAMES.source,
      x: [mm(q.source[a])],
      y: [mm(q.source[b])],
      mode: 'markers',
      marker: { symbol: 'star', size: 13, color: LOCATE_COLOURS.source, line: { color: '#ffffff', width: 1 } },
      hoverinfo: 'skip',
    });
  }
  const annotations: PlotAnnotation[] = [];
  const best = q.map.best;
  if (best) {
    const { c } = axesOf(pair);
    data.push({
      type: 'scatter',
      name: TRACE_NAMES.best,
      x: [mm(best.position_m[a])],
      y: [mm(best.position_m[b])],
      mode: 'markers',
      marker: { symbol: 'diamond', size: 15, color: LOCATE_COLOURS.best, line: { color: '#ffffff', width: 2 } },
      text: [`${AXIS_NAMES[c]} = ${fmt(mm(best.position_m[c]), 4)} ${unit}`],
      hovertemplate: 'add a sensor here (%{text})<extra></extra>',
      cliponaxis: false,
    });
    annotations.push({
      name: 'best-added-sensor',
      text: `add here (${AXIS_NAMES[c]} ${fmt(mm(best.position_m[c]), 3)} ${unit})`,
      xref: 'x',
      yref: 'y',
      x: mm(best.position_m[a]),
      y: mm(best.position_m[b]),
      showarrow: false,
      // Toward the middle of the map, so the words stay inside it.
      xanchor: best.position_m[a] > ((u[0] ?? 0) + (u.at(-1) ?? 0)) / 2 ? 'right' : 'left',
      yanchor: best.position_m[b] > ((v[0] ?? 0) + (v.at(-1) ?? 0)) / 2 ? 'top' : 'bottom',
      font: { size: 11, color: LOCATE_COLOURS.best },
      bgcolor: 'rgba(255,255,255,0.85)',
    });
  }
  // Half a cell beyond the outer points, so edge squares and the candidate box show whole.
  const pad = (u.length > 1 ? (u[1] as number) - (u[0] as number) : 0) * 0.6;
  const layout: PlotLayout = {
    ...baseLayout(),
    uirevision: `map-${pair}`,
    margin: { l: 60, r: 12, t: 40, b: 46 },
    xaxis: axis(`${AXIS_NAMES[a]} (${unit})`, { range: [mm((u[0] ?? 0) - pad), mm((u.at(-1) ?? 0) + pad)], constrain: 'domain' }),
    yaxis: axis(`${AXIS_NAMES[b]} (${unit})`, { range: [mm((v[0] ?? 0) - pad), mm((v.at(-1) ?? 0) + pad)], scaleanchor: 'x', scaleratio: 1, constrain: 'domain' }),
    annotations,
    showlegend: true,
  };
  return { data, layout };
}
