import { useMemo } from 'react';
import { type HeliumProperties, PROPERTIES_RANGE_K, SECOND_SOUND_MEASURED_MIN_K, T_LAMBDA_K } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { PlotlyChart } from '../plot/PlotlyChart';
import type { PlotLayout, PlotTrace } from '../plot/plotly-types';
import { useHeliumProperties } from '../store';
import { formatTemperature } from '../units/temperature-text';
import { useDisplayUnit } from '../units/use-display-unit';
import { ChartFigure } from './ChartFigure';
import {
  axis,
  baseLayout,
  CHART_COLOURS,
  chosenTemperatureLine,
  referenceLine,
  temperatureBand,
} from './chart-theme';
import { chosenPoint } from './chosen-point';
import { inTemperatureUnit, type TemperatureUnit } from './temperature-axis';
import { propertyCurves } from './curves';
import { lambdaLabel, modelRegionLabel } from './labels';

const U2_RANGE_M_S: [number, number] = [0, 145];
/** Room above and below the u1 curve, as a fraction of its span. */
const U1_PADDING = 0.08;

let curveTraces: PlotTrace[] | null = null;

/** The two speed curves, built once from the sweep. */
function speedCurves(): PlotTrace[] {
  if (curveTraces) return curveTraces;
  const curves = propertyCurves();
  curveTraces = [
    {
      type: 'scatter',
      name: 'u₂ second sound',
      x: curves.temperature_K,
      y: curves.secondSound_m_s,
      mode: 'lines',
      line: { color: CHART_COLOURS.secondSound, width: 2.2 },
      hovertemplate: 'T = %{x:.4f} K<br>u₂ = %{y:.4g} m/s<extra></extra>',
    },
    {
      type: 'scatter',
      name: 'u₁ first sound',
      x: curves.temperature_K,
      y: curves.firstSound_m_s,
      mode: 'lines',
      yaxis: 'y2',
      line: { color: CHART_COLOURS.firstSound, width: 2.2 },
      hovertemplate: 'T = %{x:.4f} K<br>u₁ = %{y:.4g} m/s<extra></extra>',
    },
  ];
  return curveTraces;
}

let u1Range: [number, number] | null = null;

/** The u1 axis range: the whole curve with some room. */
function firstSoundRange(): [number, number] {
  if (u1Range) return u1Range;
  const values = propertyCurves().firstSound_m_s;
  const low = Math.min(...values);
  const high = Math.max(...values);
  const pad = (high - low) * U1_PADDING;
  u1Range = [low - pad, high + pad];
  return u1Range;
}

function speedsLayout(temperature_K: number): PlotLayout {
  const [min, max] = PROPERTIES_RANGE_K;
  return {
    ...baseLayout(),
    legend: { orientation: 'h', x: 1, y: 1.01, xanchor: 'right', yanchor: 'bottom' },
    xaxis: axis('Temperature T (K)', { range: [min, max], anchor: 'y2' }),
    yaxis: axis('u₂ (m/s)', { domain: [0.4, 1], range: U2_RANGE_M_S, anchor: 'x' }),
    yaxis2: axis('u₁ (m/s)', { domain: [0, 0.3], range: firstSoundRange(), anchor: 'x' }),
    shapes: [
      temperatureBand('model-region', min, SECOND_SOUND_MEASURED_MIN_K, CHART_COLOURS.modelRegion),
      referenceLine('lambda', T_LAMBDA_K),
      chosenTemperatureLine(temperature_K),
    ],
    annotations: [modelRegionLabel(0.02, 'bottom'), lambdaLabel()],
  };
}

/** u2 and u1 against temperature, in two panels sharing the temperature axis. */
export function SpeedsChart() {
  const properties = useHeliumProperties();
  const T = properties.temperature_K;
  const data = useMemo(
    () => [
      ...speedCurves(),
      chosenPoint('u₂', T, properties.secondSound_m_s),
      chosenPoint('u₁', T, properties.firstSound_m_s, 'y2'),
    ],
    [T, properties],
  );
  const layout = useMemo(() => speedsLayout(T), [T]);
  const { unit } = useDisplayUnit('temperature');
  const summary = speedsSummary(properties, unit);
  const figure = useMemo(() => inTemperatureUnit({ data, layout }, unit), [data, layout, unit]);
  return (
    <ChartFigure
      id="speeds"
      title="Speeds of second and first sound"
      caption={
        <>
          <span className="caption-values">{summary}</span> Second sound exists only in He II, below Tλ = 2.1768 K;
          first sound exists on both sides. The grey band is the Landau-model region. Orange line: chosen temperature.
        </>
      }
    >
      <PlotlyChart chartId="speeds" label={`Chart of u₂ and u₁ against temperature. ${summary}`} data={figure.data} layout={figure.layout} />
    </ChartFigure>
  );
}

function speedsSummary(p: HeliumProperties, unit: TemperatureUnit): string {
  const u2 = p.secondSound_m_s === null ? 'no second sound (He I)' : `u₂ = ${formatSignificant(p.secondSound_m_s)} m/s`;
  return `At ${formatTemperature(p.temperature_K, unit)}: ${u2}, u₁ = ${formatSignificant(p.firstSound_m_s)} m/s.`;
}
