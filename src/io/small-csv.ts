/**
 * Reading small CSV tables (delay batches, distance fits) whole: a header row of column names,
 * then rows of cells, each with its line number. Runs in node and in a browser Web Worker.
 *
 *  - Encoding as for traces: UTF-8, or UTF-16 with a byte-order mark (see csv-common).
 *  - Blank lines and lines starting with "#" are skipped anywhere; the first other line is the
 *    header.
 *  - Delimiter: read from the header line: tab if it has one, else semicolon if it has one, else
 *    comma. Cells may be quoted (RFC 4180). Every row must have as many cells as the header.
 *  - Decimal comma as for traces: only in semicolon- and tab-delimited files.
 */
import { overLimitText } from './byte-size';
import Papa from 'papaparse';
import { baseOfColumn, type ColumnDimension, CsvInputError, type Delimiter, decodeText, delimiterName, readNumberCell, refuseBinary, toSi, unitOfColumn } from './csv-common';

/** Largest delay or fit table read, bytes (64 MiB: several million rows). */
export const TABLE_CSV_SIZE_LIMIT_BYTES = 64 * 1024 * 1024;

export interface TableRow {
  /** 1-based line of the file where the row starts. */
  line: number;
  cells: string[];
}

export interface CsvTable {
  header: string[];
  headerLine: number;
  rows: TableRow[];
  delimiter: Delimiter;
}

/**
 * Reads a whole table. Throws {@link CsvInputError} naming the line of a bad row. `options.papa`
 * sends every file through Papa Parse (the tests compare it with the quick split of plain files).
 */
export function readCsvTable(input: string | Uint8Array, what = 'table', options: { papa?: boolean } = {}): CsvTable {
  return scanCsvTable(input, what, { row: (table, row) => table.rows.push(row) }, options);
}

/** What {@link scanCsvTable} calls: once with the header, then once per row (its `rows` stays empty). */
export interface CsvTableVisitor {
  header?(table: CsvTable): void;
  row(table: CsvTable, row: TableRow): void;
}

/**
 * Reads a table row by row, handing each row to `visit` as it is read, so a caller that turns
 * rows into its own records keeps no cell arrays (a 200 000-row file then costs one record per
 * row, not three objects that all outlive the read). Same checks and errors as
 * {@link readCsvTable}, which is this collecting the rows.
 */
export function scanCsvTable(input: string | Uint8Array, what: string, visit: CsvTableVisitor, options: { papa?: boolean } = {}): CsvTable {
  const size = typeof input === 'string' ? input.length : input.byteLength;
  if (size > TABLE_CSV_SIZE_LIMIT_BYTES) {
    throw new CsvInputError('too-large', `the ${what} file is ${overLimitText(size, TABLE_CSV_SIZE_LIMIT_BYTES)}`);
  }
  let text = typeof input === 'string' ? input : decodeText(input).text;
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  refuseBinary(text);
  if (text.trim() === '') throw new CsvInputError('empty', size === 0 ? `the ${what} file is empty` : `the ${what} file holds only blank lines`);
  const headerText = firstContentLine(text);
  const delimiter: Delimiter = headerText.includes('\t') ? '\t' : headerText.includes(';') ? ';' : ',';
  // Without quotes or carriage returns, a split is what Papa's own fast mode does: lines at "\n",
  // cells at the delimiter, no cell spanning lines. Otherwise Papa reads quotes and CRLF.
  const plain = options.papa !== true && text.indexOf('"') < 0 && text.indexOf('\r') < 0;
  let line = 1;
  let table: CsvTable | null = null;
  const take = (cells: string[]): void => {
    const here = line;
    line += plain ? 1 : 1 + cells.reduce((n, c) => n + newlinesIn(c), 0);
    // A row whose first character is printable ASCII other than "#" is neither blank nor a comment.
    const first = (cells[0] ?? '').charCodeAt(0);
    const plainStart = first > 32 && first < 127 && first !== 35;
    if (!plainStart && (cells.every((c) => c.trim() === '') || (cells[0] ?? '').trimStart().startsWith('#'))) return;
    if (table === null) {
      const header = cells.map((c) => c.trim());
      if (header.every((c) => Number.isFinite(readNumberCell(c, delimiter !== ',')))) {
        throw new CsvInputError('header', `the first row is numbers; the ${what} needs a header row of column names first`, here);
      }
      table = { header, headerLine: here, rows: [], delimiter };
      visit.header?.(table);
      return;
    }
    if (cells.length !== table.header.length) {
      const foreign = (['\t', ';', ','] as const).find((x) => x !== delimiter && !(x === ',' && delimiter !== ',') && cells.some((c) => c.includes(x)));
      if (foreign !== undefined) {
        throw new CsvInputError('mixed-delimiters', `mixed delimiters: a ${delimiterName(foreign)} in a ${delimiterName(delimiter)}-delimited file`, here);
      }
      throw new CsvInputError('ragged', `ragged row: ${cells.length} cells where the header (line ${table.headerLine}) has ${table.header.length}`, here);
    }
    visit.row(table, { line: here, cells });
  };
  if (plain) {
    // Lines split at "\n", each split at the delimiter, one at a time.
    for (let start = 0; ; ) {
      const end = text.indexOf('\n', start);
      take(text.slice(start, end < 0 ? text.length : end).split(delimiter));
      if (end < 0) break;
      start = end + 1;
    }
  } else {
    for (const cells of Papa.parse<string[]>(text, { delimiter, quoteChar: '"', escapeChar: '"', skipEmptyLines: false, header: false }).data) take(cells);
  }
  const found = table as CsvTable | null;
  if (found === null) throw new CsvInputError('no-data', `the ${what} file holds only comment lines`);
  return found;
}

function firstContentLine(text: string): string {
  let start = 0;
  for (let n = 0; n < 10_000 && start <= text.length; n++) {
    const end = text.indexOf('\n', start);
    const line = text.slice(start, end < 0 ? text.length : end);
    const t = line.trim();
    if (t !== '' && !t.startsWith('#')) return line;
    if (end < 0) break;
    start = end + 1;
  }
  return '';
}

function newlinesIn(cell: string): number {
  let n = 0;
  for (let i = cell.indexOf('\n'); i >= 0; i = cell.indexOf('\n', i + 1)) n++;
  return n;
}

/** A column found in a table: its index, name and unit (10^pow10 of the SI unit). */
export interface TableColumn {
  index: number;
  name: string;
  pow10: number;
}

/**
 * Finds a column by its exact name (else ignoring case); a unit in the name (e.g. "delay_ms")
 * scales its values to SI. Returns undefined when absent.
 */
export function columnNamed(table: CsvTable, name: string, dimension: ColumnDimension | null): TableColumn | undefined {
  let index = table.header.indexOf(name);
  if (index < 0) index = table.header.findIndex((h) => h.toLowerCase() === name.trim().toLowerCase());
  if (index < 0) return undefined;
  const found = table.header[index] as string;
  return { index, name: found, pow10: dimension ? (unitOfColumn(found, dimension)?.pow10 ?? 0) : 0 };
}

/**
 * Finds a column by base name and any unit of its dimension: base "delay" finds "delay_s",
 * "delay_ms", "Delay (us)"; the first such column wins. Returns undefined when absent.
 */
export function columnByBase(table: CsvTable, base: string, dimension: ColumnDimension): TableColumn | undefined {
  const index = table.header.findIndex((h) => baseOfColumn(h) === base && (unitOfColumn(h, dimension) !== undefined || h.trim().toLowerCase() === base));
  if (index < 0) return undefined;
  const found = table.header[index] as string;
  return { index, name: found, pow10: unitOfColumn(found, dimension)?.pow10 ?? 0 };
}

/**
 * The number in `row` under `column`, in SI, or undefined when the cell is empty and `optional`.
 * Throws a 'not-a-number' {@link CsvInputError} naming the line and the column.
 */
export function numberAt(table: CsvTable, row: TableRow, column: TableColumn, optional = false): number | undefined {
  const cell = (row.cells[column.index] ?? '').trim();
  if (cell === '' && optional) return undefined;
  const value = readNumberCell(cell, table.delimiter !== ',');
  if (!Number.isFinite(value)) {
    const what = cell === '' ? 'empty cell' : /^"?[+-]?(nan|inf|infinity)"?$/i.test(cell) ? `"${cell}" is not a finite number` : `"${cell.length > 24 ? `${cell.slice(0, 24)}…` : cell}" is not a number`;
    throw new CsvInputError('not-a-number', `column "${column.name}": ${what}`, row.line);
  }
  return toSi(value, column.pow10);
}

/** "delay_s, distance_m, …": the header, for messages. */
export function columnList(table: CsvTable): string {
  return table.header.join(', ');
}
