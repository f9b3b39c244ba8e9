import { requireInRange } from './errors';
import type { Branch, TemperatureCandidate } from './invert-delay';
import { PROPERTIES_RANGE_K } from './properties';
import { EVIDENCE_LIMIT_SD, evidenceWarning, kelvinText, type ReadingWarning } from './reading-warnings';
import { temperatureFromVapourPressure, VAPOUR_PRESSURE_RANGE_PA } from './vapour-pressure';

/*
 * Choosing among the candidates of one speed (PHYSICS notes §6): by an ITS-90 vapour-pressure
 * reading, by an expected range, or by continuity along a series. The unchosen candidates stay in
 * the result; a choice only says which one the evidence favours, and why. Every candidate is
 * given its distance from the evidence in sd, and a chosen one far from it draws a caution.
 * Continuity cannot choose at an extremum of u2: both branches meeting there are continuous, so
 * after a series has come within reach of one, later readings stay undecided (both continuations
 * kept) until one with its own evidence settles the branch back to the turn.
 */

export type ChoiceRule =
  | { kind: 'pressure'; pressure_Pa: number; /** One-sigma of the gauge reading, Pa (default 0). */ pressureSd_Pa?: number }
  | { kind: 'near'; temperature_K: number; /** One-sigma of the expectation, K (default 0). */ sd_K?: number }
  | { kind: 'range'; min_K: number; max_K: number };

export interface Choice {
  /** Index into the candidate list, or null when the rule cannot decide. */
  index: number | null;
  /** Plain words: what decided, or why nothing did. */
  reason: string;
  /** Per candidate: distance from the evidence in sd (null where the rule holds no evidence, as continuity). */
  evidenceSd: (number | null)[];
  /** Cautions about the choice (the planner's warning shape). */
  warnings: ReadingWarning[];
}

/** Limits of the evidence's own sds. */
export const EVIDENCE_SD_LIMITS = { pressureSd_Pa: [0, 1e5], sd_K: [0, 10] } as const;

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

/** The candidate's own spread towards T: the 68 % interval's half on that side (the sd where it is empty). */
function spreadTowards(c: TemperatureCandidate, T: number): number {
  const side = T >= c.temperature_K ? c.interval68_K[1] - c.temperature_K : c.temperature_K - c.interval68_K[0];
  return side > 0 ? side : c.sd_K;
}

/** |T_c − T_e| in sd of both (candidate: its 68 % half towards T_e; evidence: sd_e). */
export function distanceInSd(c: TemperatureCandidate, T_e: number, sd_e: number): number {
  const gap = Math.abs(c.temperature_K - T_e);
  const sd = Math.hypot(spreadTowards(c, T_e), sd_e);
  return gap === 0 ? 0 : sd > 0 ? gap / sd : Number.MAX_VALUE;
}

interface Evidence {
  T_K: number;
  sd_K: number;
  what: string;
}

/** The temperature a point rule stands for, with its sd and words; null for a range. */
function evidenceOf(rule: ChoiceRule, fmt: (T_K: number) => string): Evidence | null {
  switch (rule.kind) {
    case 'pressure': {
      requireInRange('vapour pressure', rule.pressure_Pa, VAPOUR_PRESSURE_RANGE_PA[0], VAPOUR_PRESSURE_RANGE_PA[1], 'Pa');
      const sdP = requireInRange('vapour pressure sd', rule.pressureSd_Pa ?? 0, ...EVIDENCE_SD_LIMITS.pressureSd_Pa, 'Pa');
      const vp = temperatureFromVapourPressure(rule.pressure_Pa);
      let sd_K = 0;
      if (sdP > 0) {
        const lo = temperatureFromVapourPressure(Math.max(VAPOUR_PRESSURE_RANGE_PA[0], rule.pressure_Pa - sdP)).temperature_K;
        const hi = temperatureFromVapourPressure(Math.min(VAPOUR_PRESSURE_RANGE_PA[1], rule.pressure_Pa + sdP)).temperature_K;
        sd_K = (hi - lo) / 2;
      }
      return { T_K: vp.temperature_K, sd_K, what: `the vapour pressure (${vp.scale})` };
    }
    case 'near': {
      requireInRange('expected temperature', rule.temperature_K, PROPERTIES_RANGE_K[0], PROPERTIES_RANGE_K[1], 'K');
      const sd_K = requireInRange('expected temperature sd', rule.sd_K ?? 0, ...EVIDENCE_SD_LIMITS.sd_K, 'K');
      return { T_K: rule.temperature_K, sd_K, what: `the expected ${fmt(rule.temperature_K)}` };
    }
    case 'range':
      return null;
  }
}

function rangeDistance(c: TemperatureCandidate, min_K: number, max_K: number): number {
  if (c.temperature_K >= min_K && c.temperature_K <= max_K) return 0;
  const edge = c.temperature_K < min_K ? min_K : max_K;
  return distanceInSd(c, edge, 0);
}

/**
 * Picks the candidate a rule favours. Pressure: the candidate nearest the ITS-90 vapour-pressure
 * temperature; near: the candidate nearest the given temperature; range: the single candidate
 * inside [min, max] (none or several: no choice). Each candidate's distance from the evidence in
 * sd comes with it; a chosen one more than 3 sd away draws an "evidence-disagrees" caution. `fmt`
 * writes the temperatures in the reason (default: kelvin to 0.1 mK, "1.8000 K"; a page may pass
 * its display unit). Throws typed errors for bad rule values.
 */
export function chooseCandidate(candidates: readonly TemperatureCandidate[], rule: ChoiceRule, fmt: (T_K: number) => string = kelvinText): Choice {
  const evidence = evidenceOf(rule, fmt);
  if (rule.kind === 'range') {
    requireInRange('range minimum', rule.min_K, 0, PROPERTIES_RANGE_K[1], 'K');
    requireInRange('range maximum', rule.max_K, rule.min_K, PROPERTIES_RANGE_K[1], 'K', 'at least the minimum');
  }
  if (candidates.length === 0) return { index: null, reason: 'no candidate temperature', evidenceSd: [], warnings: [] };
  if (evidence) {
    const evidenceSd = candidates.map((c) => distanceInSd(c, evidence.T_K, evidence.sd_K));
    const i = nearest(candidates, evidence.T_K);
    const reason = rule.kind === 'pressure' ? `nearest to ${fmt(evidence.T_K)} from ${evidence.what}` : `nearest to ${evidence.what}`;
    const d = evidenceSd[i] as number;
    const warnings = d > EVIDENCE_LIMIT_SD ? [evidenceWarning(candidates[i] as TemperatureCandidate, d, evidence, fmt)] : [];
    return { index: i, reason, evidenceSd, warnings };
  }
  const { min_K, max_K } = rule as Extract<ChoiceRule, { kind: 'range' }>;
  const evidenceSd = candidates.map((c) => rangeDistance(c, min_K, max_K));
  const inside = candidates.flatMap((c, i) => (c.temperature_K >= min_K && c.temperature_K <= max_K ? [i] : []));
  if (inside.length === 1) return { index: inside[0] as number, reason: `the only one in ${fmt(min_K)}–${fmt(max_K)}`, evidenceSd, warnings: [] };
  return {
    index: null,
    reason: inside.length === 0 ? `none in ${fmt(min_K)}–${fmt(max_K)}` : `${inside.length} lie in ${fmt(min_K)}–${fmt(max_K)}`,
    evidenceSd,
    warnings: [],
  };
}

/** What decided a reading of a series: its own rule, the series' start rule, or continuity. */
export type SeriesChoiceBy = 'own' | 'start' | 'continuity';

/** A reading past a turn of u2 that continuity cannot decide: both continuations, and a labelled guess. */
export interface SeriesAmbiguity {
  /** The extremum of u2 the series came within reach of. */
  turn: 'minimum' | 'maximum';
  /** Row (0-based, in the order given to the chooser) where the series reached the turn. */
  turnRow: number;
  /** Indices of the two continuations: [the branch the series came along, the branch across the turn]. */
  alternatives: [number, number];
  /** A guess, labelled as one: the trend carries on through the turn (the branch across it). */
  guess: number;
}

/** The choice for one reading of a series, with the rule that made it (continuity: "near" the last decided temperature). */
export interface SeriesChoice extends Choice {
  rule: ChoiceRule;
  by: SeriesChoiceBy;
  /** Set when continuity cannot decide past a turn (index is then null). */
  ambiguous: SeriesAmbiguity | null;
  /** Earlier ambiguous rows this reading's own evidence settles: row and the index of the continuation chosen there. */
  settles: { row: number; index: number }[];
}

/** Chooses for the next reading of a series; `own` is the reading's own rule (e.g. its vapour pressure), or null. */
export type SeriesChooser = (candidates: readonly TemperatureCandidate[], own?: ChoiceRule | null) => SeriesChoice;

interface Turn {
  extremum: 'minimum' | 'maximum';
  row: number;
  /** The branch the series came along, and the one across the turn. */
  along: Branch;
  across: Branch;
  /** Ambiguous rows since the turn: row, index on `along`, index on `across`. */
  pending: number[];
}

const BRANCHES_AT: Readonly<Record<'minimum' | 'maximum', readonly [Branch, Branch]>> = { minimum: ['low', 'middle'], maximum: ['middle', 'high'] };

function turnReached(c: TemperatureCandidate): 'minimum' | 'maximum' | null {
  return c.reaches95.includes('maximum') ? 'maximum' : c.reaches95.includes('minimum') ? 'minimum' : null;
}

function rootOn(candidates: readonly TemperatureCandidate[], branch: Branch): number {
  return candidates.findIndex((c) => c.branch === branch && c.kind === 'root');
}

/**
 * Continuity along a time series, one reading at a time (so a long series never has to be held):
 * a reading with its own rule is decided by that rule alone; after the first decided reading, each
 * one by the candidate nearest the last decided temperature (the bath changes slowly between
 * readings); before it, by `start`. A reading with no candidates, or one nothing decides, passes
 * the last decided temperature on.
 * Turns: once a candidate decided by continuity has a 95 % interval reaching an extremum of u2
 * (a reading decided by its own evidence says which branch it is on), continuity cannot tell
 * the two branches meeting there apart: the series may have passed the turn or come back from it.
 * Every later reading with a root on both branches is left undecided, with both continuations and
 * a guess (the trend carries on through the turn), until a reading with its own evidence chooses a
 * branch: `settles` then lists the undecided rows since the turn with the continuation on that
 * branch (rows close to the turn have intervals spanning both branches, so either continuation's
 * interval holds the truth there). `fmt` writes temperatures in the reasons. The
 * returned function throws, like chooseCandidate, for a rule with bad values; the series can go on.
 */
export function seriesChooser(start: ChoiceRule, fmt: (T_K: number) => string = kelvinText): SeriesChooser {
  let previous: number | null = null;
  let previousBranch: Branch | null = null;
  let turn: Turn | null = null;
  let row = 0;
  const noEvidence = (candidates: readonly TemperatureCandidate[]) => candidates.map(() => null);
  return (candidates, own = null) => {
    const k = row;
    row += 1;
    let choice: SeriesChoice;
    const settles: SeriesChoice['settles'] = [];
    if (own !== null) {
      choice = { ...chooseCandidate(candidates, own, fmt), rule: own, by: 'own', ambiguous: null, settles };
      const chosen = choice.index === null ? undefined : candidates[choice.index];
      if (turn && chosen && (chosen.branch === turn.along || chosen.branch === turn.across) && chosen.kind === 'root') {
        const onAlong = chosen.branch === turn.along;
        const p = turn.pending;
        for (let j = 0; j < p.length; j += 3) settles.push({ row: p[j] as number, index: p[j + (onAlong ? 1 : 2)] as number });
        choice.settles = settles;
        turn = null;
      } else if (chosen) turn = null;
    } else if (previous === null) {
      choice = { ...chooseCandidate(candidates, start, fmt), rule: start, by: 'start', ambiguous: null, settles };
    } else {
      const rule: ChoiceRule = { kind: 'near', temperature_K: previous };
      if (candidates.length === 0) {
        choice = { index: null, reason: 'no candidate temperature', evidenceSd: [], warnings: [], rule, by: 'continuity', ambiguous: null, settles };
      } else {
        const i = nearest(candidates, previous);
        const along = turn ? rootOn(candidates, turn.along) : -1;
        const across = turn ? rootOn(candidates, turn.across) : -1;
        if (turn && along >= 0 && across >= 0) {
          turn.pending.push(k, along, across);
          const ambiguous: SeriesAmbiguity = { turn: turn.extremum, turnRow: turn.row, alternatives: [along, across], guess: across };
          choice = {
            index: null,
            reason:
              `past the ${turn.extremum} of u₂ (row ${turn.row + 1}) continuity cannot choose: ${fmt((candidates[along] as TemperatureCandidate).temperature_K)} ` +
              `(back along the ${turn.along} branch) or ${fmt((candidates[across] as TemperatureCandidate).temperature_K)} (on across the turn); ` +
              'a reading with its own evidence (a pressure) will settle it',
            evidenceSd: noEvidence(candidates),
            warnings: [
              {
                code: 'series-ambiguous',
                severity: 'caution',
                message: `Past the ${turn.extremum} of u₂ both continuations fit this reading; neither is reported as chosen until a reading with its own evidence settles the branch.`,
                value: k - turn.row,
                limit: 0,
              },
            ],
            rule,
            by: 'continuity',
            ambiguous,
            settles,
          };
          return choice;
        }
        choice = {
          index: i,
          reason: `nearest to the previous reading (${fmt(previous)}, row ${k})`,
          evidenceSd: noEvidence(candidates),
          warnings: [],
          rule,
          by: 'continuity',
          ambiguous: null,
          settles,
        };
      }
    }
    if (choice.index !== null) {
      const chosen = candidates[choice.index] as TemperatureCandidate;
      previous = chosen.temperature_K;
      // Only continuity runs into a turn: a reading decided by its own evidence (or the start rule)
      // says which branch it is on, whatever its interval reaches.
      const reached = choice.by === 'continuity' ? turnReached(chosen) : null;
      if (reached && (!turn || turn.extremum !== reached)) {
        const [a, b] = BRANCHES_AT[reached];
        // The branch the series came along: the chosen root's, else the one decided before it.
        const from = chosen.kind === 'root' ? chosen.branch : previousBranch;
        const along = from === b ? b : a;
        turn = { extremum: reached, row: k, along, across: along === a ? b : a, pending: [] };
      }
      if (chosen.kind === 'root') previousBranch = chosen.branch;
    }
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
    const { index, reason, evidenceSd, warnings } = next(candidates);
    return { index, reason, evidenceSd, warnings };
  });
}
