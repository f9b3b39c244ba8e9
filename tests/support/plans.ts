import type { PlanInput } from '../../src/physics';

/**
 * A plain planning case for tests: an unbounded film (the plane-wave limit, so the plane-wave
 * formulas the tests check hold exactly), one sensor on the axis, no reflectors, no lag, a fast
 * digitiser with a long record. Numbers are test settings, not data.
 */
export function basePlan(overrides: Partial<PlanInput> = {}): PlanInput {
  return {
    temperature_K: 1.8,
    liquidDepth_m: 0,
    heater: {
      geometry: 'plane-wave',
      area_m2: 1e-4,
      width_m: 0,
      height_m: 0,
      radius_m: 0,
      mount: 'wall',
      power_W: 0.1,
      shape: { kind: 'rectangle' },
      width_s: 100e-6,
      riseTime_s: 1e-6,
      repetitionRate_Hz: 1,
      averages: 1,
    },
    sensors: [
      { id: 's1', label: 'S1', position_m: [0, 0, 0.05], distanceSd_m: 0, area_m2: 0, responsivity_V_K: 1, noise_V: 1e-7, lag_s: 0 },
    ],
    spacer: { materialId: 'stainless-304', measuredWarm: false },
    reflectors: [],
    echoOrder: 0,
    digitiser: { sampleRate_Hz: 1e8, recordLength_s: 0.1, preTrigger_s: 0.001 },
    targets: { snr: 10, temperatureSd_K: 1e-3, temperatureKind: 'absolute' },
    ...overrides,
  };
}

/** The same plan with the heater changed. */
export function withHeater(plan: PlanInput, heater: Partial<PlanInput['heater']>): PlanInput {
  return { ...plan, heater: { ...plan.heater, ...heater } };
}

/** The same plan with the first sensor changed. */
export function withSensor(plan: PlanInput, sensor: Partial<PlanInput['sensors'][number]>): PlanInput {
  const [first, ...rest] = plan.sensors;
  if (!first) throw new Error('plan has no sensor');
  return { ...plan, sensors: [{ ...first, ...sensor }, ...rest] };
}
