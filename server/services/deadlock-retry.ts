// Runs a whole transaction again when MariaDB chose it as a deadlock victim (1213) or gave up
// waiting for a lock (1205). InnoDB rolls the victim back entirely, so running the body again is
// the documented remedy (MariaDB KB "Deadlocks": "the application should retry the transaction").
// Bounded attempts with full-jitter exponential back-off (common practice, no single source), so
// two clients that collided do not collide again in lock-step.
import { ERROR_CODES } from '../../shared/errors';
import { isRetryableLockError } from '../db';
import { AppError } from '../errors';

export interface RetryOptions {
  /** Tries in all, the first included. */
  attempts?: number;
  /** The first back-off's ceiling; doubled each retry. */
  baseDelayMs?: number;
  /** Replaced in tests to make the jitter predictable. */
  random?: () => number;
  /** Told of each retry (logging, tests). */
  onRetry?: (attempt: number, error: unknown) => void;
}

export const DEFAULT_ATTEMPTS = 6;
const DEFAULT_BASE_DELAY_MS = 10;
const MAX_DELAY_MS = 320;

/** Full jitter: a uniform wait in [0, min(cap, base·2^(retry−1))]. */
export function backoffDelayMs(retry: number, baseDelayMs = DEFAULT_BASE_DELAY_MS, random: () => number = Math.random): number {
  return Math.floor(random() * Math.min(MAX_DELAY_MS, baseDelayMs * 2 ** (retry - 1)));
}

/**
 * Calls `run` until it settles without a deadlock or lock-wait timeout, at most `attempts` times.
 * `run` must start its own transaction each time (it is the whole transaction, never a part).
 * When every attempt lost, the answer is a 503 (busy, try again), never a 500.
 */
export async function withDeadlockRetry<T>(run: () => Promise<T>, options: RetryOptions = {}): Promise<T> {
  const attempts = options.attempts ?? DEFAULT_ATTEMPTS;
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await run();
    } catch (error) {
      if (!isRetryableLockError(error)) throw error;
      if (attempt >= attempts) throw new AppError(503, ERROR_CODES.unavailable, 'The database is busy with the same records. Try again in a moment.');
      options.onRetry?.(attempt, error);
      await new Promise((resolve) => setTimeout(resolve, backoffDelayMs(attempt, options.baseDelayMs, options.random)));
    }
  }
}
