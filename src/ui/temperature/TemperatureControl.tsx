import { useId } from 'react';
import { useSekundoStore } from '../store';
import { TemperatureField } from './TemperatureField';
import { TemperaturePresets } from './TemperaturePresets';
import { TemperatureSlider } from './TemperatureSlider';
import { TEMPERATURE_HELP } from './temperature-help';
import { useDisplayUnit } from '../units/use-display-unit';
import { formatTemperature, otherTemperatureUnit } from '../units/temperature-text';

/** The chosen temperature: readout, typed field, slider and quick picks. */
export function TemperatureControl() {
  const headingId = useId();
  return (
    <section className="card temperature-card" aria-labelledby={headingId}>
      <div className="card-head">
        <h2 id={headingId} className="card-title">
          Temperature
        </h2>
        <TemperatureReadout />
      </div>
      <TemperatureField />
      <TemperatureSlider help={TEMPERATURE_HELP.slider} />
      <TemperaturePresets />
    </section>
  );
}

function TemperatureReadout() {
  const temperature_K = useSekundoStore((state) => state.temperature_K);
  const { unit } = useDisplayUnit('temperature');
  return (
    <output className="readout" aria-live="polite" aria-label="Temperature in effect">
      <span className="readout-main">{formatTemperature(temperature_K, unit)}</span>
      <span className="readout-alt">{formatTemperature(temperature_K, otherTemperatureUnit(unit))}</span>
    </output>
  );
}
