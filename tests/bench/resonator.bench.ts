/**
 * Resonator speed (issue targets): a 2000-point sweep fitted in under 20 ms; a 100 000-row lock-in
 * record (CSV text → L(t) and f₀ drift with sds) in under 0.5 s. Run with
 * `npx vitest bench --run tests/bench/resonator.bench.ts`.
 */
import { bench, describe } from 'vitest';
import { parseLockinCsv, parseSweepCsv } from '../../src/io/resonance-csv';
import { analyseLockin, fitResonance } from '../../src/physics';
import { type ResonanceTruth, synthLockin, synthSweep } from '../support/resonator-synth';

const TRUTH: ResonanceTruth = { f0_Hz: 7809.4, width_Hz: 2.4, amplitude: 2e-3, phase_rad: 0.6, background: { re: 5e-5, im: -3e-5, slopeRe: 2e-7, slopeIm: 1e-7 } };
const sweep = synthSweep(TRUTH, { from_Hz: TRUTH.f0_Hz - 15, to_Hz: TRUTH.f0_Hz + 15, points: 2000, noise: 1e-5, seed: 7 });
const reference = fitResonance(synthSweep(TRUTH, { from_Hz: TRUTH.f0_Hz - 15, to_Hz: TRUTH.f0_Hz + 15, points: 401, noise: 1e-5, seed: 8 }));
const sweepCsv = `frequency_Hz,x,y\n${Array.from(sweep.frequency_Hz, (f, i) => `${f},${sweep.x[i]},${sweep.y[i]}`).join('\n')}\n`;

const ROWS = 100_000;
const times = Float64Array.from({ length: ROWS }, (_, i) => i * 0.001);
const record = synthLockin(TRUTH, { drive_Hz: TRUTH.f0_Hz, times_s: times, width: (t) => 2.4 + 0.5 * Math.sin(t), centre: (t) => TRUTH.f0_Hz - 0.001 * t, noise: 1e-5, seed: 9 });
const lockinCsv = `time_s,x,y\n${Array.from(times, (t, i) => `${t},${record.x[i]},${record.y[i]}`).join('\n')}\n`;

describe('resonance sweep fit', () => {
  bench('2000-point sweep: complex Lorentzian fit (target < 20 ms)', () => {
    fitResonance(sweep);
  }, { iterations: 50 });
  bench('2000-point sweep: CSV text → fit', () => {
    fitResonance(parseSweepCsv(sweepCsv));
  }, { iterations: 20 });
});

describe('lock-in record', () => {
  bench(`${ROWS}-row record: CSV text → L(t), f₀ drift and sds (target < 0.5 s)`, () => {
    analyseLockin(parseLockinCsv(lockinCsv), reference, { temperature_K: 1.85 });
  }, { iterations: 5 });
  bench(`${ROWS}-row record: inverse plane only`, () => {
    analyseLockin(record, reference, { temperature_K: 1.85 });
  }, { iterations: 10 });
});
