/**
 * The resolution map: how finely one time-of-flight reading pins the bath temperature, over
 * temperature × heater–sensor distance, for one sensor's timing and distance uncertainties.
 *
 * At distance d the travel time is t = d/u2 (the sensor lag delays the reading but is no part of the
 * path, so the timing's relative share uses t alone), and σ_u/u = √((σ_d(d)/d)² + (σ_t/t)²), with
 * σ_d(d) = √(σ_meas² + (d·σ_ε)²) when the distance was measured warm (σ_ε: the spacer's
 * contraction sd) — the same sum the planner uses for each sensor. The kernel's temperatureSpread
 * turns that into σ_T, including the curvature bound near the extremes of u2, and flags the
 * "insensitive" spots there. σ_T falls steadily with d at each temperature, so each iso-line
 * σ_T = L is one distance per temperature, found by log–log interpolation on the grid. Filled
 * bands between iso-lines draw the map (the basic Plotly bundle has no heatmap).
 */
import { SECOND_SOUND_EXTREMA, secondSound, secondSoundSlope, T_LAMBDA_K, temperatureSpread } from '../../physics';
import { axis, baseLayout, CHART_COLOURS } from '../charts/chart-theme';
import type { PlotAnnotation, PlotLayout, PlotShape, PlotTrace } from '../plot/plotly-types';
import { type DisplayUnit, inUnit, LADDERS, messageText, plainNumber, readText, temperatureText } from '../units/ladders';
import { bandColours, PLANNER_COLOURS } from './planner-colours';

/** Temperatures shown, K: from where second sound is a measured wave well into He II, up to just below Tλ. */
export const MAP_TEMPERATURE_RANGE_K: [number, number] = [0.6, 2.17];
/** Distances shown, m (log axis). */
export const MAP_DISTANCE_RANGE_M: [number, number] = [1e-3, 0.3];
const TEMPERATURE_STEP_K = 0.0025;
const DISTANCE_POINTS = 36;
/** Candidate iso-levels, K: 1–3 steps from 1 µK to 1 K. */
const CANDIDATE_LEVELS_K = [1e-6, 3e-6, 1e-5, 3e-5, 1e-4, 3e-4, 1e-3, 3e-3, 1e-2, 3e-2, 1e-1, 3e-1, 1];
const MAX_LEVELS = 9;

/** What the map depends on: one sensor's uncertainties (SI). */
export interface MapSensor {
  /** One-sigma timing of one averaged reading, s. */
  timingSd_s: number;
  /** One-sigma of the distance as measured (scaled to cold), m. */
  distanceSd_m: number;
  /** Relative sd of the spacer contraction when measured warm (0 otherwise). */
  contractionSd: number;
  /** Sensor lag, s: kept with the sensor, not added to the travel time (it is no part of the path). */
  lag_s: number;
}

export interface MapGrid {
  temperature_K: number[];
  distance_m: number[];
  /** sd_K[i][j] at temperature i, distance j. */
  sd_K: number[][];
  insensitive: boolean[][];
  /**
   * At each temperature, the distance up to which a reading is insensitive (the flag flips there,
   * found by bisection between grid points); null where it is insensitive nowhere on the grid.
   */
  insensitiveUpTo_m: (number | null)[];
}

/** Bisection steps for the insensitive edge: 2^-12 of a grid step in log distance. */
const EDGE_BISECTIONS = 12;

/** σ_T (K) and the insensitive flag at one temperature and distance, from the kernel. */
export function spreadAt(T: number, d: number, sensor: MapSensor, at = { value: secondSound(T), slope: secondSoundSlope(T) }) {
  const transit = d / at.value;
  const distanceSd = Math.hypot(sensor.distanceSd_m, d * sensor.contractionSd);
  const relative = Math.min(1, Math.hypot(distanceSd / d, sensor.timingSd_s / transit));
  return temperatureSpread(T, relative, at);
}

function logSpace(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => a * (b / a) ** (i / (n - 1)));
}

/** The grid behind the map: σ_T at every temperature (2.5 mK steps) and distance (36 log steps). */
export function mapGrid(sensor: MapSensor, distanceRange_m: [number, number] = MAP_DISTANCE_RANGE_M): MapGrid {
  const [t0, t1] = MAP_TEMPERATURE_RANGE_K;
  const steps = Math.round((t1 - t0) / TEMPERATURE_STEP_K);
  const temperature_K = Array.from({ length: steps + 1 }, (_, i) => t0 + ((t1 - t0) * i) / steps);
  const distance_m = logSpace(distanceRange_m[0], distanceRange_m[1], DISTANCE_POINTS);
  const sd_K: number[][] = [];
  const insensitive: boolean[][] = [];
  const insensitiveUpTo_m: (number | null)[] = [];
  for (const T of temperature_K) {
    const at = { value: secondSound(T), slope: secondSoundSlope(T) };
    const spreads = distance_m.map((d) => spreadAt(T, d, sensor, at));
    const flags = spreads.map((s) => s.insensitive);
    sd_K.push(spreads.map((s) => s.sd_K));
    insensitive.push(flags);
    insensitiveUpTo_m.push(insensitiveEdge(T, at, flags, distance_m, sensor));
  }
  return { temperature_K, distance_m, sd_K, insensitive, insensitiveUpTo_m };
}

/** Where the insensitive flag turns off along one grid column (it holds at short distances only). */
function insensitiveEdge(T: number, at: { value: number; slope: number }, flags: readonly boolean[], distance_m: readonly number[], sensor: MapSensor): number | null {
  if (!flags[0]) return null;
  const off = flags.indexOf(false);
  if (off < 0) return distance_m[distance_m.length - 1] as number;
  let lo = Math.log(distance_m[off - 1] as number);
  let hi = Math.log(distance_m[off] as number);
  for (let k = 0; k < EDGE_BISECTIONS; k++) {
    const mid = (lo + hi) / 2;
    if (spreadAt(T, Math.exp(mid), sensor, at).insensitive) lo = mid;
    else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

/**
 * Distance (m) at which σ_T falls to `level` at one temperature, from one grid column (σ_T falling
 * with d): log–log interpolation; the grid's end when the level is not reached inside it.
 */
export function isoDistance(column: readonly number[], distance_m: readonly number[], level: number): number {
  const n = column.length;
  const first = column[0] as number;
  if (first <= level) return distance_m[0] as number;
  for (let j = 1; j < n; j++) {
    const s1 = column[j] as number;
    if (s1 <= level) {
      const s0 = column[j - 1] as number;
      const d0 = distance_m[j - 1] as number;
      const d1 = distance_m[j] as number;
      const f = Math.log(s0 / level) / Math.log(s0 / s1);
      return Math.exp(Math.log(d0) + f * Math.log(d1 / d0));
    }
  }
  return distance_m[n - 1] as number;
}

/** Iso-levels for a grid: 1–3 steps covering its values, at most nine (decades only if more). */
export function mapLevels(grid: MapGrid): number[] {
  let min = Number.POSITIVE_INFINITY;
  let max = 0;
  for (const column of grid.sd_K) {
    for (const v of column) {
      if (v > 0 && v < min) min = v;
      if (v > max) max = v;
    }
  }
  const inside = CANDIDATE_LEVELS_K.filter((L) => L > min && L < max);
  if (inside.length <= MAX_LEVELS) return inside.length > 0 ? inside : [CANDIDATE_LEVELS_K.find((L) => L >= max) ?? 1];
  const decades = inside.filter((L) => Math.abs(Math.log10(L) - Math.round(Math.log10(L))) < 1e-9);
  return decades.slice(0, MAX_LEVELS);
}

export interface MapMarks {
  planned: { temperature_K: number; distance_m: number; sd_K: number | null; label: string } | null;
  target_K: number;
}

/** The units the map is drawn in: the header's chosen temperature and length units. */
export interface MapUnits {
  temperature: DisplayUnit;
  length: DisplayUnit;
}

const KELVIN_MM: MapUnits = { temperature: { shown: 'K', unit: 'K' }, length: { shown: 'mm', unit: 'mm' } };

function levelText(L: number): string {
  return messageText(L, LADDERS.temperatureDifference);
}

/** Distance ticks, m: 1–2–5 steps, labelled plainly (a log axis would label every minor step). */
const DISTANCE_TICKS_M = [1e-4, 2e-4, 5e-4, 1e-3, 2e-3, 5e-3, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2, 5];

/** Scales for the axes: temperature (x) and distance (y) in the shown units. */
interface MapScale {
  toX: (T_K: number) => number;
  toY: (d_m: number) => number;
}

/**
 * The map as a Plotly figure: filled bands, the target iso-line, insensitive spots, the planned
 * point; temperatures and distances in `units` (K and mm unless the header chose others).
 */
export function mapFigure(grid: MapGrid, marks: MapMarks, units: MapUnits = KELVIN_MM): { data: PlotTrace[]; layout: PlotLayout; levels: number[] } {
  const levels = mapLevels(grid);
  const colours = bandColours(levels.length + 1);
  const scale: MapScale = { toX: (t) => inUnit(t, units.temperature), toY: (d) => inUnit(d, units.length) };
  const { toX, toY } = scale;
  const tu = units.temperature.shown;
  const lu = units.length.shown;
  // Hover temperatures to 1 mK.
  const xHover = units.temperature.unit === 'K' ? '%{x:.3f}' : '%{x:.0f}';
  const T = grid.temperature_K.map(toX);
  const dMin = grid.distance_m[0] as number;
  const dMax = grid.distance_m[grid.distance_m.length - 1] as number;
  const edge = (name: string, d: number): PlotTrace => ({
    type: 'scatter',
    name,
    x: [T[0] as number, T[T.length - 1] as number],
    y: [toY(d), toY(d)],
    mode: 'lines',
    line: { width: 0, color: 'rgba(0,0,0,0)' },
    hoverinfo: 'skip',
    showlegend: false,
  });
  const data: PlotTrace[] = [edge('top edge', dMax)];
  levels.forEach((L, k) => {
    data.push({
      type: 'scatter',
      name: `σT = ${levelText(L)}`,
      x: T,
      y: grid.sd_K.map((column) => toY(isoDistance(column, grid.distance_m, L))),
      mode: 'lines',
      line: { color: 'rgba(16, 34, 58, 0.28)', width: 0.6 },
      fill: 'tonexty',
      fillcolor: colours[k] as string,
      hovertemplate: `σT = ${levelText(L)} at ${xHover} ${tu} from %{y:.3g} ${lu}<extra></extra>`,
      showlegend: false,
    });
  });
  data.push({ ...edge('bottom edge', dMin), fill: 'tonexty', fillcolor: colours[levels.length] as string });
  data.push(colourBarTrace(levels, colours, scale));
  data.push(...insensitiveTraces(grid, scale));
  data.push({
    type: 'scatter',
    name: `Target σT = ${levelText(marks.target_K)}`,
    x: T,
    y: grid.sd_K.map((column) => toY(isoDistance(column, grid.distance_m, marks.target_K))),
    mode: 'lines',
    line: { color: PLANNER_COLOURS.target, width: 2.4, dash: 'dash' },
    hovertemplate: `target σT = ${levelText(marks.target_K)} reached from %{y:.3g} ${lu} at ${xHover} ${tu}<extra></extra>`,
  });
  if (marks.planned) {
    const p = marks.planned;
    data.push({
      type: 'scatter',
      name: 'Planned',
      x: [toX(p.temperature_K)],
      y: [toY(p.distance_m)],
      mode: 'markers',
      marker: { color: PLANNER_COLOURS.planned, size: 13, symbol: 'diamond', line: { color: '#ffffff', width: 1.5 } },
      text: [`${p.label}: ${temperatureText(p.temperature_K, [units.temperature])}, ${Number(toY(p.distance_m).toPrecision(4))} ${lu}, σT ≈ ${p.sd_K === null ? '—' : readText(p.sd_K, LADDERS.temperatureDifference, 2)}`],
      hovertemplate: '%{text}<extra></extra>',
      cliponaxis: false,
    });
  }
  const layout: PlotLayout = {
    ...baseLayout(),
    margin: { l: 64, r: 16, t: 30, b: 48 },
    dragmode: false,
    showlegend: true,
    legend: { orientation: 'h', x: 0, y: 1.01, xanchor: 'left', yanchor: 'bottom', font: { size: 12 } },
    xaxis: axis(`Bath temperature T (${tu})`, { range: [toX(MAP_TEMPERATURE_RANGE_K[0]), toX(MAP_TEMPERATURE_RANGE_K[1])], fixedrange: true }),
    yaxis: axis(`Heater–sensor distance (${lu})`, {
      type: 'log',
      range: [Math.log10(toY(dMin)), Math.log10(toY(dMax))],
      fixedrange: true,
      tickvals: DISTANCE_TICKS_M.map(toY),
      ticktext: DISTANCE_TICKS_M.map((d) => plainNumber(toY(d))),
    }),
    shapes: plannedLines(marks, scale),
    annotations: extremumLabels(units.temperature),
  };
  return { data, layout, levels };
}

/** A hidden trace that carries the colour bar: one colour per band, labels at the band edges. */
function colourBarTrace(levels: readonly number[], colours: readonly string[], { toX, toY }: MapScale): PlotTrace {
  const n = colours.length;
  const scale: [number, string][] = colours.flatMap((c, k): [number, string][] => [
    [k / n, c],
    [(k + 1) / n, c],
  ]);
  return {
    type: 'scatter',
    name: 'colour bar',
    x: [toX(MAP_TEMPERATURE_RANGE_K[0])],
    y: [toY(MAP_DISTANCE_RANGE_M[0])],
    mode: 'markers',
    marker: {
      color: [0],
      cmin: 0,
      cmax: n,
      colorscale: scale,
      showscale: true,
      opacity: 0,
      size: 1,
      colorbar: {
        title: { text: 'σT', side: 'top', font: { size: 12, color: CHART_COLOURS.inkMuted } },
        tickvals: levels.map((_, k) => k + 1),
        ticktext: levels.map(levelText),
        tickfont: { size: 11 },
        thickness: 14,
        len: 0.92,
        outlinewidth: 0,
      },
    },
    hoverinfo: 'skip',
    showlegend: false,
  };
}

/**
 * Where the kernel calls a reading insensitive (near the extremes of u2, the curvature bound
 * governs): for each temperature, the distances below which that holds, as shaded regions.
 */
function insensitiveTraces(grid: MapGrid, { toX, toY }: MapScale): PlotTrace[] {
  const runs: { T: number[]; d: number[] }[] = [];
  let run: { T: number[]; d: number[] } | null = null;
  grid.insensitiveUpTo_m.forEach((upTo, i) => {
    if (upTo === null) {
      run = null;
      return;
    }
    if (!run) {
      run = { T: [], d: [] };
      runs.push(run);
    }
    run.T.push(toX(grid.temperature_K[i] as number));
    run.d.push(upTo);
  });
  const dMin = grid.distance_m[0] as number;
  return runs.map((r, k) => ({
    type: 'scatter',
    name: 'Insensitive (u₂ extremum)',
    legendgroup: 'insensitive',
    showlegend: k === 0,
    x: [...r.T, ...[...r.T].reverse()],
    y: [...r.d.map(toY), ...r.T.map(() => toY(dMin))],
    mode: 'lines',
    fill: 'toself',
    fillcolor: PLANNER_COLOURS.insensitiveFill,
    line: { color: PLANNER_COLOURS.insensitiveEdge, width: 1, dash: 'dot' },
    hovertemplate: 'insensitive: u₂ hardly changes with T here<extra></extra>',
  }));
}

function plannedLines(marks: MapMarks, { toX, toY }: MapScale): PlotShape[] {
  if (!marks.planned) return [];
  const temperature = toX(marks.planned.temperature_K);
  const distance = toY(marks.planned.distance_m);
  const line = { color: PLANNER_COLOURS.planned, width: 1, dash: 'dot' as const };
  return [
    { name: 'planned-temperature', type: 'line', xref: 'x', yref: 'paper', x0: temperature, x1: temperature, y0: 0, y1: 1, line, layer: 'above' },
    { name: 'planned-distance', type: 'line', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: distance, y1: distance, line, layer: 'above' },
  ];
}

function extremumLabels(unit: DisplayUnit): PlotAnnotation[] {
  const { minimum, maximum } = SECOND_SOUND_EXTREMA;
  return [
    { kind: 'min', at: minimum.temperature_K },
    { kind: 'max', at: maximum.temperature_K },
  ].map(({ kind, at }) => ({
    name: `u2-${kind}`,
    text: `u₂ ${kind} ${temperatureText(at, [unit], 0.01)}`,
    xref: 'x',
    yref: 'paper',
    x: inUnit(at, unit),
    y: 0.02,
    xanchor: 'center',
    yanchor: 'bottom',
    showarrow: false,
    bgcolor: 'rgba(255,255,255,0.8)',
    font: { size: 11, color: CHART_COLOURS.ink },
  }));
}

/** Whether a temperature is on the map (He II, inside the shown range). */
export function onMap(temperature_K: number): boolean {
  return temperature_K >= MAP_TEMPERATURE_RANGE_K[0] && temperature_K <= MAP_TEMPERATURE_RANGE_K[1] && temperature_K < T_LAMBDA_K;
}
