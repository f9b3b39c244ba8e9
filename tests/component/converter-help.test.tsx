import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { CONVERTER_CHOICE_HELP, CONVERTER_FIELD_HELP } from '../../src/ui/converter/converter-help';

type User = ReturnType<typeof userEvent.setup>;

async function openConverter(): Promise<User> {
  const user = userEvent.setup();
  render(<App />);
  await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
  return user;
}

/** Every input the user can reach in the converter (not the hidden file inputs of the drop zones). */
function inputs(): HTMLElement[] {
  const panel = document.getElementById('converter-mode-panel') as HTMLElement;
  return [...panel.querySelectorAll<HTMLElement>('input, select, textarea')].filter((el) => !el.matches('[type="file"]'));
}

/** Each input is named and described by its help (the help always says where the value comes from). */
function expectAllHelped(least: number) {
  const all = inputs();
  expect(all.length).toBeGreaterThanOrEqual(least);
  for (const input of all) {
    expect(input).toHaveAccessibleName();
    expect(input, input.outerHTML).toHaveAccessibleDescription(/.{40,}Default/s);
  }
}

describe('converter help', () => {
  it('describes every input of each way of reading and each mode', async () => {
    const user = await openConverter();
    expectAllHelped(15);
    await user.click(screen.getByRole('tab', { name: 'Several distances' }));
    expectAllHelped(15);
    await user.click(screen.getByRole('tab', { name: 'Path length from a sweep' }));
    expectAllHelped(4);
    await user.click(screen.getByRole('tab', { name: 'Batch file' }));
    expectAllHelped(12);
    await user.click(screen.getByRole('tab', { name: 'Trace lab' }));
    expectAllHelped(12);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Picker' }), 'threshold');
    expectAllHelped(12);
  });

  it('says what each field is, its range and its starting value', async () => {
    await openConverter();
    const delay = screen.getByRole('textbox', { name: 'Delay' });
    expect(delay).toHaveAccessibleDescription(expect.stringContaining(CONVERTER_FIELD_HELP.delay.what));
    expect(delay).toHaveAccessibleDescription(expect.stringMatching(/valid 1 ns–10000 s/));
    // The unit menu beside a field shares its help.
    expect(screen.getByRole('combobox', { name: 'Delay unit' })).toHaveAccessibleDescription(expect.stringContaining(CONVERTER_FIELD_HELP.delay.what));
    // A field without a visible label is described by the help of its choice.
    const pressure = screen.getByRole('textbox', { name: 'Vapour pressure' });
    expect(pressure).toHaveAccessibleDescription(expect.stringContaining(CONVERTER_FIELD_HELP.pressure.what));
    expect(screen.getByRole('radio', { name: 'Vapour-pressure reading' })).toHaveAccessibleDescription(expect.stringContaining(CONVERTER_FIELD_HELP.pressure.what));
    expect(screen.getByRole('radio', { name: 'Show all, choose none' })).toHaveAccessibleDescription(expect.stringContaining(CONVERTER_CHOICE_HELP.none.what));
  });

  it('follows the unit chosen for a field', async () => {
    const user = await openConverter();
    const offsetSd = screen.getByRole('textbox', { name: 'Offset sd' });
    await user.selectOptions(screen.getByRole('combobox', { name: 'Offset sd unit' }), 'ms');
    // Ranges read in natural units; the starting value is given in the unit chosen.
    expect(offsetSd).toHaveAccessibleDescription(expect.stringMatching(/valid 0–1000 s Default 0 ms/));
  });

  it('opens and closes a field’s help with its "?" and folds it away with Escape', async () => {
    const user = await openConverter();
    const button = screen.getByRole('button', { name: 'Help: Distance' });
    const panel = document.getElementById(button.getAttribute('aria-controls') ?? '') as HTMLElement;
    expect(panel).not.toBeVisible();
    await user.click(button);
    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(panel).toBeVisible();
    expect(panel).toHaveTextContent(/Units.*mm.*Rangetypically .*valid .*Default/);
    await user.click(button);
    expect(panel).not.toBeVisible();
    await user.click(button);
    await user.keyboard('{Escape}');
    expect(panel).not.toBeVisible();
    expect(button).toHaveAttribute('aria-expanded', 'false');
  });

  it('puts one "?" in each heading of the distance table', async () => {
    const user = await openConverter();
    await user.click(screen.getByRole('tab', { name: 'Several distances' }));
    const table = screen.getByRole('region', { name: 'Delays at several distances' }).querySelector('table') as HTMLElement;
    const helps = within(table).getAllByRole('button', { name: /^Help: / });
    expect(helps.map((b) => b.getAttribute('aria-label'))).toEqual(['Help: distance column', 'Help: delay column', 'Help: delay sd column']);
    expect(within(table).getByRole('textbox', { name: 'Row 2 delay' })).toHaveAccessibleDescription(expect.stringMatching(/valid −10000000 ms – 10000000 ms/));
    await user.click(helps[2] as HTMLElement);
    const panel = document.getElementById(helps[2]?.getAttribute('aria-controls') ?? '') as HTMLElement;
    expect(panel).toBeVisible();
    await user.keyboard('{Escape}');
    expect(panel).not.toBeVisible();
  });
});
