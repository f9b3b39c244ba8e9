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
 * { "format": "sekundo-plan", "version": 2, "name": "…", "notes": "…",
 *   "bath": { "temperature_K": 1.8 } | { "vapourPressure_Pa": 1638.2 }, plus "liquidDepth_m",
 *   "heater": { "geometry": "rectangle" | "disk" | "point", "width_m" + "height_m" (rectangle) |
 *               "radius_m" (disk) | "mount": "wall" | "free" + "area_m2" (point),
 *               "power_W" | "flux_W_m2", "shape": "rectangle" | "half-sine" | { "custom": [[t_s, a], …] },
 *               "width_s", "riseTime_s", "repetitionRate_Hz", "averages" },
 *   "sensors": [{ "id", "label", "distance_m" | "position_m": [x, y, z], "distanceSd_m", "area_m2",
 *                 "responsivity_V_K", "noise_V", "lag_s" }],
 *   "spacer": { "materialId", "measuredWarm" },
 *   "reflectors": [{ "label", "axis": "x" | "y" | "z", "position_m", "reflection" (measured; absent:
 *                    a solid wall) }], "echoOrder",
 *   "digitiser": { "sampleRate_Hz", "recordLength_s", "preTrigger_s" },
 *   "targets": { "snr", "temperatureSd_K", "temperatureKind": "absolute" | "change" } }
 * ```
 *
 * Version 1 files (planar heaters, typed R only, no target kind) are read through plan-migrations.ts.
 * The format's code is split by concern: types and limits here, messages (plan-range-text.ts), the
 * schema (plan-file-schema.ts), versions (plan-migrations.ts), reading, writing and the kernel's
 * input (plan-file.ts).
 */
import { PATH_LENGTH_RANGE_M, PROPERTIES_RANGE_K, VAPOUR_PRESSURE_RANGE_PA, vapourPressure } from '../physics';

/** The `format` every plan file carries. */
export const PLAN_FORMAT = 'sekundo-plan';
/** The version this code writes and reads without migration. */
export const CURRENT_PLAN_VERSION = 2;

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
export const PLANE_POSITION_RANGE_M = [-100, 100] as const;
/** Sensor coordinates, m: the kernel's path-length range either side of the heater. */
export const SENSOR_COORDINATE_RANGE_M = [-PATH_LENGTH_RANGE_M[1], PATH_LENGTH_RANGE_M[1]] as const;
/** Lowest rise time of a rectangle, as a fraction of its width (the kernel's bound). */
export const MIN_RISE_FRACTION = 1e-6;
export const MAX_ID_CHARS = 64;
export const MAX_LABEL_CHARS = 120;
export const MAX_NAME_CHARS = 200;
export const MAX_NOTES_CHARS = 20_000;
/** Keys refused anywhere in a file: they mean something to JavaScript objects. */
export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

/** Highest vapour pressure accepted: the one at the top of the kernel's temperature range, Pa. */
export const MAX_BATH_PRESSURE_PA = vapourPressure(PROPERTIES_RANGE_K[1]).pressure_Pa;
export const BATH_PRESSURE_RANGE_PA = [VAPOUR_PRESSURE_RANGE_PA[0], MAX_BATH_PRESSURE_PA] as const;

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
  /** rectangle (a film: width × height), disk, or a small point source. */
  geometry: 'rectangle' | 'disk' | 'point';
  /** Rectangle side along x, m (rectangle heaters). */
  width_m?: number;
  /** Rectangle side along y, m (rectangle heaters). */
  height_m?: number;
  /** Radius, m (disk heaters; the area is πr²). */
  radius_m?: number;
  /** Point source: on a wall (radiates into 2π) or free in the liquid (4π). */
  mount?: 'wall' | 'free';
  /** Nominal face area, m² (point sources: for the flux figures only). */
  area_m2?: number;
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
  /** A measured amplitude reflection coefficient, −1 to 1; absent: a solid wall, R = (Z − h)/(Z + h). */
  reflection?: number;
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
  /** temperatureKind: whether temperatureSd_K is for one absolute reading or a change between readings. */
  targets: { snr: number; temperatureSd_K: number; temperatureKind: 'absolute' | 'change' };
}

/** What {@link parsePlanFile} returns: the plan (with notes of any migration), or every problem found as `field: message`. */
/** `newerVersion` is set when the file is of a format version newer than this code reads: it is not damaged, and is to be kept untouched. */
export type PlanFileParse = { ok: true; plan: PlanFile; migrated: PlanMigrationNote[] } | { ok: false; errors: string[]; newerVersion?: number };

/** What reading an older file changed: the version it came from and one line per change. */
export interface PlanMigrationNote {
  fromVersion: number;
  changes: string[];
}

