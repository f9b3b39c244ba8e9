/**
 * Pieces shared by several commands.
 */
import { fromBaseUnit } from '../../io/quantity';
import type { BooleanFlag } from '../args';
import type { CliIo } from '../io';

/** `--json`: print one JSON object instead of a table. */
export const JSON_FLAG: BooleanFlag = {
  kind: 'boolean',
  name: 'json',
  help: 'print one JSON object (keys carry SI units) instead of a table',
};

/** Writes `value` as one JSON object, indented, followed by a newline. */
export function writeJson(io: CliIo, value: unknown): void {
  io.stdout(`${JSON.stringify(value, null, 2)}\n`);
}

/** Temperatures print to 0.01 mK: five decimals in kelvin, two in millikelvin. */
const TEMPERATURE_DECIMALS_K = 5;
const TEMPERATURE_DECIMALS_MK = 2;

/** Kelvin to 0.01 mK, e.g. "1.80000". */
export function formatKelvin(T_K: number): string {
  return T_K.toFixed(TEMPERATURE_DECIMALS_K);
}

/** The same temperature in millikelvin, e.g. "1800.00". */
export function formatMillikelvin(T_K: number): string {
  return fromBaseUnit(T_K, 'mK').toFixed(TEMPERATURE_DECIMALS_MK);
}
