/**
 * Byte-level readers for the streaming trace CSV parser (trace-csv.ts): blank runs, plain
 * decimals read straight from the bytes (exact, or NaN for the slow path), and joining chunks.
 * No text is made on the fast path.
 */

export function isBlank(b: Uint8Array, start: number, end: number): boolean {
  for (let i = start; i < end; i++) {
    const c = b[i] as number;
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}

/** Powers of ten that are exact doubles (10^0 … 10^22). */
const EXACT_POW10 = Float64Array.from({ length: 23 }, (_, i) => 10 ** i);
/** Set by {@link readDecimalBytes} when it read a decimal comma; read and cleared by {@link takeDecimalComma}. */
let sawDecimalComma = false;

/** Whether a decimal comma was read since the last call (and clears the mark). */
export function takeDecimalComma(): boolean {
  const saw = sawDecimalComma;
  sawDecimalComma = false;
  return saw;
}


/**
 * Reads a plain decimal ("-1.234e-05", spaces around allowed; with `comma`, "1,5" too) from
 * b[start, end), or returns NaN for anything else, which the caller then reads the slow way.
 * Exact: at most 15 significant digits and a decimal exponent within ±22 make the result one
 * correctly rounded operation on exact doubles (Clinger's fast path), the same double `Number`
 * gives; anything longer returns NaN and goes to `Number`.
 */
export function readDecimalBytes(b: Uint8Array, start: number, end: number, comma: boolean): number {
  let i = start;
  let e = end;
  while (i < e && b[i] === 32) i++;
  while (e > i && b[e - 1] === 32) e--;
  if (i === e) return Number.NaN;
  let c = b[i] as number;
  const negative = c === 45;
  if (c === 45 || c === 43) i++;
  let mantissa = 0;
  let significant = 0;
  let digits = 0;
  let scale = 0;
  while (i < e) {
    c = b[i] as number;
    if (c < 48 || c > 57) break;
    mantissa = mantissa * 10 + (c - 48);
    if (mantissa !== 0) significant++;
    digits++;
    i++;
  }
  if (i < e && (b[i] === 46 || (comma && b[i] === 44))) {
    if (b[i] === 44) sawDecimalComma = true;
    i++;
    while (i < e) {
      c = b[i] as number;
      if (c < 48 || c > 57) break;
      mantissa = mantissa * 10 + (c - 48);
      if (mantissa !== 0) significant++;
      digits++;
      scale--;
      i++;
    }
  }
  if (digits === 0) return Number.NaN;
  if (i < e) {
    c = b[i] as number;
    if (c !== 101 && c !== 69) return Number.NaN;
    i++;
    let exponentNegative = false;
    if (i < e && (b[i] === 45 || b[i] === 43)) {
      exponentNegative = b[i] === 45;
      i++;
    }
    let exponent = 0;
    const exponentStart = i;
    while (i < e) {
      c = b[i] as number;
      if (c < 48 || c > 57 || i - exponentStart > 4) return Number.NaN;
      exponent = exponent * 10 + (c - 48);
      i++;
    }
    if (i === exponentStart) return Number.NaN;
    scale += exponentNegative ? -exponent : exponent;
  }
  if (significant > 15) return Number.NaN;
  let v: number;
  if (scale === 0 || mantissa === 0) v = mantissa;
  else if (scale < 0) {
    if (scale < -22) return Number.NaN;
    v = mantissa / (EXACT_POW10[-scale] as number);
  } else {
    if (scale > 22) return Number.NaN;
    v = mantissa * (EXACT_POW10[scale] as number);
  }
  return negative ? -v : v;
}

/** The two byte runs one after the other, in a new array. */
export function concatBytes(a: Uint8Array, b: Uint8Array): Uint8Array {
  const out = new Uint8Array(a.byteLength + b.byteLength);
  out.set(a, 0);
  out.set(b, a.byteLength);
  return out;
}
