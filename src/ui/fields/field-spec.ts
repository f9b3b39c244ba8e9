/**
 * What a typed quantity is, in one shape for every view: its label, kind of quantity, valid range
 * in SI, whether it is a value or an sd, its help, and what an empty field means. Reading typed
 * text, showing a value and naming the range are written once here; the component that uses them
 * is QuantityField.tsx (its comment says the rules a person sees).
 *
 * The unit a field shows (`shownFieldUnit`): a unit picked in the field's own menu; otherwise, for
 * a value of a kind that follows the header (temperature, length, time, pressure, heat flux), the
 * header's unit; otherwise the unit of its kind's ladder that suits the value (an sd, an instrument
 * time constant, a frequency…: "2 µs", "5 MS/s"). A bare number typed is in the unit shown; a
 * number with a unit ("2.5 ms") uses that unit.
 */
import { fromBaseUnit, parseQuantity, QuantityParseError, toBaseUnit, type Unit, unitsOf } from '../../io/quantity';
import type { HelpTopic } from '../help/FieldHelp';
import { type DisplayUnit, messageText, type QuantityKind, rangeText, unitFor } from '../units/ladders';
import { plain } from '../units/format-number';
import { type DisplayUnits, shownUnit, UNIT_KINDS, type UnitChoice } from '../units/unit-choices';

/** A value, or an uncertainty standing on its own (always shown on its kind's ladder, never in the header's unit). */
export type FieldRole = 'value' | 'sd';

export type Range = readonly [number, number];

/** One typed quantity (or plain number). Views keep their specs beside them, in this shape. */
export interface FieldSpec {
  /** Names the field in messages and is its label unless the component is given another ("Sensor 1 distance"). */
  label: string;
  /** The kind of quantity (`KINDS` in src/ui/units/ladders.ts); null for a plain number. */
  kind: QuantityKind | null;
  /** Valid range in SI (both ends accepted unless `aboveMin`). */
  range: Range;
  /** 'value' (default) or 'sd'. */
  role?: FieldRole;
  /** What the field is, its units, range and default: the "?" beside a visible label. */
  help?: HelpTopic;
  /** An empty field is allowed and means this ("no reading", "the end of the record"); its value is null. */
  blank?: string;
  /** Only whole numbers. */
  integer?: boolean;
  /** The lower end itself is refused ("above 0" for radii and sds). */
  aboveMin?: boolean;
  /** Words after the range in messages ("at most the pulse width"). */
  rangeNote?: string;
  /** Units offered in a menu beside the box, the usual first; without, the shown unit is plain text. */
  units?: readonly Unit[];
}

/** Reading typed text: the SI value (null for an allowed empty field) or the one-line message. */
export type FieldRead = { ok: true; value: number | null } | { ok: false; message: string };

const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The unit the field shows (see the top of this file); null for a plain number. */
export function shownFieldUnit(spec: FieldSpec, value: number | null, units: DisplayUnits, own?: Unit): Unit | null {
  if (spec.kind === null) return null;
  if (own !== undefined) return own;
  if (spec.kind.follows && spec.role !== 'sd') return units[spec.kind.follows] as Unit;
  return unitFor(value ?? 0, spec.kind.ladder, spec.kind.zero).unit;
}

/** A unit as printed beside the box ("µs", "W/cm²", "m²"). */
export function unitLabel(spec: FieldSpec, unit: Unit): string {
  const onLadder = spec.kind?.ladder.find((d: DisplayUnit) => d.unit === unit);
  return onLadder ? onLadder.shown : shownUnit(unit);
}

/** The valid range as people read it, in units that suit each end: "10 ns–10 s", "a whole number 0–8", "0.3–4.24 K". */
export function fieldRangeText(spec: FieldSpec): string {
  const [min, max] = spec.range;
  const kind = spec.kind;
  const end = (x: number) => (kind ? messageText(x, kind.ladder, kind.zero) : plain(x));
  let text: string;
  if (spec.aboveMin) text = `above ${end(min)}, up to ${end(max)}`;
  else if (kind) text = rangeText(min, max, kind.ladder, kind.zero);
  else text = min < 0 ? `from ${plain(min)} to ${plain(max)}` : `${plain(min)}–${plain(max)}`;
  const whole = spec.integer ? 'a whole number ' : '';
  const notes = [spec.rangeNote, spec.blank && `empty for ${spec.blank}`].filter(Boolean).join('; ');
  return `${whole}${text}${notes ? ` (${notes})` : ''}`;
}

/**
 * Reads typed text for a field: a bare number is in `unit` (the unit the field showed when typing
 * began); a typed unit wins. Gives the SI value, or a message naming the field and its valid range.
 */
export function readFieldText(spec: FieldSpec, text: string, unit: Unit | null): FieldRead {
  const trimmed = decimalPoint(text.trim().replace(/\u2212/g, '-'));
  const range = fieldRangeText(spec);
  if (trimmed === '') {
    if (spec.blank !== undefined) return { ok: true, value: null };
    return { ok: false, message: `${spec.label} is empty: type a value, ${range}.` };
  }
  let value: number;
  if (spec.kind) {
    try {
      value = parseQuantity(unit !== null && PLAIN_NUMBER.test(trimmed) ? `${trimmed} ${unit}` : trimmed, spec.kind.dimension);
    } catch (error) {
      if (!(error instanceof QuantityParseError)) throw error;
      const units = unitsOf(spec.kind.dimension).join(', ');
      return { ok: false, message: `${spec.label}: ${unitProblem(error)} Type e.g. ${spec.kind.example} (units ${units}); valid ${range}.` };
    }
  } else {
    if (!PLAIN_NUMBER.test(trimmed)) return { ok: false, message: `${spec.label} must be a number, ${range}; “${text.trim()}” is not one.` };
    value = Number(trimmed);
  }
  if (!inRange(spec, value) || (spec.integer && !Number.isInteger(value))) {
    const meant = spec.kind && unit !== null && PLAIN_NUMBER.test(trimmed) ? meantUnit(spec, Number(trimmed), unit) : null;
    return { ok: false, message: `${spec.label} must be ${range}; “${text.trim()}” is outside.${meant ? ` A bare number is in ${shownUnit(unit ?? '')}: did you mean ${trimmed} ${meant}?` : ''}` };
  }
  return { ok: true, value };
}

function inRange(spec: FieldSpec, value: number): boolean {
  const [min, max] = spec.range;
  return value <= max && (spec.aboveMin ? value > min : value >= min);
}

/** "1,65" → "1.65": a decimal comma in a number typed alone (no point, one comma between digits). */
function decimalPoint(text: string): string {
  return /^[+-]?\d+,\d+(?:[eE][+-]?\d+)?(?:\s*\D.*)?$/.test(text) && !text.includes('.') ? text.replace(',', '.') : text;
}

/**
 * Another unit of the header's choices for the field's kind in which a bare number that is out of
 * range would be in range (1800 typed in K: "1800 mK"); null when none or the kind has no choice.
 */
function meantUnit(spec: FieldSpec, amount: number, unit: Unit): string | null {
  const follows = spec.kind?.follows;
  if (!follows) return null;
  const other = (UNIT_KINDS[follows].choices as readonly UnitChoice[]).find((c) => c.unit !== unit && inRange(spec, toBaseUnit(amount, c.unit as Unit)));
  return other ? other.shown : null;
}

function unitProblem(error: QuantityParseError): string {
  switch (error.problem) {
    case 'not-a-number':
      return `“${error.input.trim()}” does not start with a number.`;
    case 'unknown-unit':
      return `“${error.input.trim()}” has a unit that is not a ${error.dimension}.`;
    case 'non-finite':
      return `“${error.input.trim()}” is not a finite number.`;
    default:
      return 'the field is empty.';
  }
}

/** A value as the box shows it, a number in `unit` (six significant digits, ASCII minus so it reads back); '' for none. */
export function fieldValueText(value: number | null, unit: Unit | null): string {
  if (value === null || !Number.isFinite(value)) return '';
  const shown = unit === null ? value : fromBaseUnit(value, unit);
  return String(Number(shown.toPrecision(6)));
}
