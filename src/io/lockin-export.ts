/**
 * The lock-in analysis as CSV, for the command line (streamed) and the page's export alike: one
 * header, then one row per record row, numbers in shortest round-trip form.
 */
import type { LockinSeries } from '../physics';
import { shortestNumberText } from './shortest-number-text';

/** A number cell: String(x)'s text; empty for a missing (non-finite) value. */
function cell(x: number): string {
  return Number.isFinite(x) ? shortestNumberText(x) : '';
}

/** The CSV header of `lockin`'s output (and the page's export). */
export const LOCKIN_CSV_COLUMNS = ['time_s', 'lineDensity_m2', 'lineDensitySd_m2', 'frequencyShift_Hz', 'frequencyShiftSd_Hz', 'temperatureShift_K', 'temperatureShiftSd_K'] as const;

/** The series as CSV text, in chunks of 4096 rows. */
export function* lockinCsvChunks(s: LockinSeries): Generator<string> {
  yield `${LOCKIN_CSV_COLUMNS.join(',')}\n`;
  const n = s.time_s.length;
  for (let start = 0; start < n; start += 4096) {
    const end = Math.min(n, start + 4096);
    const lines: string[] = [];
    for (let i = start; i < end; i++) {
      lines.push(
        `${cell(s.time_s[i] as number)},${cell(s.lineDensity_m2[i] as number)},${cell(s.lineDensitySd_m2[i] as number)},${cell(s.frequencyShift_Hz[i] as number)},${cell(s.frequencyShiftSd_Hz[i] as number)},${s.temperatureShift_K ? cell(s.temperatureShift_K[i] as number) : ''},${s.temperatureShiftSd_K ? cell(s.temperatureShiftSd_K[i] as number) : ''}`,
      );
    }
    yield `${lines.join('\n')}\n`;
  }
}
