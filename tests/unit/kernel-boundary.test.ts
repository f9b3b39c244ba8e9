/**
 * The kernel stays pure: nothing in src/physics may import React, zustand, Plotly, any package,
 * or any project file outside src/physics, nor touch the DOM. This test fails the build if it does.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const KERNEL_DIR = fileURLToPath(new URL('../../src/physics', import.meta.url));

function kernelFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return kernelFiles(path);
    return /\.(ts|tsx|js|mjs)$/.test(entry.name) ? [path] : [];
  });
}

/** Every module specifier in import/export-from statements and dynamic imports or requires. */
function moduleSpecifiers(source: string): string[] {
  const found: string[] = [];
  const patterns = [
    /\b(?:import|export)\s[^'"`;]*?\bfrom\s*['"]([^'"]+)['"]/g,
    /\bimport\s*['"]([^'"]+)['"]/g,
    /\bimport\s*\(\s*['"`]([^'"`]+)['"`]\s*\)/g,
    /\brequire\s*\(\s*['"`]([^'"`]+)['"`]\s*\)/g,
  ];
  for (const pattern of patterns) {
    for (const match of source.matchAll(pattern)) found.push(match[1] as string);
  }
  return found;
}

const DOM_GLOBALS = /\b(document|window|localStorage|sessionStorage|navigator|HTMLElement|indexedDB)\b\s*[.[(]/;

describe('src/physics is a pure kernel', () => {
  const files = kernelFiles(KERNEL_DIR);

  it('finds the kernel files', () => {
    expect(files.length).toBeGreaterThan(10);
  });

  it.each(files.map((f) => [f.slice(KERNEL_DIR.length + 1), f]))('%s imports only sibling kernel files', (_name, file) => {
    const specifiers = moduleSpecifiers(readFileSync(file, 'utf8'));
    for (const spec of specifiers) {
      expect(spec.startsWith('./'), `"${spec}" is not a kernel-local import`).toBe(true);
      expect(spec.includes('..'), `"${spec}" leaves src/physics`).toBe(false);
    }
  });

  it.each(files.map((f) => [f.slice(KERNEL_DIR.length + 1), f]))('%s does not touch the DOM or browser storage', (_name, file) => {
    const code = readFileSync(file, 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
    expect(DOM_GLOBALS.test(code)).toBe(false);
  });

  it('the import scanner itself catches what it must (so this test can fail)', () => {
    expect(moduleSpecifiers(`import React from 'react';`)).toEqual(['react']);
    expect(moduleSpecifiers(`import { create } from "zustand"`)).toEqual(['zustand']);
    expect(moduleSpecifiers(`export * from '../ui/store';`)).toEqual(['../ui/store']);
    expect(moduleSpecifiers(`import 'plotly.js-basic-dist';`)).toEqual(['plotly.js-basic-dist']);
    expect(moduleSpecifiers(`const P = await import('plotly.js-basic-dist')`)).toEqual(['plotly.js-basic-dist']);
    expect(moduleSpecifiers(`import type {\n  X,\n} from './x';`)).toEqual(['./x']);
    expect(DOM_GLOBALS.test('document.body')).toBe(true);
    expect(DOM_GLOBALS.test('window.addEventListener')).toBe(true);
  });
});
