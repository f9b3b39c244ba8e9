/**
 * Decompression of lz-string's URI-safe encoding (the format of `compressToEncodedURIComponent`,
 * lz-string 1.5.0, which writes our share links) with a cap on the output: a crafted link of
 * 190 000 characters can expand to billions (each code may stand for a string as long as all the
 * output so far), so the cap is checked while decompressing, never after. Same algorithm and
 * results as lz-string's own `decompressFromEncodedURIComponent`, read from its source (WTFPL);
 * `tests/unit/share-link.test.ts` checks the two agree.
 */

const URI_SAFE_ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+-$';
const VALUE_OF: ReadonlyMap<string, number> = new Map([...URI_SAFE_ALPHABET].map((c, i) => [c, i]));
/** Bits per character of the URI-safe alphabet. */
const RESET_VALUE = 32;

export type BoundedDecompress = { ok: true; text: string } | { ok: false; reason: 'damaged' | 'too-large' };

/**
 * The text encoded in `input` (lz-string URI-safe), or why not: 'damaged' when it is not a valid
 * encoding or ends early, 'too-large' as soon as the text would pass `maxChars`.
 */
export function decompressUriSafeBounded(input: string, maxChars: number): BoundedDecompress {
  const data = input.replace(/ /g, '+');
  if (data === '') return { ok: false, reason: 'damaged' };
  const length = data.length;
  const valueAt = (index: number): number => VALUE_OF.get(data.charAt(index)) ?? 0;
  let val = valueAt(0);
  let position = RESET_VALUE;
  let index = 1;
  const readBits = (count: number): number => {
    let bits = 0;
    const maxpower = 2 ** count;
    let power = 1;
    while (power !== maxpower) {
      const resb = val & position;
      position >>= 1;
      if (position === 0) {
        position = RESET_VALUE;
        val = valueAt(index++);
      }
      bits |= (resb > 0 ? 1 : 0) * power;
      power <<= 1;
    }
    return bits;
  };

  const dictionary: string[] = ['', '', ''];
  let enlargeIn = 4;
  let dictSize = 4;
  let numBits = 3;
  const first = readBits(2);
  let c: string;
  if (first === 0) c = String.fromCharCode(readBits(8));
  else if (first === 1) c = String.fromCharCode(readBits(16));
  else return { ok: false, reason: 'damaged' };
  dictionary[3] = c;
  let w = c;
  const result: string[] = [c];
  let total = c.length;
  for (;;) {
    if (index > length) return { ok: false, reason: 'damaged' };
    let code = readBits(numBits);
    if (code === 0 || code === 1) {
      dictionary[dictSize++] = String.fromCharCode(readBits(code === 0 ? 8 : 16));
      code = dictSize - 1;
      enlargeIn--;
    } else if (code === 2) {
      return { ok: true, text: result.join('') };
    }
    if (enlargeIn === 0) {
      enlargeIn = 2 ** numBits;
      numBits++;
    }
    let entry: string;
    const known = dictionary[code];
    if (known) entry = known;
    else if (code === dictSize) entry = w + w.charAt(0);
    else return { ok: false, reason: 'damaged' };
    total += entry.length;
    if (total > maxChars) return { ok: false, reason: 'too-large' };
    result.push(entry);
    dictionary[dictSize++] = w + entry.charAt(0);
    enlargeIn--;
    w = entry;
    if (enlargeIn === 0) {
      enlargeIn = 2 ** numBits;
      numBits++;
    }
  }
}
