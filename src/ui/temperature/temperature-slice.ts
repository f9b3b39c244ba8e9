import type { StateCreator } from 'zustand';
import { checkTemperature } from '../units/temperature-text';

/** Temperature the explorer shows when it opens, K: a typical He II working point. */
export const DEFAULT_TEMPERATURE_K = 1.8;

/**
 * The explorer's temperature. The typed field's draft and message live in the fields slice under
 * "explorer." (src/ui/fields), like every typed field.
 */
export interface TemperatureSlice {
  /** Always a valid temperature, K: a bad entry never replaces it. */
  temperature_K: number;
  /** From the field, the slider or a preset: set when in range; returns the refusal, or null. */
  setTemperature: (temperature_K: number) => string | null;
}

export const createTemperatureSlice: StateCreator<TemperatureSlice, [], [], TemperatureSlice> = (set) => ({
  temperature_K: DEFAULT_TEMPERATURE_K,
  setTemperature: (temperature_K) => {
    const entry = checkTemperature(temperature_K);
    if (!entry.ok) return entry.message;
    set({ temperature_K: entry.temperature_K });
    return null;
  },
});
