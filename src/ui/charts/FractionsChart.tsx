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

let curveTraces: PlotTrace[] | null = null;

/** The two fraction curves, built once from the sweep. */
function fractionCurves(): PlotTrace[] {
  if (curveTraces) return curveTraces;
  const curves = propertyCurves();
  curveTraces = [
    {
      type: 'scatter',
      name: 'ρs/ρ superfluid',
      x: curves.temperature_K,
      y: curves.superfluidFraction,
      mode: 'lines',
      line: { color: CHART_COLOURS.superfluid, width: 2.2 },
      hovertemplate: 'T = %{x:.4f} K<br>ρs/ρ = %{y:.4f}<extra></extra>',
    },
    {
      type: 'scatter',
      name: 'ρn/ρ normal',
      x: curves.temperature_K,
      y: curves.normalFraction,
      mode: 'lines',
      line: { color: CHART_COLOURS.normal, width: 2.2, dash: 'dash' },
      hovertemplate: 'T = %{x:.4f} K<br>ρn/ρ = %{y:.4f}<extra></extra>',
    },
  ];
  return curveTraces;
}

function fractionsLayout(temperature_K: number): PlotLayout {
  const [min, max] = PROPERTIES_RANGE_K;
  return {
    ...baseLayout(),
    legend: { orientation: 'h', x: 1, y: 1.01, xanchor: 'right', yanchor: 'bottom' },
    xaxis: axis('Temperature T (K)', { range: [min, max] }),
    yaxis: axis('Fraction of the density', { range: [-0.02, 1.04], dtick: 0.25 }),
    shapes: [
      temperatureBand('model-region', min, SECOND_SOUND_MEASURED_MIN_K, CHART_COLOURS.modelRegion),
      referenceLine('lambda', T_LAMBDA_K),
      chosenTemperatureLine(temperature_K),
    ],
    annotations: [modelRegionLabel(0.5, 'middle'), lambdaLabel('left', 0.55)],
  };
}

/** Superfluid and normal fractions against temperature. */
export function FractionsChart() {
  const properties = useHeliumProperties();
  const T = properties.temperature_K;
  const data = useMemo(
    () => [
      ...fractionCurves(),
      chosenPoint('ρs/ρ', T, properties.superfluidFraction),
      chosenPoint('ρn/ρ', T, properties.normalFraction),
    ],
    [T, properties],
  );
  const layout = useMemo(() => fractionsLayout(T), [T]);
  const { unit } = useDisplayUnit('temperature');
  const summary = fractionsSummary(properties, unit);
  const figure = useMemo(() => inTemperatureUnit({ data, layout }, unit), [data, layout, unit]);
  return (
    <ChartFigure
      id="fractions"
      title="Superfluid and normal fractions"
      caption={
        <>
          <span className="caption-values">{summary}</span> The superfluid fraction falls to zero at Tλ; above it the
          liquid is all normal fluid (He I).
        </>
      }
    >
      <PlotlyChart
        chartId="fractions"
        label={`Chart of the superfluid and normal fractions against temperature. ${summary}`}
        data={figure.data}
        layout={figure.layout}
      />
    </ChartFigure>
  );
}

function fractionsSummary(p: HeliumProperties, unit: TemperatureUnit): string {
  return `At ${formatTemperature(p.temperature_K, unit)}: ρs/ρ = ${formatSignificant(p.superfluidFraction)}, ρn/ρ = ${formatSignificant(p.normalFraction)}.`;
}
