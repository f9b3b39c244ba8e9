/**
 * What the source-location view takes from the user: sensors (position, arrival, sd), the options
 * of the fit and how results are displayed. Inputs only: results are derived (derive-locate.ts).
 */
import type { LocateSensor } from '../../io/locate-csv';
import type { SensorPlacement, SurfaceConstraint, Vec3 } from '../../physics';

/** One sensor row of the table; `key` is stable across edits (React key, field keys). */
export interface LocateRowInput extends LocateSensor {
  key: string;
}

export type SurfaceKind = SurfaceConstraint['kind'];

/** How the fit is set up. Every number here has passed its field's check. */
export interface LocateOptionsInput {
  /** Speed from the bath temperature (u₂ from the kernel) or given directly. */
  speedMode: 'temperature' | 'speed';
  temperature_K: number;
  speed_m_s: number;
  /** With a bath temperature: fit the speed under a prior of u₂'s own sd and the temperature sd (off: u₂ held fixed). */
  speedPrior: boolean;
  /** One-sigma of the bath temperature, K (widens the prior by |du₂/dT|·σT). */
  temperatureSd_K: number;
  fitSpeed: boolean;
  /** Timing sd of sensors without their own, s. */
  arrivalSd_s: number;
  dropOutliers: boolean;
  surface: SurfaceKind;
  /** Parameters of each surface, kept while another is chosen. */
  sphere: { centre_m: Vec3; radius_m: number };
  cylinder: { axisPoint_m: Vec3; axisDirection: Vec3; radius_m: number };
  plane: { point_m: Vec3; normal: Vec3 };
  /** Where an added sensor may be suggested: inside this box when `on` (always outside a sphere or cylinder body). */
  sensorRegion: { on: boolean; min_m: Vec3; max_m: Vec3 };
}

/** A pair of coordinates: a projection or the plane of the quality map. */
export type PlanePair = 'xy' | 'xz' | 'yz';

export const PLANE_PAIRS: readonly PlanePair[] = ['xy', 'xz', 'yz'];

/** The axes (0 = x, 1 = y, 2 = z) of a pair, and the one left out. */
export function axesOf(pair: PlanePair): { a: 0 | 1 | 2; b: 0 | 1 | 2; c: 0 | 1 | 2 } {
  if (pair === 'xy') return { a: 0, b: 1, c: 2 };
  if (pair === 'xz') return { a: 0, b: 2, c: 1 };
  return { a: 1, b: 2, c: 0 };
}

export const AXIS_NAMES = ['x', 'y', 'z'] as const;

/** "x–y": a pair as people read it. */
export function pairName(pair: PlanePair): string {
  const { a, b } = axesOf(pair);
  return `${AXIS_NAMES[a]}–${AXIS_NAMES[b]}`;
}

/** How results are shown (no physics). */
export interface LocateDisplay {
  /** The two projections side by side. */
  projections: readonly [PlanePair, PlanePair];
  /** Whole layout, or a close-up of the source and its regions. */
  zoom: 'layout' | 'source';
  /** Plane of the layout-quality map (through the source, or the sensors' centroid). */
  mapPlane: PlanePair;
}

/** Rows and options together: what an edit changes. */
export interface LocateInputs {
  rows: readonly LocateRowInput[];
  options: LocateOptionsInput;
}

/** An edit: the inputs it gives, or why it is refused. */
export type LocateEdit = { ok: true; inputs: LocateInputs } | { ok: false; message: string };

/** Bath temperature the view starts at, K (a common He II working point). */
export const LOCATE_DEFAULT_TEMPERATURE_K = 1.8;
/** Timing sd the view starts with, s (5 µs: a few samples of a fast digitiser; common practice, no source). */
export const LOCATE_DEFAULT_ARRIVAL_SD_S = 5e-6;

export const DEFAULT_LOCATE_OPTIONS: LocateOptionsInput = {
  speedMode: 'temperature',
  temperature_K: LOCATE_DEFAULT_TEMPERATURE_K,
  speed_m_s: 20,
  speedPrior: true,
  temperatureSd_K: 0,
  fitSpeed: false,
  arrivalSd_s: LOCATE_DEFAULT_ARRIVAL_SD_S,
  dropOutliers: false,
  surface: 'none',
  sphere: { centre_m: [0, 0, 0], radius_m: 0.1 },
  cylinder: { axisPoint_m: [0, 0, 0], axisDirection: [0, 0, 1], radius_m: 0.1 },
  plane: { point_m: [0, 0, 0], normal: [0, 0, 1] },
  sensorRegion: { on: false, min_m: [-0.2, -0.2, -0.2], max_m: [0.2, 0.2, 0.2] },
};

export const DEFAULT_LOCATE_DISPLAY: LocateDisplay = { projections: ['xy', 'xz'], zoom: 'layout', mapPlane: 'xy' };

/** The surface constraint the options describe. */
export function constraintOf(o: LocateOptionsInput): SurfaceConstraint {
  switch (o.surface) {
    case 'none':
      return { kind: 'none' };
    case 'sphere':
      return { kind: 'sphere', ...o.sphere };
    case 'cylinder':
      return { kind: 'cylinder', ...o.cylinder };
    case 'plane':
      return { kind: 'plane', ...o.plane };
  }
}

/** Where an added sensor may go: outside the body of a sphere or cylinder, and inside the user's box when set. */
export function placementOf(o: LocateOptionsInput): SensorPlacement {
  const c = constraintOf(o);
  return {
    body: c.kind === 'sphere' || c.kind === 'cylinder' ? c : null,
    box: o.sensorRegion.on ? { min_m: o.sensorRegion.min_m, max_m: o.sensorRegion.max_m } : null,
  };
}

/**
 * A layout to plan with when the demo cannot be loaded: six sensors on the faces of a 300 mm cube
 * around the origin, no readings yet (an invented layout).
 */
export const BUILT_IN_SENSORS: readonly LocateSensor[] = [
  { label: 'E', position_m: [0.15, 0, 0.02], arrival_s: null, arrivalSd_s: null },
  { label: 'W', position_m: [-0.15, 0, -0.02], arrival_s: null, arrivalSd_s: null },
  { label: 'N', position_m: [0.02, 0.15, 0], arrival_s: null, arrivalSd_s: null },
  { label: 'S', position_m: [-0.02, -0.15, 0], arrival_s: null, arrivalSd_s: null },
  { label: 'Top', position_m: [0, 0.02, 0.15], arrival_s: null, arrivalSd_s: null },
  { label: 'Bottom', position_m: [0, -0.02, -0.15], arrival_s: null, arrivalSd_s: null },
];
