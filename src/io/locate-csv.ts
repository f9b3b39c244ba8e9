/**
 * Sensor positions and arrival times for locating a heat source, as CSV; and the results written
 * back as CSV. The command line (`sekundo locate FILE`) and the page read the same format.
 * Runs in node and in the browser: no node-only imports.
 *
 * Columns (header row required; encoding, delimiter, quoting and "#" comments as in small-csv):
 *  - x_m, y_m, z_m: sensor position (a unit in the name scales the column: x_mm, "y (cm)", …);
 *  - arrival_s: when the second-sound front reached the sensor, on any common clock (arrival_ms,
 *    arrival_us, …); a blank cell is a sensor without a reading, kept for the layout but not fitted;
 *  - arrival_sd_s (optional; arrival_sd_us, …): one-sigma timing uncertainty of that sensor; blank
 *    cells take the default sd of the caller;
 *  - label (optional): a name for the sensor; blank or absent gives S1, S2, … by row.
 * Other columns are ignored, so a results file written here reads back as input.
 */
import type { LocateResult, SensorArrival, SurfaceConstraint, Vec3 } from '../physics';
import { CsvInputError, type CsvCell, writeCsv } from './csv-common';
import { type CsvTable, columnByBase, columnList, columnNamed, numberAt, readCsvTable, type TableColumn } from './small-csv';

/** Most sensors in one file: far more than any frame carries, few enough to fit at once. */
export const LOCATE_MAX_SENSORS = 500;
/** Sensor coordinates, m: the kernel's own limit (locateSource). */
export const LOCATE_POSITION_RANGE_M = [-100, 100] as const;
/** Arrival times, s: the kernel's own limit. */
export const LOCATE_ARRIVAL_RANGE_S = [-1000, 1000] as const;
/** One-sigma timing uncertainty, s: the kernel's own limit. */
export const LOCATE_ARRIVAL_SD_RANGE_S = [1e-12, 10] as const;
/** Longest sensor label, characters. */
export const LOCATE_LABEL_MAX = 40;

/** One sensor: where it is, and its reading if it has one. */
export interface LocateSensor {
  label: string;
  position_m: Vec3;
  /** Arrival time, s; null for a sensor without a reading. */
  arrival_s: number | null;
  /** One-sigma timing uncertainty, s; null to take the default. */
  arrivalSd_s: number | null;
}

export interface LocateCsv {
  sensors: LocateSensor[];
  /** Line of each sensor in the file. */
  lines: number[];
}

/**
 * Reads a sensor table. Throws {@link CsvInputError} naming the line of a malformed or out-of-range
 * row, a missing column, a repeated label, or a file without sensors.
 */
export function parseLocateCsv(input: string | Uint8Array): LocateCsv {
  const table = readCsvTable(input, 'sensor');
  const x = required(table, 'x', 'length', 'x_m');
  const y = required(table, 'y', 'length', 'y_m');
  const z = required(table, 'z', 'length', 'z_m');
  const arrival = required(table, 'arrival', 'time', 'arrival_s');
  const sd = columnByBase(table, 'arrival_sd', 'time');
  const label = columnNamed(table, 'label', null);
  if (table.rows.length === 0) throw new CsvInputError('no-data', 'the sensor file has a header but no sensor rows');
  if (table.rows.length > LOCATE_MAX_SENSORS) {
    throw new CsvInputError('too-large', `${table.rows.length} sensor rows, over the limit of ${LOCATE_MAX_SENSORS}`, table.rows[LOCATE_MAX_SENSORS]?.line);
  }
  const sensors: LocateSensor[] = [];
  const lines: number[] = [];
  const seen = new Map<string, number>();
  table.rows.forEach((row, i) => {
    const coordinate = (column: TableColumn): number => {
      const value = numberAt(table, row, column) as number;
      inRange(value, LOCATE_POSITION_RANGE_M, `${column.name} (in m)`, row.line);
      return value;
    };
    const position_m: Vec3 = [coordinate(x), coordinate(y), coordinate(z)];
    const arrival_s = numberAt(table, row, arrival, true) ?? null;
    if (arrival_s !== null) inRange(arrival_s, LOCATE_ARRIVAL_RANGE_S, `${arrival.name} (in s)`, row.line);
    const arrivalSd_s = sd ? (numberAt(table, row, sd, true) ?? null) : null;
    if (arrivalSd_s !== null && sd) inRange(arrivalSd_s, LOCATE_ARRIVAL_SD_RANGE_S, `${sd.name} (in s)`, row.line);
    const name = label ? (row.cells[label.index] ?? '').trim() : '';
    const text = name === '' ? `S${i + 1}` : name;
    if (text.length > LOCATE_LABEL_MAX) throw new CsvInputError('out-of-range', `label "${text.slice(0, 24)}…" is longer than ${LOCATE_LABEL_MAX} characters`, row.line);
    const earlier = seen.get(text);
    if (earlier !== undefined) throw new CsvInputError('out-of-range', `label "${text}" is already used on line ${earlier}; give each sensor its own label`, row.line);
    seen.set(text, row.line);
    sensors.push({ label: text, position_m, arrival_s, arrivalSd_s });
    lines.push(row.line);
  });
  return { sensors, lines };
}

function required(table: CsvTable, base: string, dimension: 'length' | 'time', name: string): TableColumn {
  const column = columnByBase(table, base, dimension);
  if (!column) throw new CsvInputError('missing-column', `no column "${name}" in the header; columns: ${columnList(table)}; needed: x_m, y_m, z_m, arrival_s`, table.headerLine);
  return column;
}

function inRange(value: number, range: readonly [number, number], name: string, line: number): void {
  if (value < range[0] || value > range[1]) {
    throw new CsvInputError('out-of-range', `${name} ${value} is outside the valid range ${range[0]} to ${range[1]}`, line);
  }
}

/** The sensors with a reading, as the kernel takes them, and their indices among all sensors. */
export function arrivalsOf(sensors: readonly LocateSensor[]): { arrivals: SensorArrival[]; indices: number[] } {
  const arrivals: SensorArrival[] = [];
  const indices: number[] = [];
  sensors.forEach((s, i) => {
    if (s.arrival_s === null) return;
    arrivals.push(s.arrivalSd_s === null ? { position_m: s.position_m, arrival_s: s.arrival_s } : { position_m: s.position_m, arrival_s: s.arrival_s, arrivalSd_s: s.arrivalSd_s });
    indices.push(i);
  });
  return { arrivals, indices };
}

/** How a sensor took part in the fit. */
export type SensorStatus = 'fitted' | 'outlier' | 'dropped' | 'no arrival';

/** One sensor after the fit: its residual and its part in the fit. */
export interface SensorOutcome {
  label: string;
  /** Arrival the fitted source predicts here, s (also for sensors without a reading). */
  predictedArrival_s: number;
  /** Measured minus predicted, s; null without a reading. */
  residual_s: number | null;
  /** Residual over its sd; null without a reading. */
  normalisedResidual: number | null;
  /**
   * 'outlier': residual beyond the limit but still in the fit; 'dropped': left out by the robust
   * refit (its residual is then beyond the limit too); 'no arrival': not fitted.
   */
  status: SensorStatus;
}

/** Each sensor's outcome, in the order of `sensors`; `indices` maps the kernel's inputs to them. */
export function sensorOutcomes(sensors: readonly LocateSensor[], indices: readonly number[], result: LocateResult): SensorOutcome[] {
  const byIndex = new Map(indices.map((sensor, k) => [sensor, k]));
  return sensors.map((s, i) => {
    const d = Math.hypot(s.position_m[0] - result.source_m[0], s.position_m[1] - result.source_m[1], s.position_m[2] - result.source_m[2]);
    const predictedArrival_s = result.offset_s + d / result.speed_m_s;
    const k = byIndex.get(i);
    if (k === undefined) return { label: s.label, predictedArrival_s, residual_s: null, normalisedResidual: null, status: 'no arrival' };
    const status: SensorStatus = result.dropped.includes(k) ? 'dropped' : result.outliers.includes(k) ? 'outlier' : 'fitted';
    return { label: s.label, predictedArrival_s, residual_s: result.residuals_s[k] ?? null, normalisedResidual: result.normalisedResiduals[k] ?? null, status };
  });
}

/** The sensors in the input format (re-readable by {@link parseLocateCsv}). */
export function locateSensorsToCsv(sensors: readonly LocateSensor[]): string {
  return writeCsv(SENSOR_HEADER, sensors.map(sensorCells));
}

const SENSOR_HEADER = ['label', 'x_m', 'y_m', 'z_m', 'arrival_s', 'arrival_sd_s'] as const;

function sensorCells(s: LocateSensor): CsvCell[] {
  return [s.label, s.position_m[0], s.position_m[1], s.position_m[2], s.arrival_s, s.arrivalSd_s];
}

/** What the results file says about how the fit was set up. */
export interface LocateRunDescription {
  /** How the speed was chosen, in words (e.g. "u2 at 1.8 K"). */
  speedFrom: string;
  fitSpeed: boolean;
  defaultArrivalSd_s: number;
  constraint: SurfaceConstraint;
  dropOutliers: boolean;
}

/**
 * The results as CSV: "#" comment lines with the source, its sds, the offset, the speed and the
 * fit, then one row per sensor in the input format plus predicted arrival, residual and status.
 * The file reads back as sensor input (comments and extra columns are skipped).
 */
export function locateResultsToCsv(sensors: readonly LocateSensor[], outcomes: readonly SensorOutcome[], result: LocateResult, run: LocateRunDescription): string {
  const vec = (v: readonly number[] | null) => (v ? v.map((x) => String(x)).join(' ') : 'undetermined');
  const comments = [
    '# Sekundo source location results',
    `# source_m (x y z): ${vec(result.source_m)}`,
    `# sourceSd_m (x y z): ${vec(result.sourceSd_m)}`,
    `# offset_s: ${result.offset_s}; offsetSd_s: ${result.offsetSd_s ?? 'undetermined'}`,
    `# speed_m_s: ${result.speed_m_s}; speedSd_m_s: ${result.speedSd_m_s ?? (run.fitSpeed ? 'undetermined' : 'fixed')}; speed from ${run.speedFrom}${run.fitSpeed ? ', fitted' : ''}`,
    `# chiSquare: ${result.chiSquare}; degreesOfFreedom: ${result.degreesOfFreedom}; degenerate: ${result.degenerate}`,
    `# default arrival sd_s: ${run.defaultArrivalSd_s}; surface: ${describeConstraint(run.constraint)}; robust refit: ${run.dropOutliers ? 'yes' : 'no'}`,
    ...result.notes.map((n) => `# note: ${n.replace(/[\r\n]+/g, ' ')}`),
  ];
  const header = [...SENSOR_HEADER, 'predicted_arrival_s', 'residual_s', 'normalised_residual', 'status'];
  const rows = sensors.map((s, i) => {
    const o = outcomes[i];
    return [...sensorCells(s), o?.predictedArrival_s, o?.residual_s, o?.normalisedResidual, o?.status];
  });
  return `${comments.join('\n')}\n${writeCsv(header, rows)}`;
}

/** A surface constraint in words with its numbers in metres, e.g. "sphere centre 0 0 0 m, radius 0.1 m". */
export function describeConstraint(c: SurfaceConstraint): string {
  const v = (x: readonly number[]) => x.map((n) => String(n)).join(' ');
  switch (c.kind) {
    case 'none':
      return 'none';
    case 'sphere':
      return `sphere centre ${v(c.centre_m)} m, radius ${c.radius_m} m`;
    case 'cylinder':
      return `cylinder through ${v(c.axisPoint_m)} m along ${v(c.axisDirection)}, radius ${c.radius_m} m`;
    case 'plane':
      return `plane through ${v(c.point_m)} m, normal ${v(c.normal)}`;
  }
}
