/**
 * The converter page says what the data hold: each candidate's 68 % and 95 % intervals and its sd
 * in the measurement's and the u₂ curve's parts; a caution when the delay and the gauge disagree;
 * and a batch through the u₂ maximum left undecided past the turn, both continuations drawn.
 * Numbers: 60.0 mm in 3.02 ms and 2.45 kPa (ITS-90: 1.9198 K); the batch is invented from the
 * kernel's own u₂ and ITS-90.
 */
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { secondSound, vapourPressure } from '../../src/physics';
import { ACROSS_TRACE, ALONG_TRACE } from '../../src/ui/converter/batch-results';
import { lastDraw } from './fake-plotly';

type User = ReturnType<typeof userEvent.setup>;

async function typeField(user: User, name: string, text: string) {
  const field = screen.getByRole('textbox', { name });
  await user.clear(field);
  await user.type(field, `${text}{Enter}`);
}

describe('one reading', () => {
  it('3.02 ms over 60.0 mm with 2.45 kPa: a caution that delay and evidence disagree, and each candidate’s distance in sd', async () => {
    const user = userEvent.setup();
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Distance unit' }), 'mm');
    await typeField(user, 'Distance', '60.0');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Delay unit' }), 'ms');
    await typeField(user, 'Delay', '3.02');
    await typeField(user, 'Vapour pressure', '2450');
    const cautions = screen.getByRole('list', { name: 'Cautions about this reading' });
    expect(within(cautions).getByText(/Delay and evidence disagree/)).toBeInTheDocument();
    expect(cautions).toHaveTextContent(/offset t0.*gauge.*head pressure/);
    const table = screen.getByRole('table', { name: /every temperature with u₂/i });
    const chosen = within(table)
      .getAllByRole('row')
      .find((r) => r.getAttribute('aria-current') === 'true');
    expect(chosen).toHaveTextContent(/\d+ sd \(far\)/);
    // The chosen one's 95 % interval under the key figure, and the sd's two parts in the table.
    expect(screen.getByTestId('chosen-interval')).toHaveTextContent(/95 %: 1\.7\d+ – 1\.8\d+ K/);
    expect(within(table).getByRole('columnheader', { name: /measurement \/ u₂ curve/ })).toBeInTheDocument();
  });
});

describe('a batch through the u₂ maximum', () => {
  it('rows past the turn are undecided with both continuations in the table and on the chart; a later pressure settles them', async () => {
    const temps = Array.from({ length: 41 }, (_, i) => 2.0 - i * 0.015);
    const lines = ['delay_ms,pressure_Pa', ...temps.map((T, i) => `${((0.05 / secondSound(T)) * 1e3).toPrecision(12)},${i === 0 ? vapourPressure(T).pressure_Pa.toPrecision(8) : ''}`)];
    const user = userEvent.setup();
    render(<App />);
    await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
    await user.click(screen.getByRole('tab', { name: 'Batch file' }));
    await user.upload(screen.getByLabelText('Choose a CSV file'), new File([`${lines.join('\n')}\n`], 'cooling.csv', { type: 'text/csv' }));
    expect(await screen.findByTestId('batch-ambiguous')).toHaveTextContent(/past a turn of u₂/);
    expect(screen.getAllByText(/undecided past a turn of u₂/).length).toBeGreaterThan(5);
    expect(screen.getAllByText(/ or /, { selector: '.ambiguous-pair' }).length).toBeGreaterThan(5);
    await waitFor(() => expect(lastDraw('converter-batch')?.data.some((t) => t.name === ALONG_TRACE)).toBe(true));
    expect(lastDraw('converter-batch')?.data.some((t) => t.name === ACROSS_TRACE)).toBe(true);
    // No chosen temperature claims a warming.
    const chosen = lastDraw('converter-batch')?.data.find((t) => t.name === 'Chosen temperature')?.y as number[];
    for (let i = 1; i < chosen.length; i++) expect(chosen[i] as number).toBeLessThan((chosen[i - 1] as number) + 1e-3);
  });
});
