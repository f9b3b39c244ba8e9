import { type ReactNode, useId, useRef } from 'react';
import type { PlanFile } from '../../io/plan-file';
import { describedBy as joinIds, HelpLabel, type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { editField, fieldRangeText, fieldText, fieldUnit, type NumberField, type PlanEdit } from './plan-fields';
import { PLAN_OTHER_HELP, planHelpKey, planNumberHelp } from './planner-help';

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
  /**
   * What the field is, its units, range and default, shown by a "?" beside a visible label. Number
   * fields and the plan's text fields find their own (planner-help.ts); this replaces it.
   */
  help?: HelpTopic;
  /** Ids of text elsewhere that describes the field (a table column's help, for hidden labels). */
  describedBy?: string;
}

interface NumberFieldProps extends FieldProps {
  field: NumberField;
}

/**
 * A typed quantity in the plan: applied as the user types when the whole plan checks out;
 * otherwise the text stays with a message naming the field and its range, and the plan keeps its
 * last good value. Escape brings back the plan's value.
 */
export function PlanNumberField({ field, help, ...props }: NumberFieldProps) {
  const range = useSekundoStore((s) => fieldRangeText(field, s.plannerPlan));
  const value = useSekundoStore((s) => fieldText(field, s.plannerPlan, s.displayUnits));
  // A bare number is in the unit the field showed when typing began (it must not change while the
  // typed value grows past a step of the unit ladder: 100 µs, then 1000 µs, stays in µs).
  const unit = useSekundoStore((s) => fieldUnit(field, s.plannerPlan, s.displayUnits));
  const typing = useSekundoStore((s) => field.key in s.plannerDrafts);
  const unitAtStart = useRef(unit);
  if (!typing) unitAtStart.current = unit;
  const edit = (plan: PlanFile, text: string) => editField(field, plan, text, unitAtStart.current ?? undefined);
  return <PlanTextInput {...props} help={help ?? planNumberHelp(field, range)} fieldKey={field.key} value={value} edit={edit} rangeHint={(plan) => fieldRangeText(field, plan)} />;
}

interface TextFieldProps extends FieldProps {
  fieldKey: string;
  /** The plan's current text for the field. */
  select: (plan: PlanFile) => string;
  edit: (plan: PlanFile, text: string) => PlanEdit;
}

/** A text field of the plan (name, sensor id and label) with the same draft-and-message rules. */
export function PlanTextField({ select, help, ...props }: TextFieldProps) {
  const value = useSekundoStore((s) => select(s.plannerPlan));
  const key = planHelpKey(props.fieldKey);
  return <PlanTextInput {...props} help={help ?? (key in PLAN_OTHER_HELP ? PLAN_OTHER_HELP[key as keyof typeof PLAN_OTHER_HELP] : undefined)} value={value} />;
}

interface InputProps extends FieldProps {
  fieldKey: string;
  value: string;
  edit: (plan: PlanFile, text: string) => PlanEdit;
  rangeHint?: (plan: PlanFile) => string;
}

function PlanTextInput({ fieldKey, value, edit, label, labelHidden = false, hint, message = 'below', className, rangeHint, help, describedBy: elsewhere }: InputProps) {
  const id = useId();
  const fieldHelp = useFieldHelp(label, help ?? { what: '' });
  const hasHelp = help !== undefined && !labelHidden;
  // The help (own or a column's) names the valid range; without any, a hidden line says it.
  const helped = hasHelp || elsewhere !== undefined;
  const draft = useSekundoStore((s) => s.plannerDrafts[fieldKey]);
  const error = useSekundoStore((s) => s.plannerErrors[fieldKey]);
  const type = useSekundoStore((s) => s.typePlannerField);
  const leave = useSekundoStore((s) => s.leavePlannerField);
  const discard = useSekundoStore((s) => s.discardPlannerDraft);
  const range = useSekundoStore((s) => (rangeHint ? rangeHint(s.plannerPlan) : null));
  const hintId = `${id}-hint`;
  const shownHint = error ? null : hint ? 'hint' : range && !helped ? 'range' : null;
  const describedBy = joinIds(error && messageId(fieldKey), shownHint && hintId, hasHelp && fieldHelp.describedBy, elsewhere);
  return (
    <div className={`plan-field${className ? ` ${className}` : ''}`}>
      {hasHelp ? (
        <HelpLabel htmlFor={id} className="plan-field__label" help={fieldHelp}>
          {label}
        </HelpLabel>
      ) : (
        <label htmlFor={id} className={labelHidden ? 'visually-hidden' : 'plan-field__label'}>
          {label}
        </label>
      )}
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
      {shownHint === 'hint' ? (
        <p id={hintId} className="field-hint plan-field__hint">
          {hint}
          {range && !helped ? <span className="visually-hidden"> Valid: {range}.</span> : null}
        </p>
      ) : null}
      {shownHint === 'range' ? (
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
