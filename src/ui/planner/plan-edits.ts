/**
 * Changes to a plan that are not a typed number: modes, shapes, lists of sensors and planes.
 * Each returns a new plan (plans are never mutated); the store checks it before using it.
 */
import { MAX_REFLECTORS, type PlanFile, type PlanFileHeater, type PlanFileSensor, planBath, planHeaterArea } from '../../io/plan-file';
import { parseQuantity } from '../../io/quantity';
import { CUSTOM_PULSE_MAX_POINTS, PLAN_LIMITS, vapourPressure } from '../../physics';
import type { PlanEdit } from './plan-fields';

export type BathMode = 'temperature' | 'pressure';
export type DriveMode = 'power' | 'flux';
export type ShapeKind = 'rectangle' | 'half-sine' | 'custom';
export type PositionMode = 'axis' | 'xyz';
export type Geometry = PlanFileHeater['geometry'];
/** The heater kinds the page offers: a point source comes on a wall or free in the liquid. */
export type HeaterChoice = 'rectangle' | 'disk' | 'point-wall' | 'point-free';

export const MAX_SENSORS = PLAN_LIMITS.sensorCount[1];
export { MAX_REFLECTORS };

function omit<T extends object, K extends keyof T>(value: T, ...keys: K[]): Omit<T, K> {
  const copy = { ...value };
  for (const key of keys) delete copy[key];
  return copy;
}

// ---------------------------------------------------------------------------------------------
// Bath

export function bathMode(plan: Pick<PlanFile, 'bath'>): BathMode {
  return plan.bath.temperature_K !== undefined ? 'temperature' : 'pressure';
}

/** Gives the bath as a temperature or as a vapour-pressure reading, converting the current value. */
export function setBathMode(plan: PlanFile, mode: BathMode): PlanEdit {
  if (mode === bathMode(plan)) return { ok: true, plan };
  const depth = plan.bath.liquidDepth_m;
  try {
    const T = planBath(plan).temperature_K;
    if (mode === 'temperature') return { ok: true, plan: { ...plan, bath: { temperature_K: Number(T.toPrecision(7)), liquidDepth_m: depth } } };
    const p = vapourPressure(T).pressure_Pa;
    return { ok: true, plan: { ...plan, bath: { vapourPressure_Pa: Number(p.toPrecision(6)), liquidDepth_m: depth } } };
  } catch (error) {
    const why = error instanceof Error ? error.message : String(error);
    return { ok: false, message: `Bath: the temperature cannot be given as a vapour-pressure reading here (${why}).` };
  }
}

// ---------------------------------------------------------------------------------------------
// Heater

function heaterArea(h: PlanFileHeater): number {
  return planHeaterArea(h) ?? 0;
}

const SIZE_KEYS = ['width_m', 'height_m', 'radius_m', 'mount', 'area_m2'] as const;

export function heaterChoice(plan: PlanFile): HeaterChoice {
  const h = plan.heater;
  return h.geometry === 'point' ? (h.mount === 'free' ? 'point-free' : 'point-wall') : h.geometry;
}

/**
 * Changes the heater kind; the size carries over (a square or disk of the same area; a point keeps
 * the area as its nominal one).
 */
export function setGeometry(plan: PlanFile, choice: HeaterChoice): PlanFile {
  if (heaterChoice(plan) === choice) return plan;
  const h = plan.heater;
  const area = heaterArea(h);
  const rest = omit(h, ...SIZE_KEYS);
  const sig = (x: number) => Number(x.toPrecision(6));
  let heater: PlanFileHeater;
  if (choice === 'disk') heater = { ...rest, geometry: 'disk', radius_m: sig(Math.sqrt(area / Math.PI)) };
  else if (choice === 'rectangle') heater = { ...rest, geometry: 'rectangle', width_m: sig(Math.sqrt(area)), height_m: sig(Math.sqrt(area)) };
  else heater = { ...rest, geometry: 'point', mount: choice === 'point-free' ? 'free' : 'wall', area_m2: sig(area) };
  return { ...plan, heater };
}

export function driveMode(plan: PlanFile): DriveMode {
  return plan.heater.power_W !== undefined ? 'power' : 'flux';
}

/** Gives the heater drive as peak power or as peak flux, converting with the heater area. */
export function setDriveMode(plan: PlanFile, mode: DriveMode): PlanFile {
  const h = plan.heater;
  if (mode === driveMode(plan)) return plan;
  const area = heaterArea(h);
  const heater: PlanFileHeater =
    mode === 'power'
      ? { ...omit(h, 'flux_W_m2'), power_W: Number(((h.flux_W_m2 ?? 0) * area).toPrecision(6)) }
      : { ...omit(h, 'power_W'), flux_W_m2: Number(((h.power_W ?? 0) / area).toPrecision(6)) };
  return { ...plan, heater };
}

export function shapeKind(plan: PlanFile): ShapeKind {
  return typeof plan.heater.shape === 'object' ? 'custom' : plan.heater.shape;
}

/**
 * Changes the pulse shape. A custom pulse starts as the current rectangle drawn as points
 * (a trapezoid); going back uses the custom pulse's length as the width. Width and rise time stay
 * in the plan while a custom pulse is used, so nothing typed is lost.
 */
export function setShape(plan: PlanFile, kind: ShapeKind): PlanFile {
  const h = plan.heater;
  if (kind === shapeKind(plan)) return plan;
  if (kind === 'custom') {
    const width = h.width_s ?? 1e-4;
    const rise = Math.min(h.riseTime_s ?? width / 100, width / 4);
    const points: [number, number][] =
      h.shape === 'half-sine'
        ? Array.from({ length: 9 }, (_, i) => [(width * i) / 8, Number(Math.sin((Math.PI * i) / 8).toFixed(4))])
        : [
            [0, 0],
            [rise, 1],
            [Number((width - rise).toPrecision(12)), 1],
            [width, 0],
          ];
    return { ...plan, heater: { ...h, shape: { custom: points } } };
  }
  const last = typeof h.shape === 'object' ? h.shape.custom[h.shape.custom.length - 1]?.[0] : undefined;
  const width = h.width_s ?? last ?? 1e-4;
  const rise = Math.min(h.riseTime_s ?? width / 100, width);
  return { ...plan, heater: { ...h, shape: kind, width_s: width, riseTime_s: rise } };
}

export function customPoints(plan: PlanFile): readonly [number, number][] {
  return typeof plan.heater.shape === 'object' ? plan.heater.shape.custom : [];
}

function withPoints(plan: PlanFile, points: [number, number][]): PlanFile {
  return { ...plan, heater: { ...plan.heater, shape: { custom: points } } };
}

/** Adds a point after the last one (10 % of the pulse later, amplitude 0). */
export function addPulsePoint(plan: PlanFile): PlanFile {
  const points = customPoints(plan).map((p): [number, number] => [p[0], p[1]]);
  const last = points[points.length - 1] ?? [0, 0];
  const step = Math.max(last[0] * 0.1, 1e-6);
  return withPoints(plan, [...points, [Number((last[0] + step).toPrecision(6)), 0]]);
}

export function removePulsePoint(plan: PlanFile, index: number): PlanFile {
  return withPoints(
    plan,
    customPoints(plan)
      .filter((_, i) => i !== index)
      .map((p): [number, number] => [p[0], p[1]]),
  );
}

/**
 * Reads pasted "t, a" lines (comma, semicolon, tab or spaces between; the time may carry a unit,
 * a bare time is in seconds; # starts a comment). Returns the points or a message naming the line.
 */
export function parsePastedPoints(text: string): { ok: true; points: [number, number][] } | { ok: false; message: string } {
  const points: [number, number][] = [];
  const lines = text.split(/\r?\n/);
  for (const [i, raw] of lines.entries()) {
    const line = raw.replace(/#.*$/, '').trim();
    if (line === '') continue;
    const parts = line.includes(',') || line.includes(';') || line.includes('\t') ? line.split(/[,;\t]/) : splitLastSpace(line);
    const [tText = '', aText = '', ...extra] = parts.map((p) => p.trim());
    if (aText === '' || extra.some((e) => e !== '')) {
      return { ok: false, message: `Pulse points, line ${i + 1}: expected “time, amplitude”, e.g. “20 us, 1”; got “${raw.trim()}”.` };
    }
    let t: number;
    try {
      t = parseQuantity(tText, 'time');
    } catch {
      return { ok: false, message: `Pulse points, line ${i + 1}: “${tText}” is not a time (e.g. 20 us, 0.5 ms, or seconds as a bare number).` };
    }
    const a = Number(aText);
    if (!Number.isFinite(a) || aText === '') {
      return { ok: false, message: `Pulse points, line ${i + 1}: “${aText}” is not a number (the relative amplitude, 0 or more).` };
    }
    points.push([t, a]);
  }
  if (points.length < 2) return { ok: false, message: 'Pulse points: paste at least two lines “time, amplitude”.' };
  if (points.length > CUSTOM_PULSE_MAX_POINTS) return { ok: false, message: `Pulse points: at most ${CUSTOM_PULSE_MAX_POINTS} lines (got ${points.length}).` };
  return { ok: true, points };
}

function splitLastSpace(line: string): string[] {
  const at = line.search(/\s+\S+$/);
  return at < 0 ? [line] : [line.slice(0, at), line.slice(at)];
}

export function setPulsePoints(plan: PlanFile, points: [number, number][]): PlanFile {
  return withPoints(plan, points);
}

// ---------------------------------------------------------------------------------------------
// Sensors

export function positionMode(sensor: PlanFileSensor): PositionMode {
  return sensor.position_m !== undefined ? 'xyz' : 'axis';
}

/** On the axis at distance d ⇄ at (0, 0, d); from x, y, z back to the axis keeps the straight distance. */
export function setPositionMode(plan: PlanFile, index: number, mode: PositionMode): PlanFile {
  return {
    ...plan,
    sensors: plan.sensors.map((s, i) => {
      if (i !== index || positionMode(s) === mode) return s;
      if (mode === 'xyz') return { ...omit(s, 'distance_m'), position_m: [0, 0, s.distance_m ?? 0] };
      const [x, y, z] = s.position_m ?? [0, 0, 0];
      return { ...omit(s, 'position_m'), distance_m: Number(Math.hypot(x, y, z).toPrecision(9)) };
    }),
  };
}

export function setSensorText(plan: PlanFile, index: number, key: 'id' | 'label', text: string): PlanFile {
  return { ...plan, sensors: plan.sensors.map((s, i) => (i === index ? { ...s, [key]: text } : s)) };
}

function uniqueId(plan: PlanFile, base: string): string {
  const taken = new Set(plan.sensors.map((s) => s.id));
  if (!taken.has(base)) return base;
  for (let n = 2; ; n++) {
    const id = `${base}-${n}`;
    if (!taken.has(id)) return id;
  }
}

function sensorDistance(s: PlanFileSensor): number {
  return s.distance_m ?? Math.hypot(...(s.position_m ?? [0, 0, 0]));
}

/** A new sensor on the axis 10 mm beyond the farthest one, wired like the last sensor. */
export function addSensor(plan: PlanFile): PlanFile {
  const last = plan.sensors[plan.sensors.length - 1];
  const farthest = Math.max(0, ...plan.sensors.map(sensorDistance));
  const n = plan.sensors.length + 1;
  const distance = Number((farthest + 0.01).toPrecision(6));
  const sensor: PlanFileSensor = {
    id: uniqueId(plan, `s${n}`),
    label: `Sensor ${n}, ${Number((distance * 1e3).toPrecision(4))} mm`,
    distance_m: distance,
    distanceSd_m: last?.distanceSd_m ?? 2e-5,
    area_m2: last?.area_m2 ?? 1e-6,
    responsivity_V_K: last?.responsivity_V_K ?? 1,
    noise_V: last?.noise_V ?? 1e-6,
    lag_s: last?.lag_s ?? 0,
  };
  return { ...plan, sensors: [...plan.sensors, sensor] };
}

/** A copy of sensor `index` right after it, with a new id. */
export function duplicateSensor(plan: PlanFile, index: number): PlanFile {
  const original = plan.sensors[index];
  if (!original) return plan;
  const copy: PlanFileSensor = { ...structuredClone(original), id: uniqueId(plan, `${original.id}-copy`), label: `${original.label} (copy)` };
  return { ...plan, sensors: [...plan.sensors.slice(0, index + 1), copy, ...plan.sensors.slice(index + 1)] };
}

export function removeSensor(plan: PlanFile, index: number): PlanFile {
  return { ...plan, sensors: plan.sensors.filter((_, i) => i !== index) };
}

// ---------------------------------------------------------------------------------------------
// Spacer and reflecting planes

export function setSpacer(plan: PlanFile, spacer: Partial<PlanFile['spacer']>): PlanFile {
  return { ...plan, spacer: { ...plan.spacer, ...spacer } };
}

/** A new plane across the axis beyond the farthest sensor: a solid wall (R from the Kapitza conductance). */
export function addReflector(plan: PlanFile): PlanFile {
  const farthest = Math.max(0, ...plan.sensors.map(sensorDistance));
  const n = plan.reflectors.length + 1;
  const position = Number((farthest + 0.01).toPrecision(6));
  return { ...plan, reflectors: [...plan.reflectors, { label: `plane ${n}`, axis: 'z', position_m: position }] };
}

export function removeReflector(plan: PlanFile, index: number): PlanFile {
  return { ...plan, reflectors: plan.reflectors.filter((_, i) => i !== index) };
}

/** A solid wall (R computed) or a measured R (starting at 0.99, to be typed over). */
export function setReflectionSource(plan: PlanFile, index: number, source: 'wall' | 'measured'): PlanFile {
  return {
    ...plan,
    reflectors: plan.reflectors.map((r, i) => {
      if (i !== index) return r;
      if (source === 'wall') return omit(r, 'reflection');
      return r.reflection === undefined ? { ...r, reflection: 0.99 } : r;
    }),
  };
}

export function setTargetKind(plan: PlanFile, kind: 'absolute' | 'change'): PlanFile {
  return { ...plan, targets: { ...plan.targets, temperatureKind: kind } };
}

export function setReflector(plan: PlanFile, index: number, change: { label?: string; axis?: 'x' | 'y' | 'z' }): PlanFile {
  return { ...plan, reflectors: plan.reflectors.map((r, i) => (i === index ? { ...r, ...change } : r)) };
}

export function setPlanName(plan: PlanFile, name: string): PlanFile {
  return { ...plan, name };
}
