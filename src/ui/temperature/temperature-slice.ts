import type { StateCreator } from 'zustand';
import type { FieldsSlice } from '../fields/fields-slice';
import { checkTemperature } from '../units/temperature-text';

/** The typed temperature's key in the fields slice. */
export const TEMPERATURE_FIELD_KEY = 'explorer.temperature';

/** Temperature the explorer shows when it opens, K: a typical He II working point. */
export const DEFAULT_TEMPERATURE_K = 1.8;

/**
 * The explorer's temperature. The typed field's draft and message live in the fields slice under
 * "explorer." (src/ui/fields), like every typed field.
 */
export interface TemperatureSlice {
  /** Always a valid temperature, K: a bad entry never replaces it. */
  temperature_K: number;
  /** A good value typed into the field: set when in range; returns the refusal, or null. */
  setTemperature: (temperature_K: number) => string | null;
  /** From the slider or a preset: set when in range, and shown in the field (a text typed there gives way). */
  chooseTemperature: (temperature_K: number) => void;
}

/** What the temperature slice reads besides its own state: the fields' drafts. */
type TemperatureStore = TemperatureSlice & FieldsSlice;

export const createTemperatureSlice: StateCreator<TemperatureStore, [], [], TemperatureSlice> = (set, get) => ({
  temperature_K: DEFAULT_TEMPERATURE_K,
  setTemperature: (temperature_K) => {
    const entry = checkTemperature(temperature_K);
    if (!entry.ok) return entry.message;
    set({ temperature_K: entry.temperature_K });
    return null;
  },
  chooseTemperature: (temperature_K) => {
    if (get().setTemperature(temperature_K) === null) get().dropFieldDraft(TEMPERATURE_FIELD_KEY);
  },
});
