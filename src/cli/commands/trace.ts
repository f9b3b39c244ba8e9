/**
 * `sekundo trace FILE.csv [--distance <d>] [--heater-column NAME] [--sensor-column NAME]
 * [--picker KIND] [--json]`: the second-sound arrival in a digitiser trace (src/io/trace-csv,
 * src/io/trace-pick), its delay from the heater onset (or t = 0), and the temperature candidates.
 */
import { CsvInputError } from '../../io/csv-common';
import { tooSlowForSecondSound } from '../../io/speed-plausibility';
import { type TraceCsv, TraceCsvParser } from '../../io/trace-csv';
import { describeTraceHeader, type HeaderValue, readTraceHeader, type TraceHeaderValues } from '../../io/trace-header';
import { pickTraceArrival, TRACE_SEARCH_RANGE_S, type TracePick } from '../../io/trace-pick';
import {
  convertDelay,
  DELAY_LIMITS,
  type DelayConversion,
  PICKER_KINDS,
  PICKER_LIMITS,
  type PickerKind,
  PhysicsError,
  requireInRange,
} from '../../physics';
import type { NumberFlag, OperandSpec, QuantityFlag, TextFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { alignTable, formatSignificant } from '../format';
import { computeFor } from '../kernel-call';
import {
  type ChoiceResult,
  chooseFor,
  DISTANCE_SD_FLAG,
  fromFile,
  INTERVAL_LEGEND,
  NEAR_FLAG,
  OFFSET_FLAG,
  OFFSET_SD_FLAG,
  PRESSURE_FLAG,
  PRESSURE_SD_FLAG,
  readChoiceRule,
  readUncertainties,
  renderCandidates,
  renderWarnings,
  streamFile,
} from './convert-shared';
import { JSON_FLAG, writeJson } from './shared';

/** Below this peak/noise ratio the table warns that the pick may be noise. */
const LOW_SNR = 5;

/** The picker used when --picker is absent: the leading edge at half height. */
export const DEFAULT_PICKER: PickerKind = 'fraction';

const FILE_OPERAND: OperandSpec = {
  name: 'file',
  placeholder: 'FILE',
  help: 'a digitiser trace as CSV: a time column and one or more channels (comma, semicolon or tab)',
};

const DISTANCE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'distance',
  dimension: 'length',
  placeholder: 'd',
  range: DELAY_LIMITS.distance_m,
  help: 'heater–sensor path, cold: converts the delay to speed and temperatures (without it, the arrival only)',
};

export const HEATER_FLAG: TextFlag = {
  kind: 'text',
  name: 'heater-column',
  placeholder: 'NAME',
  help: 'the heater drive channel: time zero moves to its pulse onset (50 % of its first rise)',
};

export const SENSOR_FLAG: TextFlag = {
  kind: 'text',
  name: 'sensor-column',
  placeholder: 'NAME',
  help: 'the sensor channel (default: the first channel not named like heater, drive, trigger or pulse)',
};

export const TIME_FLAG: TextFlag = {
  kind: 'text',
  name: 'time-column',
  placeholder: 'NAME',
  help: 'the time column (default: the one named like time, t or s, else the first)',
};

export const PICKER_FLAG: TextFlag = {
  kind: 'text',
  name: 'picker',
  placeholder: PICKER_KINDS.join('|'),
  help: `how the arrival is found (default ${DEFAULT_PICKER})`,
};

export const FROM_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'from',
  dimension: 'time',
  placeholder: 't',
  range: TRACE_SEARCH_RANGE_S,
  help: 'start of the search window after time zero, e.g. past heater pickup (default 0)',
};

export const TO_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'to',
  dimension: 'time',
  placeholder: 't',
  range: TRACE_SEARCH_RANGE_S,
  help: 'end of the search window after time zero (default: the end of the trace)',
};

export const THRESHOLD_FLAG: NumberFlag = {
  kind: 'number',
  name: 'threshold',
  placeholder: 'k',
  range: PICKER_LIMITS.thresholdSigma,
  help: 'threshold picker: level in noise sd above the baseline (default 5)',
};

export const FRACTION_FLAG: NumberFlag = {
  kind: 'number',
  name: 'fraction',
  placeholder: 'f',
  range: PICKER_LIMITS.fraction,
  help: 'fraction picker: fraction of the peak on the leading edge (default 0.5)',
};

/** The JSON printed by `trace`. */
export interface TraceJson extends TracePick, ChoiceResult {
  /** Values read from the file's header under the documented keys (src/io/trace-header.ts), and the refusals. */
  header: {
    vapourPressure_Pa: HeaderValue<number> | null;
    acquired: { key: string; text: string; iso: string } | null;
    problems: string[];
  };
  file: string;
  rows: number;
  timeColumn: string;
  distance_m: number | null;
  speed_m_s: number | null;
  speedSd_m_s: number | null;
}

/** The `trace` command. */
export const traceCommand: Command = {
  name: 'trace',
  summary: 'arrival time in a digitiser trace (CSV) → delay, speed and candidate temperatures',
  synopsis: [
    'trace FILE --distance <d> [--heater-column <NAME>] [--sensor-column <NAME>] [--picker threshold|fraction|peak|xcorr] [--json]',
  ],
  description:
    'Reads a digitiser trace as CSV (header lines allowed; comma, semicolon or tab; a time column named ' +
    'like time, t or s, with a unit such as "Time (us)", else the first column), finds the second-sound ' +
    'arrival in the sensor channel and converts the delay into speed and every candidate temperature, ' +
    'as "sekundo delay" does. Time zero is the heater pulse onset when --heater-column names the drive ' +
    'channel, else t = 0 of the file; the baseline and noise come from the samples before time zero. ' +
    'Pickers: threshold (first crossing of --threshold noise sd), fraction (leading edge at --fraction of ' +
    'the peak), peak (parabola through the top), xcorr (cross-correlation; its template is the heater ' +
    'drive when --heater-column is given, else a rectangle as wide as the pulse at half height, whose ' +
    'arrival is the leading half-height point). With a heater column the delay runs like with like: onset to ' +
    'onset for threshold, fraction and xcorr, peak to peak for the peak picker (from the drive\'s centre at half ' +
    'height); "reference" says which. Baseline and noise come only from samples before time zero, the file\'s ' +
    't = 0 and the drive\'s first rise. A pick always lies inside its search window, or the command says why not. ' +
    'With --json, prints {arrival_s, arrivalSd_s, delay_s, ' +
    'delaySd_s, reference, referenceTime_s, picker, timeZero, timeZero_s, sensor, heater, template, snr, speed_m_s, speedSd_m_s, ' +
    'candidates, chosen, choice, warnings, …}; arrival_s is on the file\'s time axis, delay_s from the heater\'s ' +
    'matching feature (referenceTime_s on the file\'s axis).',
  flags: [
    DISTANCE_FLAG,
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
  operands: [FILE_OPERAND],
  examples: [
    'trace shot-017.csv --distance 50mm --heater-column heater --sensor-column bolometer',
    'trace shot-017.csv --distance 50mm --heater-column heater --picker xcorr --json',
    'trace scope.csv --distance 12.5mm --picker threshold --threshold 6 --from 200us',
  ],
  run(args, io) {
    const path = args.operand(FILE_OPERAND.name);
    if (path === undefined) throw new UsageError('"sekundo trace" needs a trace file, e.g. sekundo trace shot.csv --distance 50mm');
    const picker = readPicker(args.text(PICKER_FLAG.name));
    if (args.has(THRESHOLD_FLAG.name) && picker !== 'threshold') throw new UsageError('--threshold applies to --picker threshold');
    if (args.has(FRACTION_FLAG.name) && picker !== 'fraction') throw new UsageError('--fraction applies to --picker fraction');
    const distance = args.quantity(DISTANCE_FLAG.name);
    const distance_m = distance ? computeFor(distance, (v) => requireInRange('distance', v, DELAY_LIMITS.distance_m[0], DELAY_LIMITS.distance_m[1], 'm')) : null;
    const sds = readUncertainties(args);
    const choice = readChoiceRule('trace', args);
    const trace = readTrace(path, args.text(TIME_FLAG.name));
    const heater = args.text(HEATER_FLAG.name);
    const pick = fromFile(
      'trace file',
      path,
      () =>
        pickTraceArrival(trace, {
          picker,
          ...(heater === undefined ? {} : { heater }),
          ...optional('sensor', args.text(SENSOR_FLAG.name)),
          ...optional('from_s', args.quantity(FROM_FLAG.name)?.value),
          ...optional('to_s', args.quantity(TO_FLAG.name)?.value),
          ...optional('thresholdSigma', args.number(THRESHOLD_FLAG.name)?.value),
          ...optional('fraction', args.number(FRACTION_FLAG.name)?.value),
        }),
      (error) => (heater === undefined && /pre-trigger: needs/.test(error.message) ? 'give --heater-column to put time zero at the heater onset' : undefined),
    );
    let conversion: DelayConversion | null = null;
    if (distance_m !== null) {
      const offset = args.quantity(OFFSET_FLAG.name);
      if (offset) computeFor(offset, (v) => requireInRange('offset', v, DELAY_LIMITS.offset_s[0], pick.delay_s * (1 - 1e-12), 's'));
      conversion = fromFile('trace file', path, () => {
        requireInRange('picked delay', pick.delay_s, DELAY_LIMITS.delay_s[0], DELAY_LIMITS.delay_s[1], 's', 'the arrival must come after time zero');
        const slow = tooSlowForSecondSound(distance_m / (pick.delay_s - sds.offset_s));
        if (slow !== null) throw new CsvInputError('out-of-range', `the picked delay of ${pick.delay_s} s with --distance ${distance_m} m: ${slow}`);
        return convertDelay({ distance_m, delay_s: pick.delay_s, distanceSd_m: sds.distanceSd_m, delaySd_s: pick.delaySd_s, offset_s: sds.offset_s, offsetSd_s: sds.offsetSd_s });
      });
    }
    const header = readTraceHeader(trace.metadata.fields);
    const result: TraceJson = {
      file: path,
      rows: trace.metadata.rows,
      timeColumn: trace.metadata.timeColumn,
      ...pick,
      distance_m,
      speed_m_s: conversion?.speed_m_s ?? null,
      speedSd_m_s: conversion?.speedSd_m_s ?? null,
      ...(conversion ? chooseWithHeader(conversion, choice, header) : { chosen: null, choice: 'no --distance: no speed or temperature', candidates: [], warnings: [] }),
      header: {
        vapourPressure_Pa: header.vapourPressure_Pa,
        acquired: header.acquired_ms ? { key: header.acquired_ms.key, text: header.acquired_ms.text, iso: new Date(header.acquired_ms.value).toISOString() } : null,
        problems: header.problems,
      },
    };
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderTrace(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

/**
 * --pressure or --near when given; else the bath vapour pressure in the file's header (the
 * documented key, as the page reads it); else a single candidate or none.
 */
/**
 * --pressure or --near when given; else the vapour pressure under a documented header key
 * (src/io/trace-header.ts), said as such; else as chooseFor leaves it.
 */
function chooseWithHeader(conversion: DelayConversion, given: ReturnType<typeof readChoiceRule>, header: TraceHeaderValues): ChoiceResult {
  const { candidates } = conversion;
  const fromHeader = header.vapourPressure_Pa;
  if (given || !fromHeader || candidates.length === 0) return chooseFor(candidates, given, conversion);
  const where = `the vapour pressure in the file's header ("${fromHeader.key}: ${fromHeader.text}")`;
  try {
    const result = chooseFor(candidates, { rule: { kind: 'pressure', pressure_Pa: fromHeader.value } }, conversion);
    return { ...result, choice: `by ${where}: ${result.choice}` };
  } catch (error) {
    if (!(error instanceof PhysicsError)) throw error;
    const result = chooseFor(candidates, undefined, conversion);
    return { ...result, choice: `${where} cannot choose (${error.message}); ${result.choice}` };
  }
}

export function optional<K extends string, V>(key: K, value: V | undefined): { [P in K]?: V } {
  return (value === undefined ? {} : { [key]: value }) as { [P in K]?: V };
}

export function readPicker(text: string | undefined): PickerKind {
  if (text === undefined) return DEFAULT_PICKER;
  const kind = PICKER_KINDS.find((k) => k === text.trim().toLowerCase());
  if (!kind) throw new UsageError(`--picker "${text}" is not a picker; choose one of ${PICKER_KINDS.join(', ')}`);
  return kind;
}

/** Streams the trace file through the incremental parser; problems become one usage line. */
export function readTrace(path: string, timeColumn: string | undefined): TraceCsv {
  let parser: TraceCsvParser | null = null;
  return fromFile('trace file', path, () => {
    streamFile(
      path,
      'trace file',
      (totalBytes) => {
        parser = new TraceCsvParser({ totalBytes, ...(timeColumn === undefined ? {} : { timeColumn }) });
      },
      (chunk) => (parser as TraceCsvParser | null)?.feed(chunk),
    );
    if (parser === null) throw new CsvInputError('empty', 'the file is empty');
    return (parser as TraceCsvParser).finish();
  });
}

/** The human-readable result of `trace`. */
export function renderTrace(r: TraceJson): string[] {
  const us = (s: number) => formatSignificant(s * 1e6);
  const rows: string[][] = [
    ['Trace', `${r.file}: ${r.rows} rows, sensor "${r.sensor}"${r.heater ? `, heater "${r.heater}"` : ''}`],
    ['Time zero', r.heater ? `heater onset, ${us(r.timeZero_s)} ± ${formatSignificant(r.timeZeroSd_s * 1e6, 2)} µs on the file's axis` : "the file's t = 0"],
    ['Picker', `${r.picker}${r.template ? ` (template: ${r.template})` : ''}, SNR ${formatSignificant(r.snr, 3)}`],
    ['Arrival', `${us(r.arrival_s)} ± ${formatSignificant(r.arrivalSd_s * 1e6, 2)} µs on the file's axis`],
    ['Delay', `${us(r.delay_s)} ± ${formatSignificant(r.delaySd_s * 1e6, 2)} µs, ${r.reference}${r.reference === 'peak to peak' ? " (from the drive's centre at half height)" : ''}`],
    ['Noise', `${formatSignificant(r.baseline.noise, 3)} (file units) from ${r.baseline.samples} samples before time zero and the drive`],
  ];
  if (r.speed_m_s !== null && r.speedSd_m_s !== null) rows.push(['Speed', `${formatSignificant(r.speed_m_s)} ± ${formatSignificant(r.speedSd_m_s, 2)} m/s`]);
  const lines = alignTable(rows, ['left', 'left']);
  const used = describeTraceHeader({ vapourPressure_Pa: r.header.vapourPressure_Pa, acquired_ms: null, problems: [] });
  if (used || r.header.acquired) lines.push(`Header    ${[used, r.header.acquired ? `recorded ${r.header.acquired.iso} (from "${r.header.acquired.key}: ${r.header.acquired.text}")` : null].filter(Boolean).join('; ')}`);
  for (const problem of r.header.problems) lines.push(`Header    ${problem}`);
  if (r.snr < LOW_SNR) lines.push('', `Warning: SNR ${formatSignificant(r.snr, 3)} is low: the pick may be noise, not the pulse (check the channel and --from/--to).`);
  if (r.distance_m === null) return [...lines, '', 'Give --distance to convert the delay into speed and temperatures.'];
  const chosen = r.chosen === null ? null : r.candidates[r.chosen];
  return [
    ...lines,
    '',
    `Temperatures with this speed (${r.candidates.length}):`,
    ...renderCandidates(r.candidates, r.chosen).map((l) => `  ${l}`),
    '',
    `  ${INTERVAL_LEGEND}`,
    '',
    chosen ? `Chosen: ${(r.chosen ?? 0) + 1}, ${chosen.temperature_K.toFixed(5)} K: ${r.choice}` : `Not chosen: ${r.choice}`,
    ...renderWarnings(r.warnings),
  ];
}
