import type { StateCreator } from 'zustand';
import type { Preferences } from '../../io/workspace-storage';
import { asDisplayUnit, DEFAULT_DISPLAY_UNITS, type DisplayUnitOf, type DisplayUnits, UNIT_KIND_LIST, type UnitKind } from '../units/unit-choices';
import type { SekundoState } from './state';
import { draftFor } from './temperature-slice';

/** The colour theme a person chose; "system" follows the operating system's light or dark setting. */
export type ThemeChoice = 'light' | 'dark' | 'system';

export const THEME_CHOICES: readonly ThemeChoice[] = ['light', 'dark', 'system'];

/** Keys of the preferences record (src/io/workspace-storage.ts) that this slice reads and writes. */
export const PREFERENCE_KEYS = {
  theme: 'theme',
  tour: 'tour',
  unit: (kind: UnitKind) => `unit.${kind}`,
} as const;

/**
 * How the page fits a person's habits, app-wide: theme, display units, whether the first-visit
 * tour is open, and a note when preferences cannot be kept. Inputs only; src/ui/preferences
 * loads them from the browser at start and saves them when they change.
 */
export interface PreferencesSlice {
  themeChoice: ThemeChoice;
  setThemeChoice: (choice: ThemeChoice) => void;
  displayUnits: DisplayUnits;
  setDisplayUnit: <K extends UnitKind>(kind: K, unit: DisplayUnitOf<K>) => void;
  /** Whether the guided tour is on screen. */
  tourOpen: boolean;
  /** Whether the tour has been closed once (then it does not open by itself again). */
  tourSeen: boolean;
  openTour: () => void;
  /** Closes the tour for good (remembered). */
  closeTour: () => void;
  /** Why preferences could not be kept (shown once, unobtrusively); null when all is well. */
  preferencesNotice: string | null;
  setPreferencesNotice: (notice: string | null) => void;
  /** Takes what the browser kept; anything unknown or malformed is ignored. Opens the tour on a first visit. */
  applyPreferences: (prefs: Preferences) => void;
}

function isThemeChoice(text: string | undefined): text is ThemeChoice {
  return THEME_CHOICES.includes(text as ThemeChoice);
}

/** The preferences record of a state: only this slice's keys. */
export function preferencesOf(state: Pick<PreferencesSlice, 'themeChoice' | 'displayUnits' | 'tourSeen'>): Preferences {
  const prefs: Preferences = { [PREFERENCE_KEYS.theme]: state.themeChoice };
  for (const kind of UNIT_KIND_LIST) prefs[PREFERENCE_KEYS.unit(kind)] = state.displayUnits[kind];
  if (state.tourSeen) prefs[PREFERENCE_KEYS.tour] = 'done';
  return prefs;
}

export const createPreferencesSlice: StateCreator<SekundoState, [], [], PreferencesSlice> = (set, get) => ({
  themeChoice: 'system',
  setThemeChoice: (choice) => set({ themeChoice: choice }),
  displayUnits: DEFAULT_DISPLAY_UNITS,
  setDisplayUnit: (kind, unit) => {
    const before = get();
    const displayUnits = { ...before.displayUnits, [kind]: unit };
    set({ displayUnits, ...temperatureDraftIn(before, displayUnits.temperature) });
    get().followConverterDisplayUnits();
  },
  tourOpen: false,
  tourSeen: false,
  openTour: () => set({ tourOpen: true }),
  closeTour: () => set({ tourOpen: false, tourSeen: true }),
  preferencesNotice: null,
  setPreferencesNotice: (notice) => set({ preferencesNotice: notice }),
  applyPreferences: (prefs) => {
    const theme = prefs[PREFERENCE_KEYS.theme];
    const units = { ...get().displayUnits } as Record<UnitKind, string>;
    for (const kind of UNIT_KIND_LIST) {
      const unit = asDisplayUnit(kind, prefs[PREFERENCE_KEYS.unit(kind)]);
      if (unit !== null) units[kind] = unit;
    }
    const seen = prefs[PREFERENCE_KEYS.tour] === 'done';
    set({
      themeChoice: isThemeChoice(theme) ? theme : get().themeChoice,
      displayUnits: units as DisplayUnits,
      ...temperatureDraftIn(get(), (units as DisplayUnits).temperature),
      tourSeen: seen,
      tourOpen: !seen,
    });
    get().followConverterDisplayUnits();
  },
});

/** The temperature field's text in a new unit, unless someone is typing in it (then it is left alone). */
function temperatureDraftIn(state: SekundoState, unit: DisplayUnits['temperature']): { temperatureDraft?: string } {
  const shown = draftFor(state.temperature_K, state.displayUnits.temperature);
  return state.temperatureDraft === shown ? { temperatureDraft: draftFor(state.temperature_K, unit) } : {};
}
