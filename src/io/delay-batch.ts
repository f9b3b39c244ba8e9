/**
 * A batch of delays as CSV → a table of speeds and temperature candidates, and back to CSV.
 * Runs in node and in a browser Web Worker: no node-only imports.
 *
 * Input (see small-csv for encoding, delimiter, comments and decimal commas): a header row, then
 * one reading per row, taken in file order.
 *  - delay: the column `delay_s` by default (also found as delay_ms, delay_us, "delay (ns)", …),
 *    or the column named by `column`; a unit in its name scales it, none means seconds.
 *  - distance_m (optional, also distance_mm, …): the heater–sensor path of that row; an empty cell
 *    or no column uses the default distance.
 *  - pressure_Pa (optional, also pressure_mbar, pressure_kPa, pressure_bar): the bath vapour
 *    pressure read with that delay; it chooses that row's temperature (ITS-90).
 *  - timestamp (optional): any text, echoed unchanged.
 *  Other columns are ignored.
 *
 * Choice of temperature per row: a row with a pressure takes the candidate nearest its ITS-90
 * vapour-pressure temperature; the rows after it follow by continuity (the kernel's
 * chooseAlongSeries: nearest to the previous choice) until the next row with a pressure. Before
 * the first pressure, a start rule decides (e.g. "near 1.8 K"); without one, the first row with a
 * single candidate starts the series. Rows nothing decides stay undecided (empty `chosen`).
 *
 * Output columns (one row per input row, in order; header always the same for the same input):
 *   line, [timestamp], <delay column as in the input, in its own unit>, distance_m, [pressure_Pa],
 *   speed_m_s, speedSd_m_s, candidates (count 0–3), chosen (1–3 or empty), chosen_by
 *   (pressure | near | range | only candidate | continuity | empty), T_K, T_sd_K (the chosen one),
 *   then for i = 1…3: Ti_K, Ti_sd_K, Ti_branch (low | middle | high), Ti_note (space-separated:
 *   "extremum", "insensitive", "Landau-model", "critical-scaling"; empty for a plain root);
 *   candidates coldest first, empty cells where a row has fewer. [..] columns appear only when
 *   the input has them. Numbers in full (shortest round-trip) precision.
 */
import {
  type ChoiceRule,
  chooseAlongSeries,
  convertDelay,
  type DelayConversion,
  PhysicsError,
  PROPERTIES_RANGE_K,
  type TemperatureCandidate,
} from '../physics';
import { type CsvCell, CsvInputError, writeCsv } from './csv-common';
import { type CsvTable, columnByBase, columnList, columnNamed, numberAt, readCsvTable, type TableColumn } from './small-csv';

/** The delay column's default name. */
export const DEFAULT_DELAY_COLUMN = 'delay_s';
/** Most candidates a speed can have (three roots between the extrema of u2). */
export const MAX_CANDIDATES = 3;

/** One reading of the batch. */
export interface DelayRow {
  line: number;
  /** The delay as written in its column's unit, for echoing. */
  delayAsWritten: number;
  delay_s: number;
  distance_m?: number;
  pressure_Pa?: number;
  timestamp?: string;
}

export interface DelayBatch {
  rows: DelayRow[];
  /** Name of the delay column as in the file. */
  delayColumn: string;
  hasTimestamp: boolean;
  hasPressure: boolean;
}

/**
 * Reads a delay batch. Throws {@link CsvInputError} naming the line of a malformed row, or the
 * missing column with the columns present.
 */
export function parseDelayCsv(input: string | Uint8Array, options: { column?: string } = {}): DelayBatch {
  const table = readCsvTable(input, 'delay');
  const delay = findDelayColumn(table, options.column);
  const distance = columnByBase(table, 'distance', 'length');
  const pressure = columnByBase(table, 'pressure', 'pressure');
  const timestamp = columnNamed(table, 'timestamp', null);
  const rows = table.rows.map((row): DelayRow => {
    const delay_s = numberAt(table, row, delay) as number;
    const out: DelayRow = { line: row.line, delayAsWritten: numberAt(table, row, { ...delay, pow10: 0 }) as number, delay_s };
    const d = distance ? numberAt(table, row, distance, true) : undefined;
    if (d !== undefined) out.distance_m = d;
    const p = pressure ? numberAt(table, row, pressure, true) : undefined;
    if (p !== undefined) out.pressure_Pa = p;
    if (timestamp) out.timestamp = (row.cells[timestamp.index] ?? '').trim();
    return out;
  });
  if (rows.length === 0) throw new CsvInputError('no-data', `no delays after the header (line ${table.headerLine})`);
  return { rows, delayColumn: delay.name, hasTimestamp: timestamp !== undefined, hasPressure: pressure !== undefined };
}

function findDelayColumn(table: CsvTable, column: string | undefined): TableColumn {
  const found = column === undefined ? (columnNamed(table, DEFAULT_DELAY_COLUMN, 'time') ?? columnByBase(table, 'delay', 'time')) : columnNamed(table, column, 'time');
  if (found) return found;
  const wanted = column ?? DEFAULT_DELAY_COLUMN;
  throw new CsvInputError('missing-column', `no column "${wanted}" in the header; columns: ${columnList(table)}`, table.headerLine);
}

/** Settings shared by every row: defaults and uncertainties (SI). */
export interface DelayBatchSettings {
  /** Distance for rows without their own, m. */
  distance_m?: number;
  distanceSd_m?: number;
  delaySd_s?: number;
  offset_s?: number;
  offsetSd_s?: number;
  /** Decides the series before its first row with a pressure (else: the first single candidate). */
  start?: ChoiceRule;
}

export type ChosenBy = 'pressure' | 'near' | 'range' | 'only candidate' | 'continuity';

export interface DelayResult extends DelayConversion {
  row: DelayRow;
  distance_m: number;
  /** Index into `candidates`, or null. */
  chosen: number | null;
  chosenBy: ChosenBy | null;
}

/** The start rule used when none is given: decides only a reading with a single candidate. */
const ONLY_CANDIDATE: ChoiceRule = { kind: 'range', min_K: 0, max_K: PROPERTIES_RANGE_K[1] };

/**
 * Converts every row (kernel convertDelay) and chooses temperatures as described above.
 * Throws {@link CsvInputError} naming the line for a row the kernel refuses (its message says
 * which quantity and range) or a row without any distance.
 */
export function convertDelayBatch(batch: DelayBatch, settings: DelayBatchSettings): DelayResult[] {
  const conversions = batch.rows.map((row) => {
    const distance_m = row.distance_m ?? settings.distance_m;
    if (distance_m === undefined) throw new CsvInputError('missing-column', 'no distance: give a default distance or a distance_m cell', row.line);
    try {
      const conversion = convertDelay({
        distance_m,
        delay_s: row.delay_s,
        distanceSd_m: settings.distanceSd_m ?? 0,
        delaySd_s: settings.delaySd_s ?? 0,
        offset_s: settings.offset_s ?? 0,
        offsetSd_s: settings.offsetSd_s ?? 0,
      });
      // Fields copied one by one: an object spread here costs several times the conversion.
      const result: DelayResult = {
        speed_m_s: conversion.speed_m_s,
        speedSd_m_s: conversion.speedSd_m_s,
        candidates: conversion.candidates,
        row,
        distance_m,
        chosen: null,
        chosenBy: null,
      };
      return result;
    } catch (error) {
      if (error instanceof PhysicsError) throw new CsvInputError('out-of-range', error.message, row.line);
      throw error;
    }
  });
  // Runs: each starts at a row with a pressure (or at the top), continuity inside.
  let runStart = 0;
  for (let i = 1; i <= conversions.length; i++) {
    if (i === conversions.length || conversions[i]?.row.pressure_Pa !== undefined) {
      chooseRun(conversions.slice(runStart, i), settings.start);
      runStart = i;
    }
  }
  return conversions;
}

function chooseRun(run: DelayResult[], start: ChoiceRule | undefined): void {
  const head = run[0];
  if (!head) return;
  const rule: ChoiceRule = head.row.pressure_Pa !== undefined ? { kind: 'pressure', pressure_Pa: head.row.pressure_Pa } : (start ?? ONLY_CANDIDATE);
  const label: ChosenBy = rule === ONLY_CANDIDATE ? 'only candidate' : rule.kind;
  let choices: ReturnType<typeof chooseAlongSeries>;
  try {
    choices = chooseAlongSeries(
      run.map((r) => r.candidates),
      rule,
    );
  } catch (error) {
    if (error instanceof PhysicsError) throw new CsvInputError('out-of-range', error.message, head.row.line);
    throw error;
  }
  let decided = false;
  run.forEach((result, k) => {
    const index = choices[k]?.index ?? null;
    result.chosen = index;
    result.chosenBy = index === null ? null : decided ? 'continuity' : label;
    if (index !== null) decided = true;
  });
}

/** Words for a candidate's note column. */
function noteOf(c: TemperatureCandidate): string {
  const words: string[] = [];
  if (c.kind === 'extremum') words.push('extremum');
  if (c.insensitive) words.push('insensitive');
  if (c.region === 'Landau model') words.push('Landau-model');
  if (c.region === 'critical scaling') words.push('critical-scaling');
  return words.join(' ');
}

/** The output header for a batch (see the module comment). */
export function delayResultHeader(batch: Pick<DelayBatch, 'delayColumn' | 'hasTimestamp' | 'hasPressure'>): string[] {
  const header = ['line'];
  if (batch.hasTimestamp) header.push('timestamp');
  header.push(batch.delayColumn, 'distance_m');
  if (batch.hasPressure) header.push('pressure_Pa');
  header.push('speed_m_s', 'speedSd_m_s', 'candidates', 'chosen', 'chosen_by', 'T_K', 'T_sd_K');
  for (let i = 1; i <= MAX_CANDIDATES; i++) header.push(`T${i}_K`, `T${i}_sd_K`, `T${i}_branch`, `T${i}_note`);
  return header;
}

/** One output row's cells, in the order of {@link delayResultHeader}. */
export function delayResultCells(batch: Pick<DelayBatch, 'hasTimestamp' | 'hasPressure'>, r: DelayResult): CsvCell[] {
  const cells: CsvCell[] = [r.row.line];
  if (batch.hasTimestamp) cells.push(r.row.timestamp ?? '');
  cells.push(r.row.delayAsWritten, r.distance_m);
  if (batch.hasPressure) cells.push(r.row.pressure_Pa ?? null);
  const chosen = r.chosen === null ? undefined : r.candidates[r.chosen];
  cells.push(r.speed_m_s, r.speedSd_m_s, r.candidates.length, r.chosen === null ? null : r.chosen + 1, r.chosenBy ?? '', chosen?.temperature_K, chosen?.sd_K);
  for (let i = 0; i < MAX_CANDIDATES; i++) {
    const c = r.candidates[i];
    cells.push(c?.temperature_K, c?.sd_K, c?.branch, c ? noteOf(c) : undefined);
  }
  return cells;
}

/** The results as CSV text (RFC 4180 quoting, LF line ends, a header row first). */
export function delayResultsToCsv(batch: DelayBatch, results: readonly DelayResult[]): string {
  return writeCsv(
    delayResultHeader(batch),
    results.map((r) => delayResultCells(batch, r)),
  );
}
