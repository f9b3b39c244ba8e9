/**
 * The sweep and lock-in CSV readers (src/io/resonance-csv.ts): column names with units, the
 * alternative names the issue lists, and one-line refusals naming the column, the line and the range.
 * The demo files are what tests/support/resonator-demo.ts makes.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CsvInputError } from '../../src/io/csv-common';
import { parseLockinCsv, parseSweepCsv } from '../../src/io/resonance-csv';
import { DEMO_LOCKIN_PATH, DEMO_REFERENCE_PATH, DEMO_SWEEP_PATH, demoLockinCsv, demoReferenceCsv, demoSweepCsv } from '../support/resonator-demo';

function rows(n: number, make: (i: number) => string): string {
  return Array.from({ length: n }, (_, i) => make(i)).join('\n');
}

describe('sweep CSV', () => {
  it('reads frequency_Hz, x, y', () => {
    const s = parseSweepCsv(`frequency_Hz,x,y\n${rows(12, (i) => `${1000 + i},${i},${-i}`)}\n`);
    expect(s.kind).toBe('complex');
    expect(Array.from(s.frequency_Hz.slice(0, 2))).toEqual([1000, 1001]);
    expect(s.y?.[3]).toBe(-3);
    expect(s.lines[0]).toBe(2);
  });
  it.each([
    ['frequency_kHz,X,Y', 1e3, 1],
    ['freq (MHz),in_phase,quadrature', 1e6, 1],
    ['frequency,x_mV,y_mV', 1, 1e-3],
    ['Frequency_Hz;x (uV);y (uV)', 1, 1e-6],
  ])('scales by the units in "%s"', (header, fScale, vScale) => {
    const sep = header.includes(';') ? ';' : ',';
    const s = parseSweepCsv(`${header}\n${rows(12, (i) => [1 + i, 2, 3].join(sep))}\n`);
    expect(s.frequency_Hz[0]).toBeCloseTo(fScale, 9);
    expect(s.x?.[0]).toBeCloseTo(2 * vScale, 15);
  });
  it('reads amplitude alone', () => {
    const s = parseSweepCsv(`frequency_Hz,amplitude\n${rows(12, (i) => `${10 + i},1`)}\n`);
    expect(s.kind).toBe('amplitude');
    expect(s.amplitude?.length).toBe(12);
  });
  it.each([
    ['x,y\n1,2\n', /no column "frequency_Hz"/],
    ['frequency_Hz,x\n1,2\n', /no column "y"/],
    ['frequency_Hz,z\n1,2\n', /no column "x and y, or amplitude"/],
    [`frequency_Hz,x,y\n${rows(12, (i) => `${i === 5 ? 'abc' : 100 + i},1,1`)}\n`, /line 7: column "frequency_Hz": "abc" is not a finite number/],
    [`frequency_Hz,x,y\n${rows(12, (i) => `${i === 5 ? 101 : 100 + i},1,1`)}\n`, /line 7: .*rise \(or fall\) steadily/],
    [`frequency_Hz,x,y\n${rows(12, (i) => `${i === 3 ? 0 : 100 + i},1,1`)}\n`, /line 5: .*outside the valid range 0\.001–100000000 Hz/],
    ['frequency_Hz,x,y\n1,1,1\n2,1,1\n', /at least 12 rows, got 2/],
    [`frequency_Hz,x,y\n${rows(12, (i) => `${100 + i},,1`)}\n`, /column "x": empty cell/],
  ])('refuses %j in one line', (text, message) => {
    let error: unknown;
    try {
      parseSweepCsv(text);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(CsvInputError);
    expect((error as Error).message).toMatch(message);
    expect((error as Error).message).not.toContain('\n');
  });
});

describe('lock-in CSV', () => {
  it('reads time_s, x, y (and time_ms scales)', () => {
    const r = parseLockinCsv('time_ms,X,Y\n0,1,2\n50,1,2\n');
    expect(Array.from(r.time_s)).toEqual([0, 0.05]);
  });
  it.each([
    ['time_s,x\n0,1\n', /no column "y"/],
    ['x,y\n0,1\n', /no column "time_s"/],
    ['time_s,x,y\n0,1,1\n0,1,1\n', /line 3: .*times must increase/],
  ])('refuses %j', (text, message) => {
    expect(() => parseLockinCsv(text)).toThrow(message);
  });
});

describe('the demo files (public/demo-resonator-*.csv)', () => {
  it.each([
    [DEMO_REFERENCE_PATH, demoReferenceCsv],
    [DEMO_SWEEP_PATH, demoSweepCsv],
    [DEMO_LOCKIN_PATH, demoLockinCsv],
  ])('%s is what tests/support/resonator-demo.ts makes (run it again after changing the model)', (path, make) => {
    expect(make()).toBe(readFileSync(join(process.cwd(), path), 'utf8'));
  });
});
