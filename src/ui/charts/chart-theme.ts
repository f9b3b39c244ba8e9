import type { PlotAxis, PlotLayout, PlotShape } from '../plot/plotly-types';

/** Chart colours; the same values as the custom properties in app/styles.css. */
export const CHART_COLOURS = {
  ink: '#10223a',
  inkMuted: '#5a6e8a',
  grid: '#e6e2d8',
  axis: '#b9b3a5',
  secondSound: '#0b7a76',
  firstSound: '#4a5c9c',
  superfluid: '#0b7a76',
  normal: '#b5542a',
  chosen: '#d9772b',
  modelRegion: 'rgba(90, 110, 138, 0.10)',
  insensitive: 'rgba(217, 119, 43, 0.16)',
  lambda: '#5a6e8a',
} as const;

/** Font stack of the page (no web fonts: nothing is downloaded). */
export const CHART_FONT_FAMILY =
  'system-ui, "Segoe UI", "Helvetica Neue", "Liberation Sans", Arial, sans-serif';

/** Layout settings every chart shares. */
export function baseLayout(): PlotLayout {
  return {
    font: { family: CHART_FONT_FAMILY, size: 12, color: CHART_COLOURS.ink },
    paper_bgcolor: 'rgba(0,0,0,0)',
    plot_bgcolor: '#ffffff',
    margin: { l: 64, r: 20, t: 34, b: 48 },
    hovermode: 'closest',
    hoverlabel: { font: { family: CHART_FONT_FAMILY, size: 12 }, bgcolor: '#ffffff', bordercolor: CHART_COLOURS.axis },
    legend: { orientation: 'h', x: 0, y: 1.02, xanchor: 'left', yanchor: 'bottom', font: { size: 12 } },
    autosize: true,
    // Keeps the reader's zoom when only the chosen temperature moves.
    uirevision: 'keep',
  };
}

/** A data axis in the house style. */
export function axis(title: string, extra: PlotAxis = {}): PlotAxis {
  return {
    title: { text: title, font: { size: 12, color: CHART_COLOURS.inkMuted }, standoff: 8 },
    gridcolor: CHART_COLOURS.grid,
    linecolor: CHART_COLOURS.axis,
    tickcolor: CHART_COLOURS.axis,
    ticks: 'outside',
    showline: true,
    zeroline: false,
    ...extra,
  };
}

/** Name of the shape that marks the chosen temperature (tests and readers of the figure find it). */
export const CHOSEN_TEMPERATURE_SHAPE = 'chosen-temperature';

/** Vertical line at the chosen temperature across the whole plot height. */
export function chosenTemperatureLine(temperature_K: number): PlotShape {
  return {
    name: CHOSEN_TEMPERATURE_SHAPE,
    type: 'line',
    xref: 'x',
    yref: 'paper',
    x0: temperature_K,
    x1: temperature_K,
    y0: 0,
    y1: 1,
    line: { color: CHART_COLOURS.chosen, width: 2 },
    layer: 'above',
  };
}

/** Dashed vertical line at a fixed temperature (Tλ). */
export function referenceLine(name: string, temperature_K: number): PlotShape {
  return {
    name,
    type: 'line',
    xref: 'x',
    yref: 'paper',
    x0: temperature_K,
    x1: temperature_K,
    y0: 0,
    y1: 1,
    line: { color: CHART_COLOURS.lambda, width: 1, dash: 'dash' },
    layer: 'below',
  };
}

/** Shaded band over a temperature interval, full plot height. */
export function temperatureBand(name: string, from_K: number, to_K: number, fillcolor: string): PlotShape {
  return { name, type: 'rect', xref: 'x', yref: 'paper', x0: from_K, x1: to_K, y0: 0, y1: 1, fillcolor, line: { width: 0 }, layer: 'below' };
}
