import type { StateCreator } from 'zustand';
import { checkTemperature, formatTemperature, parseTemperature, type TemperatureParse } from '../units/temperature-text';
import type { SekundoState } from './state';

/** Temperature the explorer shows when it opens, K: a typical He II working point. */
export const DEFAULT_TEMPERATURE_K = 1.8;

/** The chosen temperature and the text field that edits it. */
export interface TemperatureSlice {
  /** Always a valid temperature, K: a bad entry never replaces it. */
  temperature_K: number;
  /** What the typed field shows; applied on commit. */
  temperatureDraft: string;
  /** Message for the last rejected entry, or null. */
  temperatureError: string | null;
  /** From the slider or a preset; an out-of-range value is rejected like a typed one. */
  setTemperature: (temperature_K: number) => void;
  editTemperatureDraft: (text: string) => void;
  /** Applies the typed text if it is valid; otherwise keeps the temperature and sets the message. */
  commitTemperatureDraft: () => void;
}

/** Text the field shows for a temperature, in the display unit (kelvin unless mK was chosen). */
export function draftFor(temperature_K: number, unit: 'K' | 'mK' = 'K'): string {
  return formatTemperature(temperature_K, unit);
}

export const createTemperatureSlice: StateCreator<SekundoState, [], [], TemperatureSlice> = (set, get) => ({
  temperature_K: DEFAULT_TEMPERATURE_K,
  temperatureDraft: draftFor(DEFAULT_TEMPERATURE_K),
  temperatureError: null,
  setTemperature: (temperature_K) => set(applied(checkTemperature(temperature_K), get().displayUnits.temperature)),
  editTemperatureDraft: (text) => set({ temperatureDraft: text, temperatureError: null }),
  commitTemperatureDraft: () => set(applied(parseTemperature(get().temperatureDraft), get().displayUnits.temperature)),
});

/** The state change for a checked entry: the new temperature, or only the message. */
function applied(entry: TemperatureParse, unit: 'K' | 'mK'): Partial<TemperatureSlice> {
  if (!entry.ok) return { temperatureError: entry.message };
  return { temperature_K: entry.temperature_K, temperatureDraft: draftFor(entry.temperature_K, unit), temperatureError: null };
}
