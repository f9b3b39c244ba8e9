import { type FocusEvent, type KeyboardEvent, useId } from 'react';
import type { Unit } from '../../io/quantity';
import { describedBy as joinIds, HelpLabel, type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { type ConverterFieldKey, FIELD_SPECS, rangeText } from './converter-fields';
import { converterFieldHelp } from './converter-help';

/** Id of the element showing a field's message. */
export function fieldMessageId(key: ConverterFieldKey): string {
  return `converter-message-${key}`;
}

interface ConverterFieldProps {
  fieldKey: ConverterFieldKey;
  /** Label shown instead of the field's own (e.g. "±" for an sd beside its value). */
  label?: string;
  /** Read by assistive technology only. */
  labelHidden?: boolean;
  className?: string;
  /** Called after a new good value was applied (e.g. to choose the rule this field belongs to). */
  onApplied?: () => void;
  /** Replaces the field's own help (converter-help.ts), shown by a "?" beside a visible label. */
  help?: HelpTopic;
  /** Ids of text elsewhere that describes the field (the help of the choice a hidden-label field belongs to). */
  describedBy?: string;
}

/**
 * A typed quantity with its unit: applied on Enter or when the field is left. A refused entry
 * stays in the field with a message naming the field and its valid range; the last good value
 * stays in effect. Escape brings the good value back. A number typed with a unit ("2.5 ms") uses
 * that unit.
 */
export function ConverterField({ fieldKey, label, labelHidden = false, className, onApplied, help, describedBy }: ConverterFieldProps) {
  const id = useId();
  const spec = FIELD_SPECS[fieldKey];
  const field = useSekundoStore((s) => s.converterFields[fieldKey]);
  const error = useSekundoStore((s) => s.converterErrors[fieldKey]);
  const edit = useSekundoStore((s) => s.editConverterField);
  const commit = useSekundoStore((s) => s.commitConverterField);
  const setUnit = useSekundoStore((s) => s.setConverterFieldUnit);
  const discard = useSekundoStore((s) => s.discardConverterDraft);
  const shownLabel = label ?? spec.label;
  const valid = `Valid: ${rangeText(spec, field.unit)}${spec.optional ? `; empty for ${spec.emptyMeaning}` : ''}.`;
  const fieldHelp = useFieldHelp(spec.label, help ?? converterFieldHelp(fieldKey, field.unit));
  // A hidden label has no room for a "?": the caller's help describes the field instead.
  const ownHelp = !labelHidden;
  const helpIds = joinIds(ownHelp && fieldHelp.describedBy, describedBy);

  const apply = () => {
    const before = useSekundoStore.getState().converterFields[fieldKey].value;
    commit(fieldKey);
    const after = useSekundoStore.getState();
    const value = after.converterFields[fieldKey].value;
    if (onApplied && !(fieldKey in after.converterErrors) && value !== null && value !== before) onApplied();
  };
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'Enter') {
      event.preventDefault();
      apply();
    }
    if (event.key === 'Escape') discard(fieldKey);
  };
  const onBlur = (event: FocusEvent<HTMLInputElement>) => {
    // Leaving for the unit menu of the same field is not leaving the field.
    if (event.relatedTarget instanceof HTMLElement && event.relatedTarget.dataset.unitFor === id) return;
    apply();
  };

  return (
    <div className={`converter-field${className ? ` ${className}` : ''}`}>
      {ownHelp ? (
        <HelpLabel htmlFor={id} help={fieldHelp}>
          {shownLabel}
        </HelpLabel>
      ) : (
        <label htmlFor={id} className="visually-hidden">
          {spec.label}
        </label>
      )}
      <div className="converter-field__row">
        <input
          id={id}
          className="text-input converter-input"
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          value={field.text}
          aria-label={spec.label}
          placeholder={spec.optional ? spec.emptyMeaning : undefined}
          title={`${spec.label}. ${valid}`}
          aria-invalid={error ? true : undefined}
          aria-describedby={joinIds(error ? fieldMessageId(fieldKey) : !helpIds && `${id}-valid`, helpIds)}
          onChange={(event) => edit(fieldKey, event.target.value)}
          onBlur={onBlur}
          onKeyDown={onKeyDown}
        />
        {spec.units.length > 0 ? (
          <select
            className="unit-select"
            aria-label={`${spec.label} unit`}
            aria-describedby={helpIds}
            data-unit-for={id}
            value={field.unit}
            onChange={(event) => setUnit(fieldKey, event.target.value as Unit)}
          >
            {spec.units.map((unit) => (
              <option key={unit} value={unit}>
                {unit}
              </option>
            ))}
          </select>
        ) : null}
      </div>
      <span id={`${id}-valid`} className="visually-hidden">
        {valid}
      </span>
      {error ? (
        <p id={fieldMessageId(fieldKey)} className="field-error" role="alert">
          {error} The last good value stays in effect.
        </p>
      ) : null}
    </div>
  );
}
