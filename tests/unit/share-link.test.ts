/**
 * Share links: a plan travels in the URL fragment and comes back equal; anything else — not
 * ours, truncated, tampered with, another version, a script payload — is refused with a message.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parsePlanFile } from '../../src/io/plan-file';
import { decodeShareFragment, encodeShareFragment, MAX_SHARE_FRAGMENT_CHARS } from '../../src/io/share-link';

const parsed = parsePlanFile(readFileSync(new URL('../../public/demo-plan.json', import.meta.url), 'utf8'));
if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
const plan = parsed.plan;

describe('share links', () => {
  it('round-trip the demo plan through the fragment', () => {
    const fragment = encodeShareFragment(plan);
    expect(fragment.startsWith('#plan=1.')).toBe(true);
    expect(fragment.length).toBeLessThan(4000);
    const back = decodeShareFragment(fragment);
    expect(back).toEqual({ ok: true, plan });
  });

  it.each([
    ['', 'empty'],
    ['#', 'bare hash'],
    ['#section-2', 'an ordinary anchor'],
    ['#access_token=abc', 'someone else’s fragment'],
  ])('%s (%s) carries no plan', (hash) => {
    expect(decodeShareFragment(hash)).toEqual({ ok: 'none' });
  });

  it('a truncated link is refused with a message', () => {
    const fragment = encodeShareFragment(plan);
    const r = decodeShareFragment(fragment.slice(0, Math.floor(fragment.length / 2)));
    expect(r.ok).toBe(false);
    expect(r.ok === false && r.errors[0]).toMatch(/^link: /);
  });

  it.each([
    ['#plan=1.<script>alert(1)</script>', /characters a Sekundo link never has/],
    ['#plan=1.javascript:alert(1)', /characters a Sekundo link never has/],
    ['#plan=2.abc', /version/],
    ['#plan=abc', /version/],
    ['#plan=1.', /damaged or cut short/],
    ['#plan=1.NoIGwJqAFAg', /link: /],
  ])('%s is refused', (hash, message) => {
    const r = decodeShareFragment(hash);
    expect(r.ok).toBe(false);
    expect(r.ok === false && r.errors.join(' ')).toMatch(message);
  });

  it('a fragment over the size limit is refused with the limit named', () => {
    const r = decodeShareFragment(`#plan=1.${'A'.repeat(MAX_SHARE_FRAGMENT_CHARS)}`);
    expect(r.ok === false && r.errors[0]).toMatch(String(MAX_SHARE_FRAGMENT_CHARS));
  });
});
