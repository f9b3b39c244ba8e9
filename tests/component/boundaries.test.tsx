import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

// Imports flow one way: physics ← io ← ui ← app. The page builds no HTML from strings, runs no
// eval, and reads nothing from outside the repository at run time. Checked on the source text.

const ROOT = join(__dirname, '..', '..');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

function importsOf(path: string): string[] {
  const text = readFileSync(path, 'utf8');
  return [...text.matchAll(/(?:from|import)\s*\(?\s*['"]([^'"]+)['"]/g)].map((m) => m[1] ?? '');
}

const UI_AND_APP = [...sourceFiles(join(ROOT, 'src', 'ui')), ...sourceFiles(join(ROOT, 'app'))];

describe('module boundaries of the page', () => {
  it.each(sourceFiles(join(ROOT, 'src', 'ui')).map((path) => [relative(ROOT, path), path]))(
    '%s imports nothing from app/ or the command line',
    (_, path) => {
      for (const specifier of importsOf(path)) {
        expect(specifier).not.toMatch(/(^|\/)app\//);
        expect(specifier).not.toMatch(/(^|\/)cli(\/|$)/);
      }
    },
  );

  it.each(UI_AND_APP.map((path) => [relative(ROOT, path), path]))(
    '%s uses no eval, no HTML strings and nothing outside the repository',
    (_, path) => {
      const text = readFileSync(path, 'utf8');
      expect(text).not.toMatch(/\beval\s*\(|new Function\s*\(|dangerouslySetInnerHTML|\.innerHTML\s*=|insertAdjacentHTML/);
      expect(text).not.toMatch(/\.\.\/shared\b|https?:\/\/(?!www\.w3\.org)/);
    },
  );
});
