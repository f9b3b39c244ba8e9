/**
 * The number behind each planner warning and the limit it crossed, in units people read
 * (the kernel gives both in SI): the header's chosen units where the quantity follows them.
 * One entry per warning code.
 */
import type { PlanWarning, WarningCode } from '../../physics';
import type { CsvTableData } from '../export/csv-export';
import { formatSignificant } from '../units/format-number';
import { LADDERS, readText, type ShownLadders, temperatureText } from '../units/ladders';

interface FigureSpec {
  /** What the value is, e.g. "shock distance". */
  value: string;
  /** What the limit is, e.g. "path". */
  limit: string;
  /** Which of the planner's ladders shows the numbers; null for a plain number. */
  ladder: keyof ShownLadders | null;
  /** A limit of 0 means "no fixed limit" for this code. */
  noLimit?: boolean;
}

const SPECS: Record<WarningCode, FigureSpec> = {
  'no-second-sound': { value: 'bath', limit: 'Tλ', ladder: 'temperature' },
  'model-region': { value: 'bath', limit: 'measured u₂ from', ladder: 'temperature' },
  'near-lambda': { value: 'bath', limit: 'Tλ − 1 mK', ladder: 'temperature' },
  'lambda-head': { value: 'bath', limit: 'Tλ at the setup', ladder: 'temperature' },
  'large-amplitude': { value: 'peak δT', limit: 'kept below', ladder: 'temperatureDifference' },
  shock: { value: 'shock distance', limit: 'path', ladder: 'length' },
  'strong-flux': { value: 'flux', limit: 'strong heating from', ladder: 'heatFlux' },
  counterflow: { value: 'counterflow', limit: 'limit', ladder: null },
  'behind-plane': { value: 'sensor at', limit: 'plane at', ladder: 'length' },
  'plane-through-heater': { value: 'plane at', limit: 'heater centre', ladder: 'length' },
  'echo-overlap': { value: 'echo after the pulse', limit: 'pulse lasts', ladder: 'time' },
  'range-ambiguity': { value: 'pulse period', limit: 'signals last', ladder: 'time' },
  'record-too-short': { value: 'record ends', limit: 'pulse passes', ladder: 'time' },
  'coarse-sampling': { value: 'sample interval', limit: 'wanted at most', ladder: 'time' },
  'bath-heating': { value: 'average power', limit: '', ladder: 'power', noLimit: true },
  'low-snr': { value: 'SNR', limit: 'target', ladder: null },
  insensitive: { value: 'temperature sd', limit: 'target', ladder: 'temperatureDifference' },
};

function show(x: number, code: WarningCode, ladder: keyof ShownLadders | null, ladders: ShownLadders): string {
  if (code === 'counterflow') return `${formatSignificant(x * 100, 3)} cm/s`;
  if (ladder === 'temperature') return temperatureText(x, ladders.temperature);
  return ladder ? readText(x, ladders[ladder], 3) : formatSignificant(x, 3);
}

/**
 * "shock distance 12.1 mm · path 9.97 mm", or "average power 0.05 mW"; `ladders` from
 * chosenLadders for the header's units (default: the planner's own ladders, kelvin).
 */
export function warningFigures(warning: PlanWarning, ladders: ShownLadders = LADDERS): string {
  const spec = SPECS[warning.code];
  const value = `${spec.value} ${show(warning.value, warning.code, spec.ladder, ladders)}`;
  if (spec.noLimit) return value;
  return `${value} · ${spec.limit} ${show(warning.limit, warning.code, spec.ladder, ladders)}`;
}

/** The SI unit of each ladder's numbers (the kernel's), for the CSV. */
const SI_UNIT: Record<keyof ShownLadders, string> = {
  temperature: 'K',
  temperatureDifference: 'K',
  pressure: 'Pa',
  length: 'm',
  time: 's',
  area: 'm2',
  frequency: 'Hz',
  sampleRate: 'S/s',
  voltage: 'V',
  responsivity: 'V/K',
  power: 'W',
  heatFlux: 'W/m2',
  speed: 'm/s',
};

/** The SI unit of a warning's value and limit ("" for a plain number such as an SNR). */
export function warningUnit(code: WarningCode): string {
  if (code === 'counterflow') return 'm/s';
  const ladder = SPECS[code].ladder;
  return ladder ? SI_UNIT[ladder] : '';
}

/**
 * The warnings as a CSV table, most severe first as listed: severity, code, sensor, message, and
 * the value and its limit unrounded in SI with the unit named (empty limit where there is none).
 */
export function warningsCsv(warnings: readonly PlanWarning[], sensorLabels: ReadonlyMap<string, string>): CsvTableData {
  return {
    header: ['severity', 'code', 'sensor_id', 'sensor_label', 'message', 'what', 'value', 'limit_what', 'limit', 'unit'],
    rows: warnings.map((w) => {
      const spec = SPECS[w.code];
      return [
        w.severity,
        w.code,
        w.sensorId ?? '',
        w.sensorId === null ? '' : (sensorLabels.get(w.sensorId) ?? ''),
        w.message,
        spec.value,
        w.value,
        spec.noLimit ? '' : spec.limit,
        spec.noLimit ? null : w.limit,
        warningUnit(w.code),
      ];
    }),
  };
}
