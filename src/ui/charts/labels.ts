import { PROPERTIES_RANGE_K, SECOND_SOUND_MEASURED_MIN_K, T_LAMBDA_K } from '../../physics';
import type { PlotAnnotation } from '../plot/plotly-types';
import { CHART_COLOURS } from './chart-theme';

/** "Tλ" written beside the lambda line, at height `y` of the plot (0 bottom, 1 top). */
export function lambdaLabel(side: 'left' | 'right' = 'left', y = 0.99): PlotAnnotation {
  return {
    name: 'lambda-label',
    text: 'Tλ',
    xref: 'x',
    yref: 'paper',
    x: T_LAMBDA_K,
    y,
    // The label sits beside the line, on the side where the plot has room.
    xanchor: side === 'left' ? 'left' : 'right',
    yanchor: 'top',
    showarrow: false,
    font: { size: 12, color: CHART_COLOURS.inkMuted },
  };
}

/** Names the Landau-model band, at height `y` of the plot (0 bottom, 1 top). */
export function modelRegionLabel(y: number, yanchor: 'top' | 'middle' | 'bottom'): PlotAnnotation {
  return {
    name: 'model-region-label',
    text: 'model',
    xref: 'x',
    yref: 'paper',
    x: (PROPERTIES_RANGE_K[0] + SECOND_SOUND_MEASURED_MIN_K) / 2,
    y,
    xanchor: 'center',
    yanchor,
    showarrow: false,
    font: { size: 11, color: CHART_COLOURS.inkMuted },
  };
}
