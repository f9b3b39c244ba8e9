/**
 * A typed value of the watch mode (alarm band, rate, window, look interval): a bare number is in
 * the unit the field shows; a number with a unit of its kind ("1800 mK") uses that unit. Applied on
 * Enter or when the field is left; a refused entry stays in the field with a message naming the
 * field and its valid range, and the last good value stays in effect (Escape brings it back).
 * (The converter's own field serves the converter's keys; the shared quantity field of the house
 * was not on the main line yet when this was written, so this one follows its rules.)
 */
import { type KeyboardEvent, useEffect, useId, useState } from 'react';
import { type Dimension, fromBaseUnit, parseQuantity, QuantityParseError, type Unit } from '../../../io/quantity';
import { HelpLabel, type HelpTopic, useFieldHelp } from '../../help/FieldHelp';

export interface WatchFieldProps {
  label: string;
  /** Good value: SI for a quantity, the number itself for a plain number (shown with `unit` as a word). */
  value: number;
  dimension: Dimension | 'number';
  /** Unit shown (a quantity's unit, or a word after a plain number such as "mK/min"). */
  unit: string;
  /** Valid range, in the value's terms. */
  range: readonly [number, number];
  onValue: (value: number) => void;
  help: HelpTopic;
  disabled?: boolean;
}

function plain(x: number): string {
  return String(Number(x.toPrecision(8)));
}

/** The range as people read it, in the field's unit. */
export function watchRangeText(p: Pick<WatchFieldProps, 'dimension' | 'unit' | 'range'>): string {
  const show = (v: number) => (p.dimension === 'number' ? plain(v) : plain(fromBaseUnit(v, p.unit as Unit)));
  return `${show(p.range[0])}–${show(p.range[1])} ${p.unit}`;
}

/** Reads the text: the value, or a message naming the field and its range. */
export function readWatchField(p: Pick<WatchFieldProps, 'label' | 'dimension' | 'unit' | 'range'>, text: string): { ok: true; value: number } | { ok: false; message: string } {
  const t = text.replace(/\u2212/g, '-').trim();
  const valid = `valid range ${watchRangeText(p)}`;
  if (t === '') return { ok: false, message: `${p.label} is empty: type a value; ${valid}.` };
  let value: number;
  if (p.dimension === 'number') {
    value = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(t) ? Number(t) : Number.NaN;
    if (!Number.isFinite(value)) return { ok: false, message: `${p.label} must be a number in ${p.unit}; got "${t}"; ${valid}.` };
  } else {
    const bare = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/.test(t);
    try {
      value = parseQuantity(bare ? `${t} ${p.unit}` : t, p.dimension);
    } catch (error) {
      if (error instanceof QuantityParseError) return { ok: false, message: `${p.label}: ${error.detail}; ${valid}.` };
      throw error;
    }
  }
  if (value < p.range[0] || value > p.range[1]) {
    const inUnit = p.dimension === 'number' ? value : fromBaseUnit(value, p.unit as Unit);
    return { ok: false, message: `${p.label} ${plain(inUnit)} ${p.unit} is outside the ${valid}.` };
  }
  return { ok: true, value };
}

export function WatchField(props: WatchFieldProps) {
  const { label, value, dimension, unit, onValue, help, disabled } = props;
  const id = useId();
  const shown = dimension === 'number' ? plain(value) : plain(fromBaseUnit(value, unit as Unit));
  const [text, setText] = useState(shown);
  const [error, setError] = useState<string | null>(null);
  const fieldHelp = useFieldHelp(label, help);
  // A new good value from elsewhere (or in a new unit) replaces the text when there is no draft.
  useEffect(() => {
    if (error === null) setText(shown);
  }, [shown, error]);
  const apply = () => {
    const read = readWatchField(props, text);
    if (!read.ok) {
      setError(read.message);
      return;
    }
    setError(null);
    onValue(read.value);
    setText(dimension === 'number' ? plain(read.value) : plain(fromBaseUnit(read.value, unit as Unit)));
  };
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'Enter') {
      event.preventDefault();
      apply();
    }
    if (event.key === 'Escape') {
      setError(null);
      setText(shown);
    }
  };
  return (
    <div className="converter-field">
      <HelpLabel htmlFor={id} help={fieldHelp}>
        {label}
      </HelpLabel>
      <div className="converter-field__row">
        <input
          id={id}
          className="text-input converter-input"
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          value={text}
          disabled={disabled}
          title={`${label}. Valid: ${watchRangeText(props)}.`}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-message` : fieldHelp.describedBy}
          onChange={(event) => setText(event.target.value)}
          onBlur={apply}
          onKeyDown={onKeyDown}
        />
        <span className="watch-field__unit">{unit}</span>
      </div>
      {error ? (
        <p id={`${id}-message`} className="field-error" role="alert">
          {error} The last good value stays in effect.
        </p>
      ) : null}
    </div>
  );
}
