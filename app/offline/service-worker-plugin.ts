import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import type { Plugin } from 'vite';

/**
 * Build step that makes the page work offline after its first load: once the build is written, it
 * writes `sw.js`, a service worker that stores every file of the build (public/ included) on
 * install and answers the page's own requests from that store (ignoring Vary: servers such as vite
 * preview send "Vary: Origin", and the page's module scripts carry an Origin header the install
 * requests did not). The cache is named after a hash of the content of every file — index.html
 * with its Content-Security-Policy and every file of public/ included — so any change gives a new
 * sw.js, which the browser installs beside the old one. The new worker waits until the page says
 * so: the page offers to reload (app/offline/register.ts), and then the new files take over.
 * Nothing is fetched from anywhere but the page's own origin.
 */
export function offlineCache(): Plugin {
  let outDir = '';
  return {
    name: 'sekundo-offline-cache',
    apply: 'build',
    configResolved(config) {
      outDir = resolve(config.root, config.build.outDir);
    },
    writeBundle: {
      order: 'post',
      handler() {
        writeFileSync(join(outDir, 'sw.js'), serviceWorkerForDirectory(outDir));
      },
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

/** The service worker for the built files in `dir` (every file but sw.js), versioned by their content. */
export function serviceWorkerForDirectory(dir: string): string {
  const files = listFiles(dir)
    .map((path) => ({ name: relative(dir, path).split('\\').join('/'), path }))
    .filter((f) => f.name !== 'sw.js')
    .sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  const hash = createHash('sha256');
  for (const f of files) {
    hash.update(f.name);
    hash.update('\0');
    hash.update(readFileSync(f.path));
    hash.update('\0');
  }
  const version = hash.digest('hex').slice(0, 16);
  return serviceWorkerSource(['./', ...files.map((f) => `./${f.name}`)], version);
}

function serviceWorkerSource(files: string[], version: string): string {
  return `// Sekundo offline cache (generated at build time by app/offline/service-worker-plugin.ts).
const CACHE = 'sekundo-${version}';
const FILES = ${JSON.stringify(files)};

// A new version installs beside the old one and waits: the page offers to reload and then says so.
self.addEventListener('install', (event) => {
  event.waitUntil(caches.open(CACHE).then((cache) => cache.addAll(FILES)));
});

self.addEventListener('message', (event) => {
  if (event.data && event.data.type === 'sekundo-update-now') self.skipWaiting();
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
