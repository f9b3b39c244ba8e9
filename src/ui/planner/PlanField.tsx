import { type ReactNode, useId } from 'react';
import type { PlanFile } from '../../io/plan-file';
import { useSekundoStore } from '../store';
import { editField, fieldRangeText, fieldText, type NumberField, type PlanEdit } from './plan-fields';

/** Id of the element that shows a field's message, so inputs elsewhere can point to it. */
export function messageId(key: string): string {
  return `planner-message-${key.replace(/[^\w-]/g, '-')}`;
}

interface FieldProps {
  /** Visible label; with `labelHidden` it is read by assistive technology only (table cells). */
  label: string;
  labelHidden?: boolean;
  /** Shown under the field while it has no message. */
  hint?: ReactNode;
  /** Where the message goes: under the field, or in an element the caller renders (see PlanFieldMessage). */
  message?: 'below' | 'elsewhere';
  className?: string;
}

interface NumberFieldProps extends FieldProps {
  field: NumberField;
}

/**
 * A typed quantity in the plan: applied as the user types when the whole plan checks out;
 * otherwise the text stays with a message naming the field and its range, and the plan keeps its
 * last good value. Escape brings back the plan's value.
 */
export function PlanNumberField({ field, ...props }: NumberFieldProps) {
  const value = useSekundoStore((s) => fieldText(field, s.plannerPlan, s.displayUnits));
  const edit = (plan: PlanFile, text: string) => editField(field, plan, text);
  return <PlanTextInput {...props} fieldKey={field.key} value={value} edit={edit} rangeHint={(plan) => fieldRangeText(field, plan)} />;
}

interface TextFieldProps extends FieldProps {
  fieldKey: string;
  /** The plan's current text for the field. */
  select: (plan: PlanFile) => string;
  edit: (plan: PlanFile, text: string) => PlanEdit;
}

/** A text field of the plan (name, sensor id and label) with the same draft-and-message rules. */
export function PlanTextField({ select, ...props }: TextFieldProps) {
  const value = useSekundoStore((s) => select(s.plannerPlan));
  return <PlanTextInput {...props} value={value} />;
}

interface InputProps extends FieldProps {
  fieldKey: string;
  value: string;
  edit: (plan: PlanFile, text: string) => PlanEdit;
  rangeHint?: (plan: PlanFile) => string;
}

function PlanTextInput({ fieldKey, value, edit, label, labelHidden = false, hint, message = 'below', className, rangeHint }: InputProps) {
  const id = useId();
  const draft = useSekundoStore((s) => s.plannerDrafts[fieldKey]);
  const error = useSekundoStore((s) => s.plannerErrors[fieldKey]);
  const type = useSekundoStore((s) => s.typePlannerField);
  const leave = useSekundoStore((s) => s.leavePlannerField);
  const discard = useSekundoStore((s) => s.discardPlannerDraft);
  const range = useSekundoStore((s) => (rangeHint ? rangeHint(s.plannerPlan) : null));
  const hintId = `${id}-hint`;
  const describedBy = error ? messageId(fieldKey) : hint || range ? hintId : undefined;
  return (
    <div className={`plan-field${className ? ` ${className}` : ''}`}>
      <label htmlFor={id} className={labelHidden ? 'visually-hidden' : 'plan-field__label'}>
        {label}
      </label>
      <input
        id={id}
        className="text-input plan-input"
        type="text"
        value={draft ?? value}
        spellCheck={false}
        autoComplete="off"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        title={range ? `${label}: ${range}` : undefined}
        onChange={(event) => type(fieldKey, event.target.value, edit)}
        onBlur={() => leave(fieldKey)}
        onKeyDown={(event) => {
          if (event.key === 'Escape') discard(fieldKey);
        }}
      />
      {error && message === 'below' ? (
        <p id={messageId(fieldKey)} className="field-error plan-field__error" role="alert">
          {error}
        </p>
      ) : null}
      {!error && hint ? (
        <p id={hintId} className="field-hint plan-field__hint">
          {hint}
          {range ? <span className="visually-hidden"> Valid: {range}.</span> : null}
        </p>
      ) : null}
      {!error && !hint && range ? (
        <span id={hintId} className="visually-hidden">
          Valid: {range}.
        </span>
      ) : null}
    </div>
  );
}

/** The message of a field whose input sits where a message does not fit (table cells). */
export function PlanFieldMessage({ fieldKey }: { fieldKey: string }) {
  const error = useSekundoStore((s) => s.plannerErrors[fieldKey]);
  if (!error) return null;
  return (
    <p id={messageId(fieldKey)} className="field-error plan-field__error" role="alert">
      {error}
    </p>
  );
}
