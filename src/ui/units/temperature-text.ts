/**
 * Temperatures as text at the UI edge: the kernel works in kelvin only; people read kelvin or
 * millikelvin. Typed temperatures are read by the one quantity field (src/ui/fields).
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

/** Checks a temperature already in kelvin (slider, presets) against the same range. */
export function checkTemperature(temperature_K: number): TemperatureParse {
  if (!isInRange(temperature_K)) return { ok: false, message: outOfRangeMessage(temperature_K) };
  return { ok: true, temperature_K };
}

function isInRange(temperature_K: number): boolean {
  return Number.isFinite(temperature_K) && temperature_K >= MIN_K && temperature_K <= MAX_K;
}

function outOfRangeMessage(temperature_K: number): string {
  return `Temperature must be ${TEMPERATURE_RANGE_TEXT}; got ${temperature_K} K.`;
}
