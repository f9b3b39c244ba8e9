import { useId } from 'react';
import { useSekundoStore } from '../store';
import { TemperatureField } from './TemperatureField';
import { TemperaturePresets } from './TemperaturePresets';
import { TemperatureSlider } from './TemperatureSlider';
import { formatKelvin, formatMillikelvin } from './temperature-units';

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
      <TemperatureSlider />
      <TemperaturePresets />
    </section>
  );
}

function TemperatureReadout() {
  const temperature_K = useSekundoStore((state) => state.temperature_K);
  return (
    <output className="readout" aria-live="polite" aria-label="Temperature in effect">
      <span className="readout-main">{formatKelvin(temperature_K)} K</span>
      <span className="readout-alt">{formatMillikelvin(temperature_K)} mK</span>
    </output>
  );
}
