// Runs a whole transaction again when MariaDB chose it as a deadlock victim (1213) or gave up
// waiting for a lock (1205). InnoDB rolls the victim back entirely, so running the body again is
// the documented remedy (MariaDB KB "Deadlocks": "the application should retry the transaction").
// Bounded attempts with full-jitter exponential back-off (common practice, no single source), so
// two clients that collided do not collide again in lock-step.
//
// On a Galera cluster (`npm run cluster`) the same 1213 also reports a certification failure: a
// transaction on another node committed first and wrote a row this one wrote (every gate
// transaction writes the rows it locks: the items' hold_version and the audit head), or it
// brute-force aborted this one while applying. Galera documents the remedy as the same retry
// (MariaDB KB "MariaDB Galera Cluster - Known Limitations"). A transaction whose connection died
// before its COMMIT was sent (`NotCommittedError`, the node was killed) is also run again, on
// another connection, so a node's loss costs the request time, not an error.
import { ERROR_CODES } from '../../shared/errors';
import { isRetryableLockError } from '../db';
import { AppError } from '../errors';

/** The transaction's connection failed before COMMIT was sent: nothing of it was written. */
export class NotCommittedError extends Error {
  constructor(override readonly cause: unknown) {
    super('the database connection failed before the transaction committed');
  }
}

/** Retries and exhausted runs in this process, for the bench (`GET /api/health` reports them). */
export const retryCounters = { retries: 0, exhausted: 0, outages: 0 };

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

export const DEFAULT_ATTEMPTS = 8;
const DEFAULT_BASE_DELAY_MS = 10;
const OUTAGE_BASE_DELAY_MS = 100;
/** A connection lost mid-transaction is tried on another one at most twice more. */
const OUTAGE_ATTEMPTS = 3;
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
      const outage = error instanceof NotCommittedError;
      if (!outage && !isRetryableLockError(error)) throw error;
      if (attempt >= (outage ? Math.min(attempts, OUTAGE_ATTEMPTS) : attempts)) {
        retryCounters.exhausted += 1;
        // An outage that outlasted the retries is still an outage: the original error, a 503.
        if (outage) throw error.cause;
        throw new AppError(503, ERROR_CODES.unavailable, 'The database is busy with the same records. Try again in a moment.');
      }
      retryCounters.retries += 1;
      if (outage) retryCounters.outages += 1;
      options.onRetry?.(attempt, error);
      // A lost node takes the proxy about a second to mark down: outages wait longer.
      const base = outage ? OUTAGE_BASE_DELAY_MS : options.baseDelayMs;
      await new Promise((resolve) => setTimeout(resolve, backoffDelayMs(attempt, base, options.random)));
    }
  }
}
