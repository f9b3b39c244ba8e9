/**
 * Flags of one command: their specs, and a strict parser for `--flag value` / `--flag=value`.
 * Quantity flags are read into SI numbers here; every mistake becomes a one-line {@link UsageError}.
 */
import { BASE_UNIT, type Dimension, exampleOf, parseQuantity, QuantityParseError, unitsOf } from '../io/quantity';
import { UsageError } from './errors';
import { formatRange } from './format';

interface FlagBase {
  /** Long name without dashes, e.g. "temperature". */
  readonly name: string;
  /** One line for the help text. */
  readonly help: string;
}

/** A flag whose value is a quantity with units, read into the SI base unit. */
export interface QuantityFlag extends FlagBase {
  readonly kind: 'quantity';
  readonly dimension: Dimension;
  /** Placeholder in usage text, e.g. "T". */
  readonly placeholder: string;
  /** Valid range in the SI base unit of `dimension`, quoted in help and errors. */
  readonly range: readonly [number, number];
  /** Extra words after the range, e.g. what a pressure range means in temperature. */
  readonly rangeNote?: string;
}

/** A flag that is present or absent, e.g. --json. */
export interface BooleanFlag extends FlagBase {
  readonly kind: 'boolean';
}

/** A flag whose value is passed through as text, e.g. a file name. */
export interface TextFlag extends FlagBase {
  readonly kind: 'text';
  readonly placeholder: string;
}

/** Any flag a command can declare. */
export type FlagSpec = QuantityFlag | BooleanFlag | TextFlag;

/** A quantity flag as given: the spec, the text typed and its value in the SI base unit. */
export interface QuantityArg {
  readonly spec: QuantityFlag;
  readonly text: string;
  readonly value: number;
}

/** The help flag every command accepts, long and short. */
export const HELP_FLAGS: readonly string[] = ['--help', '-h'];

/** Flags parsed for one command. Look-ups by long name without dashes. */
export class ParsedArgs {
  constructor(
    private readonly quantities: ReadonlyMap<string, QuantityArg>,
    private readonly texts: ReadonlyMap<string, string>,
    private readonly booleans: ReadonlySet<string>,
  ) {}

  /** The quantity given for `name`, or undefined if the flag was absent. */
  quantity(name: string): QuantityArg | undefined {
    return this.quantities.get(name);
  }

  /** The text given for `name`, or undefined if the flag was absent. */
  text(name: string): string | undefined {
    return this.texts.get(name);
  }

  /** Whether the boolean flag `name` was given. */
  flag(name: string): boolean {
    return this.booleans.has(name);
  }

  /** Whether `name` was given at all, of any kind. */
  has(name: string): boolean {
    return this.quantities.has(name) || this.texts.has(name) || this.booleans.has(name);
  }
}

/** "units K, mK (bare number = K); valid range 0.3–4.24 K": what a quantity flag accepts. */
export function describeAccepted(spec: QuantityFlag): string {
  const base = BASE_UNIT[spec.dimension];
  const note = spec.rangeNote ? ` (${spec.rangeNote})` : '';
  return `units ${unitsOf(spec.dimension).join(', ')} (bare number = ${base}); valid range ${formatRange(spec.range, base)}${note}`;
}

/** "--temperature <T>" or "--json": a flag as shown in usage text. */
export function flagSynopsis(spec: FlagSpec): string {
  return spec.kind === 'boolean' ? `--${spec.name}` : `--${spec.name} <${spec.placeholder}>`;
}

/**
 * Reads the tokens after the command name against the command's flags.
 * Accepts `--flag value` and `--flag=value`; a value may start with a single dash ("-1K").
 * Throws UsageError for an unknown flag, a missing or unwanted value, a repeated flag, a stray
 * argument, or a quantity that does not parse. Ranges are left to the kernel.
 */
export function parseFlags(command: string, tokens: readonly string[], specs: readonly FlagSpec[]): ParsedArgs {
  const quantities = new Map<string, QuantityArg>();
  const texts = new Map<string, string>();
  const booleans = new Set<string>();
  const seen = new Set<string>();
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i] ?? '';
    if (!token.startsWith('-')) throw strayArgument(command, token, specs);
    const { name, inline } = splitFlag(token);
    const spec = token.startsWith('--') ? specs.find((s) => s.name === name) : undefined;
    if (!spec) throw unknownFlag(command, token, specs);
    if (seen.has(name)) throw new UsageError(`--${name} is given more than once`);
    seen.add(name);
    if (spec.kind === 'boolean') {
      if (inline !== undefined) throw new UsageError(`--${name} takes no value (got "${token}")`);
      booleans.add(name);
      continue;
    }
    let value = inline;
    if (value === undefined) {
      const next = tokens[i + 1];
      if (next !== undefined && !next.startsWith('--')) {
        value = next;
        i++;
      }
    }
    if (value === undefined || value.trim() === '') throw missingValue(spec);
    if (spec.kind === 'text') texts.set(name, value);
    else quantities.set(name, { spec, text: value, value: readQuantity(spec, value) });
  }
  return new ParsedArgs(quantities, texts, booleans);
}

function splitFlag(token: string): { name: string; inline: string | undefined } {
  const eq = token.indexOf('=');
  return eq < 0 ? { name: token.slice(2), inline: undefined } : { name: token.slice(2, eq), inline: token.slice(eq + 1) };
}

function readQuantity(spec: QuantityFlag, text: string): number {
  try {
    return parseQuantity(text, spec.dimension);
  } catch (error) {
    if (!(error instanceof QuantityParseError)) throw error;
    const base = BASE_UNIT[spec.dimension];
    const note = spec.rangeNote ? ` (${spec.rangeNote})` : '';
    throw new UsageError(
      `--${spec.name} ${error.detail}; accepted units: ${error.acceptedUnits.join(', ')}; ` +
        `valid range ${formatRange(spec.range, base)}${note}`,
    );
  }
}

function flagList(specs: readonly FlagSpec[]): string {
  return [...specs.map((s) => `--${s.name}`), '--help'].join(', ');
}

function unknownFlag(command: string, token: string, specs: readonly FlagSpec[]): UsageError {
  const flag = token.split('=')[0] ?? token;
  return new UsageError(`unknown flag ${flag} for "sekundo ${command}"; its flags: ${flagList(specs)}`);
}

function strayArgument(command: string, token: string, specs: readonly FlagSpec[]): UsageError {
  const quantities = specs.filter((s): s is QuantityFlag => s.kind === 'quantity');
  const unitOf = quantities.find((s) => (unitsOf(s.dimension) as readonly string[]).includes(token));
  if (unitOf) {
    return new UsageError(
      `unexpected argument "${token}" for "sekundo ${command}"; write the unit next to the number or quote both, e.g. --${unitOf.name} ${exampleOf(unitOf.dimension)}`,
    );
  }
  const quantity = quantities[0];
  const hint = quantity ? `; values follow their flag, e.g. --${quantity.name} ${exampleOf(quantity.dimension)}` : '';
  return new UsageError(`unexpected argument "${token}" for "sekundo ${command}"${hint}`);
}

function missingValue(spec: QuantityFlag | TextFlag): UsageError {
  if (spec.kind === 'text') return new UsageError(`--${spec.name} needs a value <${spec.placeholder}>`);
  return new UsageError(
    `--${spec.name} needs a value, e.g. --${spec.name} ${exampleOf(spec.dimension)}; ${describeAccepted(spec)}`,
  );
}

/**
 * The quantity given for a required flag. Throws UsageError naming the flag, an example, the
 * accepted units and the valid range when it is absent.
 */
export function requireQuantity(command: string, args: ParsedArgs, spec: QuantityFlag): QuantityArg {
  const arg = args.quantity(spec.name);
  if (!arg) {
    throw new UsageError(
      `"sekundo ${command}" needs --${spec.name}, e.g. --${spec.name} ${exampleOf(spec.dimension)}; ${describeAccepted(spec)}`,
    );
  }
  return arg;
}
