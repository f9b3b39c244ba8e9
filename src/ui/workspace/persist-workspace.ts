/**
 * Nothing typed is lost: the plan being edited is autosaved (debounced, and at once when the page
 * is hidden or closed) into this tab's own slot and restored on the next visit; named plans are
 * kept beside it. Tabs never overwrite each other: each writes its own autosave slot, hears the
 * others (the `storage` event) so its list of saved plans stays current, re-reads a saved plan
 * before opening or saving over it, and asks when another tab saved or deleted it meanwhile.
 * Before a link, a file, a saved plan or the demo replaces work that exists nowhere else, that work
 * is kept as a named copy in the saved plans, and the message says so. All storage goes through
 * src/io/workspace-storage.ts, which never throws: full, disabled or damaged storage comes back
 * as a message, which the page shows while it keeps working.
 */
import type { PlanFile } from '../../io/plan-file';
import {
  browserStore,
  deletePlan,
  duplicatePlan,
  isSavedPlanKey,
  type KeyValueStore,
  latestAutosave,
  loadAutosave,
  newAutosaveSlot,
  readSavedPlan,
  renamePlan,
  restorePlan,
  type SavedPlan,
  saveAutosave,
  savePlan,
} from '../../io/workspace-storage';
import { useSekundoStore } from '../store';
import { historyKey, redoPlan, startHistory, undoPlan } from './plan-history';
import { replaceOpenPlan } from './keep-plan';
import { readShareFragment } from './share-actions';
import { refreshSavedPlans, setWorkspaceKv, workspaceKv } from './workspace-kv';
import { showToast, useWorkspaceStore } from './workspace-store';

/** Wait after the last change before the autosave is written, ms. */
export const AUTOSAVE_DELAY_MS = 400;

/** What the page says when the browser keeps nothing at all. */
export const STORAGE_OFF =
  'This browser does not let Sekundo keep data (storage is turned off or blocked): your plan and settings are not kept between visits and saved plans are unavailable. Everything else works; use “Save plan file” to keep your work.';

let autosaveMessageShown: string | null = null;
/** This tab's autosave slot (kept in sessionStorage, so a reload of the tab finds it again). */
let slot: string | null = null;
const TAB_SLOT_KEY = 'sekundo.tab-slot';
const CHANNEL = 'sekundo-workspace';

function tabSession(): Storage | null {
  try {
    return typeof sessionStorage === 'undefined' ? null : sessionStorage;
  } catch {
    return null;
  }
}

function rememberSlot(id: string): void {
  slot = id;
  try {
    tabSession()?.setItem(TAB_SLOT_KEY, id);
  } catch {
    // Without session storage a reload starts from the newest autosave instead; nothing is lost.
  }
}

/** This tab's autosave slot (tests). */
export function autosaveSlot(): string | null {
  return slot;
}

/** The store the workspace uses (null: none). */
export function workspaceStore(): KeyValueStore | null {
  return workspaceKv();
}

function setNotice(message: string | null): void {
  useWorkspaceStore.setState({ storageNotice: message });
}

export { refreshSavedPlans };

/** Writes the open plan into the autosave slot now; says so when it cannot. */
export function autosaveNow(plan: PlanFile = useSekundoStore.getState().plannerPlan): void {
  if (useSekundoStore.getState().plannerStatus !== 'ready' || workspaceKv() === null) return;
  const result = saveAutosave(workspaceKv(), plan, slot ?? undefined);
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
  setWorkspaceKv(store);
  autosaveMessageShown = null;
  const stops: (() => void)[] = [];
  stops.push(startHistory());

  useWorkspaceStore.setState({ storageAvailable: store !== null });
  if (store === null) setNotice(STORAGE_OFF);
  restoreAutosave(store);
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
    // Another tab saved, renamed or deleted a named plan: list them again.
    const onStorage = (event: StorageEvent) => {
      if (event.storageArea === null || isSavedPlanKey(event.key)) refreshSavedPlans();
    };
    window.addEventListener('storage', onStorage);
    stops.push(() => window.removeEventListener('storage', onStorage));
    stops.push(watchDuplicateTabs());
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

/**
 * Opens this tab's last autosave (a reload), else the newest autosave of any tab (a new tab), and
 * picks this tab's slot: its own after a reload, a new one otherwise. An autosave written by a
 * newer Sekundo is named as such, never opened and never written over.
 */
function restoreAutosave(store: KeyValueStore | null): void {
  const session = tabSession();
  let previous: string | null = null;
  try {
    previous = session?.getItem(TAB_SLOT_KEY) ?? null;
  } catch {
    previous = null;
  }
  const load = (plan: PlanFile) => useSekundoStore.getState().loadPlannerPlan(plan, { kind: 'restored', note: null });
  if (previous !== null && /^[a-z0-9-]{1,40}$/.test(previous)) {
    const own = loadAutosave(store, previous);
    if (own.ok && own.value !== null) {
      rememberSlot(previous);
      load(own.value);
      return;
    }
    if (!own.ok && 'newerVersion' in own && own.newerVersion !== undefined) {
      rememberSlot(newAutosaveSlot());
      setNotice(`${own.message} The planner opens the demo plan; your edits go to a new autosave.`);
      return;
    }
  }
  rememberSlot(newAutosaveSlot());
  const { latest, problems } = latestAutosave(store);
  if (latest) load(latest.plan);
  const problem = problems[0];
  if (problem) {
    const newer = 'newerVersion' in problem && problem.newerVersion !== undefined;
    setNotice(
      newer
        ? `${problem.message}${latest ? ' The planner opened your newest autosave this Sekundo can read.' : ' The planner opens the demo plan; your edits go to a new autosave.'}`
        : `${problem.message} ${latest ? 'The planner opened your newest readable autosave' : 'The planner opens the demo plan instead'}; the damaged entry is left as it is.`,
    );
  }
}

/**
 * Two tabs with one slot (a duplicated tab copies the session): each announces its slot on a
 * BroadcastChannel, and the one started later takes a new slot, so neither overwrites the other.
 */
function watchDuplicateTabs(): () => void {
  if (typeof BroadcastChannel === 'undefined') return () => undefined;
  const instance = `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
  const startedAt = Date.now();
  let channel: BroadcastChannel;
  try {
    channel = new BroadcastChannel(CHANNEL);
  } catch {
    return () => undefined;
  }
  const announce = (type: 'hello' | 'mine') => channel.postMessage({ type, slot, instance, startedAt });
  channel.onmessage = (event: MessageEvent) => {
    const m = event.data as { type?: string; slot?: string; instance?: string; startedAt?: number } | null;
    if (!m || m.slot !== slot || m.instance === instance || typeof m.startedAt !== 'number' || typeof m.instance !== 'string') return;
    const iAmNewer = startedAt > m.startedAt || (startedAt === m.startedAt && instance > m.instance);
    if (iAmNewer) {
      rememberSlot(newAutosaveSlot());
      autosaveNow();
    } else if (m.type === 'hello') announce('mine');
  };
  announce('hello');
  return () => channel.close();
}

// ---------------------------------------------------------------------------------------------
// Named plans.

function report(result: { ok: true } | { ok: false; message: string }): boolean {
  if (!result.ok) showToast(result.message);
  return result.ok;
}

function markOpen(saved: SavedPlan): void {
  useWorkspaceStore.setState({ currentSavedId: saved.id, currentSavedAt: saved.savedAt });
}

function timeOf(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : date.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', second: '2-digit' });
}

/** Saves the open plan under a name, as a new entry. */
export function saveCurrentAs(name: string): SavedPlan | null {
  const result = savePlan(workspaceKv(), name, useSekundoStore.getState().plannerPlan);
  refreshSavedPlans();
  if (!report(result) || !result.ok) return null;
  markOpen(result.value);
  showToast(`Saved “${result.value.name}”.`);
  return result.value;
}

function writeOver(saved: SavedPlan, plan: PlanFile): void {
  const result = savePlan(workspaceKv(), saved.name, plan, saved.id);
  refreshSavedPlans();
  if (report(result) && result.ok) {
    markOpen(result.value);
    showToast(`Saved over “${saved.name}”.`);
  }
}

/**
 * Saves the open plan over the named plan it came from, after reading that plan again: when
 * another tab saved over it or deleted it since this tab opened or saved it, asks first.
 */
export function saveCurrentOver(saved: SavedPlan): void {
  const plan = useSekundoStore.getState().plannerPlan;
  const now = readSavedPlan(workspaceKv(), saved.id);
  refreshSavedPlans();
  const seenAt = useWorkspaceStore.getState().currentSavedId === saved.id ? useWorkspaceStore.getState().currentSavedAt : saved.savedAt;
  if (now.ok === 'missing') {
    useWorkspaceStore.setState({
      question: {
        title: `“${saved.name}” was deleted in another tab`,
        text: `Since this tab opened it, “${saved.name}” was deleted (in another tab or window). Save your plan under that name again, or as a new plan?`,
        choices: [
          { label: `Save again as “${saved.name}”`, run: () => writeOver(saved, plan) },
          { label: 'Save as a new plan', run: () => saveCurrentAs(`${saved.name} (this tab)`) },
          { label: 'Cancel', run: () => undefined },
        ],
      },
    });
    return;
  }
  if (!now.ok) {
    showToast(now.message);
    return;
  }
  if (seenAt !== null && now.value.savedAt !== seenAt) {
    useWorkspaceStore.setState({
      question: {
        title: `“${saved.name}” changed in another tab`,
        text: `“${saved.name}” was saved again at ${timeOf(now.value.savedAt)} (in another tab or window) after this tab opened or saved it at ${timeOf(seenAt)}. Saving here would replace that save.`,
        choices: [
          { label: 'Save mine as a new plan', run: () => saveCurrentAs(`${saved.name} (this tab)`) },
          { label: 'Replace the other save', run: () => writeOver(now.value, plan) },
          { label: 'Cancel', run: () => undefined },
        ],
      },
    });
    return;
  }
  writeOver(now.value, plan);
}

/**
 * Opens a named plan as it is in storage now (another tab may have saved over it or deleted it);
 * the plan it replaces is kept first (see {@link replaceOpenPlan}).
 */
export function openSaved(saved: SavedPlan): void {
  const now = readSavedPlan(workspaceKv(), saved.id);
  refreshSavedPlans();
  if (now.ok === 'missing') {
    showToast(`“${saved.name}” was deleted in another tab; nothing was opened.`);
    return;
  }
  if (!now.ok) {
    showToast(now.message);
    return;
  }
  const fresh = now.value;
  const changed = fresh.savedAt !== saved.savedAt ? ` (the version saved at ${timeOf(fresh.savedAt)} in another tab)` : '';
  replaceOpenPlan(fresh.plan, { kind: 'saved', note: `Opened the saved plan “${fresh.name}”${changed}.` }, `opening “${fresh.name}”`, () => markOpen(fresh));
}

/** Makes a copy of a named plan. */
export function duplicateSaved(saved: SavedPlan): void {
  const result = duplicatePlan(workspaceKv(), saved.id);
  refreshSavedPlans();
  if (report(result) && result.ok) showToast(`Made “${result.value.name}”.`);
}

/** Renames a named plan; returns the message when the name is refused. */
export function renameSaved(saved: SavedPlan, name: string): string | null {
  const result = renamePlan(workspaceKv(), saved.id, name);
  refreshSavedPlans();
  return result.ok ? null : result.message;
}

/** Deletes a named plan, with a toast offering to undo it. */
export function deleteSaved(saved: SavedPlan): void {
  const result = deletePlan(workspaceKv(), saved.id);
  refreshSavedPlans();
  if (!report(result) || !result.ok) return;
  const record = result.value;
  if (useWorkspaceStore.getState().currentSavedId === saved.id) useWorkspaceStore.setState({ currentSavedId: null, currentSavedAt: null });
  const id = showToast(`Deleted “${record.name}”.`, {
    label: 'Undo',
    run: () => {
      const back = restorePlan(workspaceKv(), record);
      refreshSavedPlans();
      if (report(back)) showToast(`“${record.name}” is back.`);
      useWorkspaceStore.setState((s) => ({ toasts: s.toasts.filter((t) => t.id !== id) }));
    },
  });
}
