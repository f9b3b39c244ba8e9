/**
 * The live chart of a followed run: the chosen temperature against minutes since the first file,
 * decimated to the chart's width (min/max per column, decimate.ts) so 10 000 files draw as fast as
 * a few hundred; files past a turn of u₂ as their two undecided continuations; the alarm band
 * shaded; each alarm crossing marked with a point and a line. Pure; temperatures in kelvin (the
 * caller converts the axis with temperatureOnY).
 */
import { chosenTemperature, type WatchRow } from '../../../io/watch-series';
import { CHART_COLOURS } from '../../charts/chart-theme';
import type { PlotLayout, PlotShape, PlotTrace } from '../../plot/plotly-types';
import { temperatureSeriesLayout } from '../batch-results';
import { decimateMinMax } from '../decimate';
import type { AlarmState, BandAlarm } from './watch-alarms';

/** Colour of alarm marks (ours: a brick red that reads in both themes). */
export const ALARM_COLOUR = '#b3362c';
/** Names tests and readers of the figure find. */
export const WATCH_TRACE = 'Chosen temperature';
export const CROSSING_TRACE = 'Alarm began';
export const BAND_SHAPE = 'alarm-band';
export const CROSSING_SHAPE = 'alarm-crossing';
/** Most crossings drawn as lines (all are in the table). */
const CROSSING_LINES = 60;
/** Most undecided continuations drawn as points. */
const UNDECIDED_POINTS = 2000;

export interface WatchFigureInput {
  rows: readonly WatchRow[];
  alarms: AlarmState;
  band: BandAlarm | null;
  /** Chart width in columns (pixels). */
  columns: number;
}

/** Time of the first file (ms), the origin of the x axis; null for none. */
export function originOf(rows: readonly WatchRow[]): number | null {
  let t0 = Number.POSITIVE_INFINITY;
  for (const r of rows) if (r.time_ms < t0) t0 = r.time_ms;
  return Number.isFinite(t0) ? t0 : null;
}

/** Points (minutes, T) sorted by time: files may arrive out of the order of their timestamps. */
function sorted(x: number[], y: number[]): { x: number[]; y: number[] } {
  let ordered = true;
  for (let i = 1; i < x.length && ordered; i++) ordered = (x[i] as number) >= (x[i - 1] as number);
  if (ordered) return { x, y };
  const idx = x.map((_, i) => i).sort((a, b) => (x[a] as number) - (x[b] as number));
  return { x: idx.map((i) => x[i] as number), y: idx.map((i) => y[i] as number) };
}

export function watchFigure({ rows, alarms, band, columns }: WatchFigureInput): { data: PlotTrace[]; layout: PlotLayout; drawn: number } {
  const t0 = originOf(rows) ?? 0;
  const minutes = (r: WatchRow) => (r.time_ms - t0) / 60_000;
  const cx: number[] = [];
  const cy: number[] = [];
  const ux: number[] = [];
  const ua: number[] = [];
  const ub: number[] = [];
  const mx: number[] = [];
  const my: number[] = [];
  const mText: string[] = [];
  for (const r of rows) {
    const T = chosenTemperature(r).temperature_K;
    if (T !== null) {
      cx.push(minutes(r));
      cy.push(T);
      const marks = alarms.marks.get(r.seq);
      if (marks?.some((m) => m.crossing)) {
        mx.push(minutes(r));
        my.push(T);
        mText.push(marks.map((m) => m.message).join('; '));
      }
    } else if (r.ambiguous && ux.length < UNDECIDED_POINTS) {
      const a = r.candidates[r.ambiguous.alternatives[0]];
      const b = r.candidates[r.ambiguous.alternatives[1]];
      if (a && b) {
        ux.push(minutes(r));
        ua.push(a.temperature_K);
        ub.push(b.temperature_K);
      }
    }
  }
  const line = sorted(cx, cy);
  const width = Math.max(50, Math.floor(columns));
  const from = line.x[0] ?? 0;
  const to = line.x[line.x.length - 1] ?? 1;
  const many = line.x.length > 2 * width;
  const drawnLine = many ? decimateMinMax(line.x, line.y, from, to + 1e-9, width) : line;
  const data: PlotTrace[] = [
    {
      type: 'scatter',
      name: WATCH_TRACE,
      x: drawnLine.x,
      y: drawnLine.y,
      mode: many ? 'lines' : 'lines+markers',
      line: { color: CHART_COLOURS.chosen, width: 1.5 },
      marker: { color: CHART_COLOURS.chosen, size: 5 },
      hovertemplate: '%{y:.4f} K<extra>%{x:.2f} min</extra>',
    },
  ];
  if (ux.length > 0) {
    data.push(
      { type: 'scatter', name: 'Undecided (past a turn of u₂)', x: ux, y: ua, mode: 'markers', marker: { color: CHART_COLOURS.inkMuted, size: 5, symbol: 'circle-open' }, legendgroup: 'undecided', hovertemplate: '%{y:.4f} K<extra>one continuation (undecided)</extra>' },
      { type: 'scatter', name: 'Undecided, other continuation', x: ux, y: ub, mode: 'markers', marker: { color: CHART_COLOURS.inkMuted, size: 5, symbol: 'diamond-open' }, legendgroup: 'undecided', showlegend: false, hovertemplate: '%{y:.4f} K<extra>other continuation (undecided)</extra>' },
    );
  }
  if (mx.length > 0) {
    data.push({
      type: 'scatter',
      name: CROSSING_TRACE,
      x: mx,
      y: my,
      mode: 'markers',
      marker: { color: ALARM_COLOUR, size: 11, symbol: 'x-thin-open', line: { color: ALARM_COLOUR, width: 2.5 } },
      text: mText,
      hovertemplate: '%{text}<extra>alarm</extra>',
    });
  }
  const shapes: PlotShape[] = [];
  if (band) {
    shapes.push({ name: BAND_SHAPE, type: 'rect', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: band.low_K, y1: band.high_K, fillcolor: 'rgba(11, 122, 118, 0.12)', line: { color: 'rgba(11, 122, 118, 0.55)', width: 1, dash: 'dot' }, layer: 'below' });
  }
  for (const x of mx.slice(-CROSSING_LINES)) {
    shapes.push({ name: CROSSING_SHAPE, type: 'line', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: ALARM_COLOUR, width: 1, dash: 'dash' }, layer: 'below' });
  }
  const title = rows.length > 0 ? `Minutes since ${new Date(t0).toISOString().replace(/\.000Z$/, 'Z').replace('T', ' ')}` : 'Minutes';
  return { data, layout: { ...temperatureSeriesLayout(title), shapes }, drawn: drawnLine.x.length };
}
