/**
 * Plotly figures of the source-location view: the colours, trace names and length scale its
 * figures share, and a projection of sensors, source and confidence ellipses (the layout-quality
 * map is quality-figure.ts). Positions are drawn on equal-scale axes in the header's unit of length.
 */
import type { SensorOutcome } from '../../io/locate-csv';
import type { LocateResult, SurfaceConstraint, Vec3 } from '../../physics';
import { axis, baseLayout, CHART_COLOURS } from '../charts/chart-theme';
import type { PlotAnnotation, PlotLayout, PlotTrace } from '../plot/plotly-types';
import { ELLIPSE_DCHI2, ellipseAxes, ellipsePoints, marginalCovariance, project, } from './locate-geometry';
import { AXIS_NAMES, axesOf, type PlanePair } from './locate-inputs';

/** Colours of this view (the house palette, chart-theme and app/styles.css). */
export const LOCATE_COLOURS = {
  sensor: CHART_COLOURS.ink,
  outlier: CHART_COLOURS.normal,
  source: CHART_COLOURS.chosen,
  sigma1Fill: 'rgba(217, 119, 43, 0.18)',
  surface: CHART_COLOURS.lambda,
  best: '#0b7a76',
} as const;

/** Names of the traces (tests and readers of the figure find them by name). */
export const TRACE_NAMES = {
  sensors: 'sensors',
  outliers: 'outliers',
  dropped: 'left out of the fit',
  noArrival: 'no arrival time',
  source: 'located source',
  sigma1: '1σ region (68.3 %)',
  sigma2: '2σ region (95.4 %)',
  surface: 'surface',
  map: 'expected position sd',
  unfixed: 'cannot fix a source here',
  best: 'best added sensor',
} as const;

/** How lengths are drawn: the unit and its size (per metre), with the decimals hover labels show. */
export interface LengthScale {
  perMetre: number;
  shown: string;
  /** Decimals of a sensor position in hover labels. */
  decimals: number;
}

/** Millimetres: the default, and what the positions on these charts were first written in. */
export const MM_SCALE: LengthScale = { perMetre: 1e3, shown: 'mm', decimals: 1 };

/** The scale of a display unit of length. */
export function lengthScale(unit: 'mm' | 'cm' | 'm'): LengthScale {
  if (unit === 'cm') return { perMetre: 1e2, shown: 'cm', decimals: 2 };
  if (unit === 'm') return { perMetre: 1, shown: 'm', decimals: 4 };
  return MM_SCALE;
}

/** A number to a few significant digits for hover text; a dash when it is not finite. */
export const fmt = (x: number, digits = 3) => (Number.isFinite(x) ? Number(x.toPrecision(digits)).toString() : '—');

export interface ProjectionInput {
  pair: PlanePair;
  positions: readonly Vec3[];
  labels: readonly string[];
  /** Per row; null when there is no fit. */
  outcomes: readonly SensorOutcome[] | null;
  result: LocateResult | null;
  constraint: SurfaceConstraint;
  zoom: 'layout' | 'source';
  /** Unit of the axes (mm when absent). */
  length?: LengthScale;
}

/** One projection: sensors by how they took part, the source, its 1σ and 2σ ellipses, the surface. */
export function projectionFigure(p: ProjectionInput): { data: PlotTrace[]; layout: PlotLayout } {
  const { a, b } = axesOf(p.pair);
  const L = p.length ?? MM_SCALE;
  const mm = (m: number) => m * L.perMetre;
  const d = L.decimals;
  const groups: { name: string; symbol: string; colour: string; rows: number[] }[] = [
    { name: TRACE_NAMES.sensors, symbol: 'circle', colour: LOCATE_COLOURS.sensor, rows: [] },
    { name: TRACE_NAMES.outliers, symbol: 'x', colour: LOCATE_COLOURS.outlier, rows: [] },
    { name: TRACE_NAMES.dropped, symbol: 'x-open', colour: LOCATE_COLOURS.outlier, rows: [] },
    { name: TRACE_NAMES.noArrival, symbol: 'circle-open', colour: LOCATE_COLOURS.sensor, rows: [] },
  ];
  p.positions.forEach((_, i) => {
    const status = p.outcomes?.[i]?.status ?? 'fitted';
    const g = status === 'outlier' ? 1 : status === 'dropped' ? 2 : status === 'no arrival' ? 3 : 0;
    groups[g]?.rows.push(i);
  });
  const data: PlotTrace[] = [];
  const surface = surfaceOutline(p.constraint, p.pair, reachOf(p.positions, p.constraint), L);
  if (surface) {
    data.push({
      type: 'scatter',
      name: TRACE_NAMES.surface,
      x: surface.x,
      y: surface.y,
      mode: 'lines',
      line: { color: LOCATE_COLOURS.surface, width: 1.5, dash: 'dot' },
      hoverinfo: 'skip',
      connectgaps: false,
    });
  }
  for (const g of groups) {
    if (g.rows.length === 0) continue;
    data.push({
      type: 'scatter',
      name: g.name,
      x: g.rows.map((i) => mm((p.positions[i] as Vec3)[a])),
      y: g.rows.map((i) => mm((p.positions[i] as Vec3)[b])),
      mode: 'markers',
      marker: { color: g.colour, size: g.symbol.startsWith('x') ? 11 : 10, symbol: g.symbol, line: { color: g.colour, width: 2 } },
      text: g.rows.map((i) => p.labels[i] ?? ''),
      hovertemplate: `%{text}: ${AXIS_NAMES[a]} %{x:.${d}f} ${L.shown}, ${AXIS_NAMES[b]} %{y:.${d}f} ${L.shown}<extra>${g.name}</extra>`,
    });
  }
  const r = p.result;
  let sigma2Extent = 0;
  if (r) {
    const centre = project(r.source_m, p.pair).map(mm) as [number, number];
    if (r.covariance_m2) {
      const cov = marginalCovariance(r.covariance_m2, p.pair).map((x) => x * L.perMetre ** 2) as [number, number, number];
      sigma2Extent = ellipseAxes(cov, ELLIPSE_DCHI2.sigma2).major;
      const e2 = ellipsePoints(centre, cov, ELLIPSE_DCHI2.sigma2);
      const e1 = ellipsePoints(centre, cov, ELLIPSE_DCHI2.sigma1);
      data.push({
        type: 'scatter',
        name: TRACE_NAMES.sigma2,
        x: e2.x,
        y: e2.y,
        mode: 'lines',
        line: { color: LOCATE_COLOURS.source, width: 1.5, dash: 'dash' },
        hoverinfo: 'skip',
      });
      data.push({
        type: 'scatter',
        name: TRACE_NAMES.sigma1,
        x: e1.x,
        y: e1.y,
        mode: 'lines',
        line: { color: LOCATE_COLOURS.source, width: 2 },
        fill: 'toself',
        fillcolor: LOCATE_COLOURS.sigma1Fill,
        hoverinfo: 'skip',
      });
    }
    data.push({
      type: 'scatter',
      name: TRACE_NAMES.source,
      x: [centre[0]],
      y: [centre[1]],
      mode: 'markers',
      marker: { color: LOCATE_COLOURS.source, size: 15, symbol: 'star', line: { color: '#ffffff', width: 1 } },
      hovertemplate: `source: ${AXIS_NAMES[a]} %{x:.${d + 1}f} ${L.shown}, ${AXIS_NAMES[b]} %{y:.${d + 1}f} ${L.shown}<extra>${r.degenerate ? 'not determined' : ''}</extra>`,
    });
  }
  const annotations: PlotAnnotation[] = p.zoom === 'layout' ? sensorLabels(p, a, b, L) : [];
  const layout: PlotLayout = {
    ...baseLayout(),
    uirevision: `${p.pair}-${p.zoom}`,
    margin: { l: 56, r: 36, t: 12, b: 44 },
    xaxis: axis(`${AXIS_NAMES[a]} (${L.shown})`, { constrain: 'domain' }),
    yaxis: axis(`${AXIS_NAMES[b]} (${L.shown})`, { scaleanchor: 'x', scaleratio: 1, constrain: 'domain' }),
    annotations,
    // The view draws one legend for both projections, in the page.
    showlegend: false,
  };
  if (p.zoom === 'source' && r) {
    const centre = project(r.source_m, p.pair).map(mm) as [number, number];
    // At least 2 mm either side of the source.
    const half = Math.max(1.6 * sigma2Extent, 2e-3 * L.perMetre);
    layout.xaxis = { ...layout.xaxis, range: [centre[0] - half, centre[0] + half], autorange: false };
    layout.yaxis = { ...layout.yaxis, range: [centre[1] - half, centre[1] + half], autorange: false };
  }
  return { data, layout };
}

/** Most sensors whose labels are drawn beside their markers. */
export const MAX_DRAWN_LABELS = 48;

/**
 * Sensor labels beside their markers; sensors that fall on one spot in this projection (one above
 * the other) share one label, "U90, L135", so no text is drawn over another.
 */
function sensorLabels(p: ProjectionInput, a: 0 | 1 | 2, b: 0 | 1 | 2, L: LengthScale): PlotAnnotation[] {
  // Past a few dozen sensors, labels would cover the frame (and hundreds of them slow every redraw):
  // they are then in each marker's hover text only.
  if (p.positions.length > MAX_DRAWN_LABELS) return [];
  const spots = new Map<string, { x: number; y: number; names: string[] }>();
  p.positions.forEach((pos, i) => {
    const x = pos[a] * L.perMetre;
    const y = pos[b] * L.perMetre;
    // One spot per half millimetre, whatever the unit.
    const key = `${Math.round(pos[a] * 2e3)}:${Math.round(pos[b] * 2e3)}`;
    const status = p.outcomes?.[i]?.status;
    const name = `${p.labels[i] ?? ''}${status === 'outlier' || status === 'dropped' ? ' (outlier)' : ''}`;
    const spot = spots.get(key);
    if (spot) spot.names.push(name);
    else spots.set(key, { x, y, names: [name] });
  });
  return [...spots.values()].map((spot, k) => ({
    name: `label-${k}`,
    text: `  ${spot.names.join(', ')}`,
    xref: 'x',
    yref: 'y',
    x: spot.x,
    y: spot.y,
    showarrow: false,
    xanchor: 'left',
    yanchor: 'middle',
    font: { size: 11, color: CHART_COLOURS.inkMuted },
  }));
}

/**
 * The outline of the surface in a projection (mm, or the given length unit), where it is simple: a sphere's rim; a cylinder
 * seen along its axis (a circle) or from the side (two lines); a plane seen edge-on (a line).
 * Null when the surface covers the view or is seen at a slant.
 */
export function surfaceOutline(c: SurfaceConstraint, pair: PlanePair, reach_m = 0.3, length: LengthScale = MM_SCALE): { x: number[]; y: (number | null)[] } | null {
  const { a, b, c: n } = axesOf(pair);
  const mm = (m: number) => m * length.perMetre;
  const circle = (centre: Vec3, R: number) => {
    const x: number[] = [];
    const y: number[] = [];
    for (let k = 0; k <= 120; k++) {
      const t = (2 * Math.PI * k) / 120;
      x.push(mm(centre[a] + R * Math.cos(t)));
      y.push(mm(centre[b] + R * Math.sin(t)));
    }
    return { x, y };
  };
  const LONG = reach_m;
  if (c.kind === 'sphere') return circle(c.centre_m, c.radius_m);
  if (c.kind === 'cylinder') {
    const len = Math.hypot(...c.axisDirection);
    const d = c.axisDirection.map((x) => x / len) as unknown as Vec3;
    if (Math.abs(Math.abs(d[n]) - 1) < 1e-9) return circle(c.axisPoint_m, c.radius_m);
    if (Math.abs(d[n]) < 1e-9) {
      // Axis in the view plane: the two silhouette lines, ±R across the projected axis.
      const da = d[a];
      const db = d[b];
      const pa = c.axisPoint_m[a];
      const pb = c.axisPoint_m[b];
      const side = (sign: number) => {
        const oa = pa - sign * c.radius_m * db;
        const ob = pb + sign * c.radius_m * da;
        return [
          [mm(oa - LONG * da), mm(ob - LONG * db)],
          [mm(oa + LONG * da), mm(ob + LONG * db)],
        ] as const;
      };
      const [s1, s2] = [side(1), side(-1)];
      // A null y breaks the line between the two sides.
      return { x: [s1[0][0], s1[1][0], s1[1][0], s2[0][0], s2[1][0]], y: [s1[0][1], s1[1][1], null, s2[0][1], s2[1][1]] };
    }
    return null;
  }
  if (c.kind === 'plane') {
    const len = Math.hypot(...c.normal);
    const nn = c.normal.map((x) => x / len) as unknown as Vec3;
    if (Math.abs(nn[n]) > 1e-9) return null;
    // Edge-on: the line through the point, perpendicular to the normal's projection.
    const ta = -nn[b];
    const tb = nn[a];
    const pa = c.point_m[a];
    const pb = c.point_m[b];
    return { x: [mm(pa - LONG * ta), mm(pa + LONG * ta)], y: [mm(pb - LONG * tb), mm(pb + LONG * tb)] };
  }
  return null;
}

/** How far the lines of a cylinder or plane reach from its point, m: a little beyond the farthest sensor. */
export function reachOf(positions: readonly Vec3[], c: SurfaceConstraint): number {
  const origin = c.kind === 'cylinder' ? c.axisPoint_m : c.kind === 'plane' ? c.point_m : c.kind === 'sphere' ? c.centre_m : ([0, 0, 0] as const);
  const far = Math.max(0, ...positions.map((p) => Math.hypot(p[0] - origin[0], p[1] - origin[1], p[2] - origin[2])));
  return far > 0 ? 1.1 * far : 0.3;
}
