import { CsvInputError } from '../../io/csv-common';
import { type LocateSensor, locateResultsToCsv, locateSensorsToCsv, parseLocateCsv } from '../../io/locate-csv';
import type { LocateOutcome } from './derive-locate';
import { constraintOf, type LocateOptionsInput, type LocateRowInput } from './locate-inputs';

/** Reads a sensor CSV chosen by the user: the sensors, or a one-line message naming the file and line. */
export async function readSensorFile(file: File): Promise<{ ok: true; sensors: LocateSensor[] } | { ok: false; message: string }> {
  try {
    const bytes = new Uint8Array(await file.arrayBuffer());
    return { ok: true, sensors: parseLocateCsv(bytes).sensors };
  } catch (error) {
    if (error instanceof CsvInputError) {
      return { ok: false, message: `${file.name}${error.line === undefined ? '' : `, line ${error.line}`}: ${error.detail}. The sensors on screen are unchanged.` };
    }
    return { ok: false, message: `${file.name} could not be read: ${error instanceof Error ? error.message : String(error)}. The sensors on screen are unchanged.` };
  }
}

/** Offers text as a file download (nothing leaves the browser). */
export function downloadText(text: string, fileName: string): void {
  const blob = new Blob([text], { type: 'text/csv;charset=utf-8' });
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

/** The sensors in the CLI's input format. */
export function sensorsCsv(rows: readonly LocateRowInput[]): string {
  return locateSensorsToCsv(rows.map(({ key: _key, ...sensor }) => sensor));
}

/** The results as CSV (readable again as sensors); null when there is no fit. */
export function resultsCsv(rows: readonly LocateRowInput[], options: LocateOptionsInput, outcome: LocateOutcome): string | null {
  if (!outcome.ok) return null;
  return locateResultsToCsv(
    rows.map(({ key: _key, ...sensor }) => sensor),
    outcome.outcomes,
    outcome.result,
    {
      speedFrom: outcome.speed.from,
      fitSpeed: options.fitSpeed,
      defaultArrivalSd_s: options.arrivalSd_s,
      constraint: constraintOf(options),
      dropOutliers: options.dropOutliers,
    },
  );
}
