/**
 * Converter speed. Targets on the 2-core reference machine: 100 000 delays converted with all
 * their candidates in under 0.2 s, and a 50 MB trace CSV parsed and picked at 50 MB/s or more
 * (under 1 s). Run with `npm run bench`; mean time per operation is what to compare.
 * Inputs are generated here (invented numbers).
 */
import { bench, describe } from 'vitest';
import { convertDelayBatch, type DelayBatch } from '../../src/io/delay-batch';
import { delayResultsToCsv } from '../../src/io/delay-results-csv';
import { TraceCsvParser } from '../../src/io/trace-csv';
import { pickTraceArrival } from '../../src/io/trace-pick';
import { convertDelay } from '../../src/physics';

const DELAYS = 100_000;
// 2.3–2.7 ms at 50 mm: 18.5–21.7 m/s, so most readings have three candidates.
const batch: DelayBatch = {
  rows: Array.from({ length: DELAYS }, (_, i) => {
    const delay_s = 2.3e-3 + (0.4e-3 * i) / DELAYS;
    return { line: i + 2, delayAsWritten: delay_s, delay_s };
  }),
  delayColumn: 'delay_s',
  hasTimestamp: false,
  hasPressure: false,
};

/** A trace CSV of about `megabytes` MB: time in µs, a heater drive and a noisy sensor with one pulse. */
function traceBytes(megabytes: number): Uint8Array {
  const lines: string[] = ['# invented digitiser export', 'Time (us),heater,sensor'];
  let size = 0;
  let random = 12345;
  for (let i = 0; size < megabytes * 1e6; i++) {
    random = (random * 1103515245 + 12345) % 2147483648;
    const t = i - 1000;
    const heater = t >= 0 && t < 100 ? 1 : 0;
    const pulse = t >= 2500 && t < 2600 ? 1e-3 : 0;
    const line = `${t},${heater},${(0.02 + pulse + 5e-5 * (random / 2147483648 - 0.5)).toExponential(6)}`;
    lines.push(line);
    size += line.length + 1;
  }
  return new TextEncoder().encode(`${lines.join('\n')}\n`);
}

const TRACE = traceBytes(50);
const CHUNK = 1 << 20;
let sink = 0;

describe('delay conversion', () => {
  bench(
    `${DELAYS} delays → speed and all candidates (convertDelayBatch)`,
    () => {
      sink += convertDelayBatch(batch, { distance_m: 0.05, delaySd_s: 1e-6 }).count;
    },
    { iterations: 5, time: 0, warmupIterations: 1 },
  );

  bench(
    `${DELAYS} delays, the kernel's convertDelay alone`,
    () => {
      for (const row of batch.rows) {
        sink += convertDelay({ distance_m: 0.05, delay_s: row.delay_s, distanceSd_m: 0, delaySd_s: 1e-6, offset_s: 0, offsetSd_s: 0 }).candidates.length;
      }
    },
    { iterations: 5, time: 0, warmupIterations: 1 },
  );

  bench(
    `${DELAYS} delays → results CSV text`,
    () => {
      sink += delayResultsToCsv(convertDelayBatch(batch, { distance_m: 0.05 })).length;
    },
    { iterations: 3, time: 0, warmupIterations: 1 },
  );
});

describe(`trace CSV (${(TRACE.length / 1e6).toFixed(1)} MB)`, () => {
  bench(
    'parse in 1 MiB chunks and pick (fraction picker, heater onset): MB/s = size / mean time',
    () => {
      const parser = new TraceCsvParser({ totalBytes: TRACE.length });
      for (let i = 0; i < TRACE.length; i += CHUNK) parser.feed(TRACE.subarray(i, i + CHUNK));
      const trace = parser.finish();
      const pick = pickTraceArrival(trace, { picker: 'fraction', heater: 'heater', sensor: 'sensor' });
      sink += pick.delay_s + trace.metadata.rows;
    },
    { iterations: 3, time: 0, warmupIterations: 1 },
  );

  bench('sanity: the benchmarked work produced finite numbers', () => {
    if (!Number.isFinite(sink)) throw new Error('benchmark produced a non-finite sum');
  });
});
