/**
 * How the planner shows SI values: each kind of quantity has a ladder of display units, and a
 * value is shown in the largest unit that keeps its number at or above 1 ("100 µs", "9.97 mm").
 * Temperatures, lengths, times, pressures and heat fluxes are shown instead in the unit chosen in
 * the header (src/ui/units), as in every view: {@link chosenLadders} swaps their ladders for that
 * one unit. Uncertainties (a timing or distance sd), instrument time constants (rise time, sensor
 * lag) and temperature differences keep the ladder, as they are orders of magnitude smaller than
 * the values they go with, and so do messages and valid ranges ("10 ns–10 s" reads better than
 * "0.00001–10000 ms").
 * Conversion uses src/io/quantity.ts, so what is shown can be typed back unchanged.
 */
import { type Dimension, fromBaseUnit, type Unit } from '../../io/quantity';
import { formatSignificant } from './format-number';
import { type DisplayUnits, shownUnit, type UnitKind } from './unit-choices';

/** A unit as shown (µ and ², which the parser also accepts) and the symbol the parser knows. */
export interface DisplayUnit {
  shown: string;
  unit: Unit;
}

const u = (shown: string, unit: Unit): DisplayUnit => ({ shown, unit });

/** Display ladders, largest unit first. The first entry of each is also the unit for zero unless `zero` says otherwise. */
export const LADDERS = {
  temperature: [u('K', 'K')],
  temperatureDifference: [u('K', 'K'), u('mK', 'mK'), u('µK', 'µK')],
  pressure: [u('Pa', 'Pa')],
  length: [u('m', 'm'), u('mm', 'mm'), u('µm', 'µm')],
  time: [u('s', 's'), u('ms', 'ms'), u('µs', 'µs'), u('ns', 'ns')],
  area: [u('m²', 'm2'), u('cm²', 'cm2'), u('mm²', 'mm2'), u('µm²', 'µm2')],
  frequency: [u('GHz', 'GHz'), u('MHz', 'MHz'), u('kHz', 'kHz'), u('Hz', 'Hz')],
  sampleRate: [u('GS/s', 'GS/s'), u('MS/s', 'MS/s'), u('kS/s', 'kS/s'), u('S/s', 'S/s')],
  voltage: [u('V', 'V'), u('mV', 'mV'), u('µV', 'µV'), u('nV', 'nV')],
  responsivity: [u('V/K', 'V/K'), u('mV/K', 'mV/K'), u('µV/K', 'µV/K')],
  power: [u('W', 'W'), u('mW', 'mW'), u('µW', 'µW')],
  heatFlux: [u('W/cm²', 'W/cm2'), u('mW/cm²', 'mW/cm2')],
  speed: [u('m/s', 'm/s')],
} as const satisfies Record<string, readonly DisplayUnit[]>;

export type Ladder = readonly DisplayUnit[];

/** A kind of quantity the planner edits: what the parser reads, how it is shown, an example. */
export interface QuantityKind {
  dimension: Dimension;
  ladder: Ladder;
  /** Unit for a value of zero (default: the smallest of the ladder). */
  zero?: DisplayUnit;
  /** Typed example for messages, e.g. "100 us". */
  example: string;
  /** The header's unit kind this quantity is shown in, when it follows the chosen display unit. */
  follows?: UnitKind;
}

export const KINDS = {
  temperature: { dimension: 'temperature', ladder: LADDERS.temperature, example: '1.8 K or 1800 mK', follows: 'temperature' },
  temperatureDifference: { dimension: 'temperature difference', ladder: LADDERS.temperatureDifference, zero: LADDERS.temperatureDifference[1], example: '1 mK or 50 uK' },
  pressure: { dimension: 'pressure', ladder: LADDERS.pressure, example: '1638 Pa or 16.4 mbar', follows: 'pressure' },
  length: { dimension: 'length', ladder: LADDERS.length, zero: LADDERS.length[1], example: '50 mm', follows: 'length' },
  /** An uncertainty of a length: shown on the ladder, not in the chosen unit. */
  lengthSd: { dimension: 'length', ladder: LADDERS.length, zero: LADDERS.length[1], example: '0.1 mm' },
  time: { dimension: 'time', ladder: LADDERS.time, zero: LADDERS.time[2], example: '100 us', follows: 'time' },
  /** An instrument's time constant (rise time, sensor lag): on the ladder, like an uncertainty. */
  timeConstant: { dimension: 'time', ladder: LADDERS.time, zero: LADDERS.time[2], example: '1 us' },
  area: { dimension: 'area', ladder: LADDERS.area, zero: LADDERS.area[2], example: '1 cm2 or 2 mm2' },
  frequency: { dimension: 'frequency', ladder: LADDERS.frequency, example: '5 Hz' },
  sampleRate: { dimension: 'frequency', ladder: LADDERS.sampleRate, example: '10 MS/s' },
  voltage: { dimension: 'voltage', ladder: LADDERS.voltage, example: '1 uV' },
  responsivity: { dimension: 'responsivity', ladder: LADDERS.responsivity, example: '2 V/K' },
  power: { dimension: 'power', ladder: LADDERS.power, example: '100 mW' },
  heatFlux: { dimension: 'heat flux', ladder: LADDERS.heatFlux, example: '0.1 W/cm2', follows: 'heatFlux' },
  speed: { dimension: 'speed', ladder: LADDERS.speed, example: '20 m/s' },
} as const satisfies Record<string, QuantityKind>;

/** A one-unit ladder: the chosen display unit of a kind. */
function onlyUnit(unit: string): Ladder {
  return [{ shown: shownUnit(unit), unit: unit as Unit }];
}

/** The ladders with the header's chosen units in place of those that follow them (see the top of this file). */
export type ShownLadders = { readonly [K in keyof typeof LADDERS]: Ladder };

/** {@link LADDERS} with temperature, pressure, length, time and heat flux each in the one unit chosen. */
export function chosenLadders(units: DisplayUnits): ShownLadders {
  return {
    ...LADDERS,
    temperature: onlyUnit(units.temperature),
    pressure: onlyUnit(units.pressure),
    length: onlyUnit(units.length),
    time: onlyUnit(units.time),
    heatFlux: onlyUnit(units.heatFlux),
  };
}

/** The ladder and zero unit a field of `kind` is shown with: its chosen unit when it follows one. */
export function shownLadder(kind: QuantityKind, units: DisplayUnits | undefined): { ladder: Ladder; zero?: DisplayUnit } {
  if (kind.follows && units) {
    const ladder = onlyUnit(units[kind.follows]);
    return { ladder, zero: ladder[0] };
  }
  return { ladder: kind.ladder, zero: kind.zero };
}

/**
 * An absolute temperature to a fixed resolution in its unit: 0.1 mK shows as "1.8000 K" or
 * "1800.0 mK" (bath temperatures are set and read to about that).
 */
export function temperatureText(value_K: number, ladder: Ladder, resolution_K = 1e-4): string {
  const unit = ladder[0] as DisplayUnit;
  const step = fromBaseUnit(resolution_K, unit.unit);
  const decimals = Math.max(0, Math.ceil(-Math.log10(step) - 1e-9));
  return `${fromBaseUnit(value_K, unit.unit).toFixed(decimals)} ${unit.shown}`;
}

/** The unit of `ladder` that shows `value` (SI) with a number of at least 1, or the smallest unit. */
export function unitFor(value: number, ladder: Ladder, zero?: DisplayUnit): DisplayUnit {
  const last = ladder[ladder.length - 1] as DisplayUnit;
  if (value === 0 || !Number.isFinite(value)) return zero ?? last;
  const magnitude = Math.abs(value) * (1 + 1e-12);
  return ladder.find((d) => fromBaseUnit(magnitude, d.unit) >= 1) ?? last;
}

/** Up to six significant digits, no trailing zeros, ASCII minus (so the text parses again). */
export function plainNumber(x: number, digits = 6): string {
  if (!Number.isFinite(x)) return '';
  return String(Number(x.toPrecision(digits)));
}

/** A value as text for an input field: "100 µs", "9.97 mm", "1 cm²". */
export function inputText(value: number, ladder: Ladder, zero?: DisplayUnit): string {
  const unit = unitFor(value, ladder, zero);
  return `${plainNumber(fromBaseUnit(value, unit.unit))} ${unit.shown}`;
}

/** A value for reading (tables, messages): four significant digits, true minus, "× 10ⁿ" when extreme. */
export function readText(value: number, ladder: Ladder, digits = 4, zero?: DisplayUnit): string {
  const unit = unitFor(value, ladder, zero);
  return `${formatSignificant(fromBaseUnit(value, unit.unit), digits)} ${unit.shown}`;
}

/** One unit that suits a whole column of values (the largest value decides). */
export function unitForColumn(values: readonly (number | null)[], ladder: Ladder): DisplayUnit {
  const finite = values.filter((v): v is number => v !== null && Number.isFinite(v) && v !== 0).map(Math.abs);
  return unitFor(finite.length > 0 ? Math.max(...finite) : 0, ladder);
}

/** A value in a given display unit, as a number (for tables and chart axes). */
export function inUnit(value: number, unit: DisplayUnit): number {
  return fromBaseUnit(value, unit.unit);
}

/** A value with its unit for a message: "10 ns", "0 mm", "−100 m" (up to six digits). */
export function messageText(value: number, ladder: Ladder, zero?: DisplayUnit): string {
  const unit = unitFor(value, ladder, zero);
  const inUnit = fromBaseUnit(value, unit.unit);
  // Far below the smallest unit on the ladder: the number in the SI unit ("1e-15 V", "0.0001 Hz").
  const base = ladder.find((d) => fromBaseUnit(1, d.unit) === 1) ?? (ladder[0] as DisplayUnit);
  const [number, shown] = value !== 0 && Math.abs(inUnit) < 1e-3 ? [plainNumber(value), base.shown] : [plainNumber(inUnit), unit.shown];
  return `${number.replace(/^-/, '\u2212')} ${shown}`;
}

/** "10 ns–10 s", "0–10 mm", "from −100 m to 100 m": a closed range in readable units. */
export function rangeText(min: number, max: number, ladder: Ladder, zero?: DisplayUnit): string {
  const b = messageText(max, ladder, zero);
  // A range from zero reads best in the unit of its top: "0–20 ms".
  const a = min === 0 && max > 0 ? `0 ${splitUnit(b)[1]}` : messageText(min, ladder, zero);
  if (min < 0) return `from ${a} to ${b}`;
  const [aNumber, aUnit] = splitUnit(a);
  const [bNumber, bUnit] = splitUnit(b);
  return aUnit === bUnit ? `${aNumber}–${bNumber} ${bUnit}` : `${a}–${b}`;
}

function splitUnit(text: string): [string, string] {
  const space = text.indexOf(' ');
  return [text.slice(0, space), text.slice(space + 1)];
}
