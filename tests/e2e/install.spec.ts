import { expect, test } from '@playwright/test';

// The page installs as an app: its manifest and every icon it lists are served, decode at the sizes
// stated, and are kept by the offline cache, so the installed app opens with the network gone.
test('the manifest and its icons are served and kept for offline use', async ({ page, context }) => {
  await page.goto('./');
  await expect(page.getByRole('heading', { name: 'Sekundo' })).toBeVisible();
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
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
