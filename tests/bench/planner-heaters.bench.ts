/**
 * The finite-heater (baffled-piston) integral in the planner: the cost per sensor per echo of
 * computing a sized heater, on a crowded plan — 16 sensors on and off the axis, 8 reflecting
 * planes on every side (solid walls, so every image up to the cap survives), echo order 8 — for a
 * 10 mm × 10 mm film, a 5.6 mm disk and the unbounded plane-wave limit. Run with
 * `npx vitest bench --run tests/bench/planner-heaters.bench.ts`. Test settings, not data.
 */
import { bench, describe } from 'vitest';
import { computePlan, type PlanInput } from '../../src/physics';

function crowded(heater: Partial<PlanInput['heater']>): PlanInput {
  return {
    temperature_K: 1.8,
    liquidDepth_m: 0.1,
    heater: { geometry: 'rectangle', width_m: 0.01, height_m: 0.01, radius_m: 0.0056, mount: 'wall', area_m2: 1e-4, power_W: 0.1, shape: { kind: 'rectangle' }, width_s: 1e-4, riseTime_s: 1e-6, repetitionRate_Hz: 5, averages: 16, ...heater },
    sensors: Array.from({ length: 16 }, (_, i) => ({
      id: `s${i}`,
      label: `S${i}`,
      position_m: [((i % 4) - 1.5) * 0.004, (Math.floor(i / 4) - 1.5) * 0.004, 0.01 + i * 0.003] as const,
      distanceSd_m: 2e-5,
      area_m2: 1e-6,
      responsivity_V_K: 2,
      noise_V: 1e-6,
      lag_s: 2e-5,
    })),
    spacer: { materialId: 'stainless-304', measuredWarm: true },
    reflectors: [
      { label: 'lid', axis: 'z', position_m: 0.07, reflection: null },
      { label: 'upper lid', axis: 'z', position_m: 0.09, reflection: null },
      { label: 'x−', axis: 'x', position_m: -0.02, reflection: null },
      { label: 'x+', axis: 'x', position_m: 0.02, reflection: null },
      { label: 'y−', axis: 'y', position_m: -0.02, reflection: null },
      { label: 'y+', axis: 'y', position_m: 0.02, reflection: null },
      { label: 'far x', axis: 'x', position_m: 0.05, reflection: null },
      { label: 'far y', axis: 'y', position_m: 0.05, reflection: null },
    ],
    echoOrder: 8,
    digitiser: { sampleRate_Hz: 1e7, recordLength_s: 0.02, preTrigger_s: 0.001 },
    targets: { snr: 100, temperatureSd_K: 1e-4, temperatureKind: 'change' },
  };
}

const rectangle = crowded({});
const disk = crowded({ geometry: 'disk' });
const planeWave = crowded({ geometry: 'plane-wave' });
let sink = 0;

describe('finite heaters in a crowded plan (16 sensors, 8 solid walls, echo order 8)', () => {
  bench('10 mm × 10 mm film (rectangle piston)', () => {
    sink += computePlan(rectangle).sensors.length;
  }, { iterations: 5, time: 0 });
  bench('5.6 mm disk (disk piston)', () => {
    sink += computePlan(disk).sensors.length;
  }, { iterations: 5, time: 0 });
  bench('unbounded film (plane-wave limit; z walls only)', () => {
    sink += computePlan(planeWave).sensors.length;
  }, { iterations: 5, time: 0 });
  bench('sanity: finite results', () => {
    if (!Number.isFinite(sink)) throw new Error('non-finite');
  });
});
