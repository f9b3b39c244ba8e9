import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { secondSound, vapourPressure } from '../../src/physics';
import { useSekundoStore } from '../../src/ui/store';
import { lastDraw } from './fake-plotly';

/*
 * Model of the batch (invented): a 50 mm path, no offset, delays 50 mm / u₂(T) written to 12
 * significant digits for a bath at 1.90, 1.86, 1.82 and 1.78 K; the first row carries the
 * ITS-90 vapour pressure of 1.90 K, which decides it; the others follow by continuity. Each
 * speed between the extrema of u₂ has three candidates, so only that choice can give back T.
 */
const MODEL_K = [1.9, 1.86, 1.82, 1.78];
const DISTANCE_M = 0.05;

function modelCsv(): string {
  const lines = ['timestamp,delay_ms,pressure_Pa'];
  MODEL_K.forEach((T, i) => {
    const pressure = i === 0 ? vapourPressure(T).pressure_Pa.toPrecision(12) : '';
    lines.push(`2026-11-03T14:0${i}:00Z,${((DISTANCE_M / secondSound(T)) * 1e3).toPrecision(12)},${pressure}`);
  });
  return `${lines.join('\n')}\n`;
}

async function openBatch() {
  const user = userEvent.setup();
  render(<App />);
  await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
  await user.click(screen.getByRole('tab', { name: 'Batch file' }));
  return user;
}

function resultRows() {
  return within(screen.getByRole('table', { name: /each reading’s speed and temperature/i })).getAllByRole('row').slice(1);
}

describe('converter: batch file', () => {
  it('converts every row, chooses by the pressure row then by continuity, and charts the series', async () => {
    const user = await openBatch();
    await user.upload(screen.getByLabelText('Choose a CSV file'), new File([modelCsv()], 'cooldown.csv', { type: 'text/csv' }));
    expect(await screen.findByText(/4 readings; 4 with a chosen temperature/)).toBeInTheDocument();
    const rows = resultRows();
    expect(rows).toHaveLength(4);
    // Lines 2–5 of the file; the temperature and its sd are rounded together (the same decimals),
    // and the temperature gives back the model to within that rounding.
    rows.forEach((row, i) => {
      const cells = within(row).getAllByRole('cell');
      expect(within(row).getByRole('rowheader')).toHaveTextContent(String(i + 2));
      const [value = '', sd = ''] = [cells[4]?.textContent, cells[5]?.textContent];
      const decimals = value.split('.')[1]?.length ?? 0;
      expect(sd.split('.')[1]?.length ?? 0).toBe(decimals);
      expect(Math.abs(Number(value) - (MODEL_K[i] as number))).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-12);
      expect(cells[7]?.textContent).toBe(i === 0 ? 'pressure' : 'continuity');
    });
    expect(rows[0]).toHaveTextContent('14:00:00');
    await waitFor(() => expect(lastDraw('converter-batch')?.data.find((t) => t.name === 'Chosen temperature')?.y).toHaveLength(4));
    const chosen = lastDraw('converter-batch')?.data.find((t) => t.name === 'Chosen temperature');
    chosen?.y.forEach((T, i) => {
      expect(T).toBeCloseTo(MODEL_K[i] as number, 9);
    });
    // Minutes since the first reading on the x axis, from the timestamps.
    expect(chosen?.x).toEqual([0, 1, 2, 3]);
  });

  it('exports the results as CSV in the display units: one line per reading, the model temperatures in full precision', async () => {
    const user = await openBatch();
    await user.upload(screen.getByLabelText('Choose a CSV file'), new File([modelCsv()], 'cooldown log.csv', { type: 'text/csv' }));
    await screen.findByText(/4 readings/);
    const blobs: Blob[] = [];
    const names: string[] = [];
    URL.createObjectURL = vi.fn((blob: Blob) => {
      blobs.push(blob);
      return 'blob:test/1';
    }) as typeof URL.createObjectURL;
    URL.revokeObjectURL = vi.fn();
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      names.push(this.download);
    });
    await user.click(screen.getByRole('button', { name: 'Export the batch results as CSV' }));
    click.mockRestore();
    expect(names).toEqual(['cooldown-log-temperatures.csv']);
    expect(blobs[0]?.type).toBe('text/csv;charset=utf-8');
    const lines = ((await blobs[0]?.text()) ?? '').trimEnd().split('\n');
    expect(lines[0]).toBe(
      'line,timestamp,delay_ms,distance_mm,pressure_Pa,speed_m_s,speedSd_m_s,candidates,chosen,chosen_by,T_K,T_sd_K,T_sd_meas_K,T_sd_curve_K,T_lo68_K,T_hi68_K,T_lo95_K,T_hi95_K,evidence_sd,alternatives,guess,warnings,T1_K,T1_sd_K,T1_branch,T1_note,T2_K,T2_sd_K,T2_branch,T2_note,T3_K,T3_sd_K,T3_branch,T3_note',
    );
    expect(lines).toHaveLength(5);
    lines.slice(1).forEach((line, i) => {
      const cells = line.split(',');
      expect(cells[0]).toBe(String(i + 2));
      expect(cells[1]).toBe(`2026-11-03T14:0${i}:00Z`);
      expect(cells[3]).toBe('50');
      expect(Number(cells[5])).toBeCloseTo(secondSound(MODEL_K[i] as number), 9);
      expect(cells[7]).toBe('3');
      expect(cells[8]).toBe('3');
      expect(cells[9]).toBe(i === 0 ? 'pressure' : 'continuity');
      expect(Number(cells[10])).toBeCloseTo(MODEL_K[i] as number, 9);
      expect(cells[32]).toBe('high');
    });
  });

  it('refuses a malformed file with its line and keeps the batch already loaded', async () => {
    const user = await openBatch();
    const input = screen.getByLabelText('Choose a CSV file');
    await user.upload(input, new File([modelCsv()], 'good.csv', { type: 'text/csv' }));
    await screen.findByText(/4 readings/);
    await user.upload(input, new File(['delay_ms\n2.5\n2.6x\n'], 'bad.csv', { type: 'text/csv' }));
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent(/^bad\.csv: Line 3: column "delay_ms":? "2\.6x" is not a number\. The batch loaded before stays\.$/);
    expect(resultRows()).toHaveLength(4);
    expect(useSekundoStore.getState().converterBatch?.fileName).toBe('good.csv');
  });

  it('refuses a distance that one row of the batch cannot take, naming the line and the range', async () => {
    const user = await openBatch();
    await user.upload(screen.getByLabelText('Choose a CSV file'), new File([modelCsv()], 'good.csv', { type: 'text/csv' }));
    await screen.findByText(/4 readings/);
    const field = screen.getByRole('textbox', { name: 'Distance' });
    await user.clear(field);
    // Pasted whole: typed, "5" (5 mm) would apply on the way, as a good value applies as it is typed.
    await user.paste('5 m');
    expect(screen.getByRole('alert')).toHaveTextContent(/With this value the batch cannot be converted: line 2: speed d\/\(t − t0\) .* m\/s is outside the valid range/);
    expect(useSekundoStore.getState().converterValues.distance).toBe(0.05);
    expect(resultRows()).toHaveLength(4);
  });
});
