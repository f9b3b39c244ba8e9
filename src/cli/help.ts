/**
 * Usage text: `sekundo --help` lists the commands; `sekundo <command> --help` lists one command's
 * flags with their units and valid ranges. Built from the command table, so it cannot drift.
 */
import { BASE_UNIT, DIMENSIONS, unitsOf } from '../io/quantity';
import { describeAccepted, describeNumber, type FlagSpec, flagSynopsis, formatNumberRange, type OperandSpec } from './args';
import type { Command } from './command';
import { alignTable, formatRange } from './format';

/** The overview printed by `sekundo --help` and `sekundo help`. */
export function renderGeneralHelp(commands: readonly Command[], version: string): string {
  const commandRows = commands.flatMap((c) => [
    [`  ${c.name}`, c.summary],
    ...(c.operands ?? []).map((o) => [`      ${o.placeholder}`, o.help]),
    ...c.flags.map(overviewFlagRow),
  ]);
  return [
    `sekundo ${version}: second sound in superfluid helium-4, on the command line`,
    '',
    'Usage:',
    '  sekundo <command> [flags]',
    '  sekundo <command> --help',
    '  sekundo help [<command>]',
    '  sekundo --version',
    '',
    'Commands:',
    ...alignTable([...commandRows, ['  help', 'show help for a command']], ['left', 'left']),
    '',
    'Quantities take a unit, with or without a space; a bare number is in the SI unit:',
    ...alignTable(
      DIMENSIONS.map((d) => [`  ${d}`, `${unitsOf(d).join(', ')} (bare number = ${BASE_UNIT[d]})`]),
      ['left', 'left'],
    ),
    '  e.g. 1.8K, "1.8 K", 1800mK, 1.6e3Pa, 16.38mbar, 1atm, 50mm, 100us, 1W/cm2, "0.5 W/cm²";',
    '  flags as --flag value or --flag=value.',
    '',
    'Output is a table, or one JSON object with --json ("delay --input" writes CSV). Bad input',
    'prints one line on stderr and exits with status 2; an internal error exits with status 1.',
    '',
  ].join('\n');
}

/** The help for one command: synopsis, description, flags with units and ranges, examples. */
export function renderCommandHelp(command: Command): string {
  const rows = [...command.flags.flatMap(helpRowsOf), ['  --help, -h', 'show this help']];
  const operands = command.operands ?? [];
  return [
    'Usage:',
    ...command.synopsis.map((s) => `  sekundo ${s}`),
    '',
    ...wrap(command.description, HELP_WIDTH),
    '',
    ...(operands.length > 0 ? ['Arguments:', ...alignTable(operands.map(operandRow), ['left', 'left']), ''] : []),
    'Flags:',
    ...alignTable(rows, ['left', 'left']),
    '',
    'Examples:',
    ...command.examples.map((e) => `  sekundo ${e}`),
    '',
  ].join('\n');
}

/** Width the help text wraps its prose to, columns. */
const HELP_WIDTH = 96;

function overviewFlagRow(spec: FlagSpec): string[] {
  const range =
    spec.kind === 'quantity' ? formatRange(spec.range, BASE_UNIT[spec.dimension]) : spec.kind === 'number' ? formatNumberRange(spec.range) : '';
  return [`      ${flagSynopsis(spec)}`, range];
}

function helpRowsOf(spec: FlagSpec): string[][] {
  const first = [`  ${flagSynopsis(spec)}`, spec.help];
  if (spec.kind === 'quantity') return [first, ['', describeAccepted(spec)]];
  if (spec.kind === 'number') return [first, ['', describeNumber(spec)]];
  return [first];
}

function operandRow(spec: OperandSpec): string[] {
  return [`  ${spec.placeholder}`, spec.help];
}

function wrap(text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (line && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else {
      line = line ? `${line} ${word}` : word;
    }
  }
  if (line) lines.push(line);
  return lines;
}
