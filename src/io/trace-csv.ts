/**
 * Digitiser traces as CSV: a time column and any number of channels, read incrementally so a Web
 * Worker can stream a 200 MB file while holding only the numbers (Float64Arrays that grow
 * geometrically); the text is never kept. Runs in node and in a browser Web Worker: no node-only
 * imports.
 *
 * Format, as read here:
 *  - Encoding: UTF-8 (a UTF-8 byte-order mark is dropped); UTF-16 LE/BE is decoded when a
 *    byte-order mark announces it; UTF-16 without a mark, or any NUL byte, is refused as binary.
 *  - Lines end with LF or CRLF. Blank lines and lines starting with "#" inside the data are skipped.
 *  - Header: any number of lines (up to 1000) before the data. The data start at the first line
 *    that, with the two numeric lines after it (or up to the end of a shorter file), is a row of at
 *    least two numbers split by one delimiter into the same number of cells.
 *  - Delimiter: comma, semicolon or tab, detected on the data (tab, then semicolon, then comma is
 *    tried). A line that uses a second delimiter is refused ("mixed delimiters"). One trailing
 *    delimiter at the end of every row is allowed.
 *  - Decimal comma: accepted in semicolon- and tab-delimited files, cell by cell, when a cell has
 *    one comma and no point ("1,5e-3"). Never in comma-delimited files. Thousands separators are
 *    not read.
 *  - Numbers: decimal with optional sign, point and exponent ("-1.5E-06"), optionally in double
 *    quotes. Empty cells, NaN and infinities are refused with their line and column.
 *  - Column names come from the last header line when it splits into as many non-numeric names
 *    as the data have cells (a leading "#" is dropped); otherwise "col1", "col2", ….
 *  - Time: the column named like time ("time", "t", "s", "sec", "x", any case, with or without a
 *    unit such as "Time (ms)", "t_us", "TIME [s]"), else the first column. A unit in its name
 *    (s, ms, us/µs, ns) scales it to seconds; without one, seconds. Time must increase strictly
 *    from row to row.
 *  - Header lines of the form "key: value", "key = value" or "key<delimiter>value" are kept as
 *    metadata fields; all header lines are kept as they were.
 *  - Size limits: the parser itself refuses more than {@link TRACE_CSV_SIZE_LIMIT_BYTES} (512 MiB),
 *    the command line's limit (`sekundo trace`); the page refuses a file before reading it above
 *    its own, smaller TRACE_FILE_LIMIT_BYTES (256 MiB, src/ui/converter/trace/trace-protocol.ts),
 *    so a browser tab keeps memory for the samples it draws.
 *
 * In a Web Worker: `parseTraceCsvBlob(file, …)` (trace-csv-stream.ts), or
 * drive a {@link TraceCsvParser} by hand with `feed(chunk)` per chunk of `file.stream()`; post the
 * result back with its Float64Array buffers in the transfer list, so nothing is copied.
 */
import { overLimitText } from './byte-size';
import {
  baseOfColumn,
  CsvInputError,
  type Delimiter,
  delimiterName,
  readNumberCell,
  sniffEncoding,
  splitQuoted,
  type TextEncodingName,
  indexOfName,
} from './csv-common';
import { concatBytes, isBlank, readDecimalBytes, takeDecimalComma } from './trace-bytes';
import { countsSamples, headerFields, sameShape, type Shape, shapeOf, TIME_NAMES, TIME_UNIT_POW10, type TimeUnit, timeUnitOf } from './trace-csv-layout';

export type { TimeUnit } from './trace-csv-layout';

/** Largest trace input the parser reads, bytes (512 MiB; the command line's limit, the page's is 256 MiB). */
export const TRACE_CSV_SIZE_LIMIT_BYTES = 512 * 1024 * 1024;
/**
 * Largest size of a value read, in any column: noise and baseline sums square the samples, and
 * 1e100² summed over 10⁸ rows still fits a double (1e308 did not: its sd came out NaN).
 */
export const TRACE_MAX_MAGNITUDE = 1e100;
/** Most lines of header before the data must start. */
export const TRACE_CSV_MAX_HEADER_LINES = 1000;
/** Longest line, characters: a longer one means the file is not a line-per-row CSV. */
export const TRACE_CSV_MAX_LINE_CHARS = 1024 * 1024;
const NUMBERS_JOINED_BY_COMMAS = /^[\s"]*[-+\d.eE]+(?:,[-+\d.eE]+){1,}[\s"]*$/;
/** Numeric rows that confirm where the data start. */
const CONFIRM_ROWS = 3;
const INITIAL_CAPACITY = 4096;
/** Most rows allocated up front from a size estimate (more grow on demand). */
const MAX_ESTIMATED_ROWS = 1 << 26;
/** Names taken for the time column (after dropping a unit), compared in lower case. */





export interface TraceChannel {
  name: string;
  values: Float64Array;
}

export interface TraceCsvMetadata {
  /** Every line before the data, as written (trimmed of its line break). */
  headerLines: string[];
  /** "key: value", "key = value" and two-cell header lines, key → value. */
  fields: Record<string, string>;
  delimiter: Delimiter;
  /** True when some cell used a decimal comma. */
  decimalComma: boolean;
  encoding: TextEncodingName;
  /** Name of the column read as time. */
  timeColumn: string;
  /** Every column name in file order, time included. */
  columns: string[];
  /** 1-based line of the first data row, and of the last line read. */
  firstDataLine: number;
  lastLine: number;
  rows: number;
  /** Blank and "#" lines skipped inside the data. */
  skippedLines: number;
  bytes: number;
  /**
   * The time column has no unit and counts samples (0, 1, 2, … in steps of exactly 1): sample
   * numbers, not seconds. A pick on such a file is refused (src/io/trace-pick.ts).
   */
  timeCountsSamples: boolean;
}

/** A parsed trace file. */
export interface TraceCsv {
  /** Time of each row, s (scaled from the file's unit). */
  time_s: Float64Array;
  /** Every column except time, in file order. */
  channels: TraceChannel[];
  /** The time unit named in the file's header, when it named one. */
  timeUnit?: TimeUnit;
  metadata: TraceCsvMetadata;
}

export interface TraceParseProgress {
  /** Bytes (or, for text chunks, characters) fed so far. */
  bytes: number;
  totalBytes: number | null;
  /** bytes / totalBytes, 0–1, when the total is known; 1 once finished. */
  fraction: number | null;
  rows: number;
  done: boolean;
}

export interface TraceParseOptions {
  /** Size of the whole input, for progress and for refusing an oversize file before reading. */
  totalBytes?: number;
  /** Size limit, bytes; default and maximum {@link TRACE_CSV_SIZE_LIMIT_BYTES}. */
  sizeLimitBytes?: number;
  /** Column to read as time, by name (exact, else ignoring case); default: detected. */
  timeColumn?: string;
  /** Unit of the time column, overriding its name. */
  timeUnit?: TimeUnit;
  /** Aborting it cancels the parse, like {@link TraceCsvParser.cancel}. */
  signal?: AbortSignal;
  /** Called after each chunk and at the end. */
  onProgress?: (progress: TraceParseProgress) => void;
}

interface PendingLine {
  text: string;
  line: number;
  shape: Shape | null;
}

type State = 'header' | 'data' | 'done' | 'failed' | 'cancelled';

const NEWLINE = 10;
const CARRIAGE_RETURN = 13;
const HASH = 35;

/**
 * Incremental reader of one trace CSV: `feed` chunks (text or bytes, any sizes, split anywhere),
 * then `finish`. Each call returns the progress. Errors are {@link CsvInputError}s whose message
 * names the line; after one, the parser refuses further input. `cancel` stops it and frees memory.
 *
 * Internally everything becomes UTF-8 bytes, split into lines at LF bytes; data rows are read
 * straight from the bytes (an exact fast path for plain decimals, `Number` for the rest), so no
 * text is kept beyond the current line and the header.
 */
export class TraceCsvParser {
  private state: State = 'header';
  private failure: CsvInputError | null = null;
  private readonly limit: number;
  private readonly totalBytes: number | null;
  private bytes = 0;
  private inputKind: 'text' | 'bytes' | null = null;
  private encoding: TextEncodingName = 'utf-8';
  private sniffed = false;
  private headBytes: Uint8Array | null = null;
  private utf16: TextDecoder | null = null;
  private readonly lineDecoder = new TextDecoder('utf-8');
  private readonly encoder = new TextEncoder();
  private heldSurrogate = '';
  private carry: Uint8Array | null = null;
  private lineNo = 0;
  private atStart = true;
  private sawContent = false;
  // Header phase.
  private pending: PendingLine[] = [];
  private pendingChars = 0;
  private run: number[] = [];
  // Data phase.
  private delimiter: Delimiter = ',';
  private delimiterByte = 44;
  private decimalCommaAllowed = false;
  private usedDecimalComma = false;
  private trailing = false;
  private ncols = 0;
  private timeIndex = 0;
  private columns: Float64Array[] = [];
  private names: string[] = [];
  private headerLines: string[] = [];
  private fields: Record<string, string> = {};
  private capacity = 0;
  private rows = 0;
  private prevTime = Number.NEGATIVE_INFINITY;
  private firstDataLine = 0;
  private skipped = 0;
  private timeUnit: TimeUnit | undefined;
  private namesFromHeader = false;

  constructor(private readonly options: TraceParseOptions = {}) {
    this.limit = Math.min(options.sizeLimitBytes ?? TRACE_CSV_SIZE_LIMIT_BYTES, TRACE_CSV_SIZE_LIMIT_BYTES);
    this.totalBytes = options.totalBytes ?? null;
    if (this.totalBytes !== null && this.totalBytes > this.limit) this.fail(tooLarge(this.totalBytes, this.limit));
  }

  /** Progress so far. */
  progress(): TraceParseProgress {
    const done = this.state === 'done';
    const fraction = done ? 1 : this.totalBytes ? Math.min(1, this.bytes / this.totalBytes) : this.totalBytes === 0 ? 0 : null;
    return { bytes: this.bytes, totalBytes: this.totalBytes, fraction, rows: this.rows, done };
  }

  /** True once cancelled (by {@link cancel} or the abort signal). */
  get cancelled(): boolean {
    return this.state === 'cancelled' || (this.options.signal?.aborted === true && this.state !== 'done' && this.state !== 'failed');
  }

  /** Stops parsing and frees what was read; later calls throw a 'cancelled' error. */
  cancel(): void {
    if (this.state === 'done' || this.state === 'failed') return;
    this.state = 'cancelled';
    this.release();
  }

  /**
   * Reads the next chunk: text (progress counts its characters), or bytes (UTF-8, or UTF-16
   * after its byte-order mark). Chunks may split lines and characters anywhere.
   */
  feed(chunk: string | Uint8Array): TraceParseProgress {
    this.checkUsable();
    try {
      const kind = typeof chunk === 'string' ? 'text' : 'bytes';
      if (this.inputKind !== null && this.inputKind !== kind) throw new CsvInputError('encoding', 'feed either text or bytes, not both');
      this.inputKind = kind;
      this.bytes += typeof chunk === 'string' ? chunk.length : chunk.byteLength;
      if (this.bytes > this.limit) throw tooLarge(this.bytes, this.limit);
      if (typeof chunk === 'string') this.feedText(chunk);
      else this.feedBytes(chunk);
    } catch (error) {
      this.fail(error);
    }
    const progress = this.progress();
    this.options.onProgress?.(progress);
    return progress;
  }

  /** Ends the input and returns the trace. Throws {@link CsvInputError} if the file is unusable. */
  finish(): TraceCsv {
    this.checkUsable();
    try {
      if (!this.sniffed && this.headBytes) this.sniff(this.headBytes);
      if (this.utf16) this.pushUtf8(this.encoder.encode(this.utf16.decode()));
      if (this.heldSurrogate) this.pushUtf8(this.encoder.encode(this.heldSurrogate));
      const last = this.carry;
      this.carry = null;
      if (last) this.lineOf(last, 0, last.length);
      if (this.state === 'header') this.endOfHeaderPhase();
      const result = this.result();
      this.state = 'done';
      this.options.onProgress?.(this.progress());
      return result;
    } catch (error) {
      this.fail(error);
    }
  }

  private checkUsable(): void {
    if (this.options.signal?.aborted && this.state !== 'cancelled' && this.state !== 'done' && this.state !== 'failed') this.cancel();
    if (this.state === 'cancelled') throw new CsvInputError('cancelled', 'reading the trace was cancelled');
    if (this.state === 'failed') throw this.failure as CsvInputError;
    if (this.state === 'done') throw new CsvInputError('cancelled', 'the parser has already finished');
  }

  private fail(error: unknown): never {
    this.state = 'failed';
    this.release();
    this.failure = error instanceof CsvInputError ? error : new CsvInputError('encoding', error instanceof Error ? error.message : String(error));
    throw this.failure;
  }

  private release(): void {
    this.columns = [];
    this.pending = [];
    this.carry = null;
    this.headBytes = null;
    this.utf16 = null;
  }

  private feedText(input: string): void {
    let text = this.heldSurrogate + input;
    this.heldSurrogate = '';
    if (this.atStart && text.length > 0 && text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    // Keep a high surrogate at the end for the next chunk, so a pair split between chunks survives.
    const lastCode = text.charCodeAt(text.length - 1);
    if (lastCode >= 0xd800 && lastCode <= 0xdbff) {
      this.heldSurrogate = text.slice(-1);
      text = text.slice(0, -1);
    }
    this.sniffed = true;
    this.pushUtf8(this.encoder.encode(text));
  }

  private feedBytes(chunk: Uint8Array): void {
    if (!this.sniffed) {
      // Wait for three bytes to read a byte-order mark.
      const head = this.headBytes ? concatBytes(this.headBytes, chunk) : chunk;
      if (head.byteLength < 3) {
        this.headBytes = head.slice();
        return;
      }
      this.headBytes = null;
      this.sniff(head);
      return;
    }
    if (this.utf16) this.pushUtf8(this.encoder.encode(this.utf16.decode(chunk, { stream: true })));
    else this.pushUtf8(chunk);
  }

  private sniff(head: Uint8Array): void {
    this.sniffed = true;
    const { encoding, bomLength } = sniffEncoding(head);
    this.encoding = encoding;
    if (encoding === 'utf-8') {
      this.pushUtf8(head.subarray(bomLength));
      return;
    }
    // UTF-16 (with its mark) is decoded, then read like UTF-8 text; the decoder drops the mark.
    this.utf16 = new TextDecoder(encoding);
    this.pushUtf8(this.encoder.encode(this.utf16.decode(head, { stream: true })));
  }

  /** Splits UTF-8 bytes into lines (LF or CRLF); a partial last line waits for the next chunk. */
  private pushUtf8(b: Uint8Array): void {
    if (b.length === 0) return;
    this.atStart = false;
    this.refuseBinary(b);
    const n = b.length;
    let pos = 0;
    if (this.carry) {
      const nl = b.indexOf(NEWLINE);
      if (nl < 0) {
        this.carry = concatBytes(this.carry, b);
        this.checkLineLength(this.carry.length);
        return;
      }
      const joined = concatBytes(this.carry, b.subarray(0, nl));
      this.carry = null;
      this.lineOf(joined, 0, joined.length);
      pos = nl + 1;
    }
    while (pos < n) {
      const nl = b.indexOf(NEWLINE, pos);
      if (nl < 0) {
        this.carry = b.slice(pos);
        this.checkLineLength(this.carry.length);
        return;
      }
      this.lineOf(b, pos, nl);
      pos = nl + 1;
    }
  }

  private checkLineLength(length: number): void {
    if (length > TRACE_CSV_MAX_LINE_CHARS) {
      throw new CsvInputError('line-too-long', `longer than ${TRACE_CSV_MAX_LINE_CHARS} bytes without a line break: not a CSV file with one row per line`, this.lineNo + 1);
    }
  }

  private refuseBinary(b: Uint8Array): void {
    const nul = b.indexOf(0);
    if (nul < 0) return;
    let line = this.lineNo + 1;
    if (this.carry) for (const x of this.carry) if (x === NEWLINE) line++;
    for (let i = b.indexOf(NEWLINE); i >= 0 && i < nul; i = b.indexOf(NEWLINE, i + 1)) line++;
    const looksUtf16 = this.lineNo === 0 && this.carry === null && (nul === 0 || nul === 1) && b.length > 3 && b[2] !== 0;
    throw new CsvInputError(
      'binary',
      looksUtf16
        ? 'the file looks like UTF-16 text without a byte-order mark; save it as UTF-8 (or as UTF-16 with a byte-order mark)'
        : 'binary content (a NUL byte): this is not a CSV text file',
      line,
    );
  }

  private lineOf(b: Uint8Array, start: number, stop: number): void {
    // A whole line inside one chunk is checked here; a line split across chunks, in feedBytes.
    if (stop - start > TRACE_CSV_MAX_LINE_CHARS) this.checkLineLength(stop - start);
    const end = stop > start && b[stop - 1] === CARRIAGE_RETURN ? stop - 1 : stop;
    this.lineNo++;
    if (this.state === 'data') this.dataLine(b, start, end, this.lineNo);
    else this.headerLine(this.lineDecoder.decode(b.subarray(start, end)));
  }

  // ---- Header phase: keep lines until three numeric rows agree on a delimiter and a width. ----

  private headerLine(text: string): void {
    const trimmed = text.trim();
    if (trimmed !== '') this.sawContent = true;
    // Blank and "#" lines neither start nor break a run of numeric rows.
    const blank = trimmed === '' || trimmed.startsWith('#');
    this.pendingChars += text.length;
    if (this.pending.length >= TRACE_CSV_MAX_HEADER_LINES + CONFIRM_ROWS || this.pendingChars > TRACE_CSV_MAX_LINE_CHARS) {
      throw new CsvInputError(
        'no-data',
        `no data rows in the first ${this.pending.length} lines: a trace needs rows of numbers (time and at least one channel) separated by commas, semicolons or tabs, after at most ${TRACE_CSV_MAX_HEADER_LINES} header lines`,
      );
    }
    const shape = blank ? null : shapeOf(text);
    this.pending.push({ text, line: this.lineNo, shape });
    if (blank) return;
    const index = this.pending.length - 1;
    const runStart = this.run[0];
    const first = runStart === undefined ? null : (this.pending[runStart] as PendingLine).shape;
    if (first && shape && sameShape(first, shape)) this.run.push(index);
    else if (first && runStart !== undefined && this.breaksData(first, shape, text)) {
      // Rows that agreed on a layout are data; this line is a bad data row, reported as such.
      this.startData(runStart);
      return;
    } else this.run = shape ? [index] : [];
    if (this.run.length >= CONFIRM_ROWS) this.startData(this.run[0] as number);
  }

  /**
   * Whether a line after a run of numeric rows is a bad data row rather than the end of a header:
   * after two agreeing rows, any line with a number in it; after one, a line of the same layout
   * with some cells not numbers ("1,nan").
   */
  private breaksData(first: Shape, shape: Shape | null, text: string): boolean {
    const cells = text.split(first.delimiter);
    const someNumber = cells.some((c) => Number.isFinite(readNumberCell(c, first.delimiter !== ',')));
    if (this.run.length >= 2) return shape !== null || someNumber;
    return shape === null && someNumber && cells.length === first.cells + (first.trailing ? 1 : 0);
  }

  private endOfHeaderPhase(): void {
    if (this.run.length > 0) {
      this.startData(this.run[0] as number);
      return;
    }
    if (!this.sawContent) throw new CsvInputError('empty', this.bytes === 0 ? 'the file is empty' : 'the file holds only blank lines');
    const spaced = this.pending.some((p) => /^\s*[-+.\d][\d.eE+-]*(?:[ ]+[-+.\d][\d.eE+-]*)+\s*$/.test(p.text));
    throw new CsvInputError(
      'no-data',
      `no data rows in ${this.lineNo} lines: a trace needs rows of numbers (time and at least one channel) separated by commas, semicolons or tabs` +
        (spaced ? ' (columns separated by spaces are not read)' : ''),
    );
  }

  private startData(index: number): void {
    const firstRow = this.pending[index] as PendingLine;
    const shape = firstRow.shape as Shape;
    this.delimiter = shape.delimiter;
    this.delimiterByte = shape.delimiter.charCodeAt(0);
    this.decimalCommaAllowed = shape.delimiter !== ',';
    this.trailing = shape.trailing;
    this.ncols = shape.cells;
    this.firstDataLine = firstRow.line;
    const header = this.pending.slice(0, index);
    this.headerLines = header.map((p) => p.text);
    const named = header.filter((p) => p.text.trim() !== '');
    const last = named[named.length - 1];
    this.names = this.columnNames(last?.text);
    this.fields = headerFields(
      named.filter((p) => p !== last || !this.namesFromHeader).map((p) => p.text),
      shape.delimiter,
    );
    this.timeIndex = this.findTimeColumn();
    this.timeUnit = this.options.timeUnit ?? timeUnitOf(this.names[this.timeIndex] as string);
    this.capacity = this.initialCapacity(firstRow.text.length + 1);
    this.columns = Array.from({ length: this.ncols }, () => new Float64Array(this.capacity));
    this.state = 'data';
    takeDecimalComma();
    const rows = this.pending.slice(index);
    this.pending = [];
    this.run = [];
    for (const row of rows) {
      const bytes = this.encoder.encode(row.text);
      this.dataLine(bytes, 0, bytes.length, row.line);
    }
  }

  private columnNames(headerText: string | undefined): string[] {
    const generic = Array.from({ length: this.ncols }, (_, i) => `col${i + 1}`);
    if (headerText === undefined) return generic;
    const cells = splitQuoted(headerText.replace(/^\s*[#%]+\s*/, ''), this.delimiter);
    if (this.trailing && cells.length === this.ncols + 1 && cells[cells.length - 1] === '') cells.pop();
    if (cells.length !== this.ncols || cells.some((c) => Number.isFinite(readNumberCell(c, this.decimalCommaAllowed)))) return generic;
    this.namesFromHeader = true;
    const seen = new Map<string, number>();
    return cells.map((cell, i) => {
      const name = cell === '' ? `col${i + 1}` : cell;
      const count = (seen.get(name) ?? 0) + 1;
      seen.set(name, count);
      return count === 1 ? name : `${name}_${count}`;
    });
  }

  private findTimeColumn(): number {
    const wanted = this.options.timeColumn;
    if (wanted !== undefined) {
      const i = indexOfName(this.names, wanted);
      if (i < 0) throw new CsvInputError('missing-column', `no column "${wanted}" to read as time; columns: ${this.names.join(', ')}`);
      return i;
    }
    const i = this.names.findIndex((n) => TIME_NAMES.has(baseOfColumn(n)));
    return Math.max(i, 0);
  }

  private initialCapacity(firstLineBytes: number): number {
    if (this.totalBytes === null) return INITIAL_CAPACITY;
    const estimate = Math.ceil((this.totalBytes / Math.max(4, firstLineBytes)) * 1.05) + 16;
    return Math.max(INITIAL_CAPACITY, Math.min(MAX_ESTIMATED_ROWS, estimate));
  }

  // ---- Data phase: the hot loop, straight from the bytes. ----

  private dataLine(b: Uint8Array, start: number, stop: number, line: number): void {
    let end = stop;
    if (end === start) {
      this.skipped++;
      return;
    }
    const first = b[start] as number;
    if (first === HASH || (first <= 32 && isBlank(b, start, end))) {
      this.skipped++;
      return;
    }
    const delim = this.delimiterByte;
    if (this.trailing && b[end - 1] === delim) end--;
    if (this.rows === this.capacity) this.grow();
    const row = this.rows;
    const last = this.ncols - 1;
    const comma = this.decimalCommaAllowed;
    let p = start;
    for (let c = 0; c <= last; c++) {
      let cellEnd = end;
      if (c < last) {
        cellEnd = p;
        while (cellEnd < end && b[cellEnd] !== delim) cellEnd++;
        if (cellEnd === end) throw this.raggedRow(b, start, end, line);
      }
      let v = readDecimalBytes(b, p, cellEnd, comma);
      if (Number.isNaN(v)) v = this.slowCell(b, p, cellEnd, c, start, end, line);
      if (v > TRACE_MAX_MAGNITUDE || v < -TRACE_MAX_MAGNITUDE) throw this.tooLargeCell(v, c, line);
      (this.columns[c] as Float64Array)[row] = v;
      p = cellEnd + 1;
    }
    const t = (this.columns[this.timeIndex] as Float64Array)[row] as number;
    if (!(t > this.prevTime)) throw this.timeOrder(t, line);
    this.prevTime = t;
    this.rows = row + 1;
    if (takeDecimalComma()) this.usedDecimalComma = true;
  }

  private tooLargeCell(v: number, column: number, line: number): CsvInputError {
    const name = this.names[column] ?? `col${column + 1}`;
    return new CsvInputError('out-of-range', `column "${name}": ${v} is too large to compute with (at most ${TRACE_MAX_MAGNITUDE} in size); rescale the column`, line);
  }

  private slowCell(b: Uint8Array, from: number, to: number, column: number, lineStart: number, lineEnd: number, line: number): number {
    const cell = this.lineDecoder.decode(b.subarray(from, to));
    const v = readNumberCell(cell, this.decimalCommaAllowed);
    if (Number.isFinite(v)) {
      if (cell.indexOf(',') >= 0) this.usedDecimalComma = true;
      return v;
    }
    if (cell.indexOf(this.delimiter) >= 0) throw this.raggedRow(b, lineStart, lineEnd, line);
    const foreign = this.foreignDelimiter(cell);
    if (foreign !== undefined) {
      throw new CsvInputError('mixed-delimiters', `mixed delimiters: a ${delimiterName(foreign)} in a ${delimiterName(this.delimiter)}-delimited file (cell "${clip(cell)}")`, line);
    }
    const name = this.names[column] ?? `col${column + 1}`;
    // biome-ignore lint/suspicious/noControlCharactersInRegex: control characters are what this looks for
    if (/[\uFFFD\u0001-\u0008\u000e-\u001f]/.test(cell)) throw new CsvInputError('binary', `binary content in column "${name}": this is not a CSV text file`, line);
    const trimmed = cell.trim();
    const what =
      trimmed === '' || trimmed === '""'
        ? 'empty cell'
        : /^"?\s*[+-]?(nan|inf|infinity)\s*"?$/i.test(trimmed)
          ? `"${trimmed}" is not a finite number`
          : `"${clip(trimmed)}" is not a number`;
    throw new CsvInputError('not-a-number', `column "${name}": ${what}`, line);
  }

  /** A delimiter other than the file's inside a cell that failed to read as a number. */
  private foreignDelimiter(cell: string): Delimiter | undefined {
    return (['\t', ';', ','] as const).find((x) => {
      if (x === this.delimiter || !cell.includes(x)) return false;
      // In a decimal-comma file a comma is foreign only between numbers: "0.5,1.5", "1,2,3".
      return x !== ',' || !this.decimalCommaAllowed || NUMBERS_JOINED_BY_COMMAS.test(cell);
    });
  }

  private raggedRow(b: Uint8Array, start: number, end: number, line: number): CsvInputError {
    const text = this.lineDecoder.decode(b.subarray(start, end));
    const cells = text.split(this.delimiter).length;
    for (const x of ['\t', ';', ','] as const) {
      if (x !== this.delimiter && text.includes(x) && !(x === ',' && this.decimalCommaAllowed)) {
        return new CsvInputError('mixed-delimiters', `mixed delimiters: a ${delimiterName(x)} in a ${delimiterName(this.delimiter)}-delimited file`, line);
      }
    }
    return new CsvInputError('ragged', `ragged row: ${cells} cells where the data have ${this.ncols} (from line ${this.firstDataLine})`, line);
  }

  private timeOrder(t: number, line: number): CsvInputError {
    const unit = this.timeUnit ?? '';
    const name = this.names[this.timeIndex];
    const fmt = (x: number) => `${x}${unit ? ` ${unit}` : ''}`;
    const why = t === this.prevTime ? 'repeated time' : 'time goes backwards';
    return new CsvInputError('time-order', `${why}: "${name}" is ${fmt(t)} after ${fmt(this.prevTime)} on the row before; time must increase`, line);
  }

  private grow(): void {
    const next = Math.max(INITIAL_CAPACITY, this.capacity * 2);
    this.columns = this.columns.map((old) => {
      const bigger = new Float64Array(next);
      bigger.set(old);
      return bigger;
    });
    this.capacity = next;
  }

  private result(): TraceCsv {
    const n = this.rows;
    // Trim to the rows read: copy when much is unused, else a view (at most 1/8 spare).
    const trim = (a: Float64Array) => (a.length === n ? a : a.length - n > a.length / 8 ? a.slice(0, n) : a.subarray(0, n));
    const columns = this.columns.map(trim);
    this.columns = [];
    const time = columns[this.timeIndex] as Float64Array;
    const pow10 = this.timeUnit ? TIME_UNIT_POW10[this.timeUnit] : 0;
    if (pow10 !== 0) {
      // As toSi: one correctly rounded division by an exact power of ten.
      const divisor = 10 ** -pow10;
      for (let i = 0; i < n; i++) time[i] = (time[i] as number) / divisor;
    }
    const trace: TraceCsv = {
      time_s: time,
      channels: columns.flatMap((values, i) => (i === this.timeIndex ? [] : [{ name: this.names[i] as string, values }])),
      metadata: {
        headerLines: this.headerLines,
        fields: this.fields,
        delimiter: this.delimiter,
        decimalComma: this.usedDecimalComma,
        encoding: this.encoding,
        timeColumn: this.names[this.timeIndex] as string,
        columns: [...this.names],
        firstDataLine: this.firstDataLine,
        lastLine: this.lineNo,
        rows: n,
        skippedLines: this.skipped,
        bytes: this.bytes,
        timeCountsSamples: this.timeUnit === undefined && countsSamples(time),
      },
    };
    if (this.timeUnit !== undefined) trace.timeUnit = this.timeUnit;
    return trace;
  }
}


function tooLarge(bytes: number, limit: number): CsvInputError {
  return new CsvInputError('too-large', `the file is ${overLimitText(bytes, limit)} for trace CSV files`);
}

function clip(text: string): string {
  return text.length > 24 ? `${text.slice(0, 24)}…` : text;
}

/** Parses a whole trace CSV given at once (text or bytes). Throws {@link CsvInputError}. */
export function parseTraceCsv(input: string | Uint8Array, options: TraceParseOptions = {}): TraceCsv {
  const parser = new TraceCsvParser({ totalBytes: typeof input === 'string' ? input.length : input.byteLength, ...options });
  parser.feed(input);
  return parser.finish();
}
