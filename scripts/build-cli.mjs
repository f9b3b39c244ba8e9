#!/usr/bin/env node
/**
 * Builds the command line into plain JavaScript, so `sekundo` starts without compiling
 * TypeScript: src/cli/entry.ts → build/cli/sekundo.mjs plus one chunk per command (loaded only
 * when that command runs). Run by npm's "prepare" step after `npm ci` / `npm install`, and by
 * `npm run build:cli`. build/ is not committed. `--outdir DIR` builds elsewhere (the tests do).
 *
 * Beside the bundle it writes inputs.json: every source file the bundle was built from (and
 * package.json). bin/sekundo.mjs runs the bundle only while none of them is newer than it, and
 * falls back to the sources (through tsx) otherwise, so an edited source is never shadowed.
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { build } from 'esbuild';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const { values } = parseArgs({ options: { outdir: { type: 'string' } } });
const outdir = values.outdir ? resolve(values.outdir) : join(root, 'build', 'cli');

rmSync(outdir, { recursive: true, force: true });
mkdirSync(outdir, { recursive: true });
const result = await build({
  absWorkingDir: root,
  entryPoints: { sekundo: 'src/cli/entry.ts' },
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  outExtension: { '.js': '.mjs' },
  chunkNames: 'chunks/[name]-[hash]',
  metafile: true,
  legalComments: 'none',
  logLevel: 'warning',
});
const inputs = [...new Set([...Object.keys(result.metafile.inputs), 'package.json', 'scripts/build-cli.mjs'])]
  .filter((path) => !path.startsWith('node_modules/'))
  .map((path) => relative(root, join(root, path)).split('\\').join('/'))
  .sort();
writeFileSync(join(outdir, 'inputs.json'), `${JSON.stringify({ builtAt: Date.now(), inputs }, null, 1)}\n`);
