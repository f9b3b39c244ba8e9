/**
 * The shape of one command. commands/index.ts keeps the table of them; adding a command means
 * writing one module that exports a Command and listing it there.
 */
import type { FlagSpec, OperandSpec, ParsedArgs } from './args';
import type { CliIo } from './io';

/** One `sekundo <name>` command. */
export interface Command {
  readonly name: string;
  /** One line for the command list in `sekundo --help`. */
  readonly summary: string;
  /** Usage line(s) after "sekundo ", e.g. "props --temperature <T> [--json]". */
  readonly synopsis: readonly string[];
  /** A few sentences for `sekundo <name> --help`. */
  readonly description: string;
  readonly flags: readonly FlagSpec[];
  /** Positional arguments, in order (e.g. the plan file); none if absent. */
  readonly operands?: readonly OperandSpec[];
  /** Complete example invocations, without the leading "sekundo ". */
  readonly examples: readonly string[];
  /**
   * Runs the command; returns the exit status (a promise for one that streams a long output).
   * Throws (or rejects with) UsageError for bad input.
   */
  run(args: ParsedArgs, io: CliIo): number | Promise<number>;
}
