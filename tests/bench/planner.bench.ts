/**
 * Planner speed. The page recomputes the plan on every edit and must redraw within 50 ms (measured
 * in the browser by tests/e2e/planner.spec.ts); these benchmarks give the part before Plotly draws:
 * the kernel's computePlan for the demo and for an eight-sensor plan, the plan-file check made on
 * each edit, and the timeline figure with its min/max decimation. Run with `npm run bench`.
 */
import { readFileSync } from 'node:fs';
import { bench, describe } from 'vitest';
import { type PlanFile, parsePlanFile, planFileToInput } from '../../src/io/plan-file';
import { computePlan, type PlanInput } from '../../src/physics';
import { addSensor } from '../../src/ui/planner/plan-edits';
import { mapGrid } from '../../src/ui/planner/resolution-map';
import { timelineFigure } from '../../src/ui/planner/timeline-figure';

function demo(): PlanFile {
  const parsed = parsePlanFile(readFileSync('public/demo-plan.json', 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
  return parsed.plan;
}

/** The demo with four more sensors added as the page adds them: eight sensors, 10–90 mm. */
function eightSensors(): PlanFile {
  let plan = demo();
  while (plan.sensors.length < 8) plan = addSensor(plan);
  return plan;
}

const demoInput: PlanInput = planFileToInput(demo());
const eightPlan = eightSensors();
const eightInput: PlanInput = planFileToInput(eightPlan);
const eightText = JSON.stringify(eightPlan);
const eightResult = computePlan(eightInput);
const PLOT_COLUMNS = 1100;
// Results accumulate here and are checked at the end, so the work cannot be optimised away.
let sink = 0;

describe('measurement planner', () => {
  bench('computePlan, demo plan (4 sensors, 2 reflecting planes, echo order 4)', () => {
    sink += computePlan(demoInput).sensors.length;
  });

  bench('computePlan, 8 sensors (the demo plus four on the axis)', () => {
    sink += computePlan(eightInput).sensors.length;
  });

  bench('plan-file check of an edited 8-sensor plan (JSON + schema)', () => {
    sink += parsePlanFile(eightText).ok ? 1 : 0;
  });

  bench(`timeline figure, 8 sensors, min/max decimation to ${PLOT_COLUMNS} columns`, () => {
    sink += timelineFigure(eightResult, 'arrivals', PLOT_COLUMNS).data.length;
    sink += timelineFigure(eightResult, 'record', PLOT_COLUMNS).data.length;
  });

  bench('resolution map grid (629 temperatures × 36 distances)', () => {
    const sensor = eightResult.sensors[0];
    sink += mapGrid({ timingSd_s: sensor?.timingSd_s ?? 1e-7, distanceSd_m: 2e-5, contractionSd: 1e-4, lag_s: 2e-5 }).sd_K.length;
  });

  bench('sanity: the benchmarked work produced finite numbers', () => {
    if (!Number.isFinite(sink)) throw new Error('benchmark produced a non-finite sum');
  });
});
