/*
 * Numbers as a reader expects them: a fixed count of significant digits, a true minus sign,
 * and "× 10ⁿ" instead of "e-6" for very small or large magnitudes.
 */

/** Significant digits for values in the table and captions: the curves' own accuracy is 0.1–1 %. */
export const DISPLAY_SIGNIFICANT_DIGITS = 4;
/** Significant digits for an uncertainty. */
export const UNCERTAINTY_SIGNIFICANT_DIGITS = 2;

const SCIENTIFIC_BELOW = 1e-3;
const SCIENTIFIC_FROM = 1e6;
const MINUS = '\u2212';
const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** `x` to `digits` significant digits; "—" for a non-finite value (never "NaN"). */
export function formatSignificant(x: number, digits: number = DISPLAY_SIGNIFICANT_DIGITS): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const magnitude = Math.abs(x);
  if (magnitude < SCIENTIFIC_BELOW || magnitude >= SCIENTIFIC_FROM) return formatScientific(x, digits);
  // Integers longer than `digits` keep all their digits (1638 Pa, 24046 Pa), never "2.405e+4".
  if (magnitude >= 10 ** digits) return withMinus(x.toFixed(0));
  return withMinus(x.toPrecision(digits));
}

/** `x` as "3.142 × 10⁻⁶". */
export function formatScientific(x: number, digits: number): string {
  const [mantissa = '', exponent = '0'] = x.toExponential(digits - 1).split('e');
  return `${withMinus(mantissa)} × 10${superscript(Number(exponent))}`;
}

/** `x` with a fixed number of decimals and a true minus sign. */
export function formatFixed(x: number, decimals: number): string {
  if (!Number.isFinite(x)) return '—';
  return withMinus(x.toFixed(decimals));
}

/** The text with a leading hyphen replaced by a true minus sign. */
export function withMinus(text: string): string {
  return text.startsWith('-') ? `${MINUS}${text.slice(1)}` : text;
}

/** A whole number as superscript digits, for powers of ten: −5 → "⁻⁵". */
export function superscript(n: number): string {
  return String(n)
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
}

/** A number in plain digits, at most 6 significant, with a true minus sign (limits and ranges in messages). */
export function plain(x: number): string {
  const text = Number(x.toPrecision(6)).toString();
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}
