import { type KeyboardEvent, useId } from 'react';
import { describedBy as joinIds, HelpLabel, type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import type { LocateTextEdit } from '../store/locate-slice';
import { fieldText, type QuantityFieldSpec } from './locate-fields';

interface LocateFieldProps {
  /** Store key of the draft and its message, e.g. "row.s3.x". */
  fieldKey: string;
  spec: QuantityFieldSpec;
  /** The value in effect, SI (null: blank). */
  value: number | null;
  /** How typed text changes the inputs (through typeLocateField); or give `onType` instead. */
  edit?: LocateTextEdit;
  /** Takes the typed text itself, for fields whose store action is not typeLocateField. */
  onType?: (text: string) => void;
  /** Visible label; when `hideLabel`, only for assistive technology (table cells). */
  label: string;
  hideLabel?: boolean;
  /** Unit shown after the box. */
  unit?: string;
  /** Show the message under the field (false: the caller shows it, e.g. in a table row). */
  inlineMessage?: boolean;
  placeholder?: string;
  /** What the field is, its units, range and default: a "?" beside the label (visible labels only). */
  help?: HelpTopic;
  /** Ids of text elsewhere that describes the field (a table column's help). */
  describedBy?: string;
}

/** A typed quantity: a good value applies as it is typed; a bad one keeps the last good value and says why. */
export function LocateField({ fieldKey, spec, value, edit, onType, label, hideLabel = false, unit, inlineMessage = true, placeholder, help, describedBy }: LocateFieldProps) {
  const id = useId();
  const fieldHelp = useFieldHelp(label, help ?? { what: '' });
  const hasHelp = help !== undefined && !hideLabel;
  const draft = useSekundoStore((s) => s.locateDrafts[fieldKey]);
  const error = useSekundoStore((s) => s.locateErrors[fieldKey]);
  const type = useSekundoStore((s) => s.typeLocateField);
  const leave = useSekundoStore((s) => s.leaveLocateField);
  const discard = useSekundoStore((s) => s.discardLocateDraft);
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'Escape') discard(fieldKey);
    if (event.key === 'Enter') leave(fieldKey);
  };
  return (
    <div className="locate-field">
      {hasHelp ? (
        <HelpLabel htmlFor={id} className="locate-field__label" help={fieldHelp}>
          {label}
        </HelpLabel>
      ) : (
        <label htmlFor={id} className={hideLabel ? 'visually-hidden' : 'locate-field__label'}>
          {label}
        </label>
      )}
      <div className="locate-field__box">
        <input
          id={id}
          className="locate-input"
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          value={draft ?? fieldText(spec, value)}
          placeholder={placeholder}
          aria-invalid={error ? true : undefined}
          aria-describedby={joinIds(error && `${id}-error`, hasHelp && fieldHelp.describedBy, describedBy)}
          onChange={(event) => (onType ? onType(event.target.value) : edit && type(fieldKey, event.target.value, edit))}
          onBlur={() => leave(fieldKey)}
          onKeyDown={onKeyDown}
        />
        {unit ? <span className="locate-field__unit">{unit}</span> : null}
      </div>
      {error ? (
        <p id={`${id}-error`} className={inlineMessage ? 'field-error' : 'visually-hidden'} role={inlineMessage ? 'alert' : undefined}>
          {error}
        </p>
      ) : null}
    </div>
  );
}
