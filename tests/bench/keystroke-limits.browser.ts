/**
 * Browser benchmark: how long a keystroke takes to be answered (Event Timing API: from the key
 * press to the next paint, the longest event of each keystroke) in the built page, at every
 * documented limit of the planner and the locate view, in Debian's Chromium. Run against a
 * served build:
 *
 *   npm run build && npx vite preview --config vite.config.ts --port 4176 &
 *   SEKUNDO_BENCH_URL=http://127.0.0.1:4176/ npx tsx tests/bench/keystroke-limits.browser.ts
 *
 * Prints one row per case: the plan opened, the time to open it (navigation to results drawn) and
 * the median and worst keystroke over 8 keystrokes. The target is 100 ms per keystroke.
 * SEKUNDO_BENCH_ONLY=<part of a case name> runs only the matching cases ("locate" for the locate view).
 */
import { readFileSync } from 'node:fs';
import { chromium, type Page } from '@playwright/test';
import { limitCases, locateCsv } from '../support/limit-plans';

const URL_BASE = process.env.SEKUNDO_BENCH_URL ?? 'http://127.0.0.1:4176/';
const KEYSTROKES = 8;

/** Starts collecting Event Timing entries (keystroke durations) in the page. */
async function watchKeys(page: Page): Promise<void> {
  await page.evaluate(() => {
    const w = window as unknown as { keyTimes: Map<number, number> };
    w.keyTimes = new Map();
    new PerformanceObserver((list) => {
      for (const e of list.getEntries() as (PerformanceEventTiming & { interactionId?: number })[]) {
        if (!['keydown', 'keypress', 'input', 'keyup', 'beforeinput'].includes(e.name)) continue;
        // One keystroke is one interaction (its keydown and keyup share the id).
        if (!e.interactionId) continue;
        w.keyTimes.set(e.interactionId, Math.max(w.keyTimes.get(e.interactionId) ?? 0, e.duration));
      }
    }).observe({ type: 'event', durationThreshold: 16, buffered: true } as PerformanceObserverInit);
  });
}

/** Types `count` characters into the field and returns each keystroke's time, ms (≥ 16: the API's floor). */
export async function keystrokeTimes(page: Page, field: ReturnType<Page['getByRole']>, count = KEYSTROKES): Promise<number[]> {
  await watchKeys(page);
  await field.click();
  await field.press('End');
  for (let i = 0; i < count; i++) {
    await page.keyboard.press(i % 2 === 0 ? 'x' : 'Backspace');
    await page.waitForTimeout(150);
  }
  await page.waitForTimeout(600);
  const times = await page.evaluate(() => [...(window as unknown as { keyTimes: Map<number, number> }).keyTimes.values()]);
  // Keystrokes answered within one frame leave no entry: they count as 16 ms.
  return [...times, ...Array(Math.max(0, count - times.length)).fill(16)].sort((a, b) => a - b);
}

async function main() {
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  const rows: string[][] = [['case', 'open (ms)', 'keystroke median (ms)', 'keystroke worst (ms)']];
  const only = process.env.SEKUNDO_BENCH_ONLY;
  for (const c of limitCases(JSON.parse(readFileSync('public/demo-plan.json', 'utf8'))).filter((x) => !only || x.name.includes(only))) {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    page.setDefaultTimeout(180_000);
    await page.addInitScript(
      ([plan]) => {
        localStorage.setItem('sekundo.prefs', JSON.stringify({ tour: 'done' }));
        localStorage.setItem('sekundo.autosave', plan as string);
      },
      [c.planText],
    );
    console.error(`${c.name}: opening`);
    const start = Date.now();
    await page.goto(URL_BASE);
    await page.getByRole('tab', { name: 'Plan a measurement' }).click();
    await page.locator('[data-chart="planner-timeline"][data-drawn="true"]').or(page.locator('.plan-problem')).first().waitFor({ timeout: 120_000 });
    const open = Date.now() - start;
    const times = await keystrokeTimes(page, page.getByRole('textbox', { name: 'Plan name' }));
    console.error(`${c.name}: open ${open} ms, keystrokes ${times.map(Math.round).join(' ')} ms`);
    rows.push([c.name, String(open), String(Math.round(times[Math.floor(times.length / 2)] ?? 0)), String(Math.round(times.at(-1) ?? 0))]);
    await context.close();
  }
  if (!only || 'locate'.includes(only)) {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    page.setDefaultTimeout(180_000);
    await page.addInitScript(() => localStorage.setItem('sekundo.prefs', JSON.stringify({ tour: 'done' })));
    await page.goto(URL_BASE);
    await page.getByRole('tab', { name: 'Locate a source' }).click();
    const start = Date.now();
    await page.getByLabel('Open sensor CSV').setInputFiles({ name: 'frame-500.csv', mimeType: 'text/csv', buffer: Buffer.from(locateCsv(500)) });
    await page.getByText('sensors 1–50 of 500').first().waitFor({ timeout: 120_000 });
    const open = Date.now() - start;
    const times = await keystrokeTimes(page, page.getByRole('textbox', { name: 'Arrival at S1 (ms)' }));
    rows.push(['locate: 500 sensors', String(open), String(Math.round(times[Math.floor(times.length / 2)] ?? 0)), String(Math.round(times.at(-1) ?? 0))]);
    await context.close();
  }
  await browser.close();
  const widths = rows[0]?.map((_, i) => Math.max(...rows.map((r) => (r[i] ?? '').length))) ?? [];
  for (const r of rows) console.log(r.map((cell, i) => cell.padEnd(widths[i] ?? 0)).join('  '));
}

if (process.argv[1]?.endsWith('keystroke-limits.browser.ts')) await main();
