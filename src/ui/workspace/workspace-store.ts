/**
 * The workspace's own small store: undo history of the plan, the named plans as last listed, the
 * notices about storage and links, toasts, the shared plan waiting for a yes, and whether the
 * setup sheet is open. Kept apart from the main store (plan inputs), which it watches and edits
 * only through its public actions and state.
 */
import { create } from 'zustand';
import type { PlanFile } from '../../io/plan-file';
import type { SavedPlan } from '../../io/workspace-storage';

/** A plan as undo brings it back, with the row keys it had (fields keep their identity). */
export interface PlanSnapshot {
  plan: PlanFile;
  sensorKeys: readonly string[];
  reflectorKeys: readonly string[];
}

export interface Toast {
  id: number;
  text: string;
  /** A button on the toast ("Undo"), or none. */
  action: { label: string; run: () => void } | null;
}

/** A plan from a link, waiting for the person to say whether it replaces theirs. */
export interface SharePrompt {
  plan: PlanFile;
}

/** A question the page asks before it could lose work (two tabs saved one plan; nowhere to keep a copy). */
export interface WorkspaceQuestion {
  title: string;
  text: string;
  /** The first choice is the default (focused); the last one is the safe way out (Escape). */
  choices: readonly { label: string; run: () => void }[];
}

export interface WorkspaceState {
  past: readonly PlanSnapshot[];
  future: readonly PlanSnapshot[];
  savedPlans: readonly SavedPlan[];
  /** One message per damaged saved entry (the entry is left as it is). */
  savedProblems: readonly string[];
  /** The named plan the open plan was last opened from or saved as; null: none. */
  currentSavedId: string | null;
  /** When that named plan was saved, as this tab last read it (another tab may save it since). */
  currentSavedAt: string | null;
  /** A question waiting for an answer; null: none. */
  question: WorkspaceQuestion | null;
  /** Why plans cannot be kept (storage full, disabled) or the autosave was not restored; null: all is well. */
  storageNotice: string | null;
  /** Messages for a share link that could not be opened; null: none. */
  linkProblem: readonly string[] | null;
  sharePrompt: SharePrompt | null;
  toasts: readonly Toast[];
  /** The printable setup sheet is on screen. */
  sheetOpen: boolean;
  /** Whether the browser lets the page keep plans at all. */
  storageAvailable: boolean;
}

export const INITIAL_WORKSPACE: WorkspaceState = {
  past: [],
  future: [],
  savedPlans: [],
  savedProblems: [],
  currentSavedId: null,
  currentSavedAt: null,
  question: null,
  storageNotice: null,
  linkProblem: null,
  sharePrompt: null,
  toasts: [],
  sheetOpen: false,
  storageAvailable: true,
};

export const useWorkspaceStore = create<WorkspaceState>()(() => INITIAL_WORKSPACE);

/** Back to the initial state (tests). */
export function resetWorkspaceStore(): void {
  useWorkspaceStore.setState(INITIAL_WORKSPACE, true);
}

let toastCounter = 0;
/** How long a toast stays, ms. */
export const TOAST_MS = 10_000;

/** Shows a toast; it goes by itself after {@link TOAST_MS}. Returns its id. */
export function showToast(text: string, action: Toast['action'] = null): number {
  toastCounter += 1;
  const id = toastCounter;
  useWorkspaceStore.setState((s) => ({ toasts: [...s.toasts.slice(-2), { id, text, action }] }));
  setTimeout(() => dismissToast(id), TOAST_MS);
  return id;
}

export function dismissToast(id: number): void {
  useWorkspaceStore.setState((s) => ({ toasts: s.toasts.filter((t) => t.id !== id) }));
}
