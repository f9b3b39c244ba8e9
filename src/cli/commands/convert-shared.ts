/**
 * Pieces shared by the converter commands (delay, trace, fit): the uncertainty and choice flags,
 * reading input files, turning CSV and kernel errors into one-line usage errors, and the
 * candidate table.
 */
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { CsvInputError } from '../../io/csv-common';
import { TABLE_CSV_SIZE_LIMIT_BYTES } from '../../io/small-csv';
import { fromBaseUnit } from '../../io/quantity';
import {
  type ChoiceRule,
  candidateWarnings,
  chooseCandidate,
  DELAY_LIMITS,
  EVIDENCE_SD_LIMITS,
  INTERVAL_K,
  PhysicsError,
  type ReadingWarning,
  speedSigmasFromTurn,
  PROPERTIES_RANGE_K,
  requireInRange,
  type TemperatureCandidate,
  VAPOUR_PRESSURE_RANGE_PA,
  VAPOUR_TEMPERATURE_RANGE_K,
} from '../../physics';
import type { ParsedArgs, QuantityArg, QuantityFlag } from '../args';
import { UsageError } from '../errors';
import { alignTable, formatRange, formatSignificant } from '../format';
import { readFileCapped } from '../io';
import { computeFor } from '../kernel-call';
import { formatKelvin } from './shared';

export const DISTANCE_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'distance-sd',
  dimension: 'length',
  placeholder: 'σd',
  range: DELAY_LIMITS.distanceSd_m,
  help: 'one-sigma uncertainty of the distance (default 0)',
};

export const DELAY_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'delay-sd',
  dimension: 'time',
  placeholder: 'σt',
  range: DELAY_LIMITS.delaySd_s,
  help: 'one-sigma uncertainty of each delay (default 0)',
};

export const OFFSET_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'offset',
  dimension: 'time',
  placeholder: 't0',
  range: DELAY_LIMITS.offset_s,
  rangeNote: 'must be less than the delay',
  help: 'offset t0 subtracted from every delay: heater and sensor lags, electronics (default 0)',
};

export const OFFSET_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'offset-sd',
  dimension: 'time',
  placeholder: 'σt0',
  range: DELAY_LIMITS.offsetSd_s,
  help: 'one-sigma uncertainty of the offset (default 0)',
};

export const PRESSURE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'pressure',
  dimension: 'pressure',
  placeholder: 'p',
  range: VAPOUR_PRESSURE_RANGE_PA,
  rangeNote: `the vapour curve over ${formatRange(VAPOUR_TEMPERATURE_RANGE_K, 'K')}`,
  help: 'bath vapour pressure: chooses the candidate nearest its ITS-90 temperature',
};

export const PRESSURE_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'pressure-sd',
  dimension: 'pressure',
  placeholder: 'σp',
  range: EVIDENCE_SD_LIMITS.pressureSd_Pa,
  help: 'one-sigma uncertainty of the --pressure reading (gauge): widens the evidence in evidenceSd (default 0)',
};

export const NEAR_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'near',
  dimension: 'temperature',
  placeholder: 'T',
  range: PROPERTIES_RANGE_K,
  help: 'expected bath temperature: chooses the candidate nearest it',
};

/** The uncertainty and offset flags, read and range-checked (SI; 0 when absent). */
export interface Uncertainties {
  distanceSd_m: number;
  delaySd_s: number;
  offset_s: number;
  offsetSd_s: number;
}

/** Reads --distance-sd, --delay-sd, --offset, --offset-sd, each checked against its range. */
export function readUncertainties(args: ParsedArgs): Uncertainties {
  return {
    distanceSd_m: checked(args.quantity(DISTANCE_SD_FLAG.name), 'distance sd', DELAY_LIMITS.distanceSd_m, 'm'),
    delaySd_s: checked(args.quantity(DELAY_SD_FLAG.name), 'delay sd', DELAY_LIMITS.delaySd_s, 's'),
    offset_s: checked(args.quantity(OFFSET_FLAG.name), 'offset', DELAY_LIMITS.offset_s, 's'),
    offsetSd_s: checked(args.quantity(OFFSET_SD_FLAG.name), 'offset sd', DELAY_LIMITS.offsetSd_s, 's'),
  };
}

/** The flag's value after the kernel's range check (naming the flag on failure), or 0 if absent. */
export function checked(arg: QuantityArg | undefined, quantity: string, range: readonly [number, number], unit: string): number {
  return arg ? computeFor(arg, (v) => requireInRange(quantity, v, range[0], range[1], unit)) : 0;
}

/** The choice rule of --pressure or --near (not both), or undefined. */
export function readChoiceRule(command: string, args: ParsedArgs): { rule: ChoiceRule; arg: QuantityArg } | undefined {
  const pressure = args.quantity(PRESSURE_FLAG.name);
  const near = args.quantity(NEAR_FLAG.name);
  if (pressure && near) throw new UsageError(`"sekundo ${command}" takes --pressure or --near to choose a temperature, not both`);
  const pressureSd = args.quantity(PRESSURE_SD_FLAG.name);
  if (pressureSd && !pressure) throw new UsageError(`--${PRESSURE_SD_FLAG.name} needs --pressure: it is the gauge's sd`);
  if (pressure) {
    computeFor(pressure, (v) => requireInRange('vapour pressure', v, VAPOUR_PRESSURE_RANGE_PA[0], VAPOUR_PRESSURE_RANGE_PA[1], 'Pa'));
    const sd = checked(pressureSd, 'vapour pressure sd', EVIDENCE_SD_LIMITS.pressureSd_Pa, 'Pa');
    return { rule: { kind: 'pressure', pressure_Pa: pressure.value, ...(sd > 0 ? { pressureSd_Pa: sd } : {}) }, arg: pressure };
  }
  if (near) {
    computeFor(near, (v) => requireInRange('expected temperature', v, PROPERTIES_RANGE_K[0], PROPERTIES_RANGE_K[1], 'K'));
    return { rule: { kind: 'near', temperature_K: near.value }, arg: near };
  }
  return undefined;
}

/** A candidate as the commands print it: the kernel's candidate and its distance from the evidence in sd. */
export type CandidateJson = TemperatureCandidate & { evidenceSd: number | null };

/**
 * Which candidate is chosen (index into `candidates`, or null) and why, in words; every candidate
 * with its distance from the evidence; and the warnings of the reading (the planner's shape).
 */
export interface ChoiceResult {
  chosen: number | null;
  choice: string;
  candidates: CandidateJson[];
  warnings: ReadingWarning[];
}

/**
 * Applies --pressure / --near; without either, a single candidate is chosen and several are left
 * undecided (the reason says how to decide). `speed` (m/s, with its measurement sd) is the number
 * behind a warning that the chosen interval runs across an extremum of u₂.
 */
export function chooseFor(
  candidates: readonly TemperatureCandidate[],
  given: { rule: ChoiceRule; arg?: QuantityArg } | undefined,
  speed: { speed_m_s: number; speedSd_m_s: number } | null = null,
): ChoiceResult {
  let chosen: number | null;
  let choice: string;
  let evidenceSd: (number | null)[] = candidates.map(() => null);
  const warnings: ReadingWarning[] = [];
  if (given) {
    // A flag's value is named in any refusal; evidence from elsewhere (a file's header) throws as it is.
    const c = given.arg ? computeFor(given.arg, () => chooseCandidate(candidates, given.rule)) : chooseCandidate(candidates, given.rule);
    ({ index: chosen, reason: choice, evidenceSd } = c);
    warnings.push(...c.warnings);
  } else if (candidates.length === 1) {
    chosen = 0;
    choice = 'the only candidate';
  } else if (candidates.length === 0) {
    chosen = null;
    choice = 'no candidate temperature';
  } else {
    chosen = null;
    choice = `${candidates.length} candidates: give --pressure or --near to choose`;
    warnings.push({
      code: 'undecided',
      severity: 'info',
      message: `${candidates.length} temperatures have this speed; give --pressure (the bath vapour pressure) or --near (an expected temperature) to choose.`,
      value: candidates.length,
      limit: 1,
    });
  }
  const pick = chosen === null ? undefined : candidates[chosen];
  if (pick) warnings.push(...candidateWarnings(pick, speed ? speedSigmasFromTurn(pick, speed.speed_m_s, speed.speedSd_m_s) : 0));
  return { chosen, choice, candidates: candidates.map((c, i) => ({ ...c, evidenceSd: evidenceSd[i] ?? null })), warnings };
}

/** The warnings as lines: "Caution: …", "Note: …". */
export function renderWarnings(warnings: readonly ReadingWarning[]): string[] {
  return warnings.map((w) => `${w.severity === 'info' ? 'Note' : w.severity === 'stop' ? 'Stop' : 'Caution'}: ${w.message}`);
}

/** An interval as "low – high" in kelvin, with what it reaches. */
function intervalText(interval: readonly [number, number], reaches: readonly string[]): string {
  const text = `${formatKelvin(interval[0])}–${formatKelvin(interval[1])}`;
  return reaches.length > 0 ? `${text} (${reaches.join(', ')})` : text;
}

/**
 * Candidates as a table: number (chosen marked *), T, sd (total, and its measurement and u₂-curve
 * parts), the 68 % and 95 % intervals, the distance from the evidence, slope, branch, note.
 */
export function renderCandidates(candidates: readonly CandidateJson[], chosen: number | null): string[] {
  if (candidates.length === 0) return ['No temperature in 0.3 K – Tλ has this speed.'];
  const mK = (K: number) => formatSignificant(fromBaseUnit(K, 'mK'), 3);
  const rows = [
    ['', 'T90 (K)', 'sd (mK)', 'meas (mK)', 'curve (mK)', `68 % (K)`, `95 % (K)`, 'evidence (sd)', 'du₂/dT (m/s/K)', 'branch', 'note'],
    ...candidates.map((c, i) => [
      `${i + 1}${i === chosen ? '*' : ''}`,
      formatKelvin(c.temperature_K),
      mK(c.sd_K),
      mK(c.sdMeasurement_K),
      mK(c.sdCurve_K),
      intervalText(c.interval68_K, c.reaches68),
      intervalText(c.interval95_K, c.reaches95),
      c.evidenceSd === null ? '' : formatSignificant(c.evidenceSd, 2),
      formatSignificant(c.slope_m_s_K, 4),
      c.branch,
      candidateNote(c),
    ]),
  ];
  return alignTable(rows, ['left', 'right', 'right', 'right', 'right', 'left', 'left', 'right', 'right', 'left', 'left']);
}

/** The line under the candidates that says what the intervals are. */
export const INTERVAL_LEGEND = `68 % and 95 %: every T with |u₂(T) − u| ≤ k·σ (k = ${INTERVAL_K.p68}, ${INTERVAL_K.p95.toFixed(2)}), σ from the measurement and the u₂ curve; "maximum"/"minimum": the interval runs across that turn of u₂ into the next branch.`;

function candidateNote(c: TemperatureCandidate): string {
  const notes: string[] = [];
  if (c.kind === 'extremum') notes.push('at the extremum of u₂ (speed just beyond it)');
  if (c.insensitive) notes.push('insensitive: u₂ is flat here');
  if (c.region !== 'measured') notes.push(c.region);
  return notes.join('; ');
}

/** Reads a whole input file ("-" for standard input) as bytes, at most `capBytes`; a failure is a one-line UsageError. */
export function readInputFile(path: string, what: string, capBytes = TABLE_CSV_SIZE_LIMIT_BYTES): Uint8Array {
  return readFileCapped(path, what, capBytes);
}

/**
 * Streams a file through `feed` in chunks of `chunkBytes`, after `start(totalBytes)`; a read
 * failure is a one-line UsageError.
 */
export function streamFile(path: string, what: string, start: (totalBytes: number) => void, feed: (chunk: Uint8Array) => void, chunkBytes = 4 * 1024 * 1024): void {
  let fd: number;
  let size: number;
  try {
    fd = openSync(path, 'r');
    size = fstatSync(fd).size;
  } catch (error) {
    throw new UsageError(`cannot read ${what} "${path}": ${describeFileError(error)}`);
  }
  try {
    start(size);
    const buffer = new Uint8Array(Math.max(1, Math.min(chunkBytes, size || 1)));
    for (;;) {
      let n: number;
      try {
        n = readSync(fd, buffer, 0, buffer.length, null);
      } catch (error) {
        throw new UsageError(`cannot read ${what} "${path}": ${describeFileError(error)}`);
      }
      if (n === 0) break;
      feed(buffer.subarray(0, n));
    }
  } finally {
    closeSync(fd);
  }
}

function describeFileError(error: unknown): string {
  const code = typeof error === 'object' && error !== null && 'code' in error ? String(error.code) : '';
  const reasons: Readonly<Record<string, string>> = {
    ENOENT: 'no such file',
    EISDIR: 'it is a directory',
    EACCES: 'permission denied',
    EPERM: 'permission denied',
  };
  return reasons[code] ?? (error instanceof Error ? error.message : String(error));
}

/**
 * Runs `read`; a CsvInputError becomes `<what> "<path>", line N: <problem>` and a kernel error
 * `<what> "<path>": <message>` (with `hint` appended when given), both one-line UsageErrors.
 */
export function fromFile<T>(what: string, path: string, read: () => T, hint?: (error: PhysicsError) => string | undefined): T {
  try {
    return read();
  } catch (error) {
    const name = `${what} "${path === '-' ? 'standard input' : path}"`;
    if (error instanceof CsvInputError) {
      throw new UsageError(error.line === undefined ? `${name}: ${error.detail}` : `${name}, line ${error.line}: ${error.detail}`);
    }
    if (error instanceof PhysicsError) {
      const extra = hint?.(error);
      throw new UsageError(`${name}: ${error.message}${extra ? ` (${extra})` : ''}`);
    }
    throw error;
  }
}
