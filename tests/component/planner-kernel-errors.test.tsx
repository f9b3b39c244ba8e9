import { screen } from '@testing-library/react';
import { vi } from 'vitest';

// The kernel refuses what the plan-file schema cannot see. To test that path without depending on
// a particular kernel limit, the plan computation here refuses any sensor lag above 0.5 s, naming
// the quantity as the kernel does; everything else goes to the real kernel. The setup file has
// loaded the page's modules already, so each test loads them afresh to pick up the stand-in.
vi.mock('../../src/physics', async (importOriginal) => {
  const physics = await importOriginal<typeof import('../../src/physics')>();
  return {
    ...physics,
    computePlanSteps: (plan: Parameters<typeof physics.computePlanSteps>[0], cache?: Parameters<typeof physics.computePlanSteps>[1]) => {
      plan.sensors.forEach((s, i) => {
        physics.requireInRange(`sensor ${i + 1} (${s.label}) lag`, s.lag_s, 0, 0.5, 's');
      });
      return physics.computePlanSteps(plan, cache);
    },
  };
});

async function freshPage() {
  vi.resetModules();
  const helpers = await import('./planner-helpers');
  const { BUILT_IN_PLAN } = await import('../../src/ui/planner/default-plan');
  return { ...helpers, BUILT_IN_PLAN };
}

describe('kernel errors in the planner', () => {
  // The plan-file schema and the kernel's input check run on every keystroke; the plan itself is
  // computed after (in the plan worker in the browser), so a value only the computation refuses is
  // taken into the plan and the results give way to the kernel's message, naming the field.
  it('shows the kernel’s message in place of the results, naming the field, and the results return when the field is mended', async () => {
    const { openPlanner, field, store } = await freshPage();
    const { user } = await openPlanner('demo', false);
    const before = store().plannerPlan;
    const lag = field('Sensor 2 lag');
    await user.clear(lag);
    await user.paste('0.8 s');
    const problem = (await screen.findByText(/No results for this plan\./)).closest('[role="alert"]');
    expect(problem).toHaveTextContent('Sensor 2 lag: sensor 2 (Bolometer B, 25 mm) lag 0.8 s is outside the valid range 0–0.5 s');
    expect(store().plannerPlan.sensors[1]?.lag_s).toBe(0.8);
    await user.clear(lag);
    await user.paste(`${(before.sensors[1]?.lag_s ?? 0) * 1e6} us`);
    expect(screen.queryByText(/No results for this plan\./)).toBeNull();
    expect(screen.getByRole('table', { name: /predicted arrivals/i })).toBeInTheDocument();
  });

  it('shows why a loaded plan has no results, with the plan left as it is', async () => {
    const { openPlanner, field, store, BUILT_IN_PLAN } = await freshPage();
    const { user } = await openPlanner('demo', false);
    const refused = { ...BUILT_IN_PLAN, sensors: BUILT_IN_PLAN.sensors.map((s) => ({ ...s, lag_s: 0.9 })) };
    store().loadPlannerPlan(refused, { kind: 'file', note: null });
    const problem = (await screen.findByText(/No results for this plan\./)).closest('[role="alert"]');
    expect(problem).toHaveTextContent('Sensor 1 lag: sensor 1 (Sensor 1, 20 mm) lag 0.9 s is outside the valid range 0–0.5 s');
    expect(store().plannerPlan).toBe(refused);
    // Fixing one sensor is taken; the results still give way to the other sensor's message.
    const lag = field('Sensor 1 lag');
    await user.clear(lag);
    await user.paste('20 us');
    expect(store().plannerPlan.sensors[0]?.lag_s).toBeCloseTo(20e-6, 12);
    const still = (await screen.findByText(/No results for this plan\./)).closest('[role="alert"]');
    expect(still).toHaveTextContent('Sensor 2 lag: sensor 2 (Sensor 2, 40 mm) lag 0.9 s is outside the valid range 0–0.5 s');
  });
});
