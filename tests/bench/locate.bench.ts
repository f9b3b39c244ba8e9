/**
 * Locating a source: one location with 8 sensors (target: well under 10 ms), with and without a
 * fitted speed, and a 20 × 20 layout-quality map. Run with `npm run bench`.
 */
import { bench, describe } from 'vitest';
import { layoutQuality, locateSource, type Vec3 } from '../../src/physics';
import { SCENARIO_SENSORS as SENSORS, SCENARIO_U2_M_S as U2 } from '../support/locate-scenario';

const SOURCE: Vec3 = [0.02, -0.01, 0.05];
// Deterministic "noise": a fixed pattern of ±5 µs.
const data = SENSORS.map((s, i) => ({
  position_m: s,
  arrival_s: 1e-4 + Math.hypot(s[0] - SOURCE[0], s[1] - SOURCE[1], s[2] - SOURCE[2]) / U2 + (i % 2 ? 5e-6 : -5e-6),
}));
const grid: Vec3[] = [];
for (let i = 0; i < 20; i++) for (let j = 0; j < 20; j++) grid.push([-0.1 + i * 0.01, -0.1 + j * 0.01, 0.05]);

describe('source location', () => {
  bench('one location, 8 sensors, known speed', () => {
    locateSource(data, { speed_m_s: U2, fitSpeed: false, arrivalSd_s: 5e-6, constraint: { kind: 'none' }, dropOutliers: false });
  });
  bench('one location, 8 sensors, fitted speed', () => {
    locateSource(data, { speed_m_s: U2, fitSpeed: true, arrivalSd_s: 5e-6, constraint: { kind: 'none' }, dropOutliers: false });
  });
  bench('layout-quality map, 400 source positions', () => {
    layoutQuality(SENSORS, grid, { speed_m_s: U2, arrivalSd_s: 5e-6, fitSpeed: false, constraint: { kind: 'none' } });
  });
});
