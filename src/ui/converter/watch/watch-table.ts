/**
 * The followed series as a table for export (CSV at any point of the run): one row per file in
 * the order read, numbers in full precision in the display units, the alarm marks and warnings.
 */
import type { CsvCell } from '../../../io/csv-common';
import { chosenTemperature, type WatchRow } from '../../../io/watch-series';
import { csvColumn, inViewUnit as inUnit, type UnitViews } from '../../units/unit-views';
import type { AlarmState } from './watch-alarms';

/** What "chosen by" says for a row, in words (also for files past a turn of u₂). */
export function chosenByText(r: WatchRow): string {
  if (r.ambiguous) return 'undecided past a turn of u₂';
  if (r.chosenBy) return r.chosenBy;
  if (r.problem) return 'no temperature';
  return r.candidates.length > 1 ? 'undecided' : '';
}

export function watchTable(rows: readonly WatchRow[], alarms: AlarmState, units: UnitViews): { header: string[]; rows: CsvCell[][] } {
  const { temperature, time, pressure } = units;
  const header = [
    'order',
    'file',
    'time',
    'time_from',
    'time_header',
    csvColumn('pressure', pressure),
    csvColumn('delay', time),
    csvColumn('delay_sd', time),
    'snr',
    'speed_m_s',
    'speed_sd_m_s',
    'candidates',
    'chosen',
    'chosen_by',
    csvColumn('T', temperature),
    csvColumn('T_sd', temperature),
    csvColumn('T_lo95', temperature),
    csvColumn('T_hi95', temperature),
    'alarm',
    'warnings',
    'problem',
  ];
  const body = rows.map((r): CsvCell[] => {
    const { temperature_K, sd_K } = chosenTemperature(r);
    const c = r.chosen === null ? undefined : r.candidates[r.chosen];
    const marks = alarms.marks.get(r.seq) ?? [];
    return [
      r.seq + 1,
      r.file,
      new Date(r.time_ms).toISOString(),
      r.timeFrom,
      r.timeSource ?? '',
      inUnit(r.pressure_Pa, pressure),
      inUnit(r.delay_s, time),
      inUnit(r.delaySd_s, time),
      r.snr,
      r.speed_m_s,
      r.speedSd_m_s,
      r.candidates.length,
      r.chosen === null ? null : r.chosen + 1,
      chosenByText(r),
      inUnit(temperature_K, temperature),
      inUnit(sd_K, temperature),
      inUnit(c?.lo95_K, temperature),
      inUnit(c?.hi95_K, temperature),
      marks.map((m) => `${m.crossing ? 'began: ' : ''}${m.message}`).join(' | '),
      r.warnings.join(' | '),
      r.problem ?? '',
    ];
  });
  return { header, rows: body };
}
