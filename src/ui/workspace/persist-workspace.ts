/**
 * Nothing typed is lost: the plan being edited is autosaved (debounced, and at once when the page
 * is hidden or closed) and restored on the next visit; named plans are kept beside it. All of it
 * goes through src/io/workspace-storage.ts, which never throws: full, disabled or damaged storage
 * comes back as a message, which the page shows while it keeps working.
 */
import type { PlanFile } from '../../io/plan-file';
import {
  browserStore,
  deletePlan,
  duplicatePlan,
  type KeyValueStore,
  listPlans,
  loadAutosave,
  renamePlan,
  restorePlan,
  type SavedPlan,
  saveAutosave,
  savePlan,
} from '../../io/workspace-storage';
import { useSekundoStore } from '../store';
import { historyKey, redoPlan, startHistory, undoPlan } from './plan-history';
import { readShareFragment } from './share-actions';
import { showToast, useWorkspaceStore } from './workspace-store';

/** Wait after the last change before the autosave is written, ms. */
export const AUTOSAVE_DELAY_MS = 400;

/** What the page says when the browser keeps nothing at all. */
export const STORAGE_OFF =
  'This browser does not let Sekundo keep data (storage is turned off or blocked): your plan and settings are not kept between visits and saved plans are unavailable. Everything else works; use “Save plan file” to keep your work.';

let kv: KeyValueStore | null = null;
let autosaveMessageShown: string | null = null;

/** The store the workspace uses (null: none). */
export function workspaceStore(): KeyValueStore | null {
  return kv;
}

function setNotice(message: string | null): void {
  useWorkspaceStore.setState({ storageNotice: message });
}

/** Reads the named plans again into the workspace store. */
export function refreshSavedPlans(): void {
  const listing = listPlans(kv);
  useWorkspaceStore.setState({ savedPlans: listing.plans, savedProblems: listing.problems });
}

/** Writes the open plan into the autosave slot now; says so when it cannot. */
export function autosaveNow(plan: PlanFile = useSekundoStore.getState().plannerPlan): void {
  if (useSekundoStore.getState().plannerStatus !== 'ready' || kv === null) return;
  const result = saveAutosave(kv, plan);
  if (!result.ok) {
    autosaveMessageShown = `Autosave stopped: ${result.message}`;
    setNotice(autosaveMessageShown);
  } else if (autosaveMessageShown !== null && useWorkspaceStore.getState().storageNotice === autosaveMessageShown) {
    autosaveMessageShown = null;
    setNotice(null);
  }
}

interface StartOptions {
  /** Where to read the link from (default: the page's location). */
  hash?: string;
  delayMs?: number;
  /** Listen to keys, page hiding and link changes on the window (off in some tests). */
  listen?: boolean;
}

/**
 * Starts the workspace: restores the autosaved plan (the planner then opens it instead of the
 * demo), lists named plans, starts the undo history and the autosave, and reads a plan link in
 * the URL. Returns a function that stops it all (tests).
 */
export function startWorkspace(store: KeyValueStore | null = browserStore(), options: StartOptions = {}): () => void {
  const { delayMs = AUTOSAVE_DELAY_MS, listen = typeof window !== 'undefined' } = options;
  kv = store;
  autosaveMessageShown = null;
  const stops: (() => void)[] = [];
  stops.push(startHistory());

  useWorkspaceStore.setState({ storageAvailable: store !== null });
  if (store === null) setNotice(STORAGE_OFF);
  const restored = loadAutosave(store);
  if (!restored.ok) setNotice(`${restored.message} The planner opens the demo plan instead; the damaged entry is overwritten by your next edit.`);
  else if (restored.value !== null) useSekundoStore.getState().loadPlannerPlan(restored.value, { kind: 'restored', note: null });
  refreshSavedPlans();

  let timer: ReturnType<typeof setTimeout> | null = null;
  const flush = () => {
    if (timer !== null) clearTimeout(timer);
    timer = null;
    autosaveNow();
  };
  stops.push(
    useSekundoStore.subscribe((state, prev) => {
      if (state.plannerStatus !== 'ready' || (state.plannerPlan === prev.plannerPlan && prev.plannerStatus === 'ready')) return;
      if (timer !== null) clearTimeout(timer);
      timer = setTimeout(flush, delayMs);
    }),
  );
  stops.push(() => {
    if (timer !== null) clearTimeout(timer);
  });

  if (listen) {
    const onHide = () => {
      if (timer !== null) flush();
    };
    const onVisibility = () => {
      if (document.visibilityState === 'hidden') onHide();
    };
    const onKey = (event: KeyboardEvent) => {
      const wish = historyKey(event);
      if (wish === null) return;
      // Text boxes that are not part of the plan keep their own undo.
      if (event.target instanceof Element && event.target.closest('.saved-plans, .workspace-bar__link')) return;
      const main = useSekundoStore.getState();
      const ws = useWorkspaceStore.getState();
      if (main.activeView !== 'planner' || ws.sharePrompt !== null || ws.sheetOpen) return;
      event.preventDefault();
      if (wish === 'undo') undoPlan();
      else redoPlan();
    };
    const onHash = () => readShareFragment(window.location.hash);
    window.addEventListener('pagehide', onHide);
    window.addEventListener('beforeunload', onHide);
    document.addEventListener('visibilitychange', onVisibility);
    window.addEventListener('keydown', onKey);
    window.addEventListener('hashchange', onHash);
    stops.push(() => {
      window.removeEventListener('pagehide', onHide);
      window.removeEventListener('beforeunload', onHide);
      document.removeEventListener('visibilitychange', onVisibility);
      window.removeEventListener('keydown', onKey);
      window.removeEventListener('hashchange', onHash);
    });
  }
  const hash = options.hash ?? (typeof window === 'undefined' ? '' : window.location.hash);
  readShareFragment(hash);
  return () => {
    for (const stop of stops.reverse()) stop();
  };
}

// ---------------------------------------------------------------------------------------------
// Named plans.

function report(result: { ok: true } | { ok: false; message: string }): boolean {
  if (!result.ok) showToast(result.message);
  return result.ok;
}

/** Saves the open plan under a name, as a new entry. */
export function saveCurrentAs(name: string): SavedPlan | null {
  const result = savePlan(kv, name, useSekundoStore.getState().plannerPlan);
  refreshSavedPlans();
  if (!report(result) || !result.ok) return null;
  useWorkspaceStore.setState({ currentSavedId: result.value.id });
  showToast(`Saved “${result.value.name}”.`);
  return result.value;
}

/** Saves the open plan over the named plan it came from. */
export function saveCurrentOver(saved: SavedPlan): void {
  const result = savePlan(kv, saved.name, useSekundoStore.getState().plannerPlan, saved.id);
  refreshSavedPlans();
  if (report(result)) showToast(`Saved over “${saved.name}”.`);
}

/** Opens a named plan (the plan it replaces can be had back with Undo). */
export function openSaved(saved: SavedPlan): void {
  useSekundoStore.getState().loadPlannerPlan(saved.plan, { kind: 'saved', note: `Opened the saved plan “${saved.name}”.` });
  useWorkspaceStore.setState({ currentSavedId: saved.id });
}

export function duplicateSaved(saved: SavedPlan): void {
  const result = duplicatePlan(kv, saved.id);
  refreshSavedPlans();
  if (report(result) && result.ok) showToast(`Made “${result.value.name}”.`);
}

/** Renames a named plan; returns the message when the name is refused. */
export function renameSaved(saved: SavedPlan, name: string): string | null {
  const result = renamePlan(kv, saved.id, name);
  refreshSavedPlans();
  return result.ok ? null : result.message;
}

/** Deletes a named plan, with a toast offering to undo it. */
export function deleteSaved(saved: SavedPlan): void {
  const result = deletePlan(kv, saved.id);
  refreshSavedPlans();
  if (!report(result) || !result.ok) return;
  const record = result.value;
  if (useWorkspaceStore.getState().currentSavedId === saved.id) useWorkspaceStore.setState({ currentSavedId: null });
  const id = showToast(`Deleted “${record.name}”.`, {
    label: 'Undo',
    run: () => {
      const back = restorePlan(kv, record);
      refreshSavedPlans();
      if (report(back)) showToast(`“${record.name}” is back.`);
      useWorkspaceStore.setState((s) => ({ toasts: s.toasts.filter((t) => t.id !== id) }));
    },
  });
}
