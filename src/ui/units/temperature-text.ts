/**
 * Temperature units at the UI edge: the kernel works in kelvin only; people type kelvin or
 * millikelvin. Parsing and formatting live here and nowhere else.
 */
import { PROPERTIES_RANGE_K } from '../../physics';

export const MILLIKELVIN_PER_KELVIN = 1000;

const [MIN_K, MAX_K] = PROPERTIES_RANGE_K;

/** Kelvin shown with at least 4 decimals (0.1 mK) and up to 6 (1 µK) when the value needs them. */
export function formatKelvin(T_K: number): string {
  return trimDecimals(T_K.toFixed(6), 4);
}

/** Millikelvin shown with at least 1 decimal and up to 3 (1 µK). */
export function formatMillikelvin(T_K: number): string {
  return trimDecimals((T_K * MILLIKELVIN_PER_KELVIN).toFixed(3), 1);
}

/** A temperature in kelvin as text in the chosen display unit, with the unit: "1.8000 K", "1800.0 mK". */
export function formatTemperature(T_K: number, unit: 'K' | 'mK'): string {
  return unit === 'mK' ? `${formatMillikelvin(T_K)} mK` : `${formatKelvin(T_K)} K`;
}

/** The other unit of the two, for a second reading beside the first. */
export function otherTemperatureUnit(unit: 'K' | 'mK'): 'K' | 'mK' {
  return unit === 'mK' ? 'K' : 'mK';
}

/** Drops trailing zeros after the decimal point, keeping at least `minDecimals`. */
function trimDecimals(fixed: string, minDecimals: number): string {
  const point = fixed.indexOf('.');
  if (point < 0) return fixed;
  let end = fixed.length;
  while (end > point + 1 + minDecimals && fixed[end - 1] === '0') end -= 1;
  return fixed.slice(0, end);
}

/** The valid range in both units, as people read it: "0.3–4.24 K (300–4240 mK)". */
export const TEMPERATURE_RANGE_TEXT = `${MIN_K}–${MAX_K} K (${MIN_K * MILLIKELVIN_PER_KELVIN}–${Math.round(MAX_K * MILLIKELVIN_PER_KELVIN)} mK)`;

export type TemperatureParse = { ok: true; temperature_K: number } | { ok: false; message: string };

// A decimal number (point or comma), optional exponent, optional unit K or mK (any case).
const TEMPERATURE_PATTERN = /^([+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:e[+-]?\d+)?)\s*(mk|k)?$/i;

/**
 * Reads a typed temperature: "1.8", "1.8 K", "1800 mK", "1,8 K". A bare number is kelvin.
 * Returns the temperature in kelvin, or a message that names the field and the valid range.
 */
export function parseTemperature(text: string): TemperatureParse {
  const trimmed = text.trim().replace(/\u2212/g, '-');
  if (trimmed === '') {
    return { ok: false, message: `Temperature is empty: type a value in ${TEMPERATURE_RANGE_TEXT}, e.g. 1.8 K or 1800 mK.` };
  }
  const match = TEMPERATURE_PATTERN.exec(trimmed);
  const numberText = match?.[1];
  if (!match || numberText === undefined) {
    return {
      ok: false,
      message: `Temperature must be a number in K or mK (e.g. 1.8 K or 1800 mK) within ${TEMPERATURE_RANGE_TEXT}.`,
    };
  }
  const amount = Number(numberText.replace(',', '.'));
  const inMillikelvin = match[2]?.toLowerCase() === 'mk';
  const temperature_K = inMillikelvin ? amount / MILLIKELVIN_PER_KELVIN : amount;
  if (!isInRange(temperature_K)) {
    return { ok: false, message: outOfRangeMessage(amount, inMillikelvin, match[2] !== undefined) };
  }
  return { ok: true, temperature_K };
}

/** Checks a temperature already in kelvin (slider, presets) against the same range. */
export function checkTemperature(temperature_K: number): TemperatureParse {
  if (!isInRange(temperature_K)) return { ok: false, message: outOfRangeMessage(temperature_K, false, true) };
  return { ok: true, temperature_K };
}

function isInRange(temperature_K: number): boolean {
  return Number.isFinite(temperature_K) && temperature_K >= MIN_K && temperature_K <= MAX_K;
}

function outOfRangeMessage(amount: number, inMillikelvin: boolean, hadUnit: boolean): string {
  const got = `${amount} ${inMillikelvin ? 'mK' : 'K'}`;
  const base = `Temperature must be ${TEMPERATURE_RANGE_TEXT}; got ${got}.`;
  const asMillikelvin = amount / MILLIKELVIN_PER_KELVIN;
  if (!hadUnit && asMillikelvin >= MIN_K && asMillikelvin <= MAX_K) {
    return `${base} A number without a unit is read as kelvin: did you mean ${amount} mK?`;
  }
  return base;
}
