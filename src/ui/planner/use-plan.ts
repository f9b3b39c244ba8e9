import { useDeferredValue } from 'react';
import { useSekundoStore } from '../store';
import type { PlanOutcome } from './derive-plan';
import { useShownPlan } from './plan-engine';

/** Before the first answer for a plan: no results yet, and no refusal either. */
const PENDING: PlanOutcome = { ok: false, message: 'Working out the plan…', pending: true };

/**
 * The plan's results as the page shows them: computed from the store's plan by the plan worker
 * (plan-engine.ts), the last answer kept while a newer plan computes.
 */
export function usePlanOutcome(): PlanOutcome {
  const plan = useSekundoStore((s) => s.plannerPlan);
  // Deferred: a new answer re-renders the results at low priority, so a keystroke interrupts it.
  return useDeferredValue(useShownPlan(plan).outcome ?? PENDING);
}

/** Whether the results on screen are for an earlier plan (or timeline) than the one being edited. */
export function usePlanUpdating(): boolean {
  const plan = useSekundoStore((s) => s.plannerPlan);
  const shown = useShownPlan(plan);
  return shown.updating || (shown.plan !== null && shown.plan !== plan);
}
