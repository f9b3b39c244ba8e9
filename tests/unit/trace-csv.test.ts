/**
 * Trace CSV reading (src/io/trace-csv): delimiters, header lines, names, units, numbers, streaming
 * in any chunking, progress, cancellation, and every malformed file refused with a message that
 * names the problem and the line. All files here are invented in the tests.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CsvInputError, csvCell, readNumberCell } from '../../src/io/csv-common';
import { alignToHeaterOnset, channelByName } from '../../src/io/trace-channels';
import { parseTraceCsvBlob } from '../../src/io/trace-csv-stream';
import {
  parseTraceCsv,
  TRACE_CSV_SIZE_LIMIT_BYTES,
  type TraceCsv,
  TraceCsvParser,
  type TraceParseProgress,
} from '../../src/io/trace-csv';

const SRC_IO = fileURLToPath(new URL('../../src/io', import.meta.url));

/** A small trace: time in seconds and two channels, as rows of numbers. */
const ROWS: readonly (readonly number[])[] = [
  [-2e-6, 0, 0.0201],
  [-1e-6, 0, 0.0199],
  [0, 1, 0.02],
  [1e-6, 1, 0.0213],
  [2e-6, 0, 0.0251],
];

function csv(delimiter: string, header: string | null, rows = ROWS, format = (x: number) => String(x)): string {
  const lines = rows.map((r) => r.map(format).join(delimiter));
  return `${[...(header === null ? [] : [header]), ...lines].join('\n')}\n`;
}

function columns(trace: TraceCsv): number[][] {
  return [Array.from(trace.time_s), ...trace.channels.map((c) => Array.from(c.values))];
}

/** The CsvInputError thrown by `f` (fails the test if none is). */
function errorOf(f: () => unknown): CsvInputError {
  try {
    f();
  } catch (error) {
    if (error instanceof CsvInputError) return error;
    throw error;
  }
  throw new Error('expected a CsvInputError');
}

const EXPECTED_COLUMNS = [0, 1, 2].map((j) => ROWS.map((r) => r[j] as number));

describe('delimiters, header lines and column names', () => {
  it.each([
    ['comma', ','],
    ['semicolon', ';'],
    ['tab', '\t'],
  ])('reads a %s-delimited file with a header row', (_name, d) => {
    const trace = parseTraceCsv(csv(d, ['time', 'heater', 'sensor'].join(d)));
    expect(trace.metadata.delimiter).toBe(d);
    expect(columns(trace)).toEqual(EXPECTED_COLUMNS);
    expect(trace.channels.map((c) => c.name)).toEqual(['heater', 'sensor']);
    expect(trace.metadata.timeColumn).toBe('time');
  });

  it('reads a decimal comma in a semicolon-delimited file (and says so)', () => {
    const text = csv(';', 'Zeit;Heizer;Sensor', ROWS, (x) => String(x).replace('.', ','));
    const trace = parseTraceCsv(text.replace('Zeit', 'time'));
    expect(columns(trace)).toEqual(EXPECTED_COLUMNS);
    expect(trace.metadata.decimalComma).toBe(true);
  });

  it('reads a decimal comma in a tab-delimited file too', () => {
    const trace = parseTraceCsv('t\tv\n0,5\t1,25e-3\n1\t2\n1,5\t3\n');
    expect(columns(trace)).toEqual([
      [0.5, 1, 1.5],
      [1.25e-3, 2, 3],
    ]);
  });

  it('skips any number of header and comment lines and keeps them as metadata', () => {
    const header = ['# Invented bench, shot 17', 'Sample rate: 1 MS/s', 'Operator = nobody', 'Record,5', '', 'time,heater,sensor'];
    const trace = parseTraceCsv(`${header.join('\r\n')}\r\n${csv(',', null).replace(/\n/g, '\r\n')}`);
    expect(columns(trace)).toEqual(EXPECTED_COLUMNS);
    expect(trace.metadata.headerLines).toEqual(header);
    expect(trace.metadata.firstDataLine).toBe(7);
    expect(trace.metadata.fields).toMatchObject({ 'Sample rate': '1 MS/s', Operator: 'nobody', Record: '5' });
  });

  it('names columns col1… when there is no header line', () => {
    const trace = parseTraceCsv(csv(',', null));
    expect(trace.metadata.columns).toEqual(['col1', 'col2', 'col3']);
    expect(trace.metadata.timeColumn).toBe('col1');
    expect(trace.timeUnit).toBeUndefined();
  });

  it('names columns col1… when the last header line does not fit the data', () => {
    expect(parseTraceCsv(`time,a\n${csv(',', null)}`).metadata.columns).toEqual(['col1', 'col2', 'col3']);
  });

  it('takes names from a "#"-commented header line and makes repeated names unique', () => {
    const trace = parseTraceCsv(`# t, ch, ch\n${csv(',', null)}`);
    expect(trace.metadata.columns).toEqual(['t', 'ch', 'ch_2']);
  });

  it.each([
    ['t', 0],
    ['s', 0],
    ['TIME', 0],
    ['Time (s)', 0],
    ['time [ms]', 3],
    ['t_us', 6],
    ['Time/µs', 6],
    ['TIME_NS', 9],
  ])('finds the time column by its name "%s" wherever it is, and divides it by 10^%i', (name, pow10) => {
    const trace = parseTraceCsv(`a,${name},b\n1,10,2\n2,20,3\n3,30,4\n`);
    expect(trace.metadata.timeColumn).toBe(name);
    // One correctly rounded division, as the unit tables of src/io/quantity do.
    expect(Array.from(trace.time_s)).toEqual([10, 20, 30].map((x) => x / 10 ** pow10));
    expect(trace.channels.map((c) => c.name)).toEqual(['a', 'b']);
  });

  it('takes the first column as time when no name looks like time; a named column on request', () => {
    expect(parseTraceCsv('x1,x2\n0,5\n1,4\n2,3\n').metadata.timeColumn).toBe('x1');
    const chosen = parseTraceCsv('x1,x2\n5,0\n4,1\n3,2\n', { timeColumn: 'X2' });
    expect(chosen.metadata.timeColumn).toBe('x2');
    expect(Array.from(chosen.time_s)).toEqual([0, 1, 2]);
    expect(Array.from(chosen.channels[0]?.values ?? [])).toEqual([5, 4, 3]);
  });

  it('accepts one trailing delimiter at the end of every row', () => {
    expect(columns(parseTraceCsv('t,v,\n0,1,\n1,2,\n2,3,\n'))).toEqual([
      [0, 1, 2],
      [1, 2, 3],
    ]);
  });

  it('reads several channels', () => {
    const rows = Array.from({ length: 50 }, (_, i) => [i * 1e-6, ...Array.from({ length: 7 }, (_, k) => Math.sin(i + k))]);
    const trace = parseTraceCsv(csv(',', `time,${Array.from({ length: 7 }, (_, k) => `ch${k}`).join(',')}`, rows));
    expect(trace.channels).toHaveLength(7);
    expect(Array.from(channelByName(trace, 'ch3').values)).toEqual(rows.map((r) => r[4]));
  });

  it('skips blank and "#" lines inside the data', () => {
    const trace = parseTraceCsv('t,v\n0,1\n\n1,2\n# pause\n2,3\n   \n');
    expect(trace.metadata.rows).toBe(3);
    expect(trace.metadata.skippedLines).toBe(3);
  });
});

describe('numbers', () => {
  it('reads scientific notation, signs, spaces and quoted cells', () => {
    const trace = parseTraceCsv('t,v\n-1.5E-06, +2.5e+03\n0,"-7.25e-1"\n1e-6 , .5\n2.0E-6,-0\n');
    expect(Array.from(trace.time_s)).toEqual([-1.5e-6, 0, 1e-6, 2e-6]);
    expect(Array.from(trace.channels[0]?.values ?? [])).toEqual([2500, -0.725, 0.5, -0]);
  });

  it('reads every double written by String, toExponential and toPrecision exactly as Number does', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e30, max: 1e30 }), { minLength: 3, maxLength: 30 }), fc.integer({ min: 1, max: 17 }), (values, digits) => {
        const formats = [(x: number) => String(x), (x: number) => x.toExponential(digits - 1), (x: number) => x.toPrecision(digits)];
        for (const format of formats) {
          const rows = values.map((v, i) => [i, v]);
          const text = csv(',', 't,v', rows, (x) => (Number.isInteger(x) && x >= 0 && x < 1000 ? String(x) : format(x)));
          const read = Array.from(parseTraceCsv(text).channels[0]?.values ?? []);
          expect(read).toEqual(values.map((v) => Number(format(v))));
        }
      }),
      { numRuns: 200 },
    );
  });

  it('the cell reader refuses empty cells, NaN, infinities and hexadecimal', () => {
    for (const cell of ['', ' ', 'NaN', 'nan', 'Infinity', '-inf', '0x1f', '1e', '--1', '1.2.3']) expect(readNumberCell(cell, false)).toBeNaN();
    expect(readNumberCell('1,5', false)).toBeNaN();
    expect(readNumberCell('1,5', true)).toBe(1.5);
  });
});

describe('streaming', () => {
  const header = '# Invented digitiser export — µs and ° in the header\nTime (µs);heater;sensor\n';
  const body = Array.from({ length: 400 }, (_, i) => `${i - 100};${i > 150 && i < 170 ? '1,0' : '0,0'};${(Math.cos(i) * 1e-3).toExponential(5)}`).join('\r\n');
  const text = `${header}${body}\r\n`;
  const bytes = new TextEncoder().encode(text);
  const whole = parseTraceCsv(bytes);

  function chunked(size: number, asText: boolean): { trace: TraceCsv; progress: TraceParseProgress[] } {
    const progress: TraceParseProgress[] = [];
    const parser = new TraceCsvParser({ totalBytes: asText ? text.length : bytes.length, onProgress: (p) => progress.push(p) });
    const input = asText ? text : bytes;
    for (let i = 0; i < input.length; i += size) parser.feed(input.slice(i, i + size) as string & Uint8Array);
    return { trace: parser.finish(), progress };
  }

  it.each([1, 2, 3, 7, 13, 64, 1000, 4096])('bytes in chunks of %i give the same trace as one chunk', (size) => {
    const { trace } = chunked(size, false);
    expect(columns(trace)).toEqual(columns(whole));
    expect(trace.metadata).toEqual(whole.metadata);
    expect(trace.timeUnit).toBe('us');
  });

  it.each([1, 5, 11, 333])('text in chunks of %i characters gives the same numbers', (size) => {
    const { trace } = chunked(size, true);
    expect(columns(trace)).toEqual(columns(whole));
    expect(trace.metadata.headerLines).toEqual(whole.metadata.headerLines);
  });

  it('progress grows to 1 and says done at the end', () => {
    const { progress } = chunked(997, false);
    const fractions = progress.map((p) => p.fraction ?? Number.NaN);
    for (let i = 1; i < fractions.length; i++) expect(fractions[i]).toBeGreaterThanOrEqual(fractions[i - 1] as number);
    const last = progress[progress.length - 1];
    expect(last).toMatchObject({ fraction: 1, done: true, bytes: bytes.length, rows: 400 });
    expect(progress.slice(0, -1).every((p) => !p.done)).toBe(true);
  });

  it('progress without a known total has no fraction until the end', () => {
    const parser = new TraceCsvParser();
    expect(parser.feed(bytes.subarray(0, 100)).fraction).toBeNull();
    parser.feed(bytes.subarray(100));
    parser.finish();
    expect(parser.progress()).toMatchObject({ fraction: 1, done: true });
  });

  it('cancel stops the parse: later chunks and finish are refused, memory is let go', () => {
    const parser = new TraceCsvParser({ totalBytes: bytes.length });
    parser.feed(bytes.subarray(0, 2000));
    parser.cancel();
    expect(parser.cancelled).toBe(true);
    expect(errorOf(() => parser.feed(bytes.subarray(2000))).problem).toBe('cancelled');
    expect(errorOf(() => parser.finish()).message).toContain('cancelled');
  });

  it('an aborted signal cancels too', () => {
    const controller = new AbortController();
    const parser = new TraceCsvParser({ signal: controller.signal });
    parser.feed(bytes.subarray(0, 500));
    controller.abort();
    expect(parser.cancelled).toBe(true);
    expect(errorOf(() => parser.feed(bytes.subarray(500))).problem).toBe('cancelled');
  });

  it('reads a Blob (as a Web Worker reads a File) through its stream, with progress', async () => {
    const seen: number[] = [];
    const trace = await parseTraceCsvBlob(new Blob([bytes]), { onProgress: (p) => seen.push(p.fraction ?? -1) });
    expect(columns(trace)).toEqual(columns(whole));
    expect(seen[seen.length - 1]).toBe(1);
  });

  it('grows its arrays past an initial guess and trims them to the rows read', () => {
    const rows = Array.from({ length: 20_000 }, (_, i) => `${i},${i % 7}`).join('\n');
    const trace = parseTraceCsv(`t,v\n${rows}\n`, { totalBytes: 100 }); // far too small a guess
    expect(trace.time_s.length).toBe(20_000);
    expect(trace.channels[0]?.values[19_999]).toBe(19_999 % 7);
  });
});

describe('encodings', () => {
  const text = 't,v\n0,1\n1,2\n2,3\n';
  const utf16le = (s: string, bom: boolean) => Uint8Array.from([...(bom ? [0xff, 0xfe] : []), ...Array.from(s).flatMap((c) => [c.charCodeAt(0), 0])]);
  const utf16be = (s: string) => Uint8Array.from([0xfe, 0xff, ...Array.from(s).flatMap((c) => [0, c.charCodeAt(0)])]);

  it('drops a UTF-8 byte-order mark', () => {
    const trace = parseTraceCsv(Uint8Array.from([0xef, 0xbb, 0xbf, ...new TextEncoder().encode(text)]));
    expect(trace.metadata.columns).toEqual(['t', 'v']);
    expect(trace.metadata.encoding).toBe('utf-8');
  });

  it('decodes UTF-16 LE and BE announced by a byte-order mark, in any chunking', () => {
    for (const bytes of [utf16le(text, true), utf16be(text)]) {
      const parser = new TraceCsvParser();
      for (let i = 0; i < bytes.length; i += 3) parser.feed(bytes.subarray(i, i + 3));
      const trace = parser.finish();
      expect(columns(trace)).toEqual([
        [0, 1, 2],
        [1, 2, 3],
      ]);
    }
  });

  it('refuses UTF-16 without a byte-order mark, saying so', () => {
    const error = errorOf(() => parseTraceCsv(utf16le(text, false)));
    expect(error.problem).toBe('binary');
    expect(error.message).toMatch(/^line 1: .*UTF-16.*byte-order mark/);
  });
});

describe('malformed files: the message names the problem and the line', () => {
  const data = 't,v\n0,1\n1,2\n2,3\n3,4\n';
  const cases: readonly [name: string, input: string | Uint8Array, problem: string, fragments: readonly string[]][] = [
    ['empty file', '', 'empty', ['the file is empty']],
    ['only blank lines', '\n \r\n\n', 'empty', ['only blank lines']],
    ['binary (a NUL byte)', 't,v\n0,1\n1,\u00002\n', 'binary', ['line 3', 'binary']],
    ['binary (an image header)', Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), 'binary', ['line 3', 'binary']],
    ['no rows of numbers', 'hello\nworld\n', 'no-data', ['no data rows', 'comma']],
    ['columns split by spaces', 't v\n0 1\n1 2\n2 3\n', 'no-data', ['spaces are not read']],
    ['ragged row (too many cells)', `${data}4,5,6\n`, 'ragged', ['line 6', 'ragged row', '3 cells', 'have 2']],
    ['ragged row (too few cells)', 't,v,w\n0,1,2\n1,2,3\n2,3,4\n3,4\n', 'ragged', ['line 5', 'ragged row', '2 cells', 'have 3']],
    ['ragged row early in the data', 't,v\n0,1\n1,2\n2,3,4\n', 'ragged', ['line 4', 'ragged']],
    ['NaN cell', `${data}4,NaN\n`, 'not-a-number', ['line 6', 'column "v"', '"NaN" is not a finite number']],
    ['NaN cell in the first rows', 't,v\n0,1\n1,nan\n', 'not-a-number', ['line 3', 'column "v"', 'not a finite number']],
    ['infinite cell', `${data}4,-inf\n`, 'not-a-number', ['line 6', 'not a finite number']],
    ['empty cell', `${data}4,\n`, 'not-a-number', ['line 6', 'column "v"', 'empty cell']],
    ['text cell', `${data}4,high\n`, 'not-a-number', ['line 6', '"high" is not a number']],
    ['repeated time', `${data}3,5\n`, 'time-order', ['line 6', 'repeated time', 'must increase']],
    ['time going backwards', `${data}2.5,5\n`, 'time-order', ['line 6', 'backwards', '2.5 after 3']],
    ['mixed delimiters (semicolon in a comma file)', `${data}4;5\n`, 'mixed-delimiters', ['line 6', 'semicolon in a comma-delimited file']],
    ['mixed delimiters (tab in a semicolon file)', 't;v\n0;1\n1;2\n2;3\n3\t4\n', 'mixed-delimiters', ['line 5', 'tab in a semicolon-delimited file']],
    ['mixed delimiters (comma list in a semicolon file)', 't;v\n0;1\n1;2\n2;3\n3;4.5,5.5\n', 'mixed-delimiters', ['line 5', 'comma']],
    ['a line far too long', `t,v\n${'1'.repeat(1_100_000)}`, 'line-too-long', ['line 2', 'without a line break']],
  ];
  it.each(cases)('%s', (_name, input, problem, fragments) => {
    const error = errorOf(() => parseTraceCsv(input));
    expect(error.problem).toBe(problem);
    for (const fragment of fragments) expect(error.message).toContain(fragment);
    expect(error.message).not.toMatch(/\n/);
  });

  it('refuses time in a column that is not increasing when asked to read it as time', () => {
    expect(errorOf(() => parseTraceCsv('x1,x2\n0,5\n1,4\n2,3\n', { timeColumn: 'x2' })).problem).toBe('time-order');
  });

  it('refuses an unknown time column, listing the columns', () => {
    expect(errorOf(() => parseTraceCsv(data, { timeColumn: 'clock' })).message).toBe('no column "clock" to read as time; columns: t, v');
  });

  it(`refuses a file over the ${TRACE_CSV_SIZE_LIMIT_BYTES / 2 ** 20} MiB limit before reading it, naming the limit`, () => {
    const error = errorOf(() => new TraceCsvParser({ totalBytes: 600 * 2 ** 20 }));
    expect(error.problem).toBe('too-large');
    expect(error.message).toBe('the file is 600 MiB, over the 512 MiB limit for trace CSV files');
  });

  it('refuses input that grows past the limit while streaming (a lower limit for the test)', () => {
    const parser = new TraceCsvParser({ sizeLimitBytes: 1000 });
    // 100 rows of "NNN,1\n": 600 bytes a chunk, so the second passes 1000.
    const rows = (from: number) => new TextEncoder().encode(Array.from({ length: 100 }, (_, i) => `${from + i},1\n`).join(''));
    expect(parser.feed(rows(100)).bytes).toBe(600);
    const error = errorOf(() => parser.feed(rows(200)));
    expect(error.problem).toBe('too-large');
    expect(error.message).toContain('1200 bytes, over the 1000 bytes limit');
  });

  it('keeps refusing after an error', () => {
    const parser = new TraceCsvParser();
    expect(() => parser.feed('t,v\n0,1\n1,2\n1,3\n')).toThrow(CsvInputError);
    expect(errorOf(() => parser.finish()).problem).toBe('time-order');
  });
});

describe('helpers on a parsed trace', () => {
  const trace = parseTraceCsv(csv(',', 'time,Heater,sensor'));

  it('finds a channel by name, exactly or ignoring case, and lists the channels otherwise', () => {
    expect(channelByName(trace, 'Heater').name).toBe('Heater');
    expect(channelByName(trace, ' heater ').name).toBe('Heater');
    expect(errorOf(() => channelByName(trace, 'bolometer')).message).toBe('no channel "bolometer"; channels: Heater, sensor');
    expect(errorOf(() => channelByName(trace, 'time')).message).toContain('is the time column');
  });

  it('moves time zero to the heater onset (the kernel heaterOnset: 50 % of the first rise)', () => {
    // A drive rising from 0 to 1 between samples 20 and 21: the 50 % point is halfway, 20.5 µs.
    const rows = Array.from({ length: 60 }, (_, i) => [i * 1e-6, i > 20 && i < 40 ? 1 : 0, 0.01 * Math.sin(i)]);
    const t = parseTraceCsv(csv(',', 't,heater,sensor', rows));
    const aligned = alignToHeaterOnset(t, 'heater');
    expect(aligned.onset_s).toBeCloseTo(20.5e-6, 12);
    expect(aligned.time_s[0]).toBeCloseTo(-20.5e-6, 12);
    expect(t.time_s[0]).toBe(0); // the parsed trace is left unchanged
  });
});

describe('writing CSV (RFC 4180)', () => {
  it('quotes only what needs it and doubles quotes', () => {
    expect(['plain', 'a,b', 'say "hi"', 'two\nlines', ' padded', 1.5e-7, null, undefined, Number.NaN, true].map(csvCell)).toEqual([
      'plain',
      '"a,b"',
      '"say ""hi"""',
      '"two\nlines"',
      '" padded"',
      '1.5e-7',
      '',
      '',
      '',
      'true',
    ]);
  });
});

describe('module boundary', () => {
  it('the io modules import nothing node-only, so a browser Web Worker can run them', () => {
    const files = readdirSync(SRC_IO).filter((f) => f.endsWith('.ts'));
    expect(files).toEqual(expect.arrayContaining(['trace-csv.ts', 'delay-batch.ts', 'fit-csv.ts', 'csv-common.ts', 'small-csv.ts', 'trace-pick.ts']));
    for (const file of ['trace-csv.ts', 'delay-batch.ts', 'fit-csv.ts', 'csv-common.ts', 'small-csv.ts', 'trace-pick.ts']) {
      const source = readFileSync(join(SRC_IO, file), 'utf8');
      const specifiers = [...source.matchAll(/from '([^']+)'/g)].map((m) => m[1] ?? '');
      for (const s of specifiers) expect(s, `${file} imports ${s}`).toMatch(/^(\.\.?\/|papaparse$)/);
      expect(source, file).not.toMatch(/\b(process|Buffer|require)\s*[.(]/);
    }
  });
});
