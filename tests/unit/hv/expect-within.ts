import { HvInputError } from '../../../shared/hv';

/** Asserts |actual − expected| ≤ relTol·|expected| (±0.5 % by default, the brief's tolerance). */
export function expectWithin(actual: number | null | undefined, expected: number, relTol = 0.005): void {
  if (typeof actual !== 'number' || !Number.isFinite(actual)) {
    throw new Error(`expected a finite number within ${relTol * 100} % of ${expected}, got ${String(actual)}`);
  }
  const allowed = Math.abs(expected) * relTol;
  if (Math.abs(actual - expected) > allowed) {
    throw new Error(`expected ${actual} to be within ${relTol * 100} % of ${expected} (off by ${(((actual - expected) / expected) * 100).toFixed(3)} %)`);
  }
}

/** Walks a result and fails on any NaN or ±Infinity: results must be JSON-safe. */
export function expectAllFinite(value: unknown, path = 'result'): void {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`${path} is ${value}`);
  } else if (Array.isArray(value)) {
    value.forEach((item, i) => expectAllFinite(item, `${path}[${i}]`));
  } else if (value !== null && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) expectAllFinite(item, `${path}.${key}`);
  }
}

/** Runs `fn` and returns the HvInputError it throws, failing if it throws anything else or nothing. */
export function catchHvInputError(fn: () => unknown): HvInputError {
  try {
    fn();
  } catch (error) {
    if (error instanceof HvInputError) return error;
    throw new Error(`expected an HvInputError, got ${String(error)}`, { cause: error });
  }
  throw new Error('expected an HvInputError, but the call returned normally');
}
