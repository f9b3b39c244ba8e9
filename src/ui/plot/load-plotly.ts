import type { PlotlyApi } from './plotly-types';

/*
 * Plotly is loaded on first use, as its own chunk: the page shows its table before the 3 MB
 * bundle arrives, and component tests (jsdom, which cannot draw Plotly) replace this module.
 */

let pending: Promise<PlotlyApi> | null = null;

/** The Plotly bundle, loaded once. A failed load is retried on the next call. */
export function loadPlotly(): Promise<PlotlyApi> {
  if (!pending) {
    pending = import('plotly.js-basic-dist').then(asPlotlyApi, (error: unknown) => {
      pending = null;
      throw error;
    });
  }
  return pending;
}

function asPlotlyApi(module: unknown): PlotlyApi {
  const candidate = hasDefault(module) ? module.default : module;
  if (!isPlotlyApi(candidate)) throw new Error('The charting library loaded without Plotly.react/purge.');
  return candidate;
}

function hasDefault(value: unknown): value is { default: unknown } {
  return typeof value === 'object' && value !== null && 'default' in value && value.default != null;
}

function isPlotlyApi(value: unknown): value is PlotlyApi {
  if (typeof value !== 'object' || value === null) return false;
  const api = value as Partial<Record<keyof PlotlyApi, unknown>>;
  return typeof api.react === 'function' && typeof api.purge === 'function' && typeof api.Plots === 'object';
}
