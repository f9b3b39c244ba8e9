/**
 * How a trace CSV is laid out, as the streaming parser (trace-csv.ts) reads it: the shape of a line
 * of numbers, the metadata fields of the header, the time column's name and unit, and whether a
 * unitless time column counts samples.
 */
import { type Delimiter, readNumberCell, splitQuoted, unitOfColumn } from './csv-common';

/** Names a time column goes by (its unit, if any, removed). */
export const TIME_NAMES: ReadonlySet<string> = new Set(['time', 't', 's', 'sec', 'secs', 'seconds', 'x', 'time_s']);

export type TimeUnit = 's' | 'ms' | 'us' | 'ns';
/** Each time unit's power of ten in seconds. */
export const TIME_UNIT_POW10: Readonly<Record<TimeUnit, number>> = { s: 0, ms: -3, us: -6, ns: -9 };

/** The delimiter, width and trailing delimiter of a line of numbers. */
export interface Shape {
  delimiter: Delimiter;
  cells: number;
  trailing: boolean;
}

/** The delimiter and width of a line of numbers, or null if it is not one. */
export function shapeOf(text: string): Shape | null {
  for (const delimiter of ['\t', ';', ','] as const) {
    if (!text.includes(delimiter)) continue;
    const cells = text.split(delimiter);
    let trailing = false;
    if (cells.length > 2 && (cells[cells.length - 1] as string).trim() === '') {
      cells.pop();
      trailing = true;
    }
    if (cells.length < 2) continue;
    const comma = delimiter !== ',';
    if (cells.every((c) => Number.isFinite(readNumberCell(c, comma)))) return { delimiter, cells: cells.length, trailing };
  }
  return null;
}

export function sameShape(a: Shape, b: Shape): boolean {
  return a.delimiter === b.delimiter && a.cells === b.cells && a.trailing === b.trailing;
}

export function headerFields(lines: readonly string[], delimiter: Delimiter): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const raw of lines) {
    const text = raw.replace(/^\s*[#%]+\s*/, '').trim();
    const kv = /^([^:=]+?)\s*[:=]\s*(.*)$/.exec(text);
    if (kv) {
      fields[kv[1] as string] = (kv[2] as string).trim();
      continue;
    }
    const cells = splitQuoted(text, delimiter).filter((c) => c !== '');
    if (cells.length === 2) fields[cells[0] as string] = cells[1] as string;
  }
  return fields;
}

export function timeUnitOf(name: string): TimeUnit | undefined {
  const unit = unitOfColumn(name, 'time');
  if (!unit) return undefined;
  return (Object.keys(TIME_UNIT_POW10) as TimeUnit[]).find((u) => TIME_UNIT_POW10[u] === unit.pow10);
}

/**
 * Whether a time column with no unit counts samples: at least three rows, every value a whole
 * number and every step exactly 1 (sample numbers, never seconds of a second-sound trace).
 */
export function countsSamples(time: Float64Array): boolean {
  if (time.length < 3) return false;
  for (let i = 0; i < time.length; i++) {
    const t = time[i] as number;
    if (!Number.isInteger(t) || (i > 0 && t - (time[i - 1] as number) !== 1)) return false;
  }
  return true;
}
