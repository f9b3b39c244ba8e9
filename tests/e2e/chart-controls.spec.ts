import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

/** The drawn x-axis range of a chart, as Plotly settled it. */
function xRange(page: Page, chartId: string): Promise<number[] | null> {
  return page.evaluate((id) => {
    const plot = document.querySelector(`[data-chart="${id}"]`) as (HTMLElement & { _fullLayout?: { xaxis?: { range?: number[] } } }) | null;
    return plot?._fullLayout?.xaxis?.range?.map(Number) ?? null;
  }, chartId);
}

test.describe('chart controls of our own', () => {
  guardEveryPage();

  test('no library toolbar; our zoom in, zoom out and back to the whole chart', async ({ page }) => {
    await page.goto('/');
    const chart = page.locator('[data-chart="speeds"]');
    await expect(chart).toHaveAttribute('data-drawn', 'true');
    await chart.hover();
    await expect(page.locator('.modebar-btn')).toHaveCount(0);
    const box = page.locator('.plot-box', { has: chart });

    const whole = await xRange(page, 'speeds');
    expect(whole).not.toBeNull();
    const [a = 0, b = 0] = whole ?? [];
    await box.getByRole('button', { name: /^Zoom in on the chart of u₂/ }).click();
    await expect.poll(async () => ((await xRange(page, 'speeds')) ?? [0, 0]).reduce((x, y) => y - x)).toBeCloseTo((b - a) / 2, 6);
    const back = box.getByRole('button', { name: /^Back to the whole of the chart of u₂/ });
    await expect(back).toBeVisible();
    await box.getByRole('button', { name: /^Zoom out of the chart of u₂/ }).click();
    await box.getByRole('button', { name: /^Zoom out of the chart of u₂/ }).click();
    await expect.poll(async () => ((await xRange(page, 'speeds')) ?? [0, 0]).reduce((x, y) => y - x)).toBeCloseTo((b - a) * 2, 6);
    await back.click();
    await expect.poll(() => xRange(page, 'speeds')).toEqual(whole);
    await expect(back).toHaveCount(0);
  });

  test('on a touch screen a drag on a chart scrolls the page instead of zooming', async ({ browser }) => {
    const context = await browser.newContext({ hasTouch: true, isMobile: true, viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.addInitScript(() => localStorage.setItem('sekundo.prefs', '{"guides":"explorer,planner,converter,locate"}'));
    await page.goto('/');
    const chart = page.locator('[data-chart="speeds"]');
    await expect(chart).toHaveAttribute('data-drawn', 'true');
    const dragmode = await chart.evaluate((el) => (el as HTMLElement & { _fullLayout?: { dragmode?: unknown } })._fullLayout?.dragmode);
    expect(dragmode).toBe(false);
    await expect(page.locator('.plot-box', { has: chart }).getByRole('button', { name: /^Zoom in on the chart of u₂/ })).toBeVisible();
    await context.close();
  });
});
