/**
 * The plan file: Sekundo's own versioned JSON format for a measurement plan.
 *
 * It stores what the user chose (not what the kernel derives), in SI units with the unit in every
 * key, and is validated at load with a strict schema: unknown fields, wrong types, values out of
 * range and inconsistent choices all come back as field-level messages such as
 * `heater.width_s: must be 10 ns–10 s (got -1)`. {@link planFileToInput} turns a valid file into
 * the kernel's {@link PlanInput}.
 *
 * ```json
 * { "format": "sekundo-plan", "version": 1, "name": "…", "notes": "…",
 *   "bath": { "temperature_K": 1.8 } | { "vapourPressure_Pa": 1638.2 }, plus "liquidDepth_m",
 *   "heater": { "geometry": "planar" | "disk" | "point", "area_m2" (planar, point) | "radius_m" (disk),
 *               "power_W" | "flux_W_m2", "shape": "rectangle" | "half-sine" | { "custom": [[t_s, a], …] },
 *               "width_s", "riseTime_s", "repetitionRate_Hz", "averages" },
 *   "sensors": [{ "id", "label", "distance_m" | "position_m": [x, y, z], "distanceSd_m", "area_m2",
 *                 "responsivity_V_K", "noise_V", "lag_s" }],
 *   "spacer": { "materialId", "measuredWarm" },
 *   "reflectors": [{ "label", "axis": "x" | "y" | "z", "position_m", "reflection" }], "echoOrder",
 *   "digitiser": { "sampleRate_Hz", "recordLength_s", "preTrigger_s" },
 *   "targets": { "snr", "temperatureSd_K" } }
 * ```
 */
import { z } from 'zod';
import {
  CUSTOM_PULSE_MAX_POINTS,
  InvalidInputError,
  MAX_ECHO_ORDER,
  NonFiniteInputError,
  OutOfRangeError,
  PATH_LENGTH_RANGE_M,
  PhysicsError,
  PLAN_LIMITS,
  type PlanInput,
  PROPERTIES_RANGE_K,
  PULSE_WIDTH_RANGE_S,
  type PulseShape,
  SPACER_MATERIALS,
  temperatureFromVapourPressure,
  VAPOUR_PRESSURE_RANGE_PA,
  type VapourPressureScale,
  vapourPressure,
} from '../physics';

/** The `format` every plan file carries. */
export const PLAN_FORMAT = 'sekundo-plan';
/** The version this code writes and reads without migration. */
export const CURRENT_PLAN_VERSION = 1;

/** Largest plan file read, characters: a 10 000-point custom pulse takes well under 1 MB. */
export const MAX_PLAN_FILE_CHARS = 4_000_000;
/** Deepest nesting of arrays and objects accepted; a plan needs 5 (plan › heater › shape › custom › point). */
export const MAX_PLAN_NESTING = 32;
/** Most messages returned for one file; the rest are counted. */
export const MAX_PLAN_MESSAGES = 50;
/** Most reflecting planes in a plan (the image count is capped by the kernel anyway). */
export const MAX_REFLECTORS = 16;
/**
 * Heat flux accepted in a file, W/m²: up to 100 kW/cm², far past what any heater film survives;
 * only a guard against typing mistakes (the derived power is checked against PLAN_LIMITS too).
 */
export const FLUX_RANGE_W_M2 = [1e-6, 1e9] as const;
/** Relative amplitudes accepted in a custom pulse (they are scaled so the largest is 1). */
export const CUSTOM_AMPLITUDE_RANGE = [0, 1e9] as const;
/** Coordinates of reflecting planes, m: the kernel's image-source range. */
const PLANE_POSITION_RANGE_M = [-100, 100] as const;
/** Sensor coordinates, m: the kernel's path-length range either side of the heater. */
const SENSOR_COORDINATE_RANGE_M = [-PATH_LENGTH_RANGE_M[1], PATH_LENGTH_RANGE_M[1]] as const;
/** Lowest rise time of a rectangle, as a fraction of its width (the kernel's bound). */
const MIN_RISE_FRACTION = 1e-6;
export const MAX_ID_CHARS = 64;
export const MAX_LABEL_CHARS = 120;
export const MAX_NAME_CHARS = 200;
const MAX_NOTES_CHARS = 20_000;
/** Keys refused anywhere in a file: they mean something to JavaScript objects. */
const FORBIDDEN_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

/** Highest vapour pressure accepted: the one at the top of the kernel's temperature range, Pa. */
const MAX_BATH_PRESSURE_PA = vapourPressure(PROPERTIES_RANGE_K[1]).pressure_Pa;
const BATH_PRESSURE_RANGE_PA = [VAPOUR_PRESSURE_RANGE_PA[0], MAX_BATH_PRESSURE_PA] as const;

// ---------------------------------------------------------------------------------------------
// The shape of a plan file.

/** Pulse shape as stored: a name, or custom points [time from onset in s, relative amplitude ≥ 0]. */
export type PlanFileShape = 'rectangle' | 'half-sine' | { custom: [number, number][] };

export interface PlanFileBath {
  /** Bath temperature T90, K. Give this or `vapourPressure_Pa`. */
  temperature_K?: number;
  /** Saturated vapour pressure read over the bath, Pa (ITS-90 from 1.25 K; reference spline below). */
  vapourPressure_Pa?: number;
  /** Liquid above the setup, m. */
  liquidDepth_m: number;
}

export interface PlanFileHeater {
  geometry: 'planar' | 'disk' | 'point';
  /** Face area, m² (planar and point heaters). */
  area_m2?: number;
  /** Radius, m (disk heaters; the area is πr²). */
  radius_m?: number;
  /** Peak power during the pulse, W. Give this or `flux_W_m2`. */
  power_W?: number;
  /** Peak heat flux on the face, W/m² (power = flux × area). */
  flux_W_m2?: number;
  shape: PlanFileShape;
  /** Pulse width, s (rectangle and half-sine; a custom pulse lasts until its last point). */
  width_s?: number;
  /** Edge time, s (rectangle; kept but unused for the other shapes). */
  riseTime_s?: number;
  repetitionRate_Hz: number;
  /** Pulses averaged per reading, a whole number. */
  averages: number;
}

export interface PlanFileSensor {
  id: string;
  label: string;
  /** Distance on the heater axis, m (the sensor sits at [0, 0, d]). Give this or `position_m`. */
  distance_m?: number;
  /** Position from the heater centre, m; the heater faces +z, so z > 0. */
  position_m?: [number, number, number];
  /** One-sigma uncertainty of the distance as measured, m. */
  distanceSd_m: number;
  /** Sensing area facing the heater, m² (0: a point). */
  area_m2: number;
  responsivity_V_K: number;
  /** Noise, V rms, single shot. */
  noise_V: number;
  /** First-order time constant, s. */
  lag_s: number;
}

export interface PlanFileReflector {
  label: string;
  /** The plane is `axis = position_m`. */
  axis: 'x' | 'y' | 'z';
  position_m: number;
  /** Amplitude reflection coefficient, −1 to 1. */
  reflection: number;
}

/** A measurement plan as stored in a file (version {@link CURRENT_PLAN_VERSION}). */
export interface PlanFile {
  format: typeof PLAN_FORMAT;
  version: typeof CURRENT_PLAN_VERSION;
  name: string;
  notes?: string;
  bath: PlanFileBath;
  heater: PlanFileHeater;
  sensors: PlanFileSensor[];
  /** Spacer between heater and sensors; `measuredWarm`: distances were measured at room temperature. */
  spacer: { materialId: string; measuredWarm: boolean };
  reflectors: PlanFileReflector[];
  /** Most reflections reported per echo, 0–12. */
  echoOrder: number;
  digitiser: { sampleRate_Hz: number; recordLength_s: number; preTrigger_s: number };
  targets: { snr: number; temperatureSd_K: number };
}

/** What {@link parsePlanFile} returns: the plan, or every problem found as `field: message`. */
/**
 * A plan file read: the plan, or every problem found. `newerVersion` is set when the file is of a
 * format version newer than this code reads: it is not damaged, and is to be kept untouched.
 */
export type PlanFileParse = { ok: true; plan: PlanFile } | { ok: false; errors: string[]; newerVersion?: number };

// ---------------------------------------------------------------------------------------------
// Messages.

/** Units that read well with an SI prefix in messages (10 ns, 1 µm, 10 kW). */
const PREFIXED_UNITS: ReadonlySet<string> = new Set(['s', 'm', 'Hz', 'W', 'V']);
const PREFIXES: readonly (readonly [number, string])[] = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
  [1e-15, 'f'],
];

function plain(x: number): string {
  return Number(x.toPrecision(6)).toString();
}

/** A value in SI for a message: "10 ns", "1 µm", "0.3 K", "1e-12 m²". */
function formatValue(x: number, unit: string): string {
  const space = unit === '' ? '' : ' ';
  if (x !== 0 && PREFIXED_UNITS.has(unit)) {
    const magnitude = Math.abs(x) * (1 + 1e-12);
    const prefix = PREFIXES.find(([size]) => magnitude >= size);
    if (prefix && magnitude < 1e12) return `${plain(x / prefix[0])} ${prefix[1]}${unit}`;
  }
  return `${plain(x)}${space}${unit}`;
}

/** "10 ns–10 s", "0.3–4.24 K", "from -1 to 1": a closed range for a message. */
export function formatPlanRange(min: number, max: number, unit: string): string {
  const a = formatValue(min, unit);
  const b = formatValue(max, unit);
  if (min < 0) return `from ${a} to ${b}`;
  const unitOfA = a.slice(a.indexOf(' ') + 1);
  const sameUnit = a.includes(' ') && b.includes(' ') && unitOfA === b.slice(b.indexOf(' ') + 1);
  return sameUnit ? `${a.slice(0, a.indexOf(' '))}–${b}` : `${a}–${b}`;
}

/** A text as a reader sees it: compatibility forms folded (NFKC), invisible format characters dropped. */
export function visibleForm(text: string): string {
  return text.normalize('NFKC').replace(/\p{Cf}/gu, '');
}

/** The value found, for "(got …)". */
function show(x: unknown): string {
  if (x === undefined) return 'nothing';
  if (x === null) return 'null';
  if (Array.isArray(x)) return `a list of ${x.length}`;
  if (typeof x === 'object') return 'an object';
  if (typeof x === 'string') return JSON.stringify(x.length > 40 ? `${x.slice(0, 40)}…` : x);
  return String(x);
}

// ---------------------------------------------------------------------------------------------
// Schema building blocks.

interface NumberSpec {
  range: readonly [number, number];
  unit: string;
  integer?: boolean;
}

/** A finite number in a closed range, with messages that quote the range. */
function num({ range, unit, integer = false }: NumberSpec) {
  const [min, max] = range;
  const what = `${integer ? 'a whole number ' : ''}${formatPlanRange(min, max, unit)}`;
  return z
    .number({ error: (issue) => (issue.input === undefined ? 'required' : `must be ${integer ? 'a whole number' : 'a number'}, ${formatPlanRange(min, max, unit)} (got ${show(issue.input)})`) })
    .refine((v) => v >= min && v <= max && (!integer || Number.isInteger(v)), { error: (issue) => `must be ${what} (got ${show(issue.input)})` });
}

/** Non-empty text of at most `maxChars`. */
function text(maxChars: number) {
  return z
    .string({ error: (issue) => (issue.input === undefined ? 'required' : `must be text (got ${show(issue.input)})`) })
    .refine((s) => s.trim() !== '', { error: 'required (empty)' })
    .refine((s) => s.length <= maxChars, { error: (issue) => `must be at most ${maxChars} characters (got ${typeof issue.input === 'string' ? issue.input.length : 0})` });
}

/** One of a few strings. */
function oneOf<const T extends readonly [string, ...string[]]>(values: T) {
  const list = values.map((v) => `"${v}"`).join(', ');
  return z.enum(values, { error: (issue) => (issue.input === undefined ? 'required' : `must be one of ${list} (got ${show(issue.input)})`) });
}

function flag() {
  return z.boolean({ error: (issue) => (issue.input === undefined ? 'required' : `must be true or false (got ${show(issue.input)})`) });
}

/** A list of `min`–`max` items of `item`. */
function list<T extends z.ZodType>(item: T, min: number, max: number, what: string) {
  const message = (issue: { input?: unknown }) =>
    issue.input === undefined ? 'required' : `must be a list of ${min}–${max} ${what} (got ${show(issue.input)})`;
  return z.array(item, { error: message }).min(min, { error: message }).max(max, { error: message });
}

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

function isNumber(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

/** Runs a cross-field check on an object even when some of its fields failed (so all problems show). */
const ON_ANY_OBJECT = { when: (payload: { value: unknown }) => isRecord(payload.value) };
const ON_ANY_LIST = { when: (payload: { value: unknown }) => Array.isArray(payload.value) };

function objectMessage(issue: { input?: unknown }): string {
  return issue.input === undefined ? 'required' : `must be an object {…} (got ${show(issue.input)})`;
}

// ---------------------------------------------------------------------------------------------
// The schema.

const bathSchema = z
  .strictObject(
    {
      temperature_K: num({ range: PLAN_LIMITS.temperature_K, unit: 'K' }).optional(),
      vapourPressure_Pa: num({ range: BATH_PRESSURE_RANGE_PA, unit: 'Pa' }).optional(),
      liquidDepth_m: num({ range: PLAN_LIMITS.liquidDepth_m, unit: 'm' }),
    },
    { error: objectMessage },
  )
  .superRefine((bath, ctx) => {
    const hasT = bath.temperature_K !== undefined;
    const hasP = bath.vapourPressure_Pa !== undefined;
    if (hasT && hasP) ctx.addIssue({ code: 'custom', path: [], message: 'give temperature_K or vapourPressure_Pa, not both' });
    if (!hasT && !hasP) {
      ctx.addIssue({
        code: 'custom',
        path: [],
        message: `give the bath temperature_K (${formatPlanRange(...PLAN_LIMITS.temperature_K, 'K')}) or a vapourPressure_Pa reading (${formatPlanRange(...BATH_PRESSURE_RANGE_PA, 'Pa')})`,
      });
    }
  }, ON_ANY_OBJECT);

const customPointsSchema = list(
  z.tuple([num({ range: [0, PULSE_WIDTH_RANGE_S[1]], unit: 's' }), num({ range: CUSTOM_AMPLITUDE_RANGE, unit: '' })], {
    error: (issue) => `must be a point [time_s, relative amplitude] (got ${show(issue.input)})`,
  }),
  2,
  CUSTOM_PULSE_MAX_POINTS,
  'points [time_s, amplitude]',
).superRefine((points, ctx) => {
  let previous = Number.NEGATIVE_INFINITY;
  let peak = 0;
  points.forEach((point, i) => {
    if (!Array.isArray(point)) return;
    const [t, a] = point as unknown[];
    if (isNumber(t)) {
      if (t <= previous) ctx.addIssue({ code: 'custom', path: [i, 0], message: `times must increase (got ${plain(t)} s after ${plain(previous)} s)` });
      previous = t;
    }
    if (isNumber(a)) peak = Math.max(peak, a);
  });
  if (peak === 0) ctx.addIssue({ code: 'custom', path: [], message: 'at least one amplitude must be above 0' });
  const last = points[points.length - 1];
  const duration = Array.isArray(last) ? last[0] : undefined;
  if (isNumber(duration) && duration < PULSE_WIDTH_RANGE_S[0]) {
    ctx.addIssue({ code: 'custom', path: [points.length - 1, 0], message: `the pulse must last ${formatPlanRange(...PULSE_WIDTH_RANGE_S, 's')} (got ${plain(duration)} s)` });
  }
}, ON_ANY_LIST);

const shapeMessage = (issue: { input?: unknown }): string => {
  if (issue.input === undefined) return 'required';
  const custom = isRecord(issue.input) ? issue.input.custom : undefined;
  if (Array.isArray(custom) && (custom.length < 2 || custom.length > CUSTOM_PULSE_MAX_POINTS)) {
    return `custom: must be a list of 2–${CUSTOM_PULSE_MAX_POINTS} points [time_s, amplitude] (got ${show(custom)})`;
  }
  return `must be "rectangle", "half-sine" or {"custom": [[time_s, amplitude], …]} (got ${show(issue.input)})`;
};

const shapeSchema = z.union(
  [z.enum(['rectangle', 'half-sine'], { error: shapeMessage }), z.strictObject({ custom: customPointsSchema }, { error: objectMessage })],
  { error: shapeMessage },
);

const heaterSchema = z
  .strictObject(
    {
      geometry: oneOf(['planar', 'disk', 'point']),
      area_m2: num({ range: PLAN_LIMITS.heaterArea_m2, unit: 'm²' }).optional(),
      radius_m: num({ range: PLAN_LIMITS.heaterRadius_m, unit: 'm' }).optional(),
      power_W: num({ range: PLAN_LIMITS.power_W, unit: 'W' }).optional(),
      flux_W_m2: num({ range: FLUX_RANGE_W_M2, unit: 'W/m²' }).optional(),
      shape: shapeSchema,
      width_s: num({ range: PULSE_WIDTH_RANGE_S, unit: 's' }).optional(),
      riseTime_s: num({ range: [0, PULSE_WIDTH_RANGE_S[1]], unit: 's' }).optional(),
      repetitionRate_Hz: num({ range: PLAN_LIMITS.repetitionRate_Hz, unit: 'Hz' }),
      averages: num({ range: PLAN_LIMITS.averages, unit: '', integer: true }),
    },
    { error: objectMessage },
  )
  .superRefine((h, ctx) => {
    const issue = (path: string[], message: string): void => ctx.addIssue({ code: 'custom', path, message });
    // Size: area for planar and point heaters, radius for a disk.
    if (h.geometry === 'disk') {
      if (h.radius_m === undefined) issue(['radius_m'], `required for a disk heater, ${formatPlanRange(...PLAN_LIMITS.heaterRadius_m, 'm')}`);
      if (h.area_m2 !== undefined) issue(['area_m2'], 'not used for a disk heater (its area is πr²); give radius_m only');
    } else if (h.geometry === 'planar' || h.geometry === 'point') {
      if (h.area_m2 === undefined) issue(['area_m2'], `required for a ${h.geometry} heater, ${formatPlanRange(...PLAN_LIMITS.heaterArea_m2, 'm²')}`);
      if (h.radius_m !== undefined) issue(['radius_m'], `only for a disk heater; a ${h.geometry} heater takes area_m2`);
    }
    // Drive: power or flux, and the power a flux gives must be in the kernel's range.
    if (h.power_W !== undefined && h.flux_W_m2 !== undefined) issue([], 'give power_W or flux_W_m2, not both');
    if (h.power_W === undefined && h.flux_W_m2 === undefined) {
      issue([], `give the peak power_W (${formatPlanRange(...PLAN_LIMITS.power_W, 'W')}) or the heat flux_W_m2`);
    }
    const area = heaterArea(h);
    if (isNumber(h.flux_W_m2) && area !== null) {
      const power = h.flux_W_m2 * area;
      const [min, max] = PLAN_LIMITS.power_W;
      if (power < min || power > max) {
        issue(['flux_W_m2'], `flux × area gives ${formatValue(power, 'W')}, outside the heater power range ${formatPlanRange(min, max, 'W')}`);
      }
    }
    // Width and rise time, as the shape needs them.
    const usesWidth = h.shape === 'rectangle' || h.shape === 'half-sine';
    if (usesWidth && h.width_s === undefined) issue(['width_s'], `required for a ${h.shape} pulse, ${formatPlanRange(...PULSE_WIDTH_RANGE_S, 's')}`);
    if (h.shape === 'rectangle') {
      const widthOk = isNumber(h.width_s) && h.width_s >= PULSE_WIDTH_RANGE_S[0] && h.width_s <= PULSE_WIDTH_RANGE_S[1];
      if (h.riseTime_s === undefined) issue(['riseTime_s'], 'required for a rectangle pulse, above 0 and at most width_s');
      else if (widthOk && isNumber(h.width_s) && isNumber(h.riseTime_s)) {
        const lowest = h.width_s * MIN_RISE_FRACTION;
        if (h.riseTime_s < lowest || h.riseTime_s > h.width_s) {
          issue(['riseTime_s'], `must be ${formatPlanRange(lowest, h.width_s, 's')} (a millionth of width_s up to width_s) (got ${plain(h.riseTime_s)})`);
        }
      }
    }
  }, ON_ANY_OBJECT);

const sensorSchema = z
  .strictObject(
    {
      id: text(MAX_ID_CHARS),
      label: text(MAX_LABEL_CHARS),
      distance_m: num({ range: PATH_LENGTH_RANGE_M, unit: 'm' }).optional(),
      position_m: z
        .tuple(
          [
            num({ range: SENSOR_COORDINATE_RANGE_M, unit: 'm' }),
            num({ range: SENSOR_COORDINATE_RANGE_M, unit: 'm' }),
            num({ range: SENSOR_COORDINATE_RANGE_M, unit: 'm' }),
          ],
          { error: (issue) => `must be [x, y, z] in metres (got ${show(issue.input)})` },
        )
        .optional(),
      distanceSd_m: num({ range: PLAN_LIMITS.distanceSd_m, unit: 'm' }),
      area_m2: num({ range: PLAN_LIMITS.sensorArea_m2, unit: 'm²' }),
      responsivity_V_K: num({ range: PLAN_LIMITS.responsivity_V_K, unit: 'V/K' }),
      noise_V: num({ range: PLAN_LIMITS.noise_V, unit: 'V' }),
      lag_s: num({ range: PLAN_LIMITS.lag_s, unit: 's' }),
    },
    { error: objectMessage },
  )
  .superRefine((s, ctx) => {
    if (s.distance_m !== undefined && s.position_m !== undefined) {
      ctx.addIssue({ code: 'custom', path: [], message: 'give distance_m or position_m, not both' });
    }
    if (s.distance_m === undefined && s.position_m === undefined) {
      ctx.addIssue({ code: 'custom', path: [], message: `give distance_m on the heater axis (${formatPlanRange(...PATH_LENGTH_RANGE_M, 'm')}) or position_m [x, y, z]` });
    }
    const z0 = Array.isArray(s.position_m) ? s.position_m[2] : undefined;
    if (isNumber(z0) && !(z0 > 0)) {
      ctx.addIssue({ code: 'custom', path: ['position_m', 2], message: `must be above 0: the sensor sits in front of the heater, which faces +z (got ${plain(z0)})` });
    }
  }, ON_ANY_OBJECT);

const sensorsSchema = list(sensorSchema, PLAN_LIMITS.sensorCount[0], PLAN_LIMITS.sensorCount[1], 'sensors').superRefine((sensors, ctx) => {
  const seen = new Map<string, number>();
  sensors.forEach((sensor, i) => {
    const id = isRecord(sensor) ? sensor.id : undefined;
    if (typeof id !== 'string') return;
    // Ids that differ only by invisible characters or compatibility forms look the same to a reader.
    const key = visibleForm(id);
    const first = seen.get(key);
    if (first === undefined) seen.set(key, i);
    else if (key === id && sensors[first]?.id === id) ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `"${id}" is already the id of sensors[${first}]; ids must be unique` });
    else ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `${JSON.stringify(id)} looks the same as the id of sensors[${first}] (they differ only by invisible or look-alike characters); ids must differ visibly` });
  });
}, ON_ANY_LIST);

const reflectorSchema = z.strictObject(
  {
    label: text(MAX_LABEL_CHARS),
    axis: oneOf(['x', 'y', 'z']),
    position_m: num({ range: PLANE_POSITION_RANGE_M, unit: 'm' }),
    reflection: num({ range: [-1, 1], unit: '' }),
  },
  { error: objectMessage },
);

const SPACER_IDS = SPACER_MATERIALS.map((m) => m.id) as [string, ...string[]];

const digitiserSchema = z
  .strictObject(
    {
      sampleRate_Hz: num({ range: PLAN_LIMITS.sampleRate_Hz, unit: 'Hz' }),
      recordLength_s: num({ range: PLAN_LIMITS.recordLength_s, unit: 's' }),
      preTrigger_s: num({ range: PLAN_LIMITS.preTrigger_s, unit: 's' }),
    },
    { error: objectMessage },
  )
  .superRefine((d, ctx) => {
    if (isNumber(d.preTrigger_s) && isNumber(d.recordLength_s) && d.preTrigger_s > d.recordLength_s) {
      ctx.addIssue({ code: 'custom', path: ['preTrigger_s'], message: `must be at most recordLength_s (${formatValue(d.recordLength_s, 's')}) (got ${plain(d.preTrigger_s)})` });
    }
  }, ON_ANY_OBJECT);

/** The schema of a version-1 plan file. */
export const PLAN_FILE_SCHEMA = z.strictObject(
  {
    format: z.literal(PLAN_FORMAT, { error: `must be "${PLAN_FORMAT}"` }),
    version: z.literal(CURRENT_PLAN_VERSION, { error: `must be ${CURRENT_PLAN_VERSION}` }),
    name: text(MAX_NAME_CHARS),
    notes: z
      .string({ error: (issue) => `must be text (got ${show(issue.input)})` })
      .max(MAX_NOTES_CHARS, { error: `must be at most ${MAX_NOTES_CHARS} characters` })
      .optional(),
    bath: bathSchema,
    heater: heaterSchema,
    sensors: sensorsSchema,
    spacer: z.strictObject({ materialId: oneOf(SPACER_IDS), measuredWarm: flag() }, { error: objectMessage }),
    reflectors: list(reflectorSchema, 0, MAX_REFLECTORS, 'reflecting planes'),
    echoOrder: num({ range: [0, MAX_ECHO_ORDER], unit: '', integer: true }),
    digitiser: digitiserSchema,
    targets: z.strictObject(
      {
        snr: num({ range: PLAN_LIMITS.snr, unit: '' }),
        temperatureSd_K: num({ range: PLAN_LIMITS.temperatureSd_K, unit: 'K' }),
      },
      { error: objectMessage },
    ),
  },
  { error: objectMessage },
);

/** The schema's output and the documented {@link PlanFile} must describe the same thing (checked by tsc). */
type MutuallyAssignable<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const schemaMatchesInterface: MutuallyAssignable<z.output<typeof PLAN_FILE_SCHEMA>, PlanFile> = true;
void schemaMatchesInterface;

function heaterArea(h: { geometry?: unknown; area_m2?: unknown; radius_m?: unknown }): number | null {
  if (h.geometry === 'disk') return isNumber(h.radius_m) ? Math.PI * h.radius_m * h.radius_m : null;
  return isNumber(h.area_m2) ? h.area_m2 : null;
}

// ---------------------------------------------------------------------------------------------
// Versions.

/** A step that turns a plan of one version (its key in the table) into the next version. */
export type PlanMigration = (plan: Record<string, unknown>) => Record<string, unknown>;

/**
 * Steps from older versions, keyed by the version they start from. Version 1 is the first, so the
 * table is empty; when version 2 arrives, `1: (plan) => …` goes here and old files keep loading.
 */
export const PLAN_MIGRATIONS: Readonly<Record<number, PlanMigration>> = {};

/**
 * Brings a plan from `fromVersion` up to `toVersion` through the migration table, one version at a
 * time (each step's result gets the next version number). Returns the messages if a step is missing.
 */
export function migratePlan(
  plan: Record<string, unknown>,
  fromVersion: number,
  migrations: Readonly<Record<number, PlanMigration>> = PLAN_MIGRATIONS,
  toVersion: number = CURRENT_PLAN_VERSION,
): { ok: true; plan: Record<string, unknown> } | { ok: false; errors: string[] } {
  let current = plan;
  for (let version = fromVersion; version < toVersion; version++) {
    const step = Object.hasOwn(migrations, version) ? migrations[version] : undefined;
    if (!step) return { ok: false, errors: [`version: no way to read version ${version} files (this Sekundo reads version ${toVersion})`] };
    current = { ...step(current), version: version + 1 };
  }
  return { ok: true, plan: current };
}

// ---------------------------------------------------------------------------------------------
// Reading.

const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** `sensors[2].label`, `heater.shape.custom[3][0]`, `bath["odd key"]`, or `plan` for the whole file. */
export function formatPlanPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else if (typeof key === 'string' && IDENTIFIER.test(key)) out += out === '' ? key : `.${key}`;
    else out += `[${JSON.stringify(String(key))}]`;
  }
  return out === '' ? 'plan' : out;
}

/** The deepest nesting of arrays and objects in JSON text, outside strings; stops early past `limit`. */
function nestingDepth(text: string, limit: number): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      depth++;
      if (depth > deepest) deepest = depth;
      if (deepest > limit) return deepest;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return deepest;
}

/** "line 3, column 7" for a character offset. */
function lineAndColumn(text: string, offset: number): string {
  const before = text.slice(0, offset).split('\n');
  return `line ${before.length}, column ${(before[before.length - 1] ?? '').length + 1}`;
}

function jsonProblem(text: string, error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  const position = /at position (\d+)/.exec(message);
  const where = position && !/\bline\b/.test(message) ? ` (${lineAndColumn(text, Number(position[1]))})` : '';
  return `plan: not valid JSON: ${message}${where}`;
}

/** Paths of keys that mean something to JavaScript objects (`__proto__`, `constructor`, `prototype`). */
function forbiddenKeys(value: unknown, path: PropertyKey[] = [], found: string[] = []): string[] {
  if (Array.isArray(value)) {
    value.forEach((item, i) => {
      forbiddenKeys(item, [...path, i], found);
    });
  } else if (isRecord(value)) {
    for (const key of Object.keys(value)) {
      if (FORBIDDEN_KEYS.has(key)) found.push(`${formatPlanPath([...path, key])}: this key is not allowed in a plan file`);
      else forbiddenKeys(value[key], [...path, key], found);
    }
  }
  return found;
}

/** Field names a strict object at `path` in the schema knows, for "unknown field" messages. */
function knownKeysAt(path: readonly PropertyKey[]): string[] {
  let schemas: z.ZodType[] = [PLAN_FILE_SCHEMA];
  for (const key of path) {
    schemas = schemas.flatMap((s) => childSchemas(s, key));
  }
  const objects = schemas.flatMap(function objectsIn(s: z.ZodType): z.ZodType[] {
    const inner = unwrap(s);
    return inner instanceof z.ZodUnion ? (inner.options as z.ZodType[]).flatMap(objectsIn) : [inner];
  });
  const keys = objects.flatMap((s) => (s instanceof z.ZodObject ? Object.keys(s.shape) : []));
  return [...new Set(keys)];
}

function unwrap(schema: z.ZodType): z.ZodType {
  return schema instanceof z.ZodOptional ? unwrap(schema.unwrap() as z.ZodType) : schema;
}

function childSchemas(schema: z.ZodType, key: PropertyKey): z.ZodType[] {
  const s = unwrap(schema);
  if (s instanceof z.ZodObject && typeof key === 'string' && Object.hasOwn(s.shape, key)) return [s.shape[key] as z.ZodType];
  if (s instanceof z.ZodArray && typeof key === 'number') return [s.element as z.ZodType];
  if (s instanceof z.ZodTuple && typeof key === 'number') return [(s.def.items as z.ZodType[])[key]].filter((x): x is z.ZodType => x !== undefined);
  if (s instanceof z.ZodUnion) return (s.options as z.ZodType[]).flatMap((o) => childSchemas(o, key));
  return [];
}

/** Field-level messages for zod's issues; unions report the branch that matches the value's kind. */
function issueMessages(issues: readonly z.core.$ZodIssue[], prefix: readonly PropertyKey[] = []): string[] {
  return issues.flatMap((issue) => {
    const path = [...prefix, ...issue.path];
    if (issue.code === 'unrecognized_keys') {
      const known = knownKeysAt(path);
      const hint = known.length > 0 ? `; known fields: ${known.join(', ')}` : '';
      return issue.keys.map((key) => `${formatPlanPath([...path, key])}: unknown field${hint}`);
    }
    if (issue.code === 'invalid_union') {
      const matching = issue.errors.filter((branch) => !branch.some((b) => b.path.length === 0 && b.code === 'invalid_type'));
      const branch = matching.length === 1 ? matching[0] : undefined;
      if (branch) return issueMessages(branch, path);
    }
    return [`${formatPlanPath(path)}: ${issue.message}`];
  });
}

function capped(errors: string[]): string[] {
  if (errors.length <= MAX_PLAN_MESSAGES) return errors;
  return [...errors.slice(0, MAX_PLAN_MESSAGES), `… and ${errors.length - MAX_PLAN_MESSAGES} more problems`];
}

/**
 * Reads a plan file. Never throws: on any problem returns `{ok: false, errors}`, one
 * `field: message` per problem (JSON syntax, nesting, forbidden keys, format and version, then every
 * field the schema refuses). Older versions are brought up to date through {@link PLAN_MIGRATIONS}.
 */
export function parsePlanFile(text: string): PlanFileParse {
  if (typeof text !== 'string') return { ok: false, errors: ['plan: expected the text of a plan file'] };
  if (text.length > MAX_PLAN_FILE_CHARS) {
    return { ok: false, errors: [`plan: the file has ${text.length} characters, more than the ${MAX_PLAN_FILE_CHARS} a plan file may have`] };
  }
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (nestingDepth(body, MAX_PLAN_NESTING) > MAX_PLAN_NESTING) {
    return { ok: false, errors: [`plan: nested more than ${MAX_PLAN_NESTING} levels deep; a plan file needs at most 5`] };
  }
  let raw: unknown;
  try {
    raw = JSON.parse(body);
  } catch (error) {
    return { ok: false, errors: [jsonProblem(body, error)] };
  }
  if (!isRecord(raw)) return { ok: false, errors: [`plan: must be a JSON object {"format": "${PLAN_FORMAT}", …} (got ${show(raw)})`] };
  const forbidden = forbiddenKeys(raw);
  if (forbidden.length > 0) return { ok: false, errors: capped(forbidden) };
  if (raw.format !== PLAN_FORMAT) {
    return { ok: false, errors: [`format: must be "${PLAN_FORMAT}" (got ${show(raw.format)}); is this a Sekundo plan file?`] };
  }
  const version = raw.version;
  const readable = CURRENT_PLAN_VERSION === 1 ? 'version 1' : `versions 1–${CURRENT_PLAN_VERSION}`;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    return { ok: false, errors: [`version: must be a whole number; this Sekundo reads ${readable} (got ${show(version)})`] };
  }
  if (version > CURRENT_PLAN_VERSION) {
    return { ok: false, newerVersion: version, errors: [`version: this file is version ${version}, written by a newer Sekundo; this one reads ${readable} (reload the page to get the newer app)`] };
  }
  const migrated = migratePlan(raw, version);
  if (!migrated.ok) return migrated;
  const result = PLAN_FILE_SCHEMA.safeParse(migrated.plan, { reportInput: true });
  if (!result.success) return { ok: false, errors: capped(issueMessages(result.error.issues)) };
  return { ok: true, plan: result.data as PlanFile };
}

// ---------------------------------------------------------------------------------------------
// Writing.

/**
 * Arrays of numbers only ([x, y, z], [t, a]) print on one line. Only arrays the indenter spread
 * over lines match (a JSON string cannot hold a raw line break), so text in strings is untouched.
 */
const NUMBER_ARRAY = /\[\n\s*(-?\d[\d.eE+-]*(?:,\n\s*-?\d[\d.eE+-]*)*)\n\s*\]/g;

/**
 * The file text of a plan: the schema's field order, two-space indent, numeric lists on one line,
 * a final newline. Throws TypeError if the plan is not valid (a programming error: build plans from
 * {@link parsePlanFile} or check them with {@link PLAN_FILE_SCHEMA}).
 */
export function serializePlanFile(plan: PlanFile): string {
  const checked = PLAN_FILE_SCHEMA.safeParse(plan);
  if (!checked.success) throw new TypeError(`not a valid plan: ${issueMessages(checked.error.issues).join('; ')}`);
  const text = JSON.stringify(checked.data, null, 2).replace(NUMBER_ARRAY, (_, items: string) => `[${items.split(/,\s*/).join(', ')}]`);
  return `${text}\n`;
}

// ---------------------------------------------------------------------------------------------
// To the kernel.

/** The bath temperature a plan gives, and where it came from. */
export interface PlanBath {
  temperature_K: number;
  /** The vapour-pressure reading it was converted from, Pa; null when the temperature was given. */
  vapourPressure_Pa: number | null;
  /** Scale of that conversion; null when the temperature was given. */
  scale: VapourPressureScale | null;
}

/**
 * The bath temperature of a plan: as given, or converted from the vapour-pressure reading (ITS-90
 * from 1.25 K, the reference spline below). Throws the kernel's errors for a pressure out of range.
 */
export function planBath(plan: PlanFile): PlanBath {
  const { temperature_K, vapourPressure_Pa } = plan.bath;
  if (temperature_K !== undefined) return { temperature_K, vapourPressure_Pa: null, scale: null };
  const converted = temperatureFromVapourPressure(vapourPressure_Pa as number);
  return { temperature_K: converted.temperature_K, vapourPressure_Pa: converted.pressure_Pa, scale: converted.scale };
}

function pulseShape(shape: PlanFileShape): PulseShape {
  if (shape === 'rectangle' || shape === 'half-sine') return { kind: shape };
  return { kind: 'custom', points: shape.custom };
}

/**
 * The kernel's input for a plan file: the temperature from the reading, power from flux × area,
 * on-axis distances as positions [0, 0, d], area and radius of the heater filled in from each other.
 * Throws the kernel's errors only for what the schema cannot see (none are known today).
 */
export function planFileToInput(plan: PlanFile): PlanInput {
  const h = plan.heater;
  const area = h.geometry === 'disk' ? Math.PI * (h.radius_m as number) ** 2 : (h.area_m2 as number);
  const radius = h.geometry === 'disk' ? (h.radius_m as number) : Math.sqrt(area / Math.PI);
  const power = h.power_W ?? (h.flux_W_m2 as number) * area;
  const shape = pulseShape(h.shape);
  const width = shape.kind === 'custom' ? (shape.points[shape.points.length - 1]?.[0] ?? 0) : (h.width_s as number);
  return {
    temperature_K: planBath(plan).temperature_K,
    liquidDepth_m: plan.bath.liquidDepth_m,
    heater: {
      geometry: h.geometry,
      area_m2: area,
      radius_m: radius,
      power_W: power,
      shape,
      width_s: width,
      riseTime_s: h.riseTime_s ?? width,
      repetitionRate_Hz: h.repetitionRate_Hz,
      averages: h.averages,
    },
    sensors: plan.sensors.map((s) => ({
      id: s.id,
      label: s.label,
      position_m: s.position_m ?? [0, 0, s.distance_m as number],
      distanceSd_m: s.distanceSd_m,
      area_m2: s.area_m2,
      responsivity_V_K: s.responsivity_V_K,
      noise_V: s.noise_V,
      lag_s: s.lag_s,
    })),
    spacer: { materialId: plan.spacer.materialId, measuredWarm: plan.spacer.measuredWarm },
    reflectors: plan.reflectors.map((r) => ({ label: r.label, axis: r.axis, position_m: r.position_m, reflection: r.reflection })),
    echoOrder: plan.echoOrder,
    digitiser: { ...plan.digitiser },
    targets: { ...plan.targets },
  };
}

const SENSOR_FIELDS: Readonly<Record<string, string>> = { area: 'area_m2', responsivity: 'responsivity_V_K', noise: 'noise_V', lag: 'lag_s' };

/** Kernel quantity names (as its errors give them) and the plan-file field each comes from. */
const KERNEL_FIELDS: readonly (readonly [RegExp, (m: RegExpExecArray) => string])[] = [
  [/^bath temperature$/, () => 'bath'],
  [/^(saturated )?vapour pressure/, () => 'bath.vapourPressure_Pa'],
  [/^liquid depth$/, () => 'bath.liquidDepth_m'],
  [/^heater radius$/, () => 'heater.radius_m'],
  [/^heater area$/, () => 'heater.area_m2'],
  [/^heater power$/, () => 'heater'],
  [/^pulse width$/, () => 'heater.width_s'],
  [/^rise time$/, () => 'heater.riseTime_s'],
  [/^pulse points$/, () => 'heater.shape.custom'],
  [/^repetition rate$/, () => 'heater.repetitionRate_Hz'],
  [/^pulses averaged$/, () => 'heater.averages'],
  [/^number of sensors$/, () => 'sensors'],
  [/^sensor (\d+) \(.*\) ([xyz])$/, (m) => `sensors[${Number(m[1]) - 1}].position_m`],
  [/^sensor (\d+) \(.*\) distance uncertainty$/, (m) => `sensors[${Number(m[1]) - 1}].distanceSd_m`],
  [/^sensor (\d+) \(.*\) (area|responsivity|noise|lag)$/, (m) => `sensors[${Number(m[1]) - 1}].${SENSOR_FIELDS[m[2] ?? ''] ?? ''}`],
  [/^spacer material$/, () => 'spacer.materialId'],
  [/^reflection of plane (\d+)$/, (m) => `reflectors[${Number(m[1]) - 1}].reflection`],
  [/^position of plane (\d+)$/, (m) => `reflectors[${Number(m[1]) - 1}].position_m`],
  [/^echo order$/, () => 'echoOrder'],
  [/^sample rate$/, () => 'digitiser.sampleRate_Hz'],
  [/^record length$/, () => 'digitiser.recordLength_s'],
  [/^pre-trigger$/, () => 'digitiser.preTrigger_s'],
  [/^target SNR$/, () => 'targets.snr'],
  [/^target temperature sd$/, () => 'targets.temperatureSd_K'],
];

/**
 * A readable one-line message for an error thrown while turning a plan into results (planBath,
 * planFileToInput, computePlan): the kernel's own message, led by the plan-file field it concerns
 * when that is known. Other errors (bugs) are described as they are.
 */
export function explainPlanError(error: unknown): string {
  if (!(error instanceof PhysicsError)) return error instanceof Error ? `${error.name}: ${error.message}` : String(error);
  const quantity =
    error instanceof OutOfRangeError || error instanceof NonFiniteInputError ? error.quantity : error instanceof InvalidInputError ? error.field : '';
  for (const [pattern, field] of KERNEL_FIELDS) {
    const match = pattern.exec(quantity);
    if (match) return `${field(match)}: ${error.message}`;
  }
  return `plan: ${error.message}`;
}
