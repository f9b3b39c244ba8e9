/**
 * `sekundo arrivals --temperature <T> --distance <d> [--flux <q>] [--pulse <τ>] … [--json]`: when
 * first and second sound and the echoes between two parallel plates reach a sensor facing a planar
 * heater, and how large the second-sound pulse is there. One quick case of the planner.
 */
import { fromBaseUnit } from '../../io/quantity';
import {
  computePlan,
  MAX_ECHO_ORDER,
  PATH_LENGTH_RANGE_M,
  PLAN_LIMITS,
  type PlanInput,
  type PlanResult,
  type PlanWarning,
  PULSE_WIDTH_RANGE_S,
  requireInRange,
  type WarningCode,
} from '../../physics';
import type { NumberFlag, ParsedArgs, QuantityArg, QuantityFlag } from '../args';
import { requireQuantity } from '../args';
import type { Command } from '../command';
import { EXIT_OK } from '../errors';
import { ABSENT, alignTable, formatPlain, formatSignificant } from '../format';
import { computeFor, kernelCall } from '../kernel-call';
import { formatKelvin, formatMillikelvin, JSON_FLAG, writeJson } from './shared';

// Defaults: a bench check with a film heater between two glass-like plates (common practice, no
// source) — every one can be changed with a flag except the heater area, which does not change a
// planar pulse.
/** Heater face, m² (1 cm²): only turns flux into power for the kernel's power range. */
export const ARRIVALS_HEATER_AREA_M2 = 1e-4;
/** Default heat flux, W/m² (0.1 W/cm²). */
export const ARRIVALS_DEFAULT_FLUX_W_M2 = 1e3;
/** Default pulse width, s (100 µs). */
export const ARRIVALS_DEFAULT_PULSE_S = 100e-6;
/** Default rise time, s (1 µs, or a tenth of a shorter pulse). */
export const ARRIVALS_DEFAULT_RISE_S = 1e-6;
/** Default reflection coefficient of both plates: glass, measured about 0.4 (PHYSICS notes §3). */
export const ARRIVALS_DEFAULT_REFLECTION = 0.4;
/** Default highest number of reflections reported: echoes after 2 and 4 reflections, at 3d/u₂ and 5d/u₂. */
export const ARRIVALS_DEFAULT_ECHO_ORDER = 4;
/** Digitiser sample rate, Hz (10 MS/s). */
const SAMPLE_RATE_HZ = 10e6;

/**
 * Warnings about the pulse and the helium, which these flags decide. Warnings about the digitiser,
 * repetition rate, averaging and sensor noise would only describe the defaults behind this
 * command, so they are left to `sekundo plan`.
 */
const ARRIVALS_WARNINGS: ReadonlySet<WarningCode> = new Set<WarningCode>([
  'no-second-sound',
  'model-region',
  'near-lambda',
  'lambda-head',
  'large-amplitude',
  'shock',
  'strong-flux',
  'counterflow',
  'echo-overlap',
]);

const TEMPERATURE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'temperature',
  dimension: 'temperature',
  placeholder: 'T',
  range: PLAN_LIMITS.temperature_K,
  help: 'bath temperature T90 (required)',
};

const DISTANCE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'distance',
  dimension: 'length',
  placeholder: 'd',
  range: PATH_LENGTH_RANGE_M,
  help: 'heater to sensor, cold (required)',
};

const FLUX_RANGE_W_M2 = [PLAN_LIMITS.power_W[0] / ARRIVALS_HEATER_AREA_M2, PLAN_LIMITS.power_W[1] / ARRIVALS_HEATER_AREA_M2] as const;

const FLUX_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'flux',
  dimension: 'heat flux',
  placeholder: 'q',
  range: FLUX_RANGE_W_M2,
  rangeNote: '1 nW–10 kW on the 1 cm² heater',
  help: 'peak heat flux on the heater (default 0.1 W/cm²)',
};

const PULSE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'pulse',
  dimension: 'time',
  placeholder: 'τ',
  range: PULSE_WIDTH_RANGE_S,
  help: 'width of the rectangular heater pulse (default 100 µs)',
};

const RISE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'rise',
  dimension: 'time',
  placeholder: 't_r',
  range: [PULSE_WIDTH_RANGE_S[0] * 1e-6, PULSE_WIDTH_RANGE_S[1]],
  rangeNote: 'from a millionth of the pulse width up to the pulse width',
  help: 'rise and fall time of the pulse edges (default 1 µs, or a tenth of a shorter pulse)',
};

const LAG_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'lag',
  dimension: 'time',
  placeholder: 't_s',
  range: PLAN_LIMITS.lag_s,
  help: 'first-order time constant of the sensor (default 0); delays and rounds the pulse',
};

const ECHO_ORDER_FLAG: NumberFlag = {
  kind: 'number',
  name: 'echo-order',
  placeholder: 'N',
  range: [0, MAX_ECHO_ORDER],
  integer: true,
  help: `most reflections on an echo's path (default ${ARRIVALS_DEFAULT_ECHO_ORDER}: echoes at 3d/u₂ and 5d/u₂)`,
};

const REFLECTION_FLAG: NumberFlag = {
  kind: 'number',
  name: 'reflection',
  placeholder: 'R',
  range: [-1, 1],
  help: `amplitude reflection coefficient of both plates (default ${ARRIVALS_DEFAULT_REFLECTION}, glass)`,
};

/** One echo in the output. */
export interface ArrivalsEcho {
  /** Reflections on the shortest path of this echo (2k for the echo at (2k+1)d/u₂). */
  order: number;
  arrival_s: number;
  amplitude_K: number;
}

/** What `arrivals --json` prints. */
export interface ArrivalsResult {
  temperature_K: number;
  distance_m: number;
  flux_W_m2: number;
  pulseWidth_s: number;
  riseTime_s: number;
  lag_s: number;
  reflection: number;
  echoOrder: number;
  /** u₂ and u₁ at the temperature, m/s (u₂ null in He I). */
  secondSound_m_s: number | null;
  firstSound_m_s: number;
  /** Second sound at the sensor, s after the pulse onset (sensor lag included); null in He I. */
  secondSoundArrival_s: number | null;
  firstSoundArrival_s: number;
  /** Peak δT at the sensor on its plate: the incident pulse and its reflection there, (1 + R)·q/(ρ c_p u₂) for a long pulse. */
  amplitude_K: number | null;
  /** δT of the incident plane wave, q/(ρ c_p u₂), K; null in He I. */
  faceDeltaT_K: number | null;
  echoes: ArrivalsEcho[];
  warnings: { code: WarningCode; severity: PlanWarning['severity']; message: string }[];
}

/** The `arrivals` command. */
export const arrivalsCommand: Command = {
  name: 'arrivals',
  summary: 'arrival times and size of a second-sound pulse from a planar heater, with echoes',
  synopsis: ['arrivals --temperature <T> --distance <d> [--flux <q>] [--pulse <τ>] [--rise <t_r>] [--lag <t_s>] [--echo-order <N>] [--reflection <R>] [--json]'],
  description:
    'A planar heater and a sensor facing it on a parallel plate at distance d. Prints when first ' +
    'sound (d/u₁) and second sound (d/u₂) arrive, the peak temperature pulse at the sensor, and the ' +
    'echoes between the two plates, which arrive at (2k+1)·d/u₂ after 2k reflections. The sensor sits ' +
    'on its plate, so it sees the incident pulse plus its reflection there: (1 + R)·q/(ρ c_p u₂) for a ' +
    'long pulse; faceDeltaT_K is the incident pulse alone. Defaults: a 1 cm² heater, 0.1 W/cm², a ' +
    '100 µs rectangle with 1 µs edges, both plates reflecting with R = 0.4 (glass), a sensor without ' +
    'lag, echoes up to 4 reflections. Warnings cover the pulse and the helium (large amplitude, ' +
    'shock, strong flux, counterflow, overlapping echoes, no second sound above Tλ); for the ' +
    'digitiser, repetition rate and noise, write a plan file and use "sekundo plan". With --json, ' +
    'prints {secondSoundArrival_s, firstSoundArrival_s, amplitude_K, echoes: [{order, arrival_s, ' +
    'amplitude_K}], warnings: [{code, severity, message}], …}.',
  flags: [TEMPERATURE_FLAG, DISTANCE_FLAG, FLUX_FLAG, PULSE_FLAG, RISE_FLAG, LAG_FLAG, ECHO_ORDER_FLAG, REFLECTION_FLAG, JSON_FLAG],
  examples: [
    'arrivals --temperature 1.8K --distance 50mm',
    'arrivals --temperature 1.8K --distance 50mm --flux 1W/cm2 --pulse 100us --json',
    'arrivals --temperature 1.65K --distance 12mm --reflection 0 --lag 20us',
  ],
  run(args, io) {
    const result = computeArrivals(args);
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderArrivals(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

/** A flag's value, checked against `range` by the kernel's own check (so errors quote the range). */
function inRange(arg: QuantityArg, quantity: string, range: readonly [number, number], unit: string): number {
  return computeFor(arg, (v) => requireInRange(quantity, v, range[0], range[1], unit));
}

/** Reads the flags, runs the planner on the two-plate case and keeps what this command reports. */
export function computeArrivals(args: ParsedArgs): ArrivalsResult {
  const optional = (flag: QuantityFlag, fallback: number, quantity: string, range: readonly [number, number], unit: string): number => {
    const arg = args.quantity(flag.name);
    return arg ? inRange(arg, quantity, range, unit) : fallback;
  };
  const T = inRange(requireQuantity('arrivals', args, TEMPERATURE_FLAG), 'temperature', TEMPERATURE_FLAG.range, 'K');
  const d = inRange(requireQuantity('arrivals', args, DISTANCE_FLAG), 'distance', DISTANCE_FLAG.range, 'm');
  const flux = optional(FLUX_FLAG, ARRIVALS_DEFAULT_FLUX_W_M2, 'heat flux', FLUX_RANGE_W_M2, 'W/m2');
  const width = optional(PULSE_FLAG, ARRIVALS_DEFAULT_PULSE_S, 'pulse width', PULSE_WIDTH_RANGE_S, 's');
  const rise = optional(RISE_FLAG, Math.min(ARRIVALS_DEFAULT_RISE_S, width / 10), 'rise time', [width * 1e-6, width], 's');
  const lag = optional(LAG_FLAG, 0, 'sensor lag', PLAN_LIMITS.lag_s, 's');
  const echoOrder = args.number(ECHO_ORDER_FLAG.name)?.value ?? ARRIVALS_DEFAULT_ECHO_ORDER;
  const reflection = args.number(REFLECTION_FLAG.name)?.value ?? ARRIVALS_DEFAULT_REFLECTION;

  const plan = kernelCall(() => computePlan(twoPlateInput({ T, d, flux, width, rise, lag, echoOrder, reflection })));
  return arrivalsFromPlan(plan, { T, d, flux, width, rise, lag, echoOrder, reflection });
}

interface ArrivalsChoice {
  T: number;
  d: number;
  flux: number;
  width: number;
  rise: number;
  lag: number;
  echoOrder: number;
  reflection: number;
}

/** The planner's input for a planar heater at z = 0, a sensor on a parallel plate at z = d. */
function twoPlateInput(c: ArrivalsChoice): PlanInput {
  return {
    temperature_K: c.T,
    liquidDepth_m: 0,
    heater: {
      geometry: 'planar',
      area_m2: ARRIVALS_HEATER_AREA_M2,
      radius_m: Math.sqrt(ARRIVALS_HEATER_AREA_M2 / Math.PI),
      power_W: c.flux * ARRIVALS_HEATER_AREA_M2,
      shape: { kind: 'rectangle' },
      width_s: c.width,
      riseTime_s: c.rise,
      // Single shots, not averaged: the warnings these decide are not reported here.
      repetitionRate_Hz: PLAN_LIMITS.repetitionRate_Hz[0],
      averages: 1,
    },
    // A point sensor whose noise is the least the planner takes, so every echo counts as heard.
    sensors: [
      { id: 'sensor', label: 'sensor', position_m: [0, 0, c.d], distanceSd_m: 0, area_m2: 0, responsivity_V_K: 1, noise_V: PLAN_LIMITS.noise_V[0], lag_s: c.lag },
    ],
    spacer: { materialId: 'stainless-304', measuredWarm: false },
    reflectors: [
      { label: 'heater plate', axis: 'z', position_m: 0, reflection: c.reflection },
      { label: 'sensor plate', axis: 'z', position_m: c.d, reflection: c.reflection },
    ],
    echoOrder: c.echoOrder,
    digitiser: { sampleRate_Hz: SAMPLE_RATE_HZ, recordLength_s: PLAN_LIMITS.recordLength_s[1], preTrigger_s: 0 },
    targets: { snr: PLAN_LIMITS.snr[0], temperatureSd_K: PLAN_LIMITS.temperatureSd_K[1] },
  };
}

function arrivalsFromPlan(plan: PlanResult, c: ArrivalsChoice): ArrivalsResult {
  const sensor = plan.sensors[0];
  if (!sensor) throw new Error('the planner returned no sensor');
  return {
    temperature_K: c.T,
    distance_m: c.d,
    flux_W_m2: c.flux,
    pulseWidth_s: c.width,
    riseTime_s: c.rise,
    lag_s: c.lag,
    reflection: c.reflection,
    echoOrder: c.echoOrder,
    secondSound_m_s: plan.properties.secondSound_m_s,
    firstSound_m_s: plan.properties.firstSound_m_s,
    secondSoundArrival_s: sensor.secondSoundArrival_s,
    firstSoundArrival_s: sensor.firstSoundArrival_s,
    amplitude_K: sensor.amplitude_K,
    faceDeltaT_K: plan.heater.faceDeltaT_K,
    echoes: sensor.echoes.map((e) => ({ order: e.order, arrival_s: e.arrival_s, amplitude_K: e.amplitude_K })),
    warnings: plan.warnings.filter((w) => ARRIVALS_WARNINGS.has(w.code)).map((w) => ({ code: w.code, severity: w.severity, message: w.message })),
  };
}

const ms = (t: number | null): string => (t === null ? ABSENT : formatSignificant(fromBaseUnit(t, 'ms')));
const mK = (x: number | null): string => (x === null ? ABSENT : formatSignificant(fromBaseUnit(x, 'mK')));

/** The human-readable result of `arrivals`. */
export function renderArrivals(r: ArrivalsResult): string[] {
  const settings = alignTable(
    [
      ['Temperature', `${formatKelvin(r.temperature_K)} K`, `${formatMillikelvin(r.temperature_K)} mK`],
      ['Distance', `${formatPlain(fromBaseUnit(r.distance_m, 'mm'))} mm`, 'heater to sensor, cold'],
      ['Heat flux', `${formatPlain(fromBaseUnit(r.flux_W_m2, 'W/cm2'))} W/cm²`, `${formatPlain(fromBaseUnit(r.pulseWidth_s, 'us'))} µs rectangle, ${formatPlain(fromBaseUnit(r.riseTime_s, 'us'))} µs edges`],
      ['Plates', `R = ${formatPlain(r.reflection)}`, `echoes up to ${r.echoOrder} reflections; sensor lag ${formatPlain(fromBaseUnit(r.lag_s, 'us'))} µs`],
      ['Speeds', r.secondSound_m_s === null ? `u₂ ${ABSENT}` : `u₂ ${formatSignificant(r.secondSound_m_s)} m/s`, `u₁ ${formatSignificant(r.firstSound_m_s)} m/s`],
    ],
    ['left', 'left', 'left'],
  );
  const rows: string[][] = [
    ['Wave', 'Arrival (ms)', 'δT at sensor (mK)'],
    ['first sound', ms(r.firstSoundArrival_s), ABSENT],
    ['second sound', ms(r.secondSoundArrival_s), mK(r.amplitude_K)],
    ...r.echoes.map((e) => [`echo, ${e.order} reflections`, ms(e.arrival_s), mK(e.amplitude_K)]),
  ];
  const lines = [
    'Second sound from a planar heater to a sensor on a parallel plate',
    '',
    ...settings,
    '',
    ...alignTable(rows, ['left', 'right', 'right']),
  ];
  if (r.faceDeltaT_K !== null) lines.push('', `Incident pulse q/(ρ c_p u₂): ${mK(r.faceDeltaT_K)} mK; the sensor's plate adds its reflection.`);
  if (r.warnings.length > 0) {
    lines.push('', 'Warnings:');
    for (const w of r.warnings) lines.push(`  ${w.severity} (${w.code}): ${w.message}`);
  }
  return lines;
}
