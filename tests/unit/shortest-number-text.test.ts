/**
 * The CSV writers' number text is exactly JavaScript's own `String(x)` (ECMAScript Number::toString,
 * ECMA-262 §6.1.6.1.20: the shortest decimal that reads back as the same double, the closest one
 * when several are as short; plain between 1e−6 and 1e21): compared double for double, on seeded
 * random doubles of every magnitude, on the awkward ones (powers of two and of ten and their
 * neighbours, short decimals, the ends of the fast range), and by fast-check.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SHORTEST_NUMBER_MAX_BYTES, shortestNumberText, writeShortestNumber } from '../../src/io/shortest-number-text';

/** A seeded generator (mulberry32; common practice, no source), so a failure can be replayed. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const f64 = new Float64Array(1);
const u32 = new Uint32Array(f64.buffer);
f64[0] = 1;
const LOW = u32[1] === 0x3ff00000 ? 0 : 1;

/** The double `steps` units in the last place from x (same sign, no crossing of zero). */
function ulpsFrom(x: number, steps: number): number {
  f64[0] = x;
  const lo = u32[LOW] as number;
  const hi = u32[1 - LOW] as number;
  const total = hi * 4294967296 + lo + steps;
  u32[LOW] = total % 4294967296;
  u32[1 - LOW] = Math.floor(total / 4294967296);
  return f64[0] as number;
}

function mismatches(values: Iterable<number>): string[] {
  const bad: string[] = [];
  for (const x of values) if (shortestNumberText(x) !== String(x)) bad.push(`${String(x)} → ${shortestNumberText(x)}`);
  return bad;
}

describe('shortestNumberText writes what String(x) writes', () => {
  it('on 600 000 seeded random doubles: temperatures, sds, speeds, any bit pattern', () => {
    const random = seeded(20260101);
    const values: number[] = [];
    for (let i = 0; i < 100_000; i++) {
      values.push(0.3 + random() * 1.9);
      values.push(random() * 10 ** (Math.floor(random() * 40) - 20));
      values.push(-(random() * 10 ** (Math.floor(random() * 24) - 8)));
      u32[0] = Math.floor(random() * 4294967296);
      u32[1] = Math.floor(random() * 4294967296);
      values.push(f64[0] as number);
      values.push(Number((random() * 100).toPrecision(1 + Math.floor(random() * 17))));
      values.push(Number((random() * 1e-3).toFixed(Math.floor(random() * 12))));
    }
    expect(mismatches(values)).toEqual([]);
  });

  it('on powers of two and of ten, their neighbours, short decimals and the ends of the fast range', () => {
    const values: number[] = [0, -0, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, Number.MIN_VALUE, Number.MAX_VALUE, Number.EPSILON];
    for (let j = -1074; j <= 1023; j++) {
      const p = 2 ** j;
      values.push(p, -p);
      for (const d of [-2, -1, 1, 2]) values.push(ulpsFrom(p, d));
    }
    for (let j = -30; j <= 30; j++) {
      const p = Number(`1e${j}`);
      for (let d = -3; d <= 3; d++) values.push(ulpsFrom(p, d));
      for (const m of [1.5, 2.5, 9.5, 9.999999999999998, 1.0000000000000002, 5, 0.1 + 0.2]) values.push(m * p);
    }
    values.push(0.1, 0.2, 0.3, 0.1 + 0.2, 1 / 3, 2 / 3, 123456789012.5, 999999999999.9999, 9.999999999999998e12, 1.7976931348623157e308);
    expect(mismatches(values)).toEqual([]);
  });

  it('for any double (fast-check)', () => {
    fc.assert(
      fc.property(fc.double(), (x) => shortestNumberText(x) === String(x)),
      { numRuns: 20_000 },
    );
    fc.assert(
      fc.property(fc.double({ min: 1e-7, max: 1e14, noNaN: true }), (x) => shortestNumberText(x) === String(x)),
      { numRuns: 20_000 },
    );
  });

  it('writes the same text as ASCII bytes at any position, within SHORTEST_NUMBER_MAX_BYTES', () => {
    const out = new Uint8Array(200);
    for (const x of [1.8000000000000003, -5e-324, 2.5e-7, 1e21, 0.000123, 42, -0.5, 1234567.125]) {
      const end = writeShortestNumber(x, out, 17);
      expect(end - 17).toBeLessThanOrEqual(SHORTEST_NUMBER_MAX_BYTES);
      expect(new TextDecoder().decode(out.subarray(17, end))).toBe(String(x));
    }
  });
});
