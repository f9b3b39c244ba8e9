/*
 * Makes public/favicon.svg and the app icons in public/icons/ from Sekundo's mark (app-mark.ts):
 *   npx tsx tests/support/make-app-icons.ts
 * PNGs are drawn by Debian's Chromium (/usr/bin/chromium), so the shape is exactly the SVG's.
 * The maskable icon keeps the mark inside the central 80 % that every launcher shows.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { chromium } from '@playwright/test';
import { markSvg } from './app-mark';

const OUT = join(import.meta.dirname, '..', '..', 'public', 'icons');
const ICONS = [
  { file: 'sekundo-192.png', size: 192, svg: markSvg({ tile: 'rounded', inset: 0 }) },
  { file: 'sekundo-512.png', size: 512, svg: markSvg({ tile: 'rounded', inset: 0 }) },
  { file: 'sekundo-maskable-512.png', size: 512, svg: markSvg({ tile: 'full', inset: 0.12 }) },
];

async function main() {
  writeFileSync(join(OUT, 'sekundo.svg'), markSvg({ tile: 'rounded', inset: 0 }));
  writeFileSync(join(OUT, '..', 'favicon.svg'), markSvg({ tile: 'rounded', inset: 0 }));
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu'] });
  try {
    for (const icon of ICONS) {
      const page = await browser.newPage({ viewport: { width: icon.size, height: icon.size } });
      await page.setContent(`<html><body style="margin:0;background:transparent">${icon.svg.replace('<svg ', `<svg width="${icon.size}" height="${icon.size}" `)}</body></html>`);
      await page.screenshot({ path: join(OUT, icon.file), omitBackground: true });
      await page.close();
    }
  } finally {
    await browser.close();
  }
}

await main();
