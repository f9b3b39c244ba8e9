import { act, screen, waitFor, within } from '@testing-library/react';
import { lastDraw } from './fake-plotly';
import { field, openPlanner, retype, store, shown } from './planner-helpers';

const sensors = () => store().plannerPlan.sensors;
const resultRows = () => within(screen.getByRole('table', { name: /predicted arrivals/i })).getAllByRole('row').slice(1);
const sensorTraces = () => lastDraw('planner-timeline')?.data.filter((t) => t.legendgroup !== undefined && !t.legendgroup.startsWith('arrivals-')) ?? [];

describe('planner sensors', () => {
  it('adds a sensor beyond the farthest one; the results table and the timeline follow', async () => {
    const { user } = await openPlanner();
    expect(resultRows()).toHaveLength(4);
    await user.click(screen.getByRole('button', { name: 'Add sensor' }));
    expect(sensors()).toHaveLength(5);
    expect(sensors()[4]).toMatchObject({ id: 's5', distance_m: 0.06, responsivity_V_K: 2 });
    expect(resultRows()).toHaveLength(5);
    await waitFor(() => expect(sensorTraces()).toHaveLength(5));
    expect(shown('Sensor 5 distance')).toBe('60 mm');
  });

  it('duplicates a sensor with a new id right after it', async () => {
    const { user } = await openPlanner();
    await user.click(screen.getByRole('button', { name: 'Duplicate sensor 2 (b25)' }));
    expect(sensors().map((s) => s.id)).toEqual(['b10', 'b25', 'b25-copy', 'b35x', 'b50']);
    expect(sensors()[2]).toMatchObject({ label: 'Bolometer B, 25 mm (copy)', distance_m: 0.025 });
    // The copy is its own sensor: editing it leaves the original alone.
    await retype(user, 'Sensor 3 distance', '30 mm');
    expect(sensors()[2]?.distance_m).toBeCloseTo(0.03, 12);
    expect(sensors()[1]?.distance_m).toBe(0.025);
  });

  it('removes a sensor, but never the last one', async () => {
    const { user } = await openPlanner();
    await user.click(screen.getByRole('button', { name: 'Remove sensor 3 (b35x)' }));
    expect(sensors().map((s) => s.id)).toEqual(['b10', 'b25', 'b50']);
    expect(resultRows()).toHaveLength(3);
    await user.click(screen.getByRole('button', { name: 'Remove sensor 1 (b10)' }));
    await user.click(screen.getByRole('button', { name: 'Remove sensor 1 (b25)' }));
    expect(sensors().map((s) => s.id)).toEqual(['b50']);
    expect(screen.getByRole('button', { name: 'Remove sensor 1 (b50)' })).toBeDisabled();
  });

  it('keeps a refused entry with its row when other rows are removed', async () => {
    const { user } = await openPlanner();
    await retype(user, 'Sensor 4 noise', '-1 uV');
    expect(screen.getByRole('alert')).toHaveTextContent(/Sensor 4 noise must be 1e-15–10 V; “-1 uV” is outside/);
    await user.click(screen.getByRole('button', { name: 'Remove sensor 1 (b10)' }));
    // The row moved up and is now sensor 3; its text and message went with it.
    expect(field('Sensor 3 noise')).toHaveValue('-1 uV');
    expect(screen.getByRole('alert')).toBeInTheDocument();
    expect(sensors()[2]?.noise_V).toBe(1e-6);
  });

  it('refuses a duplicate id with the schema’s message, keeping the old one', async () => {
    const { user } = await openPlanner();
    // Pasted at once: each keystroke would be applied while it still makes a good plan ("b1").
    const id = field('Sensor 2 id');
    await user.clear(id);
    await user.paste('b10');
    expect(screen.getByRole('alert')).toHaveTextContent('Sensor 2 id: "b10" is already the id of sensors[0]; ids must be unique');
    expect(sensors()[1]?.id).toBe('b25');
  });

  it('places a sensor by x, y, z and back on the axis', async () => {
    const { user } = await openPlanner();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Sensor 1 position given as' }), 'xyz');
    expect(sensors()[0]?.position_m).toEqual([0, 0, 0.01]);
    await retype(user, 'Sensor 1 x', '3 mm');
    await retype(user, 'Sensor 1 z', '-4 mm');
    expect(screen.getByRole('alert')).toHaveTextContent(/Sensor 1 z must be 1 µm–100 m \(in front of the heater, which faces \+z\)/);
    expect(sensors()[0]?.position_m).toEqual([0.003, 0, 0.01]);
    await user.keyboard('{Escape}');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Sensor 1 position given as' }), 'axis');
    expect(sensors()[0]?.distance_m).toBeCloseTo(Math.hypot(0.003, 0.01), 9);
  });

  it('a plan of many sensors shows 16 rows a page; an added or duplicated sensor’s page is turned to', { timeout: 120_000 }, async () => {
    const { user } = await openPlanner();
    const demo = store().plannerPlan;
    const first = demo.sensors[0];
    if (!first) throw new Error('no sensor');
    const many = Array.from({ length: 18 }, (_, i) => ({ ...first, id: `m${i + 1}`, label: `Many ${i + 1}`, distance_m: 0.01 + 0.001 * i }));
    act(() => store().loadPlannerPlan({ ...demo, sensors: many }, { kind: 'file', note: null }));
    const pages = await screen.findByRole('navigation', { name: 'Pages of sensors' });
    expect(pages).toHaveTextContent('sensors 1–16 of 18');
    expect(screen.getByRole('textbox', { name: 'Sensor 16 noise' })).toBeInTheDocument();
    expect(screen.queryByRole('textbox', { name: 'Sensor 17 noise' })).toBeNull();
    // Every sensor still has its result.
    expect(resultRows()).toHaveLength(18);
    await user.click(within(pages).getByRole('button', { name: 'Later sensors' }));
    expect(pages).toHaveTextContent('sensors 17–18 of 18');
    expect(shown('Sensor 18 distance')).toBe('27 mm');
    await user.click(within(pages).getByRole('button', { name: 'First' }));
    await user.click(screen.getByRole('button', { name: 'Add sensor' }));
    expect(sensors()).toHaveLength(19);
    expect(pages).toHaveTextContent('sensors 17–19 of 19');
    expect(screen.getByRole('textbox', { name: 'Sensor 19 noise' })).toBeInTheDocument();
    await user.click(within(pages).getByRole('button', { name: 'First' }));
    await user.click(screen.getByRole('button', { name: 'Duplicate sensor 16 (m16)' }));
    expect(sensors()[16]?.id).toBe('m16-copy');
    expect(pages).toHaveTextContent('sensors 17–20 of 20');
    expect(screen.getByRole('textbox', { name: 'Sensor 17 id' })).toHaveValue('m16-copy');
  });
});
