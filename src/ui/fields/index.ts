/**
 * Typed fields, one design for every view (see QuantityField.tsx for the rules and the props):
 * a spec (field-spec.ts), the component, its text twin and the message for table cells, and the
 * store's slice of drafts (fields-slice.ts).
 */
export { type FieldRead, type FieldRole, type FieldSpec, fieldRangeText, fieldValueText, type Range, readFieldText, shownFieldUnit, unitLabel } from './field-spec';
export { createFieldsSlice, type FieldDraft, type FieldsSlice, fieldMessage, hasRefusedField } from './fields-slice';
export { FieldMessage, fieldMessageId, QuantityField, type QuantityFieldProps, TextField, type TextFieldProps } from './QuantityField';
