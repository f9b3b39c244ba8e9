import { readFileSync } from 'node:fs';
import { screen, waitFor, within } from '@testing-library/react';
import { serializePlanFile } from '../../src/io/plan-file';
import { BUILT_IN_PLAN } from '../../src/ui/planner/default-plan';
import { demoPlan, openPlanner, store } from './planner-helpers';

describe('loading plans', () => {
  it('starts from the built-in plan, and says so, when the demo is missing', async () => {
    await openPlanner('missing');
    expect(store().plannerPlan).toBe(BUILT_IN_PLAN);
    expect(screen.getByText('Built-in plan')).toBeInTheDocument();
    expect(screen.getByText(/The demo plan could not be loaded \(the server answered 404 Not Found\), so the planner starts from its built-in plan\./)).toBeInTheDocument();
  });

  it('starts from the built-in plan when the page is offline', async () => {
    await openPlanner('offline');
    expect(store().plannerPlan).toBe(BUILT_IN_PLAN);
    expect(screen.getByText(/could not be loaded \(Failed to fetch\)/)).toBeInTheDocument();
  });

  it('opens a plan file, and keeps the current plan when a file is refused', async () => {
    const { user } = await openPlanner('missing');
    const chooser = screen.getByLabelText('Plan file to open');
    const good = new File([serializePlanFile(demoPlan())], 'orrin.json', { type: 'application/json' });
    await user.upload(chooser, good);
    await waitFor(() => expect(store().plannerPlan).toEqual(demoPlan()));
    expect(screen.getByText('From a file')).toBeInTheDocument();

    const before = store().plannerPlan;
    const broken = JSON.parse(serializePlanFile(demoPlan()));
    broken.heater.width_s = -1;
    broken.sensors[1].lag_s = 'slow';
    await user.upload(chooser, new File([JSON.stringify(broken)], 'broken.json', { type: 'application/json' }));
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('“broken.json” was not opened; the current plan is kept.');
    expect(within(alert).getByText(/^Pulse width: must be 10 ns–10 s \(got -1\)/)).toBeInTheDocument();
    expect(within(alert).getByText(/^Sensor 2 lag: must be a number/)).toBeInTheDocument();
    expect(store().plannerPlan).toBe(before);
  });

  it('opens a version-1 plan file, brought up to date, and says in the plan bar what changed', async () => {
    const { user } = await openPlanner('missing');
    const v1 = readFileSync('tests/fixtures/plan-version-1.json', 'utf8');
    await user.upload(screen.getByLabelText('Plan file to open'), new File([v1], 'old-orrin.json', { type: 'application/json' }));
    await waitFor(() => expect(store().plannerPlan.version).toBe(2));
    expect(store().plannerPlan.heater).toMatchObject({ geometry: 'rectangle', width_m: 0.01, height_m: 0.01 });
    const note = screen.getByText(/Opened “old-orrin\.json”\. Written by an older Sekundo \(plan format version 1\)/);
    expect(note).toHaveTextContent(/planar film of 1 cm² is now a 10 mm × 10 mm rectangle/);
    expect(note).toHaveTextContent(/Save the plan to keep it in the new format/);
  });

  it('loads the demo only once, whatever the tabs do', async () => {
    const { user, fetchMock } = await openPlanner();
    await user.click(screen.getByRole('tab', { name: 'Helium properties' }));
    await user.click(screen.getByRole('tab', { name: 'Plan a measurement' }));
    await screen.findByRole('region', { name: 'Bath' });
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });
});
