/**
 * Errors the command line reports as "bad input": one line on stderr, exit status 2.
 */

/** Exit status for success. */
export const EXIT_OK = 0;
/** Exit status for an unexpected internal error. */
export const EXIT_INTERNAL = 1;
/** Exit status for bad input: unknown command or flag, missing value, bad unit, out of range. */
export const EXIT_USAGE = 2;

/** Bad input from the user. The message is one line, without the "sekundo: " prefix. */
export class UsageError extends Error {
  override name = 'UsageError';
}
