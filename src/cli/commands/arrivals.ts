/**
 * `sekundo arrivals --temperature <T> --distance <d> [--heater-width <w> --heater-height <h> |
 * --heater-diameter <D>] [--flux <q>] [--pulse <τ>] … [--json]`: when first and second sound and
 * the echoes between two parallel plates reach a sensor facing a heater on the axis, and how large
 * the second-sound pulse is there. With a heater size the pulse is the finite heater's (a baffled
 * piston); without one it is the plane-wave limit, and the output says so. One quick case of the
 * planner.
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
import { EXIT_OK, UsageError } from '../errors';
import { ABSENT, alignTable, formatPlain, formatSignificant } from '../format';
import { computeFor, kernelCall } from '../kernel-call';
import { formatKelvin, formatMillikelvin, JSON_FLAG, writeJson } from './shared';

// Defaults: a bench check with a film heater between two solid plates (common practice, no source).
/** Heater face for the plane-wave limit, m² (1 cm²): only turns flux into power for the kernel's power range. */
export const ARRIVALS_HEATER_AREA_M2 = 1e-4;
/** Default heat flux, W/m² (0.1 W/cm²). */
export const ARRIVALS_DEFAULT_FLUX_W_M2 = 1e3;
/** Default pulse width, s (100 µs). */
export const ARRIVALS_DEFAULT_PULSE_S = 100e-6;
/** Default rise time, s (1 µs, or a tenth of a shorter pulse). */
export const ARRIVALS_DEFAULT_RISE_S = 1e-6;
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

const FLUX_RANGE_W_M2 = PLAN_LIMITS.flux_W_m2;

const HEATER_WIDTH_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'heater-width',
  dimension: 'length',
  placeholder: 'w',
  range: PLAN_LIMITS.heaterSide_m,
  help: 'width of a rectangular (film) heater, with --heater-height',
};

const HEATER_HEIGHT_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'heater-height',
  dimension: 'length',
  placeholder: 'h',
  range: PLAN_LIMITS.heaterSide_m,
  help: 'height of a rectangular (film) heater, with --heater-width',
};

const HEATER_DIAMETER_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'heater-diameter',
  dimension: 'length',
  placeholder: 'D',
  range: [2 * PLAN_LIMITS.heaterRadius_m[0], 2 * PLAN_LIMITS.heaterRadius_m[1]],
  help: 'diameter of a disk heater (instead of width and height)',
};

const FLUX_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'flux',
  dimension: 'heat flux',
  placeholder: 'q',
  range: FLUX_RANGE_W_M2,
  rangeNote: 'and the power (flux × heater area) 1 nW–10 kW',
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
  help: 'a measured amplitude reflection coefficient for both plates (default: solid walls, R = (Z − h)/(Z + h) ≈ 1)',
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
  /** R used for both plates. */
  reflection: number | null;
  /** solid-wall: (Z − h)/(Z + h) from the Kapitza conductance; measured: --reflection. */
  reflectionSource: 'solid-wall' | 'measured';
  reflectionNote: string;
  /** The heater: its size, or the plane-wave limit. */
  heater: { geometry: 'rectangle' | 'disk' | 'plane-wave'; width_m: number | null; height_m: number | null; diameter_m: number | null };
  /** Distance up to which the plane-wave value holds for the whole pulse, m (Infinity: plane-wave limit). */
  planeWaveRange_m: number | null;
  /** One line saying what model the numbers come from. */
  model: string;
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
  summary: 'arrival times and size of a second-sound pulse from a heater to a sensor on its axis, with echoes',
  synopsis: [
    'arrivals --temperature <T> --distance <d> [--heater-width <w> --heater-height <h> | --heater-diameter <D>] [--flux <q>] [--pulse <τ>] [--rise <t_r>] [--lag <t_s>] [--echo-order <N>] [--reflection <R>] [--json]',
  ],
  description:
    'A heater in a plate and a sensor facing it on a parallel plate at distance d, on the axis. ' +
    'Prints when first sound (d/u₁) and second sound (d/u₂) arrive, the peak temperature pulse at the ' +
    'sensor, and the echoes between the two plates, which arrive at (2k+1)·d/u₂ after 2k reflections. ' +
    'Give the heater size (--heater-width and --heater-height for a film, or --heater-diameter for a ' +
    'disk) and the pulse is the finite heater\'s (a baffled piston: beyond about a²/(2u₂τ) it turns ' +
    'short and bipolar); without a size the output is the plane-wave limit q/(ρ c_p u₂) and says so. ' +
    'The sensor sits on its plate, so it sees the incident pulse plus its reflection there (1 + R); ' +
    'faceDeltaT_K is the incident plane-wave value. Both plates are solid walls by default, ' +
    'R = (Z − h)/(Z + h) ≈ 1 with Z = ρ c_p u₂ and an order-of-magnitude Kapitza conductance h; ' +
    '--reflection sets a measured R instead. Defaults: 0.1 W/cm², a 100 µs rectangle with 1 µs edges, ' +
    'a sensor without lag, echoes up to 4 reflections. Warnings cover the pulse and the helium (large ' +
    'amplitude, shock, strong heating, counterflow, overlapping echoes, no second sound above Tλ); for ' +
    'the digitiser, repetition rate and noise, write a plan file and use "sekundo plan". With --json, ' +
    'prints {model, secondSoundArrival_s, firstSoundArrival_s, amplitude_K, echoes: [{order, ' +
    'arrival_s, amplitude_K}], warnings: [{code, severity, message}], …}.',
  flags: [TEMPERATURE_FLAG, DISTANCE_FLAG, HEATER_WIDTH_FLAG, HEATER_HEIGHT_FLAG, HEATER_DIAMETER_FLAG, FLUX_FLAG, PULSE_FLAG, RISE_FLAG, LAG_FLAG, ECHO_ORDER_FLAG, REFLECTION_FLAG, JSON_FLAG],
  examples: [
    'arrivals --temperature 1.8K --distance 50mm --heater-width 10mm --heater-height 10mm',
    'arrivals --temperature 1.95K --distance 25mm --heater-width 10mm --heater-height 10mm --flux 1W/cm2 --pulse 200us --json',
    'arrivals --temperature 1.65K --distance 12mm --heater-diameter 6mm --reflection 0.9 --lag 20us',
    'arrivals --temperature 1.8K --distance 50mm',
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
  const reflection = args.number(REFLECTION_FLAG.name)?.value ?? null;
  const size = (flag: QuantityFlag): number | null => {
    const arg = args.quantity(flag.name);
    return arg ? inRange(arg, flag.name.replace('-', ' '), flag.range, 'm') : null;
  };
  const w = size(HEATER_WIDTH_FLAG);
  const h = size(HEATER_HEIGHT_FLAG);
  const D = size(HEATER_DIAMETER_FLAG);
  if (D !== null && (w !== null || h !== null)) throw new UsageError('give --heater-diameter (a disk) or --heater-width with --heater-height (a rectangle), not both');
  if ((w === null) !== (h === null)) throw new UsageError(`--heater-${w === null ? 'width' : 'height'} is missing: a rectangular heater needs both --heater-width and --heater-height`);
  const heater: ArrivalsChoice['heater'] =
    D !== null ? { geometry: 'disk', width_m: null, height_m: null, diameter_m: D } : w !== null && h !== null ? { geometry: 'rectangle', width_m: w, height_m: h, diameter_m: null } : { geometry: 'plane-wave', width_m: null, height_m: null, diameter_m: null };
  const choice: ArrivalsChoice = { T, d, flux, width, rise, lag, echoOrder, reflection, heater };
  const plan = kernelCall(() => computePlan(twoPlateInput(choice)));
  return arrivalsFromPlan(plan, choice);
}

function heaterAreaOf(c: ArrivalsChoice): number {
  const h = c.heater;
  if (h.geometry === 'rectangle') return (h.width_m as number) * (h.height_m as number);
  if (h.geometry === 'disk') return (Math.PI * (h.diameter_m as number) ** 2) / 4;
  return ARRIVALS_HEATER_AREA_M2;
}

interface ArrivalsChoice {
  T: number;
  d: number;
  flux: number;
  width: number;
  rise: number;
  lag: number;
  echoOrder: number;
  /** Measured R of both plates, or null for solid walls. */
  reflection: number | null;
  heater: ArrivalsResult['heater'];
}

/** The planner's input for a heater at z = 0, a sensor on a parallel plate at z = d. */
function twoPlateInput(c: ArrivalsChoice): PlanInput {
  return {
    temperature_K: c.T,
    liquidDepth_m: 0,
    heater: {
      geometry: c.heater.geometry,
      width_m: c.heater.width_m ?? 0,
      height_m: c.heater.height_m ?? 0,
      radius_m: (c.heater.diameter_m ?? 0) / 2,
      mount: 'wall',
      area_m2: heaterAreaOf(c),
      power_W: c.flux * heaterAreaOf(c),
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
    targets: { snr: PLAN_LIMITS.snr[0], temperatureSd_K: PLAN_LIMITS.temperatureSd_K[1], temperatureKind: 'absolute' },
  };
}

function arrivalsFromPlan(plan: PlanResult, c: ArrivalsChoice): ArrivalsResult {
  const sensor = plan.sensors[0];
  if (!sensor) throw new Error('the planner returned no sensor');
  const plate = plan.planes.find((p) => p.label === 'sensor plate');
  return {
    temperature_K: c.T,
    distance_m: c.d,
    flux_W_m2: c.flux,
    pulseWidth_s: c.width,
    riseTime_s: c.rise,
    lag_s: c.lag,
    reflection: plate?.reflection ?? null,
    reflectionSource: c.reflection === null ? 'solid-wall' : 'measured',
    reflectionNote: c.reflection === null ? (plate?.note ?? 'solid walls') : `R = ${c.reflection} as given (a measured value); a solid wall would reflect ${plan.heater.wallReflection === null ? 'nearly all' : plan.heater.wallReflection.toFixed(4)}`,
    heater: c.heater,
    planeWaveRange_m: plan.heater.planeWaveRange_m,
    model: modelLine(c, plan),
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

function modelLine(c: ArrivalsChoice, plan: PlanResult): string {
  const range = plan.heater.planeWaveRange_m;
  const mm = (x: number) => formatPlain(Number(fromBaseUnit(x, 'mm').toPrecision(3)));
  if (c.heater.geometry === 'plane-wave') {
    return 'Plane-wave limit: no heater size given, so the heater is taken as unbounded and δT = q/(ρ c_p u₂) at every distance. A real heater gives this only on short paths; give --heater-width and --heater-height (or --heater-diameter) for its own pulse.';
  }
  const size = c.heater.geometry === 'disk' ? `a ${mm(c.heater.diameter_m as number)} mm disk` : `a ${mm(c.heater.width_m as number)} mm × ${mm(c.heater.height_m as number)} mm rectangle`;
  const edge = plan.heater.planeWaveEdge_m;
  const which = c.heater.geometry === 'disk' ? 'the radius' : 'half the shorter side';
  return range === null || edge === null
    ? `Finite heater: ${size}, computed as a baffled piston.`
    : `Finite heater: ${size}, computed as a baffled piston. The plane-wave value holds for the whole pulse only up to about ${mm(range)} mm (a²/(2u₂τ), a = ${mm(edge)} mm, ${which}); the sensor is at ${mm(c.d)} mm${c.d > range ? ', so its pulse is shorter and turns bipolar' : ''}.`;
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
      ['Heater', r.heater.geometry === 'plane-wave' ? 'plane-wave limit' : r.heater.geometry === 'disk' ? `disk ${formatPlain(fromBaseUnit(r.heater.diameter_m as number, 'mm'))} mm` : `${formatPlain(fromBaseUnit(r.heater.width_m as number, 'mm'))} mm × ${formatPlain(fromBaseUnit(r.heater.height_m as number, 'mm'))} mm`, r.heater.geometry === 'plane-wave' ? 'no size given' : 'baffled piston'],
      ['Plates', r.reflection === null ? 'R —' : `R = ${r.reflection.toFixed(4)}`, `${r.reflectionSource === 'solid-wall' ? 'solid walls' : 'measured'}; echoes up to ${r.echoOrder} reflections; sensor lag ${formatPlain(fromBaseUnit(r.lag_s, 'us'))} µs`],
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
    'Second sound from a heater to a sensor on a parallel plate',
    '',
    ...settings,
    '',
    r.model,
    '',
    ...alignTable(rows, ['left', 'right', 'right']),
  ];
  if (r.faceDeltaT_K !== null) lines.push('', `Incident plane-wave value q/(ρ c_p u₂): ${mK(r.faceDeltaT_K)} mK; the sensor's plate adds its reflection (1 + R).`);
  lines.push(`Plates: ${r.reflectionNote}.`);
  if (r.warnings.length > 0) {
    lines.push('', 'Warnings:');
    for (const w of r.warnings) lines.push(`  ${w.severity} (${w.code}): ${w.message}`);
  }
  return lines;
}
