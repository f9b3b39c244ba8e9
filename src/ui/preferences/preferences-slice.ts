import type { StateCreator } from 'zustand';
import type { Preferences } from '../../io/workspace-storage';
import { asDisplayUnit, DEFAULT_DISPLAY_UNITS, type DisplayUnitOf, type DisplayUnits, UNIT_KIND_LIST, type UnitKind } from '../units/unit-choices';
import { VIEW_IDS, type ViewId } from '../layout/view-slice';

/** The colour theme a person chose; "system" follows the operating system's light or dark setting. */
export type ThemeChoice = 'light' | 'dark' | 'system';

export const THEME_CHOICES: readonly ThemeChoice[] = ['light', 'dark', 'system'];

/** Keys of the preferences record (src/io/workspace-storage.ts) that this slice reads and writes. */
export const PREFERENCE_KEYS = {
  theme: 'theme',
  guides: 'guides',
  /** Kept by earlier versions: 'done' once the first-visit tour was closed (read as every guide put away). */
  tour: 'tour',
  unit: (kind: UnitKind) => `unit.${kind}`,
} as const;

/**
 * How the page fits a person's habits, app-wide: theme, display units, which views' first-visit
 * guides were put away, and a note when preferences cannot be kept. Inputs only; src/ui/preferences
 * loads them from the browser at start and saves them when they change.
 */
export interface PreferencesSlice {
  themeChoice: ThemeChoice;
  setThemeChoice: (choice: ThemeChoice) => void;
  displayUnits: DisplayUnits;
  setDisplayUnit: <K extends UnitKind>(kind: K, unit: DisplayUnitOf<K>) => void;
  /** Views whose first-visit guide the visitor put away (remembered). */
  guidesDismissed: readonly ViewId[];
  dismissGuide: (view: ViewId) => void;
  dismissAllGuides: () => void;
  /** Brings every view's guide back. */
  showGuidesAgain: () => void;
  /** Why preferences could not be kept (shown once, unobtrusively); null when all is well. */
  preferencesNotice: string | null;
  setPreferencesNotice: (notice: string | null) => void;
  /** Takes what the browser kept; anything unknown or malformed is ignored. */
  applyPreferences: (prefs: Preferences) => void;
}

function isThemeChoice(text: string | undefined): text is ThemeChoice {
  return THEME_CHOICES.includes(text as ThemeChoice);
}

/** The preferences record of a state: only this slice's keys. */
export function preferencesOf(state: Pick<PreferencesSlice, 'themeChoice' | 'displayUnits' | 'guidesDismissed'>): Preferences {
  const prefs: Preferences = { [PREFERENCE_KEYS.theme]: state.themeChoice };
  for (const kind of UNIT_KIND_LIST) prefs[PREFERENCE_KEYS.unit(kind)] = state.displayUnits[kind];
  prefs[PREFERENCE_KEYS.guides] = VIEW_IDS.filter((v) => state.guidesDismissed.includes(v)).join(',');
  return prefs;
}

/** The views whose guide was put away, from the kept record (an earlier version's closed tour counts as all). */
function dismissedGuides(prefs: Preferences): ViewId[] {
  const kept = prefs[PREFERENCE_KEYS.guides];
  if (kept === undefined) return prefs[PREFERENCE_KEYS.tour] === 'done' ? [...VIEW_IDS] : [];
  const named = new Set(kept.split(','));
  return VIEW_IDS.filter((v) => named.has(v));
}

export const createPreferencesSlice: StateCreator<PreferencesSlice, [], [], PreferencesSlice> = (set, get) => ({
  themeChoice: 'system',
  setThemeChoice: (choice) => set({ themeChoice: choice }),
  displayUnits: DEFAULT_DISPLAY_UNITS,
  setDisplayUnit: (kind, unit) => {
    const before = get();
    const displayUnits = { ...before.displayUnits, [kind]: unit };
    set({ displayUnits });
  },
  guidesDismissed: [],
  dismissGuide: (view) => set((s) => (s.guidesDismissed.includes(view) ? s : { guidesDismissed: [...s.guidesDismissed, view] })),
  dismissAllGuides: () => set({ guidesDismissed: [...VIEW_IDS] }),
  showGuidesAgain: () => set({ guidesDismissed: [] }),
  preferencesNotice: null,
  setPreferencesNotice: (notice) => set({ preferencesNotice: notice }),
  applyPreferences: (prefs) => {
    const theme = prefs[PREFERENCE_KEYS.theme];
    const units = { ...get().displayUnits } as Record<UnitKind, string>;
    for (const kind of UNIT_KIND_LIST) {
      const unit = asDisplayUnit(kind, prefs[PREFERENCE_KEYS.unit(kind)]);
      if (unit !== null) units[kind] = unit;
    }
    set({
      themeChoice: isThemeChoice(theme) ? theme : get().themeChoice,
      displayUnits: units as DisplayUnits,
      guidesDismissed: dismissedGuides(prefs),
    });
  },
});

