import { createHash } from 'node:crypto';
import { readdirSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import type { Plugin } from 'vite';

/**
 * Build step that makes the page work offline after its first load: it writes `sw.js`, a service
 * worker that stores every file of the build (and of public/) on install and answers the page's
 * own requests from that store (ignoring Vary: servers such as vite preview send "Vary: Origin",
 * and the page's module scripts carry an Origin header the install requests did not). The cache name carries a hash of the file list, so a new build
 * replaces the old files. Nothing is fetched from anywhere but the page's own origin.
 */
export function offlineCache(publicDir: string): Plugin {
  return {
    name: 'sekundo-offline-cache',
    apply: 'build',
    generateBundle(_options, bundle) {
      const built = Object.keys(bundle);
      const publicFiles = listFiles(publicDir).map((f) => relative(publicDir, f).split('\\').join('/'));
      const files = ['./', ...['index.html', ...built, ...publicFiles].filter((f) => f !== 'sw.js').map((f) => `./${f}`)];
      const unique = [...new Set(files)].sort();
      const version = createHash('sha256').update(unique.join('\n')).digest('hex').slice(0, 16);
      this.emitFile({ type: 'asset', fileName: 'sw.js', source: serviceWorkerSource(unique, version) });
    },
  };
}

function listFiles(dir: string): string[] {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return [];
  }
  return names.flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? listFiles(path) : [path];
  });
}

function serviceWorkerSource(files: string[], version: string): string {
  return `// Sekundo offline cache (generated at build time by app/offline/service-worker-plugin.ts).
const CACHE = 'sekundo-${version}';
const FILES = ${JSON.stringify(files)};

self.addEventListener('install', (event) => {
  event.waitUntil(caches.open(CACHE).then((cache) => cache.addAll(FILES)).then(() => self.skipWaiting()));
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    caches
      .keys()
      .then((keys) => Promise.all(keys.filter((k) => k.startsWith('sekundo-') && k !== CACHE).map((k) => caches.delete(k))))
      .then(() => self.clients.claim()),
  );
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET' || new URL(request.url).origin !== self.location.origin) return;
  event.respondWith(
    caches.open(CACHE).then((cache) =>
      cache.match(request, { ignoreSearch: true, ignoreVary: true }).then((hit) => hit || fetch(request)),
    ),
  );
});
`;
}
