import { readFileSync } from 'node:fs';
import { expect, type Page, test } from '@playwright/test';
import { BAD_TRACE_TEXT, watchTraceText } from '../support/watch-traces';
import { guardEveryPage } from './page-guard';

/*
 * "Follow a folder" in Chromium against a real folder handle: the test fills a folder of the
 * origin-private file system (navigator.storage.getDirectory(), real files the browser reads
 * through the File System Access API) and stands it in for the folder picker, so the page's own
 * read path runs: entries(), getFile(), the trace worker. Traces are invented
 * (tests/support/watch-traces.ts). A third file is written in pieces, each piece committed, as a
 * digitiser's file grows; a bad file comes in the middle.
 */

const ARTIFACTS = 'test-results/artifacts';

guardEveryPage();

/** Writes `text` into the test folder (a new file, or the first `upTo` characters of it). */
async function writeFile(page: Page, name: string, text: string): Promise<void> {
  await page.evaluate(
    async ({ name, text }) => {
      const root = await navigator.storage.getDirectory();
      const dir = await root.getDirectoryHandle('run-12', { create: true });
      const file = await dir.getFileHandle(name, { create: true });
      const w = await file.createWritable();
      await w.write(text);
      await w.close();
    },
    { name, text },
  );
}

async function listFolder(page: Page): Promise<{ name: string; size: number; modified: number }[]> {
  return page.evaluate(async () => {
    const root = await navigator.storage.getDirectory();
    const dir = await root.getDirectoryHandle('run-12', { create: true });
    const out: { name: string; size: number; modified: number }[] = [];
    // biome-ignore lint/suspicious/noExplicitAny: entries() is not in every DOM library.
    for await (const [name, handle] of (dir as any).entries()) {
      const f = await (handle as FileSystemFileHandle).getFile();
      out.push({ name, size: f.size, modified: f.lastModified });
    }
    return out.sort((a, b) => a.name.localeCompare(b.name));
  });
}

async function rows(page: Page): Promise<number> {
  return page.getByRole('table', { name: /Each file’s time/ }).locator('tbody tr').count();
}

test.describe('follow a folder', () => {
  test.beforeEach(async ({ page }) => {
    await page.goto('/');
    await page.evaluate(async () => {
      const root = await navigator.storage.getDirectory();
      await root.removeEntry('run-12', { recursive: true }).catch(() => undefined);
      const dir = await root.getDirectoryHandle('run-12', { create: true });
      // The folder picker, stood in for by the test's folder (the page asks for read-only access).
      (window as unknown as { showDirectoryPicker: () => Promise<FileSystemDirectoryHandle> }).showDirectoryPicker = async () => dir;
    });
    await page.getByRole('tab', { name: 'Read the temperature' }).click();
    await page.getByRole('tab', { name: 'Follow a folder' }).click();
    await page.getByRole('radio', { name: 'Expected temperature' }).check();
    const look = page.getByRole('textbox', { name: 'Look every' });
    await look.fill('0.3');
    await look.press('Enter');
  });

  test('reads the folder as it fills, survives a bad file and a file written in pieces, alarms, exports, and writes nothing there', async ({ page }, info) => {
    await writeFile(page, 'shot-1.csv', watchTraceText(1.86, '2026-11-03T15:00:00Z', 1));
    await writeFile(page, 'shot-2.csv', watchTraceText(1.85, '2026-11-03T15:01:00Z', 2));
    await writeFile(page, 'notes.txt', 'not matched by *.csv');
    await page.getByRole('button', { name: 'Choose a folder to follow' }).click();
    await expect.poll(() => rows(page)).toBe(2);
    await expect(page.getByText('Following', { exact: true }).locator('..')).toContainText('Following folder “run-12” · 2 read');

    await writeFile(page, 'shot-3-bad.csv', BAD_TRACE_TEXT);
    // shot-4 grows piece by piece, each piece committed (a new, longer file each time).
    const text = watchTraceText(1.84, '2026-11-03T15:03:00Z', 4);
    for (let i = 1; i <= 6; i++) {
      await writeFile(page, 'shot-4.csv', text.slice(0, Math.round((text.length * i) / 6)));
      await page.waitForTimeout(120);
    }
    await expect.poll(() => rows(page)).toBe(3);
    const notRead = page.getByRole('list', { name: 'Files not read' });
    await expect(notRead).toContainText('shot-3-bad.csv');
    await expect(notRead.locator('li')).toHaveCount(1);
    const temperatures = await page.getByRole('table', { name: /Each file’s time/ }).locator('tbody tr td:nth-child(5)').allTextContents();
    // Newest first; each reads a little warm: the half-height pick lies about 10 µs after the
    // invented pulse's onset, 5–10 mK at 50 mm (the offset t₀ would take it out).
    const read = temperatures.map((t) => Number(t.split(' ')[0]));
    [1.84, 1.85, 1.86].forEach((made, i) => {
      expect((read[i] as number) - made).toBeGreaterThan(0);
      expect((read[i] as number) - made).toBeLessThan(0.012);
    });

    await page.getByRole('checkbox', { name: /Band: alarm outside/ }).check();
    await expect.poll(() => page.title()).toMatch(/^\(!\) Band alarm: 1\.84\d\d K is .* above the band 1\.7950 K–1\.8050 K/);
    await expect(page.getByRole('alert').filter({ hasText: 'Alarm:' })).toBeVisible();
    await expect(page.locator('tr.watch-row--crossing')).toHaveCount(1);

    await page.setViewportSize({ width: 1440, height: 1000 });
    await page.screenshot({ path: `${ARTIFACTS}/watch-1440.png`, fullPage: true });
    await page.setViewportSize({ width: 390, height: 900 });
    await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.screenshot({ path: `${ARTIFACTS}/watch-390.png`, fullPage: true });
    await page.setViewportSize({ width: 1280, height: 720 });

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export the series as CSV' }).click()]);
    const csv = readFileSync(await download.path(), 'utf8').trimEnd().split('\n');
    expect(download.suggestedFilename()).toBe('sekundo-live-series.csv');
    expect(csv[0]?.startsWith('order,file,time,time_from,')).toBe(true);
    expect(csv.slice(1).map((l) => l.split(',')[1])).toEqual(['shot-1.csv', 'shot-2.csv', 'shot-4.csv']);
    expect(csv[3]).toMatch(/began: |1\.84\d+ K is/);
    await info.attach('series', { body: csv.join('\n'), contentType: 'text/csv' });

    // Read-only: the folder holds exactly what the test wrote.
    const before = await listFolder(page);
    await page.getByRole('button', { name: 'Pause' }).click();
    await page.getByRole('button', { name: 'Resume' }).click();
    await page.getByRole('button', { name: 'Stop following' }).click();
    expect(await listFolder(page)).toEqual(before);
    expect(before.map((f) => f.name)).toEqual(['notes.txt', 'shot-1.csv', 'shot-2.csv', 'shot-3-bad.csv', 'shot-4.csv']);
  });

  test('the demo replays invented traces as if they arrived live', async ({ page }) => {
    await page.getByRole('button', { name: 'Replay the invented demo run' }).click();
    await expect.poll(() => rows(page)).toBeGreaterThanOrEqual(2);
    const early = await rows(page);
    await expect.poll(() => rows(page), { timeout: 15_000 }).toBeGreaterThanOrEqual(early + 3);
    await expect(page.getByRole('table', { name: /Each file’s time/ }).locator('tbody tr').first()).toContainText('invented-cooldown-');
    await page.getByRole('button', { name: 'Stop following' }).click();
    await expect(page.getByText('Not following')).toBeVisible();
  });
});
