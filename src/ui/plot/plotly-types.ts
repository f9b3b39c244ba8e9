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
  color?: string;
  width?: number;
  dash?: 'solid' | 'dot' | 'dash' | 'longdash' | 'dashdot';
  shape?: 'linear' | 'spline';
}

export interface PlotTrace {
  type: 'scatter';
  name: string;
  x: readonly number[];
  y: readonly (number | null)[];
  mode?: 'lines' | 'markers' | 'lines+markers';
  line?: PlotLine;
  marker?: { color?: string; size?: number; symbol?: string; line?: PlotLine };
  xaxis?: string;
  yaxis?: string;
  hovertemplate?: string;
  showlegend?: boolean;
  connectgaps?: boolean;
  cliponaxis?: boolean;
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
}

export interface PlotConfig {
  responsive: boolean;
  displaylogo: boolean;
  displayModeBar?: boolean | 'hover';
  modeBarButtonsToRemove?: string[];
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
}
