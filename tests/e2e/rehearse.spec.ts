import { mkdirSync, readFileSync } from 'node:fs';
import { expect, type Page, test } from '@playwright/test';
import { guardEveryPage } from './page-guard';

const ARTIFACTS = 'test-results/artifacts';
const CHART = '[data-chart="planner-rehearsal-records"]';

async function openRehearsal(page: Page) {
  await page.goto('/');
  await page.getByRole('tab', { name: 'Plan a measurement' }).click();
  await expect(page.getByText('Demo plan (invented setup)')).toBeVisible();
  const region = page.getByRole('region', { name: 'Rehearse the measurement' });
  await region.scrollIntoViewIfNeeded();
  return region;
}

test.describe('planner: rehearse the measurement', () => {
  guardEveryPage();

  test('runs the rehearsal in a worker, shows the table and the records, and downloads a record the trace reader takes', async ({ page }) => {
    const region = await openRehearsal(page);
    await region.getByRole('combobox', { name: /Picker/ }).selectOption('fraction');
    await region.getByRole('textbox', { name: 'Trials', exact: true }).fill('40');
    await region.getByRole('button', { name: 'Run the rehearsal' }).click();
    await expect(region.getByText(/Done: 40 records per sensor/)).toBeVisible({ timeout: 60_000 });
    const table = region.getByRole('table', { name: /Rehearsed timing and temperature per sensor/ });
    for (const id of ['b10', 'b25', 'b35x', 'b50']) await expect(table.getByRole('rowheader', { name: new RegExp(`^${id}`) })).toBeVisible();
    await expect(page.locator(CHART)).toHaveAttribute('data-drawn', 'true');
    const traces = await page.evaluate((selector) => {
      const plot = document.querySelector(selector) as (HTMLElement & { data?: { name: string }[] }) | null;
      return (plot?.data ?? []).map((t) => t.name);
    }, CHART);
    expect(traces).toEqual(expect.arrayContaining(['Trial 1', 'Trial 2', 'Trial 3', 'True arrival']));
    mkdirSync(ARTIFACTS, { recursive: true });
    await region.screenshot({ path: `${ARTIFACTS}/rehearse-1280.png` });

    const [download] = await Promise.all([page.waitForEvent('download'), region.getByRole('button', { name: 'Download trial 1' }).click()]);
    expect(download.suggestedFilename()).toBe('rehearsal-trial-001.csv');
    const text = readFileSync((await download.path()) as string, 'utf8');
    const lines = text.split('\n');
    expect(lines.find((l) => l.startsWith('time_s'))).toBe('time_s,heater,b10,b25,b35x,b50');
    // 20 ms at 10 MS/s: 200 000 rows after the header.
    expect(lines.filter((l) => /^-?\d/.test(l)).length).toBe(200_000);
  });

  test('shows progress and stops on Cancel, keeping nothing of the run', async ({ page }) => {
    const region = await openRehearsal(page);
    await region.getByRole('textbox', { name: 'Trials', exact: true }).fill('5000');
    await region.getByRole('button', { name: 'Run the rehearsal' }).click();
    await expect(region.getByRole('progressbar', { name: 'Rehearsal progress' })).toBeVisible();
    await expect(region.getByText(/Trial \d+ of 5000/)).toBeVisible();
    await region.getByRole('button', { name: 'Cancel' }).click();
    await expect(region.getByText(/Cancelled; nothing from that run is shown/)).toBeVisible();
    await expect(region.getByRole('table')).toHaveCount(0);
    // A new run after a cancel starts a fresh worker and finishes.
    await region.getByRole('textbox', { name: 'Trials', exact: true }).fill('3');
    await region.getByRole('button', { name: 'Run the rehearsal' }).click();
    await expect(region.getByText(/Done: 3 records per sensor/)).toBeVisible({ timeout: 60_000 });
  });
});
