/**
 * The import graph of a folder's TypeScript files (relative imports only: `import … from`,
 * `export … from`, `import type`, and `import('…')`), and the loops in it (strongly connected
 * components of two or more files, or a file importing itself), each named as the files it
 * passes through. Used by tests/unit/import-loops.test.ts.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, normalize, relative } from 'node:path';

const IMPORT = /(?:import|export)\s[^'"]*?from\s+['"](\.[^'"]+)['"]|import\(\s*['"](\.[^'"]+)['"]\s*\)|^\s*import\s+['"](\.[^'"]+)['"]/gms;

/** Every .ts and .tsx file under the roots (declaration files and node_modules left out). */
export function sourceFiles(roots: readonly string[]): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) {
        if (name !== 'node_modules') walk(path);
      } else if (/\.tsx?$/.test(name) && !name.endsWith('.d.ts')) out.push(normalize(path));
    }
  };
  for (const root of roots) walk(root);
  return out.sort();
}

function resolve(from: string, spec: string): string | null {
  const base = normalize(join(dirname(from), spec));
  const stem = base.replace(/\.js$/, '');
  for (const candidate of [base, `${stem}.ts`, `${stem}.tsx`, join(base, 'index.ts'), join(base, 'index.tsx')]) {
    if (/\.tsx?$/.test(candidate) && existsSync(candidate) && statSync(candidate).isFile()) return candidate;
  }
  return null;
}

/** File → the project files it imports. */
export function importGraph(roots: readonly string[]): Map<string, string[]> {
  const graph = new Map<string, string[]>();
  for (const file of sourceFiles(roots)) {
    const text = readFileSync(file, 'utf8');
    const targets = new Set<string>();
    for (const match of text.matchAll(IMPORT)) {
      const spec = match[1] ?? match[2] ?? match[3];
      const target = spec ? resolve(file, spec) : null;
      if (target) targets.add(target);
    }
    graph.set(file, [...targets].sort());
  }
  return graph;
}

/** The loops of a graph (Tarjan's strongly connected components), each as its files, sorted. */
export function importLoops(graph: ReadonlyMap<string, readonly string[]>): string[][] {
  let counter = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const loops: string[][] = [];
  const visit = (v: string) => {
    index.set(v, counter);
    low.set(v, counter);
    counter += 1;
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v) ?? 0, low.get(w) ?? 0));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v) ?? 0, index.get(w) ?? 0));
    }
    if (low.get(v) === index.get(v)) {
      const component: string[] = [];
      let w: string | undefined;
      do {
        w = stack.pop();
        if (w === undefined) break;
        onStack.delete(w);
        component.push(w);
      } while (w !== v);
      if (component.length > 1 || (graph.get(v) ?? []).includes(v)) loops.push(component.sort());
    }
  };
  for (const v of graph.keys()) if (!index.has(v)) visit(v);
  return loops;
}

/** A loop as one line: "3 files: a.ts → b.ts → c.ts", paths relative to `base`. */
export function loopText(loop: readonly string[], base: string): string {
  return `${loop.length} files: ${loop.map((f) => relative(base, f)).join(' → ')}`;
}
