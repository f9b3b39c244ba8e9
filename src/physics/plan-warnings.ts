import { T_LAMBDA_K } from './constants';
import type { PlanInput, PlanSensor } from './plan-input';
import type { EchoArrival, PlanePlanResult, PlanWarning, WarningCode } from './plan-result';
import type { HeliumProperties } from './properties';
import type { PulseProfile } from './pulse-shape';
import { SECOND_SOUND_MEASURED_MIN_K } from './second-sound';

/*
 * The planner's warnings and the thresholds behind them. Severity says what the number means:
 * info — worth knowing; caution — a figure on the page may be off; stop — the small-signal model
 * every other number uses has failed here, or the layout cannot work as drawn.
 */

/** Peak δT above which thermometry loses its linear, gentle pulses (common practice, no source). */
export const LARGE_AMPLITUDE_K = 1e-3;
/** Counterflow velocity above which quantised vortices may form in long pulses, m/s (common practice, no source). */
export const COUNTERFLOW_NOTE_M_S = 0.01;
/**
 * Counterflow w = q/(ρs s T) as a fraction of u2 from which the small-signal model's speed and
 * amplitude are off by about w/u2 — more than a delay reading can stand (caution); and from which
 * the counterflow is comparable to the wave itself, so the linear model has failed (stop). The
 * expansion parameter w/u2 is standard two-fluid hydrodynamics; the two cut points are common
 * practice, no source.
 */
export const COUNTERFLOW_CAUTION_OF_U2 = 0.1;
export const COUNTERFLOW_STOP_OF_U2 = 0.5;
/**
 * Cautions start at this fraction of the Gorter–Mellink strong-heating flux q*: q* is an estimate
 * good to about a factor 2 (gorter-mellink.ts), so from half of q* the heater may already reach Tλ.
 */
export const STRONG_FLUX_CAUTION_OF_LIMIT = 0.5;
/** Tλ falls with pressure by about this much, K/Pa (0.01 K/bar; from memory). */
export const LAMBDA_SHIFT_K_PER_PA = 0.01 / 1e5;
/** Edge samples wanted on the steepest part of the pulse (common practice, no source). */
export const SAMPLES_PER_EDGE = 4;

export function fmt(x: number, digits = 3): string {
  return Number(x.toPrecision(digits)).toString();
}

export function warn(list: PlanWarning[], code: WarningCode, severity: PlanWarning['severity'], message: string, value: number, limit: number, sensorId: string | null = null): void {
  list.push({ code, severity, message, value, limit, sensorId });
}

/** Bath heating, the liquid head's Tλ, He I, the model region and the edge of Tλ. */
export function bathWarnings(list: PlanWarning[], plan: PlanInput, props: HeliumProperties, f: { averagePower: number; profile: PulseProfile; headPressure: number }): void {
  const T = plan.temperature_K;
  const h = plan.heater;
  warn(
    list,
    'bath-heating',
    'info',
    `The heater puts ${fmt(f.averagePower * 1e3)} mW on average into the bath (${fmt(h.power_W)} W peak × ${fmt(f.profile.area_s * 1e6)} µs × ${fmt(h.repetitionRate_Hz)} Hz); check it against the cryostat's cooling power.`,
    f.averagePower,
    0,
  );
  const lambdaAtDepth = T_LAMBDA_K - LAMBDA_SHIFT_K_PER_PA * f.headPressure;
  if (T < T_LAMBDA_K && T >= lambdaAtDepth) {
    warn(list, 'lambda-head', 'caution', `The liquid head of ${fmt(plan.liquidDepth_m)} m lowers Tλ at the setup to about ${fmt(lambdaAtDepth, 6)} K: at ${fmt(T, 6)} K part of the liquid there may be He I.`, T, lambdaAtDepth);
  }
  if (props.secondSound_m_s === null) {
    warn(list, 'no-second-sound', 'stop', `At ${fmt(T, 5)} K the bath is He I (at or above Tλ = 2.1768 K): there is no second sound; heat diffuses. Only first sound arrives.`, T, T_LAMBDA_K);
  } else if (T < SECOND_SOUND_MEASURED_MIN_K) {
    warn(list, 'model-region', 'info', 'Below 0.5517 K second sound comes from the Landau phonon–roton model (uncertain by about 3 %), and below about 0.5 K it is no longer a hydrodynamic wave.', T, SECOND_SOUND_MEASURED_MIN_K);
  } else if (T_LAMBDA_K - T < 1e-3) {
    warn(list, 'near-lambda', 'info', 'Within 1 mK of Tλ second sound changes very fast with temperature and its tabulated value is uncertain.', T, T_LAMBDA_K - 1e-3);
  }
}

/**
 * Strong heating (Gorter–Mellink estimate of the flux that takes the face to Tλ within the pulse)
 * and the counterflow at the heater against u2.
 */
export function heaterWarnings(list: PlanWarning[], plan: PlanInput, f: { flux: number; duration_s: number; strongLimit: number; counterflow: number; u2: number }): void {
  const T = plan.temperature_K;
  const q = f.flux;
  const limit = f.strongLimit;
  if (q >= limit * STRONG_FLUX_CAUTION_OF_LIMIT) {
    const stop = q >= limit;
    warn(
      list,
      'strong-flux',
      stop ? 'stop' : 'caution',
      stop
        ? `${fmt(q / 1e4)} W/cm² for ${fmt(f.duration_s * 1e6)} µs reaches the strong-heating limit of about ${fmt(limit / 1e4)} W/cm² at ${fmt(T, 4)} K: by the Gorter–Mellink estimate the liquid at the heater reaches Tλ within the pulse (boiling, He I); the second sound stops growing with power and the small-signal numbers on this page do not hold. Lower the flux or shorten the pulse.`
        : `${fmt(q / 1e4)} W/cm² for ${fmt(f.duration_s * 1e6)} µs is within a factor 2 of the strong-heating limit, about ${fmt(limit / 1e4)} W/cm² at ${fmt(T, 4)} K (Gorter–Mellink estimate, itself good to about a factor 2): vortices may attenuate the pulse and the heater may reach Tλ.`,
      q,
      stop ? limit : limit * STRONG_FLUX_CAUTION_OF_LIMIT,
    );
  }
  const w = f.counterflow;
  const ratio = w / f.u2;
  if (ratio >= COUNTERFLOW_STOP_OF_U2) {
    warn(
      list,
      'counterflow',
      'stop',
      `The counterflow velocity at the heater, q/(ρs·s·T), is ${fmt(w * 100)} cm/s — ${fmt(ratio * 100, 2)} % of u₂ (${fmt(f.u2 * 100)} cm/s): the heat current is not small next to the wave, so the linear two-fluid model behind every number here has failed. Lower the flux.`,
      w,
      COUNTERFLOW_STOP_OF_U2 * f.u2,
    );
  } else if (ratio >= COUNTERFLOW_CAUTION_OF_U2) {
    warn(
      list,
      'counterflow',
      'caution',
      `The counterflow velocity at the heater, q/(ρs·s·T), is ${fmt(w * 100)} cm/s, ${fmt(ratio * 100, 2)} % of u₂: linear theory's speed and amplitude are off by about that fraction, and quantised vortices form and attenuate the pulse.`,
      w,
      COUNTERFLOW_CAUTION_OF_U2 * f.u2,
    );
  } else if (w > COUNTERFLOW_NOTE_M_S) {
    warn(list, 'counterflow', 'info', `The counterflow velocity at the heater, q/(ρs·s·T), is ${fmt(w * 100)} cm/s (${fmt(ratio * 100, 2)} % of u₂): in long pulses quantised vortices can form and attenuate second sound.`, w, COUNTERFLOW_NOTE_M_S);
  }
}

/** Sensors the wave cannot reach, and planes cutting the heater. */
export function geometryWarnings(list: PlanWarning[], plan: PlanInput, f: { behind: Map<string, PlanePlanResult>; throughHeater: PlanePlanResult[] }): void {
  for (const sensor of plan.sensors) {
    const plane = f.behind.get(sensor.id);
    if (!plane) continue;
    const z = sensor.position_m['xyz'.indexOf(plane.axis)] as number;
    warn(
      list,
      'behind-plane',
      'stop',
      `${sensor.label} lies behind the reflecting plane "${plane.label}" (${plane.axis} = ${fmt(plane.position_m * 1e3)} mm cold): the heater's wave reaches the plane first and is reflected there, so this sensor gets no direct pulse and no echoes. Move the sensor or the plane.`,
      z,
      plane.position_m,
      sensor.id,
    );
  }
  for (const plane of f.throughHeater) {
    warn(list, 'plane-through-heater', 'stop', `The reflecting plane "${plane.label}" (${plane.axis} = ${fmt(plane.position_m * 1e3)} mm) cuts through the heater: a wall cannot stand across the heater's face. Move the plane or resize the heater.`, plane.position_m, 0);
  }
}

export interface SensorFigures {
  arrival: number;
  amplitude: number;
  echoes: EchoArrival[];
  snrAveraged: number;
  /** Null when there is no signal to time. */
  pulsesForTarget: number | null;
  riseAtSensor: number;
  spreadT: { sd_K: number; insensitive: boolean } | null;
  directLength: number;
  spread: number;
}

/** Largest round rate (two significant figures, rounded down) strictly below `rate`, at or below `ceiling`. */
function lowerRate(ceiling: number, rate: number): number {
  const target = Math.min(ceiling, rate * (1 - 1e-9));
  const p = 10 ** (Math.floor(Math.log10(target)) - 1);
  let r = Math.floor(target / p) * p;
  if (!(r < rate)) r = target;
  return Number(r.toPrecision(2));
}

export function sensorWarnings(list: PlanWarning[], plan: PlanInput, sensor: PlanSensor, c: { profile: PulseProfile; props: HeliumProperties; faceDeltaT: number | null; shockDistance: number | null }, f: SensorFigures): void {
  const id = sensor.id;
  const name = sensor.label;
  const h = plan.heater;
  if (f.amplitude > LARGE_AMPLITUDE_K) {
    warn(list, 'large-amplitude', 'caution', `${name}: the pulse reaches ${fmt(f.amplitude * 1e3)} mK, above the 1 mK kept for thermometry; the wave is no longer small and its speed depends on its height.`, f.amplitude, LARGE_AMPLITUDE_K, id);
  }
  if (c.shockDistance !== null && c.faceDeltaT !== null && c.shockDistance < f.directLength) {
    const alpha = c.props.nonlinearity_per_K ?? 0;
    const bias = (Math.abs(alpha) * c.faceDeltaT * (f.arrival - sensor.lag_s)) / 2;
    warn(
      list,
      'shock',
      'caution',
      `${name}: the pulse steepens into a shock after about ${fmt(c.shockDistance * 1e3)} mm, before the ${fmt(f.directLength * 1e3)} mm path ends (the ${alpha > 0 ? 'leading' : 'trailing'} edge steepens: α₂ ${alpha > 0 ? '> 0 below' : '< 0 above'} its sign change near 1.88 K); the arrival is biased by about ${fmt(bias * 1e6)} µs.`,
      c.shockDistance,
      f.directLength,
      id,
    );
  }
  const heard = (e: EchoArrival) => e.amplitude_K * sensor.responsivity_V_K > sensor.noise_V / Math.sqrt(h.averages);
  const pulseEnd = c.profile.duration_s + f.spread + 3 * sensor.lag_s;
  const firstEcho = f.echoes.find(heard);
  if (firstEcho && firstEcho.arrival_s - f.arrival < pulseEnd) {
    warn(list, 'echo-overlap', 'caution', `${name}: an echo (${firstEcho.path.join(' → ') || 'reflection'}) arrives ${fmt((firstEcho.arrival_s - f.arrival) * 1e6)} µs after the direct pulse, before it has passed (${fmt(pulseEnd * 1e6)} µs).`, firstEcho.arrival_s - f.arrival, pulseEnd, id);
  }
  const audible = f.echoes.filter(heard);
  const lastHeard = Math.max(f.arrival, ...audible.map((e) => e.arrival_s)) + pulseEnd + 5 * sensor.lag_s;
  const period = 1 / h.repetitionRate_Hz;
  if (period < lastHeard) {
    const suggested = lowerRate(1 / lastHeard, h.repetitionRate_Hz);
    warn(list, 'range-ambiguity', 'caution', `${name}: pulses come every ${fmt(period * 1e3)} ms but signals from one pulse last until ${fmt(lastHeard * 1e3)} ms; the next pulse's arrival would mix with them (lower the repetition rate from ${fmt(h.repetitionRate_Hz)} Hz to ${fmt(suggested)} Hz or less).`, period, lastHeard, id);
  }
  const recordEnd = plan.digitiser.recordLength_s - plan.digitiser.preTrigger_s;
  const needed = f.arrival + pulseEnd;
  if (recordEnd < needed) {
    warn(list, 'record-too-short', 'caution', `${name}: the record ends ${fmt(recordEnd * 1e3)} ms after the trigger, before the pulse has passed (${fmt(needed * 1e3)} ms).`, recordEnd, needed, id);
  }
  const interval = 1 / plan.digitiser.sampleRate_Hz;
  const wanted = f.riseAtSensor / SAMPLES_PER_EDGE;
  if (interval > wanted) {
    warn(list, 'coarse-sampling', 'caution', `${name}: samples every ${fmt(interval * 1e6)} µs put fewer than ${SAMPLES_PER_EDGE} points on the ${fmt(f.riseAtSensor * 1e6)} µs edge; the arrival cannot be timed well (sample at ${fmt(SAMPLES_PER_EDGE / f.riseAtSensor / 1e6)} MS/s or faster).`, interval, wanted, id);
  }
  if (f.snrAveraged < plan.targets.snr) {
    const remedy = f.pulsesForTarget === null ? 'the predicted signal is zero: raise the heater power or move the sensor' : `average ${f.pulsesForTarget} pulses or raise the signal`;
    warn(list, 'low-snr', 'caution', `${name}: SNR ${fmt(f.snrAveraged)} with ${h.averages} pulses averaged is below the target ${fmt(plan.targets.snr)}; ${remedy}.`, f.snrAveraged, plan.targets.snr, id);
  }
  if (f.spreadT?.insensitive) {
    warn(list, 'insensitive', 'caution', `${name}: at ${fmt(plan.temperature_K, 4)} K second sound hardly changes with temperature (an extremum of u2 is near); the delay pins the temperature only to about ${fmt(f.spreadT.sd_K * 1e3)} mK.`, f.spreadT.sd_K, plan.targets.temperatureSd_K, id);
  }
}
