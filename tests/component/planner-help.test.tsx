import { screen, within } from '@testing-library/react';
import { PLAN_NUMBER_HELP, PLAN_OTHER_HELP } from '../../src/ui/planner/planner-help';
import { openPlanner } from './planner-helpers';

type User = Awaited<ReturnType<typeof openPlanner>>['user'];

/** The planner's editors: the plan bar and the input cards (the results have no inputs of the plan). */
function editors(): HTMLElement[] {
  const bar = screen.getByRole('region', { name: 'Plan' });
  const cards = ['Bath', 'Heater', 'Digitiser and targets', 'Spacer and reflections', 'Sensors'].map((name) => screen.getByRole('region', { name }));
  return [bar, ...cards];
}

/** Every input the user can reach in the editors (not the hidden file input). */
function inputs(): HTMLElement[] {
  return editors().flatMap((region) => [...region.querySelectorAll<HTMLElement>('input, select, textarea')].filter((el) => !el.matches('[type="file"]')));
}

/** Each input is named and described by its help: the help always ends with where the value comes from. */
function expectAllHelped() {
  const all = inputs();
  expect(all.length).toBeGreaterThan(20);
  for (const input of all) {
    expect(input).toHaveAccessibleName();
    expect(input, input.outerHTML).toHaveAccessibleDescription(/.{40,}Default/s);
  }
  return all.length;
}

/** Shows the inputs the demo hides: the bath as a temperature, a disk driven by power, a custom pulse, a sensor by x y z. */
async function showOtherInputs(user: User) {
  await user.click(screen.getByRole('radio', { name: 'Temperature' }));
  await user.selectOptions(screen.getByRole('combobox', { name: 'Heater geometry' }), 'disk');
  await user.click(screen.getByRole('radio', { name: 'Power' }));
  await user.selectOptions(screen.getByRole('combobox', { name: 'Sensor 1 position given as' }), 'xyz');
  await user.selectOptions(screen.getByRole('combobox', { name: 'Pulse shape' }), 'custom');
}

describe('planner help', () => {
  it('describes every input of the demo plan with its help', async () => {
    await openPlanner();
    expectAllHelped();
    expect(screen.getByRole('textbox', { name: 'Pulse width' })).toHaveAccessibleDescription(expect.stringContaining(PLAN_NUMBER_HELP['heater.width']?.what ?? '?'));
    expect(screen.getByRole('textbox', { name: 'Pulse width' })).toHaveAccessibleDescription(expect.stringContaining('valid 10 ns–10 s'));
    expect(screen.getByRole('radio', { name: 'Temperature' })).toHaveAccessibleDescription(expect.stringContaining(PLAN_OTHER_HELP['bath.mode'].what));
    expect(screen.getByRole('combobox', { name: 'Spacer material' })).toHaveAccessibleDescription(expect.stringContaining(PLAN_OTHER_HELP['spacer.materialId'].what));
    expect(screen.getByRole('checkbox', { name: /measured warm/ })).toHaveAccessibleDescription(expect.stringContaining(PLAN_OTHER_HELP['spacer.measuredWarm'].what));
    expect(screen.getByRole('textbox', { name: 'Plan name' })).toHaveAccessibleDescription(expect.stringContaining(PLAN_OTHER_HELP['plan.name'].what));
  });

  it('describes the inputs the demo hides too', async () => {
    const { user } = await openPlanner();
    const before = inputs().length;
    await showOtherInputs(user);
    expect(expectAllHelped()).toBeGreaterThan(before);
    expect(screen.getByRole('textbox', { name: 'Disk radius' })).toHaveAccessibleDescription(expect.stringContaining(PLAN_NUMBER_HELP['heater.radius']?.what ?? '?'));
    expect(screen.getByRole('textbox', { name: 'Peak power' })).toHaveAccessibleDescription(expect.stringContaining(PLAN_NUMBER_HELP['heater.power']?.what ?? '?'));
    expect(screen.getByRole('textbox', { name: 'Point 1 amplitude' })).toHaveAccessibleDescription(expect.stringContaining(PLAN_NUMBER_HELP['pulse.amplitude']?.what ?? '?'));
    expect(screen.getByRole('textbox', { name: /^Pulse points/ })).toHaveAccessibleDescription(expect.stringContaining(PLAN_OTHER_HELP['pulse.paste'].what));
  });

  it('gives table cells the help of their column', async () => {
    const { user } = await openPlanner();
    const responsivity = screen.getByRole('textbox', { name: 'Sensor 2 responsivity' });
    expect(responsivity).toHaveAccessibleDescription(expect.stringContaining(PLAN_NUMBER_HELP['sensor.responsivity']?.what ?? '?'));
    // The cells' own labels are hidden: the one "?" sits in the column heading.
    expect(screen.queryByRole('button', { name: 'Help: Sensor 2 responsivity' })).toBeNull();
    const table = screen.getByRole('table', { name: /Sensors: position/ });
    const headings = within(table).getAllByRole('columnheader');
    expect(headings.filter((h) => within(h).queryByRole('button', { name: /^Help: / })).map((h) => h.textContent?.replace(/\s*\?$/, ''))).toEqual([
      'Id',
      'Label',
      'Position',
      'Distance sd',
      'Area',
      'Responsivity',
      'Noise (rms)',
      'Lag τ',
    ]);
    // A plane's R: a solid wall by default, with where R comes from; a measured R is typed, with its range.
    expect(screen.getByRole('combobox', { name: 'Plane 1 R from' })).toHaveAccessibleDescription(expect.stringContaining('Kapitza conductance'));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Plane 1 R from' }), 'measured');
    expect(screen.getByRole('textbox', { name: 'Plane 1 reflection R' })).toHaveAccessibleDescription(expect.stringContaining('valid from −1 to 1'));
  });

  it('opens and closes a field’s help with its "?" and folds it away with Escape', async () => {
    const { user } = await openPlanner();
    const button = screen.getByRole('button', { name: 'Help: Pulse width' });
    const panel = document.getElementById(button.getAttribute('aria-controls') ?? '') as HTMLElement;
    expect(button).toHaveAttribute('aria-expanded', 'false');
    expect(panel).not.toBeVisible();
    await user.click(button);
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel).toBeVisible();
    expect(panel).toHaveTextContent(/Unitsany time unit.*Rangetypically .*valid 10 ns–10 s.*Defaultthe plan in use/);
    await user.click(button);
    expect(panel).not.toBeVisible();
    await user.click(button);
    expect(panel).toBeVisible();
    await user.keyboard('{Escape}');
    expect(panel).not.toBeVisible();
    expect(button).toHaveAttribute('aria-expanded', 'false');
  });

  it('opens a column’s help from its heading', async () => {
    const { user } = await openPlanner();
    const button = screen.getByRole('button', { name: 'Help: responsivity' });
    const panel = document.getElementById(button.getAttribute('aria-controls') ?? '') as HTMLElement;
    await user.click(button);
    expect(panel).toBeVisible();
    expect(panel).toHaveTextContent(PLAN_NUMBER_HELP['sensor.responsivity']?.what ?? '?');
    await user.keyboard('{Escape}');
    expect(panel).not.toBeVisible();
  });

  it('keeps the range in the help current when it follows another field', async () => {
    const { user } = await openPlanner();
    const width = screen.getByRole('textbox', { name: 'Pulse width' });
    await user.clear(width);
    await user.type(width, '50 us');
    expect(screen.getByRole('textbox', { name: 'Rise time' })).toHaveAccessibleDescription(expect.stringContaining('valid 0.05 ns–50 µs'));
  });
});
