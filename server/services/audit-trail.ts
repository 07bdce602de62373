// Reading the audit trail: newest first, filtered by what an entry is about (entity and id), by a
// gear tag, by a person and by a time span, each entry with the names the lab knows it by. The
// writing side (appendAudit, auditedTransaction, the chain check) stays in audit.ts.
import type { AuditEvent, AuditPage, AuditSubject } from '../../shared/schemas/audit';
import type { Knex } from 'knex';
import type { Db } from '../db';
import { parseJson } from './audit';

export interface AuditFilter {
  entity?: string;
  entityId?: string;
  /** A gear tag or its start ("GST-00"): entries about that item and the bookings it was in. */
  tag?: string;
  /** Part of a name or e-mail: entries the person made, and those about them or their bookings. */
  person?: string;
  /** ISO instants: entries at or after `from`, before `to`. */
  from?: string;
  to?: string;
  beforeId?: number;
  limit: number;
}

/** More matches than this for a tag or a person is not a search any more: ask for more letters. */
const MATCH_CAP = 200;

function likeStart(text: string): string {
  return `${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function likeAnywhere(text: string): string {
  return `%${likeStart(text)}`;
}

function parseTags(value: unknown): string[] {
  const parsed = parseJson(value);
  return Array.isArray(parsed) ? parsed.filter((t): t is string => typeof t === 'string') : [];
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
  if (filter.from) query.where('a.at', '>=', new Date(filter.from));
  if (filter.to) query.where('a.at', '<', new Date(filter.to));

  if (filter.tag) {
    const itemIds = (await db('items').where('tag', 'like', likeStart(filter.tag)).orderBy('tag').limit(MATCH_CAP).pluck('id')) as number[];
    if (itemIds.length === 0) return { events: [], nextCursor: null };
    const bookingIds = (await db('booking_items').whereIn('item_id', itemIds).distinct('booking_id')).map((r) => Number(r.booking_id));
    query.where((q) => {
      q.where((w) => w.where('a.entity', 'item').whereIn('a.entity_id', itemIds.map(String)));
      if (bookingIds.length > 0) q.orWhere((w) => w.where('a.entity', 'booking').whereIn('a.entity_id', bookingIds.map(String)));
    });
  }

  if (filter.person) {
    const pattern = likeAnywhere(filter.person);
    const personIds = (await db('people').where('name', 'like', pattern).orWhere('email', 'like', pattern).limit(MATCH_CAP).pluck('id')) as number[];
    if (personIds.length === 0) return { events: [], nextCursor: null };
    const bookingIds = (await db('bookings').whereIn('person_id', personIds).pluck('id')) as number[];
    query.where((q) => {
      q.whereIn('a.actor_id', personIds).orWhere((w) => w.whereIn('a.entity', ['person', 'qualification']).whereIn('a.entity_id', personIds.map(String)));
      if (bookingIds.length > 0) q.orWhere((w) => w.where('a.entity', 'booking').whereIn('a.entity_id', bookingIds.map(String)));
    });
  }

  const rows = await query;
  const page = rows.slice(0, filter.limit);
  const subjects = await subjectsOf(db, page);
  return {
    events: page.map((r): AuditEvent => ({
      id: Number(r.id),
      at: new Date(r.at).toISOString(),
      actorId: r.actor_id,
      actorName: r.actor_name ?? null,
      entity: r.entity,
      entityId: r.entity_id,
      action: r.action,
      before: parseJson(r.before),
      after: parseJson(r.after),
      subject: subjects.get(`${r.entity}:${r.entity_id}`) ?? null,
    })),
    nextCursor: rows.length > filter.limit ? String(page[page.length - 1]!.id) : null,
  };
}

/**
 * The current names of a page's subjects in one query (a UNION ALL over the kinds on the page),
 * so a page costs the same number of queries whatever it holds.
 */
async function subjectsOf(db: Db, rows: { entity: string; entity_id: string }[]): Promise<Map<string, AuditSubject>> {
  const idsOf = (...entities: string[]) =>
    [...new Set(rows.filter((r) => entities.includes(r.entity)).map((r) => Number(r.entity_id)))].filter(Number.isInteger);
  const parts: Knex.QueryBuilder[] = [];
  const itemIds = idsOf('item');
  const bookingIds = idsOf('booking');
  const personIds = idsOf('person', 'qualification');
  const lineIds = idsOf('checklist-template');
  if (itemIds.length) parts.push(db('items').whereIn('id', itemIds).select(db.raw("'item' AS kind"), 'id', 'tag AS a', 'name AS b'));
  if (bookingIds.length)
    parts.push(
      db('bookings as bk')
        .join('people as bp', 'bp.id', 'bk.person_id')
        .whereIn('bk.id', bookingIds)
        .select(db.raw("'booking' AS kind"), 'bk.id', 'bp.name AS a', 'bk.item_tags AS b'),
    );
  if (personIds.length) parts.push(db('people').whereIn('id', personIds).select(db.raw("'person' AS kind"), 'id', 'name AS a', db.raw('NULL AS b')));
  if (lineIds.length) parts.push(db('checklist_templates').whereIn('id', lineIds).select(db.raw("'line' AS kind"), 'id', 'text AS a', db.raw('NULL AS b')));
  const subjects = new Map<string, AuditSubject>();
  if (parts.length === 0) return subjects;
  const [first, ...rest] = parts;
  const found = (rest.length ? first!.unionAll(rest, true) : first!) as unknown as Promise<{ kind: string; id: number; a: string; b: unknown }[]>;
  for (const r of await found) {
    if (r.kind === 'item') subjects.set(`item:${r.id}`, { tag: r.a, name: String(r.b) });
    else if (r.kind === 'booking') subjects.set(`booking:${r.id}`, { personName: r.a, tags: parseTags(r.b) });
    else if (r.kind === 'person') {
      subjects.set(`person:${r.id}`, { personName: r.a });
      subjects.set(`qualification:${r.id}`, { personName: r.a });
    } else subjects.set(`checklist-template:${r.id}`, { text: r.a });
  }
  return subjects;
}
