/**
 * A double as JavaScript's own `String(x)` writes it (the shortest decimal that reads back as the
 * same double, the closest such when several are as short; ECMAScript Number::toString), found
 * in plain double arithmetic, several times faster than the engine's conversion for the numbers
 * a results CSV holds. Writing a large CSV is mostly turning doubles into text.
 *
 * Method (exact throughout; no step rounds):
 *  - x = m·2^e (m the 53-bit significand). Scaled by 10^k (k = 4…22, chosen so that X = x·10^k
 *    lies in [10^16, 10^17)), X = (x·5^k)·2^k is held exactly as a pair of doubles: the product
 *    and its rounding error (Dekker's two-product; 5^k ≤ 5^22 < 2^53 is exact).
 *  - Every decimal that reads back as x lies within g = 2^(e−1)·10^k (half an ulp, scaled) of X;
 *    both ends count when m is even (reading rounds ties to even). With X ≥ 10^16, 2g > 1, so the
 *    nearest integer (17 digits) always qualifies.
 *  - X is split into a·10^8 + b + f (a, b integers, f ∈ [0, 1)); for s = 1, 2, … the nearest
 *    multiple of 10^s to X is tested against g, exactly; the last s that passes gives the
 *    shortest digits (any shorter decimal is a multiple of 10^(s+1), which failed), and being the
 *    nearest it is the closest of them.
 *  - The digits are laid out as Number::toString does (plain for 10^−6 ≤ |x| < 10^21).
 * Outside 10^−6 ≤ |x| < 10^13, for powers of two (whose lower half-gap is half the upper one) and
 * where X lies exactly half-way (which cannot happen in that range, kept as a guard) it hands
 * over to `String(x)`. tests/unit/shortest-number-text.test.ts compares the two on millions of
 * doubles, the awkward ones included.
 */

/** 10^j for j = 0…9 as 32-bit integers. */
const POW10 = Int32Array.of(1, 10, 100, 1000, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9);
/** 5^k for k = 0…22, exact (5^22 < 2^53). */
const POW5 = Array.from({ length: 23 }, (_, k) => 5 ** k);
/** Veltkamp's split of 5^k into two 26-bit halves, for Dekker's product. */
const POW5_HIGH = POW5.map((f) => {
  const t = SPLIT_OF(f);
  return t - (t - f);
});
const POW5_LOW = POW5.map((f, k) => f - (POW5_HIGH[k] as number));
/** 10^j as doubles, j = −7…13, for guessing the decimal exponent (exactness not needed). */
const DECADES = Array.from({ length: 21 }, (_, j) => 10 ** (j - 7));
/** 2^j for j = −1100…1100, exact (built by halving and doubling). */
const POW2_OFFSET = 1100;
const POW2 = (() => {
  const table = new Float64Array(2 * POW2_OFFSET + 1);
  table[POW2_OFFSET] = 1;
  for (let j = 1; j <= POW2_OFFSET; j++) {
    table[POW2_OFFSET + j] = (table[POW2_OFFSET + j - 1] as number) * 2;
    table[POW2_OFFSET - j] = (table[POW2_OFFSET - j + 1] as number) / 2;
  }
  return table;
})();

function SPLIT_OF(v: number): number {
  return 134217729 * v; // 2^27 + 1, Veltkamp's splitter
}

const FAST_MIN = 1e-6;
const FAST_MAX = 1e13;
const E8 = 1e8;
const LOG10_2 = 0.30102999566398114;

const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);
// The platform's word order (little-endian everywhere this runs; checked once).
const HIGH = (() => {
  bits[0] = 1;
  return words[1] === 0x3ff00000 ? 1 : 0;
})();
const LOW = 1 - HIGH;

/** The digits found by {@link shortestDigits}, ASCII: DIGITS[0…digitCount) × 10^(digitPoint − digitCount) = the decimal. */
const DIGITS = new Uint8Array(18);
let digitCount = 0;
let digitPoint = 0;

/**
 * Exact test of J + F ≤ g (< g when not `inclusive`), for an integer J ≥ 0, F ∈ [0, 1] and
 * g = gi + gf (gi its integer part).
 */
function within(J: number, F: number, gi: number, gf: number, inclusive: boolean): boolean {
  const d = J - gi;
  if (d >= 1) return false;
  if (d <= -2) return true;
  if (d === 0) return F < gf || (inclusive && F === gf);
  // d = −1: J + F − g = F − 1 − gf ≤ 0, equal only when F = 1 and gf = 0.
  return F < 1 || gf > 0 || inclusive;
}

/**
 * Finds the shortest digits of positive x in [FAST_MIN, FAST_MAX) into DIGITS / digitCount /
 * digitPoint; false when x needs the engine (a power of two, a half-way case).
 */
function shortestDigits(x: number): boolean {
  bits[0] = x;
  const high = words[HIGH] as number;
  const low = words[LOW] as number;
  if ((high & 0xfffff) === 0 && low === 0) return false;
  const biased = (high >>> 20) & 0x7ff;
  const inclusive = (low & 1) === 0;
  // k so that X = x·10^k lies in [10^16, 10^17): a guess from the binary exponent, corrected by the exact X.
  let decade = Math.floor((biased - 1023) * LOG10_2);
  if (x >= (DECADES[decade + 8] as number)) decade++;
  let k = 16 - decade;
  const xs = SPLIT_OF(x);
  const xh = xs - (xs - x);
  const xl = x - xh;
  let hi = 0;
  let lo = 0;
  for (let attempt = 0; ; attempt++) {
    if (k < 0 || k > 22 || attempt === 3) return false;
    const five = POW5[k] as number;
    const fh = POW5_HIGH[k] as number;
    const fl = POW5_LOW[k] as number;
    const p = x * five;
    const err = xh * fh - p + xh * fl + xl * fh + xl * fl;
    const scale = POW2[POW2_OFFSET + k] as number;
    hi = p * scale;
    lo = err * scale;
    if (hi < 1e16 || (hi === 1e16 && lo < 0)) k++;
    else if (hi > 1e17 || (hi === 1e17 && lo >= 0)) k--;
    else break;
  }
  // X = a·10^8 + b + f (a, b integers, 0 ≤ b < 10^8, 0 ≤ f < 1).
  let a = Math.floor(hi / E8);
  let r = hi - a * 390625 * 256; // a·10^8, exact: a·5^8 < 2^53
  while (lo < -r) {
    a--;
    r += E8;
  }
  while (lo >= E8 - r) {
    a++;
    r -= E8;
  }
  const floorLo = Math.floor(lo);
  const b = (r + floorLo) | 0;
  a |= 0;
  const f = lo - floorLo;
  // Half the gap to the neighbouring doubles, scaled: 5^k · 2^(e − 1 + k), e = biased − 1075; exact.
  const g = (POW5[k] as number) * (POW2[POW2_OFFSET + biased - 1076 + k] as number);
  const gi = Math.floor(g);
  const gf = g - gi;
  // s = 0: the nearest integer, always within (g > 1/2).
  if (f === 0.5) return false;
  let na = a;
  let nb = f < 0.5 ? b : b + 1;
  let zeros = 0;
  for (let s = 1; s <= 17; s++) {
    // X mod 10^s = ja·10^8 + jb + f, and 10^s − that = ua·10^8 + ub + (1 − f).
    let ja = 0;
    let jb: number;
    let ua = 0;
    let ub: number;
    if (s <= 8) {
      const m = POW10[s] as number;
      jb = b % m;
      ub = m - 1 - jb;
    } else {
      const m = POW10[s - 8] as number;
      ja = a % m;
      jb = b;
      ua = m - 1 - ja;
      ub = E8 - 1 - b;
    }
    // Within g needs the integer part at most g's (g < 12): most s fail here, without the exact test.
    const down = ja === 0 && jb <= gi && within(jb, f, gi, gf, inclusive);
    const up = ua === 0 && ub <= gi && within(ub, 1 - f, gi, gf, inclusive);
    if (!down && !up) break;
    let goDown = down;
    if (down && up) {
      // Both multiples qualify (only for s = 1): the nearer one.
      if (jb === 5 && f === 0) return false;
      goDown = jb < 5;
    }
    if (goDown) {
      na = a - ja;
      nb = b - jb;
    } else if (s <= 8) {
      na = a;
      nb = b - jb + (POW10[s] as number);
    } else {
      na = a - ja + (POW10[s - 8] as number);
      nb = 0;
    }
    zeros = s;
  }
  if (nb >= E8) {
    na++;
    nb -= E8;
  }
  // The integer na·10^8 + nb: 17 digits, or 18 when it rounded up to 10^17.
  const length = na >= 1e9 ? 18 : 17;
  writePairs(nb, length - 8, 4);
  if (length === 18) {
    DIGITS[0] = 49;
    writePairs(na - 1e9, 1, 5);
  } else {
    // 9 digits: one, then four pairs.
    const top = (na / 1e8) | 0;
    DIGITS[0] = 48 + top;
    writePairs(na - top * 1e8, 1, 4);
  }
  digitCount = length - zeros;
  digitPoint = length - k;
  return true;
}

/** "00" … "99" as ASCII pairs. */
const PAIRS = Uint8Array.from({ length: 200 }, (_, i) => 48 + (i & 1 ? (i >> 1) % 10 : Math.floor((i >> 1) / 10)));

/** The 2·pairs decimal digits of v (< 100^pairs, zero-padded) into DIGITS from `at`. */
function writePairs(v: number, at: number, pairs: number): void {
  let rest = v;
  for (let j = at + 2 * pairs - 2; j >= at; j -= 2) {
    const q = (rest / 100) | 0;
    const pair = (rest - q * 100) << 1;
    DIGITS[j] = PAIRS[pair] as number;
    DIGITS[j + 1] = PAIRS[pair + 1] as number;
    rest = q;
  }
}

/** Bytes of a text that is ASCII (number text), at `pos`; returns the end. */
function writeAscii(text: string, out: Uint8Array, pos: number): number {
  for (let i = 0; i < text.length; i++) out[pos + i] = text.charCodeAt(i);
  return pos + text.length;
}

/** Most bytes {@link writeShortestNumber} writes: "-" and 17 digits, ".", "e-324" … (String(-5e-324) is 7). */
export const SHORTEST_NUMBER_MAX_BYTES = 32;

/**
 * Writes `x` as `String(x)` writes it (ASCII) into `out` at `pos`, which must have room for
 * {@link SHORTEST_NUMBER_MAX_BYTES}; returns the position after it.
 */
export function writeShortestNumber(x: number, out: Uint8Array, pos: number): number {
  const magnitude = x < 0 ? -x : x;
  if (!(magnitude >= FAST_MIN && magnitude < FAST_MAX) || !shortestDigits(magnitude)) return writeAscii(String(x), out, pos);
  let p = pos;
  if (x < 0) out[p++] = 45;
  const count = digitCount;
  const n = digitPoint;
  if (n >= count) {
    for (let i = 0; i < count; i++) out[p++] = DIGITS[i] as number;
    for (let i = count; i < n; i++) out[p++] = 48;
  } else if (n > 0) {
    for (let i = 0; i < n; i++) out[p++] = DIGITS[i] as number;
    out[p++] = 46;
    for (let i = n; i < count; i++) out[p++] = DIGITS[i] as number;
  } else {
    out[p++] = 48;
    out[p++] = 46;
    for (let i = n; i < 0; i++) out[p++] = 48;
    for (let i = 0; i < count; i++) out[p++] = DIGITS[i] as number;
  }
  return p;
}

const scratch = new Uint8Array(SHORTEST_NUMBER_MAX_BYTES);

/**
 * `x` as `String(x)` writes it, for every double: the shortest round-trip decimal, plain
 * between 10^−6 and 10^21, with an exponent outside.
 */
export function shortestNumberText(x: number): string {
  const end = writeShortestNumber(x, scratch, 0);
  return String.fromCharCode.apply(null, scratch.subarray(0, end) as unknown as number[]);
}
