/**
 * The schema of a plan file (zod), with messages that quote each field's valid range. Types and
 * limits: plan-file-types.ts; reading a file through it: plan-file.ts.
 */
import { z } from 'zod';
import { CUSTOM_PULSE_MAX_POINTS, MAX_ECHO_ORDER, PATH_LENGTH_RANGE_M, PLAN_LIMITS, PULSE_WIDTH_RANGE_S, SPACER_MATERIALS } from '../physics';
import {
  BATH_PRESSURE_RANGE_PA,
  CURRENT_PLAN_VERSION,
  CUSTOM_AMPLITUDE_RANGE,
  FLUX_RANGE_W_M2,
  MAX_ID_CHARS,
  MAX_LABEL_CHARS,
  MAX_NAME_CHARS,
  MAX_NOTES_CHARS,
  MAX_REFLECTORS,
  MIN_RISE_FRACTION,
  PLAN_FORMAT,
  PLANE_POSITION_RANGE_M,
  type PlanFile,
  type PlanFileHeater,
  SENSOR_COORDINATE_RANGE_M,
} from './plan-file-types';
import { formatPlanRange, formatValue, plain, show } from './plan-range-text';

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

/** A text as a reader sees it: compatibility forms folded (NFKC), invisible format characters dropped. */
export function visibleForm(text: string): string {
  return text.normalize('NFKC').replace(/\p{Cf}/gu, '');
}

export function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

export function isNumber(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

/** Runs a cross-field check on an object even when some of its fields failed (so all problems show). */
const ON_ANY_OBJECT = { when: (payload: { value: unknown }) => isRecord(payload.value) };
const ON_ANY_LIST = { when: (payload: { value: unknown }) => Array.isArray(payload.value) };

function objectMessage(issue: { input?: unknown }): string {
  return issue.input === undefined ? 'required' : `must be an object {…} (got ${show(issue.input)})`;
}

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
      geometry: oneOf(['rectangle', 'disk', 'point']),
      width_m: num({ range: PLAN_LIMITS.heaterSide_m, unit: 'm' }).optional(),
      height_m: num({ range: PLAN_LIMITS.heaterSide_m, unit: 'm' }).optional(),
      radius_m: num({ range: PLAN_LIMITS.heaterRadius_m, unit: 'm' }).optional(),
      mount: oneOf(['wall', 'free']).optional(),
      area_m2: num({ range: PLAN_LIMITS.heaterArea_m2, unit: 'm²' }).optional(),
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
    // Size: width × height for a rectangle, radius for a disk, mount and nominal area for a point.
    const fields: Record<PlanFileHeater['geometry'], readonly (keyof PlanFileHeater)[]> = {
      rectangle: ['width_m', 'height_m'],
      disk: ['radius_m'],
      point: ['mount', 'area_m2'],
    };
    const sizeKeys = ['width_m', 'height_m', 'radius_m', 'mount', 'area_m2'] as const;
    const wanted = fields[h.geometry as PlanFileHeater['geometry']];
    if (wanted) {
      for (const key of wanted) {
        if (h[key] === undefined) issue([key], `required for a ${h.geometry} heater${sizeHint(key)}`);
      }
      for (const key of sizeKeys) {
        if (!wanted.includes(key) && h[key] !== undefined) issue([key], `not used for a ${h.geometry} heater; give ${wanted.join(' and ')}`);
      }
    }
    // Drive: power or flux, and the power a flux gives must be in the kernel's range.
    if (h.power_W !== undefined && h.flux_W_m2 !== undefined) issue([], 'give power_W or flux_W_m2, not both');
    if (h.power_W === undefined && h.flux_W_m2 === undefined) {
      issue([], `give the peak power_W (${formatPlanRange(...PLAN_LIMITS.power_W, 'W')}) or the heat flux_W_m2`);
    }
    const area = planHeaterArea(h);
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

function sizeHint(key: keyof PlanFileHeater): string {
  if (key === 'width_m' || key === 'height_m') return `, ${formatPlanRange(...PLAN_LIMITS.heaterSide_m, 'm')}`;
  if (key === 'radius_m') return `, ${formatPlanRange(...PLAN_LIMITS.heaterRadius_m, 'm')}`;
  if (key === 'mount') return ': "wall" (radiates into 2π) or "free" (in the liquid, 4π)';
  if (key === 'area_m2') return ` (nominal, for the flux), ${formatPlanRange(...PLAN_LIMITS.heaterArea_m2, 'm²')}`;
  return '';
}

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
    else if (key === id && (sensors[first] as { id?: unknown } | undefined)?.id === id) ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `"${id}" is already the id of sensors[${first}]; ids must be unique` });
    else ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `${JSON.stringify(id)} looks the same as the id of sensors[${first}] (they differ only by invisible or look-alike characters); ids must differ visibly` });
  });
}, ON_ANY_LIST);

const reflectorSchema = z.strictObject(
  {
    label: text(MAX_LABEL_CHARS),
    axis: oneOf(['x', 'y', 'z']),
    position_m: num({ range: PLANE_POSITION_RANGE_M, unit: 'm' }),
    reflection: num({ range: [-1, 1], unit: '' }).optional(),
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

/** The schema of a plan file of the current version (older ones are migrated first). */
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
        temperatureKind: oneOf(['absolute', 'change']),
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

/** Area the heater's power is spread on, m², when the file gives enough to know it. */
export function planHeaterArea(h: { geometry?: unknown; width_m?: unknown; height_m?: unknown; area_m2?: unknown; radius_m?: unknown }): number | null {
  if (h.geometry === 'disk') return isNumber(h.radius_m) ? Math.PI * h.radius_m * h.radius_m : null;
  if (h.geometry === 'rectangle') return isNumber(h.width_m) && isNumber(h.height_m) ? h.width_m * h.height_m : null;
  return isNumber(h.area_m2) ? h.area_m2 : null;
}
