import { PATH_LENGTH_RANGE_M } from './contraction';
import { InvalidInputError, requireInRange } from './errors';
import type { HeaterFace } from './heater-face';
import { MAX_ECHO_ORDER, type Vec3 } from './image-sources';
import { PROPERTIES_RANGE_K } from './properties';
import type { PulseShape } from './pulse-shape';
import type { HeaterGeometry, PointMount } from './received-pulse';

/*
 * What the measurement planner takes: heater, sensors, reflecting planes, digitiser and targets
 * at a bath temperature, in SI units; its limits, and the check that names the field at fault.
 */

export interface PlanHeater {
  /**
   * rectangle (width × height) or disk: a sized face, computed as a baffled piston; point: a small
   * source on a wall or free in the liquid; plane-wave: an unbounded film (the short-path limit,
   * only where it is asked for by name).
   */
  geometry: HeaterGeometry;
  /** Rectangle side along x, m (rectangle only). */
  width_m: number;
  /** Rectangle side along y, m (rectangle only). */
  height_m: number;
  /** Disk radius, m (disk only). */
  radius_m: number;
  /** Point source: on a wall (radiates into 2π) or free in the liquid (4π). */
  mount: PointMount;
  /** Face area for flux figures, m² (point: nominal; plane wave: the area the power is spread on). */
  area_m2: number;
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

/** A reflecting plane as planned: `axis = position_m`, measured like the sensors (warm or cold). */
export interface PlanReflector {
  label: string;
  axis: 'x' | 'y' | 'z';
  position_m: number;
  /** A measured amplitude reflection coefficient (−1 to 1), or null: a solid wall, R = (Z − h)/(Z + h). */
  reflection: number | null;
}

/** Which temperature sd the target is for: one absolute reading, or a change between readings. */
export type TemperatureTargetKind = 'absolute' | 'change';

export interface PlanInput {
  temperature_K: number;
  /** Liquid above the setup, m. */
  liquidDepth_m: number;
  heater: PlanHeater;
  sensors: readonly PlanSensor[];
  spacer: { materialId: string; measuredWarm: boolean };
  reflectors: readonly PlanReflector[];
  echoOrder: number;
  digitiser: { sampleRate_Hz: number; recordLength_s: number; preTrigger_s: number };
  targets: { snr: number; temperatureSd_K: number; temperatureKind: TemperatureTargetKind };
}

/** Limits of the planner's inputs (SI). */
export const PLAN_LIMITS = {
  temperature_K: PROPERTIES_RANGE_K,
  liquidDepth_m: [0, 10],
  heaterArea_m2: [1e-12, 1],
  heaterRadius_m: [1e-6, 0.5],
  /** Rectangle sides, m: 1 µm to 1 m. */
  heaterSide_m: [1e-6, 1],
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

/** The heater's face for the piston model, or null for a point source or the plane wave. */
export function heaterFace(h: PlanHeater): HeaterFace | null {
  if (h.geometry === 'rectangle') return { kind: 'rectangle', width_m: h.width_m, height_m: h.height_m };
  if (h.geometry === 'disk') return { kind: 'disk', radius_m: h.radius_m };
  return null;
}

/** Area the heater's power is spread on, m² (the peak flux is power over this). */
export function heaterArea_m2(h: PlanHeater): number {
  if (h.geometry === 'rectangle') return h.width_m * h.height_m;
  if (h.geometry === 'disk') return Math.PI * h.radius_m * h.radius_m;
  return h.area_m2;
}

/** Throws OutOfRangeError, NonFiniteInputError or InvalidInputError naming the first field at fault. */
export function checkPlanInput(plan: PlanInput): void {
  const L = PLAN_LIMITS;
  requireInRange('bath temperature', plan.temperature_K, L.temperature_K[0], L.temperature_K[1], 'K');
  requireInRange('liquid depth', plan.liquidDepth_m, L.liquidDepth_m[0], L.liquidDepth_m[1], 'm');
  const h = plan.heater;
  if (h.geometry === 'disk') requireInRange('heater radius', h.radius_m, L.heaterRadius_m[0], L.heaterRadius_m[1], 'm');
  else if (h.geometry === 'rectangle') {
    requireInRange('heater width', h.width_m, L.heaterSide_m[0], L.heaterSide_m[1], 'm');
    requireInRange('heater height', h.height_m, L.heaterSide_m[0], L.heaterSide_m[1], 'm');
  } else if (h.geometry === 'point' || h.geometry === 'plane-wave') {
    requireInRange('heater area', h.area_m2, L.heaterArea_m2[0], L.heaterArea_m2[1], 'm²');
    if (h.geometry === 'point' && h.mount !== 'wall' && h.mount !== 'free') throw new InvalidInputError('heater mount', 'must be "wall" or "free"');
  } else throw new InvalidInputError('heater geometry', 'must be rectangle, disk, point or plane-wave');
  requireInRange('heater power', h.power_W, L.power_W[0], L.power_W[1], 'W');
  requireInRange('repetition rate', h.repetitionRate_Hz, L.repetitionRate_Hz[0], L.repetitionRate_Hz[1], 'Hz');
  requireInRange('pulses averaged', h.averages, L.averages[0], L.averages[1], '');
  if (!Number.isInteger(h.averages)) throw new InvalidInputError('pulses averaged', 'must be a whole number');
  requireInRange('heat flux', h.power_W / heaterArea_m2(h), L.flux_W_m2[0], L.flux_W_m2[1], 'W/m²');
  requireInRange('number of reflecting planes', plan.reflectors.length, L.reflectors[0], L.reflectors[1], '');
  plan.reflectors.forEach((p, i) => {
    requireInRange(`position of plane ${i + 1}`, p.position_m, -100, 100, 'm');
    if (p.reflection !== null) requireInRange(`reflection of plane ${i + 1}`, p.reflection, -1, 1, '');
  });
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
  if (plan.targets.temperatureKind !== 'absolute' && plan.targets.temperatureKind !== 'change') {
    throw new InvalidInputError('target kind', 'must be "absolute" or "change"');
  }
}
