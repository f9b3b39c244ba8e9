#!/usr/bin/env node
// Command-line entry. Runs the plain-JavaScript bundle build/cli/sekundo.mjs that npm's "prepare"
// step builds after `npm ci` (scripts/build-cli.mjs), so a call starts in a few tens of
// milliseconds. While the bundle is missing, or any source file it was built from is newer than
// it (an edit not yet rebuilt: `npm run build:cli`), or SEKUNDO_FROM_SOURCE=1 is set, it runs the
// TypeScript sources through tsx instead: same program, slower start.
import { readFileSync, statSync } from 'node:fs';

const root = new URL('../', import.meta.url);

function bundleIsCurrent() {
  if (process.env.SEKUNDO_FROM_SOURCE === '1') return false;
  try {
    const { builtAt, inputs } = JSON.parse(readFileSync(new URL('build/cli/inputs.json', root), 'utf8'));
    const built = statSync(new URL('build/cli/sekundo.mjs', root)).mtimeMs;
    const since = Math.min(built, builtAt);
    return inputs.every((path) => statSync(new URL(path, root), { throwIfNoEntry: false })?.mtimeMs <= since);
  } catch {
    return false;
  }
}

if (bundleIsCurrent()) {
  await import('../build/cli/sekundo.mjs');
} else {
  const { register } = await import('tsx/esm/api');
  register();
  await import('../src/cli/entry.ts');
}
