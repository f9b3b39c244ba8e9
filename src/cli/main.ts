/**
 * Sekundo's command line: `sekundo <command> [flags]`. A thin layer over src/physics.
 * Contract: results on stdout; bad input is one line on stderr and exit status 2; an unexpected
 * internal error is one line on stderr and exit status 1. Never a stack trace. The line is printable
 * and short (src/cli/errors.ts); with --json it is one JSON object {"error", "field"} instead.
 */
import { HELP_FLAGS, parseFlags } from './args';
import type { Command } from './command';
import { COMMAND_TABLE, loadAllCommands } from './commands/index';
import { EXIT_INTERNAL, EXIT_OK, EXIT_USAGE, fieldOf, printableLine, UsageError } from './errors';
import { renderCommandHelp, renderGeneralHelp } from './help';
import { type CliIo, processIo, withStandardInput } from './io';
import { packageVersion } from './version';

const PROGRAM = 'sekundo';
const VERSION_FLAG = '--version';

/**
 * Runs the command line on `argv` (the arguments after the program name) and returns the exit
 * status: 0 success, 1 internal error, 2 bad input. Writes only through `io`; never throws.
 */
export async function main(argv: string[], io: CliIo = processIo): Promise<number> {
  const json = argv.includes('--json');
  try {
    return await withStandardInput(io.stdinFd, () => dispatch(argv, io));
  } catch (error) {
    if (error instanceof UsageError) {
      const message = printableLine(error.message);
      io.stderr(json ? `${JSON.stringify({ error: message, field: fieldOf(error) })}\n` : `${PROGRAM}: ${message}\n`);
      return EXIT_USAGE;
    }
    const message = `internal error: ${printableLine(describeError(error))}`;
    io.stderr(json ? `${JSON.stringify({ error: message, field: null })}\n` : `${PROGRAM}: ${message}\n`);
    return EXIT_INTERNAL;
  }
}

async function dispatch(argv: readonly string[], io: CliIo): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined) throw new UsageError(`no command given; commands: ${commandNames()} (try "${PROGRAM} --help")`);
  if (HELP_FLAGS.includes(first)) return printGeneralHelp(rest, io);
  if (first === VERSION_FLAG) return printVersion(rest, io);
  if (first === 'help') return printHelpFor(rest, io);
  if (first.startsWith('-')) {
    throw new UsageError(`unknown flag ${first.split('=')[0]}; give a command first: ${commandNames()}`);
  }
  const command = await findCommand(first);
  if (rest.some((token) => HELP_FLAGS.includes(token))) {
    io.stdout(renderCommandHelp(command));
    return EXIT_OK;
  }
  return command.run(parseFlags(command.name, rest, command.flags, command.operands), io);
}

async function printGeneralHelp(rest: readonly string[], io: CliIo): Promise<number> {
  requireNothingAfter(HELP_FLAGS[0] ?? '--help', rest);
  io.stdout(renderGeneralHelp(await loadAllCommands(), packageVersion()));
  return EXIT_OK;
}

function printVersion(rest: readonly string[], io: CliIo): number {
  requireNothingAfter(VERSION_FLAG, rest);
  io.stdout(`${packageVersion()}\n`);
  return EXIT_OK;
}

async function printHelpFor(rest: readonly string[], io: CliIo): Promise<number> {
  const [name, ...extra] = rest;
  if (name === undefined) return printGeneralHelp([], io);
  requireNothingAfter(`help ${name}`, extra);
  io.stdout(renderCommandHelp(await findCommand(name)));
  return EXIT_OK;
}

function findCommand(name: string): Promise<Command> {
  const entry = COMMAND_TABLE.find((c) => c.name === name);
  if (!entry) throw new UsageError(`unknown command "${name}"; commands: ${commandNames()}, help`);
  return entry.load();
}

function requireNothingAfter(what: string, rest: readonly string[]): void {
  const [extra] = rest;
  if (extra !== undefined) throw new UsageError(`unexpected argument "${extra}" after ${what}`);
}

function commandNames(): string {
  return COMMAND_TABLE.map((c) => c.name).join(', ');
}

function describeError(error: unknown): string {
  return error instanceof Error ? `${error.name}: ${error.message}` : String(error);
}
