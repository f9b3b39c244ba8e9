/**
 * The small-table reader's quick path: a file without quotes or carriage returns is split at
 * "\n" and the delimiter instead of going through Papa Parse (as Papa's own fast mode does). The
 * two must give the same table, or the same error, for any such file (common practice, no
 * source: RFC 4180 reading of unquoted fields).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { type CsvTable, readCsvTable } from '../../src/io/small-csv';

function outcome(read: () => CsvTable): CsvTable | string {
  try {
    return read();
  } catch (error) {
    return error instanceof Error ? `${error.name}: ${error.message}` : String(error);
  }
}

const cell = fc.constantFrom('', ' ', '1', '2.5e-3', '-0,5', 'delay_s', 'distance_mm', '#', '# note', 'x y', '\t', ';', ',', '3;4', 'NaN', 'µs');
const line = fc.array(cell, { minLength: 0, maxLength: 4 }).map((cells) => cells.join(''));
const file = fc.tuple(fc.array(line, { minLength: 1, maxLength: 8 }), fc.boolean()).map(([lines, end]) => lines.join('\n') + (end ? '\n' : ''));

describe('readCsvTable on plain files (no quotes, no carriage returns)', () => {
  it('gives what Papa Parse gives: the same header, rows, line numbers and errors', () => {
    fc.assert(
      fc.property(file, (text) => {
        expect(outcome(() => readCsvTable(text, 'delay'))).toEqual(outcome(() => readCsvTable(text, 'delay', { papa: true })));
      }),
      { numRuns: 500 },
    );
  });

  it('reads a typical delay file', () => {
    const table = readCsvTable('# log\ndelay_s;distance_mm\n\n0,0025;50\n0,0026;\n');
    expect(table).toEqual({
      header: ['delay_s', 'distance_mm'],
      headerLine: 2,
      delimiter: ';',
      rows: [
        { line: 4, cells: ['0,0025', '50'] },
        { line: 5, cells: ['0,0026', ''] },
      ],
    });
  });
});
