/**
 * The per-sensor cache of the planner (SensorResultCache) and its stepwise compute: a cached
 * sensor gives the same result and warnings as a fresh computation (same plan, same kernel, so
 * equality is exact), and an edit to one sensor recomputes only that sensor. Common practice, no
 * source: the check is the kernel against itself.
 */
import { computePlan, computePlanSteps, type PlanInput, SensorResultCache } from '../../src/physics';
import { planFileToInput } from '../../src/io/plan-file';
import { readFileSync } from 'node:fs';
import { parsePlanFile } from '../../src/io/plan-file';

/** The demo plan (four sensors, two reflecting planes). */
function demoInput(): PlanInput {
  const parsed = parsePlanFile(readFileSync('public/demo-plan.json', 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.join('; '));
  return planFileToInput(parsed.plan);
}

describe('per-sensor cache of the planner', () => {
  it('gives exactly what an uncached computation gives, sensors and warnings in order', () => {
    const input = demoInput();
    const cache = new SensorResultCache();
    const first = computePlan(input, cache);
    expect(cache.misses).toBe(input.sensors.length);
    const again = computePlan(input, cache);
    expect(cache.hits).toBe(input.sensors.length);
    expect(again).toEqual(computePlan(input));
    expect(first).toEqual(again);
  });

  it('recomputes only the edited sensor; a bath edit recomputes all', () => {
    const input = demoInput();
    const cache = new SensorResultCache();
    computePlan(input, cache);
    cache.hits = 0;
    cache.misses = 0;
    const moved = { ...input, sensors: input.sensors.map((s, i) => (i === 1 ? { ...s, position_m: [s.position_m[0], s.position_m[1], s.position_m[2] + 0.001] as const } : s)) };
    const result = computePlan(moved, cache);
    expect(cache.misses).toBe(1);
    expect(cache.hits).toBe(input.sensors.length - 1);
    expect(result).toEqual(computePlan(moved));
    cache.hits = 0;
    cache.misses = 0;
    computePlan({ ...input, temperature_K: input.temperature_K + 0.01 }, cache);
    expect(cache.misses).toBe(input.sensors.length);
  });

  it('steps one sensor at a time and returns the plan', () => {
    const input = demoInput();
    const steps = computePlanSteps(input);
    const seen: number[] = [];
    let step = steps.next();
    while (!step.done) {
      seen.push(step.value);
      step = steps.next();
    }
    expect(seen).toEqual(input.sensors.map((_, i) => i + 1));
    expect(step.value).toEqual(computePlan(input));
  });
});
