import { useMemo } from 'react';
import { type HeliumProperties, T_LAMBDA_K } from '../../physics';
import { formatFixed, formatSignificant } from '../units/format-number';
import { PlotlyChart } from '../plot/PlotlyChart';
import type { PlotAnnotation, PlotLayout, PlotShape, PlotTrace } from '../plot/plotly-types';
import { useHeliumProperties } from '../store';
import { formatTemperature } from '../units/temperature-text';
import { useDisplayUnit } from '../units/use-display-unit';
import { ChartFigure } from './ChartFigure';
import { axis, baseLayout, CHART_COLOURS, chosenTemperatureLine, referenceLine, temperatureBand } from './chart-theme';
import { chosenPoint } from './chosen-point';
import { inTemperatureUnit, type TemperatureUnit } from './temperature-axis';
import {
  INSENSITIVE_SLOPE_M_S_K,
  insensitiveIntervals,
  propertyCurves,
  type SecondSoundExtreme,
  secondSoundExtremes,
  type TemperatureInterval,
} from './curves';
import { lambdaLabel } from './labels';

/** Temperatures shown, K: the measured He II curve where time-of-flight thermometry is done. */
export const THERMOMETRY_VIEW_K: [number, number] = [0.9, T_LAMBDA_K];
const U2_RANGE_M_S: [number, number] = [0, 23.5];
const SLOPE_RANGE_M_S_K: [number, number] = [-32, 10];

interface ThermometryCurves {
  traces: PlotTrace[];
  intervals: TemperatureInterval[];
  extremes: SecondSoundExtreme[];
}

let built: ThermometryCurves | null = null;

/** u2 and its slope, the insensitive intervals and the extremes, built once from the sweep. */
export function thermometryCurves(): ThermometryCurves {
  if (built) return built;
  const curves = propertyCurves();
  built = {
    traces: [
      {
        type: 'scatter',
        name: 'u₂',
        x: curves.temperature_K,
        y: curves.secondSound_m_s,
        mode: 'lines',
        line: { color: CHART_COLOURS.secondSound, width: 2.2 },
        hovertemplate: 'T = %{x:.4f} K<br>u₂ = %{y:.4g} m/s<extra></extra>',
      },
      {
        type: 'scatter',
        name: 'du₂/dT',
        x: curves.temperature_K,
        y: curves.secondSoundSlope_m_s_K,
        mode: 'lines',
        yaxis: 'y2',
        line: { color: CHART_COLOURS.firstSound, width: 1.8 },
        hovertemplate: 'T = %{x:.4f} K<br>du₂/dT = %{y:.3g} m/s/K<extra></extra>',
      },
    ],
    intervals: insensitiveIntervals(curves.temperature_K, curves.secondSoundSlope_m_s_K, INSENSITIVE_SLOPE_M_S_K),
    extremes: secondSoundExtremes(curves),
  };
  return built;
}

function thresholdBand(): PlotShape {
  return {
    name: 'threshold-band',
    type: 'rect',
    xref: 'paper',
    yref: 'y2',
    x0: 0,
    x1: 1,
    y0: -INSENSITIVE_SLOPE_M_S_K,
    y1: INSENSITIVE_SLOPE_M_S_K,
    fillcolor: CHART_COLOURS.insensitive,
    line: { width: 0 },
    layer: 'below',
  };
}

function extremeLabel(extreme: SecondSoundExtreme): PlotAnnotation {
  return {
    name: `u2-${extreme.kind}`,
    text: `u₂ ${extreme.kind === 'minimum' ? 'min' : 'max'} ${formatFixed(extreme.temperature_K, 3)} K`,
    xref: 'x',
    yref: 'paper',
    x: extreme.temperature_K,
    y: 1.005,
    xanchor: 'center',
    yanchor: 'bottom',
    showarrow: false,
    font: { size: 11, color: CHART_COLOURS.normal },
  };
}

function outOfViewNote(temperature_K: number, unit: TemperatureUnit): PlotAnnotation | null {
  const [from, to] = THERMOMETRY_VIEW_K;
  if (temperature_K >= from && temperature_K < to) return null;
  const why = temperature_K >= to ? 'He I, no second sound' : 'below this view';
  return {
    name: 'chosen-out-of-view',
    text: `Chosen ${formatTemperature(temperature_K, unit)}: ${why}`,
    xref: 'paper',
    yref: 'paper',
    x: 0.02,
    y: 0.45,
    xanchor: 'left',
    yanchor: 'bottom',
    showarrow: false,
    bgcolor: 'rgba(255,255,255,0.85)',
    font: { size: 12, color: CHART_COLOURS.chosen },
  };
}

function thermometryLayout(temperature_K: number, curves: ThermometryCurves, unit: TemperatureUnit): PlotLayout {
  const note = outOfViewNote(temperature_K, unit);
  return {
    ...baseLayout(),
    showlegend: false,
    margin: { l: 64, r: 20, t: 30, b: 48 },
    xaxis: axis('Temperature T (K)', { range: THERMOMETRY_VIEW_K, anchor: 'y2' }),
    yaxis: axis('u₂ (m/s)', { domain: [0.42, 1], range: U2_RANGE_M_S, anchor: 'x' }),
    yaxis2: axis('du₂/dT (m/s/K)', { domain: [0, 0.34], range: SLOPE_RANGE_M_S_K, anchor: 'x' }),
    shapes: [
      ...curves.intervals.map((interval, i) =>
        temperatureBand(`insensitive-${i}`, interval.from_K, interval.to_K, CHART_COLOURS.insensitive),
      ),
      thresholdBand(),
      referenceLine('lambda', T_LAMBDA_K),
      chosenTemperatureLine(temperature_K),
    ],
    annotations: [...curves.extremes.map(extremeLabel), lambdaLabel('right'), ...(note ? [note] : [])],
  };
}

/** u2 in He II with the temperatures where a time of flight pins T poorly shaded. */
export function ThermometryChart() {
  const properties = useHeliumProperties();
  const T = properties.temperature_K;
  const curves = thermometryCurves();
  const data = useMemo(
    () => [
      ...curves.traces,
      chosenPoint('u₂', T, properties.secondSound_m_s),
      chosenPoint('du₂/dT', T, properties.secondSoundSlope_m_s_K, 'y2'),
    ],
    [curves, T, properties],
  );
  const { unit } = useDisplayUnit('temperature');
  const layout = useMemo(() => thermometryLayout(T, curves, unit), [T, curves, unit]);
  const summary = thermometrySummary(properties, unit);
  const figure = useMemo(() => inTemperatureUnit({ data, layout }, unit), [data, layout, unit]);
  return (
    <ChartFigure
      id="thermometry"
      title="Where a time of flight pins the temperature"
      caption={
        <>
          <span className="caption-values">{summary}</span> Shaded: |du₂/dT| &lt; {INSENSITIVE_SLOPE_M_S_K} m/s/K, where
          time-of-flight thermometry is insensitive — a 0.1 % error in the delay moves the inferred temperature by more
          than 10 mK. {intervalsText(curves.intervals)}
        </>
      }
    >
      <PlotlyChart
        chartId="thermometry"
        label={`Chart of u₂ and du₂/dT in He II with insensitive regions shaded. ${summary}`}
        data={figure.data}
        layout={figure.layout}
      />
    </ChartFigure>
  );
}

function intervalsText(intervals: readonly TemperatureInterval[]): string {
  if (intervals.length === 0) return '';
  const list = intervals.map((i) => `${formatFixed(i.from_K, 3)}–${formatFixed(i.to_K, 3)} K`).join(' and ');
  return `Insensitive here: ${list}.`;
}

function thermometrySummary(p: HeliumProperties, unit: TemperatureUnit): string {
  if (p.secondSound_m_s === null || p.secondSoundSlope_m_s_K === null) {
    return `At ${formatTemperature(p.temperature_K, unit)}: He I, no second sound.`;
  }
  const slope = p.secondSoundSlope_m_s_K;
  const verdict = Math.abs(slope) < INSENSITIVE_SLOPE_M_S_K ? 'insensitive' : 'usable';
  return `At ${formatTemperature(p.temperature_K, unit)}: u₂ = ${formatSignificant(p.secondSound_m_s)} m/s, du₂/dT = ${formatSignificant(slope, 3)} m/s/K (${verdict}).`;
}
