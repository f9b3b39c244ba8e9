/**
 * The converter's typed fields: what each one is, its units and its valid range (SI), and how a
 * typed text becomes a value or a message that names the field and the range. Units exist only
 * here and in src/io/quantity.ts; the store and the kernel see SI values.
 */
import { type Dimension, fromBaseUnit, parseQuantity, QuantityParseError, toBaseUnit, type Unit } from '../../io/quantity';
import { TRACE_SEARCH_RANGE_S } from '../../io/trace-pick';
import { DELAY_LIMITS, PICKER_LIMITS, PROPERTIES_RANGE_K, VAPOUR_PRESSURE_RANGE_PA } from '../../physics';
import { plain } from '../units/format-number';
import type { DisplayUnits, UnitKind } from '../units/unit-choices';

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

/** A plain number (noise sd, fraction of the peak): no unit. */
type FieldDimension = Dimension | 'number';

export interface FieldSpec {
  key: ConverterFieldKey;
  /** Label on the page and first word of its messages. */
  label: string;
  dimension: FieldDimension;
  /** Units offered beside the field, the default first; empty for a plain number. */
  units: readonly Unit[];
  /** Valid range, SI. */
  range: readonly [number, number];
  /** Value when the converter opens (SI); null: empty (optional fields only). */
  initial: number | null;
  /** An empty field is allowed and means "not given" (default behaviour). */
  optional?: boolean;
  /** What the empty field means, e.g. "from time zero". */
  emptyMeaning?: string;
  /**
   * Usually orders of magnitude smaller than the values of its kind (an uncertainty, the
   * instrument offset t₀): its unit follows the header's only where that is finer (see {@link followedUnit}).
   */
  fine?: boolean;
}

const TIME_UNITS: readonly Unit[] = ['ms', 'µs', 's', 'ns'];

/** Every field, by key. Ranges are the kernel's own where it has them. */
export const FIELD_SPECS: Readonly<Record<ConverterFieldKey, FieldSpec>> = {
  distance: { key: 'distance', label: 'Distance', dimension: 'length', units: ['mm', 'cm', 'm', 'µm'], range: DELAY_LIMITS.distance_m, initial: 0.05 },
  distanceSd: { key: 'distanceSd', label: 'Distance sd', dimension: 'length', units: ['mm', 'µm', 'cm', 'm'], range: DELAY_LIMITS.distanceSd_m, initial: 1e-4, fine: true },
  delay: { key: 'delay', label: 'Delay', dimension: 'time', units: TIME_UNITS, range: DELAY_LIMITS.delay_s, initial: 2.5e-3 },
  delaySd: { key: 'delaySd', label: 'Delay sd', dimension: 'time', units: ['µs', 'ms', 'ns', 's'], range: DELAY_LIMITS.delaySd_s, initial: 2e-6, fine: true },
  offset: { key: 'offset', label: 'Offset t₀', dimension: 'time', units: ['µs', 'ms', 'ns', 's'], range: DELAY_LIMITS.offset_s, initial: 0, fine: true },
  offsetSd: { key: 'offsetSd', label: 'Offset sd', dimension: 'time', units: ['µs', 'ms', 'ns', 's'], range: DELAY_LIMITS.offsetSd_s, initial: 0, fine: true },
  pressure: { key: 'pressure', label: 'Vapour pressure', dimension: 'pressure', units: ['Pa', 'kPa', 'mbar', 'torr'], range: VAPOUR_PRESSURE_RANGE_PA, initial: null, optional: true, emptyMeaning: 'no reading' },
  expected: { key: 'expected', label: 'Expected temperature', dimension: 'temperature', units: ['K', 'mK'], range: PROPERTIES_RANGE_K, initial: 1.8 },
  rangeMin: { key: 'rangeMin', label: 'Range from', dimension: 'temperature', units: ['K', 'mK'], range: [0, PROPERTIES_RANGE_K[1]], initial: 1.7 },
  rangeMax: { key: 'rangeMax', label: 'Range to', dimension: 'temperature', units: ['K', 'mK'], range: [0, PROPERTIES_RANGE_K[1]], initial: 2.1 },
  threshold: { key: 'threshold', label: 'Threshold', dimension: 'number', units: [], range: PICKER_LIMITS.thresholdSigma, initial: 5 },
  fraction: { key: 'fraction', label: 'Fraction of the peak', dimension: 'number', units: [], range: PICKER_LIMITS.fraction, initial: 0.5 },
  searchFrom: { key: 'searchFrom', label: 'Search from', dimension: 'time', units: TIME_UNITS, range: TRACE_SEARCH_RANGE_S, initial: null, optional: true, emptyMeaning: 'time zero' },
  searchTo: { key: 'searchTo', label: 'Search to', dimension: 'time', units: TIME_UNITS, range: TRACE_SEARCH_RANGE_S, initial: null, optional: true, emptyMeaning: 'the end of the record' },
};

/** The header's kind of unit for a field's dimension; null for a plain number. */
export function unitKindOf(spec: FieldSpec): UnitKind | null {
  switch (spec.dimension) {
    case 'temperature':
    case 'length':
    case 'time':
    case 'pressure':
      return spec.dimension;
    default:
      return null;
  }
}

/**
 * The unit a field shows while it follows the header's display units (until someone picks a unit
 * in the field's own menu). A value field takes the header's unit of its kind. An sd, or the
 * instrument offset t₀, is usually orders of magnitude smaller than the values of its kind, so such
 * a field keeps its own finer default (µs for a delay sd or the offset, mm for a distance sd) and
 * takes the header's unit only where that is finer still; a bare number typed into it keeps meaning
 * that unit whatever the header says.
 * A plain number has no unit ('').
 */
export function followedUnit(spec: FieldSpec, units: DisplayUnits): Unit | '' {
  const kind = unitKindOf(spec);
  const own = spec.units[0] ?? '';
  if (kind === null || own === '') return own;
  const header: Unit = units[kind];
  if (!spec.fine) return header;
  return toBaseUnit(1, header) < toBaseUnit(1, own) ? header : own;
}

/** Result of reading a field's text: the SI value (null for an empty optional field) or why not. */
export type FieldRead = { ok: true; value: number | null } | { ok: false; message: string };

const MINUS = /\u2212/g;
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Reads a field's text. A bare number is in `unit`; a number with a unit of the field's kind
 * ("2.5 ms") uses that unit. Out-of-range values give a message naming the field and the range.
 */
export function readField(spec: FieldSpec, text: string, unit: Unit | ''): FieldRead {
  const trimmed = text.replace(MINUS, '-').trim();
  if (trimmed === '') {
    if (spec.optional) return { ok: true, value: null };
    return { ok: false, message: `${spec.label} is empty: type a value in ${rangeText(spec, unit)}.` };
  }
  let value: number;
  if (spec.dimension === 'number') {
    value = DECIMAL.test(trimmed) ? Number(trimmed) : Number.NaN;
    if (!Number.isFinite(value)) return { ok: false, message: `${spec.label} must be a number in ${rangeText(spec, unit)}; got "${text.trim()}".` };
  } else {
    const bare = DECIMAL.test(trimmed);
    try {
      value = parseQuantity(bare && unit !== '' ? `${trimmed} ${unit}` : trimmed, spec.dimension);
    } catch (error) {
      if (error instanceof QuantityParseError) {
        return { ok: false, message: `${spec.label}: ${error.detail}; accepted units: ${error.acceptedUnits.join(', ')}. Valid range ${rangeText(spec, unit)}.` };
      }
      throw error;
    }
  }
  const [min, max] = spec.range;
  if (value < min || value > max) {
    const shown = spec.dimension === 'number' || unit === '' ? plain(value) : `${plain(fromBaseUnit(value, unit))} ${unit}`;
    return { ok: false, message: `${spec.label} ${shown} is outside the valid range ${rangeText(spec, unit)}.` };
  }
  return { ok: true, value };
}

/** The field's range as people read it, in units that suit each end: "1 ns – 10000 s". */
export function rangeText(spec: FieldSpec, unit: Unit | ''): string {
  const [min, max] = spec.range;
  if (spec.dimension === 'number') return `${plain(min)}–${plain(max)}${spec.key === 'threshold' ? ' noise sd' : ''}`;
  const lo = inSuitableUnit(min, spec, unit);
  const hi = inSuitableUnit(max, spec, unit);
  return `${lo} – ${hi}`;
}

/** A value in the first of the field's units where it reads as ≥ 1 (else the smallest), e.g. "1 ns". */
function inSuitableUnit(value: number, spec: FieldSpec, preferred: Unit | ''): string {
  if (value === 0) return `0 ${preferred || spec.units[0] || ''}`.trim();
  const units = [...spec.units].map((u) => ({ u, x: fromBaseUnit(value, u) })).sort((a, b) => Math.abs(a.x) - Math.abs(b.x));
  const fit = units.find((c) => Math.abs(c.x) >= 1) ?? units[units.length - 1];
  return fit ? `${plain(fit.x)} ${fit.u}` : plain(value);
}


/** The text a field shows for an SI value in `unit` (empty for null). */
export function fieldText(spec: FieldSpec, value: number | null, unit: Unit | ''): string {
  if (value === null) return '';
  if (spec.dimension === 'number' || unit === '') return String(Number(value.toPrecision(10)));
  return String(Number(fromBaseUnit(value, unit).toPrecision(10)));
}
