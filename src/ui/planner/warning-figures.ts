/**
 * The number behind each planner warning and the limit it crossed, in units people read
 * (the kernel gives both in SI). One entry per warning code.
 */
import type { PlanWarning, WarningCode } from '../../physics';
import { formatSignificant } from '../format/format-number';
import { type Ladder, LADDERS, readText } from './display-units';

interface FigureSpec {
  /** What the value is, e.g. "shock distance". */
  value: string;
  /** What the limit is, e.g. "path". */
  limit: string;
  ladder: Ladder | null;
  /** A limit of 0 means "no fixed limit" for this code. */
  noLimit?: boolean;
}

const SPECS: Record<WarningCode, FigureSpec> = {
  'no-second-sound': { value: 'bath', limit: 'Tλ', ladder: LADDERS.temperature },
  'model-region': { value: 'bath', limit: 'measured u₂ from', ladder: LADDERS.temperature },
  'near-lambda': { value: 'bath', limit: 'Tλ − 1 mK', ladder: LADDERS.temperature },
  'lambda-head': { value: 'bath', limit: 'Tλ at the setup', ladder: LADDERS.temperature },
  'large-amplitude': { value: 'peak δT', limit: 'kept below', ladder: LADDERS.temperatureDifference },
  shock: { value: 'shock distance', limit: 'path', ladder: LADDERS.length },
  'strong-flux': { value: 'flux', limit: 'strong from', ladder: LADDERS.heatFlux },
  counterflow: { value: 'counterflow', limit: 'noted above', ladder: null },
  'echo-overlap': { value: 'echo after the pulse', limit: 'pulse lasts', ladder: LADDERS.time },
  'range-ambiguity': { value: 'pulse period', limit: 'signals last', ladder: LADDERS.time },
  'record-too-short': { value: 'record ends', limit: 'pulse passes', ladder: LADDERS.time },
  'coarse-sampling': { value: 'sample interval', limit: 'wanted at most', ladder: LADDERS.time },
  'bath-heating': { value: 'average power', limit: '', ladder: LADDERS.power, noLimit: true },
  'low-snr': { value: 'SNR', limit: 'target', ladder: null },
  insensitive: { value: 'temperature sd', limit: 'target', ladder: LADDERS.temperatureDifference },
};

function show(x: number, code: WarningCode, ladder: Ladder | null): string {
  if (code === 'counterflow') return `${formatSignificant(x * 100, 3)} cm/s`;
  if (ladder === LADDERS.temperature) return `${x.toFixed(4)} K`;
  return ladder ? readText(x, ladder, 3) : formatSignificant(x, 3);
}

/** "shock distance 12.1 mm · path 9.97 mm", or "average power 0.05 mW". */
export function warningFigures(warning: PlanWarning): string {
  const spec = SPECS[warning.code];
  const value = `${spec.value} ${show(warning.value, warning.code, spec.ladder)}`;
  if (spec.noLimit) return value;
  return `${value} · ${spec.limit} ${show(warning.limit, warning.code, spec.ladder)}`;
}
