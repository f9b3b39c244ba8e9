import { mkdirSync, readFileSync } from 'node:fs';
import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

const ARTIFACTS = 'test-results/artifacts';
const VIEWS = [
  { id: 'explorer', tab: 'Helium properties' },
  { id: 'planner', tab: 'Plan a measurement' },
  { id: 'converter', tab: 'Read the temperature' },
  { id: 'locate', tab: 'Locate a source' },
  { id: 'resonator', tab: 'Resonator' },
] as const;

/** Every chart on the page drawn (and at least one there). */
async function waitForCharts(page: Page) {
  await expect
    .poll(() =>
      page.evaluate(() => {
        const charts = [...document.querySelectorAll('[data-chart]')];
        return charts.length > 0 && charts.every((c) => c.getAttribute('data-drawn') === 'true');
      }),
    )
    .toBe(true);
}

/** A value of the layout Plotly holds for a drawn chart. */
function drawnLayout(page: Page, chartId: string, key: 'plot_bgcolor' | 'paper_bgcolor' | 'xaxisTitle'): Promise<string | null> {
  return page.evaluate(
    ([id, k]) => {
      const plot = document.querySelector(`[data-chart="${id}"]`) as (HTMLElement & { layout?: Record<string, unknown> & { xaxis?: { title?: { text?: string } } } }) | null;
      if (!plot?.layout) return null;
      return k === 'xaxisTitle' ? (plot.layout.xaxis?.title?.text ?? null) : (plot.layout[k] as string);
    },
    [chartId, key] as const,
  );
}

function themeOption(page: Page, name: 'Light' | 'Dark' | 'System') {
  return page.locator('.header-segmented__option', { hasText: name });
}

function propertyRow(page: Page, name: string) {
  return page.getByRole('row').filter({ has: page.getByRole('rowheader', { name, exact: true }) });
}

async function openTab(page: Page, tab: string) {
  await page.getByRole('tab', { name: tab }).click();
  await expect(page.getByRole('tab', { name: tab })).toHaveAttribute('aria-selected', 'true');
}

test.describe('workspace habits', () => {
  // Also fails on a Content-Security-Policy refusal, which the console reports as an error.
  guardEveryPage();

  test('theme and display units are chosen, kept across a reload, and followed by tables and charts', async ({ page }) => {
    await page.goto('/');
    await waitForCharts(page);
    await expect(page.getByRole('radio', { name: 'System' })).toBeChecked();

    await themeOption(page, 'Dark').click();
    await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
    expect(await page.evaluate(() => getComputedStyle(document.documentElement).backgroundColor)).toBe('rgb(13, 19, 28)');
    await expect.poll(() => drawnLayout(page, 'speeds', 'plot_bgcolor')).toBe('#101823');

    const units = page.getByRole('button', { name: /^Units/ });
    await units.click();
    await page.getByRole('combobox', { name: 'Temperature' }).selectOption('mK');
    await page.getByRole('combobox', { name: 'Length' }).selectOption('cm');
    await page.getByRole('combobox', { name: 'Time' }).selectOption('µs');
    await page.getByRole('combobox', { name: 'Pressure' }).selectOption('mbar');
    await page.keyboard.press('Escape');
    await expect(units).toHaveAttribute('aria-expanded', 'false');
    await expect(page.getByRole('status', { name: 'Temperature in effect' })).toContainText('1800.0 mK');
    await expect(propertyRow(page, 'Vapour pressure p_sat').getByRole('cell').nth(1)).toHaveText('mbar');

    await page.reload();
    await waitForCharts(page);
    await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
    await expect(page.getByRole('radio', { name: 'Dark' })).toBeChecked();
    await expect(page.getByRole('status', { name: 'Temperature in effect' })).toContainText('1800.0 mK');
    await expect(page.getByRole('table', { name: /at 1800\.0 mK/ })).toBeVisible();
    await expect(propertyRow(page, 'Vapour pressure p_sat').getByRole('cell').nth(1)).toHaveText('mbar');
    expect(await drawnLayout(page, 'speeds', 'xaxisTitle')).toBe('Temperature T (mK)');
    expect(await drawnLayout(page, 'speeds', 'plot_bgcolor')).toBe('#101823');

    await openTab(page, 'Locate a source');
    await waitForCharts(page);
    await expect(page.getByLabel('x of U0 (cm)')).toHaveValue('15');
    await expect(page.getByLabel('Arrival at U0 (µs)')).toHaveValue('11563');
    expect(await drawnLayout(page, 'locate-projection-1', 'xaxisTitle')).toBe('x (cm)');

    await openTab(page, 'Plan a measurement');
    await waitForCharts(page);
    await expect(page.getByRole('textbox', { name: 'Pulse width' })).toHaveValue('100');
    await expect(page.getByRole('textbox', { name: 'Sensor 4 distance', exact: true })).toHaveValue('5');
    await expect(page.getByRole('table', { name: /predicted arrivals/i }).getByRole('columnheader', { name: /Second sound \(µs\)/ })).toBeVisible();
    await expect.poll(() => drawnLayout(page, 'planner-timeline', 'xaxisTitle')).toBe('Time after the heater pulse starts (µs)');
  });

  test('a chart exports as SVG and PNG, tables as CSV (under the page’s CSP)', async ({ page }) => {
    await page.goto('/');
    await waitForCharts(page);

    const [svg] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download the chart of u₂ and u₁ against temperature as SVG' }).click()]);
    expect(svg.suggestedFilename()).toBe('sekundo-speeds.svg');
    const svgText = readFileSync(await svg.path(), 'utf8');
    expect(svgText.startsWith('<svg')).toBe(true);
    expect(svgText).toContain('u₂ second sound');

    const [png] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download the chart of u₂ and u₁ against temperature as PNG' }).click()]);
    expect(png.suggestedFilename()).toBe('sekundo-speeds.png');
    const pngBytes = readFileSync(await png.path());
    expect([...pngBytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    // Twice the chart's width in CSS pixels: sharp in print.
    const chartWidth = await page.locator('[data-chart="speeds"]').evaluate((e) => Math.round(e.getBoundingClientRect().width));
    expect(pngBytes.readUInt32BE(16)).toBe(2 * chartWidth);

    const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download the property table as CSV' }).click()]);
    expect(csv.suggestedFilename()).toBe('helium-properties-1.8000K.csv');
    const lines = readFileSync(await csv.path(), 'utf8').split('\r\n');
    expect(lines[0]).toBe('temperature (K),property,symbol,value,sd,unit,note,source');
    expect(lines.filter((l) => l.length > 0)).toHaveLength(13);
    expect(lines.find((l) => l.startsWith('1.8,Second sound,u₂,'))).toMatch(/^1\.8,Second sound,u₂,19\.9027\d+,0\.0497\d+,m\/s,,"R\. J\. Donnelly/);

    await openTab(page, 'Locate a source');
    await waitForCharts(page);
    const [residuals] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download the residuals table as CSV' }).click()]);
    expect(residuals.suggestedFilename()).toBe('locate-residuals.csv');
    const rows = readFileSync(await residuals.path(), 'utf8').split('\r\n');
    expect(rows[0]).toBe('sensor,predicted arrival (ms),residual (us),residual / sd,status');
    expect(rows.find((r) => r.startsWith('L225,'))).toContain('"OUTLIER, kept in the fit"');
    const [source] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download the located source as CSV' }).click()]);
    expect(readFileSync(await source.path(), 'utf8')).toMatch(/^quantity,value,sd,unit\r\nsource x,-48\.\d+,1\.\d+,mm\r\n/);
    const [mapSvg] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: /Download the chart “Expected position sd.*” as SVG/ }).click()]);
    expect(mapSvg.suggestedFilename()).toBe('sekundo-locate-quality-map.svg');
  });

  test('keyboard only: header controls, every tab, into each view and back, focus always visible', async ({ page }) => {
    // Five views of up to 30 Tab stops each, and back: past the default minute on a busy machine.
    test.setTimeout(150_000);
    await page.goto('/');
    await waitForCharts(page);
    const focused = () =>
      page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        if (!el || el === document.body) return { name: 'body', ring: false, inView: false, inMain: false };
        const visibleRing = (e: Element | null): boolean => {
          if (!e) return false;
          const s = getComputedStyle(e);
          return (s.outlineStyle !== 'none' && Number.parseFloat(s.outlineWidth) >= 2) || (s.boxShadow !== 'none' && !s.boxShadow.includes('inset'));
        };
        // A radio drawn as a segment shows its ring on the label around it.
        const ring = visibleRing(el) || (el.matches('input[type="radio"], input[type="file"]') && visibleRing(el.closest('label, .drop-zone__button, .drop-zone')));
        const r = el.getBoundingClientRect();
        return {
          name: `${el.tagName.toLowerCase()} ${el.getAttribute('aria-label') ?? el.textContent?.trim().slice(0, 40) ?? ''}`,
          ring,
          inView: r.bottom > 0 && r.top < window.innerHeight && r.right > 0 && r.left < window.innerWidth,
          inMain: Boolean(el.closest('#view')),
        };
      });

    // The skip link comes first, then the theme radios: arrows change the theme.
    await page.keyboard.press('Tab');
    expect((await focused()).name).toContain('Skip to the content');
    await page.keyboard.press('Tab');
    await expect(page.getByRole('radio', { name: 'System' })).toBeFocused();
    expect((await focused()).ring).toBe(true);
    await page.keyboard.press('ArrowLeft');
    await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
    await page.keyboard.press('ArrowLeft');
    await expect(page.locator('html')).toHaveAttribute('data-theme', 'light');

    // Units: Enter opens the panel, Tab walks its selects, Escape closes it.
    await page.keyboard.press('Tab');
    await expect(page.getByRole('button', { name: /^Units/ })).toBeFocused();
    await page.keyboard.press('Enter');
    await page.keyboard.press('Tab');
    await expect(page.getByRole('combobox', { name: 'Temperature' })).toBeFocused();
    await page.keyboard.press('Escape');
    await expect(page.getByRole('button', { name: /^Units/ })).toBeFocused();
    await expect(page.getByRole('combobox', { name: 'Temperature' })).toBeHidden();

    // The selected tab, then arrows through the views; Tab goes into each view, Shift+Tab back.
    await page.keyboard.press('Tab');
    await expect(page.getByRole('tab', { name: 'Helium properties' })).toBeFocused();
    const missing: string[] = [];
    for (const [i, view] of VIEWS.entries()) {
      if (i > 0) {
        await page.keyboard.press('ArrowRight');
        await expect(page.getByRole('tab', { name: view.tab })).toBeFocused();
        await expect(page.getByRole('tab', { name: view.tab })).toHaveAttribute('aria-selected', 'true');
        await waitForCharts(page);
      }
      // Up to 30 stops into the view, or until the footer's button, the page's last stop.
      let pressed = 0;
      while (pressed < 30) {
        await page.keyboard.press('Tab');
        pressed += 1;
        const f = await focused();
        const footer = f.name.includes('Show the first-visit guides again');
        expect(f.inMain || footer, `Tab ${pressed} in ${view.id} left the view: ${f.name}`).toBe(true);
        if (!f.ring) missing.push(`${view.id}: ${f.name}`);
        if (!f.inView) missing.push(`${view.id}: ${f.name} (off screen)`);
        if (footer) break;
      }
      for (let n = 0; n < pressed; n++) await page.keyboard.press('Shift+Tab');
      await expect(page.getByRole('tab', { name: view.tab })).toBeFocused();
    }
    expect(missing, 'every focused control shows a focus ring and is scrolled into view').toEqual([]);

    // Enter and Space work on buttons reached by keyboard: the explorer's jump to the u₂ maximum.
    await page.keyboard.press('Home');
    await expect(page.getByRole('tab', { name: 'Helium properties' })).toHaveAttribute('aria-selected', 'true');
    await page.keyboard.press('End');
    await expect(page.getByRole('tab', { name: 'Resonator' })).toBeFocused();
    await page.keyboard.press('Home');
    await expect(page.getByRole('tab', { name: 'Helium properties' })).toBeFocused();
    await waitForCharts(page);
    await page.getByRole('button', { name: /u₂ max/ }).focus();
    await page.keyboard.press('Space');
    await expect(page.getByRole('status', { name: 'Temperature in effect' })).toContainText('1.65');
  });

  test('storage full for preferences: the page says so once and works on', async ({ page }) => {
    await page.addInitScript(() => {
      const setItem = Storage.prototype.setItem;
      Storage.prototype.setItem = function (key: string, value: string) {
        if (key === 'sekundo.prefs') throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
        setItem.call(this, key, value);
      };
    });
    await page.goto('/');
    await waitForCharts(page);
    await themeOption(page, 'Dark').click();
    await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
    const notice = page.getByRole('status').filter({ hasText: /Your settings cannot be saved in this browser/ });
    await expect(notice).toHaveCount(1);
    await themeOption(page, 'Light').click();
    await page.getByRole('button', { name: /^Units/ }).click();
    await page.getByRole('combobox', { name: 'Length' }).selectOption('cm');
    await expect(notice).toHaveCount(1);
    await expect(page.locator('html')).toHaveAttribute('data-theme', 'light');
    await expect(page.getByRole('table', { name: /Liquid helium-4 at 1\.8000 K/ })).toBeVisible();
  });

  test('storage turned off: one message about it, and the page works', async ({ page }) => {
    await page.addInitScript(() => {
      Storage.prototype.setItem = () => {
        throw new DOMException('The operation is insecure.', 'SecurityError');
      };
    });
    await page.goto('/');
    // Nothing could be kept, so this is a first visit: the guide shows, covering nothing.
    await expect(page.getByRole('complementary', { name: /^First time here/ })).toBeVisible();
    await themeOption(page, 'Dark').click();
    await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
    await expect(page.getByRole('status').filter({ hasText: /cannot be saved in this browser|does not let Sekundo keep data/ })).toHaveCount(1);
    await waitForCharts(page);
    await expect(page.getByRole('table', { name: /Liquid helium-4 at 1\.8000 K/ })).toBeVisible();
  });
});

test.describe('first visit', () => {
  test.use({ storageState: { cookies: [], origins: [] } });

  test('each view shows its guide inline, nothing covers the page, and a guide put away stays away', async ({ page }) => {
    const outside: string[] = [];
    page.on('request', (r) => {
      const { protocol, hostname } = new URL(r.url());
      if (!(protocol === 'data:' || protocol === 'blob:' || hostname === '127.0.0.1')) outside.push(r.url());
    });
    await page.goto('/');
    await expect(page.getByRole('dialog')).toHaveCount(0);
    const guide = page.getByRole('complementary', { name: /^First time here\? Start with the bath temperature/ });
    await expect(guide).toBeVisible();
    // The view is usable under its guide: the temperature field takes a value at once.
    const field = page.getByRole('textbox', { name: /temperature/i });
    await field.fill('1.5');
    await field.press('Enter');
    await expect(page.getByRole('status', { name: 'Temperature in effect' })).toContainText('1.5000 K');
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: `${ARTIFACTS}/first-visit-guide.png` });

    // Each view has its own guide; the keyboard reaches its buttons in the page's order.
    const leads = ['Start with the bath temperature', 'Edit the demo plan', 'Type the distance and the delay', 'Type or load the sensors', 'Open the demo resonator'];
    const tabs = ['Helium properties', 'Plan a measurement', 'Read the temperature', 'Locate a source', 'Resonator'];
    for (const [i, tab] of tabs.entries()) {
      await page.getByRole('tab', { name: tab }).click();
      await expect(page.getByRole('complementary', { name: new RegExp(`^First time here\\? ${leads[i]}`) })).toBeVisible();
    }
    await page.getByRole('complementary', { name: /^First time here/ }).getByRole('button', { name: 'Got it' }).focus();
    await page.keyboard.press('Enter');
    await expect(page.getByRole('complementary', { name: /^First time here/ })).toHaveCount(0);
    await page.getByRole('tab', { name: 'Helium properties' }).click();
    await page.getByRole('button', { name: 'Hide all guides' }).click();
    await expect(page.getByRole('complementary', { name: /^First time here/ })).toHaveCount(0);

    await page.reload();
    await expect(page.getByRole('heading', { level: 1, name: 'Sekundo' })).toBeVisible();
    await waitForCharts(page);
    await expect(page.getByRole('complementary', { name: /^First time here/ })).toHaveCount(0);
    await page.getByRole('button', { name: 'Show the first-visit guides again' }).click();
    await expect(guide).toBeVisible();
    expect(outside).toEqual([]);
  });
});
