/**
 * Arrival pickers on synthetic traces generated here from a stated model (PHYSICS notes §7):
 * baseline, a pulse of known shape arriving at a known time, white Gaussian noise at SNR 20
 * (peak over noise sd), seeded. Each picker must land within one sample interval of where the
 * noiseless pulse puts its feature (threshold crossing, fraction crossing, peak, alignment).
 */
import { describe, expect, it } from 'vitest';
import { baselineOf, heaterOnset, pickArrival, type PickerKind, uniformStep } from '../../src/physics';
import { gaussianPulse, smoothPulse, synthTrace } from '../support/synthetic-trace';

const STEP = 1e-6; // 1 MS/s
const ARRIVAL = 2.5e-3;
const AMPLITUDE = 1e-3; // V
const NOISE = AMPLITUDE / 20; // SNR 20
const RISE = 8e-6; // eight samples: timing jitter σ/slope ≈ 0.25 µs at SNR 20
const WIDTH = 100e-6;

function trace(seed: number, polarity = 1) {
  return synthTrace({
    start_s: -0.5e-3,
    step_s: STEP,
    samples: 4000,
    arrival_s: ARRIVAL,
    amplitude: polarity * AMPLITUDE,
    baseline: 0.02,
    noise: NOISE,
    shape: smoothPulse(RISE, WIDTH),
    seed,
  });
}

/** Where the noiseless pulse crosses `level` (fraction of its amplitude) on its rise. */
function cleanCrossing(level: number): number {
  // Raised-cosine rise: 0.5 − 0.5 cos(πt/rise) = level.
  return ARRIVAL + (RISE / Math.PI) * Math.acos(1 - 2 * level);
}

const SEEDS = Array.from({ length: 20 }, (_, i) => i + 1);

describe('pickers at SNR 20 land within one sample interval', () => {
  it.each(SEEDS)('threshold (5σ), seed %i', (seed) => {
    const p = pickArrival(trace(seed), { kind: 'threshold', thresholdSigma: 5 });
    const expected = cleanCrossing((5 * NOISE) / AMPLITUDE);
    expect(Math.abs(p.arrival_s - expected)).toBeLessThan(STEP);
    expect(p.arrivalSd_s).toBeGreaterThan(0);
  });

  it.each(SEEDS)('leading-edge fraction (half height), seed %i', (seed) => {
    const p = pickArrival(trace(seed), { kind: 'fraction', fraction: 0.5 });
    expect(Math.abs(p.arrival_s - cleanCrossing(0.5))).toBeLessThan(STEP);
  });

  it.each(SEEDS)('peak with parabolic refinement, seed %i', (seed) => {
    const t = synthTrace({ start_s: -0.5e-3, step_s: STEP, samples: 4000, arrival_s: ARRIVAL, amplitude: AMPLITUDE, baseline: 0, noise: NOISE, shape: gaussianPulse(30e-6, 12e-6), seed });
    const p = pickArrival(t, { kind: 'peak' });
    expect(Math.abs(p.arrival_s - (ARRIVAL + 30e-6))).toBeLessThan(STEP);
  });

  it.each(SEEDS)('cross-correlation with a template, sub-sample, seed %i', (seed) => {
    const shape = smoothPulse(RISE, WIDTH);
    // The arrival falls between samples: 0.37 of a step past a sample.
    const arrival = ARRIVAL + 0.37 * STEP;
    const t = synthTrace({ start_s: -0.5e-3, step_s: STEP, samples: 4000, arrival_s: arrival, amplitude: AMPLITUDE, baseline: 0.01, noise: NOISE, shape, seed });
    const template = Float64Array.from({ length: Math.round((RISE + WIDTH) / STEP) + 1 }, (_, j) => shape(j * STEP));
    const p = pickArrival(t, { kind: 'xcorr', template });
    expect(Math.abs(p.arrival_s - arrival)).toBeLessThan(STEP);
  });
});

describe('picker uncertainty is honest', () => {
  it.each<PickerKind>(['threshold', 'fraction', 'peak'])('%s: stated sd matches the scatter over 200 seeds within a factor 2', (kind) => {
    const picks: number[] = [];
    let stated = 0;
    for (let seed = 100; seed < 300; seed++) {
      const t =
        kind === 'peak'
          ? synthTrace({ start_s: -0.5e-3, step_s: STEP, samples: 4000, arrival_s: ARRIVAL, amplitude: AMPLITUDE, baseline: 0, noise: NOISE, shape: gaussianPulse(30e-6, 12e-6), seed })
          : trace(seed);
      const p = pickArrival(t, { kind });
      picks.push(p.arrival_s);
      stated += p.arrivalSd_s / 200;
    }
    const mean = picks.reduce((a, b) => a + b, 0) / picks.length;
    const scatter = Math.sqrt(picks.reduce((a, b) => a + (b - mean) ** 2, 0) / (picks.length - 1));
    expect(stated / scatter).toBeGreaterThan(0.5);
    expect(stated / scatter).toBeLessThan(2);
  });
});

describe('picker inputs and edge cases', () => {
  it('follows a negative-going signal with polarity auto', () => {
    const p = pickArrival(trace(3, -1), { kind: 'fraction' });
    expect(Math.abs(p.arrival_s - cleanCrossing(0.5))).toBeLessThan(STEP);
    expect(p.peak).toBeLessThan(0);
  });

  it('baseline and noise come from the pre-trigger part', () => {
    const b = baselineOf(trace(4));
    expect(b.level).toBeCloseTo(0.02, 4);
    expect(Math.abs(b.noise / NOISE - 1)).toBeLessThan(0.1);
    expect(b.samples).toBe(500);
  });

  it('says what is missing: no pre-trigger, no crossing, no template, uneven sampling', () => {
    const t = trace(5);
    const late = { time_s: t.time_s.map((x) => x + 1e-3), values: t.values };
    expect(() => pickArrival(late, { kind: 'threshold' })).toThrow(/pre-trigger/);
    const flat = { time_s: t.time_s, values: t.values.map((v, i) => (t.time_s[i] as number) < 0 ? v : 0.02) };
    expect(() => pickArrival(flat, { kind: 'threshold', thresholdSigma: 50 })).toThrow(/never rises/);
    expect(() => pickArrival(t, { kind: 'xcorr' })).toThrow(/template/);
    const uneven = { time_s: t.time_s.map((x, i) => (i === 2000 ? x + 0.5 * STEP : x)), values: t.values };
    expect(() => uniformStep(uneven)).toThrow(/evenly spaced/);
  });

  it('finds the heater onset as the 50 % crossing of the drive', () => {
    const drive = synthTrace({ start_s: -0.1e-3, step_s: STEP, samples: 600, arrival_s: 0, amplitude: 5, baseline: 0, noise: 1e-3, shape: smoothPulse(4e-6, 100e-6), seed: 9 });
    const onset = heaterOnset(drive);
    expect(Math.abs(onset.onset_s - 2e-6)).toBeLessThan(STEP);
  });
});

describe('cross-correlation on a long trace (coarse search, then every lag near the best)', () => {
  it('finds a sub-sample arrival in a 400 000-sample trace as exactly as on a short one', () => {
    const shape = smoothPulse(RISE, WIDTH);
    const arrival = 0.2 + 0.41 * STEP;
    const t = synthTrace({ start_s: -0.5e-3, step_s: STEP, samples: 400_000, arrival_s: arrival, amplitude: AMPLITUDE, baseline: 0, noise: NOISE, shape, seed: 77 });
    const template = Float64Array.from({ length: Math.round((RISE + WIDTH) / STEP) + 1 }, (_, j) => shape(j * STEP));
    const p = pickArrival(t, { kind: 'xcorr', template });
    expect(Math.abs(p.arrival_s - arrival)).toBeLessThan(STEP);
  });
});
