/**
 * Delay → temperature kernel: 100 000 delays converted to all their candidates (target: under
 * 0.2 s in node). Run with `npm run bench`.
 */
import { bench, describe } from 'vitest';
import { convertDelay } from '../../src/physics';

const N = 100_000;
// Delays over 50 mm spanning 0.5–2.17 K's speeds (one to three candidates each).
const delays = Float64Array.from({ length: N }, (_, i) => 0.05 / (15 + (i % 5000) * 0.0012));

describe('delay conversion', () => {
  bench(`${N} delays → all candidates`, () => {
    for (let i = 0; i < N; i++) {
      convertDelay({ distance_m: 0.05, delay_s: delays[i] as number, distanceSd_m: 20e-6, delaySd_s: 1e-6, offset_s: 0, offsetSd_s: 0 });
    }
  }, { iterations: 5 });
});
