/**
 * The small part of Plotly's figure format that Sekundo uses, typed here because the basic bundle
 * ships no types. Add a field when a chart needs it; anything else stays out.
 */

export interface PlotFont {
  family?: string;
  size?: number;
  color?: string;
}

export interface PlotLine {
  /** One colour (a marker outline may take one per point). */
  color?: string | readonly string[];
  width?: number;
  dash?: 'solid' | 'dot' | 'dash' | 'longdash' | 'dashdot';
  shape?: 'linear' | 'spline';
}

/** A colour bar beside a chart whose markers carry a colour scale. */
export interface PlotColorBar {
  title?: { text: string; side?: 'right' | 'top' | 'bottom'; font?: PlotFont };
  tickvals?: readonly number[];
  ticktext?: readonly string[];
  tickfont?: PlotFont;
  thickness?: number;
  len?: number;
  x?: number;
  y?: number;
  yanchor?: 'top' | 'middle' | 'bottom';
  outlinewidth?: number;
}

export interface PlotMarker {
  /** One colour, one colour per point, or one number per point read through `colorscale`. */
  color?: string | readonly string[] | readonly number[];
  size?: number;
  /** One symbol, or one per point. */
  symbol?: string | readonly string[];
  line?: PlotLine;
  opacity?: number;
  /** [[fraction 0–1, colour], …] for numeric colours. */
  colorscale?: readonly (readonly [number, string])[];
  cmin?: number;
  cmax?: number;
  showscale?: boolean;
  colorbar?: PlotColorBar;
}

export interface PlotTrace {
  type: 'scatter';
  name: string;
  x: readonly number[];
  y: readonly (number | null)[];
  mode?: 'lines' | 'markers' | 'lines+markers' | 'none';
  line?: PlotLine;
  marker?: PlotMarker;
  xaxis?: string;
  yaxis?: string;
  hovertemplate?: string;
  /** Text per point, for `%{text}` in the hover template. */
  text?: readonly string[];
  /** Our own per-point text for `%{customdata}` (numbers; never user text, which goes in `text`). */
  customdata?: readonly string[];
  hoverinfo?: 'skip' | 'none';
  showlegend?: boolean;
  /** Traces sharing a group show and hide together from the legend. */
  legendgroup?: string;
  connectgaps?: boolean;
  cliponaxis?: boolean;
  fill?: 'none' | 'tozeroy' | 'tonexty' | 'toself';
  fillcolor?: string;
  opacity?: number;
}

export interface PlotAxis {
  title?: { text: string; font?: PlotFont; standoff?: number };
  range?: [number, number];
  autorange?: boolean;
  type?: 'linear' | 'log';
  domain?: [number, number];
  side?: 'left' | 'right';
  overlaying?: string;
  anchor?: string;
  matches?: string;
  showticklabels?: boolean;
  zeroline?: boolean;
  gridcolor?: string;
  linecolor?: string;
  tickcolor?: string;
  tickfont?: PlotFont;
  ticks?: '' | 'outside' | 'inside';
  showline?: boolean;
  mirror?: boolean;
  hoverformat?: string;
  tickformat?: string;
  dtick?: number;
  fixedrange?: boolean;
  tickvals?: readonly number[];
  ticktext?: readonly string[];
  nticks?: number;
  /** Ties this axis's scale to another ("x"): equal lengths in both directions. */
  scaleanchor?: string;
  scaleratio?: number;
  /** What gives way to keep the scale: the range or the axis domain. */
  constrain?: 'range' | 'domain';
  exponentformat?: 'none' | 'e' | 'E' | 'power' | 'SI' | 'B';
  /** 'auto': round ticks of its own; 'sync': at the overlaid axis's grid lines (not round). */
  tickmode?: 'auto' | 'linear' | 'array' | 'sync';
  showgrid?: boolean;
}

export interface PlotShape {
  /** Found by tests and by readers of the figure, e.g. "chosen-temperature". */
  name?: string;
  type: 'line' | 'rect';
  xref: string;
  yref: string;
  x0: number;
  x1: number;
  y0: number;
  y1: number;
  line?: PlotLine;
  fillcolor?: string;
  opacity?: number;
  layer?: 'above' | 'below';
}

export interface PlotAnnotation {
  name?: string;
  text: string;
  xref: string;
  yref: string;
  x: number;
  y: number;
  showarrow?: boolean;
  xanchor?: 'auto' | 'left' | 'center' | 'right';
  yanchor?: 'auto' | 'top' | 'middle' | 'bottom';
  font?: PlotFont;
  bgcolor?: string;
  align?: 'left' | 'center' | 'right';
  textangle?: number;
}

export interface PlotLayout {
  xaxis?: PlotAxis;
  xaxis2?: PlotAxis;
  yaxis?: PlotAxis;
  yaxis2?: PlotAxis;
  shapes?: PlotShape[];
  annotations?: PlotAnnotation[];
  margin?: { l?: number; r?: number; t?: number; b?: number; pad?: number };
  font?: PlotFont;
  paper_bgcolor?: string;
  plot_bgcolor?: string;
  showlegend?: boolean;
  legend?: {
    orientation?: 'h' | 'v';
    x?: number;
    y?: number;
    xanchor?: 'auto' | 'left' | 'center' | 'right';
    yanchor?: 'auto' | 'top' | 'middle' | 'bottom';
    font?: PlotFont;
    bgcolor?: string;
  };
  hovermode?: 'closest' | 'x' | 'x unified' | false;
  hoverlabel?: { font?: PlotFont; bgcolor?: string; bordercolor?: string };
  autosize?: boolean;
  height?: number;
  uirevision?: string | number;
  dragmode?: 'zoom' | 'pan' | false;
}

export interface PlotConfig {
  responsive: boolean;
  displaylogo: boolean;
  displayModeBar?: boolean | 'hover';
  typesetMath?: boolean;
  showSendToCloud?: boolean;
  showEditInChartStudio?: boolean;
  showTips?: boolean;
  doubleClick?: 'reset' | 'autosize' | 'reset+autosize' | false;
  toImageButtonOptions?: { filename?: string; format?: 'png' | 'svg' };
}

/** The functions of the Plotly bundle that the wrapper calls. */
export interface PlotlyApi {
  react(element: HTMLElement, data: readonly PlotTrace[], layout: PlotLayout, config: PlotConfig): Promise<unknown>;
  purge(element: HTMLElement): void;
  Plots: { resize(element: HTMLElement): Promise<unknown> | undefined };
  /**
   * The drawn chart as an image. With `imageDataOnly`, PNG comes as base64 text without the
   * "data:" prefix and SVG as the SVG text itself.
   */
  toImage(element: HTMLElement, options: PlotImageOptions): Promise<string>;
  /** Changes the drawn layout in place (axis ranges, for the chart's own zoom controls). */
  relayout(element: HTMLElement, update: Readonly<Record<string, unknown>>): Promise<unknown>;
}

/** A drawn chart element as Plotly leaves it: its events and the layout it settled on. */
export interface DrawnPlotElement extends HTMLElement {
  on?(event: 'plotly_relayout', handler: (update: Readonly<Record<string, unknown>>) => void): void;
  removeAllListeners?(event: 'plotly_relayout'): void;
  _fullLayout?: Readonly<Record<string, unknown>>;
}

/** What {@link PlotlyApi.toImage} makes. */
export interface PlotImageOptions {
  format: 'png' | 'svg';
  width?: number;
  height?: number;
  /** Pixels per CSS pixel of a PNG. */
  scale?: number;
  imageDataOnly?: boolean;
}
