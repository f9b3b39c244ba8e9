/**
 * The converter's typed fields: each a FieldSpec (src/ui/fields) with its key and the value the
 * converter opens with. Ranges are the kernel's own where it has them; units exist only in the
 * specs and src/io/quantity.ts, the store and the kernel see SI values.
 */
import type { Unit } from '../../io/quantity';
import { DELAY_LIMITS, PROPERTIES_RANGE_K, VAPOUR_PRESSURE_RANGE_PA } from '../../physics';
import type { FieldSpec } from '../fields/field-spec';
import { PICKER_FIELD_SPECS } from '../fields/picker-specs';
import { KINDS } from '../units/ladders';

export type ConverterFieldKey =
  | 'distance'
  | 'distanceSd'
  | 'delay'
  | 'delaySd'
  | 'offset'
  | 'offsetSd'
  | 'pressure'
  | 'expected'
  | 'rangeMin'
  | 'rangeMax'
  | 'threshold'
  | 'fraction'
  | 'searchFrom'
  | 'searchTo';

/** A converter field: its FieldSpec, its key, and its value when the converter opens. */
export interface ConverterFieldSpec extends FieldSpec {
  key: ConverterFieldKey;
  /** Value when the converter opens (SI); null: empty (fields with `blank` only). */
  initial: number | null;
}

/** Prefix of the converter's field keys in the fields slice. */
export const CONVERTER_FIELD_PREFIX = 'converter.';

/** Key of a converter field in the fields slice (drafts, messages, a unit picked in its menu). */
export function converterFieldKey(key: ConverterFieldKey): string {
  return `${CONVERTER_FIELD_PREFIX}${key}`;
}

const TIME_UNITS: readonly Unit[] = ['ms', 'µs', 's', 'ns'];
const SMALL_TIME_UNITS: readonly Unit[] = ['µs', 'ms', 'ns', 's'];
const TEMPERATURE_UNITS: readonly Unit[] = ['K', 'mK'];

/** Every field, by key. An sd and the offset t₀ are shown on their ladder (µs), not in the header's unit. */
export const FIELD_SPECS: Readonly<Record<ConverterFieldKey, ConverterFieldSpec>> = {
  distance: { key: 'distance', label: 'Distance', kind: KINDS.length, units: ['mm', 'cm', 'm', 'µm'], range: DELAY_LIMITS.distance_m, initial: 0.05 },
  distanceSd: { key: 'distanceSd', label: 'Distance sd', kind: KINDS.lengthSd, role: 'sd', units: ['mm', 'µm', 'cm', 'm'], range: DELAY_LIMITS.distanceSd_m, initial: 1e-4 },
  delay: { key: 'delay', label: 'Delay', kind: KINDS.time, units: TIME_UNITS, range: DELAY_LIMITS.delay_s, initial: 2.5e-3 },
  delaySd: { key: 'delaySd', label: 'Delay sd', kind: KINDS.timeConstant, role: 'sd', units: SMALL_TIME_UNITS, range: DELAY_LIMITS.delaySd_s, initial: 2e-6 },
  offset: { key: 'offset', label: 'Offset t₀', kind: KINDS.timeConstant, units: SMALL_TIME_UNITS, range: DELAY_LIMITS.offset_s, initial: 0 },
  offsetSd: { key: 'offsetSd', label: 'Offset sd', kind: KINDS.timeConstant, role: 'sd', units: SMALL_TIME_UNITS, range: DELAY_LIMITS.offsetSd_s, initial: 0 },
  pressure: { key: 'pressure', label: 'Vapour pressure', kind: KINDS.pressure, units: ['Pa', 'kPa', 'mbar', 'torr'], range: VAPOUR_PRESSURE_RANGE_PA, initial: null, blank: 'no reading' },
  expected: { key: 'expected', label: 'Expected temperature', kind: KINDS.temperature, units: TEMPERATURE_UNITS, range: PROPERTIES_RANGE_K, initial: 1.8 },
  rangeMin: { key: 'rangeMin', label: 'Range from', kind: KINDS.temperature, units: TEMPERATURE_UNITS, range: [0, PROPERTIES_RANGE_K[1]], initial: 1.7 },
  rangeMax: { key: 'rangeMax', label: 'Range to', kind: KINDS.temperature, units: TEMPERATURE_UNITS, range: [0, PROPERTIES_RANGE_K[1]], initial: 2.1 },
  threshold: { key: 'threshold', ...PICKER_FIELD_SPECS.threshold },
  fraction: { key: 'fraction', ...PICKER_FIELD_SPECS.fraction },
  searchFrom: { key: 'searchFrom', ...PICKER_FIELD_SPECS.searchFrom },
  searchTo: { key: 'searchTo', ...PICKER_FIELD_SPECS.searchTo },
};

export const CONVERTER_FIELD_KEYS = Object.keys(FIELD_SPECS) as ConverterFieldKey[];

/** The values the converter opens with, SI. */
export function initialConverterValues(): Record<ConverterFieldKey, number | null> {
  const values = {} as Record<ConverterFieldKey, number | null>;
  for (const key of CONVERTER_FIELD_KEYS) values[key] = FIELD_SPECS[key].initial;
  return values;
}
