import { useDeferredValue } from 'react';
import { useSekundoStore } from '../store';
import type { PlanOutcome } from './derive-plan';
import { planWorkerRuns, usePlanRequests, useShownOutcome, useShownUpdating } from './plan-engine';

/** Before the first answer for a plan: no results yet, and no refusal either. */
const PENDING: PlanOutcome = { ok: false, message: 'Working out the plan…', pending: true };

/**
 * The store's plan where no worker runs (the results are computed from it on this thread); null
 * where the worker runs: the views that read results then follow the worker's answers only, and
 * a keystroke in a large plan re-renders none of them.
 */
function usePlanComputedHere() {
  return useSekundoStore((s) => (planWorkerRuns() ? null : s.plannerPlan));
}

/**
 * The plan's results as the page shows them: computed from the store's plan by the plan worker
 * (plan-engine.ts), the last answer kept while a newer plan computes.
 */
export function usePlanOutcome(): PlanOutcome {
  // Deferred: a new answer re-renders the results at low priority, so a keystroke interrupts it.
  return useDeferredValue(useShownOutcome(usePlanComputedHere()) ?? PENDING);
}

/** Whether the results on screen are for an earlier plan (or timeline) than the one being edited. */
export function usePlanUpdating(): boolean {
  return useShownUpdating(usePlanComputedHere());
}

/** Sends each new plan of the store to the plan worker (once on the page: the planner view). */
export function useRequestPlans(): void {
  usePlanRequests(useSekundoStore((s) => (planWorkerRuns() ? s.plannerPlan : null)));
}
