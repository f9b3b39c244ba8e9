import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { convertDelay, secondSound } from '../../src/physics';
import { formatMeasured } from '../../src/ui/units/format-measured';
import { SPEED_BAND_SHAPE } from '../../src/ui/converter/speed-figure';
import { useSekundoStore } from '../../src/ui/store';
import { lastDraw, lastShape } from './fake-plotly';

type User = ReturnType<typeof userEvent.setup>;

async function openConverter(): Promise<User> {
  const user = userEvent.setup();
  render(<App />);
  await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
  return user;
}

async function typeField(user: User, name: string, text: string) {
  const field = screen.getByRole('textbox', { name });
  await user.clear(field);
  await user.type(field, `${text}{Enter}`);
}

function candidateRows() {
  const table = screen.getByRole('table', { name: /every temperature with u₂/i });
  return within(table).getAllByRole('row').slice(1);
}

/** Catches what the export would download: the Blob behind the object URL and the file name. */
function captureDownloads() {
  const blobs: Blob[] = [];
  const names: string[] = [];
  URL.createObjectURL = vi.fn((blob: Blob) => {
    blobs.push(blob);
    return `blob:test/${blobs.length}`;
  }) as typeof URL.createObjectURL;
  URL.revokeObjectURL = vi.fn();
  const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
    names.push(this.download);
  });
  return { blobs, names, restore: () => click.mockRestore() };
}

describe('converter: one reading', () => {
  it('shows the three temperatures of 50 mm in 2.5 ms (20 m/s lies between the extrema of u₂)', async () => {
    const user = await openConverter();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Distance unit' }), 'mm');
    await typeField(user, 'Distance', '50');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Delay unit' }), 'ms');
    await typeField(user, 'Delay', '2.5');
    expect(screen.getByTestId('speed')).toHaveTextContent('20.00');
    const rows = candidateRows();
    expect(rows).toHaveLength(3);
    // The kernel's own roots, coldest first; the table shows each with its sd, rounded together
    // (0.946 ± 0.006 K, 1.492 ± 0.016 K, 1.785 ± 0.011 K).
    const expected = convertDelay({ distance_m: 0.05, delay_s: 2.5e-3, distanceSd_m: 1e-4, delaySd_s: 2e-6, offset_s: 0, offsetSd_s: 0 }).candidates;
    rows.forEach((row, i) => {
      const c = expected[i];
      const shown = formatMeasured(c?.temperature_K ?? Number.NaN, c?.sd_K ?? null);
      expect(within(row).getAllByRole('cell')[0]).toHaveTextContent(`${shown.value} K`);
      expect(within(row).getAllByRole('cell')[1]).toHaveTextContent(`± ${shown.sd} K`);
    });
    expect(rows.map((r) => within(r).getAllByRole('cell')[0]?.textContent)).toEqual(['0.946 K', '1.492 K', '1.785 K']);
    expect(rows.map((r) => within(r).getAllByRole('cell')[6]?.textContent)).toEqual(['low, falling', 'middle, rising', 'high, falling']);
    // Each candidate is a root of u₂(T) = 20 m/s.
    for (const c of expected) expect(secondSound(c.temperature_K)).toBeCloseTo(20, 9);
    // The band is the speed ± its sd: σu/u = √((0.1 mm / 50 mm)² + (2 µs / 2.5 ms)²).
    const sd = 20 * Math.hypot(1e-4 / 0.05, 2e-6 / 2.5e-3);
    await waitFor(() => expect(lastShape('converter-speed', SPEED_BAND_SHAPE)?.y0).toBeCloseTo(20 - sd, 12));
    expect(lastShape('converter-speed', SPEED_BAND_SHAPE)?.y1).toBeCloseTo(20 + sd, 12);
    const markers = lastDraw('converter-speed')?.data.find((t) => t.name === 'Candidates');
    expect(markers?.x).toHaveLength(3);
    expect(screen.getByText(/Not chosen: give a vapour pressure/)).toBeInTheDocument();
  });

  it('a vapour-pressure reading of 1638.2 Pa picks the candidate near 1.800 K and keeps the others with their reason', async () => {
    const user = await openConverter();
    await typeField(user, 'Vapour pressure', '1638.2');
    expect(screen.getByRole('radio', { name: 'Vapour-pressure reading' })).toBeChecked();
    const rows = candidateRows();
    expect(rows).toHaveLength(3);
    const chosen = rows.filter((r) => r.getAttribute('aria-current') === 'true');
    expect(chosen).toHaveLength(1);
    // ITS-90: 1638.2 Pa is the vapour pressure at 1.8000 K; the high-branch root is 1.7851 K, shown
    // to the digit its sd (11 mK) supports.
    expect(chosen[0]).toHaveTextContent('1.785 K');
    expect(chosen[0]).toHaveTextContent(/nearest to 1\.8000 K from the vapour pressure \(ITS-90\)/);
    expect(screen.getByTestId('chosen-temperature')).toHaveTextContent(/^1\.785$/);
    expect(screen.getByTestId('chosen-temperature').nextElementSibling).toHaveTextContent('± 0.011 K');
    expect(rows[0]).toHaveTextContent(/−854 mK from the vapour-pressure temperature 1\.8000 K/);
    expect(rows[1]).toHaveTextContent(/−308 mK from the vapour-pressure temperature/);
    await waitFor(() => expect(lastDraw('converter-speed')?.data.find((t) => t.name === 'Chosen')?.x[0]).toBeCloseTo(1.7851, 4));
  });

  it('refuses a bad delay with the range and keeps the last result', async () => {
    const user = await openConverter();
    await typeField(user, 'Delay', '2.5');
    const before = screen.getByTestId('speed').textContent;
    await typeField(user, 'Delay', '-3');
    expect(screen.getByRole('alert')).toHaveTextContent('Delay must be 1 ns–10000 s; “-3” is outside.');
    expect(screen.getByRole('textbox', { name: 'Delay' })).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByTestId('speed').textContent).toBe(before);
    expect(candidateRows()).toHaveLength(3);
    expect(useSekundoStore.getState().converterValues.delay).toBe(2.5e-3);

    // Fine alone, impossible with the distance: a speed no second sound has.
    await typeField(user, 'Delay', '0.1');
    expect(screen.getByRole('alert')).toHaveTextContent(/speed d\/\(t − t0\) 500 m\/s is outside the valid range .* m\/s \(no second sound that fast or slow\)/i);
    expect(screen.getByTestId('speed').textContent).toBe(before);

    // Escape brings back the good value.
    await user.type(screen.getByRole('textbox', { name: 'Delay' }), '{Escape}');
    expect(screen.getByRole('textbox', { name: 'Delay' })).toHaveValue('2.5');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('exports the reading as CSV, one row per candidate, in the display units (mm, ms, K by default)', async () => {
    const user = await openConverter();
    await typeField(user, 'Vapour pressure', '1638.2');
    const downloads = captureDownloads();
    await user.click(screen.getByRole('button', { name: 'Export the result as CSV' }));
    downloads.restore();
    expect(downloads.names).toEqual(['sekundo-reading.csv']);
    const text = await downloads.blobs[0]?.text();
    const lines = text?.trimEnd().split('\n') ?? [];
    expect(lines[0]).toBe(
      'distance_mm,distance_sd_mm,delay_ms,delay_sd_ms,offset_ms,offset_sd_ms,speed_m_s,speed_sd_m_s,rule,candidate,T_K,T_sd_K,T_sd_meas_K,T_sd_curve_K,T_lo68_K,T_hi68_K,T_lo95_K,T_hi95_K,reaches95,evidence_sd,slope_m_s_K,branch,region,kind,insensitive,chosen,choice',
    );
    expect(lines).toHaveLength(4);
    const c = convertDelay({ distance_m: 0.05, delay_s: 2.5e-3, distanceSd_m: 1e-4, delaySd_s: 2e-6, offset_s: 0, offsetSd_s: 0 }).candidates[2];
    expect(lines[3]).toBe(
      `50,0.1,2.5,0.002,0,0,20,${20 * Math.hypot(1e-4 / 0.05, 2e-6 / 2.5e-3)},vapour pressure 1638.2 Pa,3,${c?.temperature_K},${c?.sd_K},${c?.sdMeasurement_K},${c?.sdCurve_K},${c?.interval68_K[0]},${c?.interval68_K[1]},${c?.interval95_K[0]},${c?.interval95_K[1]},,${lines[3]?.split(',')[19]},${c?.slope_m_s_K},high,measured,root,false,true,nearest to 1.8000 K from the vapour pressure (ITS-90)`,
    );
    // The distance from the evidence (1.8000 K from 1638.2 Pa) in sd: the chosen 1.785 K is about 1.3 sd below it.
    expect(Number(lines[3]?.split(',')[19])).toBeGreaterThan(0.5);
    expect(Number(lines[3]?.split(',')[19])).toBeLessThan(3);
    expect(screen.getByText('Saved sekundo-reading.csv.')).toBeInTheDocument();
  });

  it('copies the result as tab-separated text', async () => {
    const user = await openConverter();
    await user.click(screen.getByRole('button', { name: 'Copy the result' }));
    const text = await navigator.clipboard.readText();
    expect(text.split('\n')[0]?.split('\t')).toContain('T_K');
    expect(text.split('\n')).toHaveLength(5);
  });

  it('fits delays at several distances: speed, offset and the candidates', async () => {
    const user = await openConverter();
    await user.click(screen.getByRole('tab', { name: 'Several distances' }));
    // The invented example in the table: 1.90 K (u₂ = 18.83 m/s), t₀ = 12 µs.
    expect(screen.getByTestId('speed')).toHaveTextContent('18.8');
    // The offset in its field's own unit (µs), rounded with its sd; the example's t₀ is 12 µs.
    const offset = /Offset t₀([\d.]+) ± ([\d.]+) µs/.exec(screen.getByText(/Offset t₀/).closest('div')?.textContent ?? '');
    expect(offset).not.toBeNull();
    expect(Math.abs(Number(offset?.[1]) - 12)).toBeLessThan(2 * Number(offset?.[2]));
    const cell = screen.getByRole('textbox', { name: 'Row 2 delay' });
    await user.clear(cell);
    await user.type(cell, 'abc{Enter}');
    expect(screen.getByRole('alert')).toHaveTextContent(/Row 2, delay: "abc" does not start with a number\. The last good fit stays in effect\./);
    expect(screen.getByTestId('speed')).toHaveTextContent('18.8');
  });

  it('calibrates the path from the invented sweep and offers it as the distance', async () => {
    const user = await openConverter();
    await user.click(screen.getByRole('tab', { name: 'Path length from a sweep' }));
    await user.click(screen.getByRole('button', { name: 'Load an invented example' }));
    // The example sweep runs over a 48.60 mm path.
    const figure = screen.getByText('Path length L').closest('div')?.textContent ?? '';
    const [, L, sd] = /([\d.]+) ± ([\d.]+) mm/.exec(figure) ?? [];
    expect(Math.abs(Number(L) - 48.6)).toBeLessThan(2 * Number(sd));
    await user.click(screen.getByRole('button', { name: 'Use as the distance' }));
    expect(useSekundoStore.getState().converterValues.distance).toBeCloseTo(0.0486, 4);
  });
});
