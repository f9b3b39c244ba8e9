/**
 * Locating a source: one location with 8 sensors (target: well under 10 ms), with and without a
 * fitted speed, and a 20 × 20 layout-quality map. Run with `npm run bench`.
 */
import { bench, describe } from 'vitest';
import { layoutQuality, locateSource, type Vec3 } from '../../src/physics';

const U2 = 19.9;
const SENSORS: Vec3[] = [
  [0.1, 0, 0],
  [-0.1, 0, 0],
  [0, 0.1, 0.02],
  [0, -0.1, 0.05],
  [0.05, 0.05, 0.15],
  [-0.06, 0.04, -0.1],
  [0.03, -0.08, 0.1],
  [-0.02, -0.03, 0.2],
];
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
