import { mkdirSync } from 'node:fs';
import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

const ARTIFACTS = 'test-results/artifacts';
const CHART_IDS = ['speeds', 'fractions', 'thermometry'] as const;

/** x of the chosen-temperature line as Plotly holds it on the drawn chart. */
function markerX(page: Page, chartId: string): Promise<number | null> {
  return page.evaluate((id) => {
    const plot = document.querySelector(`[data-chart="${id}"]`) as
      | (HTMLElement & { layout?: { shapes?: { name?: string; x0?: number }[] } })
      | null;
    const shape = plot?.layout?.shapes?.find((s) => s.name === 'chosen-temperature');
    return typeof shape?.x0 === 'number' ? shape.x0 : null;
  }, chartId);
}

/** Left edge, in page pixels, of the marker line Plotly drew for a chart. */
function markerPixel(page: Page, chartId: string): Promise<number | null> {
  return page.evaluate((id) => {
    const plot = document.querySelector(`[data-chart="${id}"]`);
    const paths = plot ? [...plot.querySelectorAll<SVGPathElement>('.shapelayer path, .layer-above .shapelayer path')] : [];
    // Plotly draws shapes in layout order; the chosen-temperature line is the last one.
    const line = paths.at(-1);
    return line ? line.getBoundingClientRect().left : null;
  }, chartId);
}

function u2Cell(page: Page) {
  return page.getByRole('row').filter({ has: page.getByRole('rowheader', { name: 'Second sound u₂', exact: true }) }).getByRole('cell').first();
}

async function waitForCharts(page: Page) {
  for (const id of CHART_IDS) await expect(page.locator(`[data-chart="${id}"]`)).toHaveAttribute('data-drawn', 'true');
}

test.describe('property explorer', () => {
  guardEveryPage();

  test('a user changes the temperature; table and chart markers follow', async ({ page }) => {
    await page.goto('/');
    await expect(page.getByRole('heading', { level: 1, name: 'Sekundo' })).toBeVisible();
    await waitForCharts(page);
    await expect(u2Cell(page)).toHaveText('19.90');
    for (const id of CHART_IDS) expect(await markerX(page, id)).toBe(1.8);
    const pixelBefore = await markerPixel(page, 'speeds');

    // Typed in millikelvin.
    const field = page.getByRole('textbox', { name: /temperature/i });
    await field.fill('1200 mK');
    await field.press('Enter');
    await expect(page.getByRole('status', { name: 'Temperature in effect' })).toContainText('1.2000 K');
    await expect(u2Cell(page)).toHaveText('18.51');
    await expect.poll(() => markerX(page, 'speeds')).toBeCloseTo(1.2, 10);
    await expect.poll(() => markerX(page, 'thermometry')).toBeCloseTo(1.2, 10);
    const pixelAfter = await markerPixel(page, 'speeds');
    expect(pixelBefore).not.toBeNull();
    expect(pixelAfter).not.toBeNull();
    expect(pixelAfter ?? 0).toBeLessThan((pixelBefore ?? 0) - 20);

    // A bad entry keeps the last good temperature.
    await field.fill('5 K');
    await field.press('Enter');
    await expect(page.getByRole('alert')).toContainText('Temperature must be 0.3–4.24 K; “5 K” is outside.');
    await expect(u2Cell(page)).toHaveText('18.51');

    // The slider, by keyboard: 10 mK per arrow key.
    const slider = page.getByRole('slider', { name: /sweep the temperature/i });
    await slider.fill('1.6');
    await expect(page.getByRole('status', { name: 'Temperature in effect' })).toContainText('1.6000 K');
    await slider.press('ArrowRight');
    await slider.press('ArrowRight');
    await expect(page.getByRole('status', { name: 'Temperature in effect' })).toContainText('1.6200 K');
    await expect.poll(() => markerX(page, 'fractions')).toBeCloseTo(1.62, 10);
    await expect(page.getByRole('alert')).toHaveCount(0);

    // Above Tλ the table explains the absence of second sound.
    await slider.fill('3');
    await expect(u2Cell(page)).toContainText('No second sound');
    await expect(page.locator('body')).not.toContainText('NaN');

    // Back to a typical working point for the kept screenshot.
    await field.fill('1.8 K');
    await field.press('Enter');
    await expect.poll(() => markerX(page, 'speeds')).toBe(1.8);
    await page.mouse.move(0, 0);
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: `${ARTIFACTS}/explorer.png` });
  });

  test('the page reads well at 1600×1000 and shows its cautions', async ({ page }) => {
    await page.setViewportSize({ width: 1600, height: 1000 });
    await page.goto('/');
    await waitForCharts(page);
    await expect(page.getByRole('heading', { name: 'About and cautions' })).toBeAttached();
    await expect(page.getByText(/planning aid, not a safety system/).first()).toBeAttached();
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: `${ARTIFACTS}/explorer-1600x1000.png` });
    await page.screenshot({ path: `${ARTIFACTS}/explorer-full-page.png`, fullPage: true });
  });

  test('keyboard users see where focus is', async ({ page }) => {
    await page.goto('/');
    await page.keyboard.press('Tab');
    const skip = page.getByRole('link', { name: 'Skip to the content' });
    await expect(skip).toBeFocused();
    const outline = await skip.evaluate((element) => getComputedStyle(element).outlineStyle);
    expect(outline).not.toBe('none');
  });
});
