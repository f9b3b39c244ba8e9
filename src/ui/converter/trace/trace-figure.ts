/**
 * The figure of one trace: the sensor channel (and the heater drive on its own scale) decimated to
 * min/max per pixel column, time in the display unit (ms by default) from time zero (the heater onset, or the file's t = 0), the
 * picked arrival with its ± sd, the level the picker crossed, and the search window.
 */
import type { TracePick } from '../../../io/trace-pick';
import { axis, baseLayout, CHART_COLOURS } from '../../charts/chart-theme';
import { fromBaseUnit } from '../../../io/quantity';
import type { PlotLayout, PlotShape, PlotTrace } from '../../plot/plotly-types';
import { shownUnit } from '../../units/unit-choices';
import { TIME_DECIMALS } from '../../units/unit-views';
import { decimateMinMax } from '../decimate';
import type { TraceSamples } from './trace-protocol';

export const ARRIVAL_SHAPE = 'picked-arrival';
export const ARRIVAL_SD_SHAPE = 'picked-arrival-sd';
export const PICK_LEVEL_SHAPE = 'pick-level';
export const TIME_ZERO_SHAPE = 'time-zero';

export interface TraceFigureInput {
  samples: TraceSamples;
  sensor: string;
  heater: string | null;
  pick: TracePick | null;
  /** Threshold in noise sd or fraction of the peak, for the level line. */
  level: { kind: 'threshold'; sigma: number } | { kind: 'fraction'; fraction: number } | null;
  search: { from_s: number | null; to_s: number | null };
  view: 'record' | 'arrival';
  /** Pixel columns of the plot area. */
  columns: number;
  /** Display unit of time on the x axis. */
  timeUnit: 'ms' | 'µs' | 's';
}

/** The time span shown, on the file's axis, s. */
export function viewSpan(samples: TraceSamples, pick: TracePick | null, view: 'record' | 'arrival'): [number, number] {
  const t = samples.time_s;
  const first = t[0] ?? 0;
  const last = t[t.length - 1] ?? 1;
  if (view === 'record' || !pick) return [first, last];
  // A fifth of the delay each side shows the whole leading edge and the top of the pulse, whatever the record length.
  const half = pick.delay_s > 0 ? Math.max(0.2 * pick.delay_s, 40 * pick.arrivalSd_s) : 0.04 * (last - first);
  return [Math.max(first, pick.arrival_s - half), Math.min(last, pick.arrival_s + half)];
}

/**
 * A channel's name with its unit for an axis title: "sensor (V)" as written; "sensor_V" → "sensor (V)";
 * a name without a unit is marked as the file's units.
 */
export function channelAxisTitle(name: string): string {
  if (/[([][^)\]]+[)\]]\s*$/.test(name)) return name;
  const suffix = /^(.*?)[_\s]([uµμmnk]?V|[uµμmk]?A|[mk]?Ω|ohm|[um]?K)$/i.exec(name);
  if (suffix?.[1]) return `${suffix[1]} (${(suffix[2] ?? '').replace(/^u/, 'µ')})`;
  return `${name} (file units)`;
}

/** Round, short tick labels with SI prefixes on a signal axis (20µ, 0.5m, 1.2): the unit is in the title. */
export const SIGNAL_TICKS = { tickformat: '~s', exponentformat: 'SI' } as const;

export function traceFigure({ samples, sensor, heater, pick, level, search, view, columns, timeUnit }: TraceFigureInput): { data: PlotTrace[]; layout: PlotLayout } {
  const zero = pick?.timeZero_s ?? 0;
  const [from, to] = viewSpan(samples, pick, view);
  const scale = fromBaseUnit(1, timeUnit);
  const unit = shownUnit(timeUnit);
  const decimals = TIME_DECIMALS[timeUnit];
  /** A time on the file's axis, from time zero in the display unit. */
  const shown = (t: number) => (t - zero) * scale;
  const data: PlotTrace[] = [];
  const sensorValues = samples.channels.find((c) => c.name === sensor)?.values;
  // Around the arrival the drive is long over: its trace would only add a flat line and an axis.
  const heaterValues = heater === null || (view === 'arrival' && pick) ? undefined : samples.channels.find((c) => c.name === heater)?.values;
  if (heaterValues) {
    const line = decimateMinMax(samples.time_s, heaterValues, from, to, columns, scale, zero);
    data.push({ type: 'scatter', name: `${heater} (heater)`, x: line.x, y: line.y, yaxis: 'y2', mode: 'lines', line: { color: CHART_COLOURS.inkMuted, width: 1 }, opacity: 0.7, hoverinfo: 'skip' });
  }
  if (sensorValues) {
    const line = decimateMinMax(samples.time_s, sensorValues, from, to, columns, scale, zero);
    data.push({ type: 'scatter', name: `${sensor} (sensor)`, x: line.x, y: line.y, mode: 'lines', line: { color: CHART_COLOURS.secondSound, width: 1.2 }, hovertemplate: `%{x:.${decimals}f} ${unit}<br>%{y:.4g}<extra></extra>` });
  }
  const shapes: PlotShape[] = [
    { name: TIME_ZERO_SHAPE, type: 'line', xref: 'x', yref: 'paper', x0: 0, x1: 0, y0: 0, y1: 1, line: { color: CHART_COLOURS.lambda, width: 1, dash: 'dash' }, layer: 'below' },
  ];
  if (search.from_s !== null || search.to_s !== null) {
    const lo = search.from_s === null ? 0 : search.from_s * scale;
    const hi = search.to_s === null ? shown(samples.time_s[samples.time_s.length - 1] ?? 0) : search.to_s * scale;
    shapes.push({ name: 'search-window', type: 'rect', xref: 'x', yref: 'paper', x0: lo, x1: hi, y0: 0, y1: 1, fillcolor: 'rgba(11, 122, 118, 0.06)', line: { width: 0 }, layer: 'below' });
  }
  if (pick) {
    // The arrival on the axis from time zero (for a peak-to-peak delay, not the delay itself).
    const t = (pick.arrival_s - zero) * scale;
    const sd = pick.delaySd_s * scale;
    shapes.push(
      { name: ARRIVAL_SD_SHAPE, type: 'rect', xref: 'x', yref: 'paper', x0: t - sd, x1: t + sd, y0: 0, y1: 1, fillcolor: 'rgba(217, 119, 43, 0.25)', line: { width: 0 }, layer: 'below' },
      { name: ARRIVAL_SHAPE, type: 'line', xref: 'x', yref: 'paper', x0: t, x1: t, y0: 0, y1: 1, line: { color: CHART_COLOURS.chosen, width: 2 }, layer: 'above' },
    );
    const sign = pick.peak >= 0 ? 1 : -1;
    const y =
      level?.kind === 'threshold'
        ? pick.baseline.level + sign * level.sigma * pick.baseline.noise
        : level?.kind === 'fraction'
          ? pick.baseline.level + level.fraction * pick.peak
          : null;
    if (y !== null) {
      shapes.push({ name: PICK_LEVEL_SHAPE, type: 'line', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: y, y1: y, line: { color: CHART_COLOURS.chosen, width: 1, dash: 'dot' }, layer: 'above' });
    }
  }
  return {
    data,
    layout: {
      ...baseLayout(),
      margin: { l: 64, r: heaterValues ? 56 : 16, t: 30, b: 46 },
      legend: { orientation: 'h', x: 1, y: 1.01, xanchor: 'right', yanchor: 'bottom' },
      xaxis: axis(pick?.timeZero === 'heater onset' ? `Time from the heater onset (${unit})` : `Time (${unit})`, { range: [shown(from), shown(to)] }),
      yaxis: axis(channelAxisTitle(sensor), SIGNAL_TICKS),
      ...(heaterValues ? { yaxis2: axis(channelAxisTitle(heater as string), { ...SIGNAL_TICKS, tickmode: 'auto', showgrid: false, overlaying: 'y', side: 'right', showline: true, zeroline: false, gridcolor: 'rgba(0,0,0,0)' }) } : {}),
      shapes,
      annotations: pick
        ? [
            {
              name: 'arrival-label',
              text: `arrival ${((pick.arrival_s - zero) * scale).toFixed(decimals)} ${unit}${pick.reference === 'peak to peak' ? ' (peak; delay peak to peak)' : ''}`,
              xref: 'x',
              yref: 'paper',
              x: (pick.arrival_s - zero) * scale,
              y: 1,
              xanchor: 'left',
              yanchor: 'top',
              showarrow: false,
              font: { size: 11, color: CHART_COLOURS.chosen },
              bgcolor: 'rgba(255,255,255,0.8)',
            },
          ]
        : [],
      uirevision: `${view}|${sensor}|${heater ?? ''}|${timeUnit}`,
    },
  };
}
