/**
 * The u₂(T) figure of a conversion: the curve, the measured speed ± sd as a horizontal band, each
 * candidate marked with its ± sd in T, the chosen one in amber, and what the rule points at (the
 * vapour-pressure or expected temperature, or the range). The axes zoom to where the curve is near
 * the measured speed, so the three crossings between the extrema can be told apart.
 */
import { type ChoiceRule, secondSound, T_LAMBDA_K, type TemperatureCandidate } from '../../physics';
import { axis, baseLayout, CHART_COLOURS, referenceLine, temperatureBand } from '../charts/chart-theme';
import { propertyCurves } from '../charts/curves';
import { lambdaLabel } from '../charts/labels';
import type { PlotLayout, PlotShape, PlotTrace } from '../plot/plotly-types';
import { ruleTemperature } from './candidate-notes';

/** Names of the figure's parts (tests and readers of the figure find them). */
export const SPEED_BAND_SHAPE = 'measured-speed';
export const CANDIDATE_TRACE = 'Candidates';
export const CHOSEN_TRACE = 'Chosen';

const CURVE_TRACE: { current: PlotTrace | null } = { current: null };

function curveTrace(): PlotTrace {
  if (CURVE_TRACE.current) return CURVE_TRACE.current;
  const curves = propertyCurves();
  const x: number[] = [];
  const y: number[] = [];
  curves.temperature_K.forEach((T, i) => {
    const u = curves.secondSound_m_s[i];
    if (u != null && T <= T_LAMBDA_K) {
      x.push(T);
      y.push(u);
    }
  });
  CURVE_TRACE.current = {
    type: 'scatter',
    name: 'u₂(T)',
    x,
    y,
    mode: 'lines',
    line: { color: CHART_COLOURS.secondSound, width: 2.2 },
    hovertemplate: 'T = %{x:.4f} K<br>u₂ = %{y:.4g} m/s<extra></extra>',
  };
  return CURVE_TRACE.current;
}

/** Speed shown on the curve at a candidate (the extremum's own speed for an extremum candidate). */
function speedAt(c: TemperatureCandidate): number {
  return secondSound(c.temperature_K);
}

export interface SpeedFigureInput {
  speed_m_s: number;
  speedSd_m_s: number;
  candidates: readonly TemperatureCandidate[];
  chosen: number | null;
  rule: ChoiceRule | null;
}

/** Axis ranges: speeds within ±30 % of the measured one (at least 15–25 m/s around the extrema). */
export function speedFigureRanges(speed: number, candidates: readonly TemperatureCandidate[]): { x: [number, number]; y: [number, number] } {
  let yLo = speed * 0.7;
  let yHi = speed * 1.3;
  if (speed < 30) {
    yLo = Math.min(yLo, 15);
    yHi = Math.max(yHi, 25);
  }
  const curve = curveTrace();
  let xLo = Number.POSITIVE_INFINITY;
  let xHi = Number.NEGATIVE_INFINITY;
  curve.x.forEach((T, i) => {
    const u = curve.y[i] as number;
    if (u >= yLo && u <= yHi) {
      xLo = Math.min(xLo, T);
      xHi = Math.max(xHi, T);
    }
  });
  for (const c of candidates) {
    xLo = Math.min(xLo, c.temperature_K);
    xHi = Math.max(xHi, c.temperature_K);
  }
  if (!Number.isFinite(xLo)) return { x: [0.3, 2.2], y: [yLo, yHi] };
  const pad = Math.max(0.03, (xHi - xLo) * 0.06);
  return { x: [Math.max(0.28, xLo - pad), Math.min(2.25, xHi + pad)], y: [Math.max(0, yLo), yHi] };
}

export function speedFigure({ speed_m_s, speedSd_m_s, candidates, chosen, rule }: SpeedFigureInput): { data: PlotTrace[]; layout: PlotLayout } {
  const others = candidates.filter((_, i) => i !== chosen);
  const pick = chosen === null ? undefined : candidates[chosen];
  const marker = (list: readonly TemperatureCandidate[], name: string, colour: string, size: number, symbol: string): PlotTrace => ({
    type: 'scatter',
    name,
    x: list.map((c) => c.temperature_K),
    y: list.map(speedAt),
    mode: 'markers',
    marker: { color: colour, size, symbol, line: { color: '#ffffff', width: 2 } },
    cliponaxis: false,
    text: list.map((c) => `${c.branch} branch${c.kind === 'extremum' ? ', extremum' : ''}${c.insensitive ? ', insensitive' : ''}`),
    hovertemplate: `%{x:.4f} K, %{text}<extra>${name}</extra>`,
  });
  const data: PlotTrace[] = [curveTrace(), marker(others, CANDIDATE_TRACE, CHART_COLOURS.ink, 10, 'circle')];
  if (pick) data.push(marker([pick], CHOSEN_TRACE, CHART_COLOURS.chosen, 14, 'diamond'));
  const shapes: PlotShape[] = [
    {
      name: SPEED_BAND_SHAPE,
      type: 'rect',
      xref: 'paper',
      yref: 'y',
      x0: 0,
      x1: 1,
      y0: speed_m_s - speedSd_m_s,
      y1: speed_m_s + speedSd_m_s,
      fillcolor: 'rgba(217, 119, 43, 0.28)',
      line: { color: 'rgba(217, 119, 43, 0.65)', width: 1 },
      layer: 'below',
    },
    referenceLine('lambda', T_LAMBDA_K),
    ...candidates.map(
      (c, i): PlotShape => ({
        name: `candidate-sd-${i + 1}`,
        type: 'line',
        xref: 'x',
        yref: 'y',
        x0: c.temperature_K - c.sd_K,
        x1: c.temperature_K + c.sd_K,
        y0: speedAt(c),
        y1: speedAt(c),
        line: { color: i === chosen ? CHART_COLOURS.chosen : CHART_COLOURS.ink, width: 3 },
        layer: 'above',
      }),
    ),
  ];
  const target = ruleTemperature(rule);
  if (target !== null) shapes.push({ ...referenceLine('rule-temperature', target), line: { color: CHART_COLOURS.chosen, width: 1.5, dash: 'dot' } });
  if (rule?.kind === 'range') shapes.push(temperatureBand('rule-range', rule.min_K, rule.max_K, 'rgba(217, 119, 43, 0.08)'));
  const ranges = speedFigureRanges(speed_m_s, candidates);
  return {
    data,
    layout: {
      ...baseLayout(),
      margin: { l: 56, r: 16, t: 30, b: 44 },
      legend: { orientation: 'h', x: 1, y: 1.01, xanchor: 'right', yanchor: 'bottom' },
      xaxis: axis('Temperature T (K)', { range: ranges.x }),
      yaxis: axis('u₂ (m/s)', { range: ranges.y }),
      shapes,
      annotations: [lambdaLabel('right')],
      uirevision: `${ranges.x.join()}|${ranges.y.join()}`,
    },
  };
}
