/**
 * The plan file: Sekundo's own versioned JSON format for a measurement plan — reading (with
 * migration from older versions), writing, and turning a plan into the kernel's input. The format
 * itself (fields, limits) is in plan-file-types.ts, its schema in plan-file-schema.ts, older
 * versions in plan-migrations.ts; this module is the one the rest of the app imports.
 */
import { z } from 'zod';
import {
  InvalidInputError,
  NonFiniteInputError,
  OutOfRangeError,
  PhysicsError,
  type PlanInput,
  type PulseShape,
  temperatureFromVapourPressure,
  type VapourPressureScale,
} from '../physics';
import { isRecord, PLAN_FILE_SCHEMA, planHeaterArea } from './plan-file-schema';
import {
  CURRENT_PLAN_VERSION,
  FORBIDDEN_KEYS,
  MAX_PLAN_FILE_CHARS,
  MAX_PLAN_MESSAGES,
  MAX_PLAN_NESTING,
  PLAN_FORMAT,
  type PlanFile,
  type PlanFileParse,
  type PlanFileShape,
} from './plan-file-types';
import { migratePlan } from './plan-migrations';
import { withCheckedPointsShort } from './plan-points-check';
import { show } from './plan-range-text';

export * from './plan-file-types';
export { PLAN_FILE_SCHEMA, planHeaterArea, visibleForm } from './plan-file-schema';
export { migratePlan, PLAN_MIGRATIONS, type PlanMigration, planV1toV2 } from './plan-migrations';
export { formatPlanRange } from './plan-range-text';

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
  const readable = `versions 1–${CURRENT_PLAN_VERSION}`;
  // Older versions are read through plan-migrations.ts, with a note of what changed.
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
  return { ok: true, plan: result.data as PlanFile, migrated: migrated.notes };
}

/**
 * What the schema refuses in a plan already in memory (the page's plan after an edit), one
 * `field: message` each as {@link parsePlanFile} words them; an empty list when it passes. No text
 * to read: the plan's own objects are checked (a long custom pulse's points by a plain loop), which
 * the page does on every keystroke.
 */
export function planObjectProblems(plan: PlanFile): string[] {
  const result = PLAN_FILE_SCHEMA.safeParse(withCheckedPointsShort(plan).plan, { reportInput: true });
  return result.success ? [] : capped(issueMessages(result.error.issues));
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
  // A long custom pulse's points are checked by a plain loop, the rest by the schema (the page
  // writes its autosave after each pause in typing; the schema takes long over 10 000 points).
  const short = withCheckedPointsShort(plan);
  const checked = PLAN_FILE_SCHEMA.safeParse(short.plan);
  if (!checked.success) throw new TypeError(`not a valid plan: ${issueMessages(checked.error.issues).join('; ')}`);
  const data = short.points === null ? checked.data : { ...checked.data, heater: { ...checked.data.heater, shape: short.points } };
  const text = JSON.stringify(data, null, 2).replace(NUMBER_ARRAY, (_, items: string) => `[${items.split(/,\s*/).join(', ')}]`);
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
export function planBath(plan: Pick<PlanFile, 'bath'>): PlanBath {
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
 * on-axis distances as positions [0, 0, d], the heater's size for its geometry, planes without a
 * typed R as solid walls. Throws the kernel's errors only for what the schema cannot see.
 */
export function planFileToInput(plan: PlanFile): PlanInput {
  const h = plan.heater;
  const area = planHeaterArea(h) as number;
  const power = h.power_W ?? (h.flux_W_m2 as number) * area;
  const shape = pulseShape(h.shape);
  const width = shape.kind === 'custom' ? (shape.points[shape.points.length - 1]?.[0] ?? 0) : (h.width_s as number);
  return {
    temperature_K: planBath(plan).temperature_K,
    liquidDepth_m: plan.bath.liquidDepth_m,
    heater: {
      geometry: h.geometry,
      width_m: h.width_m ?? 0,
      height_m: h.height_m ?? 0,
      radius_m: h.radius_m ?? 0,
      mount: h.mount ?? 'wall',
      area_m2: area,
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
    reflectors: plan.reflectors.map((r) => ({ label: r.label, axis: r.axis, position_m: r.position_m, reflection: r.reflection ?? null })),
    echoOrder: plan.echoOrder,
    digitiser: { ...plan.digitiser },
    targets: { ...plan.targets, temperatureKind: plan.targets.temperatureKind },
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
  [/^heater width$/, () => 'heater.width_m'],
  [/^heater height$/, () => 'heater.height_m'],
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
