import { CURRENT_PLAN_VERSION, PLAN_FORMAT, type PlanFile } from '../../io/plan-file';

/** Where the demo plan is fetched from, relative to the page (same origin; allowed by the page's CSP). */
export const DEMO_PLAN_URL = './demo-plan.json';

/**
 * The plan the planner starts from when the demo file cannot be loaded: an invented, deliberately
 * plain setup (film heater, two bolometers on the axis, no reflectors), not a real experiment.
 */
export const BUILT_IN_PLAN: PlanFile = {
  format: PLAN_FORMAT,
  version: CURRENT_PLAN_VERSION,
  name: 'Built-in starting plan: 10 mm × 10 mm film heater, two bolometers at 20 and 40 mm',
  notes: 'Sekundo’s own starting point (invented numbers), used when the demo plan cannot be loaded.',
  bath: { temperature_K: 1.8, liquidDepth_m: 0.2 },
  heater: {
    geometry: 'rectangle',
    width_m: 0.01,
    height_m: 0.01,
    flux_W_m2: 1000,
    shape: 'rectangle',
    width_s: 1e-4,
    riseTime_s: 1e-6,
    repetitionRate_Hz: 5,
    averages: 16,
  },
  sensors: [
    { id: 's1', label: 'Sensor 1, 20 mm', distance_m: 0.02, distanceSd_m: 2e-5, area_m2: 1e-6, responsivity_V_K: 2, noise_V: 1e-6, lag_s: 2e-5 },
    { id: 's2', label: 'Sensor 2, 40 mm', distance_m: 0.04, distanceSd_m: 2e-5, area_m2: 1e-6, responsivity_V_K: 2, noise_V: 1e-6, lag_s: 2e-5 },
  ],
  spacer: { materialId: 'stainless-304', measuredWarm: true },
  reflectors: [],
  echoOrder: 2,
  digitiser: { sampleRate_Hz: 1e7, recordLength_s: 0.01, preTrigger_s: 5e-4 },
  targets: { snr: 100, temperatureSd_K: 1e-4, temperatureKind: 'change' },
};

/**
 * "New plan": the user's own plan from sensible defaults, with no demo text — the built-in plan's
 * bath, heater (a 10 mm × 10 mm film at 0.1 W/cm² for 100 µs) and digitiser, one sensor 50 mm away
 * on the axis, no reflecting planes but the heater's own wall (common practice, no source; the user
 * changes every number).
 */
export const NEW_PLAN: PlanFile = {
  format: PLAN_FORMAT,
  version: CURRENT_PLAN_VERSION,
  name: 'New plan',
  bath: BUILT_IN_PLAN.bath,
  heater: BUILT_IN_PLAN.heater,
  sensors: [{ id: 's1', label: 'Sensor 1', distance_m: 0.05, distanceSd_m: 2e-5, area_m2: 1e-6, responsivity_V_K: 2, noise_V: 1e-6, lag_s: 2e-5 }],
  spacer: BUILT_IN_PLAN.spacer,
  reflectors: [],
  echoOrder: BUILT_IN_PLAN.echoOrder,
  digitiser: BUILT_IN_PLAN.digitiser,
  targets: { snr: 100, temperatureSd_K: 1e-3, temperatureKind: 'change' },
};
