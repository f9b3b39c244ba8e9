import { useMemo } from 'react';
import type { PlanFile } from '../../io/plan-file';
import { fieldRangeText as specRangeText } from '../fields/field-spec';
import type { QuantityFieldProps, TextFieldProps } from '../fields/QuantityField';
import { useSekundoStore } from '../store';
import { PLANNER_FIELD_PREFIX } from './planner-slice';
import { type NumberField, type PlanEdit, rangeOf, specWithRange } from './plan-fields';
import { PLAN_OTHER_HELP, planHelpKey, planNumberHelp } from './planner-help';

/** Key of a planner field in the fields slice (drafts, messages, message ids). */
export function planFieldKey(key: string): string {
  return `${PLANNER_FIELD_PREFIX}${key}`;
}

/**
 * The props that bind a planner field spec to the plan for QuantityField: its value, its range
 * against the plan in use (with its help), and an apply that changes the plan only when the whole
 * plan then checks out.
 */
export function usePlanField(field: NumberField): Pick<QuantityFieldProps, 'fieldKey' | 'spec' | 'value' | 'apply'> {
  const value = useSekundoStore((s) => field.get(s.plannerPlan) ?? null);
  const min = useSekundoStore((s) => rangeOf(field, s.plannerPlan)[0]);
  const max = useSekundoStore((s) => rangeOf(field, s.plannerPlan)[1]);
  const applyEdit = useSekundoStore((s) => s.applyPlannerEdit);
  // Field objects are made afresh on each render (sensor rows); what matters is the key and range.
  // biome-ignore lint/correctness/useExhaustiveDependencies: see the line above
  const spec = useMemo(() => {
    const bare = specWithRange(field, [min, max]);
    return { ...bare, help: planNumberHelp(field, specRangeText(bare)) };
  }, [field.key, field.label, min, max]);
  return {
    fieldKey: planFieldKey(field.key),
    spec,
    value,
    apply: (v) => (v === null ? `${field.label} is empty.` : applyEdit((plan) => field.set(plan, v))),
  };
}

/** Props for a TextField over a text of the plan (its name, a sensor's id or label, a plane's label). */
export function usePlanText(key: string, select: (plan: PlanFile) => string, edit: (plan: PlanFile, text: string) => PlanEdit | PlanFile): Pick<TextFieldProps, 'fieldKey' | 'value' | 'apply' | 'help'> {
  const value = useSekundoStore((s) => select(s.plannerPlan));
  const applyEdit = useSekundoStore((s) => s.applyPlannerEdit);
  const helpKey = planHelpKey(key);
  return {
    fieldKey: planFieldKey(key),
    value,
    apply: (text) => applyEdit((plan) => edit(plan, text)),
    help: helpKey in PLAN_OTHER_HELP ? PLAN_OTHER_HELP[helpKey as keyof typeof PLAN_OTHER_HELP] : undefined,
  };
}
