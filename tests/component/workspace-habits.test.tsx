import { act, cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { App } from '../../app/App';
import { heliumProperties } from '../../src/physics';
import { type KeyValueStore, memoryStore } from '../../src/io/workspace-storage';
import { PREFERENCES_NOT_KEPT, startPreferences } from '../../src/ui/preferences/persist-preferences';
import { resetSekundoStore, useSekundoStore } from '../../src/ui/store';
import { LocateView } from '../../src/ui/locate/LocateView';
import { fakePlotly, lastDraw } from './fake-plotly';
import { DEMO_SENSORS } from './locate-helpers';

const PREFS_KEY = 'sekundo.prefs';
const store = () => useSekundoStore.getState();

/** Downloads the page offers, caught where the page hands them to the browser. */
interface Download {
  name: string;
  blob: Blob;
}
let downloads: Download[] = [];
let stopPreferences: (() => void) | null = null;

beforeEach(() => {
  downloads = [];
  const blobs = new Map<string, Blob>();
  let n = 0;
  vi.stubGlobal('URL', Object.assign(URL, {
    createObjectURL: (blob: Blob) => {
      n += 1;
      const url = `blob:test/${n}`;
      blobs.set(url, blob);
      return url;
    },
    revokeObjectURL: () => undefined,
  }));
  vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
    const blob = blobs.get(this.href);
    if (blob) downloads.push({ name: this.download, blob });
  });
});

afterEach(() => {
  stopPreferences?.();
  stopPreferences = null;
  delete document.documentElement.dataset.theme;
  delete document.documentElement.dataset.themeChoice;
  vi.restoreAllMocks();
  vi.unstubAllGlobals();
});

const ALL_GUIDES = 'explorer,planner,converter,locate,resonator';

/** A browser store that already holds preferences (every guide put away, unless `prefs` says otherwise). */
function storeWith(prefs: Record<string, string> = { guides: ALL_GUIDES }): KeyValueStore {
  const kept = memoryStore();
  kept.setItem(PREFS_KEY, JSON.stringify(prefs));
  return kept;
}

function kept(browser: KeyValueStore): Record<string, string> {
  return JSON.parse(browser.getItem(PREFS_KEY) ?? '{}') as Record<string, string>;
}

/** The page as main.tsx starts it: preferences first, then the app (with its charts drawn). */
async function openPage(browser: KeyValueStore | null) {
  stopPreferences = startPreferences(browser);
  const user = userEvent.setup();
  render(<App />);
  await waitFor(() => {
    for (const id of ['speeds', 'fractions', 'thermometry']) expect(lastDraw(id)).toBeDefined();
  });
  return { user };
}

/** A reload: the store starts afresh and reads the browser's preferences again. */
async function reload(browser: KeyValueStore | null) {
  cleanup();
  stopPreferences?.();
  resetSekundoStore();
  return openPage(browser);
}

function propertyRow(name: string): HTMLElement {
  const row = screen.getByRole('rowheader', { name }).closest('tr');
  if (!row) throw new Error(`no row for ${name}`);
  return row;
}

describe('theme', () => {
  it('the header toggle sets data-theme on <html> and is kept for the next visit', async () => {
    const browser = storeWith({ guides: ALL_GUIDES, other: 'kept' });
    const { user } = await openPage(browser);
    expect(screen.getByRole('radio', { name: 'System' })).toBeChecked();
    await user.click(screen.getByRole('radio', { name: 'Dark' }));
    expect(document.documentElement.dataset.theme).toBe('dark');
    expect(kept(browser)).toMatchObject({ theme: 'dark', guides: ALL_GUIDES, other: 'kept' });

    await reload(browser);
    expect(document.documentElement.dataset.theme).toBe('dark');
    expect(screen.getByRole('radio', { name: 'Dark' })).toBeChecked();
  });

  it('"System" follows the system setting, and charts are drawn in the theme in effect', async () => {
    let dark = true;
    const listeners = new Set<() => void>();
    vi.stubGlobal('matchMedia', (query: string) => ({
      get matches() {
        return query.includes('dark') && dark;
      },
      media: query,
      addEventListener: (_: string, f: () => void) => listeners.add(f),
      removeEventListener: (_: string, f: () => void) => listeners.delete(f),
    }));
    const { user } = await openPage(storeWith());
    expect(document.documentElement.dataset.theme).toBe('dark');
    await waitFor(() => expect(lastDraw('speeds')?.layout.plot_bgcolor).toBe('#101823'));
    // The ink-coloured u₁ curve is lightened for the dark plot; the figure as written stays light.
    const u1 = lastDraw('speeds')?.data.find((t) => t.name === 'u₁ first sound');
    expect(u1?.line?.color).toBe('#93a5e6');

    act(() => {
      dark = false;
      for (const f of listeners) f();
    });
    expect(document.documentElement.dataset.theme).toBe('light');
    await waitFor(() => expect(lastDraw('speeds')?.layout.plot_bgcolor).toBe('#ffffff'));

    await user.click(screen.getByRole('radio', { name: 'Dark' }));
    expect(document.documentElement.dataset.theme).toBe('dark');
    expect(document.documentElement.dataset.themeChoice).toBe('dark');
  });
});

describe('display units', () => {
  it('a unit chosen in the header panel changes the explorer table and readout, and is kept', async () => {
    const browser = storeWith();
    const { user } = await openPage(browser);
    const vapour = heliumProperties(1.8).vapourPressure_Pa ?? Number.NaN;
    expect(within(propertyRow('Vapour pressure p_sat')).getAllByRole('cell')[0]).toHaveTextContent(String(Math.round(vapour)));

    const unitsButton = screen.getByRole('button', { name: /^Units/ });
    await user.click(unitsButton);
    expect(unitsButton).toHaveAttribute('aria-expanded', 'true');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Pressure' }), 'mbar');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Temperature' }), 'mK');

    const cells = within(propertyRow('Vapour pressure p_sat')).getAllByRole('cell');
    expect(cells[0]).toHaveTextContent((vapour / 100).toPrecision(4));
    expect(cells[1]).toHaveTextContent('mbar');
    expect(screen.getByRole('table', { name: /liquid helium-4 at 1800\.0 mK/i })).toBeInTheDocument();
    expect(screen.getByRole('status', { name: 'Temperature in effect' })).toHaveTextContent(/^1800\.0 mK/);
    expect(screen.getByRole('textbox', { name: /temperature/i })).toHaveValue('1800');
    // The charts' temperature axis follows.
    await waitFor(() => expect(lastDraw('speeds')?.layout.xaxis?.title?.text).toBe('Temperature T (mK)'));

    // Escape closes the panel and gives focus back to its button.
    await user.keyboard('{Escape}');
    expect(unitsButton).toHaveAttribute('aria-expanded', 'false');
    expect(unitsButton).toHaveFocus();
    expect(kept(browser)).toMatchObject({ 'unit.pressure': 'mbar', 'unit.temperature': 'mK' });

    await reload(browser);
    expect(store().displayUnits.pressure).toBe('mbar');
    expect(within(propertyRow('Vapour pressure p_sat')).getAllByRole('cell')[1]).toHaveTextContent('mbar');
  });

  it('ignores a unit the page does not offer (a stale or edited preference)', async () => {
    await openPage(storeWith({ guides: ALL_GUIDES, 'unit.length': 'furlong', 'unit.time': 'µs', theme: 'sepia' }));
    expect(store().displayUnits.length).toBe('mm');
    expect(store().displayUnits.time).toBe('µs');
    expect(store().themeChoice).toBe('system');
  });
});

describe('exports', () => {
  it('the property table as CSV: every property with its value, sd, unit and source, RFC 4180 quoting', async () => {
    const { user } = await openPage(storeWith({ guides: ALL_GUIDES, 'unit.pressure': 'torr' }));
    await user.click(screen.getByRole('button', { name: 'Download the property table as CSV' }));
    expect(downloads).toHaveLength(1);
    const [download] = downloads;
    expect(download?.name).toBe('helium-properties-1.8000K.csv');
    const text = await download?.blob.text();
    const lines = (text ?? '').split('\r\n');
    expect(lines[0]).toBe('temperature (K),property,symbol,value,sd,unit,note,source');
    expect(lines).toHaveLength(12 + 2); // header, 12 properties, and the final line end
    const p = heliumProperties(1.8);
    const u2 = lines.find((l) => l.startsWith('1.8,Second sound,u₂,'));
    // Every digit the kernel gave, and the source quoted because it holds commas.
    expect(u2).toBe(`1.8,Second sound,u₂,${p.secondSound_m_s},${p.secondSoundSd_m_s},m/s,,"${'R. J. Donnelly & C. F. Barenghi, J. Phys. Chem. Ref. Data 27, 1217 (1998)'}, second-sound spline; below 0.5517 K ${'L. Landau (1941, 1947) phonon–roton model; roton parameters: J. S. Brooks & R. J. Donnelly, J. Phys. Chem. Ref. Data 6, 51 (1977)'}"`);
    const vapour = lines.find((l) => l.startsWith('1.8,Vapour pressure,'))?.split(',');
    expect(Number(vapour?.[3])).toBeCloseTo(((p.vapourPressure_Pa ?? 0) * 760) / 101325, 9);
    expect(vapour?.[5]).toBe('torr');
  });

  it('an absent value leaves its cells empty and says why', async () => {
    const { user } = await openPage(storeWith());
    act(() => store().setTemperature(3));
    await user.click(screen.getByRole('button', { name: 'Download the property table as CSV' }));
    const lines = ((await downloads[0]?.blob.text()) ?? '').split('\r\n');
    const u2 = lines.find((l) => l.startsWith('3,Second sound,u₂,'));
    expect(u2).toMatch(/^3,Second sound,u₂,,,m\/s,.+second sound/i);
  });

  it('each chart offers PNG and SVG through the wrapper, named after the chart id', async () => {
    const { user } = await openPage(storeWith());
    await waitFor(() => expect(lastDraw('speeds')).toBeDefined());
    const svg = screen.getByRole('button', { name: 'Download the chart of u₂ and u₁ against temperature as SVG' });
    await waitFor(() => expect(svg).toBeEnabled());
    await user.click(svg);
    await user.click(screen.getByRole('button', { name: /Download the chart of the superfluid and normal fractions.* as PNG/ }));
    await waitFor(() => expect(downloads).toHaveLength(2));
    expect(fakePlotly.images.map((i) => [i.chartId, i.options.format])).toEqual([
      ['speeds', 'svg'],
      ['fractions', 'png'],
    ]);
    expect(downloads.map((d) => [d.name, d.blob.type])).toEqual([
      ['sekundo-speeds.svg', 'image/svg+xml'],
      ['sekundo-fractions.png', 'image/png'],
    ]);
    expect(await downloads[0]?.blob.text()).toContain('<svg');
    // The PNG arrives as base64 and leaves as bytes.
    expect(new TextDecoder().decode(await downloads[1]?.blob.arrayBuffer())).toBe('PNG');
    // Keyboard users reach them: plain buttons in the tab order.
    expect(svg.tagName).toBe('BUTTON');
    expect(svg).not.toHaveAttribute('tabindex', '-1');
  });
});

describe('locate view', () => {
  async function openLocate(prefs: Record<string, string>) {
    stopPreferences = startPreferences(storeWith({ guides: ALL_GUIDES, ...prefs }));
    store().loadLocateSensors(DEMO_SENSORS, { kind: 'demo', name: 'demo', note: null });
    const user = userEvent.setup();
    render(<LocateView />);
    await waitFor(() => expect(lastDraw('locate-projection-1')).toBeDefined());
    return { user };
  }

  it('shows lengths and times in the chosen units: fields, headings, charts', async () => {
    await openLocate({ 'unit.length': 'cm', 'unit.time': 'µs' });
    expect(screen.getByLabelText('x of U0 (cm)')).toHaveValue('15');
    expect(screen.getByLabelText('Arrival at U0 (µs)')).toHaveValue('11563');
    const table = screen.getByRole('table', { name: 'Sensor positions and readings' });
    expect(within(table).getAllByRole('columnheader').map((h) => h.textContent?.replace(/\s*\?$/, ''))).toEqual(
      expect.arrayContaining(['x (cm)', 'Arrival (µs)', 'Timing sd']),
    );
    expect(lastDraw('locate-projection-1')?.layout.xaxis?.title?.text).toBe('x (cm)');
    const u0 = lastDraw('locate-projection-1')?.data.find((t) => t.name === 'sensors');
    expect(u0?.x).toContain(15);
    // The source to the digit its sd supports, in cm.
    expect(screen.getByRole('table', { name: 'Source position' })).toHaveTextContent(/x \(cm\)/);
  });

  it('the residuals table as CSV, in the chosen time unit', async () => {
    const { user } = await openLocate({ 'unit.time': 's' });
    await user.click(screen.getByRole('button', { name: 'Download the residuals table as CSV' }));
    const lines = ((await downloads[0]?.blob.text()) ?? '').split('\r\n');
    expect(downloads[0]?.name).toBe('locate-residuals.csv');
    expect(lines[0]).toBe('sensor,predicted arrival (s),residual (us),residual / sd,status');
    expect(lines).toHaveLength(DEMO_SENSORS.length + 2);
    expect(lines.find((l) => l.startsWith('L225,'))).toMatch(/^L225,0\.011\d+,2\d\d\.\d+,4\.\d+,"OUTLIER, kept in the fit"$/);
  });

  it('every input is labelled and says what it takes (help in its description)', async () => {
    const { user } = await openLocate({});
    await user.selectOptions(screen.getByRole('combobox', { name: 'Source on a surface' }), 'cylinder');
    const inputs = [...document.querySelectorAll<HTMLElement>('input, select, textarea')].filter((el) => !el.matches('[type="file"]'));
    expect(inputs.length).toBeGreaterThan(50);
    for (const input of inputs) {
      expect(input).toHaveAccessibleName();
      expect(input, input.outerHTML).toHaveAccessibleDescription(/.{20,}/);
    }
    // The "?" shows the same help on screen.
    const help = screen.getByRole('button', { name: 'Help: Bath temperature T90' });
    await user.click(help);
    expect(help).toHaveAttribute('aria-expanded', 'true');
    const panel = document.getElementById(help.getAttribute('aria-controls') ?? '');
    expect(panel).toBeVisible();
    expect(panel).toHaveTextContent(/Units.*K.*Range.*Default1\.8 K/);
    await user.keyboard('{Escape}');
    expect(panel).not.toBeVisible();
  });
});

describe('explorer help', () => {
  it('every input of the explorer is labelled and described', async () => {
    await openPage(storeWith());
    const main = document.querySelector('main') as HTMLElement;
    const inputs = [...main.querySelectorAll<HTMLElement>('input, select, textarea')];
    expect(inputs.length).toBeGreaterThanOrEqual(3);
    for (const input of inputs) {
      expect(input).toHaveAccessibleName();
      expect(input, input.outerHTML).toHaveAccessibleDescription(/.{20,}/);
    }
    expect(screen.getAllByRole('button', { name: /^Help: / }).map((b) => b.getAttribute('aria-label'))).toEqual([
      'Help: Temperature',
      'Help: sweep the temperature',
      'Help: jump to',
      'Help: show notes and full sources',
    ]);
  });
});

describe('first-visit guides', () => {
  it('show inline above each view on a first visit, cover nothing, and stay away once put away', async () => {
    const browser = memoryStore();
    const { user } = await openPage(browser);
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(document.querySelector('main')).not.toHaveAttribute('inert');
    const guide = screen.getByRole('complementary', { name: /^First time here\? Start with the bath temperature/ });
    expect(within(guide).getByText(/About and cautions/)).toBeInTheDocument();
    // The view under the guide works as usual.
    expect(screen.getByRole('table', { name: /liquid helium-4 at 1\.8000 K/i })).toBeInTheDocument();

    await user.click(within(guide).getByRole('button', { name: 'Got it' }));
    expect(screen.queryByRole('complementary', { name: /^First time here/ })).toBeNull();
    expect(kept(browser)).toMatchObject({ guides: 'explorer' });
    // Another view keeps its own guide until it too is put away.
    await user.click(screen.getByRole('tab', { name: 'Plan a measurement' }));
    expect(screen.getByRole('complementary', { name: /^First time here\? Edit the demo plan/ })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Hide all guides' }));
    expect(kept(browser)).toMatchObject({ guides: 'explorer,planner,converter,locate,resonator' });

    const again = await reload(browser);
    expect(screen.queryByRole('complementary', { name: /^First time here/ })).toBeNull();
    await again.user.click(screen.getByRole('button', { name: 'Show the first-visit guides again' }));
    expect(screen.getByRole('complementary', { name: /^First time here\? Start with the bath temperature/ })).toBeInTheDocument();
    expect(kept(browser)).toMatchObject({ guides: '' });
  });

  it('an earlier version’s closed tour counts as every guide put away', async () => {
    await openPage(storeWith({ tour: 'done' }));
    expect(screen.queryByRole('complementary', { name: /^First time here/ })).toBeNull();
  });
});

describe('storage faults', () => {
  it('storage turned off: the page says so once, unobtrusively, and works on', async () => {
    const { user } = await openPage(null);
    // Nothing kept: a first visit every time, so the guide shows; it covers nothing.
    expect(screen.getByRole('complementary', { name: /^First time here/ })).toBeInTheDocument();
    // The first change that cannot be kept says so.
    await user.click(screen.getByRole('radio', { name: 'Dark' }));
    expect(document.documentElement.dataset.theme).toBe('dark');
    const notice = screen.getByRole('status', { name: '' });
    expect(screen.getByText(PREFERENCES_NOT_KEPT)).toBeInTheDocument();
    expect(notice).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Dismiss' }));
    expect(screen.queryByText(PREFERENCES_NOT_KEPT)).toBeNull();

    // Later changes work and do not bring the message back.
    await user.click(screen.getByRole('radio', { name: 'Light' }));
    expect(document.documentElement.dataset.theme).toBe('light');
    expect(screen.queryByText(PREFERENCES_NOT_KEPT)).toBeNull();
    expect(screen.getByRole('table', { name: /liquid helium-4 at 1\.8000 K/i })).toBeInTheDocument();
  });

  it('storage full: the change applies, the message shows once', async () => {
    const full = storeWith();
    full.setItem = () => {
      const error = new Error('The quota has been exceeded.');
      error.name = 'QuotaExceededError';
      throw error;
    };
    const { user } = await openPage(full);
    await user.click(screen.getByRole('radio', { name: 'Light' }));
    await user.click(screen.getByRole('radio', { name: 'Dark' }));
    expect(document.documentElement.dataset.theme).toBe('dark');
    expect(screen.getAllByText(PREFERENCES_NOT_KEPT)).toHaveLength(1);
  });
});
