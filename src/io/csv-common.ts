/**
 * Pieces shared by Sekundo's CSV formats (traces, delay batches, distance fits): the error every
 * reader throws, number cells, units taken from column names, text decoding with a byte-order
 * mark, and the RFC 4180 writer. Runs in node and in a browser Web Worker: no node-only imports.
 */
import Papa from 'papaparse';

/** What was wrong with a CSV input. */
export type CsvProblem =
  | 'empty'
  | 'binary'
  | 'encoding'
  | 'too-large'
  | 'no-data'
  | 'header'
  | 'ragged'
  | 'not-a-number'
  | 'mixed-delimiters'
  | 'time-order'
  | 'line-too-long'
  | 'missing-column'
  | 'out-of-range'
  | 'sample-numbers'
  | 'cancelled';

/**
 * A CSV input that cannot be read. The message starts with "line N: " when a line is at fault, so
 * a caller can prefix the file name and show it as it is (one line, no stack).
 */
export class CsvInputError extends Error {
  override name = 'CsvInputError';
  constructor(
    readonly problem: CsvProblem,
    /** The problem in words, without the line number. */
    readonly detail: string,
    /** 1-based line of the file at fault, when one is. */
    readonly line?: number,
  ) {
    super(line === undefined ? detail : `line ${line}: ${detail}`);
  }
}

/** Column delimiters the readers accept. */
export type Delimiter = ',' | ';' | '\t';

/** How a delimiter is named in messages. */
export function delimiterName(d: Delimiter): string {
  return d === '\t' ? 'tab' : d === ';' ? 'semicolon' : 'comma';
}

/**
 * Reads one cell as a finite number, or returns NaN. Accepts what `Number` accepts for decimal
 * text (sign, point, exponent: "1.5e-3", "-2E+06", surrounding spaces) and a cell wrapped in double
 * quotes. With `decimalComma`, a cell with exactly one comma and no point reads the comma as the
 * decimal point ("1,5e-3"); the readers allow that only when the delimiter is not the comma.
 * Empty cells, NaN, infinities and hexadecimal are not numbers here.
 */
export function readNumberCell(cell: string, decimalComma: boolean): number {
  let text = cell.trim();
  if (text.length >= 2 && text.charCodeAt(0) === 34 && text.charCodeAt(text.length - 1) === 34) text = text.slice(1, -1).trim();
  if (text === '' || !DECIMAL_TEXT.test(text)) {
    if (!decimalComma || !DECIMAL_COMMA_TEXT.test(text)) return Number.NaN;
    text = text.replace(',', '.');
  }
  const value = Number(text);
  return Number.isFinite(value) ? value : Number.NaN;
}

const DECIMAL_TEXT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA_TEXT = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;

/** Time units a column name may carry, and their size in seconds as a power of ten. */
const TIME_UNITS: Readonly<Record<string, number>> = {
  s: 0,
  sec: 0,
  secs: 0,
  second: 0,
  seconds: 0,
  ms: -3,
  msec: -3,
  us: -6,
  'µs': -6,
  'μs': -6,
  usec: -6,
  ns: -9,
  nsec: -9,
};

/** Length units a column name may carry. */
const LENGTH_UNITS: Readonly<Record<string, number>> = { m: 0, cm: -2, mm: -3, um: -6, 'µm': -6, 'μm': -6 };

/** Pressure units a column name may carry (decimal ones only). */
const PRESSURE_UNITS: Readonly<Record<string, number>> = { pa: 0, kpa: 3, mbar: 2, bar: 5 };

/** Frequency units a column name may carry (case kept: mHz is not MHz; "hz", "khz" also read). */
const FREQUENCY_UNITS: Readonly<Record<string, number>> = { Hz: 0, hz: 0, kHz: 3, khz: 3, MHz: 6, mHz: -3 };

/** Voltage units a column name may carry (case kept; "v" also read). */
const VOLTAGE_UNITS: Readonly<Record<string, number>> = { V: 0, v: 0, mV: -3, uV: -6, 'µV': -6, 'μV': -6, nV: -9 };

/** Canonical symbols of the lower-case frequency spellings. */
const FREQUENCY_SYMBOLS: Readonly<Record<string, string>> = { hz: 'Hz', khz: 'kHz' };

export type ColumnDimension = 'time' | 'length' | 'pressure' | 'frequency' | 'voltage';

const UNITS_OF: Readonly<Record<ColumnDimension, Readonly<Record<string, number>>>> = {
  time: TIME_UNITS,
  length: LENGTH_UNITS,
  pressure: PRESSURE_UNITS,
  frequency: FREQUENCY_UNITS,
  voltage: VOLTAGE_UNITS,
};

/** A unit read from a column name: its symbol and its size in the SI unit as a power of ten. */
export interface ColumnUnit {
  symbol: string;
  pow10: number;
}

/**
 * Splits a column name into a base and a unit: "Time (ms)", "time [us]", "time/µs", "delay_ms",
 * "t_s" and "TIME_US" name a time in ms, µs, µs, ms, s, µs. A name that is itself a unit ("s",
 * "ms") is that unit. Returns undefined when the name carries no unit of `dimension`.
 */
export function unitOfColumn(name: string, dimension: ColumnDimension): ColumnUnit | undefined {
  const table = UNITS_OF[dimension];
  const text = name.trim().replace(/[)\]]\s*$/, '');
  const match = /(?:^|[\s_([/])([^\s_([/]+)$/.exec(text);
  const token = match?.[1];
  if (token === undefined) return undefined;
  // Time and pressure units are read case-blind ("TIME_MS"); lengths, frequencies and voltages keep
  // their case (mm is not Mm, mHz is not MHz).
  const key = dimension === 'time' || dimension === 'pressure' ? token.toLowerCase() : token;
  const pow10 = table[key];
  if (pow10 === undefined) return undefined;
  const symbol = dimension === 'pressure' ? canonicalPressure(key) : dimension === 'frequency' ? (FREQUENCY_SYMBOLS[key] ?? key) : key.replace('μ', 'µ');
  return { symbol: dimension === 'voltage' && key === 'v' ? 'V' : symbol, pow10 };
}

function canonicalPressure(key: string): string {
  return key === 'pa' ? 'Pa' : key === 'kpa' ? 'kPa' : key;
}

/** A column name ending in its unit, in plain ASCII ("µs" → "us", which {@link unitOfColumn} reads back): ("T", "mK") → "T_mK". */
export function columnWithUnit(base: string, unit: string): string {
  return `${base}_${unit.replace(/[µμ]/g, 'u')}`;
}

/** The name without its unit suffix, lower case: "Time (ms)" → "time", "delay_s" → "delay", "t" → "t". */
export function baseOfColumn(name: string): string {
  let text = name.trim().replace(/\s*[([][^)\]]*[)\]]\s*$/, '');
  const match = /^(.*?)[\s_/]+([^\s_/]+)$/.exec(text);
  const [, head = '', tail = ''] = match ?? [];
  if (match && (['time', 'length', 'pressure'] as const).some((d) => unitOfColumn(`x_${tail}`, d))) text = head;
  return text.trim().toLowerCase();
}

/** Converts `value` in a unit 10^pow10 of the SI unit into the SI unit, with one rounding. */
export function toSi(value: number, pow10: number): number {
  return pow10 >= 0 ? value * 10 ** pow10 : value / 10 ** -pow10;
}

/** Encodings the readers decode. */
export type TextEncodingName = 'utf-8' | 'utf-16le' | 'utf-16be';

/** The encoding a byte-order mark announces (UTF-8 without one), and the mark's length. */
export function sniffEncoding(bytes: Uint8Array): { encoding: TextEncodingName; bomLength: number } {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return { encoding: 'utf-16le', bomLength: 2 };
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return { encoding: 'utf-16be', bomLength: 2 };
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) return { encoding: 'utf-8', bomLength: 3 };
  return { encoding: 'utf-8', bomLength: 0 };
}

/**
 * Decodes a whole file: UTF-8, or UTF-16 (LE or BE) when a byte-order mark says so; the mark is
 * dropped. Invalid UTF-8 becomes U+FFFD, which the readers then report as binary content.
 */
export function decodeText(bytes: Uint8Array): { text: string; encoding: TextEncodingName } {
  const { encoding, bomLength } = sniffEncoding(bytes);
  return { text: new TextDecoder(encoding).decode(bytes.subarray(bomLength)), encoding };
}

/**
 * Throws a 'binary' error when the text holds a NUL character (or looks like UTF-16 read as
 * bytes): a CSV file is text. `firstLine` is the line number of the text's first character.
 */
export function refuseBinary(text: string, firstLine = 1): void {
  const nul = text.indexOf('\0');
  if (nul < 0) return;
  const line = firstLine + countNewlines(text, 0, nul);
  const utf16 = text.length > 3 && (text.charCodeAt(1) === 0 || text.charCodeAt(0) === 0) && text.charCodeAt(2) !== 0;
  throw new CsvInputError(
    'binary',
    utf16
      ? 'the file looks like UTF-16 text without a byte-order mark; save it as UTF-8 (or UTF-16 with a byte-order mark)'
      : 'binary content (a NUL byte): this is not a CSV text file',
    line,
  );
}

/** Newlines in text[from, to). */
export function countNewlines(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = text.indexOf('\n', from); i >= 0 && i < to; i = text.indexOf('\n', i + 1)) n++;
  return n;
}

/** One cell of a CSV being written: text, a number (written in full, shortest round-trip form), or empty. */
export type CsvCell = string | number | boolean | null | undefined;

/**
 * Writes rows as CSV text (RFC 4180): comma-delimited, a cell quoted only when it holds a comma,
 * a double quote (doubled inside), a line break or leading/trailing spaces. Numbers are written
 * with JavaScript's shortest round-trip form, so reading them back gives the same double; null,
 * undefined and non-finite numbers are empty cells. Text that a spreadsheet would run as a formula
 * is neutralised ({@link neutraliseFormula}). Lines end with "\n" unless `newline` says "\r\n".
 * Pure text: nothing here is HTML.
 */
export function writeCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[], newline: '\n' | '\r\n' = '\n'): string {
  const lines: string[] = [header.map(csvCell).join(',')];
  for (const row of rows) lines.push(row.map(csvCell).join(','));
  return `${lines.join(newline)}${newline}`;
}

const NEEDS_QUOTES = /[",\r\n]|^\s|\s$/;
/** First characters a spreadsheet reads as the start of a formula (OWASP, "CSV Injection"). */
const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER_TEXT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Text that a spreadsheet would run as a formula ("=1+1", "=HYPERLINK(…)", "+…", "-…", "@…", or
 * a leading tab or carriage return) gets a leading apostrophe, as the OWASP guidance on CSV
 * injection recommends, so it is shown as the text it is. Numbers — JavaScript numbers and text
 * that is a plain number such as "-1.5" — are left as they are. Every CSV and tab-separated export
 * of the page and the command line goes through here (via {@link csvCell}).
 */
export function neutraliseFormula(text: string): string {
  return FORMULA_START.test(text) && !PLAIN_NUMBER_TEXT.test(text) ? `'${text}` : text;
}

/** One cell as CSV text (see {@link writeCsv}); text that could run as a formula is neutralised. */
export function csvCell(cell: CsvCell): string {
  if (cell === null || cell === undefined) return '';
  if (typeof cell === 'number') return Number.isFinite(cell) ? String(cell) : '';
  const text = neutraliseFormula(String(cell));
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * Splits one line into cells with the given delimiter, honouring RFC 4180 double quotes (for
 * header lines, where names may be quoted). Data rows use a faster split of their own.
 */
export function splitQuoted(line: string, delimiter: Delimiter): string[] {
  const result = Papa.parse<string[]>(line, { delimiter, quoteChar: '"', newline: '\n', skipEmptyLines: false });
  return (result.data[0] ?? []).map((cell) => cell.trim());
}

/** Index of the name `wanted` (exact, else ignoring case and surrounding spaces), or −1. */
export function indexOfName(names: readonly string[], wanted: string): number {
  const exact = names.indexOf(wanted);
  if (exact >= 0) return exact;
  const lower = wanted.trim().toLowerCase();
  return names.findIndex((n) => n.toLowerCase() === lower);
}
