/**
 * A synthetic record as a trace CSV file that the trace reader (trace-csv.ts), the page's trace
 * lab and `sekundo trace` read back: a few "#" header lines saying what it is, then the columns
 * `time_s` (the digitiser's clock, trigger at 0), the drive (`heater`, relative 0–1) and one column
 * per sensor named by its id, in volts. Runs in node and in a browser Web Worker.
 */
import type { RecordModel, SyntheticRecord } from '../physics';
import { csvCell } from './csv-common';
import { heaterColumn } from './rehearse-run';

/** Significant digits of the sensor values (far below any noise) and of the time column. */
const VALUE_DIGITS = 7;
const TIME_DIGITS = 10;

/** Rows per text chunk. */
const ROWS_PER_CHUNK = 4096;

export interface RecordFileNote {
  planName: string;
  trials: number;
  seed: number;
}

/** File name of trial `trial` (0-based) among `trials`: rehearsal-trial-001.csv, … */
export function recordFileName(trial: number, trials: number): string {
  const digits = Math.max(3, String(trials).length);
  return `rehearsal-trial-${String(trial + 1).padStart(digits, '0')}.csv`;
}

/** The file's text in chunks of rows (the header first). */
export function* recordCsvChunks(model: RecordModel, record: SyntheticRecord, note: RecordFileNote): Generator<string> {
  const heater = heaterColumn(model);
  const header = [
    `# Sekundo rehearsal: a synthetic record of the plan "${note.planName.replace(/[\r\n]+/g, ' ')}", trial ${record.trial + 1} of ${note.trials}, seed ${note.seed}`,
    `# made from the plan's predicted signals with white noise (${model.shots} pulses averaged); not a measurement`,
    `# time_s: the digitiser's clock, trigger at 0 (the heater onset falls within one sample of it); ${heater}: relative drive 0-1; sensors: V`,
    ['time_s', heater, ...model.sensors.map((s) => s.id)].map(csvCell).join(','),
  ];
  yield `${header.join('\n')}\n`;
  const n = record.time_s.length;
  const columns = [record.heater, ...record.sensors];
  for (let start = 0; start < n; start += ROWS_PER_CHUNK) {
    const rows: string[] = [];
    const end = Math.min(n, start + ROWS_PER_CHUNK);
    for (let i = start; i < end; i++) {
      let line = String(Number((record.time_s[i] as number).toPrecision(TIME_DIGITS)));
      for (const c of columns) {
        const v = c[i] as number;
        line += `,${v === 0 ? '0' : String(Number(v.toPrecision(VALUE_DIGITS)))}`;
      }
      rows.push(line);
    }
    yield `${rows.join('\n')}\n`;
  }
}

/** The whole file as one string. */
export function recordCsv(model: RecordModel, record: SyntheticRecord, note: RecordFileNote): string {
  return [...recordCsvChunks(model, record, note)].join('');
}
