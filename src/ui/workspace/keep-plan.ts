/**
 * Keeping work before something replaces it: before a share link, a plan file, a saved plan or the
 * demo takes the place of the open plan, that plan is kept as a named copy in the saved plans —
 * unless it is unchanged since it came from a file, the demo or a saved plan, or a saved plan
 * already holds it — and the planner's note says where. When it cannot be kept (storage full or
 * off) the page asks first.
 */
import { type PlanFile, serializePlanFile } from '../../io/plan-file';
import { keepPlanCopy, listPlans } from '../../io/workspace-storage';
import { downloadPlanFile } from '../planner/plan-file-actions';
import { type PlannerSource, useSekundoStore } from '../store';
import { refreshSavedPlans, workspaceKv } from './workspace-kv';
import { useWorkspaceStore } from './workspace-store';

function sameText(a: PlanFile, b: PlanFile): boolean {
  return a === b || serializePlanFile(a) === serializePlanFile(b);
}

function keptName(plan: PlanFile, reason: string, now: Date): string {
  const when = now.toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
  return `${plan.name} (kept ${when}, before ${reason})`.slice(0, 120);
}

/**
 * Whether the open plan is work of the visitor's own that is kept nowhere else: false when no plan
 * is open yet, or when it is unchanged since it came from a file, the demo, "New plan" or a saved plan.
 */
export function openPlanIsOwnWork(): boolean {
  const main = useSekundoStore.getState();
  if (main.plannerStatus !== 'ready') return false;
  return !(main.plannerOpenedPlan === main.plannerPlan && ['demo', 'built-in', 'new', 'file', 'saved'].includes(main.plannerSource.kind));
}

/** What became of the open plan before it was replaced. */
export type KeepOutcome = { kept: 'not needed' } | { kept: 'copy'; name: string } | { kept: 'saved'; name: string } | { kept: 'failed'; message: string };

/**
 * Keeps the open plan somewhere durable before it is replaced: nothing to do when it is unchanged
 * since it came from a file, the demo or a saved plan, or when a saved plan holds the same plan;
 * (compared by content: a copy already kept is not kept twice); otherwise a named copy in the
 * saved plans ("<name> (kept <time>, before <reason>)"), marked as a kept copy.
 */
export function keepOpenPlan(reason: string, now = new Date()): KeepOutcome {
  if (!openPlanIsOwnWork()) return { kept: 'not needed' };
  const plan = useSekundoStore.getState().plannerPlan;
  const twin = listPlans(workspaceKv()).plans.find((p) => sameText(p.plan, plan));
  if (twin) return { kept: 'saved', name: twin.name };
  const result = keepPlanCopy(workspaceKv(), keptName(plan, reason, now), plan, `before ${reason}`, now);
  refreshSavedPlans();
  return result.ok ? { kept: 'copy', name: result.value.name } : { kept: 'failed', message: result.message };
}

/** The sentence that tells where the replaced plan is. */
export function keptSentence(outcome: KeepOutcome): string {
  if (outcome.kept === 'copy') return `Your previous plan is kept in Saved plans as “${outcome.name}”.`;
  if (outcome.kept === 'saved') return `Your previous plan is in Saved plans as “${outcome.name}”.`;
  return '';
}

/**
 * Replaces the open plan (a link, a file, a saved plan, the demo) after keeping it. When it cannot
 * be kept (storage full or off), asks first: save a plan file, replace anyway, or keep working.
 */
export function replaceOpenPlan(plan: PlanFile, source: PlannerSource, reason: string, after: () => void = () => undefined): void {
  const apply = (sentence: string) => {
    useSekundoStore.getState().loadPlannerPlan(plan, sentence ? { ...source, note: [source.note, sentence].filter(Boolean).join(' ') } : source);
    after();
  };
  const outcome = keepOpenPlan(reason);
  if (outcome.kept !== 'failed') {
    apply(keptSentence(outcome));
    return;
  }
  const open = useSekundoStore.getState().plannerPlan;
  useWorkspaceStore.setState({
    question: {
      title: 'Your plan cannot be kept in this browser',
      text: `${outcome.message} Opening ${reason.replace(/^opening /, '')} would replace “${open.name}”, which is kept nowhere else.`,
      choices: [
        {
          label: 'Save plan file, then open',
          run: () => {
            downloadPlanFile(open);
            apply('Your previous plan was offered as a plan file download.');
          },
        },
        { label: 'Replace without keeping', run: () => apply('') },
        { label: 'Keep my plan', run: () => undefined },
      ],
    },
  });
}

/** Answers the open question with one of its choices. */
export function answerQuestion(index: number): void {
  const question = useWorkspaceStore.getState().question;
  useWorkspaceStore.setState({ question: null });
  question?.choices[index]?.run();
}
