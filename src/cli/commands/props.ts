/**
 * `sekundo props --temperature <T> [--json]`: every property of liquid helium-4 at one temperature.
 */
import { fromBaseUnit } from '../../io/quantity';
import {
  type HeliumProperties,
  heliumProperties,
  NO_VAPOUR_PRESSURE_REASON,
  PROPERTIES_RANGE_K,
  PROPERTY_CATALOGUE,
  type PropertyInfo,
  type PropertyKey,
  T_LAMBDA_K,
} from '../../physics';
import { type QuantityFlag, requireQuantity } from '../args';
import type { Command } from '../command';
import { EXIT_OK } from '../errors';
import { ABSENT, alignTable, formatSignificant } from '../format';
import { computeFor } from '../kernel-call';
import { formatKelvin, formatMillikelvin, JSON_FLAG, writeJson } from './shared';

const TEMPERATURE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'temperature',
  dimension: 'temperature',
  placeholder: 'T',
  range: PROPERTIES_RANGE_K,
  help: 'bath temperature T90 along saturated vapour pressure (required)',
};

/** Significant digits where the default would overstate what is known. */
const DIGITS: Partial<Record<PropertyKey, number>> = {
  secondSoundSd_m_s: 2,
};

/** The `props` command. */
export const propsCommand: Command = {
  name: 'props',
  summary: 'every property of liquid helium-4 at one temperature (u₂, u₁, ρ, ρs/ρ, s, c_p, α₂, p_sat)',
  synopsis: ['props --temperature <T> [--json]'],
  description:
    'Prints the properties of liquid helium-4 along saturated vapour pressure at temperature T90: ' +
    'second and first sound, density, superfluid and normal fractions, entropy, specific heat, ' +
    'the second-sound nonlinearity and the vapour pressure. Second sound exists only in He II, ' +
    `below Tλ = ${T_LAMBDA_K} K; above it the second-sound fields are null. With --json, prints one ` +
    'JSON object whose keys carry their SI units (temperature_K, secondSound_m_s, …).',
  flags: [TEMPERATURE_FLAG, JSON_FLAG],
  examples: ['props --temperature 1.8K', 'props --temperature=1450mK --json'],
  run(args, io) {
    const temperature = requireQuantity('props', args, TEMPERATURE_FLAG);
    const props = computeFor(temperature, heliumProperties);
    if (args.flag(JSON_FLAG.name)) writeJson(io, props);
    else io.stdout(`${renderPropsTable(props).join('\n')}\n`);
    return EXIT_OK;
  },
};

/** The human-readable table for `props`: label, symbol, value, unit, note; then any explanations. */
export function renderPropsTable(props: HeliumProperties): string[] {
  const rows: string[][] = [
    ['Temperature', 'T', formatKelvin(props.temperature_K), 'K', `${formatMillikelvin(props.temperature_K)} mK`],
    ['Phase', '', props.phase, '', phaseNote(props)],
    ...PROPERTY_CATALOGUE.map((info) => catalogueRow(info, props)),
    ['Reduced temperature', 't', formatSignificant(props.reducedTemperature), '1', '1 − T/Tλ'],
  ];
  const lines = [
    'Liquid helium-4 at saturated vapour pressure',
    '',
    ...alignTable(rows, ['left', 'left', 'right', 'left', 'left']),
  ];
  const notes = [props.secondSoundAbsentReason, props.vapourPressure_Pa === null ? NO_VAPOUR_PRESSURE_REASON : null];
  for (const note of notes) if (note) lines.push('', note);
  return lines;
}

function catalogueRow(info: PropertyInfo, props: HeliumProperties): string[] {
  const value = props[info.key];
  const text = value === null ? ABSENT : formatSignificant(value, DIGITS[info.key]);
  return [info.label, info.symbol, text, info.unit, rowNote(info.key, props)];
}

function rowNote(key: PropertyKey, props: HeliumProperties): string {
  if (key === 'secondSound_m_s' && props.secondSound_m_s !== null) return props.model;
  if (key === 'vapourPressure_Pa' && props.vapourPressure_Pa !== null) {
    const torr = formatSignificant(fromBaseUnit(props.vapourPressure_Pa, 'torr'));
    return `${props.vapourPressureScale ?? ''}; ${torr} torr`;
  }
  return '';
}

function phaseNote(props: HeliumProperties): string {
  return props.phase === 'He II' ? `superfluid, below Tλ = ${T_LAMBDA_K} K` : `normal fluid, above Tλ = ${T_LAMBDA_K} K`;
}
