/**
 * `sekundo delay`: a time of flight → the second-sound speed and every bath temperature with that
 * speed (u₂ is not monotonic: up to three), with their sds, and the one a pressure or an expected
 * temperature picks. With --input, a CSV of delays → a CSV of results (src/io/delay-batch).
 */
import { type ChoiceRule, convertDelay, DELAY_LIMITS, type DelayConversion, OutOfRangeError, requireInRange, SPEED_RANGE_M_S } from '../../physics';
import { parseDelayCsv } from '../../io/delay-batch';
import { delayBatchCsvBytes } from '../../io/delay-results-csv';
import { tooSlowForSecondSound } from '../../io/speed-plausibility';
import { type QuantityFlag, requireQuantity, type TextFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { alignTable, formatPlain, formatRange, formatSignificant } from '../format';
import { computeFor } from '../kernel-call';
import { writeChunks } from '../output';
import {
  type ChoiceResult,
  chooseFor,
  DELAY_SD_FLAG,
  DISTANCE_SD_FLAG,
  fromFile,
  INTERVAL_LEGEND,
  NEAR_FLAG,
  OFFSET_FLAG,
  OFFSET_SD_FLAG,
  PRESSURE_FLAG,
  PRESSURE_SD_FLAG,
  readChoiceRule,
  readInputFile,
  readUncertainties,
  renderCandidates,
  renderWarnings,
} from './convert-shared';
import { JSON_FLAG, writeJson } from './shared';

const DISTANCE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'distance',
  dimension: 'length',
  placeholder: 'd',
  range: DELAY_LIMITS.distance_m,
  help: 'heater–sensor path, cold (required for one delay; with --input, for rows without distance_m)',
};

const DELAY_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'delay',
  dimension: 'time',
  placeholder: 't',
  range: DELAY_LIMITS.delay_s,
  help: 'measured delay from the heater pulse to the arrival',
};

const INPUT_FLAG: TextFlag = {
  kind: 'text',
  name: 'input',
  placeholder: 'FILE',
  help: 'a CSV of delays (column delay_s; optional distance_m, pressure_Pa, timestamp); "-" reads standard input',
};

const COLUMN_FLAG: TextFlag = {
  kind: 'text',
  name: 'column',
  placeholder: 'NAME',
  help: 'with --input: the delay column (default delay_s; a unit in the name, e.g. delay_ms, scales it)',
};

/** The JSON printed for one delay. */
export interface DelayJson extends Omit<DelayConversion, 'candidates'>, ChoiceResult {
  distance_m: number;
  delay_s: number;
  offset_s: number;
}

/** The `delay` command. */
export const delayCommand: Command = {
  name: 'delay',
  summary: 'delay → second-sound speed and every candidate temperature (one delay, or a CSV with --input)',
  synopsis: [
    'delay --distance <d> --delay <t> [--distance-sd <σd>] [--delay-sd <σt>] [--offset <t0>] [--offset-sd <σt0>] [--pressure <p> | --near <T>] [--json]',
    'delay --input <FILE> [--distance <d>] [--column <NAME>] [sd and offset flags] [--pressure <p> | --near <T>]',
  ],
  description:
    'Turns a second-sound time of flight into the speed u = d/(t − t0) and every temperature T90 at which ' +
    'second sound has that speed, coldest first, each with its sd (from the distance, timing and offset ' +
    'sds and the u₂ table), the slope du₂/dT and its branch of the u₂ curve (low, middle, high: u₂ has a ' +
    'minimum near 1.12 K and a maximum near 1.65 K, so one speed can mean three temperatures). --pressure ' +
    '(the bath vapour pressure, ITS-90) or --near (an expected temperature) chooses one; "chosen" is its ' +
    'index into "candidates", or null. Each candidate has a 68 % and a 95 % interval, found by mapping the ' +
    "speed's interval through u₂(T) (asymmetric near the u₂ minimum and maximum, where an interval may run " +
    'across the turn into the next branch), and its sd in two parts: the measurement\'s and the u₂ curve\'s own. ' +
    'With --json, prints {speed_m_s, speedSd_m_s, candidates: [{temperature_K, sd_K, sdMeasurement_K, sdCurve_K, ' +
    'interval68_K: [low, high], interval95_K, reaches68, reaches95, evidenceSd, slope_m_s_K, branch, insensitive, ' +
    'region, kind}], chosen, choice, warnings: [{code, severity, message, value, limit}], …}; evidenceSd is the ' +
    "candidate's distance from --pressure or --near in sd (null without), and a chosen one beyond 3 sd draws an " +
    '"evidence-disagrees" caution. ' +
    'With --input, reads a CSV of delays and writes a CSV on standard output: a header row, then one row ' +
    'per input row (line, [timestamp], the delay column, distance_m, [pressure_Pa], speed_m_s, speedSd_m_s, ' +
    'candidates, chosen (1–3), chosen_by, T_K, T_sd_K, T_sd_meas_K, T_sd_curve_K, T_lo68_K, T_hi68_K, T_lo95_K, ' +
    'T_hi95_K, evidence_sd, alternatives, guess, warnings, then T1_K, T1_sd_K, T1_branch, T1_note … T3_note). ' +
    'A row with pressure_Pa is chosen by its pressure, later rows by continuity; before that, by --pressure ' +
    'or --near, else from the first row with a single candidate. Past a turn of u₂ (a chosen 95 % interval ' +
    'reaching its minimum or maximum) continuity cannot choose: such rows are "ambiguous" (alternatives: the two ' +
    'continuations; guess: the trend carried on, a guess) until a row with its own pressure "settles" them.',
  flags: [DISTANCE_FLAG, DELAY_FLAG, DISTANCE_SD_FLAG, DELAY_SD_FLAG, OFFSET_FLAG, OFFSET_SD_FLAG, PRESSURE_FLAG, PRESSURE_SD_FLAG, NEAR_FLAG, INPUT_FLAG, COLUMN_FLAG, JSON_FLAG],
  examples: [
    'delay --distance 50mm --delay 2.5ms',
    'delay --distance 50mm --delay 2.5ms --delay-sd 1us --distance-sd 20um --pressure 1638Pa --json',
    'delay --input delays.csv --distance 50mm --delay-sd 1us > temperatures.csv',
    'delay --input log.csv --column delay_ms --distance 12.5mm --near 1.8K',
  ],
  run(args, io) {
    const input = args.text(INPUT_FLAG.name);
    if (input !== undefined) return runBatch(args, input, io);
    for (const flag of [COLUMN_FLAG]) {
      if (args.has(flag.name)) throw new UsageError(`--${flag.name} needs --input: it names a column of the input file`);
    }
    const distance = requireQuantity('delay', args, DISTANCE_FLAG);
    const delay = requireQuantity('delay', args, DELAY_FLAG);
    const distance_m = computeFor(distance, (v) => requireInRange('distance', v, DELAY_LIMITS.distance_m[0], DELAY_LIMITS.distance_m[1], 'm'));
    const delay_s = computeFor(delay, (v) => requireInRange('delay', v, DELAY_LIMITS.delay_s[0], DELAY_LIMITS.delay_s[1], 's'));
    const sds = readUncertainties(args);
    const offset = args.quantity(OFFSET_FLAG.name);
    if (offset) computeFor(offset, (v) => requireInRange('offset', v, DELAY_LIMITS.offset_s[0], delay_s * (1 - 1e-12), 's'));
    const choice = readChoiceRule('delay', args);
    const conversion = convertOne(distance_m, delay_s, sds, distance.text, delay.text);
    const result: DelayJson = { distance_m, delay_s, offset_s: sds.offset_s, ...conversion, ...chooseFor(conversion.candidates, choice, conversion) };
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderDelay(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

function convertOne(distance_m: number, delay_s: number, sds: ReturnType<typeof readUncertainties>, distanceText: string, delayText: string): DelayConversion {
  const slow = tooSlowForSecondSound(distance_m / (delay_s - sds.offset_s));
  if (slow !== null) throw new UsageError(`--distance ${distanceText.trim()} and --delay ${delayText.trim()}: ${slow}`);
  try {
    return convertDelay({ distance_m, delay_s, ...sds });
  } catch (error) {
    if (error instanceof OutOfRangeError) {
      throw new UsageError(
        `--distance ${distanceText.trim()} and --delay ${delayText.trim()} give a speed of ${formatPlain(error.value)} m/s, ` +
          `outside the range of second sound ${formatRange(SPEED_RANGE_M_S, 'm/s')}`,
      );
    }
    throw error;
  }
}

async function runBatch(args: Parameters<Command['run']>[0], path: string, io: Parameters<Command['run']>[1]): Promise<number> {
  for (const flag of [DELAY_FLAG, JSON_FLAG]) {
    if (args.has(flag.name)) {
      throw new UsageError(`--${flag.name} cannot be used with --input: the delays come from the file and the results are written as CSV`);
    }
  }
  const distance = args.quantity(DISTANCE_FLAG.name);
  const distance_m = distance ? computeFor(distance, (v) => requireInRange('distance', v, DELAY_LIMITS.distance_m[0], DELAY_LIMITS.distance_m[1], 'm')) : undefined;
  const sds = readUncertainties(args);
  const choice = readChoiceRule('delay', args);
  const column = args.text(COLUMN_FLAG.name);
  const bytes = readInputFile(path, 'delay file');
  const batch = fromFile('delay file', path, () => parseDelayCsv(bytes, column === undefined ? {} : { column }));
  const start: ChoiceRule | undefined = choice?.rule;
  const missing = distance_m === undefined ? batch.rows.find((row) => row.distance_m === undefined) : undefined;
  if (missing) throw new UsageError(`delay file "${path}", line ${missing.line}: no distance_m on this row; give --distance, e.g. --distance 50mm`);
  const settings = { ...sds, ...(distance_m === undefined ? {} : { distance_m }), ...(start ? { start } : {}) };
  // Every row is checked (or the batch converted) here, so a refused row writes nothing; then rows
  // become text chunk by chunk as stdout takes them, and a closed pipe stops it quietly.
  const chunks = fromFile('delay file', path, () => delayBatchCsvBytes(batch, settings));
  await writeChunks(io, chunks);
  return EXIT_OK;
}

/** The human-readable result of one delay. */
export function renderDelay(r: DelayJson): string[] {
  const transit = r.delay_s - r.offset_s;
  const head = alignTable(
    [
      ['Distance', 'd', formatSignificant(r.distance_m * 1e3), 'mm'],
      ['Delay', 't', formatSignificant(r.delay_s * 1e3), 'ms'],
      ...(r.offset_s !== 0 ? [['Offset', 't0', formatSignificant(r.offset_s * 1e3), 'ms']] : []),
      ['Speed', 'u = d/(t − t0)', `${formatSignificant(r.speed_m_s)} ± ${formatSignificant(r.speedSd_m_s, 2)}`, 'm/s'],
      ['Transit', 't − t0', formatSignificant(transit * 1e3), 'ms'],
    ],
    ['left', 'left', 'right', 'left'],
  );
  const chosen = r.chosen === null ? null : r.candidates[r.chosen];
  return [
    ...head,
    '',
    `Temperatures with this speed (${r.candidates.length}):`,
    ...renderCandidates(r.candidates, r.chosen).map((l) => `  ${l}`),
    '',
    `  ${INTERVAL_LEGEND}`,
    '',
    chosen ? `Chosen: ${r.chosen === null ? '' : r.chosen + 1}, ${chosen.temperature_K.toFixed(5)} K: ${r.choice}` : `Not chosen: ${r.choice}`,
    ...renderWarnings(r.warnings),
  ];
}
