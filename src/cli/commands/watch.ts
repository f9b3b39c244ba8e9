/**
 * `sekundo watch DIR --distance <d> [--pattern GLOB] [picker and choice flags as for trace]
 * [--interval <t>] [--once] [--json]`: follows a folder that an oscilloscope or digitiser fills
 * with trace files during a cooldown and prints one line per new file (CSV, or one JSON object per
 * line) as the files arrive, until interrupted (Ctrl-C ends it cleanly); --once reads what is
 * there and stops. Files are read only once their size stopped changing between two looks
 * (src/io/folder-poll.ts); each is read, picked and converted as `sekundo trace` does, and the
 * candidate chosen along the series (src/io/watch-series.ts). A file that cannot be read is one
 * line on stderr and the run goes on. Nothing is ever written into the folder.
 */
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { csvCell } from '../../io/csv-common';
import type { FolderEntry, PollEvent } from '../../io/folder-poll';
import { type FolderSource, FolderPoller, followFolder, realSleep, WATCH_INTERVAL_RANGE_MS } from '../../io/folder-watch';
import { pickTraceArrival } from '../../io/trace-pick';
import { type WatchPick, type WatchRow, WatchSeries } from '../../io/watch-series';
import { compileWatchPattern, DEFAULT_WATCH_PATTERN, WatchPatternError } from '../../io/watch-pattern';
import { DELAY_LIMITS, requireInRange } from '../../physics';
import { type BooleanFlag, type OperandSpec, type QuantityFlag, requireQuantity, type TextFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, printableLine, UsageError } from '../errors';
import { computeFor } from '../kernel-call';
import { DISTANCE_SD_FLAG, fromFile, NEAR_FLAG, OFFSET_FLAG, OFFSET_SD_FLAG, PRESSURE_FLAG, PRESSURE_SD_FLAG, readChoiceRule, readUncertainties } from './convert-shared';
import { JSON_FLAG } from './shared';
import { FRACTION_FLAG, FROM_FLAG, HEATER_FLAG, optional, PICKER_FLAG, readPicker, readTrace, SENSOR_FLAG, THRESHOLD_FLAG, TIME_FLAG, TO_FLAG } from './trace';

/** Time between two looks at the folder when --interval is absent, s. */
export const DEFAULT_WATCH_INTERVAL_S = 2;

const DIR_OPERAND: OperandSpec = { name: 'dir', placeholder: 'DIR', help: 'the folder the digitiser writes its trace files into (only read, never written)' };

const DISTANCE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'distance',
  dimension: 'length',
  placeholder: 'd',
  range: DELAY_LIMITS.distance_m,
  help: 'heater–sensor path, cold: converts each delay to speed and temperatures',
};

const PATTERN_FLAG: TextFlag = {
  kind: 'text',
  name: 'pattern',
  placeholder: 'GLOB',
  help: `which files to read, by name: * ? [abc] {csv,txt}, any case (default ${DEFAULT_WATCH_PATTERN})`,
};

const INTERVAL_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'interval',
  dimension: 'time',
  placeholder: 't',
  range: [WATCH_INTERVAL_RANGE_MS[0] / 1000, WATCH_INTERVAL_RANGE_MS[1] / 1000],
  help: `time between two looks at the folder; a file is read once its size is the same in two looks (default ${DEFAULT_WATCH_INTERVAL_S} s)`,
};

const ONCE_FLAG: BooleanFlag = { kind: 'boolean', name: 'once', help: 'read the files there now (two looks, one --interval apart) and stop' };

/** Columns of the CSV lines, in order (the JSON objects use the same names). */
export const WATCH_COLUMNS = ['file', 'time', 'time_from', 'delay_s', 'delay_sd_s', 'temperature_K', 'sd_K', 'sd_meas_K', 'sd_curve_K', 'chosen_by', 'warnings'] as const;

/** One printed line of `watch --json`. */
export interface WatchLineJson {
  file: string;
  /** ISO 8601, UTC. */
  time: string;
  time_from: 'header' | 'file modified';
  delay_s: number | null;
  delay_sd_s: number | null;
  temperature_K: number | null;
  /** The whole sd: the measurement's part and the u₂ curve's part in quadrature. */
  sd_K: number | null;
  /** The measurement's part (distance, timing, offset): what limits a change between files. */
  sd_meas_K: number | null;
  /** The u₂ curve's part: the same for every file at this temperature. */
  sd_curve_K: number | null;
  chosen_by: string | null;
  warnings: string[];
}

/** The line's fields for a row of the series. */
export function watchLine(row: WatchRow): WatchLineJson {
  const chosen = row.chosen === null ? undefined : row.candidates[row.chosen];
  const warnings = row.problem ? [row.problem, ...row.warnings] : [...row.warnings];
  let chosenBy: string | null = row.chosenBy;
  if (row.ambiguous) chosenBy = 'undecided past a turn of u2';
  else if (chosenBy === null && row.candidates.length > 1) chosenBy = 'undecided';
  return {
    file: row.file,
    time: new Date(row.time_ms).toISOString(),
    time_from: row.timeFrom,
    delay_s: row.delay_s,
    delay_sd_s: row.delaySd_s,
    temperature_K: chosen?.temperature_K ?? null,
    sd_K: chosen?.sd_K ?? null,
    sd_meas_K: chosen?.sdMeasurement_K ?? null,
    sd_curve_K: chosen?.sdCurve_K ?? null,
    chosen_by: chosenBy,
    warnings,
  };
}

function csvLine(line: WatchLineJson): string {
  return WATCH_COLUMNS.map((name) => (name === 'warnings' ? line.warnings.join(' | ') : line[name])).map(csvCell).join(',');
}

/** The folder through node's fs: regular files only (symbolic links followed); files gone meanwhile are skipped. */
export function nodeFolder(dir: string): FolderSource {
  return {
    async list() {
      const out: FolderEntry[] = [];
      for (const d of readdirSync(dir, { withFileTypes: true })) {
        if (!d.isFile() && !d.isSymbolicLink()) continue;
        try {
          const st = statSync(join(dir, d.name));
          if (st.isFile()) out.push({ name: d.name, size_bytes: st.size, modified_ms: st.mtimeMs, identity: `${st.dev}:${st.ino}` });
        } catch {
          // Gone between the listing and its stat: the next look says so.
        }
      }
      return out;
    },
  };
}

/** The `watch` command. */
export const watchCommand: Command = {
  name: 'watch',
  summary: 'follow a folder of trace files during a cooldown → one temperature line per new file',
  synopsis: ['watch DIR --distance <d> [--pattern <GLOB>] [--heater-column <NAME>] [--picker …] [--pressure <p> | --near <T>] [--interval <t>] [--once] [--json]'],
  description:
    'Follows a folder that an oscilloscope or digitiser fills with trace files (CSV, as "sekundo trace" reads) and prints ' +
    `one line per new file as it arrives: CSV with the columns ${WATCH_COLUMNS.join(', ')} (a header line first), or with --json one ` +
    'JSON object per line with the same names. sd_K is the whole sd of the temperature; sd_meas_K its measurement part (distance, ' +
    "timing, offset: what limits a change between files) and sd_curve_K the u2 curve's own part (the same for every file at that temperature). " +
    'A file is read only once its size and modification time are the same in two looks ' +
    'at the folder (--interval apart), so a file still being written waits; a file that grows after it was read is read again; a ' +
    'renamed file is not read twice; files that vanish are skipped. Each file is picked with the picker flags of "sekundo trace" and ' +
    'converted with --distance, --offset and their sds. The first file with several candidates is decided by --pressure or --near ' +
    "(else only a single candidate is taken); a file whose header gives the bath vapour pressure is decided by it; the others by " +
    'continuity. Past a turn of u2 continuity cannot decide: those files print "undecided past a turn of u2" with no temperature ' +
    'until a file with its own pressure settles them, and then each settled file is printed again with chosen_by "settled by a ' +
    'later pressure". time is the header timestamp under a documented key (time_from "header"), else the file\'s modification time ' +
    '("file modified"). A file that cannot be read or picked is one line on stderr and the run goes on. Runs until interrupted ' +
    '(Ctrl-C stops it cleanly, status 0); --once reads what is there and stops. The folder is only read.',
  flags: [
    DISTANCE_FLAG,
    PATTERN_FLAG,
    INTERVAL_FLAG,
    ONCE_FLAG,
    HEATER_FLAG,
    SENSOR_FLAG,
    TIME_FLAG,
    PICKER_FLAG,
    FROM_FLAG,
    TO_FLAG,
    THRESHOLD_FLAG,
    FRACTION_FLAG,
    DISTANCE_SD_FLAG,
    OFFSET_FLAG,
    OFFSET_SD_FLAG,
    PRESSURE_FLAG,
    PRESSURE_SD_FLAG,
    NEAR_FLAG,
    JSON_FLAG,
  ],
  operands: [DIR_OPERAND],
  examples: [
    "watch /mnt/scope --distance 50mm --heater-column heater --pattern 'shot-*.csv'",
    'watch ./run-12 --distance 50mm --heater-column heater --near 1.8K --json',
    'watch ./run-12 --distance 50mm --once',
  ],
  async run(args, io) {
    const dir = args.operand(DIR_OPERAND.name);
    if (dir === undefined) throw new UsageError('"sekundo watch" needs a folder, e.g. sekundo watch ./traces --distance 50mm');
    const distance = requireQuantity('watch', args, DISTANCE_FLAG);
    const distance_m = computeFor(distance, (v) => requireInRange('distance', v, DELAY_LIMITS.distance_m[0], DELAY_LIMITS.distance_m[1], 'm'));
    const picker = readPicker(args.text(PICKER_FLAG.name));
    if (args.has(THRESHOLD_FLAG.name) && picker !== 'threshold') throw new UsageError('--threshold applies to --picker threshold');
    if (args.has(FRACTION_FLAG.name) && picker !== 'fraction') throw new UsageError('--fraction applies to --picker fraction');
    let matches: (name: string) => boolean;
    try {
      matches = compileWatchPattern(args.text(PATTERN_FLAG.name) ?? DEFAULT_WATCH_PATTERN);
    } catch (error) {
      if (error instanceof WatchPatternError) throw new UsageError(`--pattern: ${error.message}`);
      throw error;
    }
    const interval = args.quantity(INTERVAL_FLAG.name);
    const interval_s = interval
      ? computeFor(interval, (v) => requireInRange('interval', v, INTERVAL_FLAG.range[0], INTERVAL_FLAG.range[1], 's'))
      : DEFAULT_WATCH_INTERVAL_S;
    const sds = readUncertainties(args);
    const choice = readChoiceRule('watch', args);
    try {
      if (!statSync(dir).isDirectory()) throw new UsageError(`"${dir}" is not a folder; give the folder the trace files are written into`);
    } catch (error) {
      if (error instanceof UsageError) throw error;
      throw new UsageError(`cannot read the folder "${dir}": ${(error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such folder' : printableLine(String(error))}`);
    }
    const heater = args.text(HEATER_FLAG.name);
    const timeColumn = args.text(TIME_FLAG.name);
    const pickOptions = {
      picker,
      ...optional('heater', heater),
      ...optional('sensor', args.text(SENSOR_FLAG.name)),
      ...optional('from_s', args.quantity(FROM_FLAG.name)?.value),
      ...optional('to_s', args.quantity(TO_FLAG.name)?.value),
      ...optional('thresholdSigma', args.number(THRESHOLD_FLAG.name)?.value),
      ...optional('fraction', args.number(FRACTION_FLAG.name)?.value),
    };
    const json = args.flag(JSON_FLAG.name);
    // Each row is printed as it comes: the series keeps only the rows a later file may still settle.
    const series = new WatchSeries({ ...sds, distance_m, start: choice?.rule ?? null }, false);
    const print = (row: WatchRow) => {
      const line = watchLine(row);
      io.stdout(`${json ? JSON.stringify(line) : csvLine(line)}\n`);
    };
    const complain = (text: string) => io.stderr(json ? `${JSON.stringify({ error: printableLine(text), field: null })}\n` : `sekundo: ${printableLine(text)}\n`);
    let read = 0;
    let failed = 0;
    let listFailing = false;

    const readOne = (entry: FolderEntry) => {
      const path = join(dir, entry.name);
      try {
        const trace = readTrace(path, timeColumn);
        const pick = fromFile('trace file', path, () => pickTraceArrival(trace, pickOptions));
        if (pick.delay_s <= sds.offset_s) {
          throw new UsageError(`trace file "${path}": the picked delay ${pick.delay_s} s is not after the offset ${sds.offset_s} s`);
        }
        const kept: WatchPick = { delay_s: pick.delay_s, delaySd_s: pick.delaySd_s, snr: pick.snr, sensor: pick.sensor, picker: pick.picker };
        return { ok: true as const, reading: { file: entry.name, fields: trace.metadata.fields, modified_ms: entry.modified_ms, pick: kept, problem: null } };
      } catch (error) {
        if (error instanceof UsageError) return { ok: false as const, message: error.message };
        throw error;
      }
    };

    const onEvent = (event: PollEvent) => {
      if (event.kind === 'renamed') {
        series.rename(event.from, event.to);
        return;
      }
      if (event.kind === 'vanished') return;
      const result = readOne(event.entry);
      if (!result.ok) {
        failed += 1;
        complain(result.message);
        return;
      }
      read += 1;
      const { row, settled } = series.add(result.reading);
      if (event.again) row.warnings.unshift('read again: the file changed after it was first read');
      print(row);
      for (const earlier of settled) print(earlier);
    };

    const controller = new AbortController();
    const stop = () => controller.abort();
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
    if (!json) io.stdout(`${WATCH_COLUMNS.join(',')}\n`);
    const poller = new FolderPoller(matches);
    const folder = nodeFolder(dir);
    try {
      await followFolder({
        source: {
          list: async () => {
            const listing = await folder.list();
            // Listed again after a failure: the next failure is reported again.
            listFailing = false;
            return listing;
          },
        },
        poller,
        interval_ms: interval_s * 1000,
        sleep: realSleep,
        signal: controller.signal,
        once: args.flag(ONCE_FLAG.name),
        onEvent,
        onListError: (error) => {
          if (listFailing) return;
          listFailing = true;
          complain(`cannot list the folder "${dir}" (${(error as NodeJS.ErrnoException).code === 'ENOENT' ? 'it is gone' : printableLine(String(error))}); looking again`);
        },
      });
    } finally {
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
    }
    if (args.flag(ONCE_FLAG.name)) {
      for (const name of poller.waiting()) complain(`${join(dir, name)}: still being written (its size changed between two looks); not read`);
    }
    if (!json) io.stderr(`sekundo: watch ended: ${read} file${read === 1 ? '' : 's'} read${failed > 0 ? `, ${failed} not read` : ''}\n`);
    return EXIT_OK;
  },
};
