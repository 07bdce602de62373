// connect-session-knex 5, made safe for a lab server:
// - its methods both call back with an error AND reject a promise nobody awaits; on Node 20 that
//   unhandled rejection kills the process while the database is down. Here every error reaches
//   express-session exactly once, through the callback, and the promise is settled.
// - express-session touches the store on every request; we only write when the expiry would move
//   by more than TOUCH_STEP_MS, which keeps signed-in reads at one statement for the session.
// - that one statement is skipped while this process holds a fresh copy of the row
//   (./session-cache.ts says why that is safe).
// - an unreachable database is reported as a 503 error, never as "no such session": express-session
//   treats an error whose code is ENOENT (what a Unix-socket connect fails with while MariaDB is
//   down) as a missing session, and would then hand out a new, empty session with a new cookie
//   that replaces the person's valid one in the browser.
// - expired rows are purged by the scheduler (server/jobs/purge.ts), not by a timer per store.
import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { SessionData } from 'express-session';
import { isDatabaseUnavailable, type Db } from '../db';
import { UnavailableError } from '../errors';
import { withDeadlockRetry } from '../services/deadlock-retry';
import { sessionCacheOf, type SessionCache } from './session-cache';

/** What the store hands express-session instead of a raw database error. */
export function storeError(error: unknown): unknown {
  if (isDatabaseUnavailable(error)) return new UnavailableError();
  // Any other error with ENOENT would also be read as "no session": keep it an error.
  if ((error as { code?: unknown } | null)?.code === 'ENOENT') return new UnavailableError();
  return error;
}

type Callback<T = void> = (error?: unknown, value?: T) => void;

const TOUCH_STEP_MS = 5 * 60_000;

export class SessionStore extends ConnectSessionKnexStore {
  private readonly cache: SessionCache;

  constructor(
    private readonly db: Db,
    cacheMs?: number,
  ) {
    super({ knex: db, tableName: 'sessions', createTable: false, cleanupInterval: 0, onDbCleanupError: () => {} });
    // The base class rejects `ready` when the table check fails (database down at boot).
    (this as unknown as { ready: Promise<void> }).ready.catch(() => {});
    this.cache = sessionCacheOf(db, cacheMs);
  }

  /** Reads the row's expiry too, so `touch` can tell whether a write is worth it. */
  override async get(sid: string, callback: Callback<SessionData | null>): Promise<SessionData | null> {
    try {
      const row = this.cache.read(sid) ?? (await this.readRow(sid));
      if (!row) {
        callback(null, null);
        return null;
      }
      const session = JSON.parse(row.json) as SessionData & { loadedExpiresMs?: number };
      session.loadedExpiresMs = row.expiresMs;
      callback(null, session);
      return session;
    } catch (error) {
      callback(storeError(error));
      return null;
    }
  }

  private async readRow(sid: string): Promise<{ json: string; expiresMs: number } | null> {
    const startedAt = this.cache.begin();
    // Raw SQL: the query builder's work showed up in the bench profile next to the query itself.
    const [rows] = (await this.db.raw('SELECT sess, expired FROM sessions WHERE sid = ? AND expired > ? LIMIT 1', [sid, new Date()])) as [
      { sess: unknown; expired: Date }[],
    ];
    const row = rows[0];
    if (!row) return null;
    const json = typeof row.sess === 'string' ? row.sess : JSON.stringify(row.sess);
    const expiresMs = new Date(row.expired).getTime();
    this.cache.keep(sid, json, expiresMs, startedAt);
    return { json, expiresMs };
  }

  override set(sid: string, session: SessionData, callback?: Callback): Promise<void> {
    this.cache.forget(sid);
    // Two requests of one session on two cluster nodes may write its row at once (1213): again.
    return withDeadlockRetry(() => super.set(sid, session))
      .then(() => callback?.())
      .catch((error: unknown) => callback?.(storeError(error)));
  }

  override destroy(sid: string, callback?: Callback): Promise<number> {
    this.cache.forget(sid);
    return withDeadlockRetry(() => super.destroy(sid))
      .then((count) => {
        callback?.();
        return count;
      })
      .catch((error: unknown) => {
        callback?.(storeError(error));
        return 0;
      });
  }

  override touch(sid: string, session: SessionData, callback?: Callback): Promise<void> {
    const cookie = session.cookie as { expires?: Date | string | null };
    const loaded = (session as { loadedExpiresMs?: number }).loadedExpiresMs;
    const next = cookie.expires ? new Date(cookie.expires).getTime() : 0;
    if (loaded && next - loaded < TOUCH_STEP_MS) {
      callback?.();
      return Promise.resolve();
    }
    this.cache.forget(sid);
    return withDeadlockRetry(() => super.touch(sid, session))
      .then(() => callback?.())
      .catch((error: unknown) => callback?.(storeError(error)));
  }
}
