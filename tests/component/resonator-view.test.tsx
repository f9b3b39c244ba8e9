/**
 * The resonator view: the demo opens with its plan, fits, candidates, line density and lock-in
 * series; inputs go through the one quantity field (a bare number in the unit shown; a refusal
 * names the field and its range); a bad file is refused in one line and the old one kept.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { parseLockinCsv, parseSweepCsv } from '../../src/io/resonance-csv';
import { secondSound } from '../../src/physics';
import { DEMO_RESONATOR_INPUTS, DEMO_RESONATOR_NAME } from '../../src/ui/resonator/load-demo';
import { ResonatorView } from '../../src/ui/resonator/ResonatorView';
import { useSekundoStore } from '../../src/ui/store';
import { lastDraw } from './fake-plotly';

const read = (name: string) => readFileSync(join(process.cwd(), 'public', name));

async function openDemo() {
  useSekundoStore.getState().finishResonatorLoad({
    inputs: DEMO_RESONATOR_INPUTS,
    reference: { name: 'demo-resonator-reference.csv', data: parseSweepCsv(read('demo-resonator-reference.csv')) },
    sweep: { name: 'demo-resonator-sweep.csv', data: parseSweepCsv(read('demo-resonator-sweep.csv')) },
    lockin: { name: 'demo-resonator-lockin.csv', data: parseLockinCsv(read('demo-resonator-lockin.csv')) },
    origin: DEMO_RESONATOR_NAME,
  });
  const user = userEvent.setup();
  render(<ResonatorView />);
  await waitFor(() => expect(lastDraw('resonator-lockin')).toBeDefined());
  return { user };
}

describe('resonator view', () => {
  it('shows the demo: modes, fit, the chosen temperature, L with sds and the lock-in chart', async () => {
    await openDemo();
    expect(screen.getByText(/Kestrel-2 resonator \(invented demo\)/)).toBeInTheDocument();
    const spacing = Number((screen.getByTestId('resonator-mode-spacing').textContent ?? '').replace(/[^\d.]/g, ''));
    expect(spacing).toBeCloseTo(secondSound(1.85) / (2 * 0.00997), 2);
    const fit = screen.getByTestId('resonator-fit');
    expect(within(fit).getByText('centre f₀').closest('tr')).toHaveTextContent(/7809\.1\d+ ± 0\.00\d/);
    // The chosen candidate (nearest the bath temperature typed) is the 1.85 K one.
    expect(screen.getByRole('table', { name: /Every temperature with u₂/ })).toHaveTextContent(/1\.850/);
    expect(screen.getByTestId('resonator-line-density')).toHaveTextContent(/L = \(3\.0\d+ ± 0\.0\d+\) × 10⁸ m⁻²/);
    expect(lastDraw('resonator-sweep')?.data.map((t) => t.name)).toEqual(expect.arrayContaining(['fit', 'reference fit', 'residual x', 'residual y']));
    expect(lastDraw('resonator-lockin')?.data.map((t) => t.name)).toEqual(expect.arrayContaining(['line density L', 'drift of f₀']));
    expect(screen.getByRole('button', { name: 'Download the line density and f₀ drift as CSV' })).toBeEnabled();
    expect(screen.getByText('Heaters, counterflow and cryogens')).toBeInTheDocument();
  });

  it('reads a bare number in the unit shown and refuses a gap outside its range, keeping the last good one', async () => {
    const { user } = await openDemo();
    const gap = screen.getByLabelText('Plate gap');
    await user.clear(gap);
    await user.type(gap, '20');
    expect(useSekundoStore.getState().resonatorInputs.gap_m).toBeCloseTo(0.02, 12);
    await user.clear(gap);
    // Pasted whole: typed key by key, "5" alone would apply 5 mm first (a good value applies as typed).
    await user.paste('5 m');
    expect(screen.getByRole('alert')).toHaveTextContent(/Plate gap must be .*10 µm.*1 m/);
    expect(useSekundoStore.getState().resonatorInputs.gap_m).toBeCloseTo(0.02, 12);
  });

  it('without a mode number, says how to get temperatures; a neighbouring resonance gives n', async () => {
    const { user } = await openDemo();
    const mode = screen.getByLabelText('Mode number n');
    await user.clear(mode);
    expect(screen.getByText(/no mode number: type n, or the neighbouring resonance/)).toBeInTheDocument();
    const neighbour = screen.getByLabelText('Neighbouring resonance');
    await user.type(neighbour, '8.7854 kHz');
    await waitFor(() => expect(screen.getByTestId('resonator-speed')).toHaveTextContent(/n = 8 \(from the neighbouring resonance/));
  });

  it('refuses a file without the needed columns in one line and keeps the sweep it had', async () => {
    const { user } = await openDemo();
    const file = new File(['time_s,x,y\n0,1,1\n'], 'wrong.csv', { type: 'text/csv' });
    await user.upload(screen.getByLabelText('Choose a sweep CSV'), file);
    await waitFor(() => expect(screen.getByText(/wrong\.csv: line 1: no column "frequency_Hz"/)).toBeInTheDocument());
    expect(useSekundoStore.getState().resonatorSweep?.name).toBe('demo-resonator-sweep.csv');
  });

  it('every input has its help', async () => {
    await openDemo();
    for (const label of ['Plate gap', 'Gap sd', 'Gap measured', 'Plate diameter', 'Bath temperature', 'Modes listed', 'Target resolution', 'Expected width Δ₀', 'Amplitude noise σA/A₀', 'Tangle geometry', 'Mode number n', 'Neighbouring resonance', 'Bath vapour pressure', 'Drive frequency']) {
      expect(screen.getByRole('button', { name: new RegExp(`Help.*${label.replace(/[()]/g, '.')}|${label.replace(/[()]/g, '.')}.*help`, 'i') })).toBeInTheDocument();
    }
  });
});
