/**
 * Flags of one command: their specs, and a strict parser for `--flag value` / `--flag=value`.
 * Quantity flags are read into SI numbers here; every mistake becomes a one-line {@link UsageError}.
 */
import { BASE_UNIT, type Dimension, exampleOf, parseQuantity, QuantityParseError, unitsOf } from '../io/quantity';
import { UsageError } from './errors';
import { formatPlain, formatRange } from './format';

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

/** A flag whose value is a plain number without units (a count, a coefficient), checked here. */
export interface NumberFlag extends FlagBase {
  readonly kind: 'number';
  readonly placeholder: string;
  /** Valid range, quoted in help and errors. */
  readonly range: readonly [number, number];
  /** Only whole numbers. */
  readonly integer?: boolean;
}

/** Any flag a command can declare. */
export type FlagSpec = QuantityFlag | BooleanFlag | TextFlag | NumberFlag;

/** A positional argument, e.g. the plan file of `sekundo plan FILE`. */
export interface OperandSpec {
  /** Name used to look it up, e.g. "file". */
  readonly name: string;
  /** Placeholder in usage text, e.g. "FILE". */
  readonly placeholder: string;
  /** One line for the help text. */
  readonly help: string;
}

/** A quantity flag as given: the spec, the text typed and its value in the SI base unit. */
export interface QuantityArg {
  readonly spec: QuantityFlag;
  readonly text: string;
  readonly value: number;
}

/** A number flag as given: the spec, the text typed and its value. */
export interface NumberArg {
  readonly spec: NumberFlag;
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
    private readonly numbers: ReadonlyMap<string, NumberArg> = new Map(),
    private readonly operands: ReadonlyMap<string, string> = new Map(),
  ) {}

  /** The quantity given for `name`, or undefined if the flag was absent. */
  quantity(name: string): QuantityArg | undefined {
    return this.quantities.get(name);
  }

  /** The plain number given for `name`, or undefined if the flag was absent. */
  number(name: string): NumberArg | undefined {
    return this.numbers.get(name);
  }

  /** The positional argument `name`, or undefined if it was not given. */
  operand(name: string): string | undefined {
    return this.operands.get(name);
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
    return this.quantities.has(name) || this.texts.has(name) || this.booleans.has(name) || this.numbers.has(name) || this.operands.has(name);
  }
}

/** "units K, mK (bare number = K); valid range 0.3–4.24 K": what a quantity flag accepts. */
export function describeAccepted(spec: QuantityFlag): string {
  const base = BASE_UNIT[spec.dimension];
  const note = spec.rangeNote ? ` (${spec.rangeNote})` : '';
  return `units ${unitsOf(spec.dimension).join(', ')} (bare number = ${base}); valid range ${formatRange(spec.range, base)}${note}`;
}

/** "a whole number; valid range 0–12": what a number flag accepts. */
export function describeNumber(spec: NumberFlag): string {
  return `${spec.integer ? 'a whole number' : 'a number'}; valid range ${formatNumberRange(spec.range)}`;
}

/** "0–12", "-1 to 1": a unitless range. */
export function formatNumberRange(range: readonly [number, number]): string {
  return range[0] < 0 ? `${formatPlain(range[0])} to ${formatPlain(range[1])}` : `${formatPlain(range[0])}–${formatPlain(range[1])}`;
}

/** "--temperature <T>" or "--json": a flag as shown in usage text. */
export function flagSynopsis(spec: FlagSpec): string {
  return spec.kind === 'boolean' ? `--${spec.name}` : `--${spec.name} <${spec.placeholder}>`;
}

/**
 * Reads the tokens after the command name against the command's flags and positional operands.
 * Accepts `--flag value` and `--flag=value`; a value may start with a single dash ("-1K"). Tokens
 * that are not flags or flag values fill the operands in order.
 * Throws UsageError for an unknown flag, a missing or unwanted value, a repeated flag, a stray
 * argument, a quantity that does not parse, or a number flag out of its range. Ranges of
 * quantities are left to the kernel.
 */
export function parseFlags(
  command: string,
  tokens: readonly string[],
  specs: readonly FlagSpec[],
  operandSpecs: readonly OperandSpec[] = [],
): ParsedArgs {
  const quantities = new Map<string, QuantityArg>();
  const texts = new Map<string, string>();
  const booleans = new Set<string>();
  const numbers = new Map<string, NumberArg>();
  const operands = new Map<string, string>();
  const seen = new Set<string>();
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i] ?? '';
    // "-" alone is an operand: standard input.
    if (!token.startsWith('-') || token === '-') {
      const operand = operandSpecs[operands.size];
      if (!operand) throw strayArgument(command, token, specs);
      operands.set(operand.name, token);
      continue;
    }
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
    else if (spec.kind === 'number') numbers.set(name, { spec, text: value, value: readNumber(spec, value) });
    else quantities.set(name, { spec, text: value, value: readQuantity(spec, value) });
  }
  return new ParsedArgs(quantities, texts, booleans, numbers, operands);
}

// A decimal number without a unit.
const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

function readNumber(spec: NumberFlag, text: string): number {
  const trimmed = text.trim();
  const value = PLAIN_NUMBER.test(trimmed) ? Number(trimmed) : Number.NaN;
  const range = formatNumberRange(spec.range);
  if (!Number.isFinite(value)) throw new UsageError(`--${spec.name} "${text}" is not a ${spec.integer ? 'whole ' : ''}number; valid range ${range}`);
  const [min, max] = spec.range;
  if (value < min || value > max) throw new UsageError(`--${spec.name} ${formatPlain(value)} is outside the valid range ${range}`);
  if (spec.integer && !Number.isInteger(value)) throw new UsageError(`--${spec.name} ${formatPlain(value)} is not a whole number; valid range ${range}`);
  return value;
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

function missingValue(spec: QuantityFlag | TextFlag | NumberFlag): UsageError {
  if (spec.kind === 'text') return new UsageError(`--${spec.name} needs a value <${spec.placeholder}>`);
  if (spec.kind === 'number') return new UsageError(`--${spec.name} needs a value <${spec.placeholder}>, ${describeNumber(spec)}`);
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
