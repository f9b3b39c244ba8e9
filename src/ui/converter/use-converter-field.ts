import type { QuantityFieldProps } from '../fields/QuantityField';
import { shownFieldUnit } from '../fields/field-spec';
import { useSekundoStore } from '../store';
import { type ConverterFieldKey, converterFieldKey, FIELD_SPECS } from './converter-fields';
import { converterFieldHelp } from './converter-help';

/**
 * The props that bind a converter field spec to the store for QuantityField: its value, its help
 * (ranges and the starting value in the unit the field shows) and an apply that sets the value
 * when it agrees with the other fields. `onApplied` runs after a good value changed the field
 * (choosing the way of choosing a field belongs to).
 */
export function useConverterField(key: ConverterFieldKey, onApplied?: () => void): Pick<QuantityFieldProps, 'fieldKey' | 'spec' | 'value' | 'apply'> {
  const fieldKey = converterFieldKey(key);
  const value = useSekundoStore((s) => s.converterValues[key]);
  const unit = useSekundoStore((s) => shownFieldUnit(FIELD_SPECS[key], s.converterValues[key], s.displayUnits, s.fieldUnits[fieldKey]));
  const spec = { ...FIELD_SPECS[key], help: converterFieldHelp(key, unit) };
  return {
    fieldKey,
    spec,
    value,
    apply: (v) => {
      const state = useSekundoStore.getState();
      const before = state.converterValues[key];
      const problem = state.setConverterValue(key, v);
      if (problem === null && v !== null && v !== before) onApplied?.();
      return problem;
    },
  };
}
