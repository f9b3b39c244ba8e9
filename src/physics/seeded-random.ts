import { InvalidInputError } from './errors';

/*
 * A small seeded random source for reproducible Monte Carlo: xoshiro128** (Blackman & Vigna,
 * "Scrambled linear pseudorandom number generators", ACM TOMS 47 (2021) 36) for 32-bit uniform
 * words, seeded through splitmix32 so that nearby seeds give unrelated streams; normal deviates by
 * Marsaglia's polar form of the Box–Muller transform (Box & Muller, Ann. Math. Statist. 29, 610
 * (1958); Marsaglia & Bray, SIAM Review 6, 260 (1964)), both of each pair used: no sine or cosine. Pure integer arithmetic on 32-bit words (Math.imul), so node and every browser give the
 * same numbers bit for bit.
 */

/** Seeds accepted: whole numbers 0 to 10⁹ (a round bound that fits the 32-bit state). */
export const SEED_RANGE = [0, 1_000_000_000] as const;
/** Stream keys (trials, channels): whole numbers 0 to 2³² − 1. */
const KEY_RANGE = [0, 4294967295] as const;

/** One splitmix32 step: the next state and a well-mixed 32-bit output (unsigned). */
function splitmix32(state: number): { state: number; out: number } {
  const next = (state + 0x9e3779b9) | 0;
  let z = next;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return { state: next, out: (z ^ (z >>> 16)) >>> 0 };
}

/** Throws unless `seed` is a whole number in {@link SEED_RANGE}. */
export function requireSeed(seed: number, field = 'seed'): number {
  if (!Number.isInteger(seed) || seed < SEED_RANGE[0] || seed > SEED_RANGE[1]) {
    throw new InvalidInputError(field, `must be a whole number from ${SEED_RANGE[0]} to ${SEED_RANGE[1]}`);
  }
  return seed;
}

/**
 * A stream of uniform and normal deviates from a seed and any number of stream keys (e.g. a
 * trial and a channel): each key is folded in with splitmix32, so stream (seed, 3, 1) does not
 * depend on how many other streams were drawn. Seed: {@link SEED_RANGE}; keys: 0 to 2³² − 1.
 */
export class SeededRandom {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spare = 0;
  private hasSpare = false;

  constructor(seed: number, ...keys: number[]) {
    let state = requireSeed(seed) | 0;
    for (const k of keys) {
      if (!Number.isInteger(k) || k < KEY_RANGE[0] || k > KEY_RANGE[1]) throw new InvalidInputError('stream key', `must be a whole number from ${KEY_RANGE[0]} to ${KEY_RANGE[1]}`);
      const step = splitmix32(state ^ Math.imul(k | 0, 0x27d4eb2d));
      state = step.out | 0;
    }
    const words: number[] = [];
    for (let i = 0; i < 4; i++) {
      const step = splitmix32(state);
      state = step.state;
      words.push(step.out | 0);
    }
    [this.s0, this.s1, this.s2, this.s3] = words as [number, number, number, number];
    // xoshiro's state must not be all zero; splitmix32 never gives four zero words, but be sure.
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /** The next unsigned 32-bit word (xoshiro128**). */
  nextUint32(): number {
    const result = Math.imul(rotl(Math.imul(this.s1, 5), 7), 9);
    const t = this.s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result >>> 0;
  }

  /** Uniform on [0, 1), 32 bits of resolution. */
  uniform(): number {
    return this.nextUint32() / 4294967296;
  }

  /** A standard normal deviate (polar Box–Muller; the second of each pair is kept for the next call). */
  normal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    let x: number;
    let y: number;
    let r2: number;
    do {
      x = 2 * this.uniform() - 1;
      y = 2 * this.uniform() - 1;
      r2 = x * x + y * y;
    } while (r2 >= 1 || r2 === 0);
    const f = Math.sqrt((-2 * Math.log(r2)) / r2);
    this.spare = y * f;
    this.hasSpare = true;
    return x * f;
  }

  /** Adds `sd` × a normal deviate to every value of `values`, in place (the same deviates as {@link normal}). */
  addNormal(values: Float64Array, sd: number): void {
    const n = values.length;
    for (let i = 0; i < n; i++) values[i] = (values[i] as number) + sd * this.normal();
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}
