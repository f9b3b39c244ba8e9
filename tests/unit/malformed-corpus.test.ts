/**
 * The corpus of malformed inputs in tests/corpus: every plan file and URL fragment there must get
 * a message that names the problem (or, for the one valid plan with a script-like label, load with
 * the label kept as plain text). The store-level and browser-level checks that the open plan stays
 * unchanged use the same corpus.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parsePlanFile } from '../../src/io/plan-file';
import { decodeShareFragment } from '../../src/io/share-link';

const PLANS = new URL('../corpus/plans/', import.meta.url);
const expected = JSON.parse(readFileSync(new URL('expected.json', PLANS), 'utf8')) as Record<string, string | null>;
const files = readdirSync(PLANS).filter((f) => f.endsWith('.json') && f !== 'expected.json');

describe('malformed plan files (tests/corpus/plans)', () => {
  it('every file in the corpus has an expectation', () => {
    expect(files.sort()).toEqual(Object.keys(expected).sort());
  });

  it.each(files)('%s', (file) => {
    const result = parsePlanFile(readFileSync(new URL(file, PLANS), 'utf8'));
    const want = expected[file];
    if (want === null) {
      expect(result.ok).toBe(true);
      return;
    }
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.errors.length).toBeGreaterThan(0);
      expect(result.errors.join('\n')).toContain(want);
    }
  });

  it('no corpus file pollutes Object.prototype', () => {
    for (const file of files) parsePlanFile(readFileSync(new URL(file, PLANS), 'utf8'));
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

const fragments = JSON.parse(readFileSync(new URL('../corpus/fragments/fragments.json', import.meta.url), 'utf8')) as {
  cases: { fragment: string; expect: string | null }[];
};

describe('malformed share-link fragments (tests/corpus/fragments)', () => {
  it.each(fragments.cases)('$fragment', ({ fragment, expect: want }) => {
    const r = decodeShareFragment(fragment);
    if (want === null) {
      expect(r).toEqual({ ok: 'none' });
    } else {
      expect(r.ok).toBe(false);
      if (r.ok === false) expect(r.errors.join(' ')).toContain(want);
    }
  });
});
