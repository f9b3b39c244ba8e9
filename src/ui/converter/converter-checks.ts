/**
 * Checks that need more than one field: a value that is fine alone but makes the reading
 * impossible (an offset longer than the delay, a speed no second sound has) is refused with the
 * kernel's own message, and the last good value stays. Pure functions over SI values.
 */
import { CsvInputError } from '../../io/csv-common';
import { convertDelayBatch, type DelayBatch, type DelayBatchSettings } from '../../io/delay-batch';
import { type ChoiceRule, convertDelay, type DelayConversion, PhysicsError } from '../../physics';
import type { ConverterFieldKey } from './converter-fields';

/** SI values of the fields, as the store holds them. */
export type FieldValues = Readonly<Record<ConverterFieldKey, number | null>>;

/** The fields of one delay reading. */
export const READING_FIELDS: readonly ConverterFieldKey[] = ['distance', 'distanceSd', 'delay', 'delaySd', 'offset', 'offsetSd'];

/** Kernel messages start in lower case ("delay 0.1 s is outside …"); a field message starts in upper case. */
export function sentence(message: string): string {
  const text = message.charAt(0).toUpperCase() + message.slice(1);
  return /[.!?)]$/.test(text) ? (text.endsWith(')') ? `${text}.` : text) : `${text}.`;
}

/** The one reading made of the values (nulls read as 0 for the sds and offset). */
export function readingOf(v: FieldValues) {
  return {
    distance_m: v.distance ?? Number.NaN,
    delay_s: v.delay ?? Number.NaN,
    distanceSd_m: v.distanceSd ?? 0,
    delaySd_s: v.delaySd ?? 0,
    offset_s: v.offset ?? 0,
    offsetSd_s: v.offsetSd ?? 0,
  };
}

/** The conversion of one reading, or the kernel's message. */
export function convertReading(v: FieldValues): { ok: true; conversion: DelayConversion } | { ok: false; message: string } {
  try {
    return { ok: true, conversion: convertDelay(readingOf(v)) };
  } catch (error) {
    if (error instanceof PhysicsError) return { ok: false, message: sentence(error.message) };
    throw error;
  }
}

/** What a new value is checked against besides its own range. */
export interface CheckContext {
  /** The single reading on screen: distance, delay and offset must give a speed. */
  reading: boolean;
  /** The batch loaded in batch mode: every row must still convert. */
  batch: DelayBatch | null;
  choice: ChoiceKind;
}

/** Settings of a batch conversion from the fields (SI) and the way of choosing. */
export function batchSettingsOf(v: FieldValues, choice: ChoiceKind): DelayBatchSettings {
  const start = choiceRuleOf(choice, v);
  return {
    ...(v.distance === null ? {} : { distance_m: v.distance }),
    distanceSd_m: v.distanceSd ?? 0,
    delaySd_s: v.delaySd ?? 0,
    offset_s: v.offset ?? 0,
    offsetSd_s: v.offsetSd ?? 0,
    ...(start === null ? {} : { start }),
  };
}

/**
 * Why a new value of `key` cannot be taken with the other values, or null if it can: the single
 * reading on screen must still give a speed (offset < delay, a speed second sound can have), every
 * row of a loaded batch must still convert, and the two ends of the temperature range and of the
 * search window must be in order.
 */
export function crossFieldProblem(key: ConverterFieldKey, next: FieldValues, context: CheckContext): string | null {
  if (context.reading && READING_FIELDS.includes(key)) {
    const result = convertReading(next);
    if (!result.ok) return result.message;
  }
  if (context.batch && READING_FIELDS.includes(key) && key !== 'delay') {
    try {
      convertDelayBatch(context.batch, batchSettingsOf(next, context.choice));
    } catch (error) {
      if (error instanceof CsvInputError) return `With this value the batch cannot be converted: ${error.message}.`;
      throw error;
    }
  }
  if ((key === 'rangeMin' || key === 'rangeMax') && next.rangeMin !== null && next.rangeMax !== null && next.rangeMin > next.rangeMax) {
    return key === 'rangeMin' ? 'Range from must not be above Range to.' : 'Range to must not be below Range from.';
  }
  if ((key === 'searchFrom' || key === 'searchTo') && next.searchFrom !== null && next.searchTo !== null && !(next.searchFrom < next.searchTo)) {
    return key === 'searchFrom' ? 'Search from must be before Search to.' : 'Search to must be after Search from.';
  }
  return null;
}

export type ChoiceKind = 'none' | 'pressure' | 'expected' | 'range';

/** The kernel's choice rule for the chosen kind, or null (no rule, or its value is not given). */
export function choiceRuleOf(kind: ChoiceKind, v: FieldValues): ChoiceRule | null {
  switch (kind) {
    case 'none':
      return null;
    case 'pressure':
      return v.pressure === null ? null : { kind: 'pressure', pressure_Pa: v.pressure };
    case 'expected':
      return v.expected === null ? null : { kind: 'near', temperature_K: v.expected };
    case 'range':
      return v.rangeMin === null || v.rangeMax === null ? null : { kind: 'range', min_K: v.rangeMin, max_K: v.rangeMax };
  }
}
