/**
 * Share links: a plan travels in the URL fragment and comes back equal; anything else — not
 * ours, truncated, tampered with, another version, a script payload — is refused with a message.
 */
import { readFileSync } from 'node:fs';
import { compressToEncodedURIComponent, decompressFromEncodedURIComponent } from 'lz-string';
import { describe, expect, it } from 'vitest';
import { decompressUriSafeBounded } from '../../src/io/lz-bounded';
import { MAX_PLAN_FILE_CHARS, parsePlanFile } from '../../src/io/plan-file';
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

  it('a link that unpacks past the plan-file cap is refused as too large, without unpacking it all', () => {
    const fragment = `#plan=1.${compressToEncodedURIComponent('x'.repeat(MAX_PLAN_FILE_CHARS + 1))}`;
    expect(fragment.length).toBeLessThan(MAX_SHARE_FRAGMENT_CHARS);
    const r = decodeShareFragment(fragment);
    expect(r.ok === false && r.errors).toEqual([expect.stringMatching(/^link: too large: .*4000000 characters/)]);
    expect(decompressUriSafeBounded(fragment.slice('#plan=1.'.length), 1000)).toEqual({ ok: false, reason: 'too-large' });
  });

  it('the bounded unpacker reads exactly what lz-string reads (seeded random texts and damaged data; lz-string 1.5.0 as the reference)', () => {
    let seed = 12345;
    const random = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (let n = 0; n < 200; n++) {
      const length = Math.floor(random() * 3000);
      const alphabet = n % 3 === 0 ? 'ab' : n % 3 === 1 ? '{"sensors": [0.01, 2e-5], µ→ü}' : 'x';
      const text = Array.from({ length }, () => alphabet[Math.floor(random() * alphabet.length)]).join('') + (n % 7 === 0 ? '\u{1F600}' : '');
      const packed = compressToEncodedURIComponent(text);
      expect(decompressUriSafeBounded(packed, MAX_PLAN_FILE_CHARS)).toEqual({ ok: true, text });
      const cut = packed.slice(0, Math.floor(packed.length * random()));
      const theirs = cut === '' ? null : decompressFromEncodedURIComponent(cut);
      const ours = decompressUriSafeBounded(cut, MAX_PLAN_FILE_CHARS);
      expect(ours.ok ? ours.text : null).toBe(theirs ? theirs : null);
    }
  });
});
