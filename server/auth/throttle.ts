// Throttling of sign-in, password reset and invitation links, counted in the database
// (rate-limiter-flexible's MySQL store, table rate_limits), so every server process sharing the
// database shares the counts.
//
// Two counters per attempt, each over a 15-minute window:
// - per account and address: one person's wrong passwords from one computer (LOGIN_RATE_LIMIT);
// - per address: everything from one computer (LOGIN_RATE_LIMIT_PER_ADDRESS), much higher, so a
//   shared counter computer is never locked out by one person's typos or a broken client.
// An attempt refused by the account counter does not count against the address, and a malformed
// body counts only against the address. The account is the text the visitor typed (hashed), known
// or not, so the counting never tells whether an account exists.
import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';
import type { z } from 'zod';
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import { ERROR_CODES } from '../../shared/errors';
import type { Db } from '../db';
import { AppError, ValidationError } from '../errors';
import { validate } from '../middleware/validate';
import { withDeadlockRetry } from '../services/deadlock-retry';

export const THROTTLE_TABLE = 'rate_limits';
export const THROTTLE_WINDOW_S = 15 * 60;

export interface ThrottleLimits {
  perAccount: number;
  perAddress: number;
}

export class TooManyAttemptsError extends AppError {
  constructor(
    message: string,
    readonly retryAfterS: number,
  ) {
    super(429, ERROR_CODES.rateLimited, message);
  }
}

/** Keys hold no e-mail address or token in clear: a SHA-256 prefix is enough to tell them apart. */
const digest = (value: string) => createHash('sha256').update(value).digest('hex').slice(0, 32);

export class Throttle {
  private readonly account: RateLimiterMySQL;
  private readonly address: RateLimiterMySQL;

  constructor(
    db: Db,
    database: string,
    readonly name: string,
    limits: ThrottleLimits,
    private readonly message: string,
  ) {
    const common = {
      storeClient: db,
      storeType: 'knex',
      dbName: database,
      tableName: THROTTLE_TABLE,
      tableCreated: true,
      clearExpiredByTimeout: false,
      duration: THROTTLE_WINDOW_S,
    };
    this.account = new RateLimiterMySQL({ ...common, keyPrefix: `${name}:acct`, points: limits.perAccount });
    this.address = new RateLimiterMySQL({ ...common, keyPrefix: `${name}:addr`, points: limits.perAddress });
  }

  private accountKey(address: string, account: string) {
    return `${digest(account.trim().toLowerCase())}:${address}`;
  }

  /**
   * Counts one attempt from `address` (on `account`, when the body named one); a 429 with
   * Retry-After when the account's or the address's count is used up.
   */
  async attempt(address: string, account: string | null, res?: Response): Promise<void> {
    try {
      if (account !== null) await this.consume(this.account, this.accountKey(address, account));
      try {
        await this.consume(this.address, address);
      } catch (error) {
        // Refused by the address ceiling: not an attempt on the account.
        if (account !== null) await this.account.reward(this.accountKey(address, account)).catch(() => undefined);
        throw error;
      }
    } catch (error) {
      if (error instanceof TooManyAttemptsError) res?.set('Retry-After', String(error.retryAfterS));
      throw error;
    }
  }

  /** Parses a body; a malformed one is a 400 that counts against the address only (or a 429). */
  async parse<S extends z.ZodType>(req: Request, res: Response, schema: S, value: unknown, what: string): Promise<z.output<S>> {
    try {
      return validate(schema, value, what);
    } catch (error) {
      if (error instanceof ValidationError) await this.attempt(addressOf(req), null, res);
      throw error;
    }
  }

  /** A success: the account's count starts over and the attempt is given back to the address. */
  async succeeded(address: string, account: string): Promise<void> {
    await withDeadlockRetry(() => this.account.delete(this.accountKey(address, account)));
    await withDeadlockRetry(() => this.address.reward(address));
  }

  private async consume(limiter: RateLimiterMySQL, key: string): Promise<void> {
    try {
      // The store counts in a transaction on one row per key; on a Galera cluster two processes
      // counting the same key on different nodes conflict (1213) and the loser counts again.
      await withDeadlockRetry(() => limiter.consume(key));
    } catch (error) {
      // The library rejects with its result when the count is used up, with the error otherwise.
      if (error instanceof RateLimiterRes) throw new TooManyAttemptsError(this.message, Math.max(1, Math.ceil(error.msBeforeNext / 1000)));
      throw error;
    }
  }
}

/** The visitor's address as Express sees it (behind a proxy only with TRUST_PROXY). */
export function addressOf(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}

/** The three throttles of one app, sharing the limits from the configuration. */
export function createThrottles(db: Db, config: { db: { database: string }; loginRateLimit: number; loginRateLimitPerAddress: number }) {
  const limits = { perAccount: config.loginRateLimit, perAddress: config.loginRateLimitPerAddress };
  const make = (name: string, message: string) => new Throttle(db, config.db.database, name, limits, message);
  return {
    signIn: make('sign-in', 'Too many failed sign-ins. Wait 15 minutes and try again.'),
    passwordReset: make('password-reset', 'Too many password-reset attempts. Wait 15 minutes and try again.'),
    invitation: make('invitation', 'Too many attempts. Wait 15 minutes and try again.'),
  };
}
export type Throttles = ReturnType<typeof createThrottles>;
