/**
 * File-name patterns for following a folder (`sekundo watch --pattern`, the page's "Follow a
 * folder"): a glob over the file's own name (no folders): `*` any run of characters, `?` one
 * character, `[abc]` / `[0-9]` / `[!abc]` one of (or none of) a set, `{csv,txt}` one of a few words.
 * Matching ignores case, as the file systems of most acquisition PCs do (SHOT-1.CSV matches *.csv).
 */

/** Longest pattern accepted, characters. */
export const WATCH_PATTERN_MAX_CHARS = 200;

/** The default pattern: CSV files (any case). */
export const DEFAULT_WATCH_PATTERN = '*.csv';

/** A pattern that cannot be read: the message names the problem in one line. */
export class WatchPatternError extends Error {
  override name = 'WatchPatternError';
}

function escapeChar(c: string): string {
  return /[\\^$.*+?()[\]{}|/]/.test(c) ? `\\${c}` : c;
}

/**
 * The pattern as a matcher of file names. Throws WatchPatternError for an empty or over-long
 * pattern, one with a folder separator, an unclosed `[` or `{`, or a nested `{`.
 */
export function compileWatchPattern(pattern: string): (name: string) => boolean {
  const p = pattern.trim();
  if (p === '') throw new WatchPatternError('the pattern is empty; give one such as *.csv');
  if (p.length > WATCH_PATTERN_MAX_CHARS) throw new WatchPatternError(`the pattern has ${p.length} characters; at most ${WATCH_PATTERN_MAX_CHARS}`);
  if (/[/\\]/.test(p)) throw new WatchPatternError(`the pattern "${p}" names a folder; it matches file names inside the folder only, e.g. *.csv`);
  let source = '';
  let inBraces = false;
  for (let i = 0; i < p.length; i++) {
    const c = p[i] as string;
    if (c === '*') source += '.*';
    else if (c === '?') source += '.';
    else if (c === '[') {
      const end = p.indexOf(']', i + 2);
      if (end < 0) throw new WatchPatternError(`the pattern "${p}" opens a set with [ and never closes it with ]`);
      let body = p.slice(i + 1, end);
      const negate = body.startsWith('!') || body.startsWith('^');
      if (negate) body = body.slice(1);
      source += `[${negate ? '^' : ''}${body.replace(/[\\\]^]/g, (x) => `\\${x}`)}]`;
      i = end;
    } else if (c === '{') {
      if (inBraces) throw new WatchPatternError(`the pattern "${p}" nests { inside {; list the words once, e.g. *.{csv,txt}`);
      if (p.indexOf('}', i) < 0) throw new WatchPatternError(`the pattern "${p}" opens a list with { and never closes it with }`);
      inBraces = true;
      source += '(?:';
    } else if (c === '}' && inBraces) {
      inBraces = false;
      source += ')';
    } else if (c === ',' && inBraces) source += '|';
    else source += escapeChar(c);
  }
  const re = new RegExp(`^${source}$`, 'is');
  return (name) => re.test(name);
}
