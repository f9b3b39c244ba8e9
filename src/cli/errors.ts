/**
 * Errors the command line reports as "bad input": one line on stderr, exit status 2. Every error
 * line is printable and short, whatever bytes the input held: control characters (an escape
 * sequence in a plan file would clear the terminal) are shown as \xNN or \uNNNN, line breaks are
 * folded, and the line is cut at {@link MAX_ERROR_CHARS}. With --json the same message is one
 * JSON object on stderr: {"error": "…", "field": "…" | null}.
 */

/** Exit status for success. */
export const EXIT_OK = 0;
/** Exit status for an unexpected internal error. */
export const EXIT_INTERNAL = 1;
/** Exit status for bad input: unknown command or flag, missing value, bad unit, out of range. */
export const EXIT_USAGE = 2;
/** Longest error line, characters (before the "sekundo: " prefix). */
export const MAX_ERROR_CHARS = 400;

/** Bad input from the user. The message is one line, without the "sekundo: " prefix. */
export class UsageError extends Error {
  override name = 'UsageError';
  /** The flag ("--distance") or file role ("plan file") the message is about, when known. */
  readonly field: string | null;
  constructor(message: string, field: string | null = null) {
    super(message);
    this.field = field;
  }
}

// C0 and C1 controls, DEL, line and paragraph separators, bidirectional and zero-width format marks.
// biome-ignore lint/suspicious/noControlCharactersInRegex: these are the characters being made visible
const UNPRINTABLE = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\u200b-\u200f\u202a-\u202e\u2060-\u2069\ufeff\ufff9-\ufffb]/g;

/** One printable line of at most {@link MAX_ERROR_CHARS} characters. */
export function printableLine(text: string): string {
  const folded = text.replace(/\s*[\r\n]+\s*/g, ' ').trim();
  const cut = folded.length > MAX_ERROR_CHARS * 4 ? folded.slice(0, MAX_ERROR_CHARS * 4) : folded;
  const shown = cut.replace(UNPRINTABLE, (c) => {
    const code = c.charCodeAt(0);
    return code < 0x100 ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u${code.toString(16).padStart(4, '0')}`;
  });
  // Lone surrogates (bytes that were not text) print as the replacement character.
  const whole = shown.replace(/[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g, '\ufffd');
  if (whole.length <= MAX_ERROR_CHARS) return whole;
  let end = MAX_ERROR_CHARS - 1;
  if (/[\ud800-\udbff]/.test(whole.charAt(end - 1))) end -= 1;
  return `${whole.slice(0, end)}…`;
}

/** The flag or file a message is about: "--distance …" → "--distance", 'plan file "x" …' → "plan file". */
export function fieldOf(error: UsageError): string | null {
  if (error.field !== null) return error.field;
  const flag = /^(--[a-z][\w-]*)/.exec(error.message)?.[1];
  if (flag) return flag;
  const file = /^(?:cannot read )?((?:plan|sensor|trace|delay|fit|sweep|reference|lock-in) file)\b/.exec(error.message)?.[1];
  return file ?? null;
}
