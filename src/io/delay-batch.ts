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
 * seriesChooser: nearest to the previous choice) until the next row with a pressure. Past a turn
 * of u2 (a chosen 95 % interval reaching its minimum or maximum) continuity cannot choose: those
 * rows are "ambiguous" (no chosen candidate, both continuations kept, a labelled trend guess)
 * until a row with its own pressure settles the branch; they are then "settled" back to the turn. Before
 * the first decided row, a start rule decides (e.g. "near 1.8 K"); without one, the first row with
 * a single candidate starts the series. Rows nothing decides stay undecided (empty `chosen`).
 * The choice is made row by row (the kernel's seriesChooser) as results are stored in typed
 * arrays, so the series is never held as objects.
 *
 * Output columns (one row per input row, in order; header always the same for the same input):
 *   line, [timestamp], <delay column as in the input, in its own unit>, distance_m, [pressure_Pa],
 *   speed_m_s, speedSd_m_s, candidates (count 0–3), chosen (1–3 or empty), chosen_by
 *   (pressure | near | range | only candidate | continuity | settled | ambiguous | empty), T_K,
 *   T_sd_K (the chosen one, total sd), T_sd_meas_K and T_sd_curve_K (its two parts: measurement,
 *   and the u2 curve's own), T_lo68_K, T_hi68_K, T_lo95_K, T_hi95_K (its 68 % and 95 % intervals),
 *   evidence_sd (its distance from the row's own evidence, in sd; empty without evidence),
 *   alternatives and guess (for an ambiguous row past a turn of u2: the two continuations'
 *   candidate numbers, "2 3", and the trend guess's number), warnings (space-separated codes:
 *   evidence-disagrees, interval-reaches-extremum, series-ambiguous, near-lambda, model-region),
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
  candidateWarnings,
  checkDelayReading,
  convertDelay,
  type DelayConversion,
  EVIDENCE_LIMIT_SD,
  type IntervalReach,
  PhysicsError,
  PROPERTIES_RANGE_K,
  type ReadingWarning,
  type ReadingWarningCode,
  type SeriesChoiceBy,
  seriesChooser,
  speedSigmasFromTurn,
  type TemperatureCandidate,
} from '../physics';
import { type CsvCell, CsvInputError, columnWithUnit, toSi } from './csv-common';
import { fromBaseUnit, type Unit } from './quantity';
import { type CsvTable, columnByBase, columnList, columnNamed, numberAt, scanCsvTable, type TableColumn, type TableRow } from './small-csv';

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
  // Rows become DelayRows as they are read (no table of cells kept). Errors come in the order of
  // reading the whole table first: the file's structure (ragged rows …), then a missing delay
  // column, then the first cell that is not a number.
  let columns: ReturnType<typeof delayColumns> | null = null;
  let deferred: unknown = null;
  const rows: DelayRow[] = [];
  const table = scanCsvTable(input, 'delay', {
    header: (t) => {
      try {
        columns = delayColumns(t, options.column);
      } catch (error) {
        deferred = error;
      }
    },
    row: (t, row) => {
      if (deferred !== null || columns === null) return;
      try {
        rows.push(delayRowOf(t, row, columns));
      } catch (error) {
        deferred = error;
      }
    },
  });
  if (deferred !== null) throw deferred;
  const found = columns as ReturnType<typeof delayColumns> | null;
  if (found === null) throw new CsvInputError('missing-column', 'no delay column', table.headerLine);
  if (rows.length === 0) throw new CsvInputError('no-data', `no delays after the header (line ${table.headerLine})`);
  return { rows, delayColumn: found.delay.name, hasTimestamp: found.timestamp !== undefined, hasPressure: found.pressure !== undefined };
}

/** The batch's columns, found once from the header. */
function delayColumns(table: CsvTable, column: string | undefined) {
  const delay = findDelayColumn(table, column);
  return {
    delay,
    // The delay cell is read once, as written; its SI value is that scaled (as numberAt would).
    delayAsWritten: { ...delay, pow10: 0 } as TableColumn,
    distance: columnByBase(table, 'distance', 'length'),
    pressure: columnByBase(table, 'pressure', 'pressure'),
    timestamp: columnNamed(table, 'timestamp', null),
  };
}

function delayRowOf(table: CsvTable, row: TableRow, c: ReturnType<typeof delayColumns>): DelayRow {
  const asWritten = numberAt(table, row, c.delayAsWritten) as number;
  const out: DelayRow = { line: row.line, delayAsWritten: asWritten, delay_s: toSi(asWritten, c.delay.pow10) };
  const d = c.distance ? numberAt(table, row, c.distance, true) : undefined;
  if (d !== undefined) out.distance_m = d;
  const p = c.pressure ? numberAt(table, row, c.pressure, true) : undefined;
  if (p !== undefined) out.pressure_Pa = p;
  if (c.timestamp) out.timestamp = (row.cells[c.timestamp.index] ?? '').trim();
  return out;
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

export type ChosenBy = 'pressure' | 'near' | 'range' | 'only candidate' | 'continuity' | 'settled' | 'ambiguous';

/** Codes of the typed-array columns of {@link DelayBatchResults}. */
export const BRANCH_CODES: readonly Branch[] = ['low', 'middle', 'high'];
export const REGION_CODES: readonly TemperatureCandidate['region'][] = ['measured', 'Landau model', 'critical scaling'];
export const KIND_CODES: readonly TemperatureCandidate['kind'][] = ['root', 'extremum'];
export const CHOSEN_BY_CODES: readonly ChosenBy[] = ['pressure', 'near', 'range', 'only candidate', 'continuity', 'settled', 'ambiguous'];
/** Bits of the {@link DelayBatchResults.reaches68} / reaches95 columns. */
export const REACH_CODES: readonly IntervalReach[] = ['minimum', 'maximum', 'Tλ', 'model limit'];
/** Bits of the {@link DelayBatchResults.warnings} column. */
export const WARNING_CODES: readonly ReadingWarningCode[] = ['evidence-disagrees', 'interval-reaches-extremum', 'series-ambiguous', 'near-lambda', 'model-region'];
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
  /** The two parts of sd_K: measurement, and the u2 curve's own. */
  sdMeasurement_K: Float64Array;
  sdCurve_K: Float64Array;
  /** 68 % and 95 % interval bounds. */
  low68_K: Float64Array;
  high68_K: Float64Array;
  low95_K: Float64Array;
  high95_K: Float64Array;
  /** Bit masks over {@link REACH_CODES}. */
  reaches68: Uint8Array;
  reaches95: Uint8Array;
  /** Distance from the row's own evidence in sd; NaN without evidence. */
  evidenceSd: Float64Array;
  /** Index of the chosen candidate, or −1. */
  chosen: Int8Array;
  /** Index into {@link CHOSEN_BY_CODES}, or {@link NO_CODE}. */
  chosenBy: Uint8Array;
  /** Ambiguous rows past a turn: the continuation along the branch the series came, the one across the turn (−1 elsewhere). */
  along: Int8Array;
  across: Int8Array;
  /** Bit mask over {@link WARNING_CODES}, per row. */
  warnings: Uint8Array;
}

/** One row of a batch as objects. */
export interface DelayResult extends DelayConversion {
  row: DelayRow;
  distance_m: number;
  /** Index into `candidates`, or null. */
  chosen: number | null;
  chosenBy: ChosenBy | null;
  /** Past a turn of u2: the two continuations and the labelled trend guess (indices into `candidates`). */
  ambiguous: { alternatives: [number, number]; guess: number } | null;
  /** Per candidate: distance from the row's own evidence in sd, or null. */
  evidenceSd: (number | null)[];
  warnings: ReadingWarning[];
}

/** Temperatures in the chooser's reasons, which a batch does not keep. */
const noWords = (): string => '';

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
  const out = emptyDelayResults(batch, n);
  const convert = delayRowConverter(settings, true);
  for (let i = 0; i < n; i++) convert(out, i, batch.rows[i] as DelayRow);
  return out;
}

/** Results with room for `n` rows, every cell empty (NaN, {@link NO_CODE}, −1). */
export function emptyDelayResults(batch: DelayBatch, n: number): DelayBatchResults {
  const m = n * MAX_CANDIDATES;
  return clearDelayResults({
    batch,
    count: n,
    distance_m: new Float64Array(n),
    speed_m_s: new Float64Array(n),
    speedSd_m_s: new Float64Array(n),
    candidateCount: new Uint8Array(n),
    temperature_K: new Float64Array(m),
    sd_K: new Float64Array(m),
    slope_m_s_K: new Float64Array(m),
    branch: new Uint8Array(m),
    region: new Uint8Array(m),
    kind: new Uint8Array(m),
    insensitive: new Uint8Array(m),
    sdMeasurement_K: new Float64Array(m),
    sdCurve_K: new Float64Array(m),
    low68_K: new Float64Array(m),
    high68_K: new Float64Array(m),
    low95_K: new Float64Array(m),
    high95_K: new Float64Array(m),
    reaches68: new Uint8Array(m),
    reaches95: new Uint8Array(m),
    evidenceSd: new Float64Array(m),
    chosen: new Int8Array(n),
    chosenBy: new Uint8Array(n),
    along: new Int8Array(n),
    across: new Int8Array(n),
    warnings: new Uint8Array(n),
  });
}

/** Empties every cell of `r` (to be filled again, e.g. by the next block of a streamed batch). */
export function clearDelayResults(r: DelayBatchResults): DelayBatchResults {
  for (const column of [r.temperature_K, r.sd_K, r.slope_m_s_K, r.sdMeasurement_K, r.sdCurve_K, r.low68_K, r.high68_K, r.low95_K, r.high95_K, r.evidenceSd]) column.fill(Number.NaN);
  for (const column of [r.branch, r.region, r.kind, r.chosenBy]) column.fill(NO_CODE);
  for (const column of [r.chosen, r.along, r.across]) column.fill(-1);
  for (const column of [r.insensitive, r.reaches68, r.reaches95, r.warnings]) column.fill(0);
  return r;
}

/** Converts one row into row i of a results table; rows must come in order (the series is chosen row by row). */
export type DelayRowConverter = (out: DelayBatchResults, i: number, row: DelayRow) => void;

/**
 * The conversion of {@link convertDelayBatch}, one row at a time, keeping the series' choice
 * between calls. With `settle` false (rows written out block by block, so earlier rows are no
 * longer at hand) a row that settles earlier ambiguous rows is an error: only a batch with
 * pressures has such rows ({@link DelayBatch.hasPressure}).
 */
export function delayRowConverter(settings: DelayBatchSettings, settle: boolean): DelayRowConverter {
  // The batch keeps which rule chose, not the reason in words: no temperature text per row.
  const choose = seriesChooser(settings.start ?? ONLY_CANDIDATE, noWords);
  const byCode: Readonly<Record<SeriesChoiceBy, number>> = {
    own: CHOSEN_BY_CODES.indexOf('pressure'),
    start: CHOSEN_BY_CODES.indexOf(settings.start ? settings.start.kind : 'only candidate'),
    continuity: CHOSEN_BY_CODES.indexOf('continuity'),
  };
  const reading = readingOf(settings);
  return (out, i, row) => {
    const distance_m = row.distance_m ?? settings.distance_m;
    if (distance_m === undefined) throw new CsvInputError('missing-column', 'no distance: give a default distance or a distance_m cell', row.line);
    reading.distance_m = distance_m;
    reading.delay_s = row.delay_s;
    let candidates: TemperatureCandidate[];
    let choice: ReturnType<typeof choose>;
    const slow = tooSlowForSecondSound(distance_m / (row.delay_s - reading.offset_s));
    if (slow !== null) throw new CsvInputError('out-of-range', slow, row.line);
    try {
      const conversion = convertDelay(reading);
      candidates = conversion.candidates;
      out.speed_m_s[i] = conversion.speed_m_s;
      out.speedSd_m_s[i] = conversion.speedSd_m_s;
      choice = choose(candidates, row.pressure_Pa === undefined ? null : { kind: 'pressure', pressure_Pa: row.pressure_Pa });
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
      out.sdMeasurement_K[j] = c.sdMeasurement_K;
      out.sdCurve_K[j] = c.sdCurve_K;
      out.low68_K[j] = c.interval68_K[0];
      out.high68_K[j] = c.interval68_K[1];
      out.low95_K[j] = c.interval95_K[0];
      out.high95_K[j] = c.interval95_K[1];
      out.reaches68[j] = reachBits(c.reaches68);
      out.reaches95[j] = reachBits(c.reaches95);
      const e = choice.evidenceSd[k];
      if (e !== null && e !== undefined) out.evidenceSd[j] = e;
    }
    const { index, by } = choice;
    let warnings = warningBits(choice.warnings);
    if (index !== null && index < count) {
      out.chosen[i] = index;
      out.chosenBy[i] = byCode[by];
      // Only the codes are kept: the messages' temperatures are not written (noWords).
      warnings |= warningBits(candidateWarnings(candidates[index] as TemperatureCandidate, 0, noWords));
    }
    if (choice.ambiguous) {
      out.along[i] = choice.ambiguous.alternatives[0];
      out.across[i] = choice.ambiguous.alternatives[1];
      out.chosenBy[i] = CHOSEN_BY_CODES.indexOf('ambiguous');
    }
    out.warnings[i] = warnings;
    if (choice.settles.length > 0 && !settle) throw new Error('a row settles earlier rows of a batch written block by block');
    for (const settled of choice.settles) settleRow(out, settled.row, settled.index);
  };
}

/** The reading every row shares (its distance and delay are set per row). */
function readingOf(settings: DelayBatchSettings) {
  return {
    distance_m: 0,
    delay_s: 0,
    distanceSd_m: settings.distanceSd_m ?? 0,
    delaySd_s: settings.delaySd_s ?? 0,
    offset_s: settings.offset_s ?? 0,
    offsetSd_s: settings.offsetSd_s ?? 0,
  };
}

/**
 * Throws what {@link convertDelayBatch} would throw for a row the kernel refuses or a row
 * without a distance (the first such row), without converting: a batch written block by block
 * is refused whole before any of it is written.
 */
export function checkDelayBatch(batch: DelayBatch, settings: DelayBatchSettings): void {
  const reading = readingOf(settings);
  for (const row of batch.rows) {
    const distance_m = row.distance_m ?? settings.distance_m;
    if (distance_m === undefined) throw new CsvInputError('missing-column', 'no distance: give a default distance or a distance_m cell', row.line);
    reading.distance_m = distance_m;
    reading.delay_s = row.delay_s;
    const slow = tooSlowForSecondSound(distance_m / (row.delay_s - reading.offset_s));
    if (slow !== null) throw new CsvInputError('out-of-range', slow, row.line);
    try {
      checkDelayReading(reading);
    } catch (error) {
      if (error instanceof PhysicsError) throw new CsvInputError('out-of-range', error.message, row.line);
      throw error;
    }
  }
}

function reachBits(reaches: readonly IntervalReach[]): number {
  let bits = 0;
  for (const r of reaches) bits |= 1 << REACH_CODES.indexOf(r);
  return bits;
}

function warningBits(warnings: readonly ReadingWarning[]): number {
  let bits = 0;
  for (const w of warnings) {
    const b = WARNING_CODES.indexOf(w.code);
    if (b >= 0) bits |= 1 << b;
  }
  return bits;
}

/** A row past a turn that a later row's evidence settled: the continuation on the chosen branch. */
function settleRow(out: DelayBatchResults, row: number, index: number): void {
  out.chosen[row] = index;
  out.chosenBy[row] = CHOSEN_BY_CODES.indexOf('settled');
  const ambiguousBit = 1 << WARNING_CODES.indexOf('series-ambiguous');
  const j = row * MAX_CANDIDATES + index;
  const reachBit = 1 << WARNING_CODES.indexOf('interval-reaches-extremum');
  const turns = (1 << REACH_CODES.indexOf('minimum')) | (1 << REACH_CODES.indexOf('maximum'));
  out.warnings[row] = ((out.warnings[row] as number) & ~ambiguousBit) | ((out.reaches95[j] as number) & turns ? reachBit : 0);
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
      sdMeasurement_K: results.sdMeasurement_K[j] as number,
      sdCurve_K: results.sdCurve_K[j] as number,
      interval68_K: [results.low68_K[j] as number, results.high68_K[j] as number],
      interval95_K: [results.low95_K[j] as number, results.high95_K[j] as number],
      reaches68: reachesOf(results.reaches68[j] as number),
      reaches95: reachesOf(results.reaches95[j] as number),
    });
  }
  return out;
}

function reachesOf(bits: number): IntervalReach[] {
  return REACH_CODES.filter((_, b) => (bits & (1 << b)) !== 0);
}

/** The warnings cell for each bit mask over {@link WARNING_CODES}, built once. */
const WARNING_TEXTS: readonly string[] = Array.from({ length: 1 << WARNING_CODES.length }, (_, bits) => WARNING_CODES.filter((_, b) => (bits & (1 << b)) !== 0).join(' '));

/** The warning codes of row `i`. */
export function warningCodesAt(results: DelayBatchResults, i: number): ReadingWarningCode[] {
  const bits = results.warnings[i] as number;
  return WARNING_CODES.filter((_, b) => (bits & (1 << b)) !== 0);
}

/**
 * Row `i`'s warnings with their messages, made again from the stored columns (the batch keeps
 * only their codes): the chosen candidate's own, its distance from the row's pressure, and the
 * ambiguity past a turn.
 */
export function warningsAt(results: DelayBatchResults, i: number): ReadingWarning[] {
  const codes = warningCodesAt(results, i);
  const candidates = candidatesAt(results, i);
  const chosen = results.chosen[i] as number;
  const out: ReadingWarning[] = [];
  const c = chosen >= 0 ? candidates[chosen] : undefined;
  if (c && codes.includes('evidence-disagrees')) {
    const e = results.evidenceSd[i * MAX_CANDIDATES + chosen] as number;
    const row = results.batch.rows[i] as DelayRow;
    out.push({
      code: 'evidence-disagrees',
      severity: 'caution',
      message: `Delay and evidence disagree: the chosen ${c.temperature_K.toFixed(4)} K lies ${e.toFixed(1)} sd from the temperature of this row's vapour pressure (${row.pressure_Pa ?? ''} Pa). Check the distance, the offset t0, the gauge and the head pressure.`,
      value: e,
      limit: EVIDENCE_LIMIT_SD,
    });
  }
  if (c) out.push(...candidateWarnings(c, speedSigmasFromTurn(c, results.speed_m_s[i] as number, results.speedSd_m_s[i] as number)));
  if (codes.includes('series-ambiguous')) {
    out.push({
      code: 'series-ambiguous',
      severity: 'caution',
      message: 'Past a turn of u₂ both continuations fit this reading; neither is reported as chosen until a row with its own pressure settles the branch.',
      value: 1,
      limit: 0,
    });
  }
  return out;
}

/** Row `i` of the results as objects. */
export function delayResultAt(results: DelayBatchResults, i: number): DelayResult {
  const chosen = results.chosen[i] as number;
  const along = results.along[i] as number;
  const across = results.across[i] as number;
  const count = results.candidateCount[i] as number;
  return {
    row: results.batch.rows[i] as DelayRow,
    distance_m: results.distance_m[i] as number,
    speed_m_s: results.speed_m_s[i] as number,
    speedSd_m_s: results.speedSd_m_s[i] as number,
    candidates: candidatesAt(results, i),
    chosen: chosen < 0 ? null : chosen,
    chosenBy: CHOSEN_BY_CODES[results.chosenBy[i] as number] ?? null,
    ambiguous: chosen < 0 && along >= 0 && across >= 0 ? { alternatives: [along, across], guess: across } : null,
    evidenceSd: Array.from({ length: count }, (_, k) => {
      const e = results.evidenceSd[i * MAX_CANDIDATES + k] as number;
      return Number.isNaN(e) ? null : e;
    }),
    warnings: warningsAt(results, i),
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

/** Every note a candidate can have, by kind (0 root, 1 extremum) × insensitive × region, built once. */
const NOTES: readonly string[] = Array.from({ length: 2 * 2 * REGION_CODES.length }, (_, code) =>
  noteOf(code >= 2 * REGION_CODES.length, Math.floor(code / REGION_CODES.length) % 2 === 1, code % REGION_CODES.length),
);

function noteAt(r: DelayBatchResults, j: number): string {
  return NOTES[((r.kind[j] === 1 ? 2 : 0) + (r.insensitive[j] === 1 ? 1 : 0)) * REGION_CODES.length + (r.region[j] as number)] as string;
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

export type BatchShape = Pick<DelayBatch, 'delayColumn' | 'hasTimestamp' | 'hasPressure'>;

/**
 * One column of the results CSV: its name, whether a batch has it, and its cell in row i. The
 * header, the page's table export and the streamed CSV all read {@link RESULT_COLUMNS}, so a new
 * column is one entry there.
 */
export interface ResultColumn {
  name(batch: BatchShape, units: ResultUnits): string;
  /** Absent: every batch has the column. */
  present?(batch: BatchShape): boolean;
  cell(r: DelayBatchResults, i: number, units: ResultUnits): CsvCell;
}

/** Index of row i's chosen candidate in the candidate columns, or −1. */
function chosenAt(r: DelayBatchResults, i: number): number {
  const chosen = r.chosen[i] as number;
  return chosen < 0 ? -1 : i * MAX_CANDIDATES + chosen;
}

/** Index of row i's candidate k in the candidate columns, or −1 when the row has fewer. */
function candidateAt(r: DelayBatchResults, i: number, k: number): number {
  return k < (r.candidateCount[i] as number) ? i * MAX_CANDIDATES + k : -1;
}

/** Columns Ti_K, Ti_sd_K, Ti_branch, Ti_note for candidate k (0-based). */
function candidateColumns(k: number): ResultColumn[] {
  const n = k + 1;
  return [
    { name: (_b, u) => columnWithUnit(`T${n}`, u.temperature ?? 'K'), cell: (r, i, u) => valueAt(r.temperature_K, candidateAt(r, i, k), u.temperature) },
    { name: (_b, u) => columnWithUnit(`T${n}_sd`, u.temperature ?? 'K'), cell: (r, i, u) => valueAt(r.sd_K, candidateAt(r, i, k), u.temperature) },
    { name: () => `T${n}_branch`, cell: (r, i) => codeAt(BRANCH_CODES, r.branch, candidateAt(r, i, k)) },
    { name: () => `T${n}_note`, cell: (r, i) => (candidateAt(r, i, k) < 0 ? null : noteAt(r, candidateAt(r, i, k))) },
  ];
}

function valueAt(column: Float64Array, j: number, unit: Unit | undefined): number | null | undefined {
  return j < 0 ? null : inUnit(column[j], unit);
}

function codeAt<T>(codes: readonly T[], column: Uint8Array, j: number): T | null {
  return j < 0 ? null : (codes[column[j] as number] ?? null);
}

/** A column of the chosen candidate's temperature-like value (an sd part, an interval end), in the temperature unit. */
function chosenTemperatureColumn(name: string, column: (r: DelayBatchResults) => Float64Array): ResultColumn {
  return { name: (_b, u) => columnWithUnit(name, u.temperature ?? 'K'), cell: (r, i, u) => valueAt(column(r), chosenAt(r, i), u.temperature) };
}

/** Row i is undecided past a turn of u₂, with both continuations kept. */
function ambiguousAt(r: DelayBatchResults, i: number): boolean {
  return (r.chosen[i] as number) < 0 && (r.along[i] as number) >= 0;
}

/** The results CSV's columns, in order (see the module comment). */
const RESULT_COLUMNS: readonly ResultColumn[] = [
  { name: () => 'line', cell: (r, i) => (r.batch.rows[i] as DelayRow).line },
  { name: () => 'timestamp', present: (b) => b.hasTimestamp, cell: (r, i) => (r.batch.rows[i] as DelayRow).timestamp ?? '' },
  {
    name: (b, u) => (u.time ? columnWithUnit('delay', u.time) : b.delayColumn),
    cell: (r, i, u) => {
      const row = r.batch.rows[i] as DelayRow;
      return u.time ? fromBaseUnit(row.delay_s, u.time) : row.delayAsWritten;
    },
  },
  { name: (_b, u) => columnWithUnit('distance', u.length ?? 'm'), cell: (r, i, u) => inUnit(r.distance_m[i], u.length) },
  { name: (_b, u) => columnWithUnit('pressure', u.pressure ?? 'Pa'), present: (b) => b.hasPressure, cell: (r, i, u) => inUnit((r.batch.rows[i] as DelayRow).pressure_Pa ?? null, u.pressure) },
  { name: () => 'speed_m_s', cell: (r, i) => r.speed_m_s[i] },
  { name: () => 'speedSd_m_s', cell: (r, i) => r.speedSd_m_s[i] },
  { name: () => 'candidates', cell: (r, i) => r.candidateCount[i] },
  { name: () => 'chosen', cell: (r, i) => ((r.chosen[i] as number) < 0 ? null : (r.chosen[i] as number) + 1) },
  { name: () => 'chosen_by', cell: (r, i) => CHOSEN_BY_CODES[r.chosenBy[i] as number] ?? '' },
  { name: (_b, u) => columnWithUnit('T', u.temperature ?? 'K'), cell: (r, i, u) => valueAt(r.temperature_K, chosenAt(r, i), u.temperature) },
  { name: (_b, u) => columnWithUnit('T_sd', u.temperature ?? 'K'), cell: (r, i, u) => valueAt(r.sd_K, chosenAt(r, i), u.temperature) },
  chosenTemperatureColumn('T_sd_meas', (r) => r.sdMeasurement_K),
  chosenTemperatureColumn('T_sd_curve', (r) => r.sdCurve_K),
  chosenTemperatureColumn('T_lo68', (r) => r.low68_K),
  chosenTemperatureColumn('T_hi68', (r) => r.high68_K),
  chosenTemperatureColumn('T_lo95', (r) => r.low95_K),
  chosenTemperatureColumn('T_hi95', (r) => r.high95_K),
  {
    name: () => 'evidence_sd',
    cell: (r, i) => {
      const j = chosenAt(r, i);
      const e = j < 0 ? Number.NaN : (r.evidenceSd[j] as number);
      return Number.isNaN(e) ? null : e;
    },
  },
  { name: () => 'alternatives', cell: (r, i) => (ambiguousAt(r, i) ? `${(r.along[i] as number) + 1} ${(r.across[i] as number) + 1}` : '') },
  { name: () => 'guess', cell: (r, i) => (ambiguousAt(r, i) ? (r.across[i] as number) + 1 : null) },
  { name: () => 'warnings', cell: (r, i) => WARNING_TEXTS[r.warnings[i] as number] as string },
  ...Array.from({ length: MAX_CANDIDATES }, (_, k) => candidateColumns(k)).flat(),
];

/** The columns a batch of this shape has, in order (for writers of the results CSV). */
export function columnsOf(batch: BatchShape): ResultColumn[] {
  return RESULT_COLUMNS.filter((c) => c.present?.(batch) ?? true);
}

/** The output header for a batch (see the module comment). */
export function delayResultHeader(batch: BatchShape, units: ResultUnits = {}): string[] {
  return columnsOf(batch).map((c) => c.name(batch, units));
}

/** Row `i`'s cells, in the order of {@link delayResultHeader}. */
export function delayResultCells(r: DelayBatchResults, i: number, units: ResultUnits = {}): CsvCell[] {
  return columnsOf(r.batch).map((c) => c.cell(r, i, units));
}
