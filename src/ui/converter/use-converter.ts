import { useShallow } from 'zustand/react/shallow';
import type { ChoiceRule } from '../../physics';
import { useSekundoStore } from '../store';
import { type ChoiceKind, choiceRuleOf, type FieldValues } from './converter-checks';

/** The fields' last good values (SI); a new object only when a value changes, not on each keystroke. */
export function useFieldValues(): FieldValues {
  return useSekundoStore(useShallow((s) => s.converterValues));
}

/** The way of choosing among candidates, and its kernel rule (null: none, or its value is missing). */
export function useChoiceRule(): { kind: ChoiceKind; rule: ChoiceRule | null } {
  const kind = useSekundoStore((s) => s.converterChoice);
  const values = useFieldValues();
  return { kind, rule: choiceRuleOf(kind, values) };
}
