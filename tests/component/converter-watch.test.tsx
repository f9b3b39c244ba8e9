/**
 * "Follow a folder" in the converter (src/ui/converter/watch/): files are read through the trace
 * worker's service (run in-process: jsdom has no workers), picked, converted and shown live; a
 * folder handle is stubbed with files the test adds and grows over time (real timers, looks 0.1 s
 * apart). Traces are the invented ones of tests/support/watch-traces.ts.
 */
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { useSekundoStore } from '../../src/ui/store';
import { watchLive } from '../../src/ui/converter/watch/watch-live';
import { stopWatch } from '../../src/ui/converter/watch/watch-runner';
import { BAND_SHAPE, CROSSING_TRACE, WATCH_TRACE } from '../../src/ui/converter/watch/watch-figure';
import { BAD_TRACE_TEXT, watchTraceText } from '../support/watch-traces';
import { lastDraw, lastShape } from './fake-plotly';

vi.mock('../../src/ui/converter/trace/trace-port', async () => {
  const { inProcessPort } = await import('./converter-trace-port');
  return { createTracePort: inProcessPort };
});

/** A folder handle in memory, as the File System Access API gives one; the test writes into it. */
class FakeFolder {
  readonly kind = 'directory' as const;
  readonly name = 'run-12';
  files = new Map<string, File>();
  write(name: string, text: string, modified_ms = Date.now()): void {
    this.files.set(name, new File([text], name, { type: 'text/csv', lastModified: modified_ms }));
  }
  async *entries(): AsyncIterable<[string, { kind: 'file' }]> {
    for (const name of this.files.keys()) yield [name, { kind: 'file' }];
  }
  async getFileHandle(name: string): Promise<{ getFile(): Promise<File> }> {
    const file = this.files.get(name);
    if (!file) throw new DOMException(`${name} is gone`, 'NotFoundError');
    return { getFile: async () => file };
  }
}

type PickerWindow = Window & { showDirectoryPicker?: unknown };

async function openWatch() {
  const user = userEvent.setup();
  render(<App />);
  await user.click(screen.getByRole('tab', { name: 'Read the temperature' }));
  await user.click(screen.getByRole('tab', { name: 'Follow a folder' }));
  return user;
}

function tableTemperatures(): string[] {
  const table = screen.getByRole('table', { name: /Each file’s time, delay, chosen temperature with its sd in parts, and alarm/ });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((r) => within(r).getAllByRole('cell')[3]?.textContent ?? '');
}

beforeEach(() => {
  useSekundoStore.getState().setConverterChoice('expected');
  useSekundoStore.getState().setWatchInterval(0.1);
});

afterEach(() => {
  stopWatch();
  watchLive.clear();
  delete (window as PickerWindow).showDirectoryPicker;
});

describe('Follow a folder', () => {
  it('without a folder picker says so and reads dropped files the same way, listing a bad one with its message', async () => {
    await openWatch();
    expect(screen.getByText(/This browser cannot follow a folder/)).toBeInTheDocument();
    const files = [
      new File([watchTraceText(1.86, '2026-11-03T15:00:00Z', 1)], 'shot-1.csv', { type: 'text/csv' }),
      new File([BAD_TRACE_TEXT], 'shot-2.csv', { type: 'text/csv' }),
      new File([watchTraceText(1.85, '2026-11-03T15:02:00Z', 2)], 'shot-3.csv', { type: 'text/csv' }),
    ];
    fireEvent.drop(screen.getByRole('group', { name: 'Drop files here' }), { dataTransfer: { files } });
    await waitFor(() => expect(tableTemperatures()).toHaveLength(2), { timeout: 8000 });
    // Newest first; the expected temperature 1.8 K decides the first, continuity the next (about 9 mK warm: the half-height pick).
    expect(tableTemperatures()).toEqual([expect.stringMatching(/^1\.85\d ± 0\.00\d$/), expect.stringMatching(/^1\.86\d ± 0\.00\d$/)]);
    const notRead = screen.getByRole('list', { name: 'Files not read' });
    expect(within(notRead).getByText('shot-2.csv')).toBeInTheDocument();
    expect(notRead).toHaveTextContent(/no data rows|time column|not a trace/i);
    await waitFor(() => expect(lastDraw('watch-live')?.data.find((t) => t.name === WATCH_TRACE)?.y).toHaveLength(2));
  });

  it('follows a picked folder: reads a file once its size settles, not while it grows; pauses and resumes; exports the series', async () => {
    const folder = new FakeFolder();
    (window as PickerWindow).showDirectoryPicker = vi.fn(async () => folder);
    const user = await openWatch();
    expect(screen.queryByText(/This browser cannot follow a folder/)).toBeNull();
    folder.write('shot-1.csv', watchTraceText(1.86, '2026-11-03T15:00:00Z', 1));
    await user.click(screen.getByRole('button', { name: 'Choose a folder to follow' }));
    expect((window as PickerWindow).showDirectoryPicker).toHaveBeenCalledWith({ mode: 'read', id: 'sekundo-watch' });
    await waitFor(() => expect(tableTemperatures()).toHaveLength(1), { timeout: 8000 });
    expect(screen.getByText('Following').closest('p')).toHaveTextContent('Following folder “run-12” · 1 read');

    // A file still being written: a new part before each look keeps it waiting.
    const text = watchTraceText(1.85, null, 2);
    const grow = setInterval(() => {
      const now = folder.files.get('shot-2.csv');
      const have = now ? now.size : 0;
      folder.write('shot-2.csv', text.slice(0, Math.min(text.length, have + 20_000)));
    }, 30);
    await new Promise((r) => setTimeout(r, 400));
    expect(tableTemperatures()).toHaveLength(1);
    await waitFor(() => expect(folder.files.get('shot-2.csv')?.size).toBe(text.length), { timeout: 8000 });
    clearInterval(grow);
    await waitFor(() => expect(tableTemperatures()).toHaveLength(2), { timeout: 8000 });
    // No timestamp in its header: the time is the file's, and the row says so.
    expect(screen.getByText('(file time)')).toBeInTheDocument();
    expect(screen.queryByRole('list', { name: 'Files not read' })).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Pause' }));
    folder.write('shot-3.csv', watchTraceText(1.84, '2026-11-03T15:04:00Z', 3));
    await new Promise((r) => setTimeout(r, 500));
    expect(tableTemperatures()).toHaveLength(2);
    expect(screen.getByText('Paused').closest('p')).toHaveTextContent(/^Paused folder “run-12” · 2 read/);
    await user.click(screen.getByRole('button', { name: 'Resume' }));
    await waitFor(() => expect(tableTemperatures()).toHaveLength(3), { timeout: 8000 });

    const blobs: Blob[] = [];
    URL.createObjectURL = vi.fn((blob: Blob) => {
      blobs.push(blob);
      return 'blob:test/live';
    }) as typeof URL.createObjectURL;
    URL.revokeObjectURL = vi.fn();
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    await user.click(screen.getByRole('button', { name: 'Export the series as CSV' }));
    click.mockRestore();
    const lines = ((await blobs[0]?.text()) ?? '').trimEnd().split('\n');
    expect(lines[0]).toBe(
      'order,file,time,time_from,time_header,pressure_Pa,delay_ms,delay_sd_ms,snr,speed_m_s,speed_sd_m_s,candidates,chosen,chosen_by,T_K,T_sd_K,T_sd_meas_K,T_sd_curve_K,T_lo68_K,T_hi68_K,T_lo95_K,T_hi95_K,alarm,warnings,problem',
    );
    expect(lines.slice(1).map((l) => l.split(',').slice(0, 4).join(','))).toEqual([
      '1,shot-1.csv,2026-11-03T15:00:00.000Z,header',
      expect.stringMatching(/^2,shot-2\.csv,\d{4}-\d\d-\d\dT[\d:.]+Z,file modified$/),
      '3,shot-3.csv,2026-11-03T15:04:00.000Z,header',
    ]);
    // The sd in its parts (measurement ⊕ u₂ curve = whole) and the intervals around T, as the trace lab's series export gives them.
    const header = (lines[0] as string).split(',');
    const first = (lines[1] as string).split(',');
    const at = (name: string) => Number(first[header.indexOf(name)]);
    expect(Math.abs(Math.hypot(at('T_sd_meas_K'), at('T_sd_curve_K')) / at('T_sd_K') - 1)).toBeLessThan(1e-3);
    expect(at('T_sd_curve_K')).toBeGreaterThan(0);
    expect(at('T_lo95_K')).toBeLessThan(at('T_lo68_K'));
    expect(at('T_lo68_K')).toBeLessThan(at('T_K'));
    expect(at('T_hi68_K')).toBeGreaterThan(at('T_K'));
    expect(at('T_hi95_K')).toBeGreaterThan(at('T_hi68_K'));
  }, 30_000);

  it('a band alarm marks the chart, the table and the page title, and clears when the band is widened', async () => {
    const folder = new FakeFolder();
    (window as PickerWindow).showDirectoryPicker = vi.fn(async () => folder);
    const user = await openWatch();
    const base = document.title;
    folder.write('a.csv', watchTraceText(1.86, '2026-11-03T15:00:00Z', 1));
    folder.write('b.csv', watchTraceText(1.85, '2026-11-03T15:01:00Z', 2));
    await user.click(screen.getByRole('button', { name: 'Choose a folder to follow' }));
    await waitFor(() => expect(tableTemperatures()).toHaveLength(2), { timeout: 8000 });
    await user.click(screen.getByRole('checkbox', { name: /Band: alarm outside/ }));
    // The default band 1.795–1.805 K: both readings (about 1.86 and 1.85 K) lie above it.
    await waitFor(() => expect(document.title).toMatch(/^\(!\) Band alarm: 1\.85\d\d K is .* above the band 1\.7950 K–1\.8050 K/));
    expect(screen.getByRole('alert')).toHaveTextContent(/Alarm: 1\.85\d\d K is .* above the band/);
    await waitFor(() => expect(lastShape('watch-live', BAND_SHAPE)).toMatchObject({ y0: 1.795, y1: 1.805 }));
    expect(lastDraw('watch-live')?.data.find((t) => t.name === CROSSING_TRACE)?.x).toHaveLength(1);
    const rows = within(screen.getByRole('table', { name: /Each file’s time/ })).getAllByRole('row').slice(1);
    expect(rows[1]).toHaveClass('watch-row--crossing');
    expect(rows[0]).toHaveClass('watch-row--alarm');

    const to = screen.getByRole('textbox', { name: 'Band to' });
    await user.clear(to);
    await user.type(to, '9');
    expect(screen.getByText(/^Band to must be 0\.3–4\.24 K .*; “9” is outside\.$/)).toBeInTheDocument();
    await user.clear(to);
    await user.type(to, '1.7');
    expect(screen.getByText('Band to must be above the lower edge, 1.795 K.')).toBeInTheDocument();
    // The band in effect is still 1.795–1.805 K: the title still shows the alarm.
    expect(document.title).toMatch(/^\(!\) Band alarm/);
    await user.clear(to);
    await user.type(to, '1900 mK{Enter}');
    await waitFor(() => expect(document.title).toBe(base));
    await waitFor(() => expect(lastDraw('watch-live')?.data.find((t) => t.name === CROSSING_TRACE)).toBeUndefined());
  }, 30_000);

  it('a change of distance converts every file read so far again, once typing pauses (not on each keystroke)', async () => {
    const folder = new FakeFolder();
    (window as PickerWindow).showDirectoryPicker = vi.fn(async () => folder);
    const user = await openWatch();
    folder.write('a.csv', watchTraceText(1.86, '2026-11-03T15:00:00Z', 1));
    await user.click(screen.getByRole('button', { name: 'Choose a folder to follow' }));
    await waitFor(() => expect(tableTemperatures()).toHaveLength(1), { timeout: 8000 });
    const before = tableTemperatures()[0];
    const distance = screen.getByRole('textbox', { name: 'Distance' });
    await user.clear(distance);
    await user.type(distance, '50.5{Enter}');
    // Just typed: the series waits for a pause in typing (typing-pause.ts) before converting again.
    expect(tableTemperatures()[0]).toBe(before);
    await waitFor(() => expect(tableTemperatures()[0]).not.toBe(before));
    expect(tableTemperatures()).toHaveLength(1);
  });
});
