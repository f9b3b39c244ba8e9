/**
 * Rehearsal speed (issue target: 200 trials for 8 sensors at 1 MS/s × 20 ms records in under 5 s in
 * the page's worker). Measured here in node, the same kernel and picking code the worker runs
 * (src/io/rehearse-run.ts): the demo with four more sensors added as the page adds them (eight
 * sensors, 10–90 mm, the lid moved to 100 mm), its digitiser set to 1 MS/s and 20 ms. One iteration is a whole rehearsal.
 */
import { readFileSync } from 'node:fs';
import { bench, describe } from 'vitest';
import { type PlanFile, parsePlanFile, planFileToInput } from '../../src/io/plan-file';
import { DEFAULT_REHEARSAL_OPTIONS, rehearse } from '../../src/io/rehearse-run';
import { computePlan } from '../../src/physics';
import { addSensor } from '../../src/ui/planner/plan-edits';

function benchPlan(): PlanFile {
  const parsed = parsePlanFile(readFileSync('public/demo-plan.json', 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
  let plan = parsed.plan;
  while (plan.sensors.length < 8) plan = addSensor(plan);
  // The lid moved up to 100 mm so that the added sensors (up to 90 mm) sit in front of it.
  const reflectors = plan.reflectors.map((r) => (r.label === 'lid' ? { ...r, position_m: 0.1 } : r));
  return { ...plan, reflectors, digitiser: { sampleRate_Hz: 1e6, recordLength_s: 0.02, preTrigger_s: 0.001 } };
}

const input = planFileToInput(benchPlan());
const planned = computePlan(input);
if (planned.sensors.filter((s) => s.secondSoundArrival_s !== null).length !== 8) throw new Error('the bench plan needs eight sensors with a pulse');

describe('rehearsal: 200 trials × 8 sensors, 1 MS/s × 20 ms records (target < 5 s)', () => {
  for (const picker of ['xcorr', 'fraction', 'threshold', 'peak'] as const) {
    bench(`${picker}`, () => {
      rehearse(input, planned, { ...DEFAULT_REHEARSAL_OPTIONS, picker, trials: 200, seed: 1 });
    }, { iterations: 3, warmupIterations: 1, time: 0 });
  }
});
