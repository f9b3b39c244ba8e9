import type { Vec3 } from '../../src/physics';

/** Second sound near 1.8 K, m/s (Donnelly & Barenghi 1998 curve), used by the location scenarios. */
export const SCENARIO_U2_M_S = 19.9;

/** Eight sensors around a test volume, m: a spread, non-coplanar layout (test setting, not data). */
export const SCENARIO_SENSORS: readonly Vec3[] = [
  [0.1, 0, 0],
  [-0.1, 0, 0],
  [0, 0.1, 0.02],
  [0, -0.1, 0.05],
  [0.05, 0.05, 0.15],
  [-0.06, 0.04, -0.1],
  [0.03, -0.08, 0.1],
  [-0.02, -0.03, 0.2],
];
