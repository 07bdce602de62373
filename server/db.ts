// The one Knex instance per process. MariaDB through mysql2, UTC everywhere.
import knex, { type Knex } from 'knex';
import path from 'node:path';
import type { Config } from './config';

export type Db = Knex;
export type Trx = Knex.Transaction;

export const MIGRATIONS_DIR = path.resolve(__dirname, '..', 'migrations');
export const SEEDS_DIR = path.resolve(__dirname, '..', 'seeds');

export function createDb(config: Pick<Config, 'db'>): Db {
  return knex({
    client: 'mysql2',
    connection: {
      // A Unix socket skips the loopback TCP stack: each query's write costs a fraction of the
      // CPU (the bench profile spent a third of a list request's time in loopback socket writes).
      ...(config.db.socketPath ? { socketPath: config.db.socketPath } : { host: config.db.host, port: config.db.port }),
      user: config.db.user,
      password: config.db.password,
      database: config.db.database,
      timezone: 'Z',
      charset: 'utf8mb4',
      decimalNumbers: true,
      // Calendar dates (due dates) stay 'YYYY-MM-DD' text; no time-zone shifting.
      // (knex's connection type is narrower than what mysql2 accepts.)
      dateStrings: ['DATE'] as unknown as boolean,
      connectTimeout: 2000,
      // BOOLEAN columns are TINYINT(1) in MariaDB; hand them to the code as booleans.
      typeCast(field: { type: string; length: number; string(): string | null }, next: () => unknown) {
        if (field.type === 'TINY' && field.length === 1) {
          const value = field.string();
          return value === null ? null : value === '1';
        }
        return next();
      },
    },
    pool: {
      min: 0,
      max: config.db.poolMax,
      // READ COMMITTED on every connection: a statement sees every transaction committed before
      // it. The gate's checks lock the rows they depend on first (booking, then items in id
      // order; server/services/booking-holds.ts) and then read; at MariaDB's default REPEATABLE
      // READ a plain read earlier in the transaction would pin an older snapshot and the check
      // would miss a booking committed while it waited for the lock.
      afterCreate(connection: { query(sql: string, done: (error: Error | null) => void): void }, done: (error: Error | null, connection: unknown) => void) {
        connection.query('SET SESSION TRANSACTION ISOLATION LEVEL READ COMMITTED', (error) => done(error, connection));
      },
    },
    // Fail fast while the database is down, so requests get a 503 instead of hanging.
    acquireConnectionTimeout: 2000,
    // Knex prints pool errors with console.log; they also reject the query, which the error
    // handler logs once as a 503, so the console copy is only noise during an outage.
    log: { warn() {}, error() {}, deprecate() {}, debug() {} },
    migrations: { directory: MIGRATIONS_DIR, extension: 'ts', loadExtensions: ['.ts'], tableName: 'knex_migrations' },
    seeds: { directory: SEEDS_DIR, loadExtensions: ['.ts'] },
  });
}

const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  // A Unix socket whose server is gone: the file may be missing while MariaDB restarts.
  'ENOENT',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'ER_QUERY_INTERRUPTED',
]);

/** True when an error means the database itself could not be reached (not a bad query). */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (typeof error !== 'object' || error === null) return false;
  const { code, name, fatal, message } = error as { code?: string; name?: string; fatal?: boolean; message?: unknown };
  if (name === 'KnexTimeoutError') return true;
  if (fatal === true) return true;
  if (UNAVAILABLE_CODES.has(code ?? '')) return true;
  // mysql2 refuses a query on a connection that died under it with a plain Error (no code).
  return typeof message === 'string' && /connection is in closed state|Connection lost/i.test(message);
}

/** MariaDB's deadlock (1213) and lock-wait timeout (1205): the transaction can simply run again. */
export function isRetryableLockError(error: unknown): boolean {
  const { code, errno } = (error ?? {}) as { code?: string; errno?: number };
  return code === 'ER_LOCK_DEADLOCK' || code === 'ER_LOCK_WAIT_TIMEOUT' || errno === 1213 || errno === 1205;
}

/** MariaDB's duplicate-key error, so services can answer 409 instead of 500. */
export function isDuplicateKey(error: unknown): boolean {
  return (error as { code?: string } | null)?.code === 'ER_DUP_ENTRY';
}

/** MariaDB's refusal of a row naming a parent row that does not exist (1452), so services can answer 400. */
export function isUnknownReference(error: unknown): boolean {
  const { code, errno } = (error ?? {}) as { code?: string; errno?: number };
  return code === 'ER_NO_REFERENCED_ROW_2' || errno === 1452;
}

/** MariaDB's strict-mode refusal of a value longer than its column (1406), so services can answer 400. */
export function isDataTooLong(error: unknown): boolean {
  const { code, errno } = (error ?? {}) as { code?: string; errno?: number };
  return code === 'ER_DATA_TOO_LONG' || errno === 1406;
}
