import { useMemo } from 'react';
import type { ChoiceRule, TemperatureCandidate } from '../../physics';
import { ChartFigure } from '../charts/ChartFigure';
import { formatSignificant } from '../units/format-number';
import { inTemperatureUnit } from '../charts/temperature-axis';
import { PlotlyChart } from '../plot/PlotlyChart';
import { useDisplayUnit } from '../units/use-display-unit';
import { speedFigure } from './speed-figure';

interface SpeedChartProps {
  id: string;
  speed_m_s: number;
  speedSd_m_s: number;
  candidates: readonly TemperatureCandidate[];
  chosen: number | null;
  rule: ChoiceRule | null;
}

/** u₂(T) with the measured speed as a band and the candidates where the band meets the curve; temperature in the display unit. */
export function SpeedChart({ id, speed_m_s, speedSd_m_s, candidates, chosen, rule }: SpeedChartProps) {
  const temperature = useDisplayUnit('temperature');
  const figure = useMemo(
    () => inTemperatureUnit(speedFigure({ speed_m_s, speedSd_m_s, candidates, chosen, rule }), temperature.unit),
    [speed_m_s, speedSd_m_s, candidates, chosen, rule, temperature.unit],
  );
  const where = candidates.map((c) => `${temperature.measured(c.temperature_K, c.sd_K).value} ${temperature.shown}`).join(', ');
  const summary = `u = ${formatSignificant(speed_m_s)} ± ${formatSignificant(speedSd_m_s, 2)} m/s meets u₂(T) at ${candidates.length === 0 ? 'no temperature' : where}.`;
  return (
    <ChartFigure
      id={id}
      title="Where the measured speed meets u₂(T)"
      caption={
        <>
          <span className="caption-values">{summary}</span> Amber band: the measured speed ± sd. Dots: candidates, with their ± sd in temperature;
          amber diamond: the chosen one. Dotted line: the temperature the chosen rule points at.
        </>
      }
    >
      <PlotlyChart chartId={id} label={`Chart of u₂ against temperature. ${summary}`} data={figure.data} layout={figure.layout} />
    </ChartFigure>
  );
}
