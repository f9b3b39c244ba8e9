import { act } from '@testing-library/react';
import { openPlanner, retype, store, shown } from './planner-helpers';

/**
 * One rule in every view: a bare number is in the unit the field shows. Typing 30 into a distance
 * shown as "10 mm" means 30 mm (not 30 m); 5 into a field shown in W/cm² means 5 W/cm² (not
 * 5 W/m²). A number with a unit keeps its own unit. Unit factors: SI prefixes (1 W/cm² = 10⁴ W/m²).
 */
describe('planner: a bare number is in the unit the field shows', () => {
  it('30 in a distance shown in mm is 30 mm', async () => {
    const { user } = await openPlanner();
    expect(shown('Sensor 1 distance')).toBe('10 mm');
    await retype(user, 'Sensor 1 distance', '30');
    expect(store().plannerPlan.sensors[0]?.distance_m).toBeCloseTo(0.03, 12);
    await user.tab();
    expect(shown('Sensor 1 distance')).toBe('30 mm');
  });

  it('5 in a heat flux shown in W/cm² is 5 W/cm²', async () => {
    const { user } = await openPlanner();
    act(() => store().setDisplayUnit('heatFlux', 'W/cm2'));
    expect(shown('Peak heat flux')).toMatch(/ W\/cm²$/);
    await retype(user, 'Peak heat flux', '5');
    expect(store().plannerPlan.heater.flux_W_m2).toBeCloseTo(5e4, 6);
  });

  it('a number with a unit keeps its own unit; the unit of a bare number stays while typing', async () => {
    const { user } = await openPlanner();
    await retype(user, 'Sensor 1 distance', '2.5 cm');
    expect(store().plannerPlan.sensors[0]?.distance_m).toBeCloseTo(0.025, 12);
    // Shown "20 µs"; typing 1, 10, 100, 1000 stays in µs though 1000 µs would show as 1 ms.
    expect(shown('Sensor 1 lag')).toBe('20 µs');
    await retype(user, 'Sensor 1 lag', '1000');
    expect(store().plannerPlan.sensors[0]?.lag_s).toBeCloseTo(1e-3, 15);
  });
});
