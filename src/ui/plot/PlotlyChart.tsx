import { type RefObject, useEffect, useMemo, useRef, useState } from 'react';
import { DownloadIcon } from '../export/CsvExportButton';
import { base64Bytes, downloadBlob, fileSlug } from '../export/download';
import { useResolvedTheme } from '../theme/use-theme';
import { loadPlotly } from './load-plotly';
import { plainFigure } from './plain-text';
import { sameFigure } from './same-figure';
import { themeFigure } from './plot-theme';
import type { DrawnPlotElement, PlotConfig, PlotLayout, PlotlyApi, PlotTrace } from './plotly-types';

/**
 * One config for every chart: no library toolbar (zoom, reset and the PNG/SVG export are the
 * chart's own buttons under it, reachable by keyboard), no logo, no cloud, no math typesetting,
 * resizes with its box. Dragging a box still zooms with a mouse; a double click resets.
 */
export const PLOT_CONFIG: PlotConfig = {
  responsive: true,
  displaylogo: false,
  displayModeBar: false,
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
  const touch = useCoarsePointer();
  const figure = useMemo(() => {
    const plain = plainFigure(data, layout);
    const themed = themeFigure(plain.data, plain.layout, theme);
    // On a touch screen a drag scrolls the page; the zoom buttons zoom.
    return touch && themed.layout.dragmode !== false ? { ...themed, layout: { ...themed.layout, dragmode: false as const } } : themed;
  }, [data, layout, theme, touch]);
  const zoomable = layout.dragmode !== false;
  // Read at draw time, so a new callback alone does not redraw the chart.
  const drawnCallback = useRef(onDrawn);
  drawnCallback.current = onDrawn;

  // The figure last drawn on this element: a new figure with the same values is not drawn again
  // (a redraw of a large figure holds the main thread, and a keystroke would wait behind it).
  const lastDrawn = useRef<{ figure: typeof figure; element: HTMLElement } | null>(null);

  useEffect(() => {
    const element = surface.current;
    if (!plotly || !element) return;
    const last = lastDrawn.current;
    if (last !== null && last.element === element && sameFigure(last.figure, figure)) {
      lastDrawn.current = { figure, element };
      drawnCallback.current?.(element);
      return;
    }
    let live = true;
    // Plotly keeps the layout it is given and changes it in place on every zoom: give it a copy, so
    // the figure stays what it was ("Whole chart" goes back to it).
    plotly.react(element, figure.data, structuredClone(figure.layout), PLOT_CONFIG).then(
      () => {
        if (!live) return;
        lastDrawn.current = { figure, element };
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
      <div className="plot-tools">
        {zoomable ? <ChartZoom plotly={drawn ? plotly : null} surface={surface} layout={figure.layout} what={shortLabel(label)} /> : null}
        <ChartExport chartId={chartId} label={label} plotly={drawn ? plotly : null} surface={surface} />
      </div>
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
    <>
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
    </>
  );
}

/** How much one press of "zoom in" narrows each axis (and "zoom out" widens it). */
const ZOOM_STEP = 2;

/**
 * The chart's own zoom: in and out about the middle of what is shown, and back to the figure's own
 * view. "Back" is offered only once the view differs from the figure (after a button, a dragged box
 * or a double click, which Plotly reports as a relayout).
 */
function ChartZoom({ plotly, surface, layout, what }: { plotly: PlotlyApi | null; surface: RefObject<HTMLDivElement | null>; layout: PlotLayout; what: string }) {
  const [zoomed, setZoomed] = useState(false);
  // A new figure is drawn at its own view.
  const [figureLayout, setFigureLayout] = useState(layout);
  if (figureLayout !== layout) {
    setFigureLayout(layout);
    setZoomed(false);
  }
  useEffect(() => {
    const element = surface.current as DrawnPlotElement | null;
    if (!plotly || !element?.on) return;
    element.on('plotly_relayout', (update) => {
      const keys = Object.keys(update);
      if (keys.some((k) => /^[xy]axis\d*\.range/.test(k))) setZoomed(true);
      else if (keys.some((k) => /^[xy]axis\d*\.autorange$/.test(k))) setZoomed(false);
    });
    return () => element.removeAllListeners?.('plotly_relayout');
  }, [plotly, surface]);
  const zoom = (factor: number) => {
    const element = surface.current as DrawnPlotElement | null;
    if (!plotly || !element) return;
    const update = zoomedRanges(element._fullLayout, factor);
    if (Object.keys(update).length > 0) void plotly.relayout(element, update);
  };
  const reset = () => {
    const element = surface.current;
    if (!plotly || !element) return;
    void plotly.relayout(element, figureRanges(layout, (surface.current as DrawnPlotElement)._fullLayout)).then(() => setZoomed(false));
  };
  return (
    <span className="plot-zoom">
      <button type="button" className="export-button plot-zoom__button" disabled={!plotly} aria-label={`Zoom in on ${what}`} title="Zoom in (or drag a box on the chart)" onClick={() => zoom(1 / ZOOM_STEP)}>
        <ZoomIcon sign="in" />
      </button>
      <button type="button" className="export-button plot-zoom__button" disabled={!plotly} aria-label={`Zoom out of ${what}`} title="Zoom out" onClick={() => zoom(ZOOM_STEP)}>
        <ZoomIcon sign="out" />
      </button>
      {zoomed ? (
        <button type="button" className="export-button" aria-label={`Back to the whole of ${what}`} title="Back to the chart's own view (or double-click the chart)" onClick={reset}>
          Whole chart
        </button>
      ) : null}
    </span>
  );
}

/** Axis names of a drawn layout: xaxis, xaxis2, yaxis … */
function axisNames(fullLayout: Readonly<Record<string, unknown>> | undefined): string[] {
  return Object.keys(fullLayout ?? {}).filter((k) => /^[xy]axis\d*$/.test(k));
}

/** New ranges for every numeric, zoomable axis: each scaled by `factor` about its middle. */
export function zoomedRanges(fullLayout: Readonly<Record<string, unknown>> | undefined, factor: number): Record<string, [number, number]> {
  const update: Record<string, [number, number]> = {};
  for (const name of axisNames(fullLayout)) {
    const axis = fullLayout?.[name] as { range?: unknown[]; fixedrange?: boolean } | undefined;
    const [a, b] = (axis?.range ?? []).map(Number);
    if (axis?.fixedrange || a === undefined || b === undefined || !Number.isFinite(a) || !Number.isFinite(b)) continue;
    const middle = (a + b) / 2;
    const half = ((b - a) / 2) * factor;
    update[`${name}.range`] = [middle - half, middle + half];
  }
  return update;
}

/** The figure's own view of every drawn axis: its stated range, or automatic where it states none. */
export function figureRanges(layout: PlotLayout, fullLayout: Readonly<Record<string, unknown>> | undefined): Record<string, unknown> {
  const update: Record<string, unknown> = {};
  for (const name of axisNames(fullLayout)) {
    const stated = (layout as Record<string, { range?: unknown } | undefined>)[name]?.range;
    if (Array.isArray(stated)) update[`${name}.range`] = [...stated];
    else update[`${name}.autorange`] = true;
  }
  return update;
}

function ZoomIcon({ sign }: { sign: 'in' | 'out' }) {
  return (
    <svg className="export-button__icon" viewBox="0 0 14 14" width="12" height="12" aria-hidden="true" focusable="false">
      <circle cx="6" cy="6" r="4.3" fill="none" stroke="currentColor" strokeWidth="1.6" />
      <path d={sign === 'in' ? 'M4 6h4M6 4v4' : 'M4 6h4'} stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
      <path d="M9.2 9.2l3.3 3.3" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
    </svg>
  );
}

/** True on a touch screen without a fine pointer (a phone or tablet), where a drag should scroll. */
function useCoarsePointer(): boolean {
  const [coarse, setCoarse] = useState(() => typeof matchMedia === 'function' && matchMedia('(pointer: coarse)').matches);
  useEffect(() => {
    if (typeof matchMedia !== 'function') return;
    const query = matchMedia('(pointer: coarse)');
    const follow = () => setCoarse(query.matches);
    query.addEventListener('change', follow);
    return () => query.removeEventListener('change', follow);
  }, []);
  return coarse;
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
