/**
 * The copies the page keeps by itself before something replaces the open plan (keep-plan.ts):
 * listed apart in Saved plans, made one of the user's own plans, or deleted all at once after a
 * question that names them, with an undo that puts every one back.
 */
import { adoptKeptPlan, deletePlan, restorePlan, type SavedPlan } from '../../io/workspace-storage';
import { refreshSavedPlans, workspaceKv } from './workspace-kv';
import { showToast, useWorkspaceStore } from './workspace-store';

/** The user's own saved plans and the kept copies, each newest first. */
export function splitKept(plans: readonly SavedPlan[]): { own: SavedPlan[]; kept: SavedPlan[] } {
  return { own: plans.filter((p) => p.kept === undefined), kept: plans.filter((p) => p.kept !== undefined) };
}

/** Makes a kept copy one of the user's own plans (its "(kept …)" suffix goes from the name). */
export function adoptKept(saved: SavedPlan): void {
  const result = adoptKeptPlan(workspaceKv(), saved.id);
  refreshSavedPlans();
  showToast(result.ok ? `“${result.value.name}” is now one of your saved plans.` : result.message);
}

function names(plans: readonly SavedPlan[]): string {
  const shown = plans.slice(0, 5).map((p) => `“${p.name}”`);
  return plans.length > 5 ? `${shown.join(', ')} and ${plans.length - 5} more` : shown.join(', ');
}

/** Deletes these kept copies now; the toast's Undo puts every one back. */
function deleteNow(plans: readonly SavedPlan[]): void {
  const deleted: SavedPlan[] = [];
  const problems: string[] = [];
  for (const p of plans) {
    const result = deletePlan(workspaceKv(), p.id);
    if (result.ok) deleted.push(result.value);
    else problems.push(result.message);
  }
  const currentId = useWorkspaceStore.getState().currentSavedId;
  if (deleted.some((p) => p.id === currentId)) useWorkspaceStore.setState({ currentSavedId: null, currentSavedAt: null });
  refreshSavedPlans();
  if (problems.length > 0) showToast(`${problems[0]}${problems.length > 1 ? ` (and ${problems.length - 1} more)` : ''}`);
  if (deleted.length === 0) return;
  const id = showToast(`Deleted ${deleted.length} kept cop${deleted.length === 1 ? 'y' : 'ies'}.`, {
    label: 'Undo',
    run: () => {
      const failed = deleted.map((p) => restorePlan(workspaceKv(), p)).filter((r) => !r.ok);
      refreshSavedPlans();
      useWorkspaceStore.setState((s) => ({ toasts: s.toasts.filter((t) => t.id !== id) }));
      showToast(failed.length === 0 ? `The ${deleted.length} kept cop${deleted.length === 1 ? 'y is' : 'ies are'} back.` : `${failed.length} kept copies could not be put back: ${failed[0] && !failed[0].ok ? failed[0].message : ''}`);
    },
  });
}

/** Asks before deleting every kept copy, naming them; nothing is deleted until the user says so. */
export function askDeleteAllKept(plans: readonly SavedPlan[]): void {
  if (plans.length === 0) return;
  const count = `${plans.length} kept cop${plans.length === 1 ? 'y' : 'ies'}`;
  useWorkspaceStore.setState({
    question: {
      title: `Delete ${count}?`,
      text: `The page kept ${plans.length === 1 ? 'this plan' : 'these plans'} before a link, a file, a saved plan or the demo replaced your work: ${names(plans)}. Your own saved plans stay. Open a copy or move it to your plans first to keep it.`,
      choices: [
        { label: `Delete ${count}`, run: () => deleteNow(plans) },
        { label: 'Keep them', run: () => undefined },
      ],
    },
  });
}
