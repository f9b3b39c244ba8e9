import { PATH_LENGTH_RANGE_M, spacerMaterial } from './contraction';
import { STANDARD_GRAVITY_M_S2, T_LAMBDA_K } from './constants';
import { InvalidInputError, requireInRange } from './errors';
import { imageSources, MAX_ECHO_ORDER, type ReflectingPlane, type Vec3 } from './image-sources';
import { type HeliumProperties, heliumProperties, PROPERTIES_RANGE_K } from './properties';
import { type PulseProfile, type PulseShape, pulseProfile } from './pulse-shape';
import { type HeaterGeometry, type Medium, type ReceivedPulse, receivedPulse, type SampledSignal } from './received-pulse';
import { SECOND_SOUND_MEASURED_MIN_K } from './second-sound';
import { secondSoundRelativeSd, shortestDistanceForResolution, temperatureSpread } from './temperature-resolution';

/*
 * The measurement planner: for a proposed heater, sensors, reflectors and digitiser at a bath
 * temperature, when each wave arrives at each sensor, how big the signal is, what overlaps or
 * distorts, and how finely the delay pins the temperature. Physics: PHYSICS notes §2–5; each
 * threshold below names its basis.
 */

export interface PlanHeater {
  geometry: HeaterGeometry;
  /** Heater face area, m² (disk: πa² is used instead; point: nominal, for flux figures). */
  area_m2: number;
  /** Disk radius, m (disk only). */
  radius_m: number;
  /** Peak power during the pulse, W. */
  power_W: number;
  shape: PulseShape;
  width_s: number;
  riseTime_s: number;
  repetitionRate_Hz: number;
  /** Pulses averaged per reading. */
  averages: number;
}

export interface PlanSensor {
  id: string;
  label: string;
  /** Position relative to the heater centre (heater face in the z = 0 plane, facing +z), m. */
  position_m: Vec3;
  /** One-sigma uncertainty of the heater–sensor distance as measured, m. */
  distanceSd_m: number;
  /** Sensing area facing the heater, m² (0: a point). */
  area_m2: number;
  responsivity_V_K: number;
  /** Noise, V rms, single shot. */
  noise_V: number;
  /** First-order time constant of the sensor, s. */
  lag_s: number;
}

export interface PlanInput {
  temperature_K: number;
  /** Liquid above the setup, m. */
  liquidDepth_m: number;
  heater: PlanHeater;
  sensors: readonly PlanSensor[];
  spacer: { materialId: string; measuredWarm: boolean };
  reflectors: readonly ReflectingPlane[];
  echoOrder: number;
  digitiser: { sampleRate_Hz: number; recordLength_s: number; preTrigger_s: number };
  targets: { snr: number; temperatureSd_K: number };
}

export type WarningCode =
  | 'no-second-sound'
  | 'model-region'
  | 'near-lambda'
  | 'lambda-head'
  | 'large-amplitude'
  | 'shock'
  | 'strong-flux'
  | 'counterflow'
  | 'echo-overlap'
  | 'range-ambiguity'
  | 'record-too-short'
  | 'coarse-sampling'
  | 'bath-heating'
  | 'low-snr'
  | 'insensitive';

export interface PlanWarning {
  code: WarningCode;
  severity: 'info' | 'caution' | 'stop';
  message: string;
  /** The number behind the warning and the limit it crossed, in SI units. */
  value: number;
  limit: number;
  sensorId: string | null;
}

export interface EchoArrival {
  order: number;
  arrival_s: number;
  amplitude_K: number;
  path: readonly string[];
}

export interface SensorPlanResult {
  id: string;
  label: string;
  /** Cold path length (shortest, heater to sensor), m. */
  pathLength_m: number;
  /** One-sigma uncertainty of that length (measurement and contraction), m. */
  pathLengthSd_m: number;
  firstSoundArrival_s: number;
  /** Second-sound arrival including the sensor lag, s after the pulse onset; null in He I. */
  secondSoundArrival_s: number | null;
  /** Peak |δT| of the direct pulse at the sensor, K. */
  amplitude_K: number | null;
  signal_V: number | null;
  snrSingle: number | null;
  snrAveraged: number | null;
  pulsesForTargetSnr: number | null;
  echoes: EchoArrival[];
  /** Predicted δT(t) at the sensor, as non-overlapping segments in time order, K. */
  waveform: SampledSignal[];
  /** One-sigma arrival-time uncertainty of one averaged reading, s. */
  timingSd_s: number | null;
  /** One-sigma temperature from timing and distance, K. */
  temperatureSd_K: number | null;
  /**
   * One-sigma of a temperature change between readings, from timing alone, K: the distance error
   * is the same for every reading, so changes are resolved better than the absolute value.
   */
  temperatureChangeSd_K: number | null;
  /** The same with the u2 table's own uncertainty added, K. */
  temperatureSdWithModel_K: number | null;
  insensitive: boolean;
  /** Shortest distance that reaches the target temperature sd with this sensor's timing, m. */
  shortestDistanceForTarget_m: number | null;
}

export interface PlanResult {
  temperature_K: number;
  properties: HeliumProperties;
  heater: {
    flux_W_m2: number;
    power_W: number;
    energyPerPulse_J: number;
    averagePower_W: number;
    /** δT of a plane wave at the heater face, q/(ρ c_p u2), K; null in He I. */
    faceDeltaT_K: number | null;
    counterflowVelocity_m_s: number | null;
    shockDistance_m: number | null;
    effectiveRise_s: number;
    duration_s: number;
  };
  /** Relative heater flux f(t) for the timeline. */
  heaterPulse: SampledSignal;
  sensors: SensorPlanResult[];
  warnings: PlanWarning[];
  record: { start_s: number; end_s: number; sampleInterval_s: number };
  /** Hydrostatic pressure of the liquid over the setup, Pa. */
  headPressure_Pa: number;
}

/** Limits of the planner's inputs (SI). */
export const PLAN_LIMITS = {
  temperature_K: PROPERTIES_RANGE_K,
  liquidDepth_m: [0, 10],
  heaterArea_m2: [1e-12, 1],
  heaterRadius_m: [1e-6, 0.5],
  power_W: [1e-9, 1e4],
  /** Heat flux on the heater face: up to 100 kW/cm², far past any film; a guard against typing slips. */
  flux_W_m2: [1e-6, 1e9],
  reflectors: [0, 16],
  repetitionRate_Hz: [1e-4, 1e5],
  averages: [1, 1e7],
  sensorCount: [1, 64],
  distanceSd_m: [0, 0.01],
  sensorArea_m2: [0, 0.01],
  responsivity_V_K: [1e-9, 1e6],
  noise_V: [1e-15, 10],
  lag_s: [0, 1],
  sampleRate_Hz: [1, 1e11],
  recordLength_s: [1e-9, 1e3],
  preTrigger_s: [0, 1e3],
  snr: [1, 1e6],
  temperatureSd_K: [1e-9, 1],
} as const;

/** Peak δT above which thermometry loses its linear, gentle pulses (common practice, no source). */
export const LARGE_AMPLITUDE_K = 1e-3;
/**
 * Flux–duration product treated as strong: 1 W/cm² for a 1 ms pulse, scaling as τ^(−1/2)
 * (10 W/cm² at 10 µs). Common practice for the onset of vortex generation and boiling in pulsed
 * heating (PHYSICS notes §5: 1–10 W/cm² for millisecond pulses); no single source.
 */
export const STRONG_FLUX_W_M2_AT_1MS = 1e4;
/** Counterflow velocity above which quantised vortices may form in long pulses, m/s (common practice, no source). */
export const COUNTERFLOW_NOTE_M_S = 0.01;
/** Tλ falls with pressure by about this much, K/Pa (0.01 K/bar; from memory). */
export const LAMBDA_SHIFT_K_PER_PA = 0.01 / 1e5;
/** Edge samples wanted on the steepest part of the pulse (common practice, no source). */
export const SAMPLES_PER_EDGE = 4;
/** Time steps per effective rise time in the predicted waveforms. */
const STEPS_PER_RISE = 10;
/** Most samples in one predicted arrival; the step grows instead. */
const MAX_SAMPLES_PER_ARRIVAL = 1500;

function vec(v: Vec3, scale: number): Vec3 {
  return [v[0] * scale, v[1] * scale, v[2] * scale];
}

function checkInputs(plan: PlanInput): void {
  const L = PLAN_LIMITS;
  requireInRange('bath temperature', plan.temperature_K, L.temperature_K[0], L.temperature_K[1], 'K');
  requireInRange('liquid depth', plan.liquidDepth_m, L.liquidDepth_m[0], L.liquidDepth_m[1], 'm');
  const h = plan.heater;
  if (h.geometry === 'disk') requireInRange('heater radius', h.radius_m, L.heaterRadius_m[0], L.heaterRadius_m[1], 'm');
  else requireInRange('heater area', h.area_m2, L.heaterArea_m2[0], L.heaterArea_m2[1], 'm²');
  requireInRange('heater power', h.power_W, L.power_W[0], L.power_W[1], 'W');
  requireInRange('repetition rate', h.repetitionRate_Hz, L.repetitionRate_Hz[0], L.repetitionRate_Hz[1], 'Hz');
  requireInRange('pulses averaged', h.averages, L.averages[0], L.averages[1], '');
  if (!Number.isInteger(h.averages)) throw new InvalidInputError('pulses averaged', 'must be a whole number');
  const area = h.geometry === 'disk' ? Math.PI * h.radius_m * h.radius_m : h.area_m2;
  requireInRange('heat flux', h.power_W / area, L.flux_W_m2[0], L.flux_W_m2[1], 'W/m²');
  requireInRange('number of reflecting planes', plan.reflectors.length, L.reflectors[0], L.reflectors[1], '');
  requireInRange('number of sensors', plan.sensors.length, L.sensorCount[0], L.sensorCount[1], '');
  plan.sensors.forEach((s, i) => {
    const name = `sensor ${i + 1} (${s.label})`;
    s.position_m.forEach((c, k) => {
      requireInRange(`${name} ${'xyz'[k]}`, c, -PATH_LENGTH_RANGE_M[1], PATH_LENGTH_RANGE_M[1], 'm');
    });
    if (!(s.position_m[2] > 0)) throw new InvalidInputError(`${name} z`, 'the sensor must sit in front of the heater (z above 0)');
    requireInRange(`${name} distance`, Math.hypot(...s.position_m), PATH_LENGTH_RANGE_M[0], PATH_LENGTH_RANGE_M[1], 'm');
    requireInRange(`${name} distance uncertainty`, s.distanceSd_m, L.distanceSd_m[0], L.distanceSd_m[1], 'm');
    requireInRange(`${name} area`, s.area_m2, L.sensorArea_m2[0], L.sensorArea_m2[1], 'm²');
    requireInRange(`${name} responsivity`, s.responsivity_V_K, L.responsivity_V_K[0], L.responsivity_V_K[1], 'V/K');
    requireInRange(`${name} noise`, s.noise_V, L.noise_V[0], L.noise_V[1], 'V');
    requireInRange(`${name} lag`, s.lag_s, L.lag_s[0], L.lag_s[1], 's');
  });
  const d = plan.digitiser;
  requireInRange('sample rate', d.sampleRate_Hz, L.sampleRate_Hz[0], L.sampleRate_Hz[1], 'Hz');
  requireInRange('record length', d.recordLength_s, L.recordLength_s[0], L.recordLength_s[1], 's');
  requireInRange('pre-trigger', d.preTrigger_s, L.preTrigger_s[0], d.recordLength_s, 's', 'at most the record length');
  requireInRange('echo order', plan.echoOrder, 0, MAX_ECHO_ORDER, '');
  if (!Number.isInteger(plan.echoOrder)) throw new InvalidInputError('echo order', `must be a whole number 0–${MAX_ECHO_ORDER}`);
  requireInRange('target SNR', plan.targets.snr, L.snr[0], L.snr[1], '');
  requireInRange('target temperature sd', plan.targets.temperatureSd_K, L.temperatureSd_K[0], L.temperatureSd_K[1], 'K');
}

function warn(
  list: PlanWarning[],
  code: WarningCode,
  severity: PlanWarning['severity'],
  message: string,
  value: number,
  limit: number,
  sensorId: string | null = null,
): void {
  list.push({ code, severity, message, value, limit, sensorId });
}

function peakAbs(values: Float64Array): number {
  let m = 0;
  for (const v of values) m = Math.max(m, Math.abs(v));
  return m;
}

/** Sums signals on a common step into non-overlapping segments (signals on one step grid). */
function mergeSegments(signals: SampledSignal[]): SampledSignal[] {
  if (signals.length === 0) return [];
  const step = (signals[0] as SampledSignal).step_s;
  const spans = signals
    .map((s) => ({ s, i0: Math.round(s.start_s / step), i1: Math.round(s.start_s / step) + s.values.length - 1 }))
    .sort((a, b) => a.i0 - b.i0);
  const groups: (typeof spans)[] = [];
  for (const span of spans) {
    const last = groups[groups.length - 1];
    const lastEnd = last ? Math.max(...last.map((x) => x.i1)) : Number.NEGATIVE_INFINITY;
    if (last && span.i0 <= lastEnd + 1) last.push(span);
    else groups.push([span]);
  }
  return groups.map((group) => {
    const i0 = Math.min(...group.map((g) => g.i0));
    const i1 = Math.max(...group.map((g) => g.i1));
    const values = new Float64Array(i1 - i0 + 1);
    for (const g of group) {
      g.s.values.forEach((v, k) => {
        values[g.i0 - i0 + k] = (values[g.i0 - i0 + k] as number) + v;
      });
    }
    return { start_s: i0 * step, step_s: step, values };
  });
}

function fmt(x: number, digits = 3): string {
  return Number(x.toPrecision(digits)).toString();
}

interface HeaterFigures {
  profile: PulseProfile;
  /** Peak heat flux on the heater face, W/m². */
  flux: number;
}

function heaterFigures(h: PlanHeater): HeaterFigures {
  const profile = pulseProfile(h.shape, h.width_s, h.riseTime_s);
  const area = h.geometry === 'disk' ? Math.PI * h.radius_m * h.radius_m : h.area_m2;
  return { profile, flux: h.power_W / area };
}

/**
 * Computes the plan: arrivals, predicted pulses, echoes, signal and SNR, limits and temperature
 * resolution for every sensor. Inputs in SI (see {@link PlanInput}); throws OutOfRangeError,
 * NonFiniteInputError or InvalidInputError naming the field.
 */
export function computePlan(plan: PlanInput): PlanResult {
  checkInputs(plan);
  const T = plan.temperature_K;
  const props = heliumProperties(T);
  const { profile, flux } = heaterFigures(plan.heater);
  const h = plan.heater;
  const warnings: PlanWarning[] = [];
  const headPressure = props.density_kg_m3 * STANDARD_GRAVITY_M_S2 * plan.liquidDepth_m;
  const averagePower = h.power_W * profile.area_s * h.repetitionRate_Hz;
  const material = spacerMaterial(plan.spacer.materialId);
  const sampleInterval = 1 / plan.digitiser.sampleRate_Hz;
  const record = {
    start_s: -plan.digitiser.preTrigger_s,
    end_s: plan.digitiser.recordLength_s - plan.digitiser.preTrigger_s,
    sampleInterval_s: sampleInterval,
  };

  warn(
    warnings,
    'bath-heating',
    'info',
    `The heater puts ${fmt(averagePower * 1e3)} mW on average into the bath (${fmt(h.power_W)} W peak × ${fmt(profile.area_s * 1e6)} µs × ${fmt(h.repetitionRate_Hz)} Hz); check it against the cryostat's cooling power.`,
    averagePower,
    0,
  );
  const lambdaAtDepth = T_LAMBDA_K - LAMBDA_SHIFT_K_PER_PA * headPressure;
  if (T < T_LAMBDA_K && T >= lambdaAtDepth) {
    warn(
      warnings,
      'lambda-head',
      'caution',
      `The liquid head of ${fmt(plan.liquidDepth_m)} m lowers Tλ at the setup to about ${fmt(lambdaAtDepth, 6)} K: at ${fmt(T, 6)} K part of the liquid there may be He I.`,
      T,
      lambdaAtDepth,
    );
  }

  const heII = props.secondSound_m_s !== null;
  if (!heII) {
    warn(
      warnings,
      'no-second-sound',
      'stop',
      `At ${fmt(T, 5)} K the bath is He I (at or above Tλ = 2.1768 K): there is no second sound; heat diffuses. Only first sound arrives.`,
      T,
      T_LAMBDA_K,
    );
  } else if (T < SECOND_SOUND_MEASURED_MIN_K) {
    warn(
      warnings,
      'model-region',
      'info',
      `Below 0.5517 K second sound comes from the Landau phonon–roton model (uncertain by about 3 %), and below about 0.5 K it is no longer a hydrodynamic wave.`,
      T,
      SECOND_SOUND_MEASURED_MIN_K,
    );
  } else if (T_LAMBDA_K - T < 1e-3) {
    warn(
      warnings,
      'near-lambda',
      'info',
      `Within 1 mK of Tλ second sound changes very fast with temperature and its tabulated value is uncertain.`,
      T,
      T_LAMBDA_K - 1e-3,
    );
  }

  let faceDeltaT: number | null = null;
  let counterflow: number | null = null;
  let shockDistance: number | null = null;
  let medium: Medium | null = null;
  if (heII && props.secondSound_m_s !== null && props.nonlinearity_per_K !== null) {
    const u2 = props.secondSound_m_s;
    medium = { density_kg_m3: props.density_kg_m3, specificHeat_J_kgK: props.specificHeat_J_kgK, secondSound_m_s: u2 };
    faceDeltaT = flux / (props.density_kg_m3 * props.specificHeat_J_kgK * u2);
    const rhoS = props.superfluidFraction * props.density_kg_m3;
    counterflow = flux / (rhoS * props.entropy_J_kgK * T);
    const alpha = Math.abs(props.nonlinearity_per_K);
    shockDistance = alpha > 0 ? (u2 * profile.effectiveRise_s) / (alpha * faceDeltaT) : Number.POSITIVE_INFINITY;
    const strongLimit = STRONG_FLUX_W_M2_AT_1MS * Math.sqrt(1e-3 / profile.duration_s);
    if (flux >= strongLimit) {
      warn(
        warnings,
        'strong-flux',
        'caution',
        `${fmt(flux / 1e4)} W/cm² for ${fmt(profile.duration_s * 1e6)} µs is strong heating (about ${fmt(strongLimit / 1e4)} W/cm² and up for this length): quantised vortices attenuate the pulse and the heater may boil; more power then gives no more second sound.`,
        flux,
        strongLimit,
      );
    }
    if (counterflow > COUNTERFLOW_NOTE_M_S) {
      warn(
        warnings,
        'counterflow',
        'info',
        `The counterflow velocity at the heater, q/(ρs·s·T), is ${fmt(counterflow * 100)} cm/s: in long pulses quantised vortices can form and attenuate second sound.`,
        counterflow,
        COUNTERFLOW_NOTE_M_S,
      );
    }
  }

  const images = imageSources(
    [0, 0, 0],
    h.geometry === 'planar' ? plan.reflectors.filter((p) => p.axis === 'z') : plan.reflectors,
    // One order more than asked: a reflector through the sensor adds its partner to the last echo.
    plan.echoOrder + 1,
  );
  const sensors = plan.sensors.map((sensor) =>
    sensorResult({ plan, sensor, props, medium, profile, flux, images, warnings, faceDeltaT, shockDistance, contraction: material.contraction, contractionSd: material.contractionSd }),
  );

  const heaterStep = Math.max(profile.duration_s / 400, 1e-12);
  const heaterPulse: SampledSignal = {
    start_s: -heaterStep * 10,
    step_s: heaterStep,
    values: Float64Array.from({ length: 421 }, (_, i) => profile.value((i - 10) * heaterStep)),
  };

  return {
    temperature_K: T,
    properties: props,
    heater: {
      flux_W_m2: flux,
      power_W: h.power_W,
      energyPerPulse_J: h.power_W * profile.area_s,
      averagePower_W: averagePower,
      faceDeltaT_K: faceDeltaT,
      counterflowVelocity_m_s: counterflow,
      shockDistance_m: shockDistance,
      effectiveRise_s: profile.effectiveRise_s,
      duration_s: profile.duration_s,
    },
    heaterPulse,
    sensors,
    warnings,
    record,
    headPressure_Pa: headPressure,
  };
}

interface SensorContext {
  plan: PlanInput;
  sensor: PlanSensor;
  props: HeliumProperties;
  medium: Medium | null;
  profile: PulseProfile;
  flux: number;
  images: ReturnType<typeof imageSources>;
  warnings: PlanWarning[];
  faceDeltaT: number | null;
  shockDistance: number | null;
  contraction: number;
  contractionSd: number;
}

function sensorResult(c: SensorContext): SensorPlanResult {
  const { plan, sensor, props, profile } = c;
  const h = plan.heater;
  const warm = plan.spacer.measuredWarm;
  const scale = warm ? 1 - c.contraction : 1;
  const position = vec(sensor.position_m, scale);
  const measuredLength = Math.hypot(...sensor.position_m);
  const contractionSd = warm ? measuredLength * c.contractionSd : 0;
  const pathSd = Math.hypot(sensor.distanceSd_m * scale, contractionSd);
  const sensorRadius = Math.sqrt(sensor.area_m2 / Math.PI);
  const directLength = h.geometry === 'planar' ? position[2] : h.geometry === 'point' ? Math.hypot(...position) : Math.hypot(position[2], Math.max(0, Math.hypot(position[0], position[1]) - h.radius_m));
  const firstSoundArrival = directLength / props.firstSound_m_s;
  const base: SensorPlanResult = {
    id: sensor.id,
    label: sensor.label,
    pathLength_m: directLength,
    pathLengthSd_m: pathSd,
    firstSoundArrival_s: firstSoundArrival,
    secondSoundArrival_s: null,
    amplitude_K: null,
    signal_V: null,
    snrSingle: null,
    snrAveraged: null,
    pulsesForTargetSnr: null,
    echoes: [],
    waveform: [],
    timingSd_s: null,
    temperatureSd_K: null,
    temperatureChangeSd_K: null,
    temperatureSdWithModel_K: null,
    insensitive: false,
    shortestDistanceForTarget_m: null,
  };
  if (!c.medium) return base;
  const medium = c.medium;
  const u2 = medium.secondSound_m_s;

  // Time step: resolve the edges, but keep each arrival's samples bounded.
  const spread = h.geometry === 'disk' ? (Math.hypot(directLength, 2 * h.radius_m + 2 * sensorRadius + Math.hypot(position[0], position[1])) - directLength) / u2 : 0;
  const window = profile.duration_s + spread + 6 * sensor.lag_s;
  const step = Math.max(profile.effectiveRise_s / STEPS_PER_RISE, window / MAX_SAMPLES_PER_ARRIVAL);

  const arrivals: { image: (typeof c.images)[number]; pulse: ReceivedPulse }[] = c.images.map((image) => ({
    image,
    pulse: receivedPulse(
      { geometry: h.geometry, peakFlux_W_m2: c.flux, peakPower_W: h.power_W, radius_m: h.radius_m, profile, centre: image.position, amplitudeFactor: image.factor },
      { position, radius_m: sensorRadius, lag_s: sensor.lag_s },
      medium,
      step,
    ),
  }));
  const direct = arrivals[0] as (typeof arrivals)[number];
  // Group arrivals that coincide (a reflector through the sensor, or symmetric paths) with each other.
  const groups: (typeof arrivals)[] = [];
  for (const a of [...arrivals].sort((x, y) => x.pulse.arrival_s - y.pulse.arrival_s)) {
    const last = groups[groups.length - 1];
    if (last && Math.abs((last[0] as (typeof arrivals)[number]).pulse.arrival_s - a.pulse.arrival_s) < step / 2) last.push(a);
    else groups.push([a]);
  }
  const grouped = groups.map((g) => {
    const merged = mergeSegments(g.map((x) => x.pulse.signal));
    return {
      members: g,
      arrival_s: (g[0] as (typeof arrivals)[number]).pulse.arrival_s + sensor.lag_s,
      amplitude: Math.max(...merged.map((m) => peakAbs(m.values))),
      order: Math.min(...g.map((x) => x.image.order)),
    };
  });
  const directGroup = grouped.find((g) => g.members.includes(direct)) as (typeof grouped)[number];
  const echoes: EchoArrival[] = grouped
    .filter((g) => g !== directGroup && g.order <= plan.echoOrder)
    .map((g) => ({
      order: g.order,
      arrival_s: g.arrival_s,
      amplitude_K: g.amplitude,
      path: (g.members[0] as (typeof arrivals)[number]).image.path,
    }));
  const waveform = mergeSegments(arrivals.map((a) => a.pulse.signal));

  const amplitude = directGroup.amplitude;
  const arrival = directGroup.arrival_s;
  const signal = amplitude * sensor.responsivity_V_K;
  const snrSingle = signal / sensor.noise_V;
  const snrAveraged = snrSingle * Math.sqrt(h.averages);
  const riseAtSensor = Math.hypot(profile.effectiveRise_s, sensor.lag_s, spread);
  const timing = snrAveraged > 0 ? timingFigures(plan, { snrSingle, snrAveraged, riseAtSensor, arrival, pathSd, directLength }) : null;

  sensorWarnings(c, { arrival, amplitude, echoes, snrAveraged, pulsesForTarget: timing?.pulsesForTarget ?? null, riseAtSensor, spreadT: timing?.spreadT ?? null, directLength, spread });

  return {
    ...base,
    secondSoundArrival_s: arrival,
    amplitude_K: amplitude,
    signal_V: signal,
    snrSingle,
    snrAveraged,
    pulsesForTargetSnr: timing?.pulsesForTarget ?? null,
    echoes,
    waveform,
    timingSd_s: timing?.timingSd ?? null,
    temperatureSd_K: timing?.spreadT.sd_K ?? null,
    temperatureChangeSd_K: timing?.changeT.sd_K ?? null,
    temperatureSdWithModel_K: timing?.withModel.sd_K ?? null,
    insensitive: timing?.spreadT.insensitive ?? false,
    shortestDistanceForTarget_m: timing && Number.isFinite(timing.shortest) ? timing.shortest : null,
  };
}

/** Timing and temperature resolution of one sensor with a signal above zero. */
function timingFigures(
  plan: PlanInput,
  f: { snrSingle: number; snrAveraged: number; riseAtSensor: number; arrival: number; pathSd: number; directLength: number },
) {
  const T = plan.temperature_K;
  const pulsesForTarget = Math.ceil((plan.targets.snr / f.snrSingle) ** 2);
  const sampleInterval = 1 / plan.digitiser.sampleRate_Hz;
  const timingSd = Math.hypot(f.riseAtSensor / f.snrAveraged, sampleInterval / Math.sqrt(12));
  const relSpeedSd = Math.hypot(f.pathSd / f.directLength, timingSd / f.arrival);
  // Relative speed uncertainties above 1 mean the reading says nothing; they are capped there.
  const spreadT = temperatureSpread(T, Math.min(1, relSpeedSd));
  const changeT = temperatureSpread(T, Math.min(1, timingSd / f.arrival));
  const withModel = temperatureSpread(T, Math.min(1, Math.hypot(relSpeedSd, secondSoundRelativeSd(T))));
  const shortest = Number.isFinite(timingSd) ? shortestDistanceForResolution(T, plan.targets.temperatureSd_K, Math.min(timingSd, 1e3), f.pathSd) : Number.POSITIVE_INFINITY;
  return { pulsesForTarget: Number.isFinite(pulsesForTarget) ? pulsesForTarget : null, timingSd, spreadT, changeT, withModel, shortest };
}

interface SensorFigures {
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

function sensorWarnings(c: SensorContext, f: SensorFigures): void {
  const { plan, sensor, profile, warnings } = c;
  const id = sensor.id;
  const name = sensor.label;
  const h = plan.heater;
  if (f.amplitude > LARGE_AMPLITUDE_K) {
    warn(warnings, 'large-amplitude', 'caution', `${name}: the pulse reaches ${fmt(f.amplitude * 1e3)} mK, above the 1 mK kept for thermometry; the wave is no longer small and its speed depends on its height.`, f.amplitude, LARGE_AMPLITUDE_K, id);
  }
  if (c.shockDistance !== null && c.faceDeltaT !== null && c.shockDistance < f.directLength) {
    const alpha = plan.temperature_K < 2.1768 && c.props.nonlinearity_per_K !== null ? c.props.nonlinearity_per_K : 0;
    const bias = (Math.abs(alpha) * c.faceDeltaT * f.arrival) / 2;
    warn(
      warnings,
      'shock',
      'caution',
      `${name}: the pulse steepens into a shock after about ${fmt(c.shockDistance * 1e3)} mm, before the ${fmt(f.directLength * 1e3)} mm path ends (${alpha > 0 ? 'leading' : 'trailing'} edge); the arrival is biased by about ${fmt(bias * 1e6)} µs.`,
      c.shockDistance,
      f.directLength,
      id,
    );
  }
  const pulseEnd = profile.duration_s + f.spread + 3 * sensor.lag_s;
  const firstEcho = f.echoes.find((e) => e.amplitude_K * sensor.responsivity_V_K > sensor.noise_V / Math.sqrt(h.averages));
  if (firstEcho && firstEcho.arrival_s - f.arrival < pulseEnd) {
    warn(warnings, 'echo-overlap', 'caution', `${name}: an echo (${firstEcho.path.join(' → ') || 'reflection'}) arrives ${fmt((firstEcho.arrival_s - f.arrival) * 1e6)} µs after the direct pulse, before it has passed (${fmt(pulseEnd * 1e6)} µs).`, firstEcho.arrival_s - f.arrival, pulseEnd, id);
  }
  const audible = f.echoes.filter((e) => e.amplitude_K * sensor.responsivity_V_K > sensor.noise_V / Math.sqrt(h.averages));
  const lastHeard = Math.max(f.arrival, ...audible.map((e) => e.arrival_s)) + pulseEnd + 5 * sensor.lag_s;
  const period = 1 / h.repetitionRate_Hz;
  if (period < lastHeard) {
    warn(warnings, 'range-ambiguity', 'caution', `${name}: pulses come every ${fmt(period * 1e3)} ms but signals from one pulse last until ${fmt(lastHeard * 1e3)} ms; the next pulse's arrival would mix with them (lower the repetition rate below ${fmt(1 / lastHeard)} Hz).`, period, lastHeard, id);
  }
  const recordEnd = plan.digitiser.recordLength_s - plan.digitiser.preTrigger_s;
  const needed = f.arrival + pulseEnd;
  if (recordEnd < needed) {
    warn(warnings, 'record-too-short', 'caution', `${name}: the record ends ${fmt(recordEnd * 1e3)} ms after the trigger, before the pulse has passed (${fmt(needed * 1e3)} ms).`, recordEnd, needed, id);
  }
  const interval = 1 / plan.digitiser.sampleRate_Hz;
  const wanted = f.riseAtSensor / SAMPLES_PER_EDGE;
  if (interval > wanted) {
    warn(warnings, 'coarse-sampling', 'caution', `${name}: samples every ${fmt(interval * 1e6)} µs put fewer than ${SAMPLES_PER_EDGE} points on the ${fmt(f.riseAtSensor * 1e6)} µs edge; the arrival cannot be timed well (sample at ${fmt(SAMPLES_PER_EDGE / f.riseAtSensor / 1e6)} MS/s or faster).`, interval, wanted, id);
  }
  if (f.snrAveraged < plan.targets.snr) {
    const remedy = f.pulsesForTarget === null ? 'the predicted signal is zero: raise the heater power or move the sensor' : `average ${f.pulsesForTarget} pulses or raise the signal`;
    warn(warnings, 'low-snr', 'caution', `${name}: SNR ${fmt(f.snrAveraged)} with ${h.averages} pulses averaged is below the target ${fmt(plan.targets.snr)}; ${remedy}.`, f.snrAveraged, plan.targets.snr, id);
  }
  if (f.spreadT?.insensitive) {
    warn(warnings, 'insensitive', 'caution', `${name}: at ${fmt(plan.temperature_K, 4)} K second sound hardly changes with temperature (an extremum of u2 is near); the delay pins the temperature only to about ${fmt(f.spreadT.sd_K * 1e3)} mK.`, f.spreadT.sd_K, plan.targets.temperatureSd_K, id);
  }
}
