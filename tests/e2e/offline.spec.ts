import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { extname, join } from 'node:path';
import { expect, type Page, test } from '@playwright/test';
import { serviceWorkerForDirectory } from '../../app/offline/service-worker-plugin';

// After one visit the page works with the network gone: the build's service worker keeps every
// file of the page. (A first visit needs the network once; that is the documented limit.)
/** A first visit, then a reload once the offline cache controls the page and holds its files. */
async function underOfflineCache(page: Page): Promise<void> {
  await page.goto('./');
  await expect(page.getByRole('heading', { name: 'Sekundo' })).toBeVisible();
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
}

test('works offline after the first load', async ({ page, context }) => {
  await underOfflineCache(page);
  await context.setOffline(true);
  await page.reload();
  await expect(page.getByRole('heading', { name: 'Sekundo' })).toBeVisible();
  await expect(page.getByRole('tab').first()).toBeVisible();
  // The property table still computes: the kernel runs in the page.
  await expect(page.getByRole('table').first()).toContainText('m/s');
  await context.setOffline(false);
});

// A returning browser gets a changed build: the new service worker installs beside the old one,
// the page says a new version is ready and offers to reload, and after the reload the new files
// (here a changed title in index.html) are in use. The build is served from a copy by a small
// static server of the test, so the test can change it between visits.
test('a changed build is offered with a reload, and then used', async ({ page }) => {
  const root = mkdtempSync(join(tmpdir(), 'sekundo-update-'));
  cpSync('dist', root, { recursive: true });
  const types: Record<string, string> = { '.html': 'text/html', '.js': 'text/javascript', '.css': 'text/css', '.json': 'application/json', '.svg': 'image/svg+xml', '.csv': 'text/csv' };
  const server = createServer((request, response) => {
    const path = decodeURIComponent(new URL(request.url ?? '/', 'http://x').pathname);
    const file = join(root, path.endsWith('/') ? `${path}index.html` : path);
    if (!file.startsWith(root) || !existsSync(file)) {
      response.writeHead(404).end();
      return;
    }
    response.writeHead(200, { 'Content-Type': types[extname(file)] ?? 'application/octet-stream', 'Cache-Control': 'no-cache' });
    response.end(readFileSync(file));
  });
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
  try {
    // A returning visitor of this origin: the first-visit tour is done.
    await page.addInitScript(() => localStorage.setItem('sekundo.prefs', JSON.stringify({ tour: 'done' })));
    await page.goto(url);
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await page.reload();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    const oldTitle = await page.title();

    // A new build: only index.html changes (its title), as a change to the CSP or public/ would.
    const html = readFileSync(join(root, 'index.html'), 'utf8');
    writeFileSync(join(root, 'index.html'), html.replace(/<title>([^<]*)<\/title>/, '<title>$1 (new build)</title>'));
    writeFileSync(join(root, 'sw.js'), serviceWorkerForDirectory(root));

    await page.reload();
    // The old build still answers until the person agrees; it says a new one is ready.
    expect(await page.title()).toBe(oldTitle);
    const offer = page.getByRole('status').filter({ hasText: 'A new version of Sekundo is ready' });
    await expect(offer).toBeVisible({ timeout: 20_000 });
    await offer.getByRole('button', { name: 'Reload now' }).click();
    await expect(page).toHaveTitle(`${oldTitle} (new build)`);
  } finally {
    await new Promise((done) => server.close(done));
    rmSync(root, { recursive: true, force: true });
  }
});

// The page installs as an app: its manifest and every icon it lists are served, decode at the sizes
// stated, and are kept by the offline cache, so the installed app opens with the network gone.
test('the manifest and its icons are served and kept for offline use', async ({ page, context }) => {
  await underOfflineCache(page);
  await context.setOffline(true);

  const found = await page.evaluate(async () => {
    const link = document.querySelector<HTMLLinkElement>('link[rel="manifest"]');
    if (!link) return null;
    const manifest = (await (await fetch(link.href)).json()) as { icons: { src: string; sizes: string }[] };
    const icons = [];
    for (const icon of manifest.icons) {
      const image = new Image();
      image.src = new URL(icon.src, link.href).href;
      await image.decode();
      icons.push({ sizes: icon.sizes, drawn: `${image.naturalWidth}x${image.naturalHeight}` });
    }
    return icons;
  });
  await context.setOffline(false);
  expect(found).not.toBeNull();
  for (const icon of found ?? []) if (icon.sizes !== 'any') expect(icon.drawn).toBe(icon.sizes);
  expect(found?.length).toBeGreaterThanOrEqual(3);
});
