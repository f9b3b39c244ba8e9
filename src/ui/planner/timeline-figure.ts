/**
 * The timeline of one heater pulse as a Plotly figure: the heater's flux on top, the predicted
 * δT at each sensor below, vertical markers where first sound, second sound and each echo arrive,
 * and the digitiser's record window shaded. Pure: built from a PlanResult, no DOM.
 */
import type { PlanResult, SampledSignal, SensorPlanResult } from '../../physics';
import { axis, baseLayout, CHART_COLOURS } from '../charts/chart-theme';
import type { PlotAnnotation, PlotLayout, PlotShape, PlotTrace } from '../plot/plotly-types';
import type { TimelineView } from './planner-slice';
import { decimateSegments } from './decimate';
import { type DisplayUnit, inUnit, LADDERS, unitForColumn } from '../units/ladders';
import { PLANNER_COLOURS, sensorColour } from './planner-colours';

/** The time axis before a unit is chosen. */
const MILLISECONDS: DisplayUnit = { shown: 'ms', unit: 'ms' };
/**
 * Points of all sensors' waveforms together (about two per column each): up to 12 sensors get a
 * column per pixel of a wide chart; more share it. Common practice, no source: chosen so the
 * largest plan's timeline draws in tens of milliseconds (tests/bench/keystroke-limits.browser.ts).
 */
const SENSOR_POINT_BUDGET = 24_000;
/**
 * Echo arrivals marked on the timeline, all sensors together: each marker is an SVG element the
 * page draws and paints on its main thread (a keystroke waits behind a redraw), and the largest plan
 * has thousands of echoes in view. Each sensor gets its earliest echoes, at least
 * MIN_ECHOES_PER_SENSOR; the caption says how many are marked.
 */
export const ECHO_MARK_BUDGET = 600;
export const MIN_ECHOES_PER_SENSOR = 4;
/** Fewest columns a sensor's waveform is cut to. */
const MIN_SENSOR_COLUMNS = 120;
/** Fraction of the plot height given to the sensors (bottom) and the heater (top). */
const SENSOR_DOMAIN: [number, number] = [0, 0.76];
const HEATER_DOMAIN: [number, number] = [0.84, 1];

/** One entry of the chart's key. */
export interface TimelineKeyEntry {
  label: string;
  colour: string;
  /** How the entry is drawn: a line, a filled pulse, or an arrival line with its marker. */
  kind: 'line' | 'fill' | 'first sound' | 'second sound' | 'echo';
}

export interface TimelineFigure {
  data: PlotTrace[];
  /** The key: heater, each sensor in its colour, the three kinds of arrival line. */
  key: TimelineKeyEntry[];
  layout: PlotLayout;
  /** Time span shown, s. */
  range_s: [number, number];
  /** Unit of the δT axis. */
  amplitudeUnit: DisplayUnit;
  /** Echo arrivals in the span shown, and how many of them are marked (each sensor's earliest, within the budget). */
  echoes: { inView: number; shown: number };
}

/** End of the segment of `waveform` that holds time t (or t itself). */
function segmentEnd(waveform: readonly SampledSignal[], t: number): number {
  const segment = waveform.find((s) => s.start_s <= t && t <= s.start_s + (s.values.length - 1) * s.step_s);
  return segment ? segment.start_s + (segment.values.length - 1) * segment.step_s : t;
}

function lastSampleTime(waveform: readonly SampledSignal[]): number {
  return Math.max(0, ...waveform.map((s) => s.start_s + (s.values.length - 1) * s.step_s));
}

/** The time span each view shows, s. */
export function timelineRange(result: PlanResult, view: TimelineView): [number, number] {
  const sensors = result.sensors;
  const duration = result.heater.duration_s;
  const firstSound = Math.max(...sensors.map((s) => s.firstSoundArrival_s));
  if (view === 'early') {
    const to = Math.max(firstSound, duration) * 1.6;
    return [-0.08 * to, to];
  }
  if (view === 'record') {
    const lastSignal = Math.max(firstSound, ...sensors.map((s) => lastSampleTime(s.waveform)));
    const from = Math.min(result.record.start_s, 0);
    const to = Math.max(result.record.end_s, lastSignal);
    const pad = 0.02 * (to - from);
    return [from - pad, to + pad];
  }
  const directEnds = sensors.map((s) => (s.secondSoundArrival_s === null ? s.firstSoundArrival_s + duration : segmentEnd(s.waveform, s.secondSoundArrival_s)));
  // Rounded up to a tidy span, so the axis holds still while a value is being typed.
  const to = tidyCeil(Math.max(duration, ...directEnds) * 1.08);
  return [-0.05 * to, to];
}

/** The smallest of 1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8 × 10ⁿ at or above x (x > 0). */
export function tidyCeil(x: number): number {
  const power = 10 ** Math.floor(Math.log10(x));
  const mantissa = x / power;
  const step = [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10].find((k) => k >= mantissa * (1 - 1e-12)) ?? 10;
  return step * power;
}

type ArrivalKind = 'first sound' | 'second sound' | 'echo';
const ARRIVAL_KINDS: readonly ArrivalKind[] = ['first sound', 'second sound', 'echo'];
const ARRIVAL_LEGEND: Record<ArrivalKind, string> = { 'first sound': 'First sound', 'second sound': 'Second sound', echo: 'Echoes' };

interface Arrival {
  kind: ArrivalKind;
  t_s: number;
  detail: string;
}

function arrivalsOf(sensor: SensorPlanResult): Arrival[] {
  const list: Arrival[] = [{ kind: 'first sound', t_s: sensor.firstSoundArrival_s, detail: 'first sound' }];
  if (sensor.secondSoundArrival_s !== null) list.push({ kind: 'second sound', t_s: sensor.secondSoundArrival_s, detail: 'second sound' });
  for (const echo of sensor.echoes) {
    const path = echo.path.length > 0 ? ` via ${echo.path.join(' → ')}` : '';
    list.push({ kind: 'echo', t_s: echo.arrival_s, detail: `echo, order ${echo.order}${path}` });
  }
  return list;
}

const MARKER_STYLE = {
  'first sound': { dash: 'dot', width: 1.2, symbol: 'triangle-down-open', colour: 'rgba(74, 92, 156, 0.75)' },
  'second sound': { dash: 'solid', width: 1.3, symbol: 'triangle-down', colour: 'rgba(16, 34, 58, 0.55)' },
  echo: { dash: 'dash', width: 1, symbol: 'diamond-open', colour: 'rgba(90, 110, 138, 0.55)' },
} as const;

function peakOf(sensor: SensorPlanResult): { min: number; max: number } {
  let min = 0;
  let max = 0;
  for (const s of sensor.waveform) {
    for (const v of s.values) {
      if (v < min) min = v;
      if (v > max) max = v;
    }
  }
  return { min, max };
}

/**
 * The figure for a plan result. `columns` is the plot's width in pixels: each waveform is cut to
 * at most about two points per pixel column before Plotly sees it. Times are shown in `timeUnit`
 * (the header's chosen unit).
 */
export function timelineFigure(result: PlanResult, view: TimelineView, columns: number, timeUnit: DisplayUnit = MILLISECONDS): TimelineFigure {
  const [from, to] = timelineRange(result, view);
  // Many sensors share the columns: the chart draws on the page's main thread, and its time grows
  // with the points, so a crowded plan's waveforms are cut coarser (never below MIN_SENSOR_COLUMNS).
  const sensorColumns = Math.max(MIN_SENSOR_COLUMNS, Math.min(columns, Math.floor(SENSOR_POINT_BUDGET / (2 * Math.max(1, result.sensors.length)))));
  const inTime = (t_s: number) => inUnit(t_s, timeUnit);
  const tu = timeUnit.shown;
  const peaks = result.sensors.map(peakOf);
  const amplitudeUnit = unitForColumn(
    peaks.flatMap((p) => [p.min, p.max]),
    LADDERS.temperatureDifference,
  );
  const scale = (v: number) => inUnit(v, amplitudeUnit);
  const lowest = scale(Math.min(0, ...peaks.map((p) => p.min)));
  const highest = scale(Math.max(...peaks.map((p) => p.max)));
  // Tidy limits too: the δT axis only moves when the peaks change noticeably.
  const high = highest > 0 ? tidyCeil(highest * 1.2) : 1;
  const low = lowest < 0 ? -tidyCeil(-lowest * 1.1) : 0;
  const span = high - low;
  const yRange: [number, number] = [low - 0.06 * span, high];
  const markerY = yRange[1] - 0.06 * (yRange[1] - yRange[0]);

  const heaterLine = decimateSegments([result.heaterPulse], from, to, columns);
  const data: PlotTrace[] = [
    {
      type: 'scatter',
      name: 'Heater flux',
      x: heaterLine.t.map(inTime),
      y: heaterLine.v,
      mode: 'lines',
      yaxis: 'y2',
      fill: 'tozeroy',
      fillcolor: PLANNER_COLOURS.heaterFill,
      line: { color: PLANNER_COLOURS.heater, width: 1.4 },
      hovertemplate: `t = %{x:.4g} ${tu}<br>heater at %{y:.0%} of peak<extra></extra>`,
    },
  ];
  const shapes: PlotShape[] = [recordWindow(result, inTime)];
  const marks: { t: number; colour: string; symbol: string; text: string }[] = [];
  const lines: Record<ArrivalKind, number[]> = { 'first sound': [], 'second sound': [], echo: [] };
  let echoesInView = 0;
  let echoesShown = 0;
  result.sensors.forEach((sensor, i) => {
    const colour = sensorColour(i);
    const line = decimateSegments(sensor.waveform, from, to, sensorColumns);
    const name = `${sensor.label} (${sensor.id})`;
    data.push({
      type: 'scatter',
      name,
      legendgroup: sensor.id,
      x: line.t.map(inTime),
      y: line.v.map(scale),
      mode: 'lines',
      line: { color: colour, width: 1.6 },
      hovertemplate: `${escapeHover(sensor.id)}: t = %{x:.4g} ${tu}, δT = %{y:.3g} ${amplitudeUnit.shown}<extra></extra>`,
    });
    const inView = arrivalsOf(sensor).filter((a) => a.t_s >= from && a.t_s <= to);
    // Each sensor's earliest echoes, up to its share of the budget (the markers are SVG elements).
    const echoes = inView.filter((a) => a.kind === 'echo').sort((x, y) => x.t_s - y.t_s);
    const echoShare = Math.max(MIN_ECHOES_PER_SENSOR, Math.floor(ECHO_MARK_BUDGET / Math.max(1, result.sensors.length)));
    echoesInView += echoes.length;
    const keptEchoes = new Set(echoes.slice(0, echoShare));
    echoesShown += keptEchoes.size;
    const arrivals = inView.filter((a) => a.kind !== 'echo' || keptEchoes.has(a));
    for (const a of arrivals) {
      marks.push({ t: inTime(a.t_s), colour, symbol: MARKER_STYLE[a.kind].symbol, text: `${escapeHover(sensor.id)} · ${a.detail}: ${formatTime(a.t_s, timeUnit)}` });
      lines[a.kind].push(inTime(a.t_s));
    }
  });

  // The vertical arrival lines: one trace per kind (a few traces draw much faster than dozens of
  // shapes); the coloured marker on top of each line says which sensor it belongs to.
  for (const kind of ARRIVAL_KINDS) {
    const times = lines[kind];
    const style = MARKER_STYLE[kind];
    data.push({
      type: 'scatter',
      name: ARRIVAL_LEGEND[kind],
      legendgroup: `arrivals-${kind}`,
      x: times.flatMap((t) => [t, t, t]),
      y: times.flatMap(() => [yRange[0], markerY, null]),
      mode: 'lines',
      line: { color: style.colour, width: style.width, dash: style.dash },
      hoverinfo: 'skip',
      connectgaps: false,
    });
  }

  // Every arrival's marker in one trace, in its sensor's colour, with the arrival in the hover text.
  data.push({
    type: 'scatter',
    name: 'Arrivals',
    showlegend: false,
    x: marks.map((m) => m.t),
    y: marks.map(() => markerY),
    mode: 'markers',
    marker: { color: marks.map((m) => m.colour), size: 9, symbol: marks.map((m) => m.symbol), line: { color: marks.map((m) => m.colour), width: 1.2 } },
    text: marks.map((m) => m.text),
    hovertemplate: '%{text}<extra></extra>',
    cliponaxis: false,
  });

  const layout: PlotLayout = {
    ...baseLayout(),
    margin: { l: 64, r: 16, t: 8, b: 46 },
    dragmode: 'zoom',
    // The key is drawn in HTML beside the chart (TimelineKey): cheaper to redraw while typing.
    showlegend: false,
    xaxis: axis(`Time after the heater pulse starts (${tu})`, { range: [inTime(from), inTime(to)], fixedrange: true, anchor: 'y', zeroline: true }),
    yaxis: axis(`δT at sensor (${amplitudeUnit.shown})`, { domain: SENSOR_DOMAIN, range: yRange, anchor: 'x' }),
    yaxis2: axis('Heater', { domain: HEATER_DOMAIN, range: [0, 1.15], anchor: 'x', showticklabels: false, fixedrange: true, ticks: '' }),
    shapes,
    annotations: recordLabels(result, from, to, inTime),
  };
  const key: TimelineKeyEntry[] = [
    { label: 'Heater flux', colour: PLANNER_COLOURS.heater, kind: 'fill' },
    ...result.sensors.map((sensor, i): TimelineKeyEntry => ({ label: `${sensor.label} (${sensor.id})`, colour: sensorColour(i), kind: 'line' })),
    ...ARRIVAL_KINDS.map((kind): TimelineKeyEntry => ({ label: ARRIVAL_LEGEND[kind], colour: MARKER_STYLE[kind].colour, kind })),
  ];
  return { data, key, layout, range_s: [from, to], amplitudeUnit, echoes: { inView: echoesInView, shown: echoesShown } };
}

function recordWindow(result: PlanResult, inTime: (t_s: number) => number): PlotShape {
  return {
    name: 'record-window',
    type: 'rect',
    xref: 'x',
    yref: 'paper',
    x0: inTime(result.record.start_s),
    x1: inTime(result.record.end_s),
    y0: 0,
    y1: 1,
    fillcolor: PLANNER_COLOURS.recordFill,
    line: { color: PLANNER_COLOURS.recordEdge, width: 1, dash: 'dot' },
    layer: 'below',
  };
}

/** "record starts" / "record ends" labels where the window's edges are in view. */
function recordLabels(result: PlanResult, from: number, to: number, inTime: (t_s: number) => number): PlotAnnotation[] {
  const labels: PlotAnnotation[] = [];
  const edge = (name: string, t: number, text: string, xanchor: 'left' | 'right', y: number): PlotAnnotation => ({
    name,
    text,
    xref: 'x',
    yref: 'paper',
    x: inTime(t),
    y,
    xanchor,
    yanchor: 'top',
    showarrow: false,
    font: { size: 11, color: CHART_COLOURS.secondSound },
  });
  // Each label sits to the right of its edge, one above the other, so they never overlap.
  if (result.record.start_s > from && result.record.start_s < to) labels.push(edge('record-start', result.record.start_s, ' record starts', 'left', 1));
  if (result.record.end_s > from && result.record.end_s < to) labels.push(edge('record-end', result.record.end_s, ' record ends', 'left', 0.93));
  return labels;
}

/** A time for hover text and summaries, four digits, in `unit` (default: ms, or µs below 1 ms). */
export function formatTime(t_s: number, unit?: DisplayUnit): string {
  const shown = unit ?? (Math.abs(t_s) >= 1e-3 ? MILLISECONDS : { shown: 'µs', unit: 'µs' });
  return `${Number(inUnit(t_s, shown).toPrecision(4))} ${shown.shown}`;
}

/** Plotly hover text treats < and > as markup; user labels must not. */
function escapeHover(text: string): string {
  return text.replace(/</g, '‹').replace(/>/g, '›');
}
