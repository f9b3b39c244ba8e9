/**
 * The offline cache is versioned by the content of every built file: a change to index.html (its
 * Content-Security-Policy included) or to any file of public/ gives a new sw.js, so a returning
 * browser installs the new build; an identical build gives an identical sw.js.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { serviceWorkerForDirectory } from '../../app/offline/service-worker-plugin';

let dir = '';
afterEach(() => rmSync(dir, { recursive: true, force: true }));

function build(files: Record<string, string>): string {
  dir = mkdtempSync(join(tmpdir(), 'sekundo-sw-'));
  for (const [name, content] of Object.entries(files)) {
    mkdirSync(join(dir, name, '..'), { recursive: true });
    writeFileSync(join(dir, name), content);
  }
  return dir;
}

const BUILD = {
  'index.html': '<meta http-equiv="Content-Security-Policy" content="default-src \'self\'"><title>Sekundo</title>',
  'assets/index-abc.js': 'console.log(1)',
  'demo-plan.json': '{"name":"Orrin-2"}',
  'favicon.svg': '<svg/>',
};

describe('offline cache version', () => {
  it('lists every file but sw.js, and the same build gives the same sw.js', () => {
    const a = serviceWorkerForDirectory(build({ ...BUILD, 'sw.js': 'old' }));
    expect(a).toContain('"./assets/index-abc.js"');
    expect(a).toContain('"./demo-plan.json"');
    expect(a).not.toContain('"./sw.js"');
    writeFileSync(join(dir, 'sw.js'), a);
    expect(serviceWorkerForDirectory(dir)).toBe(a);
  });

  it.each([
    ['the title in index.html', 'index.html', BUILD['index.html'].replace('Sekundo', 'Sekundo · new')],
    ['the Content-Security-Policy in index.html', 'index.html', BUILD['index.html'].replace("'self'", "'self' blob:")],
    ['the demo plan in public/', 'demo-plan.json', '{"name":"Orrin-3"}'],
  ])('a change to %s gives a new cache name', (_what, file, content) => {
    const before = serviceWorkerForDirectory(build(BUILD));
    writeFileSync(join(dir, file), content);
    const after = serviceWorkerForDirectory(dir);
    const cache = (sw: string) => /const CACHE = '(sekundo-[0-9a-f]{16})'/.exec(sw)?.[1];
    expect(cache(after)).toBeDefined();
    expect(cache(after)).not.toBe(cache(before));
  });

  it('a new worker waits for the page instead of taking over by itself', () => {
    const sw = serviceWorkerForDirectory(build(BUILD));
    expect(sw).not.toMatch(/install[\s\S]*skipWaiting\(\)\)/);
    expect(sw).toContain("event.data.type === 'sekundo-update-now') self.skipWaiting()");
  });
});
