/**
 * The worst cases of the documented limits in Chromium: a plan with 64 sensors, 16 reflecting
 * planes at echo order 12 and a 10 000-point custom pulse opens without freezing (the page says it
 * computes up to 400 arrivals as you type and shows no results for it), its 10 000 points are
 * shown a page at a time, and 500 located sensors are too; typing stays answered. Keystroke times
 * (Event Timing API) are measured by tests/bench/keystroke-limits.browser.ts; here the bound is a
 * loose one a shared test machine keeps (the issue measured 1.6 s and 3.7 s per keystroke).
 */
import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { keystrokeTimes } from '../bench/keystroke-limits.browser';
import { limitCases, locateCsv } from '../support/limit-plans';
import { guardEveryPage } from './page-guard';

guardEveryPage();
const LOOSE_BOUND_MS = 1000;

test('all planner limits together: opens, says what it computes, pages the points, answers keys', async ({ page }) => {
  test.setTimeout(180_000);
  const worst = limitCases(JSON.parse(readFileSync('public/demo-plan.json', 'utf8'))).at(-1);
  if (!worst) throw new Error('no limit cases');
  await page.addInitScript(([plan]) => localStorage.setItem('sekundo.autosave', plan as string), [worst.planText]);
  await page.goto('./');
  await page.getByRole('tab', { name: 'Plan a measurement' }).click();
  await expect(page.locator('.plan-problem')).toContainText(/This plan has 64 sensors × \d+ echo paths/);
  await expect(page.locator('.plan-problem')).toContainText('the page computes up to 400 as you type');
  await expect(page.getByRole('navigation', { name: 'Pages of points' })).toContainText('points 1–50 of 10000');
  await expect(page.locator('.pulse-points__table tbody tr')).toHaveCount(50);
  const times = await keystrokeTimes(page, page.getByRole('textbox', { name: 'Plan name' }));
  expect(Math.max(...times)).toBeLessThan(LOOSE_BOUND_MS);
  await page.getByRole('button', { name: 'Later points' }).click();
  await expect(page.getByRole('textbox', { name: 'Point 51 time' })).toBeVisible();
});

test('500 located sensors: a page of rows, keys answered', async ({ page }) => {
  test.setTimeout(180_000);
  await page.goto('./');
  await page.getByRole('tab', { name: 'Locate a source' }).click();
  await page.getByLabel('Open sensor CSV').setInputFiles({ name: 'frame-500.csv', mimeType: 'text/csv', buffer: Buffer.from(locateCsv(500)) });
  await expect(page.getByText('sensors 1–50 of 500').first()).toBeVisible({ timeout: 60_000 });
  await expect(page.locator('.locate-sensors-table tbody tr')).toHaveCount(50);
  const times = await keystrokeTimes(page, page.getByRole('textbox', { name: 'Arrival at S1 (ms)' }));
  expect(Math.max(...times)).toBeLessThan(LOOSE_BOUND_MS);
});
