import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { secondSound } from '../../src/physics';
import { ARRIVAL_SHAPE, TIME_ZERO_SHAPE } from '../../src/ui/converter/trace/trace-figure';
import { lastDraw, lastShape } from './fake-plotly';

// jsdom has no Web Workers: the worker's boundary is replaced by the same service run in-process.
vi.mock('../../src/ui/converter/trace/trace-port', async () => {
  const { inProcessPort } = await import('./converter-trace-port');
  return { createTracePort: inProcessPort };
});

/*
 * Model of a synthetic trace (invented): 1 MS/s from −200 µs to 3.5 ms; the heater drive ramps
 * linearly from 0 V at −1 µs to 5 V at +1 µs (so its 50 % onset is at t = 0) and stays on for
 * 20 µs; the sensor pulse starts at t_a = 50 mm / u₂(T), rises linearly to 10 mV in 4 µs and
 * decays with a 300 µs time constant, over ±0.2 mV of fixed pseudo-random noise. The fraction
 * picker at 0.5 crosses 5 mV on the linear rise, at t_a + 2 µs (linear interpolation is exact there).
 */
const DISTANCE_M = 0.05;
const STEP_S = 1e-6;

function arrivalFor(T: number): number {
  return DISTANCE_M / secondSound(T);
}

function traceCsv(T: number, timestamp: string | null, seed = 7): string {
  const ta = arrivalFor(T);
  let state = seed;
  const noise = () => {
    state = (state * 16807) % 2147483647;
    return (state / 2147483647 - 0.5) * 0.4e-3;
  };
  const lines = ['# Invented test trace', ...(timestamp ? [`# Timestamp: ${timestamp}`] : []), 'Time (s);heater;sensor'];
  for (let i = -200; i <= 3500; i++) {
    const t = i * STEP_S;
    const heater = t <= -STEP_S ? 0 : t < STEP_S ? (5 * (t + STEP_S)) / (2 * STEP_S) : t <= 20e-6 ? 5 : 0;
    const dt = t - ta;
    const pulse = dt <= 0 ? 0 : dt < 4e-6 ? (10e-3 * dt) / 4e-6 : 10e-3 * Math.exp(-(dt - 4e-6) / 300e-6);
    lines.push(`${t.toPrecision(8)};${heater};${(pulse + noise()).toPrecision(8)}`);
  }
  return `${lines.join('\n')}\n`;
}

async function openTraceLab() {
  const user = userEvent.setup();
  render(<App />);
  await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
  await user.click(screen.getByRole('tab', { name: 'Trace lab' }));
  return user;
}

describe('converter: trace lab', () => {
  it('reads a synthetic trace, picks the arrival at t_a + 2 µs and shows its candidates', async () => {
    const user = await openTraceLab();
    await user.upload(screen.getByLabelText('Choose trace files'), new File([traceCsv(1.8, null)], 'shot.csv', { type: 'text/csv' }));
    const delay = await screen.findByTestId('picked-delay', {}, { timeout: 5000 });
    const expected_ms = (arrivalFor(1.8) + 2e-6) * 1e3;
    const shown = Number(delay.textContent?.replace(' ms', ''));
    expect(Math.abs(shown - expected_ms)).toBeLessThan(0.3e-3);
    // The channel names set the defaults: the heater channel gives time zero.
    expect(screen.getByRole('combobox', { name: 'Heater / trigger channel' })).toHaveValue('heater');
    expect(screen.getByRole('combobox', { name: 'Sensor channel' })).toHaveValue('sensor');
    expect(screen.getByText(/heater onset \(50 % of the drive’s rise\)/)).toBeInTheDocument();
    await waitFor(() => expect(lastShape('converter-trace', ARRIVAL_SHAPE)?.x0).toBeCloseTo(expected_ms, 3));
    expect(lastShape('converter-trace', TIME_ZERO_SHAPE)?.x0).toBe(0);
    const sensor = lastDraw('converter-trace')?.data.find((t) => t.name === 'sensor (sensor)');
    // Min/max decimation: never more than two points per pixel column (plus the two edges).
    expect(sensor?.x.length).toBeLessThanOrEqual(2 * 880 + 2);
    // 50 mm in t_a + 2 µs: a speed between the extrema of u₂, so three candidates, one near 1.8 K.
    const table = screen.getByRole('table', { name: /every temperature with u₂/i });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    // Arriving 2 µs late reads slow, which on the high branch (u₂ falling with T) is about 2 mK warm;
    // the 0.1 mm distance sd makes the sd about 9 mK, so the value is shown to 1 mK.
    expect(rows[2]).toHaveTextContent(/1\.802 K± 0\.009 K/);
  });

  it('switches pickers: the threshold picker finds the first rise, earlier than the half-height point', async () => {
    const user = await openTraceLab();
    await user.upload(screen.getByLabelText('Choose trace files'), new File([traceCsv(1.8, null)], 'shot.csv', { type: 'text/csv' }));
    const fraction = Number((await screen.findByTestId('picked-delay', {}, { timeout: 5000 })).textContent?.replace(' ms', ''));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Picker' }), 'threshold');
    await waitFor(() => expect(Number(screen.getByTestId('picked-delay').textContent?.replace(' ms', ''))).toBeLessThan(fraction - 1e-3));
    const threshold = Number(screen.getByTestId('picked-delay').textContent?.replace(' ms', ''));
    // 5 noise sd of ±0.2 mV uniform noise (sd 0.115 mV) is 0.58 mV: 0.23 µs into the 2.5 mV/µs rise.
    expect(threshold - arrivalFor(1.8) * 1e3).toBeGreaterThan(0);
    expect(threshold - arrivalFor(1.8) * 1e3).toBeLessThan(0.6e-3);
    expect(screen.getByText(/Threshold \(k noise sd\); sensor “sensor”/)).toBeInTheDocument();
  });

  it('makes a temperature series from several files, ordered by their timestamps, and exports it', async () => {
    const user = await openTraceLab();
    const files = [
      new File([traceCsv(1.8, '2026-11-03T15:04:00Z', 11)], 'c-late.csv'),
      new File([traceCsv(1.84, '2026-11-03T15:00:00Z', 12)], 'a-early.csv'),
      new File([traceCsv(1.82, '2026-11-03T15:02:00Z', 13)], 'b-middle.csv'),
    ];
    await user.upload(screen.getByLabelText('Choose trace files'), files);
    await user.click(screen.getByRole('radio', { name: 'Expected temperature' }));
    const table = await screen.findByRole('table', { name: /each file’s delay, speed and temperature/i }, { timeout: 5000 });
    // The T column (after file, timestamp, delay and speed), each about 2 mK warm, to the mK its sd supports.
    await waitFor(() =>
      expect(within(table).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell')[4]?.textContent)).toEqual([
        expect.stringMatching(/^1\.84\d$/),
        expect.stringMatching(/^1\.82\d$/),
        expect.stringMatching(/^1\.80\d$/),
      ]),
    );
    const names = within(table).getAllByRole('button').map((b) => b.textContent);
    expect(names).toEqual(['c-late.csv', 'a-early.csv', 'b-middle.csv'].sort());
    expect(screen.getByText(/3 files, ordered by the timestamp in their headers; 3 with a chosen temperature/)).toBeInTheDocument();

    const blobs: Blob[] = [];
    URL.createObjectURL = vi.fn((blob: Blob) => {
      blobs.push(blob);
      return 'blob:test/series';
    }) as typeof URL.createObjectURL;
    URL.revokeObjectURL = vi.fn();
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    await user.click(screen.getByRole('button', { name: 'Export the series as CSV' }));
    click.mockRestore();
    const lines = ((await blobs[0]?.text()) ?? '').trimEnd().split('\n');
    // Columns in the display units (Pa, ms, K by default).
    expect(lines[0]?.startsWith('order,file,timestamp,pressure_Pa,sensor,heater,picker,delay_ms,delay_sd_ms,snr,speed_m_s,speed_sd_m_s,candidates,chosen,chosen_by,T_K,T_sd_K')).toBe(true);
    expect(lines.slice(1).map((l) => l.split(',').slice(0, 3).join(','))).toEqual(['1,a-early.csv,2026-11-03T15:00:00Z', '2,b-middle.csv,2026-11-03T15:02:00Z', '3,c-late.csv,2026-11-03T15:04:00Z']);
    const T = lines.slice(1).map((l) => Number(l.split(',')[15]));
    // Each file's half-height pick is 2 µs late, which makes it read about 2 mK warm.
    [1.84, 1.82, 1.8].forEach((model, i) => {
      expect(Math.abs((T[i] as number) - model)).toBeLessThan(4e-3);
    });
    expect(lines[2]?.split(',')[14]).toBe('continuity');
  });

  it('refuses a file over the size limit before reading it, naming the limit', async () => {
    await openTraceLab();
    const huge = { name: 'huge.csv', size: 300 * 1024 * 1024, type: 'text/csv' } as File;
    fireEvent.drop(screen.getByRole('group', { name: 'Drop files here' }), { dataTransfer: { files: [huge] } });
    expect(await screen.findByRole('alert')).toHaveTextContent('Not read: huge.csv is 300 MiB, over the 256 MiB limit for one trace file.');
    expect(screen.queryByRole('list', { name: 'Trace files loaded' })).toBeNull();
  });

  it('names the line of a malformed trace', async () => {
    const user = await openTraceLab();
    const text = traceCsv(1.8, null).replace(/\n(0\.0010000000;)/, '\n$1;');
    await user.upload(screen.getByLabelText('Choose trace files'), new File([text], 'broken.csv'));
    const list = await screen.findByRole('list', { name: 'Trace files loaded' });
    await waitFor(() => expect(within(list).getByText(/^line \d+: /)).toBeInTheDocument(), { timeout: 5000 });
    expect(within(list).getByText(/not read/)).toBeInTheDocument();
  });
});
