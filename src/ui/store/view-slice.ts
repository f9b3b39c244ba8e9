import type { StateCreator } from 'zustand';
import type { SekundoState } from './state';

/** How the explorer is shown (no physics here). */
export interface ViewSlice {
  /** Whether the properties table shows each row's note and full source. */
  sourceDetailsShown: boolean;
  setSourceDetailsShown: (shown: boolean) => void;
}

export const createViewSlice: StateCreator<SekundoState, [], [], ViewSlice> = (set) => ({
  sourceDetailsShown: false,
  setSourceDetailsShown: (shown) => set({ sourceDetailsShown: shown }),
});
