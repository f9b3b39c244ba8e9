import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { markSvg } from '../support/app-mark';

/*
 * The page installs as an app (on a lab PC or a phone) and opens offline: a web app manifest with
 * icons that exist at the sizes it states (W3C Web Application Manifest; a 192 px and a 512 px
 * icon and a maskable one are what installing browsers ask for — common practice, no single source).
 */

const PUBLIC = join(import.meta.dirname, '..', '..', 'public');

interface ManifestIcon {
  src: string;
  sizes: string;
  type: string;
  purpose?: string;
}

const manifest = JSON.parse(readFileSync(join(PUBLIC, 'manifest.webmanifest'), 'utf8')) as {
  name: string;
  short_name: string;
  start_url: string;
  scope: string;
  display: string;
  icons: ManifestIcon[];
};

/** Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948, §11.2.2). */
function pngSize(bytes: Buffer): { width: number; height: number } {
  expect(bytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  expect(bytes.subarray(12, 16).toString('latin1')).toBe('IHDR');
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

describe('web app manifest', () => {
  it('names the app, starts at the page itself and opens as a standalone window', () => {
    expect(manifest.short_name).toBe('Sekundo');
    expect(manifest.name).toMatch(/^Sekundo/);
    expect(manifest.start_url).toBe('./');
    expect(manifest.scope).toBe('./');
    expect(manifest.display).toBe('standalone');
  });

  it('lists icons that exist at the sizes it states, a maskable one among them', () => {
    const pngs = manifest.icons.filter((i) => i.type === 'image/png');
    for (const icon of pngs) {
      const [w, h] = icon.sizes.split('x').map(Number);
      expect(pngSize(readFileSync(join(PUBLIC, icon.src))), icon.src).toEqual({ width: w, height: h });
    }
    expect(pngs.map((i) => i.sizes)).toEqual(expect.arrayContaining(['192x192', '512x512']));
    expect(manifest.icons.some((i) => i.purpose === 'maskable')).toBe(true);
  });

  it('draws the icons and the favicon from Sekundo’s own mark', () => {
    const mark = markSvg({ tile: 'rounded', inset: 0 });
    expect(readFileSync(join(PUBLIC, 'icons', 'sekundo.svg'), 'utf8')).toBe(mark);
    expect(readFileSync(join(PUBLIC, 'favicon.svg'), 'utf8')).toBe(mark);
  });

  it('is linked from the page with the theme colour of the header', () => {
    const html = readFileSync(join(import.meta.dirname, '..', '..', 'app', 'index.html'), 'utf8');
    expect(html).toContain('<link rel="manifest" href="./manifest.webmanifest" />');
    expect(html).toContain(`<meta name="theme-color" content="${(manifest as unknown as { theme_color: string }).theme_color}" />`);
  });
});
