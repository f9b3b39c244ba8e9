/**
 * Calls into the physics kernel on behalf of a flag, so a range error names the flag the user typed.
 */
import { NonFiniteInputError, OutOfRangeError } from '../physics';
import type { QuantityArg } from './args';
import { UsageError } from './errors';
import { formatPlain, formatRange } from './format';

/**
 * Runs `compute` on the flag's SI value. The kernel's OutOfRangeError and NonFiniteInputError
 * become a UsageError such as "--temperature 5 K is outside the valid range 0.3–4.24 K",
 * quoting the kernel's own range; any other error passes through.
 */
export function computeFor<T>(arg: QuantityArg, compute: (value: number) => T): T {
  try {
    return compute(arg.value);
  } catch (error) {
    if (error instanceof OutOfRangeError) {
      const range = formatRange([error.min, error.max], error.unit);
      const detail = [error.detail, arg.spec.rangeNote].filter(Boolean).join('; ');
      throw new UsageError(
        `--${arg.spec.name} ${echoInput(arg, error.unit)} is outside the valid range ${range}${detail ? ` (${detail})` : ''}`,
      );
    }
    if (error instanceof NonFiniteInputError) {
      const range = formatRange([error.min, error.max], error.unit);
      throw new UsageError(`--${arg.spec.name} must be a finite number in ${range}, got "${arg.text}"`);
    }
    throw error;
  }
}

/** "5 K" when the user typed 5 K, else "5000mK (= 5 K)": the input and what the kernel saw. */
function echoInput(arg: QuantityArg, unit: string): string {
  const canonical = `${formatPlain(arg.value)} ${unit}`;
  const typed = arg.text.trim();
  const compact = (s: string): string => s.replace(/\s+/g, '');
  if (typed === formatPlain(arg.value) || compact(typed) === compact(canonical)) return canonical;
  return `${typed} (= ${canonical})`;
}
