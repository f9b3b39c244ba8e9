/**
 * Kernel speed. Targets on the 2-core reference machine: at least 1 million u2 evaluations per
 * second, and a full 1000-point sweep of all properties under 5 ms. Run with `npm run bench`.
 */
import { bench, describe } from 'vitest';
import { heliumProperties, PROPERTIES_RANGE_K, secondSound, SECOND_SOUND_MEASURED_MIN_K } from '../../src/physics';

const SWEEP_POINTS = 1000;
const sweep = Array.from(
  { length: SWEEP_POINTS },
  (_, i) => PROPERTIES_RANGE_K[0] + ((PROPERTIES_RANGE_K[1] - PROPERTIES_RANGE_K[0]) * i) / (SWEEP_POINTS - 1),
);
// u2 over its measured range (where a delay conversion spends its time).
const U2_BATCH = 1000;
const u2Temperatures = Array.from(
  { length: U2_BATCH },
  (_, i) => SECOND_SOUND_MEASURED_MIN_K + ((2.17 - SECOND_SOUND_MEASURED_MIN_K) * i) / (U2_BATCH - 1),
);
// Results accumulate here and are checked at the end, so the work cannot be optimised away.
let sink = 0;

describe('property kernel', () => {
  bench('all properties at one temperature (1.8 K)', () => {
    sink += heliumProperties(1.8).density_kg_m3;
  });

  bench(`all properties, ${SWEEP_POINTS}-point sweep 0.3–4.24 K`, () => {
    for (const T of sweep) sink += heliumProperties(T).density_kg_m3;
  });

  bench(`u2 alone, batch of ${U2_BATCH} evaluations (ops/s × ${U2_BATCH} = evaluations/s)`, () => {
    for (const T of u2Temperatures) sink += secondSound(T);
  });

  bench('sanity: the benchmarked work produced finite numbers', () => {
    if (!Number.isFinite(sink)) throw new Error('benchmark produced a non-finite sum');
  });
});
