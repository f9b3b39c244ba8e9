/**
 * The followed series as a table for export (CSV at any point of the run): one row per file in
 * the order read, numbers in full precision in the display units (the reading columns shared with
 * the trace lab's series, reading-columns.ts), the alarm marks and warnings.
 */
import type { CsvCell } from '../../../io/csv-common';
import type { WatchRow } from '../../../io/watch-series';
import { csvColumn, inViewUnit, type UnitViews } from '../../units/unit-views';
import { readingCells, readingHeader } from '../reading-columns';
import type { AlarmState } from './watch-alarms';

/** What "chosen by" says for a row, in words (also for files past a turn of u₂). */
export function chosenByText(r: WatchRow): string {
  if (r.ambiguous) return 'undecided past a turn of u₂';
  if (r.chosenBy) return r.chosenBy;
  if (r.problem) return 'no temperature';
  return r.candidates.length > 1 ? 'undecided' : '';
}

export function watchTable(rows: readonly WatchRow[], alarms: AlarmState, units: UnitViews): { header: string[]; rows: CsvCell[][] } {
  const header = ['order', 'file', 'time', 'time_from', 'time_header', csvColumn('pressure', units.pressure), ...readingHeader(units), 'alarm', 'warnings', 'problem'];
  const body = rows.map((r): CsvCell[] => {
    const marks = alarms.marks.get(r.seq) ?? [];
    return [
      r.seq + 1,
      r.file,
      new Date(r.time_ms).toISOString(),
      r.timeFrom,
      r.timeSource ?? '',
      inViewUnit(r.pressure_Pa, units.pressure),
      ...readingCells(
        {
          delay_s: r.delay_s,
          delaySd_s: r.delaySd_s,
          snr: r.snr,
          speed_m_s: r.speed_m_s,
          speedSd_m_s: r.speedSd_m_s,
          candidates: r.candidates.length,
          chosen: r.chosen,
          chosenBy: chosenByText(r),
          temperature: r.chosen === null ? undefined : r.candidates[r.chosen],
        },
        units,
      ),
      marks.map((m) => `${m.crossing ? 'began: ' : ''}${m.message}`).join(' | '),
      r.warnings.join(' | '),
      r.problem ?? '',
    ];
  });
  return { header, rows: body };
}
