/**
 * A temperature series built one file at a time while a folder is followed (the page's "Follow a
 * folder" and `sekundo watch`): each file's picked delay becomes a speed and its candidate
 * temperatures (the distance, offset and their sds given), and one candidate is chosen as the
 * trace lab's series does — the file's own bath vapour pressure (documented header key) when it
 * has one, else the start rule for the first decided file, else continuity — through the kernel's
 * seriesChooser, so the extremum rules hold: past a turn of u₂ files stay undecided (both
 * continuations kept) until one with its own pressure settles them, and `add` says which earlier
 * rows it settled.
 *
 * Only the series is kept (a few numbers per file, never the samples), so 10 000 files cost a few
 * megabytes; past WATCH_ROW_LIMIT files the series refuses more and says so.
 * Time of a row: the header's timestamp under a documented key (trace-header.ts), else the file's
 * modification time; `timeFrom` says which.
 */
import {
  type ChoiceRule,
  candidateWarnings,
  convertDelay,
  PhysicsError,
  PROPERTIES_RANGE_K,
  seriesChooser,
  type SeriesChooser,
  speedSigmasFromTurn,
  type TemperatureCandidate,
} from '../physics';
import { tooSlowForSecondSound } from './speed-plausibility';
import { readTraceHeader } from './trace-header';

/**
 * Most files in one followed series that keeps its rows (the page: about 1 kB a file, so at most
 * about 50 MB); a series that keeps no history (`sekundo watch`) has no limit.
 */
export const WATCH_ROW_LIMIT = 50_000;

/** Below this peak/noise ratio a row warns that the pick may be noise (as `sekundo trace`). */
export const WATCH_LOW_SNR = 5;

/** The pick of one file, as much of it as the series keeps. */
export interface WatchPick {
  delay_s: number;
  delaySd_s: number;
  snr: number;
  sensor: string;
  picker: string;
}

/** One file as read: its header fields (only documented keys are used), modification time, and pick or why none. */
export interface WatchReading {
  file: string;
  fields: Readonly<Record<string, string>>;
  modified_ms: number;
  pick: WatchPick | null;
  /** Why the file has no pick (it could not be read or picked); null when it has one. */
  problem: string | null;
}

/** Distance, offset, their sds (SI), and the rule that decides the first file. */
export interface WatchSettings {
  distance_m: number;
  distanceSd_m: number;
  offset_s: number;
  offsetSd_s: number;
  /** Decides the first file (null: only a single candidate is chosen until a file's own pressure decides). */
  start: ChoiceRule | null;
}

export type WatchChosenBy =
  | 'vapour pressure in the file'
  | 'pressure'
  | 'expected'
  | 'range'
  | 'only candidate'
  | 'continuity'
  | 'settled by a later pressure';

/** A candidate as the series keeps it. */
export type WatchCandidate = Pick<TemperatureCandidate, 'temperature_K' | 'sd_K' | 'sdMeasurement_K' | 'sdCurve_K' | 'interval68_K' | 'interval95_K' | 'branch' | 'kind'>;

export interface WatchRow {
  /** 0-based position in the series (arrival order). */
  seq: number;
  file: string;
  /** ms since 1970-01-01 UTC. */
  time_ms: number;
  timeFrom: 'header' | 'file modified';
  /** The header line the time came from ("Timestamp: 2026-…"), or null. */
  timeSource: string | null;
  pressure_Pa: number | null;
  delay_s: number | null;
  delaySd_s: number | null;
  snr: number | null;
  speed_m_s: number | null;
  speedSd_m_s: number | null;
  candidates: WatchCandidate[];
  chosen: number | null;
  chosenBy: WatchChosenBy | null;
  /** Past a turn of u₂: the two continuations and the labelled trend guess (indices into candidates). */
  ambiguous: { alternatives: [number, number]; guess: number } | null;
  /** Cautions and notes, one line each. */
  warnings: string[];
  /** Why the file has no temperature; null when it has candidates. */
  problem: string | null;
}

/** The chosen candidate's temperature and sd, or nulls. */
export function chosenTemperature(row: WatchRow): { temperature_K: number | null; sd_K: number | null } {
  const c = row.chosen === null ? undefined : row.candidates[row.chosen];
  return { temperature_K: c?.temperature_K ?? null, sd_K: c?.sd_K ?? null };
}

const ONLY_CANDIDATE: ChoiceRule = { kind: 'range', min_K: 0, max_K: PROPERTIES_RANGE_K[1] };

/** What the series keeps of a reading to build its row again (settings changed). */
interface Kept {
  file: string;
  time_ms: number;
  timeFrom: WatchRow['timeFrom'];
  timeSource: string | null;
  pressure_Pa: number | null;
  headerProblems: readonly string[];
  pick: WatchPick | null;
  problem: string | null;
}

const NONE: readonly string[] = [];

function keep(r: WatchReading): Kept {
  const header = readTraceHeader(r.fields);
  const t = header.acquired_ms;
  return {
    file: r.file,
    time_ms: t ? t.value : r.modified_ms,
    timeFrom: t ? 'header' : 'file modified',
    timeSource: t ? `${t.key}: ${t.text}` : null,
    pressure_Pa: header.vapourPressure_Pa?.value ?? null,
    headerProblems: header.problems.length > 0 ? header.problems : NONE,
    pick: r.pick,
    problem: r.problem,
  };
}

function sentence(message: string): string {
  const t = message.trim();
  return t === '' ? t : `${t[0]?.toUpperCase()}${t.slice(1)}${/[.!?]$/.test(t) ? '' : '.'}`;
}

/** A series being followed: add files as they are read; change the settings to build it again. */
export class WatchSeries {
  private kept: Kept[] = [];
  private built: WatchRow[] = [];
  /** Without history: the rows a later file may still settle (past a turn of u₂), by seq. */
  private open = new Map<number, WatchRow>();
  private count = 0;
  private choose: SeriesChooser;

  /**
   * @param history keep every row (the page: to show, export and build again); false keeps only
   *   the rows a later file may still settle, so a run of any length holds a few rows (`sekundo watch`,
   *   which prints each row as it comes); `rows`, `replace` and `configure` then see no history.
   */
  constructor(
    private settings: WatchSettings,
    private readonly history = true,
  ) {
    this.choose = seriesChooser(settings.start ?? ONLY_CANDIDATE);
  }

  get rows(): readonly WatchRow[] {
    return this.built;
  }

  get length(): number {
    return this.count;
  }

  /**
   * Adds a file read; returns its row and the earlier rows its own pressure settled (changed).
   * Throws RangeError past WATCH_ROW_LIMIT files.
   */
  add(reading: WatchReading): { row: WatchRow; settled: WatchRow[] } {
    if (this.history && this.kept.length >= WATCH_ROW_LIMIT) throw new RangeError(`the series holds ${WATCH_ROW_LIMIT} files, the most one run keeps; export it and start again`);
    const k = keep(reading);
    if (this.history) this.kept.push(k);
    return this.build(k);
  }

  /** Replaces the row of a file read again (it grew), building the series again; false when the file has no row. */
  replace(reading: WatchReading): boolean {
    const i = this.kept.findIndex((k) => k.file === reading.file);
    if (i < 0) return false;
    this.kept[i] = keep(reading);
    this.rebuild();
    return true;
  }

  /** Renames a file's row (the file was renamed after it was read). */
  rename(from: string, to: string): void {
    for (const k of this.kept) if (k.file === from) k.file = to;
    for (const r of this.built) if (r.file === from) r.file = to;
    for (const r of this.open.values()) if (r.file === from) r.file = to;
  }

  /** New distance, offset or rule: every row is built again from what was read. */
  configure(settings: WatchSettings): void {
    this.settings = settings;
    this.rebuild();
  }

  private rebuild(): void {
    if (!this.history) throw new Error('a series without history cannot be built again');
    this.choose = seriesChooser(this.settings.start ?? ONLY_CANDIDATE);
    this.built = [];
    this.count = 0;
    for (const k of this.kept) this.build(k);
  }

  private build(k: Kept): { row: WatchRow; settled: WatchRow[] } {
    const s = this.settings;
    const row: WatchRow = {
      seq: this.count,
      file: k.file,
      time_ms: k.time_ms,
      timeFrom: k.timeFrom,
      timeSource: k.timeSource,
      pressure_Pa: k.pressure_Pa,
      delay_s: k.pick?.delay_s ?? null,
      delaySd_s: k.pick?.delaySd_s ?? null,
      snr: k.pick?.snr ?? null,
      speed_m_s: null,
      speedSd_m_s: null,
      candidates: [],
      chosen: null,
      chosenBy: null,
      ambiguous: null,
      warnings: [...k.headerProblems],
      problem: k.problem,
    };
    this.count += 1;
    if (this.history) this.built.push(row);
    const settled: WatchRow[] = [];
    let full: TemperatureCandidate[] = [];
    if (k.pick) {
      try {
        const speed = s.distance_m / (k.pick.delay_s - s.offset_s);
        const slow = tooSlowForSecondSound(speed);
        if (slow !== null) throw new PhysicsError(`the picked delay of ${k.pick.delay_s} s over ${s.distance_m} m: ${slow}`);
        const conversion = convertDelay({
          distance_m: s.distance_m,
          delay_s: k.pick.delay_s,
          distanceSd_m: s.distanceSd_m,
          delaySd_s: k.pick.delaySd_s,
          offset_s: s.offset_s,
          offsetSd_s: s.offsetSd_s,
        });
        full = conversion.candidates;
        row.speed_m_s = conversion.speed_m_s;
        row.speedSd_m_s = conversion.speedSd_m_s;
        row.candidates = full.map((c) => ({
          temperature_K: c.temperature_K,
          sd_K: c.sd_K,
          sdMeasurement_K: c.sdMeasurement_K,
          sdCurve_K: c.sdCurve_K,
          interval68_K: c.interval68_K,
          interval95_K: c.interval95_K,
          branch: c.branch,
          kind: c.kind,
        }));
        if (k.pick.snr < WATCH_LOW_SNR) row.warnings.push(`SNR ${Number(k.pick.snr.toPrecision(3))} is low: the pick may be noise, not the pulse.`);
        if (full.length === 0) row.problem = 'No temperature between 0.3 K and Tλ has this speed.';
      } catch (error) {
        if (!(error instanceof PhysicsError)) throw error;
        row.problem = sentence(error.message);
      }
    }
    try {
      const choice = this.choose(full, k.pressure_Pa === null ? null : { kind: 'pressure', pressure_Pa: k.pressure_Pa });
      row.chosen = choice.index;
      const start: WatchChosenBy = s.start === null ? 'only candidate' : s.start.kind === 'near' ? 'expected' : s.start.kind;
      row.chosenBy = choice.index === null ? null : choice.by === 'own' ? 'vapour pressure in the file' : choice.by === 'start' ? start : 'continuity';
      if (choice.ambiguous) row.ambiguous = { alternatives: choice.ambiguous.alternatives, guess: choice.ambiguous.guess };
      for (const w of choice.warnings) row.warnings.push(w.message);
      if (choice.index === null && full.length > 1 && !choice.ambiguous) {
        row.warnings.push(
          s.start === null
            ? `Undecided: ${full.length} temperatures have this speed; a start rule (a vapour pressure, an expected temperature or a range) or a file with its own vapour pressure decides.`
            : `Undecided: ${choice.reason}.`,
        );
      }
      const pick = choice.index === null ? undefined : full[choice.index];
      if (pick && row.speed_m_s !== null && row.speedSd_m_s !== null) {
        for (const w of candidateWarnings(pick, speedSigmasFromTurn(pick, row.speed_m_s, row.speedSd_m_s))) row.warnings.push(w.message);
      }
      for (const done of choice.settles) {
        const earlier = this.history ? this.built[done.row] : this.open.get(done.row);
        if (!earlier) continue;
        earlier.chosen = done.index;
        earlier.chosenBy = 'settled by a later pressure';
        earlier.ambiguous = null;
        settled.push(earlier);
      }
      if (!this.history) {
        // A file decided by its own evidence ends any turn: nothing before it can be settled later.
        if (choice.by === 'own' && choice.index !== null) this.open.clear();
        if (row.ambiguous) this.open.set(row.seq, row);
      }
    } catch (error) {
      if (!(error instanceof PhysicsError)) throw error;
      row.warnings.push(`The file's own vapour pressure cannot choose: ${sentence(error.message)}`);
    }
    return { row, settled };
  }
}
