import { HvInputError } from './errors';

// Internal guards shared by the calculations. Each returns the value so call sites stay short.

export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new HvInputError(field, `${field} must be a finite number`);
  }
  return value;
}

export function requireNonNegative(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n < 0) throw new HvInputError(field, `${field} must not be negative`);
  return n;
}

/** For values that a formula divides by or takes the logarithm of. */
export function requirePositive(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n <= 0) throw new HvInputError(field, `${field} must be greater than zero`);
  return n;
}

export function requireInteger(value: unknown, field: string, min: number): number {
  const n = requireFinite(value, field);
  if (!Number.isInteger(n) || n < min) {
    throw new HvInputError(field, `${field} must be a whole number of at least ${min}`);
  }
  return n;
}

/**
 * Finite inputs can still overflow (1e200 F at 1e200 V). Refuse rather than hand back Infinity,
 * blaming the input that set the scale.
 */
export function requireFiniteResult(value: number, field: string): number {
  if (!Number.isFinite(value)) {
    throw new HvInputError(field, `${field} is too large: the result is out of range`);
  }
  return value;
}

export function requireOneOf<T extends string>(value: unknown, allowed: readonly T[], field: string): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw new HvInputError(field, `${field} must be one of: ${allowed.join(', ')}`);
  }
  return value as T;
}
