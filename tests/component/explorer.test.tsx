import { fireEvent, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { DB1998, NO_SECOND_SOUND_REASON, NO_VAPOUR_PRESSURE_REASON } from '../../src/physics';

function setup() {
  const user = userEvent.setup();
  render(<App />);
  const field = screen.getByRole('textbox', { name: /temperature/i });
  return { user, field };
}

async function typeTemperature(user: ReturnType<typeof userEvent.setup>, field: HTMLElement, text: string) {
  await user.clear(field);
  await user.type(field, `${text}{Enter}`);
}

/** The table row whose header is `name` (label and symbol, e.g. "Second sound u₂"). */
function propertyRow(name: string): HTMLElement {
  const header = screen.getByRole('rowheader', { name });
  const row = header.closest('tr');
  if (!row) throw new Error(`no row for ${name}`);
  return row;
}

function shownValue(name: string): string {
  return within(propertyRow(name)).getAllByRole('cell')[0]?.textContent ?? '';
}

function readout(): string {
  return screen.getByRole('status', { name: 'Temperature in effect' }).textContent ?? '';
}

describe('property explorer', () => {
  it('opens at 1.8 K with every catalogue property in a captioned table', () => {
    setup();
    expect(readout()).toContain('1.8000 K');
    expect(readout()).toContain('1800.0 mK');
    const table = screen.getByRole('table', { name: /liquid helium-4 at 1\.8000 K/i });
    expect(within(table).getAllByRole('rowheader')).toHaveLength(12);
    expect(shownValue('Second sound u₂')).toBe('19.90');
    // σ(u₂) = 0.0498 m/s: leading digits 498 keep one digit, and u₂ is rounded to the same place.
    expect(within(propertyRow('Second sound u₂')).getByText('± 0.05')).toBeInTheDocument();
    expect(screen.getByText('He II', { selector: '.badge' })).toBeInTheDocument();
  });

  it('applies a temperature typed in mK: "1800 mK" gives u₂ ≈ 19.90 m/s', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '1.2 K');
    expect(shownValue('Second sound u₂')).toBe('18.51');
    await typeTemperature(user, field, '1800 mK');
    expect(shownValue('Second sound u₂')).toBe('19.90');
    expect(readout()).toContain('1800.0 mK');
    // Left with Enter, the box shows the value in effect in the header's unit (K), beside it.
    expect(field).toHaveValue('1.8');
  });

  it.each([
    ['a bare number is in the unit shown (K)', '1.5', '1.5000 K'],
    ['a comma works as the decimal mark', '1,65 K', '1.6500 K'],
    ['a typed unit wins over the unit shown', '2100 mK', '2.1000 K'],
  ])('accepts typed temperatures: %s', async (_, typed, shown) => {
    const { user, field } = setup();
    await typeTemperature(user, field, typed);
    expect(readout()).toContain(shown);
  });

  it('rejects "5 K" with a message naming the field and range, and keeps the last good values', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '5 K');
    const message = screen.getByRole('alert');
    expect(message).toHaveTextContent('Temperature must be 0.3–4.24 K; “5 K” is outside.');
    expect(field).toHaveAttribute('aria-invalid', 'true');
    expect(field).toHaveAccessibleDescription(/Temperature must be 0\.3–4\.24 K/);
    expect(field).toHaveValue('5 K');
    expect(readout()).toContain('1.8000 K');
    expect(shownValue('Second sound u₂')).toBe('19.90');
  });

  it('rejects text that is not a temperature', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, 'cold');
    expect(screen.getByRole('alert')).toHaveTextContent(/^Temperature: “cold” does not start with a number\. Type e\.g\. 1\.8 K or 1800 mK .*valid 0\.3–4\.24 K\.$/);
    expect(readout()).toContain('1.8000 K');
  });

  it('suggests mK when a bare number only makes sense in mK', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '1800');
    expect(screen.getByRole('alert')).toHaveTextContent('did you mean 1800 mK?');
  });

  it('clears the message once a good temperature is applied', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '5 K');
    await typeTemperature(user, field, '2 K');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    expect(field).not.toHaveAttribute('aria-invalid');
  });

  it('applies the typed temperature when the field loses focus', async () => {
    const { user, field } = setup();
    await user.clear(field);
    await user.type(field, '1.65');
    await user.tab();
    expect(readout()).toContain('1.6500 K');
  });

  it('above Tλ shows why there is no second sound instead of a number, and never NaN', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '3 K');
    expect(within(propertyRow('Second sound u₂')).getByText(NO_SECOND_SOUND_REASON)).toBeInTheDocument();
    expect(screen.getByText('He I', { selector: '.badge' })).toBeInTheDocument();
    expect(document.body.textContent).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('labels the Landau-model region and the missing vapour pressure at 0.4 K', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '400 mK');
    expect(screen.getByText('Landau model', { selector: '.badge' })).toBeInTheDocument();
    expect(screen.getByText(/0\.3–0\.55 K is a model region/)).toBeInTheDocument();
    expect(within(propertyRow('Vapour pressure p_sat')).getByText(NO_VAPOUR_PRESSURE_REASON)).toBeInTheDocument();
    expect(document.body.textContent).not.toMatch(/NaN/);
  });

  it('names the vapour-pressure scale: a reference spline below 1.25 K, ITS-90 above', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '1.0 K');
    expect(screen.getByText(/reference spline \(not ITS-90\)/)).toBeInTheDocument();
    await typeTemperature(user, field, '1.5 K');
    expect(screen.getByText('ITS-90')).toBeInTheDocument();
  });

  it('moves with the slider and writes the value back into the field, in place of a refused text', async () => {
    const { user, field } = setup();
    await typeTemperature(user, field, '5 K');
    expect(screen.getByRole('alert')).toBeInTheDocument();
    const slider = screen.getByRole('slider', { name: /sweep the temperature/i });
    fireEvent.change(slider, { target: { value: '2.5' } });
    expect(readout()).toContain('2.5000 K');
    expect(screen.getByRole('textbox', { name: /temperature/i })).toHaveValue('2.5');
    expect(slider).toHaveAttribute('aria-valuetext', '2.5000 K (2500.0 mK)');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('jumps to the u₂ maximum found on the curve', async () => {
    const { user } = setup();
    await user.click(screen.getByRole('button', { name: /u₂ max/ }));
    expect(readout()).toMatch(/1\.65\d\d K/);
    expect(screen.getByText(/insensitive \(below 2 m\/s\/K\)/)).toBeInTheDocument();
  });

  it('shows each row’s note and full source on request', async () => {
    const { user } = setup();
    expect(screen.queryByText(`Source: ${DB1998}, first-sound spline`)).not.toBeInTheDocument();
    await user.click(screen.getByRole('checkbox', { name: /show notes and full sources/i }));
    expect(screen.getByText(`Source: ${DB1998}, first-sound spline`)).toBeInTheDocument();
  });

  it('has the about and cautions section with sources, model regions and hazards', () => {
    setup();
    const about = screen.getByRole('region', { name: 'About and cautions' });
    expect(within(about).getByText(/Metrologia 27, 3 \(1990\)/)).toBeInTheDocument();
    expect(within(about).getByText(/Brooks & R\. J\. Donnelly/)).toBeInTheDocument();
    expect(within(about).getByText(/Asphyxiation/)).toBeInTheDocument();
    expect(within(about).getByText(/planning aid, not a safety system/)).toBeInTheDocument();
    expect(within(about).getByText(/local codes/)).toBeInTheDocument();
  });
});
