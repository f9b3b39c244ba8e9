/**
 * Words for the candidates: what each flag means, why the chosen one was chosen and why each other
 * one was not. Pure; the kernel decides, this only says it.
 */
import {
  type Choice,
  type ChoiceRule,
  chooseCandidate,
  PhysicsError,
  SECOND_SOUND_EXTREMA,
  type TemperatureCandidate,
  temperatureFromVapourPressure,
} from '../../physics';
import { formatSignificant } from '../units/format-number';
import { sentence } from './converter-checks';
import { fixedTemperatureText } from '../units/unit-views';
import { LADDERS, readText } from '../units/ladders';

/** A flag shown on a candidate, with the sentence that explains it. */
export interface CandidateFlag {
  key: 'extremum' | 'insensitive' | 'landau' | 'critical';
  label: string;
  explanation: string;
}

const BRANCH_WORDS: Readonly<Record<TemperatureCandidate['branch'], string>> = {
  low: 'low, falling',
  middle: 'middle, rising',
  high: 'high, falling',
};

export function branchWords(branch: TemperatureCandidate['branch']): string {
  return BRANCH_WORDS[branch];
}

/** The flags of a candidate, each explained. */
export function candidateFlags(c: TemperatureCandidate): CandidateFlag[] {
  const flags: CandidateFlag[] = [];
  if (c.kind === 'extremum') {
    const which = Math.abs(c.temperature_K - SECOND_SOUND_EXTREMA.maximum.temperature_K) < Math.abs(c.temperature_K - SECOND_SOUND_EXTREMA.minimum.temperature_K) ? 'maximum' : 'minimum';
    const u = SECOND_SOUND_EXTREMA[which].speed_m_s;
    flags.push({
      key: 'extremum',
      label: `u₂ ${which}`,
      explanation: `The speed lies just ${which === 'maximum' ? 'above' : 'below'} the u₂ ${which} (${formatSignificant(u)} m/s), within two sd: no temperature has exactly this speed, but the ${which} itself is consistent with it.`,
    });
  }
  if (c.insensitive) {
    flags.push({
      key: 'insensitive',
      label: 'insensitive here',
      explanation: `u₂ barely changes with T here (du₂/dT = ${formatSignificant(c.slope_m_s_K, 2)} m/s/K), so the delay pins the temperature poorly; the sd is the second-order bound.`,
    });
  }
  if (c.region === 'Landau model') flags.push({ key: 'landau', label: 'Landau model', explanation: 'Below 0.55 K u₂ comes from the Landau model, not from measurements.' });
  if (c.region === 'critical scaling') flags.push({ key: 'critical', label: 'critical scaling', explanation: 'In the last 5 µK below Tλ u₂ comes from critical scaling.' });
  return flags;
}

/** The choice the rule makes, its reason with temperatures in `unit`, or why it could not be applied. */
export function applyRule(candidates: readonly TemperatureCandidate[], rule: ChoiceRule | null, unit: 'K' | 'mK' = 'K'): Choice & { problem: string | null } {
  if (rule === null) return { index: null, reason: 'no way of choosing is set', evidenceSd: candidates.map(() => null), warnings: [], problem: null };
  try {
    return { ...chooseCandidate(candidates, rule, (T) => fixedTemperatureText(T, unit)), problem: null };
  } catch (error) {
    if (error instanceof PhysicsError) return { index: null, reason: 'the rule cannot be applied', evidenceSd: candidates.map(() => null), warnings: [], problem: sentence(error.message) };
    throw error;
  }
}

/** Temperature the rule points at (vapour pressure → ITS-90 T, expected T), for the notes and the chart. */
export function ruleTemperature(rule: ChoiceRule | null): number | null {
  if (rule === null || rule.kind === 'range') return null;
  if (rule.kind === 'near') return rule.temperature_K;
  try {
    return temperatureFromVapourPressure(rule.pressure_Pa).temperature_K;
  } catch {
    return null;
  }
}

/** Why candidate `i` was or was not chosen, in a few words, temperatures in `unit`. */
export function choiceNote(candidates: readonly TemperatureCandidate[], i: number, rule: ChoiceRule | null, choice: Choice, unit: 'K' | 'mK' = 'K'): string {
  const shown = (T: number) => fixedTemperatureText(T, unit);
  const c = candidates[i];
  if (!c) return '';
  if (choice.index === i) return `Chosen: ${choice.reason}.`;
  if (rule === null) return candidates.length === 1 ? 'The only candidate.' : 'Undecided.';
  if (rule.kind === 'range') {
    const inside = c.temperature_K >= rule.min_K && c.temperature_K <= rule.max_K;
    return inside ? `Inside the range, but ${choice.reason}: the range does not decide.` : `Outside ${shown(rule.min_K)}–${shown(rule.max_K)}.`;
  }
  const target = ruleTemperature(rule);
  if (target === null) return 'Not chosen.';
  const dT = c.temperature_K - target;
  const source = rule.kind === 'pressure' ? 'the vapour-pressure temperature' : 'the expected temperature';
  const sigmas = c.sd_K > 0 ? ` (${formatSignificant(Math.abs(dT) / c.sd_K, 2)} sd)` : '';
  // A difference: in the unit that suits its size (µK, mK, K), as the planner shows differences.
  return `${dT >= 0 ? '+' : '−'}${readText(Math.abs(dT), LADDERS.temperatureDifference, 3)} from ${source} ${shown(target)}${sigmas}.`;
}
