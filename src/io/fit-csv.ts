/**
 * Distance-fit input as CSV: several heater–sensor distances at one bath temperature, for the
 * kernel's fitDistances (t = t0 + d/u2). Runs in node and in a browser Web Worker.
 *
 * Columns (header row required; see small-csv for encoding, delimiter and comments):
 *  - distance_m (also distance_mm, distance_um, "distance (cm)", …),
 *  - delay_s (also delay_ms, delay_us, …),
 *  - delay_sd_s (optional; also delay_sd_us, …): give it on every row or on none (the kernel then
 *    scales the uncertainties by the scatter).
 * Other columns are ignored.
 */
import { DELAY_LIMITS, type DistanceDelay } from '../physics';
import { CsvInputError } from './csv-common';
import { type CsvTable, columnByBase, columnList, numberAt, readCsvTable, type TableColumn } from './small-csv';

export interface FitInput {
  points: DistanceDelay[];
  /** Line of each point in the file. */
  lines: number[];
}

/**
 * Reads a distance-fit table. Throws {@link CsvInputError} naming the line of a malformed or
 * out-of-range row, a missing column, or a table with sds on some rows only.
 */
export function parseFitCsv(input: string | Uint8Array): FitInput {
  const table = readCsvTable(input, 'fit');
  const distance = required(table, 'distance', 'length', 'distance_m');
  const delay = required(table, 'delay', 'time', 'delay_s');
  const sd = columnByBase(table, 'delay_sd', 'time');
  const points: DistanceDelay[] = [];
  const lines: number[] = [];
  let withSd = 0;
  for (const row of table.rows) {
    const distance_m = numberAt(table, row, distance) as number;
    const delay_s = numberAt(table, row, delay) as number;
    inRange(distance_m, DELAY_LIMITS.distance_m, `${distance.name} (in m)`, row.line);
    inRange(delay_s, [-DELAY_LIMITS.delay_s[1], DELAY_LIMITS.delay_s[1]], `${delay.name} (in s)`, row.line);
    const point: DistanceDelay = { distance_m, delay_s };
    const delaySd_s = sd ? numberAt(table, row, sd, true) : undefined;
    if (delaySd_s !== undefined) {
      if (!(delaySd_s > 0)) throw new CsvInputError('out-of-range', `${(sd as TableColumn).name} must be above 0`, row.line);
      point.delaySd_s = delaySd_s;
      withSd++;
    }
    points.push(point);
    lines.push(row.line);
  }
  if (withSd !== 0 && withSd !== points.length) {
    const missing = lines[points.findIndex((p) => p.delaySd_s === undefined)];
    throw new CsvInputError('out-of-range', `${(sd as TableColumn).name} is empty: give a delay sd on every row or on none`, missing);
  }
  if (points.length < 3) throw new CsvInputError('no-data', `the fit needs at least 3 rows of (distance, delay), got ${points.length}`);
  return { points, lines };
}

function required(table: CsvTable, base: string, dimension: 'length' | 'time', name: string): TableColumn {
  const column = columnByBase(table, base, dimension);
  if (!column) throw new CsvInputError('missing-column', `no column "${name}" in the header; columns: ${columnList(table)}`, table.headerLine);
  return column;
}

function inRange(value: number, range: readonly [number, number], name: string, line: number): void {
  if (value < range[0] || value > range[1]) {
    throw new CsvInputError('out-of-range', `${name} ${value} is outside the valid range ${range[0]}–${range[1]}`, line);
  }
}
