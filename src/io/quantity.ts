/**
 * Quantities typed by people: "1.8K", "1800 mK", "1.6e3Pa", "50mm", "2.5 ms", "1W/cm2", "20mW",
 * "1 cm2", "10 MS/s", "1 uV", "2 V/K", "50 µK", "20 m/s". Parsing turns text into a number in the SI
 * base unit (K, Pa, m, s, W/m2, W, m2, Hz, V, V/K, m/s); every other unit exists only here, at the
 * edge, through {@link toBaseUnit} and {@link fromBaseUnit}. Used by the command line and the page.
 */

/** The kinds of quantity a user can type. */
export type Dimension =
  | 'temperature'
  | 'pressure'
  | 'length'
  | 'time'
  | 'heat flux'
  | 'power'
  | 'temperature difference'
  | 'area'
  | 'frequency'
  | 'voltage'
  | 'responsivity'
  | 'speed';

/**
 * One unit: its value in the base unit is 10^pow10 · numerator / denominator, all exact.
 * Decimal prefixes use pow10 alone, so "1800 mK" parses to exactly the same double as "1.8".
 */
interface UnitDefinition {
  readonly pow10: number;
  readonly numerator: number;
  readonly denominator: number;
}

const decimal = (pow10: number): UnitDefinition => ({ pow10, numerator: 1, denominator: 1 });
const ratio = (numerator: number, denominator: number): UnitDefinition => ({ pow10: 0, numerator, denominator });

/** Standard atmosphere, Pa (CGPM 1954, exact). */
export const STANDARD_ATMOSPHERE_PA = 101_325;
/** Torr per standard atmosphere (definition of the torr, exact). */
export const TORR_PER_ATMOSPHERE = 760;

/** Unit symbols of each dimension, mapped to their exact size in the base unit (listed first). */
const UNIT_TABLE = {
  temperature: { K: decimal(0), mK: decimal(-3) },
  pressure: {
    Pa: decimal(0),
    kPa: decimal(3),
    mbar: decimal(2),
    bar: decimal(5),
    torr: ratio(STANDARD_ATMOSPHERE_PA, TORR_PER_ATMOSPHERE),
    atm: ratio(STANDARD_ATMOSPHERE_PA, 1),
  },
  length: { m: decimal(0), cm: decimal(-2), mm: decimal(-3), um: decimal(-6), 'µm': decimal(-6) },
  time: { s: decimal(0), ms: decimal(-3), us: decimal(-6), 'µs': decimal(-6), ns: decimal(-9) },
  // 1 cm² = 1e-4 m², 1 mm² = 1e-6 m² (SI prefixes, exact): 1 W/cm² = 1e4 W/m², 1 W/mm² = 1e6 W/m².
  'heat flux': { 'W/m2': decimal(0), 'W/cm2': decimal(4), 'mW/cm2': decimal(1), 'W/mm2': decimal(6) },
  power: { W: decimal(0), mW: decimal(-3), uW: decimal(-6), 'µW': decimal(-6) },
  // A spread or step of temperature (an uncertainty, a pulse height): it may be tiny, so µK too.
  'temperature difference': { K: decimal(0), mK: decimal(-3), uK: decimal(-6), 'µK': decimal(-6) },
  // Squared SI prefixes (exact): 1 cm² = 1e-4 m², 1 mm² = 1e-6 m², 1 µm² = 1e-12 m².
  area: { m2: decimal(0), cm2: decimal(-4), mm2: decimal(-6), um2: decimal(-12), 'µm2': decimal(-12) },
  // A sample rate in samples per second is a frequency: 1 S/s = 1 Hz.
  frequency: {
    Hz: decimal(0),
    kHz: decimal(3),
    MHz: decimal(6),
    GHz: decimal(9),
    'S/s': decimal(0),
    'kS/s': decimal(3),
    'MS/s': decimal(6),
    'GS/s': decimal(9),
  },
  voltage: { V: decimal(0), mV: decimal(-3), uV: decimal(-6), 'µV': decimal(-6), nV: decimal(-9) },
  responsivity: { 'V/K': decimal(0), 'mV/K': decimal(-3), 'uV/K': decimal(-6), 'µV/K': decimal(-6), 'V/mK': decimal(3) },
  // A speed (second sound, an effective pulse speed): SI prefixes on the metre, exact.
  speed: { 'm/s': decimal(0), 'cm/s': decimal(-2), 'mm/s': decimal(-3) },
} as const satisfies Record<Dimension, Record<string, UnitDefinition>>;

/** Unit symbols accepted for a dimension, e.g. `UnitOf<'temperature'>` is `'K' | 'mK'`. */
export type UnitOf<D extends Dimension> = D extends Dimension ? keyof (typeof UNIT_TABLE)[D] & string : never;
/** Any unit symbol this module knows. */
export type Unit = UnitOf<Dimension>;

/** SI base unit of each dimension: what parsing returns and what a bare number means. */
export const BASE_UNIT = {
  temperature: 'K',
  pressure: 'Pa',
  length: 'm',
  time: 's',
  'heat flux': 'W/m2',
  power: 'W',
  'temperature difference': 'K',
  area: 'm2',
  frequency: 'Hz',
  voltage: 'V',
  responsivity: 'V/K',
  speed: 'm/s',
} as const satisfies { [D in Dimension]: UnitOf<D> };

/** Every dimension, in the order help text lists them. */
export const DIMENSIONS: readonly Dimension[] = Object.keys(UNIT_TABLE) as Dimension[];

/**
 * Other spellings people type, mapped to the canonical symbol. The Greek mu (U+03BC) and the
 * micro sign (U+00B5) look alike, so both are taken; so is the superscript two (U+00B2) in areas.
 */
const UNIT_ALIASES: Readonly<Record<string, string>> = {
  Torr: 'torr',
  'μm': 'µm',
  'μs': 'µs',
  'μW': 'µW',
  'W/m²': 'W/m2',
  'W/cm²': 'W/cm2',
  'mW/cm²': 'mW/cm2',
  'W/mm²': 'W/mm2',
  'μK': 'µK',
  'μV': 'µV',
  'μV/K': 'µV/K',
  'm²': 'm2',
  'cm²': 'cm2',
  'mm²': 'mm2',
  'µm²': 'µm2',
  'μm²': 'µm2',
  'um²': 'um2',
  'μm2': 'µm2',
};

/** What was wrong with a typed quantity. */
export type QuantityProblem = 'empty' | 'not-a-number' | 'non-finite' | 'unknown-unit';

/**
 * A quantity that could not be read. The message names the quantity, what was wrong and the
 * accepted units; the fields let a caller (CLI flag, form field) say the same in its own words.
 */
export class QuantityParseError extends Error {
  override name = 'QuantityParseError';
  constructor(
    readonly dimension: Dimension,
    readonly input: string,
    readonly problem: QuantityProblem,
    /** Human description of the problem, without the quantity's name. */
    readonly detail: string,
    readonly acceptedUnits: readonly string[],
  ) {
    super(`${dimension} ${detail}; accepted units: ${acceptedUnits.join(', ')}`);
  }
}

/** Unit symbols accepted for `dimension`, base unit first. */
export function unitsOf<D extends Dimension>(dimension: D): readonly UnitOf<D>[] {
  return Object.keys(UNIT_TABLE[dimension]) as UnitOf<D>[];
}

function definitionOf(dimension: Dimension, unit: string): UnitDefinition | undefined {
  const table: Readonly<Record<string, UnitDefinition>> = UNIT_TABLE[dimension];
  return Object.hasOwn(table, unit) ? table[unit] : undefined;
}

function requireDefinition(dimension: Dimension, unit: string): UnitDefinition {
  const definition = definitionOf(dimension, unit);
  if (!definition) throw new RangeError(`"${unit}" is not a unit of ${dimension}`);
  return definition;
}

function dimensionOf(unit: Unit): Dimension {
  for (const dimension of Object.keys(UNIT_TABLE) as Dimension[]) {
    if (definitionOf(dimension, unit)) return dimension;
  }
  throw new RangeError(`unknown unit "${unit}"`);
}

/**
 * Converts a value in `unit` to the SI base unit of its dimension (K, Pa, m, s, W/m², W, m², Hz, V, V/K).
 * Exact factors: 1 atm = 101325 Pa, 1 torr = 101325/760 Pa, 1 bar = 1e5 Pa, 1 mbar = 100 Pa.
 * Throws RangeError for a symbol this module does not know (a programming error).
 */
export function toBaseUnit(value: number, unit: Unit): number {
  const u = requireDefinition(dimensionOf(unit), unit);
  return scaleByPow10((value * u.numerator) / u.denominator, u.pow10);
}

/**
 * Converts a value in the SI base unit (K, Pa, m, s, W/m², W, m², Hz, V, V/K) to `unit` of the same
 * dimension, for display.
 * Throws RangeError for a symbol this module does not know (a programming error).
 */
export function fromBaseUnit(value: number, unit: Unit): number {
  const u = requireDefinition(dimensionOf(unit), unit);
  return (scaleByPow10(value, -u.pow10) * u.denominator) / u.numerator;
}

/** x · 10^k with one correctly rounded operation (10^|k| is an exact double for |k| ≤ 22). */
function scaleByPow10(x: number, k: number): number {
  return k >= 0 ? x * 10 ** k : x / 10 ** -k;
}

// A decimal number: optional sign, digits with an optional point, optional exponent.
const NUMBER_PATTERN = /^([+-]?)(\d+(?:\.\d*)?|\.\d+)(?:[eE]([+-]?\d+))?\s*(.*)$/s;
// Spellings of NaN and infinity that people (and scripts) produce.
const NON_FINITE_PATTERN = /^[+-]?(?:nan|inf|infinity)\s*\S*$/i;

/**
 * Reads a quantity such as "1.8K", "1.8 K", "1800mK" or "1.6e3Pa" and returns it in the SI base
 * unit of `dimension` (K, Pa, m, s, W/m², W, m², Hz, V or V/K). A bare number is taken in that base
 * unit. Units are case-sensitive (mK is not MK), except "Torr" = "torr"; µ may be written u, µ or μ.
 * Does not check physical ranges (callers do). Throws {@link QuantityParseError}.
 */
export function parseQuantity(text: string, dimension: Dimension): number {
  const input = text.trim();
  const fail = (problem: QuantityProblem, detail: string): QuantityParseError =>
    new QuantityParseError(dimension, text, problem, detail, unitsOf(dimension));
  if (input === '') throw fail('empty', `is empty: give a number with a unit, e.g. ${exampleOf(dimension)}`);
  if (NON_FINITE_PATTERN.test(input)) throw fail('non-finite', `must be a finite number, got "${text}"`);
  const match = NUMBER_PATTERN.exec(input);
  if (!match) throw fail('not-a-number', `"${text}" does not start with a number`);
  const [, sign = '', digits = '', exponent = '0', unitText = ''] = match;
  const unit = unitText === '' ? BASE_UNIT[dimension] : (UNIT_ALIASES[unitText] ?? unitText);
  const definition = definitionOf(dimension, unit);
  if (!definition) throw fail('unknown-unit', `"${text}" has unknown unit "${unitText}"`);
  // Shift the decimal exponent in the text itself, so the only rounding is the final parse.
  const inBase = Number(`${sign}${digits}e${Number(exponent) + definition.pow10}`);
  const value = (inBase * definition.numerator) / definition.denominator;
  if (!Number.isFinite(value)) throw fail('non-finite', `"${text}" is too large to be a finite number`);
  return value;
}

/** Reads a temperature ("1.8K", "1800 mK", "1.8" = K) and returns kelvin. See {@link parseQuantity}. */
export function parseTemperature_K(text: string): number {
  return parseQuantity(text, 'temperature');
}

/** Reads a pressure ("1638Pa", "16.4 mbar", "1atm", bare number = Pa) and returns pascal. */
export function parsePressure_Pa(text: string): number {
  return parseQuantity(text, 'pressure');
}

/** Reads a length ("50mm", "5 cm", "120um", bare number = m) and returns metres. */
export function parseLength_m(text: string): number {
  return parseQuantity(text, 'length');
}

/** Reads a time ("2.5ms", "400 us", "80ns", bare number = s) and returns seconds. */
export function parseTime_s(text: string): number {
  return parseQuantity(text, 'time');
}

/** Reads a heat flux ("1W/cm2", "1 W/cm²", "100mW/cm2", bare number = W/m²) and returns W/m². */
export function parseHeatFlux_W_m2(text: string): number {
  return parseQuantity(text, 'heat flux');
}

/** Reads a power ("2W", "20 mW", "500uW", bare number = W) and returns watts. */
export function parsePower_W(text: string): number {
  return parseQuantity(text, 'power');
}

const EXAMPLES: Readonly<Record<Dimension, string>> = {
  temperature: '1.8K',
  pressure: '1638Pa',
  length: '50mm',
  time: '2.5ms',
  'heat flux': '1W/cm2',
  power: '20mW',
  'temperature difference': '50uK',
  area: '1cm2',
  frequency: '10MHz',
  voltage: '1uV',
  responsivity: '2V/K',
  speed: '20m/s',
};

/** A short typed example of `dimension`, for help and error text. */
export function exampleOf(dimension: Dimension): string {
  return EXAMPLES[dimension];
}
