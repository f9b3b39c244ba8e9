/**
 * Calls into the physics kernel on behalf of a flag, so a range error names the flag the user typed.
 */
import { InvalidInputError, NonFiniteInputError, OutOfRangeError, PhysicsError } from '../physics';
import type { NumberArg, QuantityArg } from './args';
import { UsageError } from './errors';
import { formatPlain, formatRange } from './format';

/** A flag as given, with its value in SI: a quantity or a plain number. */
export type FlagArg = QuantityArg | NumberArg;

/**
 * Runs `compute` on the flag's SI value. The kernel's OutOfRangeError and NonFiniteInputError
 * become a UsageError such as "--temperature 5 K is outside the valid range 0.3–4.24 K",
 * quoting the kernel's own range; an InvalidInputError becomes "--flag <typed>: <kernel message>".
 * Any other error passes through.
 */
export function computeFor<T>(arg: FlagArg, compute: (value: number) => T): T {
  try {
    return compute(arg.value);
  } catch (error) {
    if (error instanceof OutOfRangeError) {
      const range = formatRange([error.min, error.max], error.unit).trimEnd();
      const note = arg.spec.kind === 'quantity' ? arg.spec.rangeNote : undefined;
      const detail = [error.detail, note].filter(Boolean).join('; ');
      throw new UsageError(
        `--${arg.spec.name} ${echoInput(arg, error.unit)} is outside the valid range ${range}${detail ? ` (${detail})` : ''}`,
      );
    }
    if (error instanceof NonFiniteInputError) {
      const range = formatRange([error.min, error.max], error.unit).trimEnd();
      throw new UsageError(`--${arg.spec.name} must be a finite number in ${range}, got "${arg.text}"`);
    }
    if (error instanceof InvalidInputError) {
      throw new UsageError(`--${arg.spec.name} ${arg.text.trim()}: ${error.message}`);
    }
    throw error;
  }
}

/**
 * Runs a kernel call whose inputs have been checked flag by flag; any kernel error left (a
 * combination the flags cannot show) becomes a UsageError with the kernel's own message.
 */
export function kernelCall<T>(compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof PhysicsError) throw new UsageError(error.message);
    throw error;
  }
}

/** "5 K" when the user typed 5 K, else "5000mK (= 5 K)": the input and what the kernel saw. */
function echoInput(arg: FlagArg, unit: string): string {
  const canonical = `${formatPlain(arg.value)}${unit ? ` ${unit}` : ''}`;
  const typed = arg.text.trim();
  const compact = (s: string): string => s.replace(/\s+/g, '');
  if (typed === formatPlain(arg.value) || compact(typed) === compact(canonical)) return canonical;
  return `${typed} (= ${canonical})`;
}
