/*
 * A measured or derived value with its standard deviation, shown with as many digits as the sd
 * supports: the sd to one or two significant digits, the value to the same decimal place.
 *
 * How many digits the sd keeps (a common convention, no source): look at its three leading digits.
 * 100–354: two digits (0.0123 → 0.012, a second digit still means something when the first is 1–3);
 * 355–949: one digit (0.0498 → 0.05); 950–999: it rounds up to 1000, shown as two digits of the next
 * power (0.0973 → 0.10).
 */
import { DISPLAY_SIGNIFICANT_DIGITS, formatSignificant, superscript, withMinus } from './format-number';

/** Beyond these the numbers share a power of ten: "(1.156 ± 0.021) × 10⁻⁵". */
const FIXED_BELOW = 1e6;
const MOST_DECIMALS = 6;

export interface MeasuredText {
  /** The value, rounded to the sd's last digit (or to `digits` significant digits without an sd). */
  value: string;
  /** The sd alone ("0.05"), or null when there is none. */
  sd: string | null;
  /** Both: "19.90 ± 0.05", "(1.156 ± 0.021) × 10⁻⁵", or the value alone. */
  text: string;
}

/**
 * Power of ten of the last digit an sd keeps (−2 for 0.05 or 0.012 → hundredths… see the rule
 * above), or null for an sd that is not a positive finite number.
 */
export function sdLastDigit(sd: number): number | null {
  if (!(Number.isFinite(sd) && sd > 0)) return null;
  let exponent = Math.floor(Math.log10(sd));
  let leading = Math.round(sd / 10 ** (exponent - 2));
  // log10 of numbers like 1000 can land a hair under the integer: bring the three digits back to 100–999.
  if (leading >= 1000) {
    exponent += 1;
    leading = Math.round(sd / 10 ** (exponent - 2));
  } else if (leading < 100) {
    exponent -= 1;
    leading = Math.round(sd / 10 ** (exponent - 2));
  }
  return leading <= 354 ? exponent - 1 : exponent;
}

/**
 * `value ± sd` rounded consistently. Without a usable sd (null, zero, not finite) the value is shown
 * to `digits` significant digits, as elsewhere on the page. A true minus sign; never "NaN".
 */
export function formatMeasured(value: number, sd: number | null, digits: number = DISPLAY_SIGNIFICANT_DIGITS): MeasuredText {
  if (!Number.isFinite(value)) return { value: '—', sd: null, text: '—' };
  const last = sd === null ? null : sdLastDigit(sd);
  if (sd === null || last === null) {
    const shown = formatSignificant(value, digits);
    return { value: shown, sd: null, text: shown };
  }
  const magnitude = Math.max(Math.abs(value), sd);
  if (magnitude >= FIXED_BELOW || -last > MOST_DECIMALS) {
    const power = Math.floor(Math.log10(magnitude));
    const decimals = Math.max(0, power - last);
    const v = withMinus((value / 10 ** power).toFixed(decimals));
    const s = (sd / 10 ** power).toFixed(decimals);
    const times = ` × 10${superscript(power)}`;
    return { value: `${v}${times}`, sd: `${s}${times}`, text: `(${v} ± ${s})${times}` };
  }
  const v = withMinus(atDigit(value, last));
  const s = atDigit(sd, last);
  return { value: v, sd: s, text: `${v} ± ${s}` };
}

/** An sd shown alone (a row that is itself an uncertainty): one or two digits by the rule above. */
export function formatSd(sd: number): string {
  const last = sdLastDigit(sd);
  if (last === null) return formatSignificant(sd, 2);
  return formatMeasured(sd, sd).sd ?? formatSignificant(sd, 2);
}

/** `x` rounded to the digit 10^last, as plain decimal text. */
function atDigit(x: number, last: number): string {
  if (last <= 0) return normaliseZero(x.toFixed(-last));
  const step = 10 ** last;
  return normaliseZero((Math.round(x / step) * step).toFixed(0));
}

/** "−0.00" reads as a signed zero: show it unsigned. */
function normaliseZero(text: string): string {
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}
