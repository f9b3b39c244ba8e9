/**
 * No import loops in the page and the shell (src/ and app/): a loop makes module start-up order
 * matter and ties features together. Type imports count too (they tie the files' design). The
 * finder is shown to fail on a small folder with a loop (tests/fixtures/import-loop).
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { importGraph, importLoops, loopText } from '../support/import-graph';

const ROOT = process.cwd();

describe('import loops', () => {
  it('src/ and app/ have none', () => {
    const graph = importGraph([join(ROOT, 'src'), join(ROOT, 'app')]);
    // The walk found the code (a broken walk would find no loops in nothing).
    expect(graph.size).toBeGreaterThan(250);
    expect(graph.get(join(ROOT, 'src/ui/store/sekundo-store.ts'))).toContain(join(ROOT, 'src/ui/planner/planner-slice.ts'));
    expect(importLoops(graph).map((loop) => loopText(loop, ROOT))).toEqual([]);
  });

  it('finds and names a loop through a type import and a dynamic import, and nothing else', () => {
    const folder = join(ROOT, 'tests/fixtures/import-loop');
    const loops = importLoops(importGraph([folder]));
    expect(loops.map((loop) => loopText(loop, folder))).toEqual(['3 files: alpha.ts → beta.ts → gamma.ts']);
  });

  it('finds a file that imports itself', () => {
    expect(importLoops(new Map([['self.ts', ['self.ts']], ['other.ts', ['self.ts']]]))).toEqual([['self.ts']]);
  });
});
