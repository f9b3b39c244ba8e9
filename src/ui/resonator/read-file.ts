import { CsvInputError } from '../../io/csv-common';
import { overLimitText } from '../../io/byte-size';
import { type LockinCsv, parseLockinCsv, parseSweepCsv, type SweepCsv } from '../../io/resonance-csv';
import { TABLE_CSV_SIZE_LIMIT_BYTES } from '../../io/small-csv';
import { useSekundoStore } from '../store';
import type { ResonatorFileRole } from './resonator-slice';

const WHAT: Readonly<Record<ResonatorFileRole, string>> = { sweep: 'sweep', reference: 'reference sweep', lockin: 'lock-in record' };

/**
 * Reads a dropped file for one role: a sweep or reference (frequency_Hz with x, y or amplitude) or
 * a lock-in record (time_s, x, y). A refused file leaves what was there and says why in one line
 * naming the file, the line and the column; a file past the byte cap is refused before it is read.
 */
export async function readResonatorFile(role: ResonatorFileRole, file: File): Promise<void> {
  const store = useSekundoStore.getState();
  if (file.size > TABLE_CSV_SIZE_LIMIT_BYTES) {
    store.setResonatorFileError(role, `${file.name}: the ${WHAT[role]} file is ${overLimitText(file.size, TABLE_CSV_SIZE_LIMIT_BYTES)}.`);
    return;
  }
  try {
    const bytes = new Uint8Array(await file.arrayBuffer());
    const data: SweepCsv | LockinCsv = role === 'lockin' ? parseLockinCsv(bytes) : parseSweepCsv(bytes);
    useSekundoStore.getState().setResonatorFile(role, { name: file.name, data } as never);
  } catch (error) {
    const detail = error instanceof CsvInputError || error instanceof Error ? error.message : String(error);
    useSekundoStore.getState().setResonatorFileError(role, `${file.name}: ${detail}`);
  }
}
