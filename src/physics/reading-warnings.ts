import { T_LAMBDA_K } from './constants';
import type { TemperatureCandidate } from './invert-delay';
import { SECOND_SOUND_MEASURED_MIN_K, secondSoundSdUnchecked, secondSoundUnchecked } from './second-sound';
import { SECOND_SOUND_EXTREMA } from './second-sound-extrema';

/*
 * Warnings about a delay → temperature reading, in the planner's shape (code, severity, message,
 * the number behind it and the limit it crossed), so the page and the command line list them the
 * same way. The messages say what to check; they never silently change the answer.
 */

export type ReadingWarningCode =
  | 'evidence-disagrees'
  | 'interval-reaches-extremum'
  | 'series-ambiguous'
  | 'series-guess'
  | 'undecided'
  | 'near-lambda'
  | 'model-region'
  /** A resonator's line density: its amplitude form and width form disagree. */
  | 'forms-disagree';

export interface ReadingWarning {
  code: ReadingWarningCode;
  severity: 'info' | 'caution' | 'stop';
  message: string;
  /** The number behind the warning and the limit it crossed (evidence distance in sd, K, or a count). */
  value: number;
  limit: number;
}

/** Beyond this many sd from its evidence a chosen candidate draws a caution. */
export const EVIDENCE_LIMIT_SD = 3;

/** A temperature in a message: kelvin to 0.1 mK. */
export function kelvinText(T_K: number): string {
  return `${T_K.toFixed(4)} K`;
}

/** A temperature difference in a message: mK with three significant digits. */
function differenceText(dT_K: number): string {
  const mK = Math.abs(dT_K) * 1e3;
  return mK >= 100 ? `${mK.toFixed(0)} mK` : mK >= 10 ? `${mK.toFixed(1)} mK` : `${mK.toPrecision(2)} mK`;
}

/**
 * The caution for a chosen candidate `evidenceSd` sd from its evidence (a vapour-pressure
 * temperature, an expected temperature or a range), naming what commonly causes it.
 */
export function evidenceWarning(candidate: TemperatureCandidate, evidenceSd: number, evidence: { T_K: number; what: string }, fmt: (T_K: number) => string = kelvinText): ReadingWarning {
  const gap = candidate.temperature_K - evidence.T_K;
  return {
    code: 'evidence-disagrees',
    severity: 'caution',
    message:
      `Delay and evidence disagree: the chosen ${fmt(candidate.temperature_K)} lies ${differenceText(gap)} (${evidenceSd.toFixed(1)} sd) ` +
      `${gap < 0 ? 'below' : 'above'} ${fmt(evidence.T_K)} from ${evidence.what}. Check the distance (cold length after contraction, which ` +
      'sensor), the offset t0 (heater and sensor lags, trigger delay), the gauge (zero, calibration, units) and the head pressure ' +
      '(a gauge line above the bath, or the liquid depth over the sensor) before trusting either.',
    value: evidenceSd,
    limit: EVIDENCE_LIMIT_SD,
  };
}

/**
 * Warnings that belong to the chosen candidate itself: its 95 % interval reaches an extremum of u2
 * (joining two branches), reaches Tλ, or lies in the Landau model region. `speedSigmas` is how many
 * total sd the speed lies from the extremum's speed (the number behind the first warning).
 */
export function candidateWarnings(c: TemperatureCandidate, speedSigmas: number, fmt: (T_K: number) => string = kelvinText): ReadingWarning[] {
  const out: ReadingWarning[] = [];
  const turn = c.reaches95.find((r): r is 'minimum' | 'maximum' => r === 'minimum' || r === 'maximum');
  if (turn) {
    const ext = SECOND_SOUND_EXTREMA[turn];
    out.push({
      code: 'interval-reaches-extremum',
      severity: 'info',
      message:
        `The 95 % interval ${fmt(c.interval95_K[0])} – ${fmt(c.interval95_K[1])} runs across the ${turn} of u₂ at ${fmt(ext.temperature_K)}: ` +
        'the speed cannot tell the two sides of it apart, so the interval spans both branches and the sd is only a summary.',
      value: speedSigmas,
      limit: 1.959963984540054,
    });
  }
  if (c.reaches95.includes('Tλ')) {
    out.push({
      code: 'near-lambda',
      severity: 'caution',
      message: `The 95 % interval reaches Tλ = ${fmt(T_LAMBDA_K)}: the end of the u₂ curve is uncertain by about 0.2 mK, so no reading this close is better than that.`,
      value: T_LAMBDA_K - c.temperature_K,
      limit: 0,
    });
  }
  if (c.temperature_K < SECOND_SOUND_MEASURED_MIN_K) {
    out.push({
      code: 'model-region',
      severity: 'caution',
      message: `Below ${fmt(SECOND_SOUND_MEASURED_MIN_K)} u₂ comes from the Landau model (3 % sd), an extrapolation: second sound stops being a hydrodynamic wave near 0.5 K.`,
      value: c.temperature_K,
      limit: SECOND_SOUND_MEASURED_MIN_K,
    });
  }
  return out;
}

/**
 * How many total sd (measurement and curve at the extremum) the speed u (m/s) lies from the speed
 * of the extremum the candidate's 95 % interval reaches; 0 when it reaches none.
 */
export function speedSigmasFromTurn(c: TemperatureCandidate, speed_m_s: number, speedSd_m_s: number): number {
  const turn = c.reaches95.find((r): r is 'minimum' | 'maximum' => r === 'minimum' || r === 'maximum');
  if (!turn) return 0;
  const ext = SECOND_SOUND_EXTREMA[turn];
  const at = secondSoundUnchecked(ext.temperature_K);
  const sigma = Math.hypot(speedSd_m_s, secondSoundSdUnchecked(ext.temperature_K, at.value, at.slope));
  return sigma > 0 ? Math.abs(speed_m_s - ext.speed_m_s) / sigma : 0;
}
