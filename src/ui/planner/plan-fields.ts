/**
 * The planner's field specs: each is a FieldSpec (src/ui/fields) with what it edits in the plan
 * file, and a valid range that may depend on the rest of the plan (the rise time is at most the
 * pulse width). use-plan-field.ts binds them to the store for QuantityField; the planner applies a
 * typed value only when the whole plan then checks out.
 */
import { FLUX_RANGE_W_M2, type PlanFile, type PlanFileReflector, type PlanFileSensor } from '../../io/plan-file';
import {
  MAX_ECHO_ORDER,
  PATH_LENGTH_RANGE_M,
  PLAN_LIMITS,
  PROPERTIES_RANGE_K,
  PULSE_WIDTH_RANGE_S,
  VAPOUR_PRESSURE_RANGE_PA,
  vapourPressure,
} from '../../physics';
import { type FieldSpec, fieldRangeText as specRangeText, type Range } from '../fields/field-spec';
import { KINDS, type QuantityKind } from '../units/ladders';

export type { Range };

/** A change to the plan, or why it was refused. */
export type PlanEdit = { ok: true; plan: PlanFile } | { ok: false; message: string };

/** A planner field: a FieldSpec whose range may follow the plan, and how it reads and sets the plan. */
export interface NumberField extends Omit<FieldSpec, 'range'> {
  /** Key of the field on the page (its help, its draft under "planner."); unique. */
  key: string;
  /** Valid range in SI, possibly depending on the rest of the plan. */
  range: Range | ((plan: PlanFile) => Range);
  get(plan: PlanFile): number | undefined;
  set(plan: PlanFile, value: number): PlanFile;
}

/** The field's valid range against `plan`. */
export function rangeOf(field: NumberField, plan: PlanFile): Range {
  return typeof field.range === 'function' ? field.range(plan) : field.range;
}

/** The field as a FieldSpec with the given range. */
export function specWithRange(field: NumberField, range: Range): FieldSpec {
  const { key: _key, get: _get, set: _set, range: _range, ...spec } = field;
  return { ...spec, range };
}

/** The field as a FieldSpec with its range against `plan`. */
export function planFieldSpec(field: NumberField, plan: PlanFile): FieldSpec {
  return specWithRange(field, rangeOf(field, plan));
}

/** The valid range of a field as people read it: "10 ns–10 s", "a whole number 1–10000000". */
export function fieldRangeText(field: NumberField, plan: PlanFile): string {
  return specRangeText(planFieldSpec(field, plan));
}

// ---------------------------------------------------------------------------------------------
// Bath

/** Highest vapour pressure the plan accepts: the one at the top of the kernel's temperature range. */
const MAX_BATH_PRESSURE_PA = vapourPressure(PROPERTIES_RANGE_K[1]).pressure_Pa;

export const BATH_FIELDS = {
  temperature: {
    key: 'bath.temperature',
    label: 'Bath temperature',
    kind: KINDS.temperature,
    range: PLAN_LIMITS.temperature_K,
    get: (p) => p.bath.temperature_K,
    set: (p, v) => ({ ...p, bath: { temperature_K: v, liquidDepth_m: p.bath.liquidDepth_m } }),
  },
  vapourPressure: {
    key: 'bath.vapourPressure',
    label: 'Vapour pressure',
    kind: KINDS.pressure,
    range: [VAPOUR_PRESSURE_RANGE_PA[0], MAX_BATH_PRESSURE_PA],
    get: (p) => p.bath.vapourPressure_Pa,
    set: (p, v) => ({ ...p, bath: { vapourPressure_Pa: v, liquidDepth_m: p.bath.liquidDepth_m } }),
  },
  liquidDepth: {
    key: 'bath.liquidDepth',
    label: 'Liquid depth',
    kind: KINDS.length,
    range: PLAN_LIMITS.liquidDepth_m,
    get: (p) => p.bath.liquidDepth_m,
    set: (p, v) => ({ ...p, bath: { ...p.bath, liquidDepth_m: v } }),
  },
} satisfies Record<string, NumberField>;

// ---------------------------------------------------------------------------------------------
// Heater

type HeaterKey = 'area_m2' | 'width_m' | 'height_m' | 'radius_m' | 'power_W' | 'flux_W_m2' | 'width_s' | 'riseTime_s' | 'repetitionRate_Hz' | 'averages';

function heaterField(key: HeaterKey, fieldKey: string, label: string, kind: QuantityKind | null, range: NumberField['range'], extra: Partial<NumberField> = {}): NumberField {
  return {
    key: `heater.${fieldKey}`,
    label,
    kind,
    range,
    get: (p) => p.heater[key],
    set: (p, v) => ({ ...p, heater: { ...p.heater, [key]: v } }),
    ...extra,
  };
}

export const HEATER_FIELDS = {
  area: heaterField('area_m2', 'area', 'Nominal area', KINDS.area, PLAN_LIMITS.heaterArea_m2),
  sideX: heaterField('width_m', 'sideX', 'Heater width', KINDS.length, PLAN_LIMITS.heaterSide_m),
  sideY: heaterField('height_m', 'sideY', 'Heater height', KINDS.length, PLAN_LIMITS.heaterSide_m),
  radius: heaterField('radius_m', 'radius', 'Heater radius', KINDS.length, PLAN_LIMITS.heaterRadius_m),
  power: heaterField('power_W', 'power', 'Peak power', KINDS.power, PLAN_LIMITS.power_W),
  flux: heaterField('flux_W_m2', 'flux', 'Peak heat flux', KINDS.heatFlux, FLUX_RANGE_W_M2),
  width: heaterField('width_s', 'width', 'Pulse width', KINDS.time, PULSE_WIDTH_RANGE_S),
  riseTime: heaterField('riseTime_s', 'riseTime', 'Rise time', KINDS.timeConstant, (p) => {
    const width = p.heater.width_s ?? PULSE_WIDTH_RANGE_S[1];
    return [width * 1e-6, width];
  }, { rangeNote: 'a millionth of the pulse width up to the width' }),
  repetitionRate: heaterField('repetitionRate_Hz', 'repetitionRate', 'Repetition rate', KINDS.frequency, PLAN_LIMITS.repetitionRate_Hz),
  averages: heaterField('averages', 'averages', 'Pulses averaged', null, PLAN_LIMITS.averages, { integer: true }),
} satisfies Record<string, NumberField>;

/** Custom pulse points: time from the onset and relative amplitude. */
export function pulsePointField(index: number, part: 0 | 1): NumberField {
  const points = (p: PlanFile) => (typeof p.heater.shape === 'object' ? p.heater.shape.custom : []);
  return {
    key: `pulse.${index}.${part === 0 ? 'time' : 'amplitude'}`,
    label: `Point ${index + 1} ${part === 0 ? 'time' : 'amplitude'}`,
    kind: part === 0 ? KINDS.time : null,
    range: part === 0 ? [0, PULSE_WIDTH_RANGE_S[1]] : [0, 1e9],
    get: (p) => points(p)[index]?.[part],
    set: (p, v) => {
      const next = points(p).map((point, i): [number, number] => (i !== index ? [point[0], point[1]] : part === 0 ? [v, point[1]] : [point[0], v]));
      return { ...p, heater: { ...p.heater, shape: { custom: next } } };
    },
  };
}

// ---------------------------------------------------------------------------------------------
// Sensors

type SensorNumberKey = 'distance_m' | 'distanceSd_m' | 'area_m2' | 'responsivity_V_K' | 'noise_V' | 'lag_s';

function updateSensor(p: PlanFile, index: number, change: (s: PlanFileSensor) => PlanFileSensor): PlanFile {
  return { ...p, sensors: p.sensors.map((s, i) => (i === index ? change(s) : s)) };
}

function sensorField(index: number, rowKey: string, key: SensorNumberKey, name: string, label: string, kind: QuantityKind, range: Range): NumberField {
  return {
    key: `sensor.${rowKey}.${name}`,
    label,
    kind,
    range,
    get: (p) => p.sensors[index]?.[key],
    set: (p, v) => updateSensor(p, index, (s) => ({ ...s, [key]: v })),
  };
}

const COORDINATE_RANGE: Range = [-PATH_LENGTH_RANGE_M[1], PATH_LENGTH_RANGE_M[1]];
/** z must be above 0 (the heater faces +z); the smallest accepted is the shortest path. */
const Z_RANGE: Range = [PATH_LENGTH_RANGE_M[0], PATH_LENGTH_RANGE_M[1]];

function coordinateField(index: number, rowKey: string, axis: 0 | 1 | 2): NumberField {
  const name = 'xyz'[axis] as string;
  return {
    key: `sensor.${rowKey}.${name}`,
    label: `Sensor ${index + 1} ${name}`,
    kind: KINDS.length,
    range: axis === 2 ? Z_RANGE : COORDINATE_RANGE,
    rangeNote: axis === 2 ? 'in front of the heater, which faces +z' : undefined,
    get: (p) => p.sensors[index]?.position_m?.[axis],
    set: (p, v) =>
      updateSensor(p, index, (s) => {
        const position: [number, number, number] = [...(s.position_m ?? [0, 0, s.distance_m ?? 0])];
        position[axis] = v;
        return { ...s, position_m: position };
      }),
  };
}

/** The numeric fields of sensor `index` (0-based) in the row with the stable key `rowKey`. */
export function sensorFields(index: number, rowKey: string) {
  const n = index + 1;
  const field = (key: SensorNumberKey, name: string, label: string, kind: QuantityKind, range: Range) =>
    sensorField(index, rowKey, key, name, `Sensor ${n} ${label}`, kind, range);
  return {
    distance: field('distance_m', 'distance', 'distance', KINDS.length, PATH_LENGTH_RANGE_M),
    x: coordinateField(index, rowKey, 0),
    y: coordinateField(index, rowKey, 1),
    z: coordinateField(index, rowKey, 2),
    distanceSd: field('distanceSd_m', 'distanceSd', 'distance sd', KINDS.lengthSd, PLAN_LIMITS.distanceSd_m),
    area: field('area_m2', 'area', 'area', KINDS.area, PLAN_LIMITS.sensorArea_m2),
    responsivity: field('responsivity_V_K', 'responsivity', 'responsivity', KINDS.responsivity, PLAN_LIMITS.responsivity_V_K),
    noise: field('noise_V', 'noise', 'noise', KINDS.voltage, PLAN_LIMITS.noise_V),
    lag: field('lag_s', 'lag', 'lag', KINDS.timeConstant, PLAN_LIMITS.lag_s),
  } satisfies Record<string, NumberField>;
}

// ---------------------------------------------------------------------------------------------
// Reflecting planes, echoes, digitiser, targets

/** Coordinates of reflecting planes, m (the plan file's range). */
export const PLANE_POSITION_RANGE_M: Range = [-100, 100];

function updateReflector(p: PlanFile, index: number, change: (r: PlanFileReflector) => PlanFileReflector): PlanFile {
  return { ...p, reflectors: p.reflectors.map((r, i) => (i === index ? change(r) : r)) };
}

/** The numeric fields of reflecting plane `index` (0-based) in the row with the stable key `rowKey`. */
export function reflectorFields(index: number, rowKey: string) {
  const n = index + 1;
  return {
    position: {
      key: `plane.${rowKey}.position`,
      label: `Plane ${n} position`,
      kind: KINDS.length,
      range: PLANE_POSITION_RANGE_M,
      get: (p) => p.reflectors[index]?.position_m,
      set: (p, v) => updateReflector(p, index, (r) => ({ ...r, position_m: v })),
    },
    reflection: {
      key: `plane.${rowKey}.reflection`,
      label: `Plane ${n} reflection R`,
      kind: null,
      range: [-1, 1],
      get: (p) => p.reflectors[index]?.reflection,
      set: (p, v) => updateReflector(p, index, (r) => ({ ...r, reflection: v })),
    },
  } satisfies Record<string, NumberField>;
}

export const ECHO_ORDER_FIELD: NumberField = {
  key: 'echoOrder',
  label: 'Echo order',
  kind: null,
  range: [0, MAX_ECHO_ORDER],
  integer: true,
  get: (p) => p.echoOrder,
  set: (p, v) => ({ ...p, echoOrder: v }),
};

export const DIGITISER_FIELDS = {
  sampleRate: {
    key: 'digitiser.sampleRate',
    label: 'Sample rate',
    kind: KINDS.sampleRate,
    range: PLAN_LIMITS.sampleRate_Hz,
    get: (p) => p.digitiser.sampleRate_Hz,
    set: (p, v) => ({ ...p, digitiser: { ...p.digitiser, sampleRate_Hz: v } }),
  },
  recordLength: {
    key: 'digitiser.recordLength',
    label: 'Record length',
    kind: KINDS.time,
    range: (p) => [Math.max(PLAN_LIMITS.recordLength_s[0], p.digitiser.preTrigger_s), PLAN_LIMITS.recordLength_s[1]],
    rangeNote: 'at least the pre-trigger',
    get: (p) => p.digitiser.recordLength_s,
    set: (p, v) => ({ ...p, digitiser: { ...p.digitiser, recordLength_s: v } }),
  },
  preTrigger: {
    key: 'digitiser.preTrigger',
    label: 'Pre-trigger',
    kind: KINDS.time,
    range: (p) => [PLAN_LIMITS.preTrigger_s[0], p.digitiser.recordLength_s],
    rangeNote: 'at most the record length',
    get: (p) => p.digitiser.preTrigger_s,
    set: (p, v) => ({ ...p, digitiser: { ...p.digitiser, preTrigger_s: v } }),
  },
} satisfies Record<string, NumberField>;

export const TARGET_FIELDS = {
  snr: {
    key: 'targets.snr',
    label: 'Target SNR',
    kind: null,
    range: PLAN_LIMITS.snr,
    get: (p) => p.targets.snr,
    set: (p, v) => ({ ...p, targets: { ...p.targets, snr: v } }),
  },
  temperatureSd: {
    key: 'targets.temperatureSd',
    label: 'Target temperature sd',
    kind: KINDS.temperatureDifference,
    range: PLAN_LIMITS.temperatureSd_K,
    get: (p) => p.targets.temperatureSd_K,
    set: (p, v) => ({ ...p, targets: { ...p.targets, temperatureSd_K: v } }),
  },
} satisfies Record<string, NumberField>;
