/**
 * Typed fields of the source-location view: each reads text with units (src/io/quantity), a bare
 * number in the field's display unit, checks the valid range and either gives the edited inputs or
 * a message naming the field and its range. The inputs keep their last good value on a refusal.
 */
import {
  LOCATE_ARRIVAL_RANGE_S,
  LOCATE_ARRIVAL_SD_RANGE_S,
  LOCATE_LABEL_MAX,
  LOCATE_POSITION_RANGE_M,
} from '../../io/locate-csv';
import { type Dimension, fromBaseUnit, parseQuantity, QuantityParseError, type Unit, unitsOf } from '../../io/quantity';
import { LOCATE_SPEED_RANGE_M_S, MODEL_MIN_K, T_LAMBDA_K, type Vec3 } from '../../physics';
import { AXIS_NAMES, type LocateEdit, type LocateInputs, type LocateOptionsInput, type LocateRowInput } from './locate-inputs';

/** A quantity field: what it is called, its unit and valid range. */
export interface QuantityFieldSpec {
  /** Names the field in messages, e.g. "x of U0". */
  name: string;
  /** null: a plain number (a direction component). */
  dimension: Dimension | null;
  /** Display unit: values are shown in it and a bare number is read in it. */
  unit: Unit | null;
  /** Valid range in SI. */
  range: readonly [number, number];
  /** The range as people read it, e.g. "−100 to 100 m". */
  rangeText: string;
  /** A blank field means "none" (an arrival not yet read, a sensor without its own sd). */
  blankAllowed?: boolean;
  /** Refused exactly at the lower end (0 for radii and sds). */
  aboveMin?: boolean;
}

export type FieldRead = { ok: true; value: number | null } | { ok: false; message: string };

const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Reads a field's text. A bare number is in the display unit; units may be typed. */
export function readField(spec: QuantityFieldSpec, text: string): FieldRead {
  const trimmed = text.trim().replace(/\u2212/g, '-');
  const range = `valid range ${spec.rangeText}`;
  if (trimmed === '') {
    return spec.blankAllowed ? { ok: true, value: null } : { ok: false, message: `${spec.name} is empty: give a value; ${range}.` };
  }
  let value: number;
  if (spec.dimension === null || spec.unit === null) {
    value = PLAIN_NUMBER.test(trimmed) ? Number(trimmed) : Number.NaN;
    if (!Number.isFinite(value)) return { ok: false, message: `${spec.name}: "${text.trim()}" is not a number; ${range}.` };
  } else {
    const withUnit = PLAIN_NUMBER.test(trimmed) ? `${trimmed} ${spec.unit}` : trimmed;
    try {
      value = parseQuantity(withUnit, spec.dimension);
    } catch (error) {
      if (!(error instanceof QuantityParseError)) throw error;
      const units = unitsOf(spec.dimension).join(', ');
      return { ok: false, message: `${spec.name}: "${text.trim()}" is not a ${spec.dimension}; type a number in ${spec.unit} or add a unit (${units}); ${range}.` };
    }
  }
  const [lo, hi] = spec.range;
  if (!(value <= hi && (spec.aboveMin ? value > lo : value >= lo))) {
    return { ok: false, message: `${spec.name} ${text.trim()} is outside the ${range}.` };
  }
  return { ok: true, value };
}

/** The value as the field shows it: in the display unit, up to 6 significant digits, ASCII minus. */
export function fieldText(spec: QuantityFieldSpec, value: number | null): string {
  if (value === null) return '';
  const shown = spec.unit === null ? value : fromBaseUnit(value, spec.unit);
  return String(Number(shown.toPrecision(6)));
}

// ---- Specs of every field ----
// Lengths, arrival times and the bath temperature are shown in the person's display units
// (src/ui/units); sds stay in µs, the scale they are read on.

/** Display units of length and time the view takes (src/ui/units). */
export type LengthUnit = 'mm' | 'cm' | 'm';
export type TimeUnit = 'ms' | 'µs' | 's';
export type TemperatureUnit = 'K' | 'mK';

export const positionSpec = (label: string, axis: 0 | 1 | 2, unit: LengthUnit = 'mm'): QuantityFieldSpec => ({
  name: `${AXIS_NAMES[axis]} of sensor ${label}`,
  dimension: 'length',
  unit,
  range: LOCATE_POSITION_RANGE_M,
  rangeText: `${LOCATE_POSITION_RANGE_M[0]} to ${LOCATE_POSITION_RANGE_M[1]} m`,
});

export const arrivalSpec = (label: string, unit: TimeUnit = 'ms'): QuantityFieldSpec => ({
  name: `arrival at sensor ${label}`,
  dimension: 'time',
  unit,
  range: LOCATE_ARRIVAL_RANGE_S,
  rangeText: `${LOCATE_ARRIVAL_RANGE_S[0]} to ${LOCATE_ARRIVAL_RANGE_S[1]} s, or blank for no reading`,
  blankAllowed: true,
});

export const sensorSdSpec = (label: string): QuantityFieldSpec => ({
  name: `timing sd of sensor ${label}`,
  dimension: 'time',
  unit: 'us',
  range: [0, LOCATE_ARRIVAL_SD_RANGE_S[1]],
  rangeText: `above 0 µs, up to ${LOCATE_ARRIVAL_SD_RANGE_S[1]} s, or blank for the default`,
  blankAllowed: true,
  aboveMin: true,
});

export const temperatureSpec = (unit: TemperatureUnit = 'K'): QuantityFieldSpec => ({
  name: 'Bath temperature',
  dimension: 'temperature',
  unit,
  range: [MODEL_MIN_K, T_LAMBDA_K],
  rangeText: `${MODEL_MIN_K}–${T_LAMBDA_K} K (He II)`,
});

export const TEMPERATURE_SPEC: QuantityFieldSpec = temperatureSpec('K');

/** The bath temperature's sd: in mK, the scale it is read on (an sd standing on its own). */
export const TEMPERATURE_SD_SPEC: QuantityFieldSpec = {
  name: 'Bath temperature sd',
  dimension: 'temperature',
  unit: 'mK',
  range: [0, 1],
  rangeText: '0–1000 mK',
};

/** A corner of the region where added sensors may go. */
export const regionSpec = (corner: 'min' | 'max', axis: 0 | 1 | 2, unit: LengthUnit = 'mm'): QuantityFieldSpec => ({
  name: `Sensor region ${corner === 'min' ? 'lowest' : 'highest'} ${AXIS_NAMES[axis]}`,
  dimension: 'length',
  unit,
  range: LOCATE_POSITION_RANGE_M,
  rangeText: `${LOCATE_POSITION_RANGE_M[0]} to ${LOCATE_POSITION_RANGE_M[1]} m, lowest below highest`,
});

export const SPEED_SPEC: QuantityFieldSpec = {
  name: 'Speed',
  dimension: 'speed',
  unit: 'm/s',
  range: LOCATE_SPEED_RANGE_M_S,
  rangeText: `${LOCATE_SPEED_RANGE_M_S[0]}–${LOCATE_SPEED_RANGE_M_S[1].toLocaleString('en-GB').replace(',', ' ')} m/s`,
};

export const DEFAULT_SD_SPEC: QuantityFieldSpec = {
  name: 'Default timing sd',
  dimension: 'time',
  unit: 'us',
  range: [0, LOCATE_ARRIVAL_SD_RANGE_S[1]],
  rangeText: `above 0 µs, up to ${LOCATE_ARRIVAL_SD_RANGE_S[1]} s`,
  aboveMin: true,
};

export const surfacePointSpec = (what: string, axis: 0 | 1 | 2, unit: LengthUnit = 'mm'): QuantityFieldSpec => ({
  name: `${what} ${AXIS_NAMES[axis]}`,
  dimension: 'length',
  unit,
  range: LOCATE_POSITION_RANGE_M,
  rangeText: `${LOCATE_POSITION_RANGE_M[0]} to ${LOCATE_POSITION_RANGE_M[1]} m`,
});

export const radiusSpec = (what: string, unit: LengthUnit = 'mm'): QuantityFieldSpec => ({
  name: `${what} radius`,
  dimension: 'length',
  unit,
  range: [0, 100],
  rangeText: 'above 0 mm, up to 100 m',
  aboveMin: true,
});

export const directionSpec = (what: string, axis: 0 | 1 | 2): QuantityFieldSpec => ({
  name: `${what} ${AXIS_NAMES[axis]}-component`,
  dimension: null,
  unit: null,
  range: [-1e6, 1e6],
  rangeText: '−1 000 000 to 1 000 000 (any length, not all zero)',
});

// ---- Edits ----

/** An edit from a field's text: reads it with `spec`, then applies the value. */
export function fieldEdit(spec: QuantityFieldSpec, apply: (inputs: LocateInputs, value: number | null) => LocateEdit | LocateInputs) {
  return (inputs: LocateInputs, text: string): LocateEdit => {
    const read = readField(spec, text);
    if (!read.ok) return read;
    const result = apply(inputs, read.value);
    return 'ok' in result ? result : { ok: true, inputs: result };
  };
}

function withRow(inputs: LocateInputs, key: string, change: (row: LocateRowInput) => LocateRowInput): LocateInputs {
  return { ...inputs, rows: inputs.rows.map((r) => (r.key === key ? change(r) : r)) };
}

function setAxis(v: Vec3, axis: 0 | 1 | 2, x: number): Vec3 {
  return [axis === 0 ? x : v[0], axis === 1 ? x : v[1], axis === 2 ? x : v[2]];
}

/** Sensor coordinate. */
export function positionEdit(row: LocateRowInput, axis: 0 | 1 | 2, unit: LengthUnit = 'mm') {
  return fieldEdit(positionSpec(row.label, axis, unit), (inputs, value) => withRow(inputs, row.key, (r) => ({ ...r, position_m: setAxis(r.position_m, axis, value ?? 0) })));
}

export function arrivalEdit(row: LocateRowInput, unit: TimeUnit = 'ms') {
  return fieldEdit(arrivalSpec(row.label, unit), (inputs, value) => withRow(inputs, row.key, (r) => ({ ...r, arrival_s: value })));
}

export function sensorSdEdit(row: LocateRowInput) {
  return fieldEdit(sensorSdSpec(row.label), (inputs, value) => withRow(inputs, row.key, (r) => ({ ...r, arrivalSd_s: value })));
}

/** Sensor label: not empty, at most 40 characters, unique. */
export function labelEdit(row: LocateRowInput) {
  return (inputs: LocateInputs, text: string): LocateEdit => {
    const label = text.trim();
    if (label === '') return { ok: false, message: `Label of sensor ${row.label} is empty: give a name of 1–${LOCATE_LABEL_MAX} characters.` };
    if (label.length > LOCATE_LABEL_MAX) return { ok: false, message: `Label of sensor ${row.label} is longer than ${LOCATE_LABEL_MAX} characters.` };
    if (inputs.rows.some((r) => r.key !== row.key && r.label === label)) return { ok: false, message: `Label "${label}" is already used by another sensor; give each sensor its own label.` };
    return { ok: true, inputs: withRow(inputs, row.key, (r) => ({ ...r, label })) };
  };
}

function withOptions(inputs: LocateInputs, change: (o: LocateOptionsInput) => LocateOptionsInput): LocateInputs {
  return { ...inputs, options: change(inputs.options) };
}

export const temperatureEditIn = (unit: TemperatureUnit) =>
  fieldEdit(temperatureSpec(unit), (inputs, value) => withOptions(inputs, (o) => ({ ...o, temperature_K: value ?? o.temperature_K })));
export const temperatureEdit = temperatureEditIn('K');
export const temperatureSdEdit = fieldEdit(TEMPERATURE_SD_SPEC, (inputs, value) => withOptions(inputs, (o) => ({ ...o, temperatureSd_K: value ?? 0 })));

/** An edit of one coordinate of the sensor region's corners; refused when it would turn the box inside out. */
export function regionEdit(corner: 'min' | 'max', axis: 0 | 1 | 2, unit: LengthUnit = 'mm') {
  return fieldEdit(regionSpec(corner, axis, unit), (inputs, value): LocateEdit => {
    const r = inputs.options.sensorRegion;
    const min_m = corner === 'min' ? setAxis(r.min_m, axis, value ?? 0) : r.min_m;
    const max_m = corner === 'max' ? setAxis(r.max_m, axis, value ?? 0) : r.max_m;
    if (!(min_m[axis] < max_m[axis])) {
      return { ok: false, message: `Sensor region: the lowest ${AXIS_NAMES[axis]} must lie below the highest ${AXIS_NAMES[axis]}.` };
    }
    return { ok: true, inputs: withOptions(inputs, (o) => ({ ...o, sensorRegion: { ...o.sensorRegion, min_m, max_m } })) };
  });
}

export const speedEdit = fieldEdit(SPEED_SPEC, (inputs, value) => withOptions(inputs, (o) => ({ ...o, speed_m_s: value ?? o.speed_m_s })));
export const defaultSdEdit = fieldEdit(DEFAULT_SD_SPEC, (inputs, value) => withOptions(inputs, (o) => ({ ...o, arrivalSd_s: value ?? o.arrivalSd_s })));

/** A field of a surface: its key part, spec and how the value changes the options. */
export interface SurfaceField {
  id: string;
  spec: QuantityFieldSpec;
  value: (o: LocateOptionsInput) => number;
  edit: (inputs: LocateInputs, text: string) => LocateEdit;
}

const AXES = [0, 1, 2] as const;

function directionField(what: string, id: string, axis: 0 | 1 | 2, get: (o: LocateOptionsInput) => Vec3, set: (o: LocateOptionsInput, v: Vec3) => LocateOptionsInput): SurfaceField {
  const spec = directionSpec(what, axis);
  return {
    id: `${id}.${AXIS_NAMES[axis]}`,
    spec,
    value: (o) => get(o)[axis],
    edit: fieldEdit(spec, (inputs, value) => {
      const next = setAxis(get(inputs.options), axis, value ?? 0);
      if (!(Math.hypot(...next) > 0)) return { ok: false, message: `${what} must not be zero in all three components.` };
      return withOptions(inputs, (o) => set(o, next));
    }),
  };
}

function pointField(what: string, id: string, axis: 0 | 1 | 2, get: (o: LocateOptionsInput) => Vec3, set: (o: LocateOptionsInput, v: Vec3) => LocateOptionsInput, unit: LengthUnit): SurfaceField {
  const spec = surfacePointSpec(what, axis, unit);
  return {
    id: `${id}.${AXIS_NAMES[axis]}`,
    spec,
    value: (o) => get(o)[axis],
    edit: fieldEdit(spec, (inputs, value) => withOptions(inputs, (o) => set(o, setAxis(get(o), axis, value ?? 0)))),
  };
}

function radiusField(what: string, id: string, get: (o: LocateOptionsInput) => number, set: (o: LocateOptionsInput, r: number) => LocateOptionsInput, unit: LengthUnit): SurfaceField {
  const spec = radiusSpec(what, unit);
  return { id, spec, value: get, edit: fieldEdit(spec, (inputs, value) => withOptions(inputs, (o) => set(o, value ?? get(o)))) };
}

/** The fields of each surface, in the order they are shown, with lengths in `unit`. */
export function surfaceFields(unit: LengthUnit): Readonly<Record<'sphere' | 'cylinder' | 'plane', readonly SurfaceField[]>> {
  const cached = surfaceFieldCache.get(unit);
  if (cached) return cached;
  const fields = {
    sphere: [
      ...AXES.map((k) => pointField('Sphere centre', 'sphere.centre', k, (o) => o.sphere.centre_m, (o, v) => ({ ...o, sphere: { ...o.sphere, centre_m: v } }), unit)),
      radiusField('Sphere', 'sphere.radius', (o) => o.sphere.radius_m, (o, r) => ({ ...o, sphere: { ...o.sphere, radius_m: r } }), unit),
    ],
    cylinder: [
      ...AXES.map((k) => pointField('Cylinder axis point', 'cylinder.point', k, (o) => o.cylinder.axisPoint_m, (o, v) => ({ ...o, cylinder: { ...o.cylinder, axisPoint_m: v } }), unit)),
      ...AXES.map((k) => directionField('Cylinder axis direction', 'cylinder.direction', k, (o) => o.cylinder.axisDirection, (o, v) => ({ ...o, cylinder: { ...o.cylinder, axisDirection: v } }))),
      radiusField('Cylinder', 'cylinder.radius', (o) => o.cylinder.radius_m, (o, r) => ({ ...o, cylinder: { ...o.cylinder, radius_m: r } }), unit),
    ],
    plane: [
      ...AXES.map((k) => pointField('Plane point', 'plane.point', k, (o) => o.plane.point_m, (o, v) => ({ ...o, plane: { ...o.plane, point_m: v } }), unit)),
      ...AXES.map((k) => directionField('Plane normal', 'plane.normal', k, (o) => o.plane.normal, (o, v) => ({ ...o, plane: { ...o.plane, normal: v } }))),
    ],
  };
  surfaceFieldCache.set(unit, fields);
  return fields;
}

const surfaceFieldCache = new Map<LengthUnit, Readonly<Record<'sphere' | 'cylinder' | 'plane', readonly SurfaceField[]>>>();

/** The fields of each surface with lengths in mm. */
export const SURFACE_FIELDS = surfaceFields('mm');
