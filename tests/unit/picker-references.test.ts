/**
 * Picks that never claim more than the trace holds (PHYSICS notes §7): a pick inside its search
 * window or a refusal that says why in µs; the peak picker measured peak to peak, the edge pickers
 * onset to onset; noise only from samples before time zero, the file's t = 0 and the heater's
 * switching. Traces are synthetic, generated here from a stated model (invented apparatus:
 * 60.0 mm path, 1 MS/s digitiser, a 100 µs flat-topped heater pulse), with seeded noise.
 */
import { describe, expect, it } from 'vitest';
import { parseTraceCsv } from '../../src/io/trace-csv';
import { pickTraceArrival } from '../../src/io/trace-pick';
import { convertDelay, InvalidInputError, pickArrival, secondSound, timeText } from '../../src/physics';
import { gaussian, seededRandom, smoothPulse } from '../support/synthetic-trace';

const STEP = 1e-6;
const D_M = 0.06;
const T_K = 1.8;
const TRANSIT = D_M / secondSound(T_K); // 3.015 ms at 1.8 K (D&B 1998 curve)
const PULSE = 100e-6;
const RISE = 4e-6;
const NOISE_V = 17.6e-6;

/**
 * A two-channel trace CSV: a heater drive switched on at t = 0 (its first sample above zero at
 * +1 µs), a pickup spike on the sensor at the switching instant (the sample at t = 0), and the
 * received pulse (the drive's shape, 1 mV) `TRANSIT` later, with white noise of 17.6 µV.
 */
function traceCsv(seed: number): string {
  const z = gaussian(seededRandom(seed));
  const lines = ['time_s,heater,sensor'];
  const drive = smoothPulse(RISE, PULSE);
  for (let i = -200; i < 4000; i++) {
    const t = i * STEP;
    const heater = 5 * drive(t);
    const pickup = i === 0 ? 400e-6 : 0;
    const sensor = 1e-3 * drive(t - TRANSIT) + pickup + NOISE_V * z();
    lines.push(`${t.toExponential(9)},${heater},${sensor}`);
  }
  return lines.join('\n');
}

const temperatureOf = (delay_s: number) => {
  const c = convertDelay({ distance_m: D_M, delay_s, distanceSd_m: 0, delaySd_s: 0, offset_s: 0, offsetSd_s: 0 }).candidates;
  return c.reduce((a, b) => (Math.abs(b.temperature_K - T_K) < Math.abs(a.temperature_K - T_K) ? b : a)).temperature_K;
};

describe('like with like: the delay runs between the same features of drive and pulse', () => {
  const trace = parseTraceCsv(traceCsv(3));

  it('peak picker: peak to peak, so a 100 µs flat-topped pulse reads 1.800 K, not 1.84 K', () => {
    const p = pickTraceArrival(trace, { picker: 'peak', heater: 'heater', sensor: 'sensor' });
    expect(p.reference).toBe('peak to peak');
    // A parabola through a flat top finds its centre only to a few samples in noise: 10 µs, 8 mK.
    expect(Math.abs(p.delay_s - TRANSIT)).toBeLessThan(10 * STEP);
    expect(Math.abs(temperatureOf(p.delay_s) - T_K)).toBeLessThan(8e-3);
    // Measured from the onset instead, the same peak is 50 µs late: well off 1.800 K.
    expect(temperatureOf(p.arrival_s - p.timeZero_s)).toBeGreaterThan(1.83);
  });

  it('fraction and threshold pickers and the correlation: onset to onset', () => {
    for (const picker of ['fraction', 'threshold', 'xcorr'] as const) {
      const p = pickTraceArrival(trace, { picker, heater: 'heater', sensor: 'sensor', from_s: 100e-6 });
      expect(p.reference).toBe('onset to onset');
      expect(Math.abs(temperatureOf(p.delay_s) - T_K)).toBeLessThan(5e-3);
    }
  });

  it('without a heater channel the delay counts from the file’s t = 0, and says so', () => {
    const p = pickTraceArrival(trace, { picker: 'fraction', sensor: 'sensor', from_s: 100e-6 });
    expect(p.reference).toBe("from the file's t = 0");
  });
});

describe('noise from samples before t = 0 only', () => {
  it('the pickup at the heater’s switching instant does not enter the noise estimate (200 samples, 17.6 µV)', () => {
    const trace = parseTraceCsv(traceCsv(11));
    const p = pickTraceArrival(trace, { picker: 'fraction', heater: 'heater', sensor: 'sensor', from_s: 100e-6 });
    expect(p.baseline.samples).toBe(200);
    // The sample sd of 200 normal deviates lies within 15 % of the true sd with near certainty.
    expect(p.baseline.noise / NOISE_V).toBeGreaterThan(0.85);
    expect(p.baseline.noise / NOISE_V).toBeLessThan(1.15);
  });
});

describe('picks stay inside the search window or are refused, in µs', () => {
  const trace = parseTraceCsv(traceCsv(5));

  it('a threshold window starting on the pulse is refused, naming its start in µs with a true minus', () => {
    // The window starts 20 µs into the received pulse: the crossing lies before it.
    const start = TRANSIT + 20e-6;
    expect(() => pickTraceArrival(trace, { picker: 'threshold', heater: 'heater', sensor: 'sensor', from_s: start })).toThrow(/already 5 noise sd above the baseline.*3\.0[0-9]* ms/);
  });

  it('refusals give times as a person reads them: "−77.7 µs", never raw seconds', () => {
    expect(timeText(-77.7e-6)).toBe('−77.7 µs');
    expect(timeText(3.016e-3)).toBe('3.02 ms');
    let message = '';
    try {
      pickArrival(
        { time_s: Float64Array.from({ length: 40 }, (_, i) => (i - 4) * 1e-6), values: Float64Array.from({ length: 40 }, (_, i) => i % 3) },
        { kind: 'threshold', thresholdSigma: 5 },
      );
    } catch (error) {
      if (error instanceof InvalidInputError) message = error.message;
    }
    expect(message).toMatch(/before t = 0 µs/);
    expect(message).not.toMatch(/e-\d/);
  });

  it('every pick of every picker lies inside its window, over windows placed anywhere around the pulse', () => {
    const pickers = ['threshold', 'fraction', 'peak', 'xcorr'] as const;
    for (const picker of pickers) {
      for (let k = 0; k < 12; k++) {
        const from_s = TRANSIT - 150e-6 + k * 25e-6;
        const to_s = from_s + 200e-6;
        try {
          const p = pickTraceArrival(trace, { picker, heater: 'heater', sensor: 'sensor', from_s, to_s });
          const t = p.arrival_s - p.timeZero_s;
          expect(t).toBeGreaterThanOrEqual(from_s - 1e-9);
          expect(t).toBeLessThanOrEqual(to_s + 1e-9);
        } catch (error) {
          expect(error).toBeInstanceOf(InvalidInputError);
          // Any time in the message is in µs or ms, never raw seconds or an exponent.
          expect((error as Error).message).not.toMatch(/\d(e[-+]?\d| s\b)/);
        }
      }
    }
  });
});

describe('trace chart axes carry units', () => {
  it('a channel named with its unit keeps it; one without says the file’s units', async () => {
    const { channelAxisTitle } = await import('../../src/ui/converter/trace/trace-figure');
    expect(channelAxisTitle('sensor_V')).toBe('sensor (V)');
    expect(channelAxisTitle('bolometer_uV')).toBe('bolometer (µV)');
    expect(channelAxisTitle('CH2 (mV)')).toBe('CH2 (mV)');
    expect(channelAxisTitle('CH2')).toBe('CH2 (file units)');
  });
});
