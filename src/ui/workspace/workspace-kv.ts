/**
 * The key–value store the workspace keeps plans in (localStorage in the page, a memory store in
 * tests, null when the browser keeps nothing), and the listing of named plans read from it.
 */
import { type KeyValueStore, listPlans } from '../../io/workspace-storage';
import { useWorkspaceStore } from './workspace-store';

let kv: KeyValueStore | null = null;

/** The store in use (null: none). */
export function workspaceKv(): KeyValueStore | null {
  return kv;
}

/** Sets the store in use (when the workspace starts). */
export function setWorkspaceKv(store: KeyValueStore | null): void {
  kv = store;
}

/** Reads the named plans again into the workspace store. */
export function refreshSavedPlans(): void {
  const listing = listPlans(kv);
  useWorkspaceStore.setState({ savedPlans: listing.plans, savedProblems: listing.problems });
}
