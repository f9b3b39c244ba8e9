/**
 * Browser benchmark (not part of `npm test`): how fast the built page answers typing at every
 * documented limit of the planner and the locate view, in Debian's Chromium through
 * playwright-core. Build first, then:
 *
 *   npm run build
 *   node --import tsx tests/bench/keystroke-limits.browser.ts
 *
 * It serves dist/ itself (vite preview on SEKUNDO_BENCH_PORT, default 4314), or uses a page
 * already served at SEKUNDO_BENCH_URL. For each case it opens the plan (from the autosave), then:
 *
 * - keystroke: the time from each keydown (the event's own time stamp, so time spent waiting for
 *   a busy main thread counts) to the next paint showing it, as the browser's Event Timing
 *   reports it (tests/support/keystroke-timer.ts); beside it, for comparison with earlier figures,
 *   keydown → a task posted from the first frame showing it (which also waits for any task queued
 *   before it). 16 keystrokes typed into a sensor field, each an edit of the plan, with gaps of
 *   120–700 ms (some keystrokes land while results are drawn);
 * - edit → result: the page's own timer (the hidden `.recompute-time` attributes: edit committed →
 *   the newest plan's timeline drawn) for edits of one sensor (the others come from the plan
 *   worker's per-sensor cache) and of the liquid depth above the setup (a bath input: every
 *   sensor recomputed).
 *
 * Prints one row per case with median and worst, and the machine's load. The target is 100 ms
 * per keystroke. SEKUNDO_BENCH_ONLY=<parts of case names, separated by |> runs only the matching
 * cases ("locate" for the locate view).
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { type Browser, chromium, type Locator, type Page } from 'playwright-core';
import { DEFAULT_KEY_GAPS_MS, frameTimes, keystrokeTimes, typeDigits, watchKeystrokes } from '../support/keystroke-timer';
import { limitCases, locateCsv } from '../support/limit-plans';

const KEYSTROKES = 16;
const KEY_GAPS_MS = DEFAULT_KEY_GAPS_MS;

function sorted(values: readonly number[]): number[] {
  return [...values].sort((a, b) => a - b);
}

function medianOf(values: readonly number[]): number {
  const s = sorted(values);
  return s[Math.floor(s.length / 2)] ?? Number.NaN;
}

function worstOf(values: readonly number[]): number {
  return values.some((v) => Number.isNaN(v)) ? Number.NaN : Math.max(...values);
}

async function timedEdits(page: Page): Promise<number> {
  return Number((await page.locator('.recompute-time').getAttribute('data-edits')) ?? 0);
}

/** Edit → newest result drawn, ms, for each value filled into the field in turn. */
async function editToResult(page: Page, field: Locator, values: readonly string[]): Promise<number[]> {
  const figures: number[] = [];
  for (const value of values) {
    const before = await timedEdits(page);
    await field.fill(value);
    await field.press('Tab');
    const deadline = Date.now() + 300_000;
    while ((await timedEdits(page)) <= before) {
      if (Date.now() > deadline) throw new Error(`no result for ${value}`);
      await page.waitForTimeout(20);
    }
    figures.push(Number(await page.locator('.recompute-time').getAttribute('data-recompute-ms')));
  }
  return figures;
}

async function serve(): Promise<{ url: string; server: ChildProcess | null }> {
  if (process.env.SEKUNDO_BENCH_URL) return { url: process.env.SEKUNDO_BENCH_URL, server: null };
  const port = process.env.SEKUNDO_BENCH_PORT ?? '4314';
  // Its own process group: npx starts vite as a child, and stopping the group stops both.
  const server = spawn('npx', ['vite', 'preview', '--config', 'vite.config.ts', '--host', '127.0.0.1', '--port', port, '--strictPort'], { stdio: 'ignore', detached: true });
  const url = `http://127.0.0.1:${port}/`;
  for (let i = 0; i < 100; i++) {
    try {
      if ((await fetch(url)).ok) return { url, server };
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  stopServer(server);
  throw new Error(`the built page did not come up on ${url} (npm run build first)`);
}

/** Stops the preview server and the vite process npx started (the whole group). */
function stopServer(server: ChildProcess): void {
  try {
    if (server.pid !== undefined) process.kill(-server.pid);
  } catch {
    server.kill();
  }
}

type Row = [string, ...string[]];
const ms = (x: number) => (Number.isNaN(x) ? 'never' : x.toFixed(0));

async function planCase(browser: Browser, url: string, name: string, planText: string): Promise<Row> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  page.setDefaultTimeout(300_000);
  await page.addInitScript(
    ([plan]) => {
      localStorage.setItem('sekundo.prefs', JSON.stringify({ tour: 'done' }));
      localStorage.setItem('sekundo.autosave', plan as string);
    },
    [planText],
  );
  const start = Date.now();
  await page.goto(url);
  await page.getByRole('tab', { name: 'Plan a measurement' }).click();
  await page.locator('[data-chart="planner-timeline"][data-drawn="true"]').or(page.locator('.plan-problem')).first().waitFor({ timeout: 300_000 });
  const open = Date.now() - start;
  console.error(`${name}: open ${open} ms`);
  await watchKeystrokes(page);
  await typeDigits(page, page.getByRole('textbox', { name: 'Sensor 1 noise', exact: true }));
  await page.waitForTimeout(500);
  const keys = await keystrokeTimes(page);
  const frames = await frameTimes(page);
  console.error(`${name}: keystrokes ${keys.map(ms).join(' ')} ms (frame and task after: ${frames.map(ms).join(' ')} ms)`);
  const sensorEdits = await editToResult(page, page.getByRole('textbox', { name: 'Sensor 1 noise', exact: true }), ['1.1 uV', '1.2 uV', '1.3 uV', '1.4 uV', '1.5 uV']);
  const depthEdits = await editToResult(page, page.getByRole('textbox', { name: 'Liquid above the setup', exact: true }), ['101 mm', '102 mm']);
  console.error(`${name}: sensor edit → result ${sensorEdits.map(ms).join(' ')} ms; depth edit → result ${depthEdits.map(ms).join(' ')} ms`);
  await context.close();
  return [name, ms(open), ms(medianOf(keys)), ms(worstOf(keys)), `${ms(medianOf(frames))}/${ms(worstOf(frames))}`, ms(medianOf(sensorEdits)), ms(worstOf(sensorEdits)), ms(medianOf(depthEdits)), ms(worstOf(depthEdits))];
}

async function locateCase(browser: Browser, url: string, count: number): Promise<Row> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  page.setDefaultTimeout(300_000);
  await page.addInitScript(() => localStorage.setItem('sekundo.prefs', JSON.stringify({ tour: 'done' })));
  await page.goto(url);
  await page.getByRole('tab', { name: 'Locate a source' }).click();
  const start = Date.now();
  await page.getByLabel('Open sensor CSV').setInputFiles({ name: `frame-${count}.csv`, mimeType: 'text/csv', buffer: Buffer.from(locateCsv(count)) });
  await page.getByText(`sensors 1–50 of ${count}`).first().waitFor({ timeout: 300_000 });
  const open = Date.now() - start;
  await watchKeystrokes(page);
  await typeDigits(page, page.getByRole('textbox', { name: 'Arrival at S1 (ms)' }));
  await page.waitForTimeout(500);
  const keys = await keystrokeTimes(page);
  const frames = await frameTimes(page);
  console.error(`locate ${count}: keystrokes ${keys.map(ms).join(' ')} ms (frame and task after: ${frames.map(ms).join(' ')} ms)`);
  await context.close();
  return [`locate: ${count} sensors`, ms(open), ms(medianOf(keys)), ms(worstOf(keys)), `${ms(medianOf(frames))}/${ms(worstOf(frames))}`, '', '', '', ''];
}

async function main(): Promise<void> {
  const { url, server } = await serve();
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  const rows: Row[] = [['case', 'open ms', 'key median', 'key worst', 'frame+task median/worst', 'sensor edit→result median', 'worst', 'depth edit→result median', 'worst']];
  const only = process.env.SEKUNDO_BENCH_ONLY;
  const load = () => loadavg().map((l) => l.toFixed(2)).join(' ');
  const loadBefore = load();
  try {
    for (const c of limitCases(JSON.parse(readFileSync('public/demo-plan.json', 'utf8')))) {
      if (only && !only.split('|').some((part) => c.name.includes(part))) continue;
      rows.push(await planCase(browser, url, c.name, c.planText));
    }
    if (!only || only.split('|').includes('locate')) rows.push(await locateCase(browser, url, 500));
  } finally {
    await browser.close();
    if (server) stopServer(server);
  }
  const widths = (rows[0] ?? []).map((_, i) => Math.max(...rows.map((r) => (r[i] ?? '').length)));
  for (const r of rows) console.log(r.map((cell, i) => cell.padEnd(widths[i] ?? 0)).join('  '));
  console.log(`${cpus().length} CPUs; load average before ${loadBefore}, after ${load()}; ${KEYSTROKES} keystrokes a case, ${KEY_GAPS_MS.join('/')} ms apart`);
}

if (process.argv[1]?.endsWith('keystroke-limits.browser.ts')) await main();
