import { type RefObject, useEffect, useRef, useState } from 'react';
import { loadPlotly } from './load-plotly';
import type { PlotConfig, PlotLayout, PlotlyApi, PlotTrace } from './plotly-types';

/** One config for every chart: no logo, no cloud, no math typesetting, resizes with its box. */
export const PLOT_CONFIG: PlotConfig = {
  responsive: true,
  displaylogo: false,
  displayModeBar: 'hover',
  modeBarButtonsToRemove: ['select2d', 'lasso2d', 'autoScale2d'],
  typesetMath: false,
  showSendToCloud: false,
  showEditInChartStudio: false,
  showTips: false,
  doubleClick: 'reset',
  toImageButtonOptions: { format: 'png' },
};

export interface PlotlyChartProps {
  /** Stable id of the chart, set as data-chart on the plot element (tests read the figure there). */
  chartId: string;
  /** What the chart shows, for people who cannot see it. */
  label: string;
  data: readonly PlotTrace[];
  layout: PlotLayout;
  /** Called after each successful draw (e.g. to time a redraw). */
  onDrawn?: (element: HTMLElement) => void;
}

/**
 * A thin wrapper around Plotly: draws with Plotly.react whenever data or layout change, purges on
 * unmount. A failure to load or draw is thrown during render, for the nearest error boundary.
 */
export function PlotlyChart({ chartId, label, data, layout, onDrawn }: PlotlyChartProps) {
  const surface = useRef<HTMLDivElement>(null);
  const loaded = usePlotly();
  const plotly = loaded instanceof Error ? null : loaded;
  const [drawn, setDrawn] = useState(false);
  const [failure, setFailure] = useState<Error | null>(null);
  // Read at draw time, so a new callback alone does not redraw the chart.
  const drawnCallback = useRef(onDrawn);
  drawnCallback.current = onDrawn;

  useEffect(() => {
    const element = surface.current;
    if (!plotly || !element) return;
    let live = true;
    plotly.react(element, data, layout, PLOT_CONFIG).then(
      () => {
        if (!live) return;
        setDrawn(true);
        drawnCallback.current?.(element);
      },
      (error: unknown) => live && setFailure(asError(error)),
    );
    return () => {
      live = false;
    };
  }, [plotly, data, layout]);

  useEffect(() => {
    const element = surface.current;
    if (!plotly || !element) return;
    return () => plotly.purge(element);
  }, [plotly]);

  useResizeWithBox(surface, plotly);

  if (loaded instanceof Error) throw loaded;
  if (failure) throw failure;
  return (
    <div className="plot-frame">
      <div ref={surface} className="plot-surface" role="img" aria-label={label} data-chart={chartId} data-drawn={drawn} />
      {drawn ? null : <p className="plot-loading">Drawing chart…</p>}
    </div>
  );
}

/** Plotly once loaded; null while loading; the Error if it failed. */
function usePlotly(): PlotlyApi | Error | null {
  const [plotly, setPlotly] = useState<PlotlyApi | Error | null>(null);
  useEffect(() => {
    let live = true;
    loadPlotly().then(
      (api) => live && setPlotly(() => api),
      (error: unknown) => live && setPlotly(asError(error)),
    );
    return () => {
      live = false;
    };
  }, []);
  return plotly;
}

/** Responsive config follows the window; this also follows the chart's own box (grid changes). */
function useResizeWithBox(surface: RefObject<HTMLDivElement | null>, plotly: PlotlyApi | null): void {
  useEffect(() => {
    const element = surface.current;
    if (!plotly || !element || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(() => {
      if (element.classList.contains('js-plotly-plot')) void plotly.Plots.resize(element);
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, [surface, plotly]);
}

function asError(error: unknown): Error {
  return error instanceof Error ? error : new Error(String(error));
}
