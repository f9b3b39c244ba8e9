import { requireInRange } from './errors';
import type { TemperatureCandidate } from './invert-delay';
import { PROPERTIES_RANGE_K } from './properties';
import { temperatureFromVapourPressure, VAPOUR_PRESSURE_RANGE_PA } from './vapour-pressure';

/*
 * Choosing among the candidates of one speed (PHYSICS notes §6): by an ITS-90 vapour-pressure
 * reading, by an expected range, or by continuity along a series. The unchosen candidates stay in
 * the result; a choice only says which one the evidence favours, and why.
 */

export type ChoiceRule =
  | { kind: 'pressure'; pressure_Pa: number }
  | { kind: 'near'; temperature_K: number }
  | { kind: 'range'; min_K: number; max_K: number };

export interface Choice {
  /** Index into the candidate list, or null when the rule cannot decide. */
  index: number | null;
  /** Plain words: what decided, or why nothing did. */
  reason: string;
}

/** A temperature in a reason: kelvin to 0.1 mK ("1.8000 K"). */
function fmtK(T: number): string {
  return `${T.toFixed(4)} K`;
}

function nearest(candidates: readonly TemperatureCandidate[], T: number): number {
  let best = 0;
  let bestD = Number.POSITIVE_INFINITY;
  candidates.forEach((c, i) => {
    const d = Math.abs(c.temperature_K - T);
    if (d < bestD) {
      bestD = d;
      best = i;
    }
  });
  return best;
}

/**
 * Picks the candidate a rule favours. Pressure: the candidate nearest the ITS-90 vapour-pressure
 * temperature; near: the candidate nearest the given temperature; range: the single candidate
 * inside [min, max] (none or several: no choice). `fmt` writes the temperatures in the
 * reason (default: kelvin to 0.1 mK, "1.8000 K"; a page may pass its display unit). Throws typed
 * errors for bad rule values.
 */
export function chooseCandidate(candidates: readonly TemperatureCandidate[], rule: ChoiceRule, fmt: (T_K: number) => string = fmtK): Choice {
  if (candidates.length === 0) return { index: null, reason: 'no candidate temperature' };
  switch (rule.kind) {
    case 'pressure': {
      requireInRange('vapour pressure', rule.pressure_Pa, VAPOUR_PRESSURE_RANGE_PA[0], VAPOUR_PRESSURE_RANGE_PA[1], 'Pa');
      const vp = temperatureFromVapourPressure(rule.pressure_Pa);
      const i = nearest(candidates, vp.temperature_K);
      return { index: i, reason: `nearest to ${fmt(vp.temperature_K)} from the vapour pressure (${vp.scale})` };
    }
    case 'near': {
      requireInRange('expected temperature', rule.temperature_K, PROPERTIES_RANGE_K[0], PROPERTIES_RANGE_K[1], 'K');
      const i = nearest(candidates, rule.temperature_K);
      return { index: i, reason: `nearest to the expected ${fmt(rule.temperature_K)}` };
    }
    case 'range': {
      requireInRange('range minimum', rule.min_K, 0, PROPERTIES_RANGE_K[1], 'K');
      requireInRange('range maximum', rule.max_K, rule.min_K, PROPERTIES_RANGE_K[1], 'K', 'at least the minimum');
      const inside = candidates.flatMap((c, i) => (c.temperature_K >= rule.min_K && c.temperature_K <= rule.max_K ? [i] : []));
      if (inside.length === 1) return { index: inside[0] as number, reason: `the only one in ${fmt(rule.min_K)}–${fmt(rule.max_K)}` };
      return { index: null, reason: inside.length === 0 ? `none in ${fmt(rule.min_K)}–${fmt(rule.max_K)}` : `${inside.length} lie in ${fmt(rule.min_K)}–${fmt(rule.max_K)}` };
    }
  }
}

/** What decided a reading of a series: its own rule, the series' start rule, or continuity. */
export type SeriesChoiceBy = 'own' | 'start' | 'continuity';

/** The choice for one reading of a series, with the rule that made it (continuity: "near" the last decided temperature). */
export interface SeriesChoice extends Choice {
  rule: ChoiceRule;
  by: SeriesChoiceBy;
}

/** Chooses for the next reading of a series; `own` is the reading's own rule (e.g. its vapour pressure), or null. */
export type SeriesChooser = (candidates: readonly TemperatureCandidate[], own?: ChoiceRule | null) => SeriesChoice;

/**
 * Continuity along a time series, one reading at a time (so a long series never has to be held):
 * a reading with its own rule is decided by that rule alone; after the first decided reading, each
 * one by the candidate nearest the last decided temperature (the bath changes slowly between
 * readings); before it, by `start`. A reading with no candidates, or one nothing decides, passes
 * the last decided temperature on. `fmt` writes temperatures in the reasons (as chooseCandidate).
 * The returned function throws, like chooseCandidate, for a rule with bad values; the series can go on.
 */
export function seriesChooser(start: ChoiceRule, fmt: (T_K: number) => string = fmtK): SeriesChooser {
  let previous: number | null = null;
  let row = 0;
  return (candidates, own = null) => {
    const k = row;
    row += 1;
    let choice: SeriesChoice;
    if (own !== null) choice = { ...chooseCandidate(candidates, own, fmt), rule: own, by: 'own' };
    else if (previous === null) choice = { ...chooseCandidate(candidates, start, fmt), rule: start, by: 'start' };
    else {
      const rule: ChoiceRule = { kind: 'near', temperature_K: previous };
      choice =
        candidates.length === 0
          ? { index: null, reason: 'no candidate temperature', rule, by: 'continuity' }
          : { index: nearest(candidates, previous), reason: `nearest to the previous reading (${fmt(previous)}, row ${k})`, rule, by: 'continuity' };
    }
    if (choice.index !== null) previous = (candidates[choice.index] as TemperatureCandidate).temperature_K;
    return choice;
  };
}

/**
 * Continuity along a whole time series (see {@link seriesChooser}): the first reading is decided by
 * `start`, each later one by the candidate nearest the previous choice.
 */
export function chooseAlongSeries(series: readonly (readonly TemperatureCandidate[])[], start: ChoiceRule): Choice[] {
  const next = seriesChooser(start);
  return series.map((candidates) => {
    const { index, reason } = next(candidates);
    return { index, reason };
  });
}
