/**
 * Resonator data as CSV, for the page and the command line alike (runs in node and in a browser):
 *
 *  - a frequency sweep: `frequency_Hz` (also `frequency`, `freq`; a unit in the name scales it:
 *    `frequency_kHz`, `freq (MHz)`), and either `x` and `y` (also `X`/`Y`, `in_phase`/`quadrature`)
 *    or `amplitude` (also `magnitude`, `r`). A voltage unit in a signal column's name (`x_mV`,
 *    `y (uV)`) scales it to volts; without one the numbers are used as they are.
 *  - a lock-in record at a fixed drive: `time_s` (also `time`, `t`; `time_ms` …), `x`, `y`.
 *
 * Header row required; encoding, delimiter, comments and quoting as the other small tables
 * (small-csv.ts); 64 MiB at most. Every refusal is a {@link CsvInputError} naming the column, the
 * line and the valid range.
 */
import { RESONANCE_LIMITS, type SweepData } from '../physics';
import { type ColumnDimension, CsvInputError, readNumberCell, toSi, unitOfColumn } from './csv-common';
import { type CsvTable, scanCsvTable, type TableColumn } from './small-csv';

/** Most points a sweep may hold. */
export const SWEEP_MAX_POINTS = 1_000_000;
/** Most rows a lock-in record may hold. */
export const LOCKIN_MAX_RECORD_ROWS = 5_000_000;

export interface SweepCsv extends SweepData {
  kind: 'complex' | 'amplitude';
  /** Line of the file of each point. */
  lines: Int32Array;
  /** The column names read, for messages and the page. */
  columns: { frequency: string; x?: string; y?: string; amplitude?: string };
}

export interface LockinCsv {
  time_s: Float64Array;
  x: Float64Array;
  y: Float64Array;
  lines: Int32Array;
  columns: { time: string; x: string; y: string };
}

const FREQUENCY_NAMES = ['frequency', 'freq', 'f'];
const X_NAMES = ['x', 'in_phase', 'in-phase', 'inphase', 'in phase'];
const Y_NAMES = ['y', 'quadrature', 'quad'];
const AMPLITUDE_NAMES = ['amplitude', 'magnitude', 'amp', 'r'];
const TIME_NAMES = ['time', 't'];

/** Reads a frequency sweep. Throws {@link CsvInputError}. */
export function parseSweepCsv(input: string | Uint8Array): SweepCsv {
  let frequency: TableColumn | undefined;
  let x: TableColumn | undefined;
  let y: TableColumn | undefined;
  let amplitude: TableColumn | undefined;
  const f = new Grow();
  const a = new Grow();
  const b = new Grow();
  const lines = new Grow();
  let previous = Number.NaN;
  let direction = 0;
  scanCsvTable(input, 'sweep', {
    header(table) {
      frequency = findColumn(table, FREQUENCY_NAMES, 'frequency');
      x = findColumn(table, X_NAMES, 'voltage');
      y = findColumn(table, Y_NAMES, 'voltage');
      amplitude = findColumn(table, AMPLITUDE_NAMES, 'voltage');
      if (!frequency) throw missing(table, 'frequency_Hz', 'the sweep needs a frequency column');
      if ((x === undefined) !== (y === undefined)) {
        throw missing(table, x ? 'y' : 'x', 'x (in-phase) and y (quadrature) come together');
      }
      if (!x && !amplitude) throw missing(table, 'x and y, or amplitude', 'the sweep needs the signal');
    },
    row(table, row) {
      if (f.length >= SWEEP_MAX_POINTS) throw new CsvInputError('too-large', `a sweep holds at most ${SWEEP_MAX_POINTS} points`, row.line);
      const fr = cell(table, row, frequency as TableColumn);
      if (fr < RESONANCE_LIMITS.frequency_Hz[0] || fr > RESONANCE_LIMITS.frequency_Hz[1]) {
        throw new CsvInputError('out-of-range', `column "${(frequency as TableColumn).name}": ${fr} Hz is outside the valid range ${RESONANCE_LIMITS.frequency_Hz[0]}–${RESONANCE_LIMITS.frequency_Hz[1]} Hz`, row.line);
      }
      if (f.length > 0) {
        const step = Math.sign(fr - previous);
        if (step === 0 || (direction !== 0 && step !== direction)) {
          throw new CsvInputError('time-order', `column "${(frequency as TableColumn).name}": ${fr} Hz after ${previous} Hz; a sweep's frequencies rise (or fall) steadily`, row.line);
        }
        direction = step;
      }
      previous = fr;
      f.push(fr);
      if (x && y) {
        a.push(cell(table, row, x));
        b.push(cell(table, row, y));
      } else a.push(cell(table, row, amplitude as TableColumn));
      lines.push(row.line);
    },
  });
  if (f.length < 12) throw new CsvInputError('no-data', `a resonance fit needs at least 12 rows, got ${f.length}`);
  const fc = frequency as TableColumn;
  if (x && y) {
    return { kind: 'complex', frequency_Hz: f.done(), x: a.done(), y: b.done(), lines: Int32Array.from(lines.done()), columns: { frequency: fc.name, x: x.name, y: y.name } };
  }
  return { kind: 'amplitude', frequency_Hz: f.done(), amplitude: a.done(), lines: Int32Array.from(lines.done()), columns: { frequency: fc.name, amplitude: (amplitude as TableColumn).name } };
}

/** Reads a lock-in record (time, x, y). Throws {@link CsvInputError}. */
export function parseLockinCsv(input: string | Uint8Array): LockinCsv {
  let time: TableColumn | undefined;
  let x: TableColumn | undefined;
  let y: TableColumn | undefined;
  const t = new Grow();
  const a = new Grow();
  const b = new Grow();
  const lines = new Grow();
  let previous = Number.NEGATIVE_INFINITY;
  scanCsvTable(input, 'lock-in', {
    header(table) {
      time = findColumn(table, TIME_NAMES, 'time');
      x = findColumn(table, X_NAMES, 'voltage');
      y = findColumn(table, Y_NAMES, 'voltage');
      if (!time) throw missing(table, 'time_s', 'the lock-in record needs a time column');
      if (!x || !y) throw missing(table, !x ? 'x' : 'y', 'the lock-in record needs x (in-phase) and y (quadrature)');
    },
    row(table, row) {
      if (t.length >= LOCKIN_MAX_RECORD_ROWS) throw new CsvInputError('too-large', `a lock-in record holds at most ${LOCKIN_MAX_RECORD_ROWS} rows`, row.line);
      const ti = cell(table, row, time as TableColumn);
      if (!(ti > previous)) throw new CsvInputError('time-order', `column "${(time as TableColumn).name}": ${ti} s does not follow ${previous} s; times must increase`, row.line);
      previous = ti;
      t.push(ti);
      a.push(cell(table, row, x as TableColumn));
      b.push(cell(table, row, y as TableColumn));
      lines.push(row.line);
    },
  });
  if (t.length < 2) throw new CsvInputError('no-data', `a lock-in record needs at least 2 rows, got ${t.length}`);
  return {
    time_s: t.done(),
    x: a.done(),
    y: b.done(),
    lines: Int32Array.from(lines.done()),
    columns: { time: (time as TableColumn).name, x: (x as TableColumn).name, y: (y as TableColumn).name },
  };
}

/** A column whose name, without a unit of `dimension`, is one of `names` (case-blind); the first wins. */
function findColumn(table: CsvTable, names: readonly string[], dimension: ColumnDimension): TableColumn | undefined {
  for (let index = 0; index < table.header.length; index++) {
    const name = table.header[index] as string;
    const unit = unitOfColumn(name, dimension);
    const base = (unit ? stripUnit(name) : name).trim().toLowerCase();
    if (names.includes(base)) return { index, name, pow10: unit?.pow10 ?? 0 };
  }
  return undefined;
}

/** "frequency_Hz" → "frequency", "freq (kHz)" → "freq", "x/mV" → "x". */
function stripUnit(name: string): string {
  const text = name.trim().replace(/\s*[([][^)\]]*[)\]]\s*$/, '');
  if (text !== name.trim()) return text;
  const match = /^(.*?)[\s_/]+[^\s_/]+$/.exec(text);
  return match ? (match[1] as string) : text;
}

function cell(table: CsvTable, row: { line: number; cells: string[] }, column: TableColumn): number {
  const raw = (row.cells[column.index] ?? '').trim();
  const value = readNumberCell(raw, table.delimiter !== ',');
  if (!Number.isFinite(value)) {
    const what = raw === '' ? 'empty cell' : `"${raw.length > 24 ? `${raw.slice(0, 24)}…` : raw}" is not a finite number`;
    throw new CsvInputError('not-a-number', `column "${column.name}": ${what}`, row.line);
  }
  return toSi(value, column.pow10);
}

function missing(table: CsvTable, name: string, why: string): CsvInputError {
  return new CsvInputError('missing-column', `no column "${name}" in the header (${why}); columns: ${table.header.join(', ')}`, table.headerLine);
}

/** A growing Float64Array. */
class Grow {
  private data = new Float64Array(1024);
  length = 0;

  push(v: number): void {
    if (this.length === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = v;
  }

  done(): Float64Array {
    return this.data.slice(0, this.length);
  }
}
