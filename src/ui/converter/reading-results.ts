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
import type { DistancePoints } from './converter-slice';
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

export function chooseFor(candidates: DelayConversion['candidates'], kind: ChoiceKind, values: FieldValues): Chosen {
  const rule = choiceRuleOf(kind, values);
  return { rule, choice: applyRule(candidates, rule) };
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

/** The export table of one delay: the reading, then one row per candidate. */
export function singleReadingTable(values: FieldValues, conversion: DelayConversion, chosen: Chosen): CandidateTable {
  return candidateTable(
    [
      ['distance_m', values.distance],
      ['distance_sd_m', values.distanceSd],
      ['delay_s', values.delay],
      ['delay_sd_s', values.delaySd],
      ['offset_s', values.offset],
      ['offset_sd_s', values.offsetSd],
      ['speed_m_s', conversion.speed_m_s],
      ['speed_sd_m_s', conversion.speedSd_m_s],
      ['rule', ruleWords(chosen.rule)],
    ],
    conversion.candidates,
    chosen.choice,
  );
}

/** The export table of a distance fit. */
export function distanceFitTable(fit: DistanceFit, chosen: Chosen): CandidateTable {
  return candidateTable(
    [
      ['speed_m_s', fit.speed_m_s],
      ['speed_sd_m_s', fit.speedSd_m_s],
      ['offset_s', fit.offset_s],
      ['offset_sd_s', fit.offsetSd_s],
      ['correlation', fit.correlation],
      ['chi_square', fit.chiSquare],
      ['dof', fit.degreesOfFreedom],
      ['weighted', fit.weighted],
      ['rule', ruleWords(chosen.rule)],
    ],
    fit.candidates,
    chosen.choice,
  );
}

/** The rule in words for an export cell: "vapour pressure 1638.2 Pa", "near 1.8 K", "range 1.7–2.1 K", "". */
export function ruleWords(rule: ChoiceRule | null): string {
  if (rule === null) return '';
  if (rule.kind === 'pressure') return `vapour pressure ${rule.pressure_Pa} Pa`;
  if (rule.kind === 'near') return `near ${rule.temperature_K} K`;
  return `range ${rule.min_K}–${rule.max_K} K`;
}
