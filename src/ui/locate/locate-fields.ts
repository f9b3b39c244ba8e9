/**
 * The source-location view's field specs (FieldSpec, src/ui/fields) and the edits a good value
 * makes to the inputs (or why the inputs refuse it: a region turned inside out, a zero direction).
 * Lengths, arrival times and the bath temperature follow the header's display units; sds sit on
 * their ladder (µs for a timing sd). Reading typed text is QuantityField's (one rule everywhere).
 */
import { LOCATE_ARRIVAL_RANGE_S, LOCATE_ARRIVAL_SD_RANGE_S, LOCATE_LABEL_MAX, LOCATE_POSITION_RANGE_M } from '../../io/locate-csv';
import { LOCATE_SPEED_RANGE_M_S, MODEL_MIN_K, T_LAMBDA_K, type Vec3 } from '../../physics';
import type { FieldSpec } from '../fields/field-spec';
import { KINDS } from '../units/ladders';
import { AXIS_NAMES, type LocateEdit, type LocateInputs, type LocateOptionsInput, type LocateRowInput } from './locate-inputs';

/** Prefix of the locate view's field keys in the fields slice. */
export const LOCATE_FIELD_PREFIX = 'locate.';

/** Key of a locate field in the fields slice ("row.s3.x" → "locate.row.s3.x"). */
export function locateFieldKey(key: string): string {
  return `${LOCATE_FIELD_PREFIX}${key}`;
}

/** A change a good value makes: the inputs it gives, or why they refuse it. */
export type LocateValueEdit = (inputs: LocateInputs, value: number | null) => LocateEdit;

// ---- Specs of every field ----

export const positionSpec = (label: string, axis: 0 | 1 | 2): FieldSpec => ({
  label: `${AXIS_NAMES[axis]} of sensor ${label}`,
  kind: KINDS.length,
  range: LOCATE_POSITION_RANGE_M,
});

export const arrivalSpec = (label: string): FieldSpec => ({
  label: `arrival at sensor ${label}`,
  kind: KINDS.time,
  range: LOCATE_ARRIVAL_RANGE_S,
  blank: 'no reading',
});

export const sensorSdSpec = (label: string): FieldSpec => ({
  label: `timing sd of sensor ${label}`,
  kind: KINDS.timeConstant,
  role: 'sd',
  range: [0, LOCATE_ARRIVAL_SD_RANGE_S[1]],
  aboveMin: true,
  blank: 'the default',
});

export const TEMPERATURE_SPEC: FieldSpec = {
  label: 'Bath temperature',
  kind: KINDS.temperature,
  range: [MODEL_MIN_K, T_LAMBDA_K],
  rangeNote: 'He II',
};

/** The bath temperature's sd: on the temperature-difference ladder (mK), the scale it is read on. */
export const TEMPERATURE_SD_SPEC: FieldSpec = {
  label: 'Bath temperature sd',
  kind: KINDS.temperatureDifference,
  role: 'sd',
  range: [0, 1],
};

/** A corner of the region where added sensors may go. */
export const regionSpec = (corner: 'min' | 'max', axis: 0 | 1 | 2): FieldSpec => ({
  label: `Sensor region ${corner === 'min' ? 'lowest' : 'highest'} ${AXIS_NAMES[axis]}`,
  kind: KINDS.length,
  range: LOCATE_POSITION_RANGE_M,
  rangeNote: 'lowest below highest',
});

export const SPEED_SPEC: FieldSpec = {
  label: 'Speed',
  kind: KINDS.speed,
  range: LOCATE_SPEED_RANGE_M_S,
};

export const DEFAULT_SD_SPEC: FieldSpec = {
  label: 'Default timing sd',
  kind: KINDS.timeConstant,
  role: 'sd',
  range: [0, LOCATE_ARRIVAL_SD_RANGE_S[1]],
  aboveMin: true,
};

export const surfacePointSpec = (what: string, axis: 0 | 1 | 2): FieldSpec => ({
  label: `${what} ${AXIS_NAMES[axis]}`,
  kind: KINDS.length,
  range: LOCATE_POSITION_RANGE_M,
});

export const radiusSpec = (what: string): FieldSpec => ({
  label: `${what} radius`,
  kind: KINDS.length,
  range: [0, 100],
  aboveMin: true,
});

export const directionSpec = (what: string, axis: 0 | 1 | 2): FieldSpec => ({
  label: `${what} ${AXIS_NAMES[axis]}-component`,
  kind: null,
  range: [-1e6, 1e6],
  rangeNote: 'any length, not all zero',
});

// ---- Edits ----

/** An edit from a good value: the change, its result made a LocateEdit. */
function fieldEdit(apply: (inputs: LocateInputs, value: number | null) => LocateEdit | LocateInputs): LocateValueEdit {
  return (inputs, value) => {
    const result = apply(inputs, value);
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
export function positionEdit(row: LocateRowInput, axis: 0 | 1 | 2) {
  return fieldEdit((inputs, value) => withRow(inputs, row.key, (r) => ({ ...r, position_m: setAxis(r.position_m, axis, value ?? 0) })));
}

export function arrivalEdit(row: LocateRowInput) {
  return fieldEdit((inputs, value) => withRow(inputs, row.key, (r) => ({ ...r, arrival_s: value })));
}

export function sensorSdEdit(row: LocateRowInput) {
  return fieldEdit((inputs, value) => withRow(inputs, row.key, (r) => ({ ...r, arrivalSd_s: value })));
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

export const temperatureEdit = fieldEdit((inputs, value) => withOptions(inputs, (o) => ({ ...o, temperature_K: value ?? o.temperature_K })));
export const temperatureSdEdit = fieldEdit((inputs, value) => withOptions(inputs, (o) => ({ ...o, temperatureSd_K: value ?? 0 })));

/** An edit of one coordinate of the sensor region's corners; refused when it would turn the box inside out. */
export function regionEdit(corner: 'min' | 'max', axis: 0 | 1 | 2) {
  return fieldEdit((inputs, value): LocateEdit => {
    const r = inputs.options.sensorRegion;
    const min_m = corner === 'min' ? setAxis(r.min_m, axis, value ?? 0) : r.min_m;
    const max_m = corner === 'max' ? setAxis(r.max_m, axis, value ?? 0) : r.max_m;
    if (!(min_m[axis] < max_m[axis])) {
      return { ok: false, message: `Sensor region: the lowest ${AXIS_NAMES[axis]} must lie below the highest ${AXIS_NAMES[axis]}.` };
    }
    return { ok: true, inputs: withOptions(inputs, (o) => ({ ...o, sensorRegion: { ...o.sensorRegion, min_m, max_m } })) };
  });
}

export const speedEdit = fieldEdit((inputs, value) => withOptions(inputs, (o) => ({ ...o, speed_m_s: value ?? o.speed_m_s })));
export const defaultSdEdit = fieldEdit((inputs, value) => withOptions(inputs, (o) => ({ ...o, arrivalSd_s: value ?? o.arrivalSd_s })));

/** A field of a surface: its key part, spec and how the value changes the options. */
export interface SurfaceField {
  id: string;
  spec: FieldSpec;
  value: (o: LocateOptionsInput) => number;
  edit: LocateValueEdit;
}

const AXES = [0, 1, 2] as const;

function directionField(what: string, id: string, axis: 0 | 1 | 2, get: (o: LocateOptionsInput) => Vec3, set: (o: LocateOptionsInput, v: Vec3) => LocateOptionsInput): SurfaceField {
  const spec = directionSpec(what, axis);
  return {
    id: `${id}.${AXIS_NAMES[axis]}`,
    spec,
    value: (o) => get(o)[axis],
    edit: fieldEdit((inputs, value) => {
      const next = setAxis(get(inputs.options), axis, value ?? 0);
      if (!(Math.hypot(...next) > 0)) return { ok: false, message: `${what} must not be zero in all three components.` };
      return withOptions(inputs, (o) => set(o, next));
    }),
  };
}

function pointField(what: string, id: string, axis: 0 | 1 | 2, get: (o: LocateOptionsInput) => Vec3, set: (o: LocateOptionsInput, v: Vec3) => LocateOptionsInput): SurfaceField {
  const spec = surfacePointSpec(what, axis);
  return {
    id: `${id}.${AXIS_NAMES[axis]}`,
    spec,
    value: (o) => get(o)[axis],
    edit: fieldEdit((inputs, value) => withOptions(inputs, (o) => set(o, setAxis(get(o), axis, value ?? 0)))),
  };
}

function radiusField(what: string, id: string, get: (o: LocateOptionsInput) => number, set: (o: LocateOptionsInput, r: number) => LocateOptionsInput): SurfaceField {
  const spec = radiusSpec(what);
  return { id, spec, value: get, edit: fieldEdit((inputs, value) => withOptions(inputs, (o) => set(o, value ?? get(o)))) };
}

/** The fields of each surface, in the order they are shown. */
export const SURFACE_FIELDS: Readonly<Record<'sphere' | 'cylinder' | 'plane', readonly SurfaceField[]>> = {
  sphere: [
    ...AXES.map((k) => pointField('Sphere centre', 'sphere.centre', k, (o) => o.sphere.centre_m, (o, v) => ({ ...o, sphere: { ...o.sphere, centre_m: v } }))),
    radiusField('Sphere', 'sphere.radius', (o) => o.sphere.radius_m, (o, r) => ({ ...o, sphere: { ...o.sphere, radius_m: r } })),
  ],
  cylinder: [
    ...AXES.map((k) => pointField('Cylinder axis point', 'cylinder.point', k, (o) => o.cylinder.axisPoint_m, (o, v) => ({ ...o, cylinder: { ...o.cylinder, axisPoint_m: v } }))),
    ...AXES.map((k) => directionField('Cylinder axis direction', 'cylinder.direction', k, (o) => o.cylinder.axisDirection, (o, v) => ({ ...o, cylinder: { ...o.cylinder, axisDirection: v } }))),
    radiusField('Cylinder', 'cylinder.radius', (o) => o.cylinder.radius_m, (o, r) => ({ ...o, cylinder: { ...o.cylinder, radius_m: r } })),
  ],
  plane: [
    ...AXES.map((k) => pointField('Plane point', 'plane.point', k, (o) => o.plane.point_m, (o, v) => ({ ...o, plane: { ...o.plane, point_m: v } }))),
    ...AXES.map((k) => directionField('Plane normal', 'plane.normal', k, (o) => o.plane.normal, (o, v) => ({ ...o, plane: { ...o.plane, normal: v } }))),
  ],
};
