import { screen, waitFor, within } from '@testing-library/react';
import { REHEARSE_CHART_ID } from '../../src/ui/planner/rehearse/RehearseSection';
import { lastDraw } from './fake-plotly';
import { field, openPlanner, retype, store } from './planner-helpers';
import { runGate } from './planner-rehearse-port';

// jsdom has no Web Workers: the worker's boundary is replaced by the same service run in-process.
vi.mock('../../src/ui/planner/rehearse/rehearse-port', async () => {
  const { inProcessRehearsePort } = await import('./planner-rehearse-port');
  return { createRehearsePort: inProcessRehearsePort };
});

function section() {
  return screen.getByRole('region', { name: 'Rehearse the measurement' });
}

describe('planner: rehearse the measurement', () => {
  it('runs a few trials of the demo plan and shows a row per sensor, notes, the chart and the export', async () => {
    const { user } = await openPlanner();
    const region = section();
    await user.selectOptions(within(region).getByRole('combobox', { name: /Picker/ }), 'fraction');
    await retype(user, 'Trials', '4');
    await user.click(within(region).getByRole('button', { name: 'Run the rehearsal' }));
    await within(region).findByText(/Done: 4 records per sensor/, {}, { timeout: 20000 });
    const table = within(region).getByRole('table', { name: /Rehearsed timing and temperature per sensor/ });
    for (const id of ['b10', 'b25', 'b35x', 'b50']) expect(within(table).getByRole('rowheader', { name: new RegExp(`^${id}`) })).toBeTruthy();
    expect(within(table).getByRole('columnheader', { name: /Planner’s sd/ })).toBeTruthy();
    expect(within(region).getAllByText(/feature sits/).length).toBeGreaterThan(0);
    await waitFor(() => expect(lastDraw(REHEARSE_CHART_ID)).toBeDefined());
    const drawn = lastDraw(REHEARSE_CHART_ID);
    expect(drawn?.data.filter((t) => t.name.startsWith('Trial')).length).toBe(3);
    expect(drawn?.data.some((t) => t.name === 'True arrival')).toBe(true);
    // The chart follows the sensor chosen.
    await user.selectOptions(within(region).getByRole('combobox', { name: 'Sensor' }), 'b50');
    await waitFor(() => expect(lastDraw(REHEARSE_CHART_ID)?.layout).toBeDefined());
    expect(store().rehearseChartSensor).toBe('b50');
    expect(within(region).getByRole('button', { name: 'Download trial 1' })).toBeTruthy();
  }, 60000);

  it('refuses a bad number of trials with one line naming the field and its range, and keeps the last good value', async () => {
    const { user } = await openPlanner();
    await retype(user, 'Trials', '1');
    expect(within(section()).getByText(/Trials must be a whole number 2–100000/)).toBeTruthy();
    expect(store().rehearseOptions.trials).toBe(200);
    await retype(user, 'Seed', 'x');
    expect(within(section()).getByText(/Seed must be a number/)).toBeTruthy();
    expect(store().rehearseOptions.seed).toBe(1);
  });

  it('cancel stops the run and shows nothing from it', async () => {
    const { user } = await openPlanner();
    const region = section();
    await retype(user, 'Trials', '3');
    runGate.hold = true;
    await user.click(within(region).getByRole('button', { name: 'Run the rehearsal' }));
    expect(within(region).getByText(/Trial 0 of 3/)).toBeTruthy();
    await user.click(within(region).getByRole('button', { name: 'Cancel' }));
    expect(within(region).getByText(/Cancelled; nothing from that run is shown/)).toBeTruthy();
    // The run the worker would have finished: nothing of it arrives.
    runGate.release();
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(within(region).queryByRole('table')).toBeNull();
    expect(store().rehearseRun.status).toBe('cancelled');
  });

  it('says when the figures belong to an earlier plan or settings', async () => {
    const { user } = await openPlanner();
    const region = section();
    await retype(user, 'Trials', '2');
    await user.click(within(region).getByRole('button', { name: 'Run the rehearsal' }));
    await within(region).findByText(/Done: 2 records per sensor/, {}, { timeout: 20000 });
    expect(within(region).queryByRole('note')).toBeNull();
    await retype(user, 'Seed', '9');
    expect(within(region).getByRole('note').textContent).toMatch(/run it again/);
  }, 60000);

  it('the input range needs a resolution first', async () => {
    const { user } = await openPlanner();
    await retype(user, 'Input range ±', '1');
    expect(within(section()).getByText(/give the digitiser’s bits first/)).toBeTruthy();
    await retype(user, 'Digitiser resolution (bits)', '12');
    await retype(user, 'Input range ±', '1');
    // A bare number is in the unit the empty field shows: volts.
    expect(store().rehearseOptions).toMatchObject({ resolutionBits: 12, range_V: 1 });
    expect(field('Input range ±').value).toBe('1');
  });
});
