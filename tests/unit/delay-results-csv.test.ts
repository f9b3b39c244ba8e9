/**
 * A delay batch written block by block (delayBatchCsvBytes: no pressures, so no later row settles
 * an earlier one) gives the bytes of the batch converted whole and written (delayResultsToCsv),
 * refuses a bad row before writing anything, with the whole conversion's message; and the branch
 * tables' bracketed search finds the node a search of the whole table finds. Delays are invented;
 * the checks compare the program with itself (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { CsvInputError } from '../../src/io/csv-common';
import { convertDelayBatch, type DelayBatchSettings, parseDelayCsv } from '../../src/io/delay-batch';
import { delayBatchCsvBytes, delayResultCsvBytes, delayResultsToCsv } from '../../src/io/delay-results-csv';
import { branches, interpolateOnBranch } from '../../src/physics/second-sound-branches';

/** Speeds over the whole curve: near Tλ, about both extrema, in the model region, and between. */
function variedDelays(rows: number, withDistance: boolean): string {
  const speeds = [0.2, 0.9, 4.9, 12.7, 18.3392, 18.34, 18.5, 19.0, 20.3698, 20.38, 20.1, 25, 60, 110, 134.5];
  const lines = [withDistance ? 'timestamp,delay_ms,distance_mm' : 'timestamp,delay_ms'];
  for (let i = 0; i < rows; i++) {
    const u = (speeds[i % speeds.length] as number) * (1 + 1e-4 * Math.sin(i));
    const d_mm = withDistance && i % 4 === 1 ? 12.5 : 50;
    const delay_ms = d_mm / u;
    lines.push(`t${i},${i % 3 === 0 ? delay_ms.toPrecision(9) : String(delay_ms)}${withDistance ? `,${i % 4 === 1 ? '12.5' : ''}` : ''}`);
  }
  return `${lines.join('\n')}\n`;
}

const decode = (chunks: Iterable<Uint8Array>) => {
  const decoder = new TextDecoder();
  let text = '';
  for (const c of chunks) text += decoder.decode(c);
  return text;
};

describe('delayBatchCsvBytes writes a batch block by block, the same bytes as converted whole', () => {
  const cases: [string, DelayBatchSettings][] = [
    ['timing sd, start by continuity', { distance_m: 0.05, delaySd_s: 1e-6 }],
    ['every sd and an offset, start near 1.8 K', { distance_m: 0.05, delaySd_s: 2e-6, distanceSd_m: 2e-5, offset_s: 1e-6, offsetSd_s: 5e-7, start: { kind: 'near', temperature_K: 1.8 } }],
    ['no sds', { distance_m: 0.05 }],
  ];
  it.each(cases)('%s: blocks of 1, 7 and 100 rows', (_name, settings) => {
    for (const withDistance of [false, true]) {
      const batch = parseDelayCsv(variedDelays(400, withDistance), { column: 'delay_ms' });
      const whole = delayResultsToCsv(convertDelayBatch(batch, settings));
      for (const blockRows of [1, 7, 100]) expect(decode(delayBatchCsvBytes(batch, settings, {}, 1 << 12, blockRows))).toBe(whole);
      expect(decode(delayResultCsvBytes(convertDelayBatch(batch, settings), {}, 1 << 12))).toBe(whole);
    }
  });

  it('a batch with pressures is converted whole (a later pressure settles earlier rows): the same bytes', () => {
    const text = 'delay_ms,pressure_Pa\n2.729,\n2.7288,\n2.7285,\n2.7282,1500\n2.728,\n';
    const batch = parseDelayCsv(text, { column: 'delay_ms' });
    const settings = { distance_m: 0.05, delaySd_s: 1e-6 };
    expect(decode(delayBatchCsvBytes(batch, settings, {}, 1 << 12, 1))).toBe(delayResultsToCsv(convertDelayBatch(batch, settings)));
  });

  it.each([
    ['a speed slower than any second sound', '2.5\n2.6\n500\n'],
    ['a speed faster than u₂ at 0.3 K', '2.5\n2.6\n0.1\n'],
    ['a delay below its range', '2.5\n2.6\n-1\n'],
  ])('refuses %s before writing anything, with the message of the whole conversion', (_name, rows) => {
    const batch = parseDelayCsv(`delay_ms\n${rows}`, { column: 'delay_ms' });
    const settings = { distance_m: 0.05, delaySd_s: 1e-6 };
    let whole: unknown;
    try {
      convertDelayBatch(batch, settings);
    } catch (error) {
      whole = error;
    }
    expect(whole).toBeInstanceOf(CsvInputError);
    expect(() => delayBatchCsvBytes(batch, settings, {}, 1 << 12, 1)).toThrow((whole as Error).message);
  });

  it('refuses a row without a distance, naming its line', () => {
    const batch = parseDelayCsv('delay_ms,distance_mm\n2.5,50\n2.5,\n', { column: 'delay_ms' });
    expect(() => delayBatchCsvBytes(batch, {}, {}, 1 << 12, 1)).toThrow('line 3: no distance');
  });
});

describe('the branch inverse searches from the bracket of its speed step', () => {
  it('finds the node (and so the guess) a search of the whole table finds, for every node speed, its neighbours and random speeds', () => {
    let bad = 0;
    let random = 12345;
    for (const b of branches()) {
      const s = b.speeds;
      const whole = (u: number) => {
        let i = 0;
        let j = s.length - 1;
        while (j - i > 1) {
          const mid = (i + j) >> 1;
          if (u >= (s[mid] as number)) i = mid;
          else j = mid;
        }
        const s0 = s[i] as number;
        const s1 = s[j] as number;
        const t0 = b.temps[i] as number;
        const t1 = b.temps[j] as number;
        return s1 > s0 ? t0 + ((u - s0) * (t1 - t0)) / (s1 - s0) : t0;
      };
      const speeds = [b.slowest, b.fastest];
      for (const v of s) speeds.push(v, v * (1 + 2 ** -52), v * (1 - 2 ** -53));
      for (let k = 0; k < 50_000; k++) {
        random = (random * 1103515245 + 12345) % 2147483648;
        speeds.push(b.slowest + (random / 2147483648) * (b.fastest - b.slowest));
      }
      for (const u of speeds) if (u >= b.slowest && u <= b.fastest && interpolateOnBranch(b, u) !== whole(u)) bad++;
    }
    expect(bad).toBe(0);
  });
});
