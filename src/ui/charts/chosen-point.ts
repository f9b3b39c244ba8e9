import type { PlotTrace } from '../plot/plotly-types';
import { CHART_COLOURS } from './chart-theme';

/** A marker at the chosen temperature on one curve; no point where the property is absent. */
export function chosenPoint(name: string, temperature_K: number, value: number | null, yaxis = 'y'): PlotTrace {
  return {
    type: 'scatter',
    name,
    x: value === null ? [] : [temperature_K],
    y: value === null ? [] : [value],
    mode: 'markers',
    yaxis,
    marker: { color: CHART_COLOURS.chosen, size: 10, symbol: 'circle', line: { color: '#ffffff', width: 2 } },
    showlegend: false,
    cliponaxis: false,
    hovertemplate: `Chosen: %{x:.4f} K, %{y:.4g}<extra>${name}</extra>`,
  };
}
