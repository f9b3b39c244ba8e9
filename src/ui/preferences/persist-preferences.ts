/**
 * Keeping a person's habits between visits: at start the store takes what the browser kept
 * (theme, display units, which first-visit guides were put away); from then on every change is written back.
 * Other keys in the same record (other views' preferences) are left as they are. Storage that is
 * full or disabled costs only the keeping: the page works on, and says so once.
 */
import { browserStore, type KeyValueStore, loadPreferences, savePreferences } from '../../io/workspace-storage';
import { useSekundoStore } from '../store';
import { preferencesOf } from './preferences-slice';
import { resolveTheme, setDocumentTheme } from '../theme/use-theme';

/** What the page says, once, when preferences cannot be kept. */
export const PREFERENCES_NOT_KEPT =
  'Your settings cannot be saved in this browser (its storage is full or turned off). They apply until you close this tab; everything else works as usual.';

/**
 * Loads the preferences into the store, sets the theme on <html> before the first paint, and saves
 * every later change. Returns a function that stops saving (tests).
 */
export function startPreferences(store: KeyValueStore | null = browserStore()): () => void {
  const api = useSekundoStore;
  api.getState().applyPreferences(loadPreferences(store));
  const first = api.getState();
  setDocumentTheme(resolveTheme(first.themeChoice), first.themeChoice);
  let saved = JSON.stringify(preferencesOf(first));
  let told = false;
  return api.subscribe((state) => {
    const prefs = preferencesOf(state);
    const text = JSON.stringify(prefs);
    if (text === saved) return;
    saved = text;
    const result = savePreferences(store, { ...loadPreferences(store), ...prefs });
    if (!result.ok && !told) {
      told = true;
      state.setPreferencesNotice(PREFERENCES_NOT_KEPT);
    }
  });
}
