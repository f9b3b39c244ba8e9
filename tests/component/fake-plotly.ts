import type { PlotConfig, PlotImageOptions, PlotLayout, PlotlyApi, PlotShape, PlotTrace } from '../../src/ui/plot/plotly-types';

/*
 * A stand-in for the Plotly bundle (jsdom cannot draw it): records what each chart is given so
 * tests can check the figure itself, e.g. where the chosen-temperature marker is.
 */

export interface DrawCall {
  chartId: string | null;
  element: HTMLElement;
  data: readonly PlotTrace[];
  layout: PlotLayout;
  config: PlotConfig;
}

/** A change of a drawn chart's layout (the chart's own zoom buttons). */
export interface RelayoutCall {
  chartId: string | null;
  update: Readonly<Record<string, unknown>>;
}

/** A request for a chart's image (export). */
export interface ImageCall {
  chartId: string | null;
  options: PlotImageOptions;
}

export const fakePlotly = {
  draws: [] as DrawCall[],
  purged: [] as HTMLElement[],
  images: [] as ImageCall[],
  relayouts: [] as RelayoutCall[],
  /** Chart id whose drawing fails, to exercise the error boundaries. */
  failFor: null as string | null,
  reset(): void {
    this.draws = [];
    this.purged = [];
    this.images = [];
    this.relayouts = [];
    this.failFor = null;
  },
};

export const fakePlotlyApi: PlotlyApi = {
  react(element, data, layout, config) {
    const chartId = element.getAttribute('data-chart');
    if (chartId !== null && chartId === fakePlotly.failFor) {
      return Promise.reject(new Error('Fake drawing failure.'));
    }
    fakePlotly.draws.push({ chartId, element, data, layout, config });
    return Promise.resolve(element);
  },
  purge(element) {
    fakePlotly.purged.push(element);
  },
  Plots: { resize: () => undefined },
  relayout(element, update) {
    fakePlotly.relayouts.push({ chartId: element.getAttribute('data-chart'), update });
    return Promise.resolve(element);
  },
  toImage(element, options) {
    fakePlotly.images.push({ chartId: element.getAttribute('data-chart'), options });
    // A tiny stand-in image: SVG text, or base64 for PNG ("PNG" in ASCII).
    return Promise.resolve(options.format === 'svg' ? '<svg xmlns="http://www.w3.org/2000/svg"></svg>' : 'UE5H');
  },
};

/** The last figure drawn for a chart, or undefined if it was never drawn. */
export function lastDraw(chartId: string): DrawCall | undefined {
  return fakePlotly.draws.filter((draw) => draw.chartId === chartId).at(-1);
}

/** The named shape of the last figure drawn for a chart. */
export function lastShape(chartId: string, name: string): PlotShape | undefined {
  return lastDraw(chartId)?.layout.shapes?.find((shape) => shape.name === name);
}
