/**
 * Many trace files → a temperature series: the files in time order (a timestamp in their header,
 * else their names in natural order), each file's picked delay converted to speed and candidates,
 * and one candidate chosen per file: by that file's vapour pressure when its header gives one, by
 * the start rule for the first file, then by continuity (the candidate nearest the one before).
 * Past a turn of u₂ continuity cannot choose: those files keep both continuations (and a labelled
 * trend guess) until a later file with its own pressure settles them back to the turn.
 * Pure functions; the CSV is plain text, never HTML.
 */
import type { CsvCell } from '../../io/csv-common';
import { readTraceHeader } from '../../io/trace-header';
import type { TracePick } from '../../io/trace-pick';
import {
  type ChoiceRule,
  convertDelay,
  type DelayConversion,
  PhysicsError,
  PROPERTIES_RANGE_K,
  type SeriesChoiceBy,
  seriesChooser,
  type TemperatureCandidate,
} from '../../physics';
import { candidateFlags } from './candidate-notes';
import { sentence } from './converter-checks';
import { type UnitViews, csvColumn, inViewUnit } from '../units/unit-views';
import { readingCells, readingHeader } from './reading-columns';

export interface Timestamp {
  text: string;
  /** Milliseconds since the epoch (an ISO 8601 time without a zone is read as UTC, for ordering). */
  ms: number;
}

/** The file's timestamp from a documented header key (src/io/trace-header.ts), or null. */
export function timestampOf(fields: Readonly<Record<string, string>>): Timestamp | null {
  const read = readTraceHeader(fields).acquired_ms;
  return read ? { text: read.text, ms: read.value } : null;
}

/** The bath vapour pressure from the documented header key, Pa, or null (src/io/trace-header.ts). */
export function pressureOf(fields: Readonly<Record<string, string>>): number | null {
  return readTraceHeader(fields).vapourPressure_Pa?.value ?? null;
}

export interface SeriesFile {
  id: string;
  name: string;
  fields: Readonly<Record<string, string>>;
}

/** Files in reading order: by header timestamp when every file has one, else by name (shot-2 before shot-10). */
export function orderFiles<F extends SeriesFile>(files: readonly F[]): { files: F[]; by: 'timestamp' | 'name' } {
  const stamps = files.map((f) => timestampOf(f.fields));
  const byName = (a: F, b: F) => a.name.localeCompare(b.name, undefined, { numeric: true, sensitivity: 'base' });
  if (files.length > 0 && stamps.every((s) => s !== null)) {
    const order = files.map((f, i) => ({ f, ms: (stamps[i] as Timestamp).ms }));
    order.sort((a, b) => a.ms - b.ms || byName(a.f, b.f));
    return { files: order.map((o) => o.f), by: 'timestamp' };
  }
  return { files: [...files].sort(byName), by: 'name' };
}

/** Distance and timing settings shared by every file (SI). */
export interface SeriesSettings {
  distance_m: number;
  distanceSd_m: number;
  offset_s: number;
  offsetSd_s: number;
}

export type ChosenBy = 'pressure' | 'vapour pressure in the file' | 'expected' | 'range' | 'only candidate' | 'continuity' | 'settled by a later pressure';

export interface SeriesRow {
  file: SeriesFile;
  timestamp: Timestamp | null;
  pressure_Pa: number | null;
  pick: TracePick | null;
  conversion: DelayConversion | null;
  chosen: number | null;
  chosenBy: ChosenBy | null;
  /** The rule that decided this row: its own pressure, the start rule, or "near" the row before (continuity). */
  rule: ChoiceRule | null;
  /** Why the file has no temperature (pick or conversion failed), or null. */
  problem: string | null;
  /** Past a turn of u₂: the two continuations (indices into the candidates) and the labelled trend guess; null otherwise. */
  ambiguous: { alternatives: [number, number]; guess: number } | null;
}

const ONLY_CANDIDATE: ChoiceRule = { kind: 'range', min_K: 0, max_K: PROPERTIES_RANGE_K[1] };

/**
 * Converts each file's pick (null: not picked, with `problems[id]` saying why) and chooses a
 * candidate per file along the series with the kernel's seriesChooser: a file with its own vapour
 * pressure by it, else by continuity once a file is decided, else by `start` (null decides only
 * single candidates). A file whose own pressure cannot be used says why and is left undecided.
 */
export function buildSeries(
  files: readonly SeriesFile[],
  picks: ReadonlyMap<string, TracePick>,
  problems: ReadonlyMap<string, string>,
  settings: SeriesSettings,
  start: ChoiceRule | null,
): SeriesRow[] {
  const rows: SeriesRow[] = files.map((file) => {
    const pick = picks.get(file.id) ?? null;
    const row: SeriesRow = { file, timestamp: timestampOf(file.fields), pressure_Pa: pressureOf(file.fields), pick, conversion: null, chosen: null, chosenBy: null, rule: null, problem: problems.get(file.id) ?? null, ambiguous: null };
    if (!pick) {
      row.problem ??= 'not picked yet';
      return row;
    }
    try {
      row.conversion = convertDelay({
        distance_m: settings.distance_m,
        delay_s: pick.delay_s,
        distanceSd_m: settings.distanceSd_m,
        delaySd_s: pick.delaySd_s,
        offset_s: settings.offset_s,
        offsetSd_s: settings.offsetSd_s,
      });
    } catch (error) {
      if (!(error instanceof PhysicsError)) throw error;
      row.problem = sentence(error.message);
    }
    return row;
  });
  const choose = seriesChooser(start ?? ONLY_CANDIDATE);
  const label: Readonly<Record<SeriesChoiceBy, ChosenBy>> = {
    own: 'vapour pressure in the file',
    start: start === null ? 'only candidate' : start.kind === 'near' ? 'expected' : start.kind,
    continuity: 'continuity',
  };
  for (const row of rows) {
    try {
      const choice = choose(row.conversion?.candidates ?? [], row.pressure_Pa === null ? null : { kind: 'pressure', pressure_Pa: row.pressure_Pa });
      row.chosen = choice.index;
      row.chosenBy = choice.index === null ? null : label[choice.by];
      row.ambiguous = choice.ambiguous ? { alternatives: choice.ambiguous.alternatives, guess: choice.ambiguous.guess } : null;
      // Rows past a turn that this file's own pressure settles, back to the turn.
      for (const settled of choice.settles) {
        const earlier = rows[settled.row];
        if (!earlier) continue;
        earlier.chosen = settled.index;
        earlier.chosenBy = 'settled by a later pressure';
        earlier.ambiguous = null;
      }
      // Without a start rule the only-candidate rule is no rule the person set.
      row.rule = choice.by === 'start' && start === null ? null : choice.rule;
    } catch (error) {
      if (!(error instanceof PhysicsError)) throw error;
      row.problem = sentence(error.message);
    }
  }
  return rows;
}

/** The chosen candidate of a row, or undefined. */
export function chosenOf(row: Pick<SeriesRow, 'conversion' | 'chosen'>): TemperatureCandidate | undefined {
  return row.chosen === null ? undefined : row.conversion?.candidates[row.chosen];
}

/** Notes for a candidate as one CSV word list: "extremum insensitive Landau-model". */
export function noteWords(c: TemperatureCandidate): string {
  return candidateFlags(c)
    .map((f) => (f.key === 'extremum' ? 'extremum' : f.key === 'insensitive' ? 'insensitive' : f.key === 'landau' ? 'Landau-model' : 'critical-scaling'))
    .join(' ');
}

const MAX_CANDIDATES = 3;

/** The series as a table: one row per file in series order; numbers in full precision, in the display units. */
export function seriesTable(rows: readonly SeriesRow[], units: UnitViews): { header: string[]; rows: CsvCell[][] } {
  const { temperature, pressure } = units;
  const header = [
    'order',
    'file',
    'timestamp',
    csvColumn('pressure', pressure),
    'sensor',
    'heater',
    'picker',
    ...readingHeader(units),
    'alternatives',
    'guess',
  ];
  for (let i = 1; i <= MAX_CANDIDATES; i++) header.push(csvColumn(`T${i}`, temperature), csvColumn(`T${i}_sd`, temperature), `T${i}_branch`, `T${i}_note`);
  header.push('problem');
  const body = rows.map((r, k): CsvCell[] => {
    const cells: CsvCell[] = [
      k + 1,
      r.file.name,
      r.timestamp?.text ?? '',
      inViewUnit(r.pressure_Pa, pressure),
      r.pick?.sensor ?? '',
      r.pick?.heater ?? '',
      r.pick?.picker ?? '',
      ...readingCells(
        {
          delay_s: r.pick?.delay_s,
          delaySd_s: r.pick?.delaySd_s,
          snr: r.pick?.snr,
          speed_m_s: r.conversion?.speed_m_s,
          speedSd_m_s: r.conversion?.speedSd_m_s,
          candidates: r.conversion ? r.conversion.candidates.length : null,
          chosen: r.chosen,
          chosenBy: r.chosenBy ?? '',
          temperature: chosenOf(r),
        },
        units,
      ),
      r.ambiguous ? `${r.ambiguous.alternatives[0] + 1} ${r.ambiguous.alternatives[1] + 1}` : '',
      r.ambiguous ? r.ambiguous.guess + 1 : null,
    ];
    for (let i = 0; i < MAX_CANDIDATES; i++) {
      const x = r.conversion?.candidates[i];
      cells.push(inViewUnit(x?.temperature_K, temperature), inViewUnit(x?.sd_K, temperature), x?.branch, x ? noteWords(x) : undefined);
    }
    cells.push(r.problem ?? '');
    return cells;
  });
  return { header, rows: body };
}
