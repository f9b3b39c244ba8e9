import { useMemo } from 'react';
import { useSekundoStore } from '../store';
import { derivePlan, type PlanOutcome } from './derive-plan';

/** The plan's results, derived from the store's plan with the kernel (memoised per plan). */
export function usePlanOutcome(): PlanOutcome {
  const plan = useSekundoStore((s) => s.plannerPlan);
  return useMemo(() => derivePlan(plan), [plan]);
}
