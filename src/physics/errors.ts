/**
 * Errors raised by the property kernel. Every error names the quantity, the value received and the
 * valid range, so a caller (UI field, CLI flag) can pass the message straight to the user.
 */

/** Base class for every error the kernel throws on purpose. */
export class PhysicsError extends Error {
  override name = 'PhysicsError';
}

/** A finite input outside the range where the model is defined. */
export class OutOfRangeError extends PhysicsError {
  override name = 'OutOfRangeError';
  constructor(
    readonly quantity: string,
    readonly value: number,
    readonly min: number,
    readonly max: number,
    readonly unit: string,
    readonly detail = '',
  ) {
    super(
      `${quantity} ${formatPlain(value)} ${unit} is outside the valid range ` +
        `${formatPlain(min)}–${formatPlain(max)} ${unit}${detail ? ` (${detail})` : ''}`,
    );
  }
}

/** NaN or ±Infinity given where a number is needed. */
export class NonFiniteInputError extends PhysicsError {
  override name = 'NonFiniteInputError';
  constructor(
    readonly quantity: string,
    readonly value: number,
    readonly min: number,
    readonly max: number,
    readonly unit: string,
  ) {
    super(
      `${quantity} must be a finite number in ${formatPlain(min)}–${formatPlain(max)} ${unit}, got ${String(value)}`,
    );
  }
}

/** An input that is not a number out of range but wrong in kind: an unknown option, a bad list. */
export class InvalidInputError extends PhysicsError {
  override name = 'InvalidInputError';
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(`${field}: ${message}`);
  }
}

/** A solver that did not converge within its iteration cap. */
export class ConvergenceError extends PhysicsError {
  override name = 'ConvergenceError';
}

/** Throws a typed error unless `min ≤ value ≤ max`. Returns the value for chaining. */
export function requireInRange(
  quantity: string,
  value: number,
  min: number,
  max: number,
  unit: string,
  detail?: string,
): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new NonFiniteInputError(quantity, value, min, max, unit);
  }
  if (value < min || value > max) throw new OutOfRangeError(quantity, value, min, max, unit, detail);
  return value;
}

function formatPlain(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  return Number(x.toPrecision(6)).toString();
}
