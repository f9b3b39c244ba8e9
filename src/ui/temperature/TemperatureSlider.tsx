import type { CSSProperties } from 'react';
import { PROPERTIES_RANGE_K, T_LAMBDA_K } from '../../physics';
import { HelpLabel, type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { useDisplayUnit } from '../units/use-display-unit';
import { formatTemperature, otherTemperatureUnit } from '../units/temperature-text';

/** Slider step, K: 10 mK per arrow key; the typed field reaches any value in between. */
export const SLIDER_STEP_K = 0.01;

const [MIN_K, MAX_K] = PROPERTIES_RANGE_K;
/** Where Tλ sits along the track, as a percentage (the track is coloured He II | He I). */
const LAMBDA_PERCENT = ((T_LAMBDA_K - MIN_K) / (MAX_K - MIN_K)) * 100;
const TRACK_STYLE = { '--lambda-position': `${LAMBDA_PERCENT}%` } as CSSProperties;

/** Sweeps the temperature over the whole range; the track shows where He II ends. */
export function TemperatureSlider({ help }: { help: HelpTopic }) {
  const temperature_K = useSekundoStore((state) => state.temperature_K);
  const setTemperature = useSekundoStore((state) => state.chooseTemperature);
  const { unit } = useDisplayUnit('temperature');
  const fieldHelp = useFieldHelp('sweep the temperature', help);
  return (
    <div className="slider-block" style={TRACK_STYLE}>
      <HelpLabel htmlFor="temperature-slider" help={fieldHelp}>
        Sweep the temperature
      </HelpLabel>
      <input
        id="temperature-slider"
        className="temperature-slider"
        type="range"
        min={MIN_K}
        max={MAX_K}
        step={SLIDER_STEP_K}
        value={temperature_K}
        aria-valuetext={`${formatTemperature(temperature_K, unit)} (${formatTemperature(temperature_K, otherTemperatureUnit(unit))})`}
        aria-describedby={fieldHelp.describedBy}
        onChange={(event) => setTemperature(Number(event.target.value))}
      />
      <div className="slider-scale" aria-hidden="true">
        <span className="slider-scale__min">{MIN_K} K</span>
        <span className="slider-scale__lambda">He II | He I · Tλ {T_LAMBDA_K} K</span>
        <span className="slider-scale__max">{MAX_K} K</span>
      </div>
    </div>
  );
}
