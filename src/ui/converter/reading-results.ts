/**
 * Results of the reading modes, derived from the store's inputs with kernel calls: one delay, a
 * fit over several distances, a path calibration from a sweep. Each returns the result or the
 * kernel's message; the exports build their text from the same functions at click time.
 */
import {
  calibratePathFromSweep,
  type Choice,
  type ChoiceRule,
  type DelayConversion,
  type DistanceFit,
  fitDistances,
  type PathCalibration,
  PhysicsError,
} from '../../physics';
import { applyRule } from './candidate-notes';
import { type ChoiceKind, choiceRuleOf, convertReading, type FieldValues, sentence } from './converter-checks';
import { plain } from '../units/format-number';
import type { DistancePoints } from './converter-slice';
import { type UnitViews, csvColumn, inViewUnit, fixedTemperatureText } from '../units/unit-views';
import { type CandidateTable, candidateTable } from './export-text';

export type Derived<T> = { ok: true; value: T } | { ok: false; message: string };

function attempt<T>(work: () => T): Derived<T> {
  try {
    return { ok: true, value: work() };
  } catch (error) {
    if (error instanceof PhysicsError) return { ok: false, message: sentence(error.message) };
    throw error;
  }
}

export interface Chosen {
  rule: ChoiceRule | null;
  choice: Choice & { problem: string | null };
}

/** The choice the way of choosing makes, its reason with temperatures in `unit`. */
export function chooseFor(candidates: DelayConversion['candidates'], kind: ChoiceKind, values: FieldValues, unit: 'K' | 'mK' = 'K'): Chosen {
  const rule = choiceRuleOf(kind, values);
  return { rule, choice: applyRule(candidates, rule, unit) };
}

/** One delay → speed and candidates. */
export function singleReading(values: FieldValues): Derived<DelayConversion> {
  const r = convertReading(values);
  return r.ok ? { ok: true, value: r.conversion } : r;
}

/** Several distances → the fit (speed, t₀, covariance, residuals, candidates). */
export function distanceFit(points: DistancePoints | null): Derived<DistanceFit> | null {
  if (points === null) return null;
  return attempt(() => fitDistances(points.points));
}

/** A sweep through the u₂ maximum → path length. */
export function sweepCalibration(points: readonly { x: number; delay_s: number }[] | null, values: FieldValues): Derived<PathCalibration> | null {
  if (points === null) return null;
  return attempt(() => calibratePathFromSweep(points, values.offset ?? 0, values.offsetSd ?? 0));
}

/** The export table of one delay: the reading, then one row per candidate; lengths, times and temperatures in the display units. */
export function singleReadingTable(values: FieldValues, conversion: DelayConversion, chosen: Chosen, units: UnitViews): CandidateTable {
  const { length, time } = units;
  return candidateTable(
    [
      [csvColumn('distance', length), inViewUnit(values.distance, length)],
      [csvColumn('distance_sd', length), inViewUnit(values.distanceSd, length)],
      [csvColumn('delay', time), inViewUnit(values.delay, time)],
      [csvColumn('delay_sd', time), inViewUnit(values.delaySd, time)],
      [csvColumn('offset', time), inViewUnit(values.offset, time)],
      [csvColumn('offset_sd', time), inViewUnit(values.offsetSd, time)],
      ['speed_m_s', conversion.speed_m_s],
      ['speed_sd_m_s', conversion.speedSd_m_s],
      ['rule', ruleWords(chosen.rule, units)],
    ],
    conversion.candidates,
    chosen.choice,
    units.temperature,
  );
}

/** The export table of a distance fit; the offset and temperatures in the display units. */
export function distanceFitTable(fit: DistanceFit, chosen: Chosen, units: UnitViews): CandidateTable {
  const { time } = units;
  return candidateTable(
    [
      ['speed_m_s', fit.speed_m_s],
      ['speed_sd_m_s', fit.speedSd_m_s],
      [csvColumn('offset', time), time.fromSi(fit.offset_s)],
      [csvColumn('offset_sd', time), time.fromSi(fit.offsetSd_s)],
      ['correlation', fit.correlation],
      ['chi_square', fit.chiSquare],
      ['dof', fit.degreesOfFreedom],
      ['weighted', fit.weighted],
      ['rule', ruleWords(chosen.rule, units)],
    ],
    fit.candidates,
    chosen.choice,
    units.temperature,
  );
}

/** The rule in words for an export cell, in the display units: "vapour pressure 1638.2 Pa", "near 1.8000 K", "range 1700.0–2100.0 mK", "". */
export function ruleWords(rule: ChoiceRule | null, units: Pick<UnitViews, 'temperature' | 'pressure'>): string {
  if (rule === null) return '';
  const t = (T_K: number) => fixedTemperatureText(T_K, units.temperature.unit);
  if (rule.kind === 'pressure') return `vapour pressure ${plain(units.pressure.fromSi(rule.pressure_Pa))} ${units.pressure.shown}`;
  if (rule.kind === 'near') return `near ${t(rule.temperature_K)}`;
  return `range ${t(rule.min_K)}–${t(rule.max_K)}`;
}
