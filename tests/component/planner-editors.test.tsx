import { screen, waitFor, within } from '@testing-library/react';
import { planFileToInput } from '../../src/io/plan-file';
import { computePlan } from '../../src/physics';
import { lastDraw } from './fake-plotly';
import { openPlanner, repaste, retype, store, shown } from './planner-helpers';

const heater = () => store().plannerPlan.heater;

describe('planner editors', () => {
  it('applies a typed value with units as the user types, and the results follow', async () => {
    const { user } = await openPlanner();
    const drawsBefore = lastDraw('planner-timeline');
    await retype(user, 'Pulse width', '200 us');
    expect(heater().width_s).toBeCloseTo(2e-4, 15);
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    const energy = computePlan(planFileToInput(store().plannerPlan)).heater.energyPerPulse_J;
    const summary = screen.getByRole('region', { name: 'Heater and bath' });
    expect(within(summary).getByText('Energy per pulse').nextElementSibling).toHaveTextContent(`${(energy * 1e6).toFixed(1)} µJ`);
    await waitFor(() => expect(lastDraw('planner-timeline')).not.toBe(drawsBefore));
  });

  it('reads a bare number in the unit the field shows', async () => {
    const { user } = await openPlanner();
    expect(shown('Pulse width')).toBe('0.1 ms');
    await retype(user, 'Pulse width', '0.3');
    expect(heater().width_s).toBe(3e-4);
  });

  it('refuses an out-of-range value with a message naming the field and its range, and keeps the plan', async () => {
    const { user } = await openPlanner();
    const before = store().plannerPlan;
    const input = await repaste(user, 'Pulse width', '20 s');
    const alert = screen.getByRole('alert');
    expect(alert).toHaveTextContent('Pulse width must be 10 ns–10 s; “20 s” is outside.');
    expect(input).toHaveAttribute('aria-invalid', 'true');
    expect(input).toHaveAccessibleDescription(/Pulse width must be 10 ns–10 s/);
    expect(store().plannerPlan).toBe(before);
    // Leaving the field keeps the refused text and its message: nothing typed is lost.
    await user.tab();
    expect(input).toHaveValue('20 s');
    expect(screen.getByRole('alert')).toBeInTheDocument();
    // Escape brings back the value in effect.
    await user.click(input);
    await user.keyboard('{Escape}');
    // Shown in the header's time unit (ms unless chosen otherwise).
    expect(shown('Pulse width')).toBe('0.1 ms');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('refuses text that is not a quantity of the right kind, listing the units', async () => {
    const { user } = await openPlanner();
    await retype(user, 'Repetition rate', 'fast');
    expect(screen.getByRole('alert')).toHaveTextContent(/Repetition rate: “fast” does not start with a number\. Type e\.g\. 5 Hz \(units Hz, kHz, MHz, GHz/);
    await retype(user, 'Repetition rate', '5 mm');
    expect(screen.getByRole('alert')).toHaveTextContent('Repetition rate: “5 mm” has a unit that is not a frequency.');
    expect(heater().repetitionRate_Hz).toBe(5);
    await retype(user, 'Repetition rate', '2 Hz');
    expect(heater().repetitionRate_Hz).toBe(2);
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('checks ranges that depend on other fields (rise time at most the width)', async () => {
    const { user } = await openPlanner();
    await repaste(user, 'Rise time', '150 us');
    expect(screen.getByRole('alert')).toHaveTextContent('Rise time must be 0.1 ns–100 µs (a millionth of the pulse width up to the width)');
    expect(heater().riseTime_s).toBe(1e-6);
    await repaste(user, 'Pre-trigger', '30 ms');
    expect(screen.getAllByRole('alert').map((a) => a.textContent)).toContain('Pre-trigger must be 0–20 ms (at most the record length); “30 ms” is outside.');
    expect(store().plannerPlan.digitiser.preTrigger_s).toBe(0.001);
  });

  it('gives the bath as a vapour-pressure reading or a temperature, converting between them', async () => {
    const { user } = await openPlanner();
    expect(shown('Vapour pressure over the bath')).toBe('1638.2 Pa');
    expect(screen.getByText(/T = 1\.79999\d K \(ITS-90\)/)).toBeInTheDocument();
    await retype(user, 'Vapour pressure over the bath', '12.5 torr');
    expect(store().plannerPlan.bath.vapourPressure_Pa).toBeCloseTo((12.5 * 101325) / 760, 9);
    await user.click(screen.getByRole('radio', { name: 'Temperature' }));
    expect(store().plannerPlan.bath.vapourPressure_Pa).toBeUndefined();
    const T = store().plannerPlan.bath.temperature_K as number;
    expect(T).toBeGreaterThan(1.7);
    await retype(user, 'Bath temperature', '1500 mK');
    expect(store().plannerPlan.bath.temperature_K).toBe(1.5);
    await retype(user, 'Bath temperature', '5 K');
    expect(screen.getByRole('alert')).toHaveTextContent('Bath temperature must be 0.3–4.24 K');
    expect(store().plannerPlan.bath.temperature_K).toBe(1.5);
  });

  it('switches the heater to a disk of the same area, and back', async () => {
    const { user } = await openPlanner();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Heater geometry' }), 'disk');
    expect(heater().geometry).toBe('disk');
    expect(heater().radius_m).toBeCloseTo(Math.sqrt(1e-4 / Math.PI), 8);
    expect(shown('Disk radius')).toBe('5.64190 mm'.replace('5.64190', String(Number((Math.sqrt(1e-4 / Math.PI) * 1e3).toPrecision(6)))));
    expect(screen.getByText(/pulses turn bipolar/)).toBeInTheDocument();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Heater geometry' }), 'rectangle');
    expect(heater().geometry).toBe('rectangle');
    expect((heater().width_m as number) * (heater().height_m as number)).toBeCloseTo(1e-4, 12);
    expect(shown('Heater width')).toBe('10 mm');
    expect(shown('Heater height')).toBe('10 mm');
  });

  it('offers a small source on a wall (2π) or free in the liquid (4π)', async () => {
    const { user } = await openPlanner();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Heater geometry' }), 'point-free');
    expect(heater()).toMatchObject({ geometry: 'point', mount: 'free' });
    expect(screen.getByText(/radiating all round \(4π\)/)).toBeInTheDocument();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Heater geometry' }), 'point-wall');
    expect(heater()).toMatchObject({ geometry: 'point', mount: 'wall' });
  });

  it('gives the drive as power or flux', async () => {
    const { user } = await openPlanner();
    expect(shown('Peak heat flux')).toBe('0.1 W/cm²');
    await retype(user, 'Peak heat flux', '0.5 W/cm2');
    expect(heater().flux_W_m2).toBe(5000);
    await user.click(screen.getByRole('radio', { name: 'Power' }));
    expect(heater().power_W).toBeCloseTo(0.5, 12);
    expect(shown('Peak power')).toBe('500 mW');
  });

  it('edits a custom pulse as points and from pasted lines', async () => {
    const { user } = await openPlanner();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Pulse shape' }), 'custom');
    expect(heater().shape).toEqual({ custom: [[0, 0], [1e-6, 1], [9.9e-5, 1], [1e-4, 0]] });
    await retype(user, 'Point 3 time', '50 us');
    expect(heater().shape).toEqual({ custom: [[0, 0], [1e-6, 1], [5e-5, 1], [1e-4, 0]] });
    // Times must increase: the schema's message names the point.
    await retype(user, 'Point 3 time', '200 us');
    expect(screen.getByRole('alert')).toHaveTextContent(/Pulse point 4 time: times must increase/);
    expect(heater().shape).toEqual({ custom: [[0, 0], [1e-6, 1], [5e-5, 1], [1e-4, 0]] });
    await user.keyboard('{Escape}');

    await user.click(screen.getByText(/Paste points as/));
    const paste = screen.getByRole('textbox', { name: /Pulse points, one/ });
    await user.click(paste);
    await user.paste('0 us, 0\n10 us, 1\n30 us, 0.5 # tail\n60 us, 0');
    await user.click(screen.getByRole('button', { name: 'Use these points' }));
    expect(heater().shape).toEqual({ custom: [[0, 0], [1e-5, 1], [3e-5, 0.5], [6e-5, 0]] });
    expect(screen.getAllByRole('textbox', { name: /^Point \d time$/ })).toHaveLength(4);

    await user.clear(paste);
    await user.type(paste, '0, 0{Enter}ten, 1');
    await user.click(screen.getByRole('button', { name: 'Use these points' }));
    expect(screen.getByRole('alert')).toHaveTextContent('Pulse points, line 2: “ten” is not a time');
    expect(heater().shape).toEqual({ custom: [[0, 0], [1e-5, 1], [3e-5, 0.5], [6e-5, 0]] });
  });

  it('shows the cautions for heaters in a cryogenic bath next to the heater inputs', async () => {
    await openPlanner();
    const heaterCard = screen.getByRole('region', { name: 'Heater' });
    const caution = within(heaterCard).getByRole('complementary', { name: 'Heater safety' });
    expect(caution).toHaveTextContent(/vacuum/);
    expect(caution).toHaveTextContent(/pressure/);
    expect(caution).toHaveTextContent(/local codes and your lab's licensed safety practice/);
  });
});
