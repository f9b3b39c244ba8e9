/**
 * The worst cases of the documented limits in Chromium: a plan with 64 sensors, 16 reflecting
 * planes at echo order 12 and a 10 000-point custom pulse, and 500 located sensors.
 *
 * The page computes these in its workers: while the largest plan is being computed (the page says
 * it is updating) every keystroke typed lands in the field, in order, and the page's main thread
 * computes no plan and no fit at all — the page notes any such work in its performance timeline
 * (`noteThreadWork`), and the test finds none — while the results still arrive in full (no lowered
 * limit, no message in their place).
 *
 * The keystroke times are measured as the browser benchmark measures them
 * (tests/support/keystroke-timer.ts: the browser's Event Timing, keydown → the next paint showing
 * the keystroke), while the plan computes and then while its results are redrawn after each edit:
 * their 90th percentile must be within the 100 ms target and none may take more than twice that
 * (see the constants). The main thread's long tasks (Long Tasks API) are reported beside the test
 * for the record.
 */
import { readFileSync } from 'node:fs';
import { expect, type Page, test } from '@playwright/test';
import { limitCases, locateCsv } from '../support/limit-plans';
import { guardEveryPage } from './page-guard';
import { keystrokeTimes, quantile, SETTLE_BEFORE_TYPING_MS, typeDigits, watchKeystrokes } from '../support/keystroke-timer';
import { PLAN_ON_THIS_THREAD } from '../../src/ui/planner/derive-plan';
import { LOCATE_ON_THIS_THREAD } from '../../src/ui/locate/use-locate';

guardEveryPage();
// Keystrokes are timed here: the test runner's trace would snapshot the page at every key pressed,
// on the page's own main thread, and time itself rather than the page.
test.use({ trace: 'off' });

/** Long tasks of the main thread from now on, ms each (the Long Tasks API: 50 ms and more). */
async function watchLongTasks(page: Page): Promise<void> {
  await page.evaluate(`(() => {
    window.sekundoLongTasks = [];
    new PerformanceObserver((list) => {
      for (const entry of list.getEntries()) window.sekundoLongTasks.push(entry.duration);
    }).observe({ type: 'longtask' });
  })()`);
}

async function longTasks(page: Page): Promise<number[]> {
  return page.evaluate('window.sekundoLongTasks');
}

/** Work of the given name the page's main thread did (measures it notes in its timeline). */
async function mainThreadWork(page: Page, name: string): Promise<number> {
  return page.evaluate((n) => performance.getEntriesByName(n).length, name);
}

/** Notes the long tasks seen beside the test's result, for the record. */
async function recordLongTasks(page: Page, what: string): Promise<void> {
  const tasks = (await longTasks(page)).map(Math.round);
  test.info().annotations.push({ type: 'long tasks', description: `${what}: ${tasks.length} long tasks, longest ${Math.max(0, ...tasks)} ms` });
}

/** The target: a keystroke answered within this, ms ("at every documented limit a keystroke is answered within 100 ms"). */
const KEYSTROKE_TARGET_MS = 100;
/**
 * No keystroke may take longer than this, ms: twice the target. On the shared two-core machine
 * the suite runs on, a keystroke now and then waits for the plan worker or a chart's redraw
 * (worst 64–96 ms measured at a load of 1–2; keystrokes took 1.6–3.6 s before the work moved off
 * the main thread); a freeze of any kind fails this.
 */
const KEYSTROKE_WORST_MS = 2 * KEYSTROKE_TARGET_MS;

/** Notes the keystroke times beside the test, and checks the 90th percentile against the target and the worst against twice it. */
function expectKeystrokesAnswered(times: readonly number[], what: string): void {
  const p90 = quantile(times, 0.9);
  const worst = quantile(times, 1);
  const all = times.map(Math.round).join(' ');
  const description = `${what}: ${times.length} keystrokes, median ${Math.round(quantile(times, 0.5))} ms, 90th percentile ${Math.round(p90)} ms, worst ${Math.round(worst)} ms (target ${KEYSTROKE_TARGET_MS} ms)`;
  test.info().annotations.push({ type: 'keystrokes', description });
  // Printed with the run's output too, for the record.
  console.log(description);
  expect(times.length).toBeGreaterThan(20);
  expect(p90, `${what}: 90th percentile of keystroke times (ms): ${all}`).toBeLessThanOrEqual(KEYSTROKE_TARGET_MS);
  expect(worst, `${what}: worst keystroke time (ms): ${all}`).toBeLessThanOrEqual(KEYSTROKE_WORST_MS);
}

test('all planner limits together: keystrokes answered within 100 ms (90th percentile, to the next paint; none over 200 ms) while the plan computes off the main thread and while its results redraw; every result arrives', async ({ page }) => {
  test.setTimeout(600_000);
  const worst = limitCases(JSON.parse(readFileSync('public/demo-plan.json', 'utf8'))).at(-1);
  if (!worst) throw new Error('no limit cases');
  await page.addInitScript(([plan]) => localStorage.setItem('sekundo.autosave', plan as string), [worst.planText]);
  await page.goto('./');
  await page.getByRole('tab', { name: 'Plan a measurement' }).click();
  const name = page.getByRole('textbox', { name: 'Plan name' });
  await expect(name).toBeVisible();
  // The points are shown a page at a time; the plan is being worked out, not refused.
  await expect(page.getByRole('navigation', { name: 'Pages of points' })).toContainText('points 1–50 of 10000');
  const note = page.locator('.updating-note');
  await expect(note).toHaveAttribute('data-updating', 'true');
  await expect(note).toContainText('Working out the results for this plan…');
  await expect(page.locator('.plan-problem')).toHaveCount(0);

  await watchLongTasks(page);
  await watchKeystrokes(page);
  const typed = ' — frame of 64, all planes';
  // In view and settled before typing, as a person types (keystroke-timer.ts).
  await name.scrollIntoViewIfNeeded();
  await page.waitForTimeout(SETTLE_BEFORE_TYPING_MS);
  await name.click();
  await name.press('End');
  const before = await name.inputValue();
  await page.keyboard.type(typed, { delay: 40 });
  // Every keystroke landed, in order, while the plan was still being computed.
  await expect(name).toHaveValue(before + typed);
  await expect(note).toHaveAttribute('data-updating', 'true');
  await recordLongTasks(page, 'typing while the largest plan computes');

  // The results arrive in full (the name edit reuses every sensor already computed).
  await expect(page.locator('[data-chart="planner-timeline"]')).toHaveAttribute('data-drawn', 'true', { timeout: 540_000 });
  await expect(note).toHaveAttribute('data-updating', 'false');
  await expect(page.locator('.plan-problem')).toHaveCount(0);
  await expect(page.getByRole('table', { name: /predicted arrivals/i }).locator('tbody tr')).toHaveCount(64);
  // All of it was computed off the main thread.
  expect(await mainThreadWork(page, PLAN_ON_THIS_THREAD)).toBe(0);
  await page.getByRole('button', { name: 'Later points' }).click();
  await expect(page.getByRole('textbox', { name: 'Point 51 time' })).toBeVisible();

  // Edits of one sensor, typed with pauses long enough for each new result to be drawn.
  await typeDigits(page, page.getByRole('textbox', { name: 'Sensor 1 noise', exact: true }));
  await page.waitForTimeout(500);
  await recordLongTasks(page, 'typing while the largest plan computes and redraws');
  expectKeystrokesAnswered(await keystrokeTimes(page), 'largest plan');
});

test('500 located sensors: a page of rows; keystrokes answered within 100 ms (90th percentile, to the next paint; none over 200 ms) while the fit runs off the main thread', async ({ page }) => {
  test.setTimeout(300_000);
  await page.goto('./');
  await page.getByRole('tab', { name: 'Locate a source' }).click();
  await page.getByLabel('Open sensor CSV').setInputFiles({ name: 'frame-500.csv', mimeType: 'text/csv', buffer: Buffer.from(locateCsv(500)) });
  await expect(page.getByText('sensors 1–50 of 500').first()).toBeVisible({ timeout: 120_000 });
  await expect(page.locator('.locate-sensors-table tbody tr')).toHaveCount(50);
  await expect(page.locator('.locate .updating-note')).toHaveAttribute('data-updating', 'false', { timeout: 120_000 });
  const field = page.getByRole('textbox', { name: 'Arrival at S1 (ms)' });
  const before = await field.inputValue();
  await watchLongTasks(page);
  await watchKeystrokes(page);
  await field.scrollIntoViewIfNeeded();
  await page.waitForTimeout(SETTLE_BEFORE_TYPING_MS);
  await field.click();
  await field.press('End');
  await page.keyboard.type('1234', { delay: 60 });
  await expect(field).toHaveValue(`${before}1234`);
  // Then edits typed with pauses long enough for each new fit to be drawn.
  await typeDigits(page, field, 20);
  await page.waitForTimeout(500);
  await recordLongTasks(page, 'typing arrivals with 500 sensors');
  expectKeystrokesAnswered(await keystrokeTimes(page), '500 located sensors');
  // The fit of the newest arrivals arrives once typing pauses, computed off the main thread.
  await expect(page.locator('.locate .updating-note')).toHaveAttribute('data-updating', 'false', { timeout: 120_000 });
  await expect(page.locator('.locate-summary')).not.toContainText('Locating the source…');
  expect(await mainThreadWork(page, LOCATE_ON_THIS_THREAD)).toBe(0);
});
