/**
 * Delay batches (src/io/delay-batch) and distance-fit input (src/io/fit-csv): reading, the
 * per-row choice of temperature, the CSV written back, and malformed files refused by line.
 * Delays and distances here are invented; expected speeds are d/t by arithmetic, and the
 * temperature 1.800 K at 1638.2 Pa is ITS-90's helium-4 vapour-pressure scale.
 */
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { CsvInputError, writeCsv } from '../../src/io/csv-common';
import {
  convertDelayBatch,
  DEFAULT_DELAY_COLUMN,
  type DelayBatch,
  type DelayBatchSettings,
  delayResultHeader,
  delayResultList,
  parseDelayCsv,
} from '../../src/io/delay-batch';
import { delayResultsToCsv } from '../../src/io/delay-results-csv';
import { parseFitCsv } from '../../src/io/fit-csv';
import { convertDelay, fitDistances, temperatureFromVapourPressure } from '../../src/physics';

const ITS90_1638_PA_K = 1.8; // ITS-90 helium-4 vapour pressure: 1638.2 Pa at 1.800 K (to 0.5 mK)

function errorOf(f: () => unknown): CsvInputError {
  try {
    f();
  } catch (error) {
    if (error instanceof CsvInputError) return error;
    throw error;
  }
  throw new Error('expected a CsvInputError');
}

/** The results of a batch, one object per row. */
function convert(batch: DelayBatch, settings: DelayBatchSettings) {
  return delayResultList(convertDelayBatch(batch, settings));
}

/** Reads CSV text back into rows of cells (papaparse, RFC 4180). */
function readBack(text: string): string[][] {
  return Papa.parse<string[]>(text.trimEnd(), { delimiter: ',' }).data;
}

const BATCH = [
  'timestamp,delay_s,pressure_Pa,note',
  '2031-05-04T10:00:00,0.0025,1638.2,start',
  '# a comment between readings',
  '2031-05-04T10:00:10,0.00251,,',
  '',
  '2031-05-04T10:00:20,0.00252,,',
  '"2031-05-04T10:00:30, late",0.0024,,',
].join('\n');

describe('reading a delay batch', () => {
  const batch = parseDelayCsv(BATCH);

  it('takes delay_s, pressure_Pa and timestamp, with the line of each row; other columns are ignored', () => {
    expect(batch.delayColumn).toBe(DEFAULT_DELAY_COLUMN);
    expect(batch.rows.map((r) => r.line)).toEqual([2, 4, 6, 7]);
    expect(batch.rows.map((r) => r.delay_s)).toEqual([0.0025, 0.00251, 0.00252, 0.0024]);
    expect(batch.rows.map((r) => r.pressure_Pa)).toEqual([1638.2, undefined, undefined, undefined]);
    expect(batch.rows[3]?.timestamp).toBe('2031-05-04T10:00:30, late');
    expect(batch.hasTimestamp && batch.hasPressure).toBe(true);
  });

  it('reads a named delay column with a unit in its name, and distances per row', () => {
    const b = parseDelayCsv('delay_ms,distance_mm\n2.5,50\n2.6,\n', { column: 'delay_ms' });
    expect(b.rows.map((r) => r.delay_s)).toEqual([0.0025, 0.0026]);
    expect(b.rows.map((r) => r.delayAsWritten)).toEqual([2.5, 2.6]);
    expect(b.rows.map((r) => r.distance_m)).toEqual([0.05, undefined]);
  });

  it('finds delay_us on its own when delay_s is absent', () => {
    expect(parseDelayCsv('delay_us\n2500\n').rows[0]?.delay_s).toBe(0.0025);
  });

  it('reads a semicolon file with decimal commas, CRLF line ends and a byte-order mark', () => {
    const b = parseDelayCsv(new TextEncoder().encode('\ufeffdelay_s;pressure_Pa\r\n0,0025;1638,2\r\n0,00251;\r\n'));
    expect(b.rows.map((r) => r.delay_s)).toEqual([0.0025, 0.00251]);
    expect(b.rows[0]?.pressure_Pa).toBe(1638.2);
  });

  const bad: readonly [name: string, input: string, options: { column?: string }, fragments: readonly string[]][] = [
    ['empty file', '', {}, ['empty']],
    ['no delay column', 'time,tof\n1,2\n', {}, ['line 1', 'no column "delay_s"', 'columns: time, tof']],
    ['no such named column', 'delay_s\n0.0025\n', { column: 'tof' }, ['no column "tof"', 'columns: delay_s']],
    ['a row that is not a number', 'delay_s\n0.0025\n2.5 ms\n', {}, ['line 3', 'column "delay_s"', '"2.5 ms" is not a number']],
    ['NaN', 'delay_s\n0.0025\nNaN\n', {}, ['line 3', 'not a finite number']],
    ['an empty delay', 'delay_s,timestamp\n,a\n', {}, ['line 2', 'empty cell']],
    ['a ragged row', 'delay_s,distance_m\n0.0025,0.05\n0.0026\n', {}, ['line 3', 'ragged row', '1 cells', 'header (line 1) has 2']],
    ['mixed delimiters', 'delay_s,distance_m\n0.0025,0.05\n0.0026;0.05\n', {}, ['line 3', 'mixed delimiters']],
    ['numbers where the header should be', '0.0025\n0.0026\n', {}, ['line 1', 'header row']],
    ['header only', 'delay_s\n', {}, ['no delays after the header']],
    ['binary', 'delay_s\n\u0000\u0001\n', {}, ['line 2', 'binary']],
  ];
  it.each(bad)('refuses %s, naming the line and the problem', (_name, input, options, fragments) => {
    const error = errorOf(() => parseDelayCsv(input, options));
    for (const fragment of fragments) expect(error.message).toContain(fragment);
  });
});

describe('converting a batch and choosing temperatures', () => {
  it('speed d/t on every row, all candidates, pressure then continuity', () => {
    const batch = parseDelayCsv(BATCH);
    const results = convert(batch, { distance_m: 0.05 });
    expect(results.map((r) => r.speed_m_s)).toEqual(batch.rows.map((r) => 0.05 / r.delay_s));
    // 20 m/s lies between the minimum (18.34) and maximum (20.37) of u2: three temperatures.
    expect(results[0]?.candidates.map((c) => c.branch)).toEqual(['low', 'middle', 'high']);
    expect(results.map((r) => r.chosenBy)).toEqual(['pressure', 'continuity', 'continuity', 'continuity']);
    // The pressure row: the candidate nearest 1.800 K.
    const first = results[0];
    const chosen = first?.candidates[first.chosen ?? -1];
    expect(first?.chosen).toBe(2);
    expect(Math.abs((chosen?.temperature_K ?? 0) - ITS90_1638_PA_K)).toBeLessThan(0.02);
    // Continuity keeps the high branch while it exists; at 20.8 m/s (above the maximum) only one is left.
    expect(results[1]?.candidates[results[1].chosen ?? -1]?.branch).toBe('high');
    expect(results[3]?.candidates).toHaveLength(1);
    expect(results[3]?.chosen).toBe(0);
  });

  it('keeps the results as typed-array columns: candidate k of row i at 3i + k, NaN where absent', () => {
    const columns = convertDelayBatch(parseDelayCsv('delay_s\n0.0025\n0.0024\n'), { distance_m: 0.05 });
    expect(columns.count).toBe(2);
    expect(Array.from(columns.candidateCount)).toEqual([3, 1]);
    expect(columns.temperature_K).toBeInstanceOf(Float64Array);
    expect(Number.isNaN(columns.temperature_K[4])).toBe(true); // row 1 has one candidate
    expect(Array.from(columns.chosen)).toEqual([-1, 0]);
    expect(delayResultList(columns)[0]?.candidates).toEqual(convertDelay({ distance_m: 0.05, delay_s: 0.0025, distanceSd_m: 0, delaySd_s: 0, offset_s: 0, offsetSd_s: 0 }).candidates);
  });

  it('a later pressure row starts a new run', () => {
    const batch = parseDelayCsv('delay_s,pressure_Pa\n0.0025,1638.2\n0.0025,\n0.0025,300\n0.0025,\n');
    const results = convert(batch, { distance_m: 0.05 });
    expect(results.map((r) => r.chosenBy)).toEqual(['pressure', 'continuity', 'pressure', 'continuity']);
    // 300 Pa is about 1.4 K (ITS-90): the middle branch.
    expect(temperatureFromVapourPressure(300).temperature_K).toBeGreaterThan(1.35);
    expect(results.map((r) => r.chosen)).toEqual([2, 2, 1, 1]);
  });

  it('without a pressure: the start rule, else the first row with a single candidate', () => {
    const batch = parseDelayCsv('delay_s\n0.0025\n0.0025\n0.0024\n0.0025\n');
    const plain = convert(batch, { distance_m: 0.05 });
    expect(plain.map((r) => r.chosenBy)).toEqual([null, null, 'only candidate', 'continuity']);
    expect(plain.map((r) => r.chosen)).toEqual([null, null, 0, 0]);
    const near = convert(batch, { distance_m: 0.05, start: { kind: 'near', temperature_K: 1.8 } });
    expect(near.map((r) => r.chosenBy)).toEqual(['near', 'continuity', 'continuity', 'continuity']);
    expect(near[0]?.chosen).toBe(2);
  });

  it('uses each row distance before the default and the sds for every row', () => {
    const batch = parseDelayCsv('delay_s,distance_m\n0.0025,0.04\n0.0025,\n');
    const results = convert(batch, { distance_m: 0.05, distanceSd_m: 2e-5, delaySd_s: 1e-6 });
    expect(results.map((r) => r.distance_m)).toEqual([0.04, 0.05]);
    const rel = Math.hypot(2e-5 / 0.05, 1e-6 / 0.0025);
    expect(results[1]?.speedSd_m_s).toBeCloseTo(20 * rel, 12);
  });

  it('refuses a row without any distance, and a row the kernel refuses, by line', () => {
    const noDistance = parseDelayCsv('delay_s,distance_m\n0.0025,0.05\n0.0025,\n');
    expect(errorOf(() => convert(noDistance, {})).message).toBe('line 3: no distance: give a default distance or a distance_m cell');
    const tooFast = parseDelayCsv('delay_s\n0.0025\n1e-6\n');
    const error = errorOf(() => convert(tooFast, { distance_m: 0.05 }));
    expect(error.message).toMatch(/^line 3: speed .* is outside the valid range/);
  });
});

describe('the results as CSV', () => {
  const batch = parseDelayCsv(BATCH);
  const columns = convertDelayBatch(batch, { distance_m: 0.05 });
  const results = delayResultList(columns);
  const text = delayResultsToCsv(columns);
  const rows = readBack(text);

  it('has a fixed header and one row per input row', () => {
    expect(rows[0]).toEqual(delayResultHeader(batch));
    expect(rows[0]?.slice(0, 23)).toEqual([
      'line',
      'timestamp',
      'delay_s',
      'distance_m',
      'pressure_Pa',
      'speed_m_s',
      'speedSd_m_s',
      'candidates',
      'chosen',
      'chosen_by',
      'T_K',
      'T_sd_K',
      'T_sd_meas_K',
      'T_sd_curve_K',
      'T_lo68_K',
      'T_hi68_K',
      'T_lo95_K',
      'T_hi95_K',
      'evidence_sd',
      'alternatives',
      'guess',
      'warnings',
      'T1_K',
    ]);
    expect(rows[0]?.slice(-4)).toEqual(['T3_K', 'T3_sd_K', 'T3_branch', 'T3_note']);
    expect(rows).toHaveLength(1 + batch.rows.length);
    for (const row of rows) expect(row).toHaveLength(rows[0]?.length ?? 0);
  });

  it('writes numbers that read back to the same doubles, quotes text that needs it, leaves absent cells empty', () => {
    const first = rows[1] ?? [];
    const header = rows[0] ?? [];
    const cell = (row: string[], name: string) => row[header.indexOf(name)] ?? '';
    expect(Number(cell(first, 'speed_m_s'))).toBe(results[0]?.speed_m_s);
    expect(Number(cell(first, 'T3_K'))).toBe(results[0]?.candidates[2]?.temperature_K);
    expect(cell(first, 'chosen')).toBe('3');
    expect(cell(first, 'T_K')).toBe(cell(first, 'T3_K'));
    expect(cell(rows[4] ?? [], 'timestamp')).toBe('2031-05-04T10:00:30, late');
    expect(text).toContain('"2031-05-04T10:00:30, late"');
    expect(cell(rows[4] ?? [], 'T2_K')).toBe('');
    expect(cell(rows[2] ?? [], 'pressure_Pa')).toBe('');
    expect(text.endsWith('\n')).toBe(true);
    expect(text).not.toContain('\r');
  });

  it('echoes a named delay column in its own unit', () => {
    const b = parseDelayCsv('delay_ms\n2.5\n', { column: 'delay_ms' });
    const back = readBack(delayResultsToCsv(convertDelayBatch(b, { distance_m: 0.05 })));
    expect(back[0]?.slice(0, 4)).toEqual(['line', 'delay_ms', 'distance_m', 'speed_m_s']);
    expect(back[1]?.slice(0, 4)).toEqual(['2', '2.5', '0.05', '20']);
  });

  it('the writer can end lines with CRLF', () => {
    expect(writeCsv(['a', 'b'], [[1, 'x']], '\r\n')).toBe('a,b\r\n1,x\r\n');
  });
});

describe('distance-fit input', () => {
  // Invented exact data: u2 = 20 m/s and t0 = 100 µs at 10, 20, 30 and 40 mm.
  const SPEED = 20;
  const OFFSET = 100e-6;
  const distances = [0.01, 0.02, 0.03, 0.04];
  const exact = ['distance_m,delay_s', ...distances.map((d) => `${d},${OFFSET + d / SPEED}`)].join('\n');

  it('reads distance_m and delay_s and fitDistances recovers the speed and the offset', () => {
    const input = parseFitCsv(exact);
    expect(input.lines).toEqual([2, 3, 4, 5]);
    const fit = fitDistances(input.points);
    // Exact data: only rounding remains (the delays were written with 17 significant digits).
    expect(Math.abs(fit.speed_m_s - SPEED)).toBeLessThan(1e-9);
    expect(Math.abs(fit.offset_s - OFFSET)).toBeLessThan(1e-15);
    for (const r of fit.residuals_s) expect(Math.abs(r)).toBeLessThan(1e-15);
  });

  it('reads units from the names and delay sds on every row (a weighted fit)', () => {
    const text = ['distance_mm;delay_us;delay_sd_us', ...distances.map((d) => `${d * 1000};${(OFFSET + d / SPEED) * 1e6};1`)].join('\n');
    const input = parseFitCsv(text);
    expect(input.points[0]).toEqual({ distance_m: 0.01, delay_s: (OFFSET + 0.01 / SPEED) * 1e6 / 1e6, delaySd_s: 1e-6 });
    const fit = fitDistances(input.points);
    expect(fit.weighted).toBe(true);
    expect(fit.speed_m_s).toBeCloseTo(SPEED, 9);
  });

  const bad: readonly [name: string, input: string, fragments: readonly string[]][] = [
    ['no distance column', 'd,delay_s\n1,2\n', ['no column "distance_m"', 'columns: d, delay_s']],
    ['no delay column', 'distance_m,t\n1,2\n', ['no column "delay_s"']],
    ['a bad cell', 'distance_m,delay_s\n0.01,0.0006\n0.02,x\n0.03,0.0016\n', ['line 3', 'column "delay_s"', '"x" is not a number']],
    ['a distance out of range', 'distance_m,delay_s\n0.01,0.0006\n-0.02,0.0011\n0.03,0.0016\n', ['line 3', 'distance_m', 'outside the valid range']],
    ['sds on some rows only', 'distance_m,delay_s,delay_sd_s\n0.01,0.0006,1e-6\n0.02,0.0011,\n0.03,0.0016,1e-6\n', ['line 3', 'every row or on none']],
    ['a zero sd', 'distance_m,delay_s,delay_sd_s\n0.01,0.0006,0\n0.02,0.0011,1e-6\n0.03,0.0016,1e-6\n', ['line 2', 'above 0']],
    ['too few rows', 'distance_m,delay_s\n0.01,0.0006\n0.02,0.0011\n', ['at least 3 rows', 'got 2']],
  ];
  it.each(bad)('refuses %s', (_name, input, fragments) => {
    const error = errorOf(() => parseFitCsv(input));
    for (const fragment of fragments) expect(error.message).toContain(fragment);
  });
});
