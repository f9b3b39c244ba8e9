import { ITS90_RANGE_K, PROPERTIES_RANGE_K, SECOND_SOUND_MEASURED_MIN_K, T_LAMBDA_K } from '../../physics';
import type { HelpTopic } from '../help/FieldHelp';
import { DEFAULT_TEMPERATURE_K } from '../store';
import { SLIDER_STEP_K } from './TemperatureSlider';

const [MIN_K, MAX_K] = PROPERTIES_RANGE_K;

/** Help for the explorer's inputs: what each is, its units and range, where its first value comes from. */
export const TEMPERATURE_HELP = {
  field: {
    what: 'The bath temperature on ITS-90 (T90) at which every property, key figure and chart marker is shown.',
    units: 'K or mK; a bare number is in the unit shown beside the field (the header’s choice), or type the unit (1800 mK)',
    range: `${MIN_K}–${MAX_K} K. He II below Tλ = ${T_LAMBDA_K} K; measured second sound from ${SECOND_SOUND_MEASURED_MIN_K} K (below it the Landau model); ITS-90 vapour pressure from ${ITS90_RANGE_K[0]} K`,
    origin: `${DEFAULT_TEMPERATURE_K} K, a common He II working point`,
  },
  slider: {
    what: `The same temperature, swept: arrow keys move it by ${SLIDER_STEP_K * 1000} mK, Page Up and Page Down by more, Home and End to the ends.`,
    units: 'K (the readout above shows mK too)',
    range: `${MIN_K}–${MAX_K} K; the track turns grey above Tλ (He I)`,
    origin: 'follows the typed temperature',
  },
  presets: {
    what: 'Jumps to notable temperatures: the minimum and maximum of u₂ (where a time of flight pins the temperature worst), just below Tλ, and He I near the normal boiling point.',
    units: 'shown in the display unit of temperature',
    origin: 'the u₂ extremes are found on the curve itself; the others are fixed picks',
  },
  details: {
    what: 'Adds each property’s note (how to read it) and its full published reference under its row.',
    origin: 'off, to keep the table short',
  },
} as const satisfies Record<string, HelpTopic>;
