import type { FieldSpec } from '../fields/field-spec';
import type { QuantityFieldProps, TextFieldProps } from '../fields/QuantityField';
import type { LocateEdit, LocateInputs } from './locate-inputs';
import { useSekundoStore } from '../store';
import { type LocateValueEdit, locateFieldKey } from './locate-fields';

/**
 * The props that bind a locate field spec to the store for QuantityField: its key in the fields
 * slice, the value in effect, and an apply that makes the edit when the inputs take it.
 */
export function locateFieldProps(key: string, spec: FieldSpec, value: number | null, edit: LocateValueEdit): Pick<QuantityFieldProps, 'fieldKey' | 'spec' | 'value' | 'apply'> {
  return {
    fieldKey: locateFieldKey(key),
    spec,
    value,
    apply: (v) => useSekundoStore.getState().applyLocateEdit((inputs) => edit(inputs, v)),
  };
}

/** The same for a text field (a sensor's label). */
export function locateTextProps(key: string, value: string, edit: (inputs: LocateInputs, text: string) => LocateEdit): Pick<TextFieldProps, 'fieldKey' | 'value' | 'apply'> {
  return {
    fieldKey: locateFieldKey(key),
    value,
    apply: (text) => useSekundoStore.getState().applyLocateEdit((inputs) => edit(inputs, text)),
  };
}
