/**
 * `sekundo rehearse PLAN.json [--picker KIND] [--trials N] [--seed S] [--write-traces DIR] [--json]`:
 * synthetic digitiser records of a plan put through the converter's pickers (src/io/rehearse-run.ts),
 * with per-sensor bias and sd of the picked arrival and of the temperature, beside the planner's
 * analytic timing sd. `--write-traces` writes records as trace CSV files that `sekundo trace` reads.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { explainPlanError, PLAN_FORMAT, planFileToInput } from '../../io/plan-file';
import { recordCsv, recordFileName } from '../../io/rehearse-csv';
import {
  DEFAULT_REHEARSAL_OPTIONS,
  type RehearsalOptions,
  type RehearsalResult,
  REHEARSAL_TRIALS_RANGE,
  rehearse,
} from '../../io/rehearse-run';
import {
  computePlan,
  PhysicsError,
  PICKER_KINDS,
  PICKER_LIMITS,
  type PickerKind,
  type PlanResult,
  RECORD_SETTING_LIMITS,
  recordModel,
  recordTimes,
  SD_RATIO_NOTE,
  SEED_RANGE,
  syntheticRecord,
} from '../../physics';
import type { NumberFlag, OperandSpec, QuantityFlag, TextFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { ABSENT, alignTable, formatSignificant } from '../format';
import { describeFileError } from '../io';
import { loadPlan } from './plan';
import { JSON_FLAG, writeJson } from './shared';

/** Trace files written by default with --write-traces (each trial is one file of the whole record). */
export const DEFAULT_TRACE_FILES = 10;

const FILE_OPERAND: OperandSpec = { name: 'file', placeholder: 'PLAN.json', help: `a plan file (JSON, "format": "${PLAN_FORMAT}"), e.g. public/demo-plan.json` };

const PICKER_FLAG: TextFlag = {
  kind: 'text',
  name: 'picker',
  placeholder: PICKER_KINDS.join('|'),
  help: `the picker the converter would use (default ${DEFAULT_REHEARSAL_OPTIONS.picker})`,
};
const TRIALS_FLAG: NumberFlag = { kind: 'number', name: 'trials', placeholder: 'N', range: REHEARSAL_TRIALS_RANGE, integer: true, help: `synthetic records per sensor (default ${DEFAULT_REHEARSAL_OPTIONS.trials})` };
const SEED_FLAG: NumberFlag = { kind: 'number', name: 'seed', placeholder: 'S', range: SEED_RANGE, integer: true, help: `seed of the random numbers: the same seed gives the same records (default ${DEFAULT_REHEARSAL_OPTIONS.seed})` };
const THRESHOLD_FLAG: NumberFlag = { kind: 'number', name: 'threshold', placeholder: 'k', range: PICKER_LIMITS.thresholdSigma, help: 'threshold picker: level in noise sd above the baseline (default 5)' };
const FRACTION_FLAG: NumberFlag = { kind: 'number', name: 'fraction', placeholder: 'f', range: PICKER_LIMITS.fraction, help: 'fraction picker: fraction of the peak on the leading edge (default 0.5)' };
const BITS_FLAG: NumberFlag = {
  kind: 'number',
  name: 'bits',
  placeholder: 'b',
  range: RECORD_SETTING_LIMITS.resolutionBits,
  integer: true,
  help: 'digitiser resolution: round every shot to 2·range/2^b (default: no rounding)',
};
const RANGE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'range',
  dimension: 'voltage',
  placeholder: 'V',
  range: RECORD_SETTING_LIMITS.range_V,
  help: 'with --bits: full scale ±range of every sensor channel (default: per channel, the smallest 1-2-5 step above its peak + 5 noise sd)',
};
const PICKUP_FLAG: NumberFlag = {
  kind: 'number',
  name: 'first-sound-pickup',
  placeholder: 'share',
  range: RECORD_SETTING_LIMITS.firstSoundPickup,
  help: 'add a first-sound pickup of this share of the second-sound peak at the first-sound arrival (default 0: none)',
};
const WRITE_FLAG: TextFlag = { kind: 'text', name: 'write-traces', placeholder: 'DIR', help: 'write records as trace CSV files (time_s, heater, one column per sensor id) into DIR' };
const FILES_FLAG: NumberFlag = {
  kind: 'number',
  name: 'trace-files',
  placeholder: 'K',
  range: [1, REHEARSAL_TRIALS_RANGE[1]],
  integer: true,
  help: `with --write-traces: how many trials to write, the first K (default ${DEFAULT_TRACE_FILES}, at most --trials)`,
};

const us = (t: number | null, digits = 3): string => (t === null || !Number.isFinite(t) ? ABSENT : formatSignificant(t * 1e6, digits));
const mK = (t: number | null, digits = 3): string => (t === null || !Number.isFinite(t) ? ABSENT : formatSignificant(t * 1e3, digits));

/** The JSON printed by `rehearse --json`. */
export function rehearsalJson(path: string, planName: string, r: RehearsalResult, written: string[]): Record<string, unknown> {
  return {
    file: path,
    name: planName,
    picker: r.picker,
    trials: r.trials,
    seed: r.seed,
    temperature_K: r.temperature_K,
    sampleInterval_s: r.sampleInterval_s,
    samplesPerRecord: r.samples,
    skipped: r.skipped,
    sensors: r.sensors.map((s) => ({
      id: s.id,
      label: s.label,
      arrival_s: s.arrival_s,
      arrivalBias_s: s.arrivalBias_s,
      arrivalSd_s: s.arrivalSd_s,
      failedShare: s.failedShare,
      temperatureBias_K: s.temperatureBias_K,
      temperatureSd_K: s.temperatureSd_K,
      analyticTimingSd_s: s.analyticTimingSd_s,
      analyticTemperatureSd_K: s.analyticTemperatureSd_K,
      sdRatio: s.sdRatio,
      boundTimingSd_s: s.boundTimingSd_s,
      plannedArrival_s: s.plannedArrival_s,
      featureOffset_s: s.featureOffset_s,
      noiseFreeBias_s: s.noiseFreeBias_s,
      picks: s.picks,
      window: s.window,
      polarity: s.polarity,
      failureReasons: s.failureReasons,
      notes: s.notes,
    })),
    traces: written,
  };
}

/** The readable report: one table, then the notes per sensor. */
export function renderRehearsal(path: string, planName: string, r: RehearsalResult, written: string[]): string[] {
  const rows = [
    ['Sensor', 'True arrival (µs)', 'Bias (µs)', 'sd (µs)', 'Planner sd (µs)', 'Ratio', 'Bound (µs)', 'Failed', 'T bias (mK)', 'T sd (mK)', 'Planner T sd (mK)'],
    ...r.sensors.map((s) => [
      s.id,
      us(s.arrival_s, 6),
      us(s.arrivalBias_s),
      us(s.arrivalSd_s),
      us(s.analyticTimingSd_s),
      s.sdRatio === null ? ABSENT : formatSignificant(s.sdRatio, 2),
      us(s.boundTimingSd_s),
      `${formatSignificant(s.failedShare * 100, 3)} %`,
      mK(s.temperatureBias_K),
      mK(s.temperatureSd_K),
      mK(s.analyticTemperatureSd_K),
    ]),
  ];
  const lines = [
    `Rehearsal of "${planName}" (${path}): ${r.trials} synthetic records, ${r.picker} picker, seed ${r.seed}, ${r.samples} samples each`,
    '',
    ...alignTable(rows, ['left', 'right', 'right', 'right', 'right', 'right', 'right', 'right', 'right', 'right', 'right']),
    '',
    `True arrival: the delay of the feature this picker measures on the predicted pulse, measured like with like from the drive (the converter's rule); bias = mean picked − true. Temperatures use t0 calibrated with this picker; planner's T sd: a change between readings, from timing alone. Planner's sd: its analytic figure for this picker (noise through the picker's rule on the predicted pulse). Ratio: rehearsed sd / planner's sd (a note when beyond ×${SD_RATIO_NOTE}). Bound: the Cramér–Rao bound for the delay of the predicted pulse in this noise (Kay 1993), which a matched cross-correlation reaches at high SNR.`,
  ];
  for (const s of r.sensors) {
    const offset = s.featureOffset_s === null ? '' : `; its feature sits ${us(s.featureOffset_s)} µs from the planner's arrival ${us(s.plannedArrival_s, 6)} µs`;
    lines.push(`${s.id} (${s.label}): window ${us(s.window.from_s, 5)}–${us(s.window.to_s, 5)} µs, ${s.polarity} pulse${offset}.`);
    for (const note of s.notes) lines.push(`  ${note}`);
  }
  if (r.skipped.length > 0) lines.push(`Not rehearsed (no second-sound pulse reaches them): ${r.skipped.join(', ')}.`);
  if (written.length > 0) lines.push('', `Wrote ${written.length} trace file${written.length === 1 ? '' : 's'}: ${written[0]}${written.length > 1 ? ` … ${written[written.length - 1]}` : ''}`);
  return lines;
}

function readPicker(text: string | undefined): PickerKind {
  if (text === undefined) return DEFAULT_REHEARSAL_OPTIONS.picker;
  const kind = PICKER_KINDS.find((k) => k === text.trim().toLowerCase());
  if (!kind) throw new UsageError(`--picker "${text}" is not a picker; choose one of ${PICKER_KINDS.join(', ')}`);
  return kind;
}

function writeTraces(dir: string, count: number, planName: string, input: Parameters<typeof computePlan>[0], result: PlanResult, o: RehearsalOptions): string[] {
  try {
    mkdirSync(dir, { recursive: true });
  } catch (error) {
    throw new UsageError(`--write-traces ${dir}: ${describeFileError(error)}`);
  }
  const model = recordModel(input, result, o, o.seed);
  const times = recordTimes(model);
  const written: string[] = [];
  for (let trial = 0; trial < count; trial++) {
    const name = join(dir, recordFileName(trial, o.trials));
    try {
      writeFileSync(name, recordCsv(model, syntheticRecord(model, trial, times), { planName, trials: o.trials, seed: o.seed }));
    } catch (error) {
      throw new UsageError(`--write-traces ${dir}: ${describeFileError(error)}`);
    }
    written.push(name);
  }
  return written;
}

/** The `rehearse` command. */
export const rehearseCommand: Command = {
  name: 'rehearse',
  summary: "rehearse a plan: synthetic records through the converter's pickers → timing and temperature bias and sd per sensor",
  synopsis: ['rehearse PLAN.json [--picker threshold|fraction|peak|xcorr] [--trials N] [--seed S] [--write-traces DIR] [--json]'],
  description:
    "Makes N synthetic digitiser records of a plan (the planner's predicted pulse at each sensor — finite heater, lag, echoes — " +
    "sampled at the plan's rate and record length, with white noise of each sensor's level over √(pulses averaged), a random " +
    'trigger phase within one sample, and, when asked, rounding to --bits and a first-sound pickup; seeded, so the same seed ' +
    'gives the same numbers), picks the arrival in each with the converter\'s own picking (the heater channel as time zero ' +
    'and as the cross-correlation template), and prints per sensor the bias and sd of the picked arrival against the true ' +
    'one, the share of failed picks, and the temperature bias and sd (through the converter\'s delay → temperature ' +
    "inversion), beside the planner's analytic timing sd for that picker, with a note where they differ by more than a factor 1.5. The true " +
    'arrival is that of the feature the picker measures, on the prediction: onset to onset for threshold, fraction and xcorr, ' +
    'peak to peak for peak. With --json: {picker, trials, seed, temperature_K, sensors: [{id, arrival_s, arrivalBias_s, ' +
    'arrivalSd_s, failedShare, temperatureBias_K, temperatureSd_K, analyticTimingSd_s, plannedArrival_s, featureOffset_s, ' +
    'notes, …}], traces}. --write-traces DIR writes the first --trace-files records (default 10) as trace CSV files with ' +
    'columns time_s, heater and one per sensor id, which `sekundo trace` and the page read back.',
  flags: [PICKER_FLAG, TRIALS_FLAG, SEED_FLAG, THRESHOLD_FLAG, FRACTION_FLAG, BITS_FLAG, RANGE_FLAG, PICKUP_FLAG, WRITE_FLAG, FILES_FLAG, JSON_FLAG],
  operands: [FILE_OPERAND],
  examples: [
    'rehearse public/demo-plan.json',
    'rehearse public/demo-plan.json --picker fraction --trials 500 --seed 7 --json',
    'rehearse public/demo-plan.json --bits 12 --write-traces rehearsal --trace-files 3',
  ],
  run(args, io) {
    const path = args.operand(FILE_OPERAND.name);
    if (path === undefined) throw new UsageError('"sekundo rehearse" needs a plan file, e.g. sekundo rehearse public/demo-plan.json');
    const picker = readPicker(args.text(PICKER_FLAG.name));
    if (args.has(THRESHOLD_FLAG.name) && picker !== 'threshold') throw new UsageError('--threshold applies to --picker threshold');
    if (args.has(FRACTION_FLAG.name) && picker !== 'fraction') throw new UsageError('--fraction applies to --picker fraction');
    if (args.has(RANGE_FLAG.name) && !args.has(BITS_FLAG.name)) throw new UsageError('--range needs --bits: without a resolution nothing is rounded');
    if (args.has(FILES_FLAG.name) && !args.has(WRITE_FLAG.name)) throw new UsageError('--trace-files needs --write-traces DIR');
    const dir = args.text(WRITE_FLAG.name);
    if (dir !== undefined && dir.trim() === '') throw new UsageError('--write-traces needs a folder name');
    const options: RehearsalOptions = {
      picker,
      trials: args.number(TRIALS_FLAG.name)?.value ?? DEFAULT_REHEARSAL_OPTIONS.trials,
      seed: args.number(SEED_FLAG.name)?.value ?? DEFAULT_REHEARSAL_OPTIONS.seed,
      thresholdSigma: args.number(THRESHOLD_FLAG.name)?.value,
      fraction: args.number(FRACTION_FLAG.name)?.value,
      resolutionBits: args.number(BITS_FLAG.name)?.value ?? null,
      range_V: args.quantity(RANGE_FLAG.name)?.value ?? null,
      firstSoundPickup: args.number(PICKUP_FLAG.name)?.value ?? 0,
    };
    const files = args.number(FILES_FLAG.name)?.value ?? Math.min(DEFAULT_TRACE_FILES, options.trials);
    if (files > options.trials) throw new UsageError(`--trace-files ${files} is more than the ${options.trials} trials; give at most --trials`);
    const plan = loadPlan(path);
    let result: RehearsalResult;
    let written: string[] = [];
    try {
      const input = planFileToInput(plan);
      const planned = computePlan(input);
      result = rehearse(input, planned, options);
      if (dir !== undefined) written = writeTraces(dir, files, plan.name, input, planned, options);
    } catch (error) {
      if (error instanceof PhysicsError) throw new UsageError(`plan file "${path}": ${explainPlanError(error)}`);
      throw error;
    }
    if (args.flag(JSON_FLAG.name)) writeJson(io, rehearsalJson(path, plan.name, result, written));
    else io.stdout(`${renderRehearsal(path, plan.name, result, written).join('\n')}\n`);
    return EXIT_OK;
  },
};
