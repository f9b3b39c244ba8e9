import { mkdirSync, readFileSync } from 'node:fs';
import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

const ARTIFACTS = 'test-results/artifacts';

interface DrawnTrace {
  name?: string;
  x?: number[];
}

function traceNames(page: Page, chartId: string): Promise<string[]> {
  return page.evaluate((id) => {
    const plot = document.querySelector(`[data-chart="${id}"]`) as (HTMLElement & { data?: DrawnTrace[] }) | null;
    return (plot?.data ?? []).map((t) => t.name ?? '');
  }, chartId);
}

async function openResonator(page: Page) {
  await page.goto('/');
  await page.getByRole('tab', { name: 'Resonator' }).click();
  await expect(page.getByText('Kestrel-2 resonator (invented demo)')).toBeVisible();
  for (const id of ['resonator-sweep', 'resonator-lockin']) await expect(page.locator(`[data-chart="${id}"]`)).toHaveAttribute('data-drawn', 'true');
}

test.describe('resonator', () => {
  guardEveryPage();

  test('the journey: the demo plan, a sweep read into a temperature and a line density, a lock-in record exported', async ({ page }) => {
    await openResonator(page);
    // Plan: the demo's mode spacing u₂/2d at 1.85 K and its Fresnel caution.
    await expect(page.getByTestId('resonator-mode-spacing')).toHaveText(/976\.17\d* Hz/);
    await expect(page.getByText(/Fresnel number a²\/\(λd\) = 0\.786/)).toBeVisible();
    // Sweep: fit, residuals, the chosen candidate near 1.85 K and L near the demo's 3e8 m⁻².
    expect(await traceNames(page, 'resonator-sweep')).toEqual(expect.arrayContaining(['fit', 'residual x', 'residual y', 'reference fit']));
    await expect(page.getByRole('table', { name: /Every temperature with u₂/ })).toContainText('1.850');
    await expect(page.getByTestId('resonator-line-density')).toContainText(/L = \(3\.0\d+ ± 0\.0\d+\) × 10⁸ m⁻²/);
    // Changing the mode number changes the speed (and the candidates) at once.
    const mode = page.getByRole('textbox', { name: 'Mode number n' });
    await mode.fill('7');
    await expect(page.getByTestId('resonator-speed')).toContainText('n = 7');
    await mode.fill('8');
    // A file without a frequency column is refused in one line; the demo sweep stays.
    await page.getByLabel('Choose a sweep CSV').setInputFiles({ name: 'scope.csv', mimeType: 'text/csv', buffer: Buffer.from('time_s,x,y\n0,1,1\n') });
    await expect(page.getByText(/scope\.csv: line 1: no column "frequency_Hz"/)).toBeVisible();
    await expect(page.getByText('Open: demo-resonator-sweep.csv')).toBeVisible();
    // Lock-in: L(t) and the drift of f₀ drawn, and the CSV download holds every row.
    expect(await traceNames(page, 'resonator-lockin')).toEqual(expect.arrayContaining(['line density L', 'drift of f₀']));
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download the line density and f₀ drift as CSV' }).click();
    const file = await (await download).path();
    const lines = readFileSync(file, 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('time_s,lineDensity_m2,lineDensitySd_m2,frequencyShift_Hz,frequencyShiftSd_Hz,temperatureShift_K,temperatureShiftSd_K');
    expect(lines).toHaveLength(2401);

    await page.mouse.move(0, 0);
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: `${ARTIFACTS}/resonator.png` });
    await page.screenshot({ path: `${ARTIFACTS}/resonator-full-page.png`, fullPage: true });
  });

  test('reads at 390 px: no page-wide sideways scroll, tables scroll in their frame', async ({ page }) => {
    await page.setViewportSize({ width: 390, height: 844 });
    await openResonator(page);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(1);
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: `${ARTIFACTS}/resonator-390-full-page.png`, fullPage: true });
  });
});
