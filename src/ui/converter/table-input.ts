/**
 * Small tables typed or pasted by people: the distance table (distance, delay, optional sd per
 * row) and the sweep ("x, delay" lines). Each bad cell gives a message naming the row or line, the
 * column and the valid range. Pure functions.
 */
import { type Dimension, fromBaseUnit, parseQuantity, QuantityParseError, type Unit } from '../../io/quantity';
import { DELAY_LIMITS } from '../../physics';
import { plain } from '../units/format-number';

/** Last good points of the distance table (SI), with their 1-based table rows. */
export interface DistancePoints {
  points: { distance_m: number; delay_s: number; delaySd_s?: number }[];
  rows: number[];
}

export type TableRead<T> = { ok: true; value: T } | { ok: false; message: string };

export interface CellSpec {
  name: string;
  dimension: Dimension;
  range: readonly [number, number];
}

export const DISTANCE_CELL: CellSpec = { name: 'distance', dimension: 'length', range: DELAY_LIMITS.distance_m };
export const DELAY_CELL: CellSpec = { name: 'delay', dimension: 'time', range: [-DELAY_LIMITS.delay_s[1], DELAY_LIMITS.delay_s[1]] };
export const SD_CELL: CellSpec = { name: 'delay sd', dimension: 'time', range: [1e-15, DELAY_LIMITS.delaySd_s[1]] };
export const SWEEP_DELAY_CELL: CellSpec = { name: 'delay', dimension: 'time', range: DELAY_LIMITS.delay_s };

/** A column's valid range in its unit, as the cells' messages give it: "0.001 mm – 100000 mm". */
export function cellRangeText(spec: CellSpec, unit: Unit): string {
  const show = (x: number) => `${plain(fromBaseUnit(x, unit))} ${unit}`;
  return `${show(spec.range[0])} – ${show(spec.range[1])}`;
}
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** One cell in SI, or the message naming `where` (e.g. "Row 2"), the column and the valid range. */
function readCell(where: string, spec: CellSpec, text: string, unit: Unit): TableRead<number> {
  const t = text.replace(/\u2212/g, '-').trim();
  let value: number;
  try {
    value = parseQuantity(NUMBER.test(t) ? `${t} ${unit}` : t, spec.dimension);
  } catch (error) {
    if (error instanceof QuantityParseError) return { ok: false, message: `${where}, ${spec.name}: ${error.detail}.` };
    throw error;
  }
  const [min, max] = spec.range;
  if (value < min || value > max) {
    const show = (x: number) => `${plain(fromBaseUnit(x, unit))} ${unit}`;
    return { ok: false, message: `${where}, ${spec.name} ${show(value)} is outside the valid range ${cellRangeText(spec, unit)}.` };
  }
  return { ok: true, value };
}

export interface DistanceRowText {
  distance: string;
  delay: string;
  sd: string;
}

/** The distance table → points (blank rows skipped; the sd is optional on all rows or none). */
export function readDistanceRows(rows: readonly DistanceRowText[], units: { distance: Unit; delay: Unit; sd: Unit }): TableRead<DistancePoints> {
  const out: DistancePoints = { points: [], rows: [] };
  for (const [i, row] of rows.entries()) {
    if (row.distance.trim() === '' && row.delay.trim() === '' && row.sd.trim() === '') continue;
    const where = `Row ${i + 1}`;
    const d = readCell(where, DISTANCE_CELL, row.distance, units.distance);
    if (!d.ok) return d;
    const t = readCell(where, DELAY_CELL, row.delay, units.delay);
    if (!t.ok) return t;
    const point: DistancePoints['points'][number] = { distance_m: d.value, delay_s: t.value };
    if (row.sd.trim() !== '') {
      const sd = readCell(where, SD_CELL, row.sd, units.sd);
      if (!sd.ok) return sd;
      point.delaySd_s = sd.value;
    }
    out.points.push(point);
    out.rows.push(i + 1);
  }
  return { ok: true, value: out };
}

/** Splits pasted text into rows of cells (tab, comma, semicolon or spaces between cells). */
export function splitPasted(text: string): string[][] {
  return text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter((line) => line !== '' && !line.startsWith('#'))
    .map((line) => line.split(/\s*[\t,;]\s*|\s+/).filter((c) => c !== ''));
}

/**
 * "x, delay" lines of a sweep → points. Blank and "#" lines are skipped, as is a first line of
 * column names; x is any increasing or unordered coordinate (time, reading number).
 */
export function readSweepText(text: string, unit: Unit): TableRead<{ x: number; delay_s: number }[]> {
  const points: { x: number; delay_s: number }[] = [];
  const lines = text.split(/\r?\n/);
  let seenData = false;
  for (const [i, raw] of lines.entries()) {
    const line = raw.trim();
    if (line === '' || line.startsWith('#')) continue;
    const cells = line.split(/\s*[\t,;]\s*|\s+/).filter((c) => c !== '');
    const where = `Line ${i + 1}`;
    if (!seenData && cells.length > 0 && cells.every((c) => !NUMBER.test(c.replace(/\u2212/g, '-')))) continue;
    seenData = true;
    if (cells.length !== 2) return { ok: false, message: `${where}: “${clip(line)}” needs two numbers, x and delay, got ${cells.length} cell${cells.length === 1 ? '' : 's'}.` };
    const x = Number((cells[0] as string).replace(/\u2212/g, '-'));
    if (!NUMBER.test((cells[0] as string).replace(/\u2212/g, '-')) || !Number.isFinite(x) || Math.abs(x) > 1e12) {
      return { ok: false, message: `${where}, x: “${clip(cells[0] as string)}” is not a number within ±1e12.` };
    }
    const delay = readCell(where, SWEEP_DELAY_CELL, cells[1] as string, unit);
    if (!delay.ok) return delay;
    points.push({ x, delay_s: delay.value });
  }
  if (points.length === 0) return { ok: false, message: 'The sweep is empty: paste lines of “x, delay”.' };
  return { ok: true, value: points };
}

function clip(text: string): string {
  return text.length > 40 ? `${text.slice(0, 40)}…` : text;
}
