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
  const size = typeof input === 'string' ? input.length : input.byteLength;
  if (size > TABLE_CSV_SIZE_LIMIT_BYTES) {
    throw new CsvInputError('too-large', `the ${what} file is ${Math.round(size / 1048576)} MiB, over the ${TABLE_CSV_SIZE_LIMIT_BYTES / 1048576} MiB limit`);
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
  const data = plain
    ? text.split('\n').map((row) => row.split(delimiter))
    : Papa.parse<string[]>(text, { delimiter, quoteChar: '"', escapeChar: '"', skipEmptyLines: false, header: false }).data;
  let line = 1;
  let header: string[] | null = null;
  let headerLine = 0;
  const rows: TableRow[] = [];
  for (const cells of data) {
    const here = line;
    line += plain ? 1 : 1 + cells.reduce((n, c) => n + newlinesIn(c), 0);
    if (cells.every((c) => c.trim() === '') || (cells[0] ?? '').trimStart().startsWith('#')) continue;
    if (header === null) {
      header = cells.map((c) => c.trim());
      headerLine = here;
      if (header.every((c) => Number.isFinite(readNumberCell(c, delimiter !== ',')))) {
        throw new CsvInputError('header', `the first row is numbers; the ${what} needs a header row of column names first`, here);
      }
      continue;
    }
    if (cells.length !== header.length) {
      const foreign = (['\t', ';', ','] as const).find((x) => x !== delimiter && !(x === ',' && delimiter !== ',') && cells.some((c) => c.includes(x)));
      if (foreign !== undefined) {
        throw new CsvInputError('mixed-delimiters', `mixed delimiters: a ${delimiterName(foreign)} in a ${delimiterName(delimiter)}-delimited file`, here);
      }
      throw new CsvInputError('ragged', `ragged row: ${cells.length} cells where the header (line ${headerLine}) has ${header.length}`, here);
    }
    rows.push({ line: here, cells });
  }
  if (header === null) throw new CsvInputError('no-data', `the ${what} file holds only comment lines`);
  return { header, headerLine, rows, delimiter };
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
