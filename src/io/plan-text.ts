/**
 * The bytes of a plan file as text, read the same way by the page and the command line: UTF-8, or
 * UTF-16 / UTF-8 with a byte-order mark (as trace files are read, src/io/csv-common.ts). A file
 * that is not text (a PNG, anything with a NUL byte) is refused in one short line rather than
 * parsed as JSON.
 */
import { decodeText } from './csv-common';
import { MAX_PLAN_FILE_CHARS } from './plan-file';

/** Largest plan file read, bytes: room for {@link MAX_PLAN_FILE_CHARS} characters as UTF-16. */
export const MAX_PLAN_FILE_BYTES = 2 * MAX_PLAN_FILE_CHARS + 4;

export type PlanText = { ok: true; text: string } | { ok: false; errors: string[] };

/** Decodes a plan file's bytes; a binary file or one over the size cap gives a message instead. */
export function planTextFromBytes(bytes: Uint8Array): PlanText {
  if (bytes.byteLength > MAX_PLAN_FILE_BYTES) {
    return { ok: false, errors: [`plan: the file has more than ${MAX_PLAN_FILE_BYTES} bytes; a plan file has at most ${MAX_PLAN_FILE_CHARS} characters`] };
  }
  let text: string;
  try {
    text = decodeText(bytes).text;
  } catch {
    return { ok: false, errors: ['plan: the file is not text in UTF-8 or UTF-16; a plan file is JSON text'] };
  }
  if (text.includes('\0')) {
    const utf16 = bytes.length > 3 && (bytes[1] === 0 || bytes[0] === 0);
    return {
      ok: false,
      errors: [
        utf16
          ? 'plan: the file looks like UTF-16 text without a byte-order mark; save it as UTF-8 (or UTF-16 with a byte-order mark)'
          : 'plan: the file is binary (it holds NUL bytes), not a plan file; a plan file is JSON text',
      ],
    };
  }
  return { ok: true, text };
}
