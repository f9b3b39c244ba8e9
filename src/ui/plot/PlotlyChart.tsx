import { type RefObject, useEffect, useMemo, useRef, useState } from 'react';
import { DownloadIcon } from '../export/CsvExportButton';
import { base64Bytes, downloadBlob, fileSlug } from '../export/download';
import { useResolvedTheme } from '../theme/use-theme';
import { loadPlotly } from './load-plotly';
import { plainFigure } from './plain-text';
import { themeFigure } from './plot-theme';
import type { PlotConfig, PlotLayout, PlotlyApi, PlotTrace } from './plotly-types';

/** One config for every chart: no logo, no cloud, no math typesetting, resizes with its box. */
export const PLOT_CONFIG: PlotConfig = {
  responsive: true,
  displaylogo: false,
  displayModeBar: 'hover',
  // Images come from the export buttons under each chart (keyboard-reachable, PNG and SVG).
  modeBarButtonsToRemove: ['select2d', 'lasso2d', 'autoScale2d', 'toImage'],
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
 * A thin wrapper around Plotly: draws with Plotly.react whenever data, layout or the page's theme
 * change (figures are written in the light palette; plot-theme.ts gives the dark one), purges on
 * unmount, and offers the chart as PNG and SVG. Every text it draws is plain text (plain-text.ts). A failure to load or draw is thrown during render,
 * for the nearest error boundary.
 */
export function PlotlyChart({ chartId, label, data, layout, onDrawn }: PlotlyChartProps) {
  const surface = useRef<HTMLDivElement>(null);
  const loaded = usePlotly();
  const plotly = loaded instanceof Error ? null : loaded;
  const [drawn, setDrawn] = useState(false);
  const [failure, setFailure] = useState<Error | null>(null);
  const theme = useResolvedTheme();
  const figure = useMemo(() => {
    const plain = plainFigure(data, layout);
    return themeFigure(plain.data, plain.layout, theme);
  }, [data, layout, theme]);
  // Read at draw time, so a new callback alone does not redraw the chart.
  const drawnCallback = useRef(onDrawn);
  drawnCallback.current = onDrawn;

  useEffect(() => {
    const element = surface.current;
    if (!plotly || !element) return;
    let live = true;
    plotly.react(element, figure.data, figure.layout, PLOT_CONFIG).then(
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
  }, [plotly, figure]);

  useEffect(() => {
    const element = surface.current;
    if (!plotly || !element) return;
    return () => plotly.purge(element);
  }, [plotly]);

  useResizeWithBox(surface, plotly);

  if (loaded instanceof Error) throw loaded;
  if (failure) throw failure;
  return (
    <div className="plot-box">
      <div className="plot-frame">
        <div ref={surface} className="plot-surface" role="img" aria-label={label} data-chart={chartId} data-drawn={drawn} />
        {drawn ? null : <p className="plot-loading">Drawing chart…</p>}
      </div>
      <ChartExport chartId={chartId} label={label} plotly={drawn ? plotly : null} surface={surface} />
    </div>
  );
}

/** Height of the export buttons' row under each chart, px (app/styles.css .plot-tools): boxes of fixed height leave room for it. */
export const PLOT_TOOLS_HEIGHT_PX = 30;

type ImageFormat = 'png' | 'svg';
/** Pixels per CSS pixel of an exported PNG: sharp on paper and on high-density screens. */
const PNG_SCALE = 2;

/**
 * Saves the drawn chart as it is on screen (theme, zoom) in the chart library's own renderer; the
 * file is named after the chart id. Buttons, so the keyboard reaches them.
 */
function ChartExport({ chartId, label, plotly, surface }: { chartId: string; label: string; plotly: PlotlyApi | null; surface: RefObject<HTMLDivElement | null> }) {
  const [status, setStatus] = useState<string | null>(null);
  const what = shortLabel(label);
  const save = async (format: ImageFormat) => {
    const element = surface.current;
    if (!plotly || !element) return;
    setStatus(null);
    try {
      // The size on screen (Plotly would otherwise draw a copy at its default 700 × 450 px).
      const size = { width: Math.round(element.clientWidth) || undefined, height: Math.round(element.clientHeight) || undefined };
      const image = await plotly.toImage(element, { format, imageDataOnly: true, ...size, ...(format === 'png' ? { scale: PNG_SCALE } : {}) });
      const blob = format === 'svg' ? new Blob([image], { type: 'image/svg+xml' }) : new Blob([base64Bytes(image)], { type: 'image/png' });
      downloadBlob(blob, `sekundo-${fileSlug(chartId)}.${format}`);
    } catch (error) {
      setStatus(`The ${format.toUpperCase()} could not be made: ${asError(error).message}`);
    }
  };
  return (
    <div className="plot-tools">
      {status ? (
        <p className="plot-tools__status" role="alert">
          {status}
        </p>
      ) : null}
      {(['png', 'svg'] as const).map((format) => (
        <button
          key={format}
          type="button"
          className="export-button"
          disabled={!plotly}
          aria-label={`Download ${what} as ${format.toUpperCase()}`}
          title={`Download the chart as ${format.toUpperCase()} (sekundo-${fileSlug(chartId)}.${format})`}
          onClick={() => void save(format)}
        >
          <DownloadIcon /> {format.toUpperCase()}
        </button>
      ))}
    </div>
  );
}

/** The chart named from its label up to the first full stop: "the chart of u₂ and u₁ against temperature". */
function shortLabel(label: string): string {
  const head = (label.split(/[.;](?:\s|$)/)[0] ?? '').trim();
  if (head.length === 0 || head.length > 120) return 'the chart';
  return /^Chart of /.test(head) ? head.replace(/^Chart of /, 'the chart of ') : `the chart “${head}”`;
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
      // A chart leaving the page (or hidden) is not resized; Plotly refuses such a div.
      if (!element.classList.contains('js-plotly-plot') || !element.isConnected || element.offsetParent === null) return;
      Promise.resolve(plotly.Plots.resize(element)).catch(() => undefined);
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, [surface, plotly]);
}

function asError(error: unknown): Error {
  return error instanceof Error ? error : new Error(String(error));
}
