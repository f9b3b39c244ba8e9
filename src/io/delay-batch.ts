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
    sdMeasurement_K: new Float64Array(m).fill(Number.NaN),
    sdCurve_K: new Float64Array(m).fill(Number.NaN),
    low68_K: new Float64Array(m).fill(Number.NaN),
    high68_K: new Float64Array(m).fill(Number.NaN),
    low95_K: new Float64Array(m).fill(Number.NaN),
    high95_K: new Float64Array(m).fill(Number.NaN),
    reaches68: new Uint8Array(m),
    reaches95: new Uint8Array(m),
    evidenceSd: new Float64Array(m).fill(Number.NaN),
    chosen: new Int8Array(n).fill(-1),
    chosenBy: new Uint8Array(n).fill(NO_CODE),
    along: new Int8Array(n).fill(-1),
    across: new Int8Array(n).fill(-1),
    warnings: new Uint8Array(n),
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
      warnings |= warningBits(candidateWarnings(candidates[index] as TemperatureCandidate, 0));
    }
    if (choice.ambiguous) {
      out.along[i] = choice.ambiguous.alternatives[0];
      out.across[i] = choice.ambiguous.alternatives[1];
      out.chosenBy[i] = CHOSEN_BY_CODES.indexOf('ambiguous');
    }
    out.warnings[i] = warnings;
    for (const settled of choice.settles) settleRow(out, settled.row, settled.index);
  }
  return out;
}

function reachBits(reaches: readonly IntervalReach[]): number {
  return reaches.reduce((bits, r) => bits | (1 << REACH_CODES.indexOf(r)), 0);
}

function warningBits(warnings: readonly ReadingWarning[]): number {
  return warnings.reduce((bits, w) => (WARNING_CODES.includes(w.code) ? bits | (1 << WARNING_CODES.indexOf(w.code)) : bits), 0);
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
  header.push(...['T_sd_meas', 'T_sd_curve', 'T_lo68', 'T_hi68', 'T_lo95', 'T_hi95'].map((name) => columnWithUnit(name, T)), 'evidence_sd', 'alternatives', 'guess', 'warnings');
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
  for (const column of [r.sdMeasurement_K, r.sdCurve_K, r.low68_K, r.high68_K, r.low95_K, r.high95_K]) cells.push(chosen < 0 ? null : inUnit(column[c], T));
  const evidence = chosen < 0 ? Number.NaN : (r.evidenceSd[c] as number);
  const along = r.along[i] as number;
  const ambiguous = chosen < 0 && along >= 0;
  cells.push(Number.isNaN(evidence) ? null : evidence, ambiguous ? `${along + 1} ${(r.across[i] as number) + 1}` : '', ambiguous ? (r.across[i] as number) + 1 : null, warningCodesAt(r, i).join(' '));
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
