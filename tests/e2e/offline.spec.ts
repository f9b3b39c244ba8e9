import { expect, test } from '@playwright/test';

// After one visit the page works with the network gone: the build's service worker keeps every
// file of the page. (A first visit needs the network once; that is the documented limit.)
test('works offline after the first load', async ({ page, context }) => {
  await page.goto('./');
  await expect(page.getByRole('heading', { name: 'Sekundo' })).toBeVisible();
  // Wait until the offline cache controls the page and holds its files.
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);

  await context.setOffline(true);
  await page.reload();
  await expect(page.getByRole('heading', { name: 'Sekundo' })).toBeVisible();
  await expect(page.getByRole('tab').first()).toBeVisible();
  // The property table still computes: the kernel runs in the page.
  await expect(page.getByRole('table').first()).toContainText('m/s');
  await context.setOffline(false);
});
