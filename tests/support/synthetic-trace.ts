/**
 * Synthetic digitiser traces for picker tests, generated from a stated model: a baseline, a
 * pulse of known shape starting at a known arrival time, and white Gaussian noise from a seeded
 * generator (so every run sees the same trace).
 */

/** Mulberry32: a small seeded generator (public-domain algorithm). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by Box–Muller from a uniform generator. */
export function gaussian(random: () => number): () => number {
  return () => {
    const u = Math.max(random(), 1e-300);
    const v = random();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
}

export interface SyntheticTrace {
  time_s: Float64Array;
  values: Float64Array;
  /** The noiseless signal, for computing what each picker should find. */
  clean: Float64Array;
}

/**
 * A trace sampled every `step_s` from `start_s` for `samples`, with `baseline + amplitude·shape(t − arrival)`
 * plus noise of standard deviation `noise`.
 */
export function synthTrace(o: {
  start_s: number;
  step_s: number;
  samples: number;
  arrival_s: number;
  amplitude: number;
  baseline: number;
  noise: number;
  shape: (t: number) => number;
  seed: number;
}): SyntheticTrace {
  const normal = gaussian(seededRandom(o.seed));
  const time_s = Float64Array.from({ length: o.samples }, (_, i) => o.start_s + i * o.step_s);
  const clean = time_s.map((t) => o.baseline + o.amplitude * o.shape(t - o.arrival_s));
  const values = clean.map((v) => v + o.noise * normal());
  return { time_s, values, clean };
}

/** A smooth pulse: raised-cosine rise over `rise`, flat, raised-cosine fall. */
export function smoothPulse(rise: number, width: number): (t: number) => number {
  return (t) => {
    if (t <= 0 || t >= width + rise) return 0;
    if (t < rise) return 0.5 - 0.5 * Math.cos((Math.PI * t) / rise);
    if (t <= width) return 1;
    return 0.5 + 0.5 * Math.cos((Math.PI * (t - width)) / rise);
  };
}

/** A Gaussian bump centred `centre` after the arrival, of standard deviation `sigma`. */
export function gaussianPulse(centre: number, sigma: number): (t: number) => number {
  return (t) => Math.exp(-0.5 * ((t - centre) / sigma) ** 2);
}
