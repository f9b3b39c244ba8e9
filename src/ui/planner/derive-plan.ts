import { explainPlanError, type PlanBath, type PlanFile, parsePlanFile, planBath, planFileToInput } from '../../io/plan-file';
import { computePlan, type PlanInput, type PlanResult } from '../../physics';
import { describePlanMessage } from './plan-paths';

/** A plan's results, or the one message that says why there are none. */
export type PlanOutcome = { ok: true; input: PlanInput; bath: PlanBath; result: PlanResult } | { ok: false; message: string };

// Results are derived, never stored: one memo per plan object (plans are replaced, never mutated),
// so the check made while typing and the page's own read share one computation.
const outcomes = new WeakMap<PlanFile, PlanOutcome>();

/** The plan's results from the kernel (planFileToInput + computePlan), memoised per plan object. */
export function derivePlan(plan: PlanFile): PlanOutcome {
  const known = outcomes.get(plan);
  if (known) return known;
  let outcome: PlanOutcome;
  try {
    const input = planFileToInput(plan);
    outcome = { ok: true, input, bath: planBath(plan), result: computePlan(input) };
  } catch (error) {
    outcome = { ok: false, message: describePlanMessage(explainPlanError(error)) };
  }
  outcomes.set(plan, outcome);
  return outcome;
}

/**
 * Why a changed plan cannot be used, or null: first the plan-file schema (every field and
 * cross-field rule), then the kernel itself. The message names the field as the page labels it.
 */
export function planProblem(plan: PlanFile): string | null {
  const parsed = parsePlanFile(JSON.stringify(plan));
  if (!parsed.ok) {
    const [first = 'plan: not valid', ...rest] = parsed.errors;
    const more = rest.length > 0 ? ` (and ${rest.length} more)` : '';
    return `${describePlanMessage(first)}${more}`;
  }
  const outcome = derivePlan(plan);
  return outcome.ok ? null : outcome.message;
}
