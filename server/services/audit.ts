// The audit trail: appended in the same transaction as the change it records, never updated or
// deleted by the application. Each entry hashes the previous one, so `verifyAuditChain` finds any
// edit or removal made behind the application's back.
import { createHash } from 'node:crypto';
import type { AuditEvent, AuditPage, AuditVerification } from '../../shared/schemas/audit';
import type { Db, Trx } from '../db';
import { wellFormed } from '../well-formed';

export interface AuditInput {
  actorId: number | null;
  entity: string;
  entityId: string | number;
  action: string;
  before?: unknown;
  after?: unknown;
}


function canonical(value: unknown): string {
  if (value === undefined || value === null) return 'null';
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

function parseJson(value: unknown): unknown {
  // mysql2 hands MariaDB JSON columns back as strings (they are LONGTEXT underneath).
  if (typeof value !== 'string') return value ?? null;
  try {
    return JSON.parse(value);
  } catch {
    return value;
  }
}

function entryHash(prevHash: string, row: { at: string; actorId: number | null; entity: string; entityId: string; action: string; before: unknown; after: unknown }): string {
  return createHash('sha256')
    .update(canonical({ prevHash, ...row }))
    .digest('hex');
}

/**
 * Appends one entry. Call inside the transaction that makes the change, as its last write: the
 * chain's lock is held from here to the commit. The database chains the entry (migration
 * 20261202001000): its hash is SHA-256 of `canonical({ ...entry, prevHash })`, and since
 * "prevHash" sorts after every other key, everything before the previous hash is sent as a prefix.
 */
export async function appendAudit(trx: Trx, input: AuditInput): Promise<void> {
  const at = new Date().toISOString();
  const row = {
    at,
    actorId: input.actorId,
    entity: input.entity,
    entityId: String(input.entityId),
    action: input.action,
    // Round-trip through JSON so the hash is computed over exactly what is stored (dates as text).
    // wellFormed: a lone surrogate in stored text would fail MariaDB's JSON check.
    before: input.before === undefined ? null : wellFormed(JSON.parse(JSON.stringify(input.before)) as unknown),
    after: input.after === undefined ? null : wellFormed(JSON.parse(JSON.stringify(input.after)) as unknown),
  };
  await trx.raw('CALL audit_append(?, ?, ?, ?, ?, ?, ?, ?)', [
    new Date(at),
    row.actorId,
    row.entity,
    row.entityId,
    row.action,
    row.before === null ? null : JSON.stringify(row.before),
    row.after === null ? null : JSON.stringify(row.after),
    hashPrefix(row),
  ]);
}

/** `canonical({ ...row, prevHash })` up to the previous hash itself; the database appends it and `"}`. */
export function hashPrefix(row: Parameters<typeof entryHash>[1]): string {
  return `${canonical(row).slice(0, -1)},"prevHash":"`;
}

export interface AuditFilter {
  entity?: string;
  entityId?: string;
  beforeId?: number;
  limit: number;
}

export async function listAudit(db: Db, filter: AuditFilter): Promise<AuditPage> {
  const query = db('audit_events as a')
    .leftJoin('people as p', 'p.id', 'a.actor_id')
    .select('a.id', 'a.at', 'a.actor_id', 'p.name as actor_name', 'a.entity', 'a.entity_id', 'a.action', 'a.before', 'a.after')
    .orderBy('a.id', 'desc')
    .limit(filter.limit + 1);
  if (filter.entity) query.where('a.entity', filter.entity);
  if (filter.entityId) query.where('a.entity_id', filter.entityId);
  if (filter.beforeId) query.where('a.id', '<', filter.beforeId);
  const rows = await query;
  const page = rows.slice(0, filter.limit);
  return {
    events: page.map((r) => ({
      id: Number(r.id),
      at: new Date(r.at).toISOString(),
      actorId: r.actor_id,
      actorName: r.actor_name ?? null,
      entity: r.entity,
      entityId: r.entity_id,
      action: r.action,
      before: parseJson(r.before),
      after: parseJson(r.after),
    })),
    nextCursor: rows.length > filter.limit ? String(page[page.length - 1]!.id) : null,
  };
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
