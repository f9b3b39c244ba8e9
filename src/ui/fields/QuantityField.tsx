/**
 * QuantityField: the one input for a typed quantity, in every view.
 *
 *   <QuantityField fieldKey="plan.sensor.s3.distance" spec={spec} value={distance_m}
 *                  apply={(v) => store.setDistance(v)} />
 *
 * Props (see QuantityFieldProps):
 * - `fieldKey`: unique on the page, starting with the feature's prefix ("plan.", "converter.",
 *   "locate.", "explorer.", …); the draft, its message and a unit picked in the field's menu are
 *   kept under it in the store (src/ui/fields/fields-slice.ts), so they survive a switch of view.
 * - `spec`: the field's FieldSpec (field-spec.ts): label, kind, valid range in SI, value or sd, help,
 *   what an empty field means, units offered in a menu.
 * - `value`: the value in effect, SI (null: empty).
 * - `apply(value)`: called with a good value (read and in range, SI; null for an allowed empty
 *   field); returns null when the feature took it, or a one-line refusal (a check against other
 *   inputs), which the field shows while the last good value stays in effect.
 * - optional: `label` (accessible name and visible label; default spec.label), `shortLabel`
 *   (visible instead, e.g. "±", the accessible name stays), `labelHidden` (table cells), `help`
 *   (replaces spec.help), `hint`, `message` ('below', or 'elsewhere': the caller renders
 *   <FieldMessage fieldKey/> where it fits), `describedBy`, `placeholder`, `className`.
 *
 * The rules a person sees, the same in every view:
 * - The unit shown beside the box is the header's unit for the kind, or the ladder's unit that
 *   suits the value for an sd or a small quantity, or the one picked in the field's own menu.
 * - A bare number is in the unit shown when typing began; a typed unit wins ("2.5 ms").
 * - A good value applies as it is typed. A refused text stays in the box with one line naming the
 *   field and its valid range; the last good value stays in effect.
 * - Leaving the field (Tab, click elsewhere) or Enter shows the value in effect again when the text
 *   was good; a refused text stays until it is corrected. Escape always restores the value in effect.
 */
import { type ReactNode, useId } from 'react';
import type { Unit } from '../../io/quantity';
import { describedBy as joinIds, HelpLabel, type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { OwnForm, useInPageForm } from './OwnForm';
import { type FieldSpec, fieldRangeText, fieldValueText, readFieldText, shownFieldUnit, unitLabel } from './field-spec';

/** Id of the element that shows a field's message, so inputs and tables elsewhere can point to it. */
export function fieldMessageId(fieldKey: string): string {
  return `field-message-${fieldKey.replace(/[^\w-]/g, '-')}`;
}

export interface FieldFrameProps {
  /** Store key of the field's draft, message and picked unit; unique on the page, prefixed by its feature. */
  fieldKey: string;
  /** Accessible name and visible label (default: the spec's label). */
  label?: string;
  /** Shown instead of the label where space is short ("±"); the accessible name stays `label`. */
  shortLabel?: string;
  /** The label is read by assistive technology only (table cells). */
  labelHidden?: boolean;
  /** Shown under the field while it has no message. */
  hint?: ReactNode;
  /** Where the message goes: under the field, or in a <FieldMessage> the caller renders. */
  message?: 'below' | 'elsewhere';
  /** Ids of text elsewhere that describes the field (a table column's help). */
  describedBy?: string;
  placeholder?: string;
  className?: string;
}

export interface QuantityFieldProps extends FieldFrameProps {
  spec: FieldSpec;
  /** The value in effect, SI; null: empty. */
  value: number | null;
  /** Takes a good value (SI); returns null when applied, or why it is refused. */
  apply: (value: number | null) => string | null;
  /** Replaces the spec's help. */
  help?: HelpTopic;
}

/** One typed quantity (see the top of this file). */
export function QuantityField({ spec, value, apply, help, ...frame }: QuantityFieldProps) {
  const { fieldKey } = frame;
  const displayUnits = useSekundoStore((s) => s.displayUnits);
  const own = useSekundoStore((s) => s.fieldUnits[fieldKey]);
  const draft = useSekundoStore((s) => s.fieldDrafts[fieldKey]);
  const shown = shownFieldUnit(spec, value, displayUnits, own);
  const unit = draft ? draft.unit : shown;

  const type = (text: string, bareUnit: Unit | null = unit) => {
    typeDraft(fieldKey, text, bareUnit, () => {
      const read = readFieldText(spec, text, bareUnit);
      return read.ok ? apply(read.value) : read.message;
    });
  };
  const pickUnit = (picked: Unit) => {
    useSekundoStore.getState().setFieldUnit(fieldKey, picked);
    if (draft) type(draft.text, picked);
  };
  const unitPart = (helpIds: string | undefined, formId: string | undefined) =>
    unit === null ? null : spec.units && spec.units.length > 0 ? (
      <select className="unit-select" form={formId} aria-label={`${frame.label ?? spec.label} unit`} aria-describedby={helpIds} value={unit} onChange={(event) => pickUnit(event.target.value as Unit)}>
        {(spec.units.includes(unit) ? spec.units : [unit, ...spec.units]).map((u) => (
          <option key={u} value={u}>
            {unitLabel(spec, u)}
          </option>
        ))}
      </select>
    ) : (
      <span className="quantity-field__unit">{unitLabel(spec, unit)}</span>
    );

  return (
    <FieldFrame
      {...frame}
      help={help ?? spec.help}
      name={spec.label}
      range={fieldRangeText(spec)}
      text={draft ? draft.text : fieldValueText(value, shown)}
      placeholder={frame.placeholder ?? spec.blank}
      onType={(text) => type(text)}
      after={unitPart}
    />
  );
}

export interface TextFieldProps extends FieldFrameProps {
  /** The text in effect. */
  value: string;
  /** Takes typed text; returns null when applied, or why it is refused. */
  apply: (text: string) => string | null;
  help?: HelpTopic;
  /** What the field accepts, for the hidden "Valid: …" line ("1–40 characters"). */
  range?: string;
}

/** A text field of a feature (a plan's name, a sensor's label) with the same draft and message rules. */
export function TextField({ value, apply, help, range, ...frame }: TextFieldProps) {
  const { fieldKey } = frame;
  const draft = useSekundoStore((s) => s.fieldDrafts[fieldKey]);
  return (
    <FieldFrame
      {...frame}
      help={help}
      name={frame.label ?? ''}
      range={range ?? null}
      text={draft ? draft.text : value}
      onType={(text) => typeDraft(fieldKey, text, null, () => apply(text))}
      after={() => null}
    />
  );
}

/**
 * Keeps typed text as the field's draft, then applies it: the draft is in the store before the
 * feature's value changes (the plan's undo history joins the keystrokes of one field into one step).
 */
function typeDraft(fieldKey: string, text: string, unit: Unit | null, applied: () => string | null): void {
  const { setFieldDraft } = useSekundoStore.getState();
  setFieldDraft(fieldKey, { text, unit, message: null });
  const message = applied();
  if (message !== null) setFieldDraft(fieldKey, { text, unit, message });
}

interface FrameProps extends FieldFrameProps {
  help: HelpTopic | undefined;
  /** The field's name in messages (the label unless given). */
  name: string;
  range: string | null;
  text: string;
  onType: (text: string) => void;
  /** What stands after the box (the unit), given the ids of the field's help and of the box's own form (OwnForm.tsx). */
  after: (helpIds: string | undefined, formId: string | undefined) => ReactNode;
}

/** Label, box, unit, hint and message: what every field looks like and how it leaves and restores. */
function FieldFrame({ fieldKey, label, shortLabel, labelHidden = false, hint, message = 'below', describedBy: elsewhere, placeholder, className, help, name, range, text, onType, after }: FrameProps) {
  const id = useId();
  const accessibleName = label ?? name;
  const fieldHelp = useFieldHelp(accessibleName, help ?? { what: '' });
  const hasHelp = help !== undefined && !labelHidden;
  const error = useSekundoStore((s) => s.fieldDrafts[fieldKey]?.message ?? null);
  const leave = () => {
    const state = useSekundoStore.getState();
    const draft = state.fieldDrafts[fieldKey];
    if (draft && draft.message === null) state.dropFieldDraft(fieldKey);
  };
  const validId = `${id}-valid`;
  const hintId = `${id}-hint`;
  // The box's own form (OwnForm.tsx), unless it sits in a small form of the page's own.
  const formId = useInPageForm() ? undefined : `${id}-form`;
  // The help (own or a column's) names the valid range; without any, a hidden line says it.
  const helped = hasHelp || elsewhere !== undefined;
  const describedBy = joinIds(error && fieldMessageId(fieldKey), !error && hint ? hintId : null, !error && range && !helped && validId, hasHelp && fieldHelp.describedBy, elsewhere);
  const visible = shortLabel ?? accessibleName;
  return (
    <div className={`quantity-field${className ? ` ${className}` : ''}`}>
      {hasHelp ? (
        <HelpLabel htmlFor={id} className="quantity-field__label" help={fieldHelp}>
          {visible}
        </HelpLabel>
      ) : (
        <label htmlFor={id} className={labelHidden ? 'visually-hidden' : 'quantity-field__label'}>
          {labelHidden ? accessibleName : visible}
        </label>
      )}
      <div className="quantity-field__box">
        <input
          id={id}
          form={formId}
          className="text-input quantity-input"
          type="text"
          value={text}
          spellCheck={false}
          autoComplete="off"
          placeholder={placeholder}
          aria-label={shortLabel !== undefined && !labelHidden ? accessibleName : undefined}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          title={range ? `${accessibleName}: ${range}` : undefined}
          onChange={(event) => onType(event.target.value)}
          onBlur={leave}
          onKeyDown={(event) => {
            if (event.key === 'Enter') leave();
            if (event.key === 'Escape') useSekundoStore.getState().dropFieldDraft(fieldKey);
          }}
        />
        {after(joinIds(hasHelp && fieldHelp.describedBy, elsewhere), formId)}
        {formId === undefined ? null : <OwnForm id={formId} />}
      </div>
      {error && message === 'below' ? (
        <p id={fieldMessageId(fieldKey)} className="field-error quantity-field__error" role="alert">
          {error}
        </p>
      ) : null}
      {!error && hint ? (
        <p id={hintId} className="field-hint quantity-field__hint">
          {hint}
        </p>
      ) : null}
      {range && !helped ? (
        <span id={validId} className="visually-hidden">
          Valid: {range}.
        </span>
      ) : null}
    </div>
  );
}

/** The message of a field whose box sits where a message does not fit (table cells): render it below the table. */
export function FieldMessage({ fieldKey }: { fieldKey: string }) {
  const error = useSekundoStore((s) => s.fieldDrafts[fieldKey]?.message ?? null);
  if (!error) return null;
  return (
    <p id={fieldMessageId(fieldKey)} className="field-error quantity-field__error" role="alert">
      {error}
    </p>
  );
}
