/**
 * Charts follow the page's theme here, once, for every chart: figures are written in the light
 * palette (src/ui/charts/chart-theme.ts and each view's colours) and this transform gives the dark
 * version: the figure's surroundings (paper and plot backgrounds, fonts, grid, axis lines, hover
 * labels, legend) take the theme's colours, and each colour a figure names is swapped for its dark
 * counterpart so lines, markers and labels stay readable on a dark plot.
 *
 * Colour scales and opaque filled areas (bands of a map) encode data and keep their colours; a
 * translucent white wash stays a wash.
 */
import type { PlotLayout, PlotTrace } from './plotly-types';

export type PlotTheme = 'light' | 'dark';

/** The colours of a chart's surroundings in each theme (the same values as app/styles.css). */
export const PLOT_SURROUNDINGS = {
  light: {
    paper: '#fffefb',
    plot: '#ffffff',
    text: '#10223a',
    muted: '#55698a',
    grid: '#e6e2d8',
    axis: '#b9b3a5',
    hoverBg: '#ffffff',
    hoverBorder: '#b9b3a5',
    legendBg: 'rgba(255, 254, 251, 0)',
  },
  dark: {
    paper: '#141c27',
    plot: '#101823',
    text: '#e8edf3',
    muted: '#9eabbd',
    grid: '#243042',
    axis: '#4d5d73',
    hoverBg: '#1d2838',
    hoverBorder: '#5a6b82',
    legendBg: 'rgba(20, 28, 39, 0)',
  },
} as const;

/**
 * Dark counterparts of the light palette's opaque colours: the house palette (chart-theme.ts), the
 * planner's sensor colours, the locate view's colours. Each keeps its hue and is light enough for
 * at least 3:1 against the dark plot (WCAG 1.4.11, graphics).
 */
const DARK_COLOURS: Readonly<Record<string, string>> = {
  '#10223a': '#dbe3ee', // ink
  '#1b3352': '#cfd8e4',
  '#3d4d5c': '#a9b8c8', // slate
  '#5a6e8a': '#9fb0c6', // muted ink, Tλ line, heater
  '#0b7a76': '#3fc4b6', // teal: second sound, superfluid
  '#0b6d69': '#36b5a8',
  '#2f9a8e': '#62d3c5',
  '#4a5c9c': '#93a5e6', // indigo: first sound
  '#b5542a': '#ea8d62', // rust: normal fluid, outliers
  '#a4401f': '#e27a55',
  '#d9772b': '#f2a259', // amber: "you are here"
  '#c86a1e': '#efa052',
  '#8a4f8f': '#cf9ed3', // plum
  '#5b7b1f': '#a8cb5c', // olive
  '#2b6fa8': '#74b3ea', // steel blue
  '#a3405f': '#e484a2', // raspberry
  '#8c6a14': '#d9b04e', // ochre
  '#d8d4ca': '#3a4557', // "cannot fix a source here" cells
  '#ffffff': '#101823', // white outlines around markers: the plot's own colour
  '#fff': '#101823',
  '#b9b3a5': '#4d5d73',
  '#e6e2d8': '#243042',
};

/** Dark counterparts of translucent colours, by their rgb; the alpha is kept. */
const DARK_RGB: Readonly<Record<string, readonly [number, number, number]>> = {
  '255,255,255': [16, 24, 35], // label backgrounds
  '16,34,58': [219, 227, 238], // ink
  '90,110,138': [159, 176, 198],
  '74,92,156': [147, 165, 230],
  '11,122,118': [63, 196, 182],
  '11,109,105': [54, 181, 168],
  '217,119,43': [242, 162, 89],
  '181,84,42': [234, 141, 98],
  '0,0,0': [0, 0, 0],
};

interface Rgba {
  r: number;
  g: number;
  b: number;
  a: number;
}

function parseColour(text: string): Rgba | null {
  const t = text.trim().toLowerCase();
  let m = /^#([0-9a-f]{3})$/.exec(t);
  if (m?.[1]) {
    const [r, g, b] = [...m[1]].map((c) => Number.parseInt(c + c, 16)) as [number, number, number];
    return { r, g, b, a: 1 };
  }
  m = /^#([0-9a-f]{6})$/.exec(t);
  if (m?.[1]) {
    const h = m[1];
    return { r: Number.parseInt(h.slice(0, 2), 16), g: Number.parseInt(h.slice(2, 4), 16), b: Number.parseInt(h.slice(4, 6), 16), a: 1 };
  }
  m = /^rgba?\(\s*(\d+)\s*,\s*(\d+)\s*,\s*(\d+)\s*(?:,\s*([\d.]+)\s*)?\)$/.exec(t);
  if (m) return { r: Number(m[1]), g: Number(m[2]), b: Number(m[3]), a: m[4] === undefined ? 1 : Number(m[4]) };
  return null;
}

function hex({ r, g, b }: Rgba): string {
  return `#${[r, g, b].map((v) => Math.round(Math.max(0, Math.min(255, v))).toString(16).padStart(2, '0')).join('')}`;
}

function luminance({ r, g, b }: Rgba): number {
  const f = (v: number) => {
    const c = v / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * f(r) + 0.7152 * f(g) + 0.0722 * f(b);
}

const DARK_PLOT = parseColour(PLOT_SURROUNDINGS.dark.plot) as Rgba;
const MIN_GRAPHIC_CONTRAST = 3;

function contrastWithDarkPlot(c: Rgba): number {
  return (luminance(c) + 0.05) / (luminance(DARK_PLOT) + 0.05);
}

/** An opaque colour lightened (towards white, keeping its hue) until it reaches 3:1 on the dark plot. */
function lightened(c: Rgba): Rgba {
  let out = c;
  for (let step = 1; step <= 20 && contrastWithDarkPlot(out) < MIN_GRAPHIC_CONTRAST; step++) {
    const f = step / 20;
    out = { r: c.r + (255 - c.r) * f, g: c.g + (255 - c.g) * f, b: c.b + (255 - c.b) * f, a: c.a };
  }
  return out;
}

/**
 * The dark counterpart of one colour. Known palette colours map to their chosen counterparts; other
 * opaque colours too dark for the dark plot are lightened; translucent ones keep their alpha.
 * Anything unreadable (names, gradients) is left as it is.
 */
export function darkColour(colour: string): string {
  const known = DARK_COLOURS[colour.trim().toLowerCase()];
  if (known) return known;
  const c = parseColour(colour);
  if (!c) return colour;
  if (c.a < 1) {
    const mapped = DARK_RGB[`${c.r},${c.g},${c.b}`];
    if (mapped) return `rgba(${mapped[0]}, ${mapped[1]}, ${mapped[2]}, ${c.a})`;
    return colour;
  }
  return contrastWithDarkPlot(c) >= MIN_GRAPHIC_CONTRAST ? colour : hex(lightened(c));
}

/** A colour for the theme (light: as written). Also for HTML keys drawn beside a chart. */
export function themedColour(colour: string, theme: PlotTheme): string {
  return theme === 'dark' ? darkColour(colour) : colour;
}

/** Keys whose string values are colours. */
const COLOUR_KEYS = new Set(['color', 'bgcolor', 'bordercolor', 'gridcolor', 'linecolor', 'tickcolor', 'zerolinecolor', 'outlinecolor']);

/**
 * Filled areas that keep their colour: opaque ones (bands of a map encode data) and translucent
 * white (a wash that pales what lies under it, meant the same on a dark plot).
 */
function keepsFill(colour: string): boolean {
  const c = parseColour(colour);
  if (c === null) return true;
  const white = c.r > 240 && c.g > 240 && c.b > 240;
  return c.a >= 1 ? !white : white;
}

/** Maps every colour in a figure object; arrays of data (x, y, text) are not walked. */
function mapColours(value: unknown, key: string | null): unknown {
  if (typeof value === 'string') {
    if (key === 'fillcolor') return keepsFill(value) ? value : darkColour(value);
    return key !== null && COLOUR_KEYS.has(key) ? darkColour(value) : value;
  }
  if (Array.isArray(value)) {
    if (key === 'colorscale') return value;
    if (key !== null && COLOUR_KEYS.has(key)) return value.map((v) => (typeof v === 'string' ? darkColour(v) : v));
    return typeof value[0] === 'object' && value[0] !== null ? value.map((v) => mapColours(v, null)) : value;
  }
  if (typeof value === 'object' && value !== null) {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) out[k] = mapColours(v, k);
    return out;
  }
  return value;
}

type AxisKey = 'xaxis' | 'xaxis2' | 'yaxis' | 'yaxis2';
const AXIS_KEYS: readonly AxisKey[] = ['xaxis', 'xaxis2', 'yaxis', 'yaxis2'];

/**
 * The figure in the theme's colours. Light returns the figure as written, with an opaque paper (so
 * an exported image is readable anywhere); dark recolours it as described above.
 */
export function themeFigure(data: readonly PlotTrace[], layout: PlotLayout, theme: PlotTheme): { data: readonly PlotTrace[]; layout: PlotLayout } {
  const s = PLOT_SURROUNDINGS[theme];
  if (theme === 'light') return { data, layout: { ...layout, paper_bgcolor: s.paper } };
  const mapped = mapColours(layout, null) as PlotLayout;
  const themed: PlotLayout = {
    ...mapped,
    paper_bgcolor: s.paper,
    plot_bgcolor: s.plot,
    font: { ...mapped.font, color: s.text },
    hoverlabel: { ...mapped.hoverlabel, bgcolor: s.hoverBg, bordercolor: s.hoverBorder, font: { ...mapped.hoverlabel?.font, color: s.text } },
    legend: { ...mapped.legend, bgcolor: s.legendBg, font: { ...mapped.legend?.font, color: s.text } },
  };
  for (const k of AXIS_KEYS) {
    const a = mapped[k];
    if (!a) continue;
    themed[k] = {
      ...a,
      // A grid hidden on purpose (a transparent colour) stays hidden.
      gridcolor: a.gridcolor !== undefined && parseColour(a.gridcolor)?.a === 0 ? a.gridcolor : s.grid,
      linecolor: s.axis,
      tickcolor: s.axis,
      tickfont: { ...a.tickfont, color: a.tickfont?.color ?? s.text },
      title: a.title ? { ...a.title, font: { ...a.title.font, color: s.muted } } : a.title,
    };
  }
  return { data: mapColours(data, null) as PlotTrace[], layout: themed };
}
