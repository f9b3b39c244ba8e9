import { create } from 'zustand';
import { createConverterSlice } from '../converter/converter-slice';
import { createFieldsSlice } from '../fields/fields-slice';
import { createRehearseSlice } from '../planner/rehearse/rehearse-slice';
import { createLocateSlice } from './locate-slice';
import { createPlannerSlice } from './planner-slice';
import { createPreferencesSlice } from './preferences-slice';
import { createResonatorSlice } from '../resonator/resonator-slice';
import type { SekundoState } from './state';
import { createTemperatureSlice } from './temperature-slice';
import { createViewSlice } from './view-slice';
import { createWatchSlice } from '../converter/watch/watch-slice';

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
