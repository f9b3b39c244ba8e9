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
  chooseCandidate,
  DELAY_LIMITS,
  PhysicsError,
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
  if (pressure) {
    computeFor(pressure, (v) => requireInRange('vapour pressure', v, VAPOUR_PRESSURE_RANGE_PA[0], VAPOUR_PRESSURE_RANGE_PA[1], 'Pa'));
    return { rule: { kind: 'pressure', pressure_Pa: pressure.value }, arg: pressure };
  }
  if (near) {
    computeFor(near, (v) => requireInRange('expected temperature', v, PROPERTIES_RANGE_K[0], PROPERTIES_RANGE_K[1], 'K'));
    return { rule: { kind: 'near', temperature_K: near.value }, arg: near };
  }
  return undefined;
}

/** Which candidate is chosen (index or null) and why, in words. */
export interface ChoiceResult {
  chosen: number | null;
  choice: string;
}

/**
 * Applies --pressure / --near; without either, a single candidate is chosen and several are left
 * undecided (the reason says how to decide).
 */
export function chooseFor(candidates: readonly TemperatureCandidate[], given: { rule: ChoiceRule; arg: QuantityArg } | undefined): ChoiceResult {
  if (given) {
    const c = computeFor(given.arg, () => chooseCandidate(candidates, given.rule));
    return { chosen: c.index, choice: c.reason };
  }
  if (candidates.length === 1) return { chosen: 0, choice: 'the only candidate' };
  if (candidates.length === 0) return { chosen: null, choice: 'no candidate temperature' };
  return { chosen: null, choice: `${candidates.length} candidates: give --pressure or --near to choose` };
}

/** Candidates as a table: number (chosen marked *), T, sd, slope, branch, note. */
export function renderCandidates(candidates: readonly TemperatureCandidate[], chosen: number | null): string[] {
  if (candidates.length === 0) return ['No temperature in 0.3 K – Tλ has this speed.'];
  const rows = [
    ['', 'T90 (K)', 'sd (mK)', 'du₂/dT (m/s/K)', 'branch', 'note'],
    ...candidates.map((c, i) => [
      `${i + 1}${i === chosen ? '*' : ''}`,
      formatKelvin(c.temperature_K),
      formatSignificant(fromBaseUnit(c.sd_K, 'mK'), 3),
      formatSignificant(c.slope_m_s_K, 4),
      c.branch,
      candidateNote(c),
    ]),
  ];
  return alignTable(rows, ['left', 'right', 'right', 'right', 'left', 'left']);
}

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
