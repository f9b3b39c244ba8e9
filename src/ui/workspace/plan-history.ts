/**
 * Undo and redo of plan edits. The history watches the main store: every change of the plan after
 * it is ready becomes a step, except that typing in one field makes one step until the field is
 * left (or another field is typed in). Opening a plan (file, saved plan, link) is a step too, so it
 * can be undone. The first plan of a session (restored or demo) starts the history.
 */
import { useSekundoStore } from '../store';
import type { SekundoState } from '../store';
import { PLANNER_FIELD_PREFIX } from '../planner/planner-slice';
import { type PlanSnapshot, useWorkspaceStore } from './workspace-store';

/** Steps kept each way. */
export const HISTORY_LIMIT = 100;

let restoring = false;
/** Field being typed in during the current store action (set by its draft, used by its plan change). */
let typingKey: string | null = null;
/** Field whose typing the last step holds; further typing there joins that step. */
let coalesceKey: string | null = null;

function snapshotOf(state: SekundoState): PlanSnapshot {
  return { plan: state.plannerPlan, sensorKeys: state.plannerSensorKeys, reflectorKeys: state.plannerReflectorKeys };
}

function onChange(state: SekundoState, prev: SekundoState): void {
  if (restoring) return;
  if (state.plannerStatus !== 'ready') return;
  if (prev.plannerStatus !== 'ready') {
    useWorkspaceStore.setState({ past: [], future: [] });
    coalesceKey = null;
    return;
  }
  if (state.fieldDrafts !== prev.fieldDrafts) {
    for (const key of Object.keys(prev.fieldDrafts)) if (!(key in state.fieldDrafts)) coalesceKey = null;
    for (const [key, draft] of Object.entries(state.fieldDrafts)) {
      if (key.startsWith(PLANNER_FIELD_PREFIX) && prev.fieldDrafts[key]?.text !== draft.text) {
        typingKey = key;
        queueMicrotask(() => {
          typingKey = null;
        });
      }
    }
  }
  if (state.plannerPlan === prev.plannerPlan) return;
  const typing = typingKey;
  typingKey = null;
  if (typing !== null && typing === coalesceKey && useWorkspaceStore.getState().past.length > 0) {
    useWorkspaceStore.setState({ future: [] });
    return;
  }
  coalesceKey = typing;
  const { past } = useWorkspaceStore.getState();
  useWorkspaceStore.setState({ past: [...past.slice(-(HISTORY_LIMIT - 1)), snapshotOf(prev)], future: [] });
}

/** Starts watching the plan. Returns a function that stops (tests). */
export function startHistory(): () => void {
  typingKey = null;
  coalesceKey = null;
  return useSekundoStore.subscribe(onChange);
}

function restore(snapshot: PlanSnapshot): void {
  const state = useSekundoStore.getState();
  const mapKey = state.plannerMapSensorKey;
  restoring = true;
  try {
    useSekundoStore.setState({
      plannerPlan: snapshot.plan,
      plannerSensorKeys: snapshot.sensorKeys,
      plannerReflectorKeys: snapshot.reflectorKeys,
      plannerErrors: {},
      plannerMapSensorKey: mapKey !== null && snapshot.sensorKeys.includes(mapKey) ? mapKey : null,
    });
  } finally {
    restoring = false;
  }
  state.dropFieldDrafts(PLANNER_FIELD_PREFIX);
  coalesceKey = null;
}

/** Goes one step back; false when there is none. */
export function undoPlan(): boolean {
  const { past, future } = useWorkspaceStore.getState();
  const previous = past.at(-1);
  if (!previous || useSekundoStore.getState().plannerStatus !== 'ready') return false;
  const current = snapshotOf(useSekundoStore.getState());
  useWorkspaceStore.setState({ past: past.slice(0, -1), future: [...future.slice(-(HISTORY_LIMIT - 1)), current] });
  restore(previous);
  return true;
}

/** Goes one step forward again; false when there is none. */
export function redoPlan(): boolean {
  const { past, future } = useWorkspaceStore.getState();
  const next = future.at(-1);
  if (!next || useSekundoStore.getState().plannerStatus !== 'ready') return false;
  const current = snapshotOf(useSekundoStore.getState());
  useWorkspaceStore.setState({ future: future.slice(0, -1), past: [...past.slice(-(HISTORY_LIMIT - 1)), current] });
  restore(next);
  return true;
}

/** Ctrl/Cmd+Z: undo; Ctrl/Cmd+Shift+Z and Ctrl+Y: redo. Returns what the key asks for, or null. */
export function historyKey(event: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>): 'undo' | 'redo' | null {
  if (!(event.ctrlKey || event.metaKey) || event.altKey) return null;
  const key = event.key.toLowerCase();
  if (key === 'z') return event.shiftKey ? 'redo' : 'undo';
  if (key === 'y' && !event.shiftKey) return 'redo';
  return null;
}
