// The audit trail: appended in the same transaction as the change it records, never updated or
// deleted by the application. Each entry hashes the previous one, so `verifyAuditChain` finds any
// edit or removal made behind the application's back.
import { createHash } from 'node:crypto';
import type { AuditVerification } from '../../shared/schemas/audit';
import { isDatabaseUnavailable, isRetryableLockError, type Db, type Trx } from '../db';
import { AppError, UnavailableError } from '../errors';
import { wellFormed } from '../well-formed';
import { NotCommittedError, withDeadlockRetry } from './deadlock-retry';
import { canonical } from '../../shared/canonical-json';

export interface AuditInput {
  actorId: number | null;
  entity: string;
  entityId: string | number;
  action: string;
  before?: unknown;
  after?: unknown;
}

export function parseJson(value: unknown): unknown {
  // mysql2 hands MariaDB JSON columns back as strings (they are LONGTEXT underneath).
  if (typeof value !== 'string') return value ?? null;
  try {
    return JSON.parse(value);
  } catch {
    return value;
  }
}

function entryHash(
  prevHash: string,
  row: { at: string; actorId: number | null; entity: string; entityId: string; action: string; before: unknown; after: unknown },
): string {
  return createHash('sha256')
    .update(canonical({ prevHash, ...row }))
    .digest('hex');
}

type ChainRow = Parameters<typeof entryHash>[1];

/** Entries waiting for their transaction's end; only transactions from auditedTransaction() are here. */
const queued = new WeakMap<Trx, ChainRow[]>();

/**
 * Records one entry of the change the transaction makes. It is chained when the transaction ends
 * (auditedTransaction), so it may be called anywhere in the transaction's body.
 */
export function appendAudit(trx: Trx, input: AuditInput): Promise<void> {
  const entries = queued.get(trx);
  // An entry outside auditedTransaction would never be written: refuse loudly instead.
  if (!entries) throw new Error('appendAudit needs a transaction from auditedTransaction()');
  entries.push({
    at: new Date().toISOString(),
    actorId: input.actorId,
    entity: input.entity,
    entityId: String(input.entityId),
    action: input.action,
    // Round-trip through JSON so the hash is computed over exactly what is stored (dates as text).
    // wellFormed: a lone surrogate in stored text would fail MariaDB's JSON check.
    before: input.before === undefined ? null : wellFormed(JSON.parse(JSON.stringify(input.before)) as unknown),
    after: input.after === undefined ? null : wellFormed(JSON.parse(JSON.stringify(input.after)) as unknown),
  });
  return Promise.resolve();
}

/**
 * Runs `body` in a transaction and then chains its audit entries through the audit_append
 * procedure (migration 20261202001000), whose last call also commits inside MariaDB: the chain's
 * lock is taken and released within that one round trip. Each entry's hash is SHA-256 of
 * `canonical({ ...entry, prevHash })`; "prevHash" sorts after every other key, so the app sends
 * everything before the previous hash as a prefix and the database completes it.
 */
export function auditedTransaction<T>(db: Db, body: (trx: Trx) => Promise<T>): Promise<T> {
  // A deadlock victim is rolled back whole, so the whole body runs again (deadlock-retry.ts).
  return withDeadlockRetry(() => auditedTransactionOnce(db, body));
}

async function auditedTransactionOnce<T>(db: Db, body: (trx: Trx) => Promise<T>): Promise<T> {
  const trx = await db.transaction();
  queued.set(trx, []);
  // Until the statement that commits is sent, a dead connection means nothing was written.
  let commitSent = false;
  try {
    const result = await body(trx);
    const entries = queued.get(trx)!;
    queued.delete(trx);
    if (entries.length === 0) commitSent = true;
    for (const [index, row] of entries.entries()) {
      if (index === entries.length - 1) commitSent = true;
      await trx.raw('CALL audit_append(?, ?, ?, ?, ?, ?, ?, ?, ?)', [
        new Date(row.at),
        row.actorId,
        row.entity,
        row.entityId,
        row.action,
        row.before === null ? null : JSON.stringify(row.before),
        row.after === null ? null : JSON.stringify(row.after),
        hashPrefix(row),
        index === entries.length - 1,
      ]);
    }
    // After the procedure's own COMMIT this is a no-op for MariaDB; it closes knex's transaction.
    await trx.commit();
    return result;
  } catch (error) {
    queued.delete(trx);
    // (Before COMMIT was sent, knex completing the transaction by itself also means the connection died.)
    if (!commitSent && !(error instanceof AppError) && (isDatabaseUnavailable(error) || trx.isCompleted())) {
      await trx.rollback().catch(() => undefined);
      throw new NotCommittedError(error);
    }
    if (!trx.isCompleted()) {
      await trx.rollback().catch(() => undefined);
      throw error;
    }
    // Knex ends a transaction by itself when its connection dies; the body's next query then
    // fails with "Transaction query already complete". Report the outage, not that symptom.
    if (error instanceof AppError || isDatabaseUnavailable(error) || isRetryableLockError(error)) throw error;
    throw new UnavailableError();
  }
}

/** `canonical({ ...row, prevHash })` up to the previous hash itself; the database appends it and `"}`. */
export function hashPrefix(row: ChainRow): string {
  return `${canonical(row).slice(0, -1)},"prevHash":"`;
}

/** Walks the chain from the start; reports the first entry whose hash does not match. */
export async function verifyAuditChain(db: Db): Promise<AuditVerification> {
  // One REPEATABLE READ snapshot, so entries appended during the walk do not look like a break.
  return db.transaction(async (trx) => walkChain(trx), { isolationLevel: 'repeatable read' });
}

async function walkChain(db: Trx): Promise<AuditVerification> {
  let prevHash = '0'.repeat(64);
  let checked = 0;
  let lastId = 0;
  for (;;) {
    const rows = await db('audit_events').where('id', '>', lastId).orderBy('id').limit(1000);
    if (rows.length === 0) break;
    for (const r of rows) {
      const expected = entryHash(prevHash, {
        at: new Date(r.at).toISOString(),
        actorId: r.actor_id,
        entity: r.entity,
        entityId: r.entity_id,
        action: r.action,
        before: parseJson(r.before),
        after: parseJson(r.after),
      });
      if (r.prev_hash !== prevHash || r.hash !== expected) return { ok: false, checked, brokenAtId: Number(r.id) };
      prevHash = r.hash;
      checked += 1;
      lastId = Number(r.id);
    }
  }
  const head = await db('audit_head').where({ id: 1 }).first<{ hash: string }>();
  if (head && head.hash !== prevHash) return { ok: false, checked, brokenAtId: lastId };
  return { ok: true, checked, brokenAtId: null };
}
