import type { StateCreator } from 'zustand';

/** The page's views (tabs), in tab order. */
export const VIEW_IDS = ['explorer', 'planner', 'converter', 'locate', 'resonator'] as const;
export type ViewId = (typeof VIEW_IDS)[number];

/** How the page is shown (no physics here). */
export interface ViewSlice {
  /** The view (tab) on screen. */
  activeView: ViewId;
  setActiveView: (view: ViewId) => void;
  /** Whether the properties table shows each row's note and full source. */
  sourceDetailsShown: boolean;
  setSourceDetailsShown: (shown: boolean) => void;
}

export const createViewSlice: StateCreator<ViewSlice, [], [], ViewSlice> = (set) => ({
  activeView: 'explorer',
  setActiveView: (view) => set({ activeView: view }),
  sourceDetailsShown: false,
  setSourceDetailsShown: (shown) => set({ sourceDetailsShown: shown }),
});
