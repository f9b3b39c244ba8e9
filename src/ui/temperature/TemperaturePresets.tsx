import { T_LAMBDA_K } from '../../physics';
import { propertyCurves, secondSoundExtremes } from '../charts/curves';
import { formatFixed } from '../units/format-number';
import { useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { useDisplayUnit } from '../units/use-display-unit';
import { TEMPERATURE_HELP } from './temperature-help';

interface Preset {
  label: string;
  temperature_K: number;
}

/** How far below Tλ the "near Tλ" pick sits, K. */
const NEAR_LAMBDA_BELOW_K = 0.005;
/** A temperature in He I near the normal boiling point, K. */
const HE_I_PICK_K = 4.2;

let presets: Preset[] | null = null;

/** Notable temperatures: the u2 extremes (from the sweep), just below Tλ, and He I. */
function notableTemperatures(): Preset[] {
  if (presets) return presets;
  const extremes = secondSoundExtremes(propertyCurves()).map((extreme) => ({
    label: `u₂ ${extreme.kind === 'minimum' ? 'min' : 'max'}`,
    temperature_K: Number(extreme.temperature_K.toFixed(4)),
  }));
  presets = [
    ...extremes,
    { label: 'near Tλ', temperature_K: Number((T_LAMBDA_K - NEAR_LAMBDA_BELOW_K).toFixed(4)) },
    { label: 'He I', temperature_K: HE_I_PICK_K },
  ];
  return presets;
}

/** One-click jumps to notable temperatures. */
export function TemperaturePresets() {
  const setTemperature = useSekundoStore((state) => state.chooseTemperature);
  const { unit } = useDisplayUnit('temperature');
  const help = useFieldHelp('jump to', TEMPERATURE_HELP.presets);
  return (
    <fieldset className="presets">
      <legend className="field-label field-head">Jump to {help.button}</legend>
      {help.panel}
      <div className="chips">
      {notableTemperatures().map((preset) => (
        <button
          key={preset.label}
          type="button"
          className="chip"
          aria-describedby={help.describedBy}
          onClick={() => setTemperature(preset.temperature_K)}
        >
          <span className="chip__label">{preset.label}</span>{' '}
          {unit === 'mK' ? `${formatFixed(preset.temperature_K * 1000, 0)} mK` : `${formatFixed(preset.temperature_K, 3)} K`}
        </button>
      ))}
      </div>
    </fieldset>
  );
}
