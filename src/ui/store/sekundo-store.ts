import { create } from 'zustand';
import { createConverterSlice } from '../converter/converter-slice';
import { createFieldsSlice } from '../fields/fields-slice';
import { createLocateSlice } from '../locate/locate-slice';
import { createPlannerSlice } from '../planner/planner-slice';
import { createRehearseSlice } from '../planner/rehearse/rehearse-slice';
import { createPreferencesSlice } from '../preferences/preferences-slice';
import { createResonatorSlice } from '../resonator/resonator-slice';
import { createWatchSlice } from '../converter/watch/watch-slice';
import type { SekundoState } from './state';
import { createTemperatureSlice } from '../temperature/temperature-slice';
import { createViewSlice } from '../layout/view-slice';

/** Sekundo's one store, built from typed slices. */
export const useSekundoStore = create<SekundoState>()((...args) => ({
  ...createTemperatureSlice(...args),
  ...createViewSlice(...args),
  ...createPlannerSlice(...args),
  ...createConverterSlice(...args),
  ...createLocateSlice(...args),
  ...createResonatorSlice(...args),
  ...createPreferencesSlice(...args),
  ...createFieldsSlice(...args),
  ...createWatchSlice(...args),
  ...createRehearseSlice(...args),
}));

/** Puts every slice back to its initial state (tests, "start over"). */
export function resetSekundoStore(): void {
  useSekundoStore.setState(useSekundoStore.getInitialState(), true);
}
