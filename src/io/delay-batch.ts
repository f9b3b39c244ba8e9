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
 * seriesChooser: nearest to the previous choice) until the next row with a pressure. Before
 * the first decided row, a start rule decides (e.g. "near 1.8 K"); without one, the first row with
 * a single candidate starts the series. Rows nothing decides stay undecided (empty `chosen`).
 * The choice is made row by row (the kernel's seriesChooser) as results are stored in typed
 * arrays, so the series is never held as objects.
 *
 * Output columns (one row per input row, in order; header always the same for the same input):
 *   line, [timestamp], <delay column as in the input, in its own unit>, distance_m, [pressure_Pa],
 *   speed_m_s, speedSd_m_s, candidates (count 0–3), chosen (1–3 or empty), chosen_by
 *   (pressure | near | range | only candidate | continuity | empty), T_K, T_sd_K (the chosen one),
 *   then for i = 1…3: Ti_K, Ti_sd_K, Ti_branch (low | middle | high), Ti_note (space-separated:
 *   "extremum", "insensitive", "Landau-model", "critical-scaling"; empty for a plain root);
 *   candidates coldest first, empty cells where a row has fewer. [..] columns appear only when
 *   the input has them. Numbers in full (shortest round-trip) precision.
 *   With {@link ResultUnits} (the page's display units) the columns of a kind are in that unit
 *   and named for it (T_mK, distance_mm, pressure_mbar, and delay_us in place of the echoed delay).
 */
import { tooSlowForSecondSound } from './speed-plausibility';
import {
  type Branch,
  type ChoiceRule,
  convertDelay,
  type DelayConversion,
  PhysicsError,
  PROPERTIES_RANGE_K,
  type SeriesChoiceBy,
  seriesChooser,
  type TemperatureCandidate,
} from '../physics';
import { type CsvCell, CsvInputError, columnWithUnit, writeCsv } from './csv-common';
import { fromBaseUnit, type Unit } from './quantity';
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

/** Codes of the typed-array columns of {@link DelayBatchResults}. */
export const BRANCH_CODES: readonly Branch[] = ['low', 'middle', 'high'];
export const REGION_CODES: readonly TemperatureCandidate['region'][] = ['measured', 'Landau model', 'critical scaling'];
export const KIND_CODES: readonly TemperatureCandidate['kind'][] = ['root', 'extremum'];
export const CHOSEN_BY_CODES: readonly ChosenBy[] = ['pressure', 'near', 'range', 'only candidate', 'continuity'];
/** Code of "none" in the Uint8Array code columns. */
export const NO_CODE = 255;

/**
 * Results of a batch, column by column in typed arrays (numbers only, so a batch of any length
 * costs no garbage collection and a Web Worker can transfer the buffers). Candidate k (0–2,
 * coldest first) of row i sits at index 3i + k; NaN and {@link NO_CODE} where a row has fewer.
 * {@link delayResultAt} gives one row as objects.
 */
export interface DelayBatchResults {
  batch: DelayBatch;
  count: number;
  distance_m: Float64Array;
  speed_m_s: Float64Array;
  speedSd_m_s: Float64Array;
  candidateCount: Uint8Array;
  temperature_K: Float64Array;
  sd_K: Float64Array;
  slope_m_s_K: Float64Array;
  /** Index into {@link BRANCH_CODES}. */
  branch: Uint8Array;
  /** Index into {@link REGION_CODES}. */
  region: Uint8Array;
  /** Index into {@link KIND_CODES}. */
  kind: Uint8Array;
  /** 1 where the candidate is insensitive (near an extremum of u2). */
  insensitive: Uint8Array;
  /** Index of the chosen candidate, or −1. */
  chosen: Int8Array;
  /** Index into {@link CHOSEN_BY_CODES}, or {@link NO_CODE}. */
  chosenBy: Uint8Array;
}

/** One row of a batch as objects. */
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
 * Converts every row (kernel convertDelay) and chooses temperatures as described above, row by
 * row, with the kernel's seriesChooser: a row with a pressure by its pressure; after a decided row,
 * by continuity (nearest to the previous choice); before any, by the start rule. Throws {@link CsvInputError} naming the line for a row the kernel refuses
 * (its message says which quantity and range) or a row without any distance.
 */
export function convertDelayBatch(batch: DelayBatch, settings: DelayBatchSettings): DelayBatchResults {
  const n = batch.rows.length;
  const m = n * MAX_CANDIDATES;
  const out: DelayBatchResults = {
    batch,
    count: n,
    distance_m: new Float64Array(n),
    speed_m_s: new Float64Array(n),
    speedSd_m_s: new Float64Array(n),
    candidateCount: new Uint8Array(n),
    temperature_K: new Float64Array(m).fill(Number.NaN),
    sd_K: new Float64Array(m).fill(Number.NaN),
    slope_m_s_K: new Float64Array(m).fill(Number.NaN),
    branch: new Uint8Array(m).fill(NO_CODE),
    region: new Uint8Array(m).fill(NO_CODE),
    kind: new Uint8Array(m).fill(NO_CODE),
    insensitive: new Uint8Array(m),
    chosen: new Int8Array(n).fill(-1),
    chosenBy: new Uint8Array(n).fill(NO_CODE),
  };
  const choose = seriesChooser(settings.start ?? ONLY_CANDIDATE);
  const byCode: Readonly<Record<SeriesChoiceBy, number>> = {
    own: CHOSEN_BY_CODES.indexOf('pressure'),
    start: CHOSEN_BY_CODES.indexOf(settings.start ? settings.start.kind : 'only candidate'),
    continuity: CHOSEN_BY_CODES.indexOf('continuity'),
  };
  const reading = {
    distance_m: 0,
    delay_s: 0,
    distanceSd_m: settings.distanceSd_m ?? 0,
    delaySd_s: settings.delaySd_s ?? 0,
    offset_s: settings.offset_s ?? 0,
    offsetSd_s: settings.offsetSd_s ?? 0,
  };
  for (let i = 0; i < n; i++) {
    const row = batch.rows[i] as DelayRow;
    const distance_m = row.distance_m ?? settings.distance_m;
    if (distance_m === undefined) throw new CsvInputError('missing-column', 'no distance: give a default distance or a distance_m cell', row.line);
    reading.distance_m = distance_m;
    reading.delay_s = row.delay_s;
    let candidates: TemperatureCandidate[];
    let index: number | null;
    let by: SeriesChoiceBy;
    const slow = tooSlowForSecondSound(distance_m / (row.delay_s - reading.offset_s));
    if (slow !== null) throw new CsvInputError('out-of-range', slow, row.line);
    try {
      const conversion = convertDelay(reading);
      candidates = conversion.candidates;
      out.speed_m_s[i] = conversion.speed_m_s;
      out.speedSd_m_s[i] = conversion.speedSd_m_s;
      ({ index, by } = choose(candidates, row.pressure_Pa === undefined ? null : { kind: 'pressure', pressure_Pa: row.pressure_Pa }));
    } catch (error) {
      if (error instanceof PhysicsError) throw new CsvInputError('out-of-range', error.message, row.line);
      throw error;
    }
    out.distance_m[i] = distance_m;
    const count = Math.min(candidates.length, MAX_CANDIDATES);
    out.candidateCount[i] = count;
    for (let k = 0; k < count; k++) {
      const c = candidates[k] as TemperatureCandidate;
      const j = i * MAX_CANDIDATES + k;
      out.temperature_K[j] = c.temperature_K;
      out.sd_K[j] = c.sd_K;
      out.slope_m_s_K[j] = c.slope_m_s_K;
      out.branch[j] = BRANCH_CODES.indexOf(c.branch);
      out.region[j] = REGION_CODES.indexOf(c.region);
      out.kind[j] = KIND_CODES.indexOf(c.kind);
      out.insensitive[j] = c.insensitive ? 1 : 0;
    }
    if (index !== null && index < count) {
      out.chosen[i] = index;
      out.chosenBy[i] = byCode[by];
    }
  }
  return out;
}

/** The candidates of row `i` as the kernel's objects, coldest first. */
export function candidatesAt(results: DelayBatchResults, i: number): TemperatureCandidate[] {
  const out: TemperatureCandidate[] = [];
  for (let k = 0; k < (results.candidateCount[i] ?? 0); k++) {
    const j = i * MAX_CANDIDATES + k;
    out.push({
      temperature_K: results.temperature_K[j] as number,
      sd_K: results.sd_K[j] as number,
      slope_m_s_K: results.slope_m_s_K[j] as number,
      branch: BRANCH_CODES[results.branch[j] as number] as Branch,
      insensitive: results.insensitive[j] === 1,
      region: REGION_CODES[results.region[j] as number] as TemperatureCandidate['region'],
      kind: KIND_CODES[results.kind[j] as number] as TemperatureCandidate['kind'],
    });
  }
  return out;
}

/** Row `i` of the results as objects. */
export function delayResultAt(results: DelayBatchResults, i: number): DelayResult {
  const chosen = results.chosen[i] as number;
  return {
    row: results.batch.rows[i] as DelayRow,
    distance_m: results.distance_m[i] as number,
    speed_m_s: results.speed_m_s[i] as number,
    speedSd_m_s: results.speedSd_m_s[i] as number,
    candidates: candidatesAt(results, i),
    chosen: chosen < 0 ? null : chosen,
    chosenBy: CHOSEN_BY_CODES[results.chosenBy[i] as number] ?? null,
  };
}

/** Every row of the results as objects (for small batches; large ones read the columns). */
export function delayResultList(results: DelayBatchResults): DelayResult[] {
  return Array.from({ length: results.count }, (_, i) => delayResultAt(results, i));
}

/** Words for a candidate's note column. */
function noteOf(extremum: boolean, insensitive: boolean, region: number): string {
  const words: string[] = [];
  if (extremum) words.push('extremum');
  if (insensitive) words.push('insensitive');
  if (REGION_CODES[region] === 'Landau model') words.push('Landau-model');
  if (REGION_CODES[region] === 'critical scaling') words.push('critical-scaling');
  return words.join(' ');
}

/**
 * Units of the output columns by kind; a kind not given stays as described above (kelvin, metres,
 * pascals, the delay echoed as written).
 */
export interface ResultUnits {
  temperature?: Unit;
  length?: Unit;
  pressure?: Unit;
  time?: Unit;
}

/** An SI value in `unit` (as it is without one); null and undefined stay. */
function inUnit(value: number | null | undefined, unit: Unit | undefined): number | null | undefined {
  return value == null || unit === undefined ? value : fromBaseUnit(value, unit);
}

/** The output header for a batch (see the module comment). */
export function delayResultHeader(batch: Pick<DelayBatch, 'delayColumn' | 'hasTimestamp' | 'hasPressure'>, units: ResultUnits = {}): string[] {
  const T = units.temperature ?? 'K';
  const header = ['line'];
  if (batch.hasTimestamp) header.push('timestamp');
  header.push(units.time ? columnWithUnit('delay', units.time) : batch.delayColumn, columnWithUnit('distance', units.length ?? 'm'));
  if (batch.hasPressure) header.push(columnWithUnit('pressure', units.pressure ?? 'Pa'));
  header.push('speed_m_s', 'speedSd_m_s', 'candidates', 'chosen', 'chosen_by', columnWithUnit('T', T), columnWithUnit('T_sd', T));
  for (let i = 1; i <= MAX_CANDIDATES; i++) header.push(columnWithUnit(`T${i}`, T), columnWithUnit(`T${i}_sd`, T), `T${i}_branch`, `T${i}_note`);
  return header;
}

/** Row `i`'s cells, in the order of {@link delayResultHeader}. */
export function delayResultCells(r: DelayBatchResults, i: number, units: ResultUnits = {}): CsvCell[] {
  const row = r.batch.rows[i] as DelayRow;
  const T = units.temperature;
  const cells: CsvCell[] = [row.line];
  if (r.batch.hasTimestamp) cells.push(row.timestamp ?? '');
  cells.push(units.time ? fromBaseUnit(row.delay_s, units.time) : row.delayAsWritten, inUnit(r.distance_m[i], units.length));
  if (r.batch.hasPressure) cells.push(inUnit(row.pressure_Pa ?? null, units.pressure));
  const chosen = r.chosen[i] as number;
  const c = i * MAX_CANDIDATES + chosen;
  const by = r.chosenBy[i] as number;
  cells.push(r.speed_m_s[i], r.speedSd_m_s[i], r.candidateCount[i], chosen < 0 ? null : chosen + 1, CHOSEN_BY_CODES[by] ?? '');
  cells.push(chosen < 0 ? null : inUnit(r.temperature_K[c], T), chosen < 0 ? null : inUnit(r.sd_K[c], T));
  for (let k = 0; k < MAX_CANDIDATES; k++) {
    const j = i * MAX_CANDIDATES + k;
    const present = k < (r.candidateCount[i] as number);
    cells.push(
      present ? inUnit(r.temperature_K[j], T) : null,
      present ? inUnit(r.sd_K[j], T) : null,
      present ? BRANCH_CODES[r.branch[j] as number] : null,
      present ? noteOf(r.kind[j] === 1, r.insensitive[j] === 1, r.region[j] as number) : null,
    );
  }
  return cells;
}

/** The results as CSV text (RFC 4180 quoting, LF line ends, a header row first), columns in `units` where given. */
export function delayResultsToCsv(results: DelayBatchResults, units: ResultUnits = {}): string {
  return writeCsv(
    delayResultHeader(results.batch, units),
    Array.from({ length: results.count }, (_, i) => delayResultCells(results, i, units)),
  );
}
