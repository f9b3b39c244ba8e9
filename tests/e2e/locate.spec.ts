import { mkdirSync } from 'node:fs';
import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

const ARTIFACTS = 'test-results/artifacts';
const PROJECTIONS = ['locate-projection-1', 'locate-projection-2'] as const;
const MAP = 'locate-quality-map';
const TRACES = 'locate-traces';

interface DrawnTrace {
  name?: string;
  x?: number[];
  y?: number[];
}

/** The traces Plotly holds for a drawn chart: name and point count. */
function tracesOf(page: Page, chartId: string): Promise<{ name: string; points: number }[]> {
  return page.evaluate((id) => {
    const plot = document.querySelector(`[data-chart="${id}"]`) as (HTMLElement & { data?: DrawnTrace[] }) | null;
    return (plot?.data ?? []).map((t) => ({ name: t.name ?? '', points: t.x?.length ?? 0 }));
  }, chartId);
}

/** x of the located source as drawn in a projection, mm. */
function drawnSourceX(page: Page, chartId: string): Promise<number | null> {
  return page.evaluate((id) => {
    const plot = document.querySelector(`[data-chart="${id}"]`) as (HTMLElement & { data?: DrawnTrace[] }) | null;
    const source = plot?.data?.find((t) => t.name === 'located source');
    return source?.x?.[0] ?? null;
  }, chartId);
}

/** The located source as the summary shows it: each coordinate and its 1σ (the row under it), mm. */
async function shownSource(page: Page): Promise<{ value: number; sd: number | null }[]> {
  const number = (text: string | null) => Number((text ?? '').replace(/\u2212/g, '-').replace(/[^-\d.]/g, '') || Number.NaN);
  const values = await Promise.all(['x', 'y', 'z'].map((k) => page.getByTestId(`locate-source-${k}`).textContent()));
  const sds = await page.getByRole('row', { name: /^1σ/ }).getByRole('cell').allTextContents();
  return values.map((text, k) => ({ value: number(text), sd: sds[k]?.includes('±') ? number(sds[k] ?? null) : null }));
}

async function waitForCharts(page: Page) {
  for (const id of [...PROJECTIONS, MAP]) await expect(page.locator(`[data-chart="${id}"]`)).toHaveAttribute('data-drawn', 'true');
}

async function openLocate(page: Page) {
  await page.goto('/');
  await page.getByRole('tab', { name: 'Locate a source' }).click();
  await expect(page.getByRole('tab', { name: 'Locate a source' })).toHaveAttribute('aria-selected', 'true');
  await expect(page.getByText('Linnet-1 quench (invented demo)')).toBeVisible();
  await waitForCharts(page);
}

test.describe('source location', () => {
  guardEveryPage();

  test('the demo opens with the source, its 1σ and 2σ ellipses and the quality map drawn', async ({ page }) => {
    await openLocate(page);
    for (const id of PROJECTIONS) {
      const traces = await tracesOf(page, id);
      const byName = new Map(traces.map((t) => [t.name, t.points]));
      expect(byName.get('located source')).toBe(1);
      expect(byName.get('1σ region (68.3 %)') ?? 0).toBeGreaterThan(20);
      expect(byName.get('2σ region (95.4 %)') ?? 0).toBeGreaterThan(20);
      expect(byName.get('sensors') ?? 0).toBeGreaterThanOrEqual(7);
      // The demo's late sensor is drawn apart and named in the residual table.
      expect(byName.get('outliers')).toBe(1);
    }
    await expect(page.getByRole('row', { name: /L225/ }).filter({ hasText: 'OUTLIER' })).toBeVisible();
    const map = await tracesOf(page, MAP);
    expect(map.find((t) => t.name === 'expected position sd')?.points ?? 0).toBeGreaterThan(500);
    expect(map.find((t) => t.name === 'best added sensor')?.points).toBe(1);
    await expect(page.getByText(/One more sensor at/)).toBeVisible();
    // The source near the equator of the invented cell (about −48 mm, 92 mm, 5 mm).
    const x = await drawnSourceX(page, 'locate-projection-1');
    expect(x).not.toBeNull();
    expect(Math.abs((x ?? 0) + 48)).toBeLessThan(5);

    await page.mouse.move(0, 0);
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: `${ARTIFACTS}/locate.png` });
    await page.screenshot({ path: `${ARTIFACTS}/locate-full-page.png`, fullPage: true });

    // A close-up of the source shows the ellipses at a readable size.
    await page.getByText('Close-up of the source').click();
    await expect.poll(async () => (await page.locator('[data-chart="locate-projection-1"]').evaluate((el) => (el as HTMLElement & { layout?: { xaxis?: { range?: number[] } } }).layout?.xaxis?.range?.length ?? 0))).toBe(2);
    await page.locator('.locate-projections').scrollIntoViewIfNeeded();
    await page.locator('.locate-projections').screenshot({ path: `${ARTIFACTS}/locate-close-up.png` });
  });

  test('editing an arrival moves the source; the robust refit drops the outlier', async ({ page }) => {
    await openLocate(page);
    const before = await drawnSourceX(page, 'locate-projection-1');
    await page.getByLabel('Robust refit: leave out the worst sensor while its residual exceeds 3σ').check();
    await expect(page.getByRole('row', { name: /L225/ }).filter({ hasText: 'left out of the fit' })).toBeVisible();
    await expect.poll(() => drawnSourceX(page, 'locate-projection-1')).not.toBe(before);
    const arrival = page.getByLabel('Arrival at U90 (ms)');
    await arrival.fill('5.2');
    await arrival.press('Tab');
    await expect(page.getByTestId('locate-source-x')).not.toHaveText('');
    // A bad entry names the field and its range, and the last good value stays in effect.
    await arrival.fill('soon');
    await expect(page.getByRole('alert').filter({ hasText: 'arrival at sensor U90' })).toContainText('valid from');
    await expect(page.getByText('No source located')).toHaveCount(0);
  });

  test('reads well at 1600×1000', async ({ page }) => {
    await page.setViewportSize({ width: 1600, height: 1000 });
    await openLocate(page);
    await page.mouse.move(0, 0);
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: `${ARTIFACTS}/locate-1600x1000.png` });
    await page.screenshot({ path: `${ARTIFACTS}/locate-1600x1000-full-page.png`, fullPage: true });
  });

  test('a sensor CSV the user opened is still there after a reload', async ({ page }) => {
    await openLocate(page);
    const csv = ['label,x_m,y_m,z_m,arrival_s', 'Fore,0.12,0,0.01,0.0061', 'Aft,-0.12,0,-0.01,0.0065', 'Port,0,0.12,0.02,0.0058', 'Star,0,-0.12,-0.02,0.0069', 'Top,0.01,0.02,0.13,0.0060', 'Keel,-0.02,0.01,-0.13,0.0066'].join('\n');
    await page.getByLabel('Open sensor CSV').setInputFiles({ name: 'bay3-sensors.csv', mimeType: 'text/csv', buffer: Buffer.from(`${csv}\n`) });
    await expect(page.getByLabel('Timing sd of Keel')).toBeVisible();
    await page.reload();
    await page.getByRole('tab', { name: 'Locate a source' }).click();
    await expect(page.getByText(/bay3-sensors\.csv/).first()).toBeVisible();
    await expect(page.getByLabel('Timing sd of Keel')).toBeVisible();
    await expect(page.getByText('Linnet-1 quench (invented demo)')).toHaveCount(0);
  });

  test('arrival times picked from the demo traces locate the source the typed demo gives, within its uncertainty', async ({ page }) => {
    await openLocate(page);
    // The speed held at u₂ (no prior): the two fits then differ only by the arrivals and their sds.
    await page.getByRole('checkbox', { name: /Fit the speed within u₂’s own uncertainty/ }).uncheck();
    const typed = await shownSource(page);
    expect(typed.every((c) => c.sd !== null)).toBe(true);
    await page.getByRole('button', { name: 'Load the demo traces' }).click();
    await expect(page.locator(`[data-chart="${TRACES}"]`)).toHaveAttribute('data-drawn', 'true');
    await expect(page.getByRole('table', { name: 'Channels, their sensors and picked arrivals' }).getByRole('row')).toHaveCount(9);
    const apply = page.getByRole('button', { name: 'Use these arrivals' });
    await expect(apply).toBeEnabled();
    await apply.click();
    await expect(page.getByText('Arrivals and timing sds written for 8 sensors: U0, U90, U180, U270, L45, L135, L225, L315.')).toBeVisible();
    // The sensor rows now carry the picks' own sds (a few µs) instead of the demo's 50 µs.
    await expect(page.getByLabel('Timing sd of U0')).not.toHaveValue('50');
    await expect.poll(async () => (await shownSource(page)).map((c) => c.value)).not.toEqual(typed.map((c) => c.value));
    const picked = await shownSource(page);
    picked.forEach((c, k) => {
      expect(Math.abs(c.value - (typed[k]?.value ?? Number.NaN))).toBeLessThan(typed[k]?.sd ?? 0);
    });
    // Every pick is marked on its trace.
    const marks = await page.locator(`[data-chart="${TRACES}"]`).evaluate((el) => (el as HTMLElement & { data?: DrawnTrace[] }).data?.find((t) => t.name === 'picked arrivals')?.x?.length ?? 0);
    expect(marks).toBe(8);

    await page.mouse.move(0, 0);
    mkdirSync(ARTIFACTS, { recursive: true });
    const card = page.locator('section.locate-traces');
    await card.scrollIntoViewIfNeeded();
    await card.screenshot({ path: `${ARTIFACTS}/locate-traces.png` });
    await page.screenshot({ path: `${ARTIFACTS}/locate-traces-view.png` });
  });
});
