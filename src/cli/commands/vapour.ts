/**
 * `sekundo vapour --pressure <p> | --temperature <T> [--json]`: helium-4 saturated vapour pressure
 * and temperature, either way (ITS-90 from 1.25 K; the reference spline below, labelled so).
 */
import { fromBaseUnit } from '../../io/quantity';
import {
  ITS90_RANGE_K,
  temperatureFromVapourPressure,
  VAPOUR_PRESSURE_RANGE_PA,
  VAPOUR_TEMPERATURE_RANGE_K,
  type VapourPressureResult,
  vapourPressure,
} from '../../physics';
import type { QuantityArg, QuantityFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { alignTable, formatRange, formatSignificant } from '../format';
import { computeFor } from '../kernel-call';
import { formatKelvin, formatMillikelvin, JSON_FLAG, writeJson } from './shared';

const PRESSURE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'pressure',
  dimension: 'pressure',
  placeholder: 'p',
  range: VAPOUR_PRESSURE_RANGE_PA,
  rangeNote: `the vapour curve over ${formatRange(VAPOUR_TEMPERATURE_RANGE_K, 'K')}`,
  help: 'saturated vapour pressure over the bath; prints the temperature T90',
};

const TEMPERATURE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'temperature',
  dimension: 'temperature',
  placeholder: 'T',
  range: VAPOUR_TEMPERATURE_RANGE_K,
  help: 'bath temperature T90; prints the saturated vapour pressure',
};

/** Pressure units shown beside pascal in the table, as gauges in the lab read. */
const DISPLAY_PRESSURE_UNITS = ['mbar', 'torr'] as const;

/** The `vapour` command. */
export const vapourCommand: Command = {
  name: 'vapour',
  summary: 'saturated vapour pressure ⇄ temperature of helium-4 (ITS-90)',
  synopsis: ['vapour --pressure <p> [--json]', 'vapour --temperature <T> [--json]'],
  description:
    'Converts between the saturated vapour pressure of helium-4 and the bath temperature T90. Give ' +
    `exactly one of --pressure or --temperature. From ${ITS90_RANGE_K[0]} K up this is the ITS-90 ` +
    'helium-4 vapour-pressure scale itself; below, a published reference spline that is not part ' +
    'of ITS-90, and the output says so in "scale". With --json, prints one JSON object ' +
    '{temperature_K, pressure_Pa, scale}.',
  flags: [PRESSURE_FLAG, TEMPERATURE_FLAG, JSON_FLAG],
  examples: ['vapour --pressure 1638Pa', 'vapour --pressure 16.38mbar --json', 'vapour --temperature 1.8K'],
  run(args, io) {
    const result = convert(args.quantity(PRESSURE_FLAG.name), args.quantity(TEMPERATURE_FLAG.name));
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderVapourTable(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

function convert(pressure: QuantityArg | undefined, temperature: QuantityArg | undefined): VapourPressureResult {
  if (pressure && !temperature) return computeFor(pressure, temperatureFromVapourPressure);
  if (temperature && !pressure) return computeFor(temperature, vapourPressure);
  const problem = pressure ? 'not both' : 'none was given';
  throw new UsageError(
    `"sekundo vapour" needs exactly one of --pressure (${formatRange(PRESSURE_FLAG.range, 'Pa')}) ` +
      `or --temperature (${formatRange(TEMPERATURE_FLAG.range, 'K')}); ${problem}`,
  );
}

/** The human-readable result of `vapour`: temperature, pressure in several units, then the scale. */
export function renderVapourTable(result: VapourPressureResult): string[] {
  const inOtherUnits = DISPLAY_PRESSURE_UNITS.map(
    (unit) => `${formatSignificant(fromBaseUnit(result.pressure_Pa, unit))} ${unit}`,
  ).join(', ');
  const table = alignTable(
    [
      ['Temperature', 'T90', formatKelvin(result.temperature_K), 'K', `${formatMillikelvin(result.temperature_K)} mK`],
      ['Vapour pressure', 'p_sat', formatSignificant(result.pressure_Pa), 'Pa', inOtherUnits],
    ],
    ['left', 'left', 'right', 'left', 'left'],
  );
  return [...table, '', `Scale: ${result.scale}`];
}
