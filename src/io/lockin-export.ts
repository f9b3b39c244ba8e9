/**
 * The lock-in analysis as CSV, for the command line (streamed) and the page's export alike: one
 * header, then one row per record row, numbers in shortest round-trip form.
 */
import type { LockinSeries } from '../physics';
import { CsvNumberText } from './csv-common';

/** The CSV header of `lockin`'s output (and the page's export). */
export const LOCKIN_CSV_COLUMNS = ['time_s', 'lineDensity_m2', 'lineDensitySd_m2', 'frequencyShift_Hz', 'frequencyShiftSd_Hz', 'temperatureShift_K', 'temperatureShiftSd_K'] as const;

/** The series as CSV text, in chunks of 4096 rows. */
export function* lockinCsvChunks(s: LockinSeries): Generator<string> {
  yield `${LOCKIN_CSV_COLUMNS.join(',')}\n`;
  const numbers = new CsvNumberText();
  const n = s.time_s.length;
  for (let start = 0; start < n; start += 4096) {
    const end = Math.min(n, start + 4096);
    const lines: string[] = [];
    for (let i = start; i < end; i++) {
      lines.push(
        `${numbers.text(s.time_s[i] as number)},${numbers.text(s.lineDensity_m2[i] as number)},${numbers.text(s.lineDensitySd_m2[i] as number)},${numbers.text(s.frequencyShift_Hz[i] as number)},${numbers.text(s.frequencyShiftSd_Hz[i] as number)},${s.temperatureShift_K ? numbers.text(s.temperatureShift_K[i] as number) : ''},${s.temperatureShiftSd_K ? numbers.text(s.temperatureShiftSd_K[i] as number) : ''}`,
      );
    }
    yield `${lines.join('\n')}\n`;
  }
}
