// Gear registry operations. Every write runs in one transaction with its audit entry.
import {
  DEFAULT_INSPECTION_DAYS,
  DUE_SOON_DAYS,
  KIND_TAG_CODES,
  RATINGS_SCHEMAS,
  ratedKvOf,
  type InspectionCreateInput,
  type InspectionState,
  type Item,
  type ItemCreateInput,
  type ItemKind,
  type ItemListQuery,
  type ItemRatings,
  type ItemStatus,
  type ItemSummary,
  type ItemUpdateInput,
  type Inspection,
  inspectionCreateSchema,
} from '../../shared/schemas/items';
import type { Knex } from 'knex';
import type { SessionUser } from '../../shared/schemas/session';
import { isDuplicateKey, type Db, type Trx } from '../db';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import { validate } from '../middleware/validate';
import { appendAudit, auditedTransaction } from './audit';
import { addDaysIso, dateColumnToIso, isoOfMillis, timestampToIso, todayIso } from './dates';
import { lockBookingsHolding, replanBookingsHolding, type MailContext } from './bookings';
import { searchWords, updateTermsDueDate, writeItemTerms } from './item-terms';
import { lockItem, SUMMARY_COLUMNS, tagOutInTransaction, toItemSummary, type ItemRow } from './item-rows';

export { inspectionStateOf, toItemSummary, type ItemRow } from './item-rows';

function parseRatings(value: unknown): ItemRatings['ratings'] {
  return (typeof value === 'string' ? JSON.parse(value) : value) as ItemRatings['ratings'];
}

export function toItem(row: ItemRow, publicUrl: string): Item {
  return {
    ...toItemSummary(row),
    make: row.make,
    model: row.model,
    serial: row.serial,
    notes: row.notes,
    ratings: parseRatings(row.ratings),
    inspectionIntervalDays: row.inspection_interval_days,
    lastInspectedOn: dateColumnToIso(row.last_inspected_on),
    lastInspectionResult: row.last_inspection_result ?? null,
    photoFileId: row.photo_file_id,
    labelUrl: labelUrl(publicUrl, row.tag),
    createdAt: timestampToIso(row.created_at)!,
    updatedAt: timestampToIso(row.updated_at)!,
  };
}

export function labelUrl(publicUrl: string, tag: string): string {
  return `${publicUrl}/i/${encodeURIComponent(tag)}`;
}

/** Next tag for a kind, e.g. MUL-0008. The sequence row is locked, so two managers never collide. */
async function issueTag(trx: Trx, kind: ItemKind): Promise<string> {
  const code = KIND_TAG_CODES[kind];
  await trx.raw('INSERT INTO tag_sequences (code, last_value) VALUES (?, 1) ON DUPLICATE KEY UPDATE last_value = last_value + 1', [code]);
  const row = await trx('tag_sequences').where({ code }).first<{ last_value: number }>();
  return `${code}-${String(row!.last_value).padStart(4, '0')}`;
}


export async function getItem(db: Db, id: number): Promise<ItemRow> {
  const row = await db<ItemRow>('items').where({ id }).first();
  if (!row) throw new NotFoundError(`No item with id ${id}.`);
  return row;
}

export async function getItemByTag(db: Db, tag: string): Promise<ItemRow> {
  const row = await db<ItemRow>('items').where({ tag: tag.trim().toUpperCase() }).first();
  if (!row) throw new NotFoundError(`No item carries the tag ${tag}.`);
  return row;
}

export async function createItem(db: Db, actor: SessionUser, input: ItemCreateInput & { kind: ItemKind; ratings: ItemRatings['ratings'] }): Promise<ItemRow> {
  return auditedTransaction(db, async (trx) => {
    const tag = input.tag ?? (await issueTag(trx, input.kind));
    const record = {
      tag,
      kind: input.kind,
      name: input.name,
      make: input.make ?? '',
      model: input.model ?? '',
      serial: input.serial ?? '',
      location: input.location,
      notes: input.notes ?? '',
      ratings: JSON.stringify(input.ratings),
      rated_kv: ratedKvOf({ kind: input.kind, ratings: input.ratings } as ItemRatings),
      inspection_interval_days: input.inspectionIntervalDays ?? DEFAULT_INSPECTION_DAYS[input.kind],
    };
    let id: number;
    try {
      [id] = (await trx('items').insert(record)) as [number];
    } catch (error) {
      if (isDuplicateKey(error)) throw new ConflictError(`The tag ${tag} has already been issued; tags are never reused.`, 'TAG_TAKEN');
      throw error;
    }
    const row = await lockItem(trx, id);
    await writeItemTerms(trx, row);
    await appendAudit(trx, { actorId: actor.id, entity: 'item', entityId: id, action: 'item.created', after: { ...record, ratings: input.ratings } });
    return row;
  });
}

function auditView(row: ItemRow) {
  return {
    name: row.name,
    make: row.make,
    model: row.model,
    serial: row.serial,
    location: row.location,
    notes: row.notes,
    ratings: parseRatings(row.ratings),
    status: row.status,
    statusReason: row.status_reason,
    inspectionIntervalDays: row.inspection_interval_days,
  };
}

export async function updateItem(db: Db, actor: SessionUser, id: number, input: ItemUpdateInput, mail: MailContext): Promise<ItemRow> {
  return auditedTransaction(db, async (trx) => {
    if (input.ratings !== undefined) await lockBookingsHolding(trx, id);
    const before = await lockItem(trx, id);
    if (before.status === 'retired') throw new ConflictError(`${before.tag} is retired; retired gear cannot be changed.`, 'ITEM_RETIRED');
    const changes: Partial<ItemRow> & { ratings?: string; updated_at: Date } = { updated_at: new Date() };
    for (const key of ['name', 'make', 'model', 'serial', 'location', 'notes'] as const) {
      if (input[key] !== undefined) changes[key] = input[key];
    }
    if (input.inspectionIntervalDays !== undefined) {
      changes.inspection_interval_days = input.inspectionIntervalDays;
      if (before.last_inspected_on) changes.next_inspection_due = addDaysIso(dateColumnToIso(before.last_inspected_on)!, input.inspectionIntervalDays);
    }
    if (input.ratings !== undefined) {
      const ratings = validate(RATINGS_SCHEMAS[before.kind], input.ratings, `ratings for a ${before.kind}`, 'ratings');
      changes.ratings = JSON.stringify(ratings);
      changes.rated_kv = ratedKvOf({ kind: before.kind, ratings } as ItemRatings);
    }
    if (input.status === 'in-service' && before.status === 'out-of-service') {
      // Lockout/tagout practice: a tag comes off after the item is inspected and passes. The
      // inspection must be recorded after the tag-out and carried out on or after its day (an
      // old inspection entered late is no evidence), and not dated in the future.
      const since = before.status_changed_at ?? new Date(0);
      const passed = await trx('inspections')
        .where({ item_id: id, result: 'pass' })
        .andWhere('created_at', '>=', since)
        .andWhere('inspected_on', '>=', isoOfMillis(new Date(since).getTime()).slice(0, 10))
        .andWhere('inspected_on', '<=', todayIso())
        .first('id');
      if (!passed) throw new ConflictError(`${before.tag} is tagged out: record a passing inspection carried out since the tag-out before clearing it.`, 'INSPECTION_REQUIRED');
    }
    if (input.status !== undefined && input.status !== before.status) {
      changes.status = input.status;
      changes.status_changed_at = new Date();
      changes.status_reason = input.status === 'in-service' ? null : (input.statusReason ?? null);
    } else if (input.statusReason !== undefined && before.status !== 'in-service') {
      changes.status_reason = input.statusReason;
    }
    await trx('items').where({ id }).update(changes);
    const after = await lockItem(trx, id);
    // New ratings change what every open booking of the item means: each is assessed again
    // under a new plan version, voiding an approval given for the old figures.
    if (changes.ratings !== undefined && changes.ratings !== JSON.stringify(typeof before.ratings === 'string' ? JSON.parse(before.ratings) : before.ratings)) {
      await replanBookingsHolding(trx, actor, id, mail);
    }
    // Name, make, model, serial, location and rating can all change what the item is found by.
    await writeItemTerms(trx, after);
    const action =
      changes.status === 'out-of-service' ? 'item.tagged-out' : changes.status === 'in-service' ? 'item.cleared' : changes.status === 'retired' ? 'item.retired' : 'item.updated';
    await appendAudit(trx, { actorId: actor.id, entity: 'item', entityId: id, action, before: auditView(before), after: auditView(after) });
    return after;
  });
}

export async function recordInspection(db: Db, actor: SessionUser, itemId: number, body: unknown): Promise<Inspection> {
  const input = validate(inspectionCreateSchema, body, 'inspection');
  const inspectedOn = input.inspectedOn ?? todayIso();
  if (inspectedOn > todayIso()) throw new ValidationError('An inspection cannot be dated in the future.', { inspectedOn: ['Pick today or an earlier date'] });
  return auditedTransaction(db, async (trx) => {
    const item = await lockItem(trx, itemId);
    if (item.status === 'retired') throw new ConflictError(`${item.tag} is retired.`, 'ITEM_RETIRED');
    const nextDue = addDaysIso(inspectedOn, item.inspection_interval_days);
    const [id] = (await trx('inspections').insert({
      item_id: itemId,
      inspected_on: inspectedOn,
      inspector_id: actor.id,
      result: input.result,
      readings: JSON.stringify(input.readings),
      notes: input.notes,
      next_due: nextDue,
    })) as [number];
    // A later inspection entered for an earlier date must not move the due date backwards.
    const latest = dateColumnToIso(item.last_inspected_on);
    if (!latest || inspectedOn >= latest) {
      await trx('items').where({ id: itemId }).update({ last_inspected_on: inspectedOn, next_inspection_due: nextDue, last_inspection_result: input.result, updated_at: new Date() });
      await updateTermsDueDate(trx, itemId, nextDue);
    }
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'item',
      entityId: itemId,
      action: `inspection.${input.result}`,
      after: { inspectionId: id, inspectedOn, result: input.result, readings: input.readings, notes: input.notes, nextDue },
    });
    if (input.result === 'fail') {
      await tagOutInTransaction(trx, actor.id, itemId, `Failed inspection on ${inspectedOn}: ${input.notes}`);
    }
    return {
      id,
      itemId,
      inspectedOn,
      inspectorName: actor.name,
      result: input.result,
      readings: input.readings,
      notes: input.notes,
      nextDue,
    };
  });
}

export async function listInspections(db: Db, itemId: number, limit = 50): Promise<Inspection[]> {
  const rows = await db('inspections as i')
    .join('people as p', 'p.id', 'i.inspector_id')
    .where('i.item_id', itemId)
    .orderBy([{ column: 'i.inspected_on', order: 'desc' }, { column: 'i.id', order: 'desc' }])
    .limit(limit)
    .select('i.*', 'p.name as inspector_name');
  return rows.map((r) => ({
    id: r.id,
    itemId: r.item_id,
    inspectedOn: dateColumnToIso(r.inspected_on)!,
    inspectorName: r.inspector_name,
    result: r.result,
    readings: typeof r.readings === 'string' ? JSON.parse(r.readings) : r.readings,
    notes: r.notes,
    nextDue: dateColumnToIso(r.next_due)!,
  }));
}

// ---------------------------------------------------------------------------------------------
// Listing with keyset pagination. The cursor is the last row's sort key and id, base64url JSON.

interface Cursor {
  v: string | number | null;
  id: number;
  /** How the search text was matched on the first page. */
  m?: TextMatch;
}

function encodeCursor(cursor: Cursor): string {
  return Buffer.from(JSON.stringify(cursor)).toString('base64url');
}

function decodeCursor(raw: string): Cursor {
  try {
    const parsed = JSON.parse(Buffer.from(raw, 'base64url').toString('utf8')) as Cursor;
    if (typeof parsed !== 'object' || parsed === null || !Number.isInteger(parsed.id)) throw new Error('bad');
    if (parsed.v !== null && typeof parsed.v !== 'string' && typeof parsed.v !== 'number') throw new Error('bad');
    if (parsed.m !== undefined && parsed.m !== 'tag' && parsed.m !== 'words') throw new Error('bad');
    return parsed;
  } catch {
    throw new ValidationError('The page cursor is not valid; start from the first page.', { cursor: ['Invalid cursor'] });
  }
}

/** Looks like a tag or its start: letters, a dash, then digits (MUL-0007, mul-00). */
const TAG_LIKE = /^[A-Za-z]{2,5}-[A-Za-z0-9-]*\d[A-Za-z0-9-]*$/;

// `unique` sorts need no id tie-breaker; leaving it out lets MariaDB walk the unique tag index
// in order instead of sorting every row (0.3 ms instead of 13 ms over 50,000 items).
// `term` names the column a word search sorts on: its copy in item_terms, whose index
// (term, column[, item_id]) MariaDB walks in order, reading items only for the rows it returns.
const SORTS = {
  tag: { column: 'tag', order: 'asc', unique: true, term: { column: 't.tag', id: 't.item_id' }, key: (r: ItemRow) => r.tag },
  name: { column: 'name', order: 'asc', unique: false, term: { column: 't.name', id: 't.item_id' }, key: (r: ItemRow) => r.name },
  ratedKv: { column: 'rated_kv', order: 'desc', unique: false, term: { column: 't.rated_kv', id: 't.item_id' }, key: (r: ItemRow) => (r.rated_kv === null ? null : Number(r.rated_kv)) },
  nextDue: { column: 'next_inspection_due', order: 'asc', unique: false, term: { column: 't.next_inspection_due', id: 't.item_id' }, key: (r: ItemRow) => dateColumnToIso(r.next_inspection_due) },
} as const;

type TextMatch = 'tag' | 'words';
type Sort = (typeof SORTS)[keyof typeof SORTS];

/** Where a listing finds each column: `items` alone, or item_terms `t` joined to items `i`. */
interface Columns {
  kind: string;
  ratedKv: string;
  status: string;
  nextDue: string;
  sort: string;
  sortId: string;
}

const ITEM_COLUMNS = (sort: Sort): Columns => ({ kind: 'kind', ratedKv: 'rated_kv', status: 'status', nextDue: 'next_inspection_due', sort: sort.column, sortId: 'id' });
const TERM_COLUMNS = (sort: Sort): Columns => ({ kind: 't.kind', ratedKv: 't.rated_kv', status: 'i.status', nextDue: 't.next_inspection_due', sort: sort.term.column, sortId: sort.term.id });

export async function listItems(db: Db, query: ItemListQuery): Promise<{ items: ItemSummary[]; nextCursor: string | null }> {
  const cursor = query.cursor ? decodeCursor(query.cursor) : null;
  const q = query.q?.trim() ?? '';
  // A tag typed off a label is answered by a prefix range on the unique tag index; a word search
  // would match every item of that kind code. If no tag starts that way (a serial number looks
  // alike), the words are searched instead. The cursor remembers which, so later pages agree.
  if (q && TAG_LIKE.test(q) && cursor?.m !== 'words') {
    const byTag = await listPage(db, query, cursor, 'tag');
    if (byTag.items.length > 0 || cursor) return byTag;
  }
  return listPage(db, query, cursor, 'words');
}

/** Filters, keyset position, order and page size, shared by the plain and the word listing. */
function applyListing(builder: Knex.QueryBuilder, query: ItemListQuery, cursor: Cursor | null, sort: Sort, c: Columns): void {
  if (query.kind) builder.where(c.kind, query.kind);
  if (query.status) builder.where(c.status, query.status);
  else builder.whereNot(c.status, 'retired');
  if (query.minKv !== undefined) builder.where(c.ratedKv, '>=', query.minKv);
  if (query.due === 'overdue') builder.where(c.nextDue, '<', todayIso());
  if (query.due === 'soon') builder.where(c.nextDue, '<=', addDaysIso(todayIso(), DUE_SOON_DAYS));

  if (cursor) {
    const { v, id } = cursor;
    const col = c.sort;
    const idCol = c.sortId;
    if (sort.unique) {
      if (typeof v !== 'string') throw new ValidationError('The page cursor is not valid; start from the first page.', { cursor: ['Invalid cursor'] });
      builder.where(col, '>', v);
    } else if (sort.order === 'asc') {
      // Ascending: NULLs come first in MariaDB.
      if (v === null) builder.where((w) => w.where((x) => x.whereNull(col).andWhere(idCol, '>', id)).orWhereNotNull(col));
      else builder.where((w) => w.where(col, '>', v).orWhere((x) => x.where(col, v).andWhere(idCol, '>', id)));
    } else {
      // Descending: NULLs come last.
      if (v === null) builder.whereNull(col).andWhere(idCol, '<', id);
      else builder.where((w) => w.where(col, '<', v).orWhere((x) => x.where(col, v).andWhere(idCol, '<', id)).orWhereNull(col));
    }
  }
  builder.orderBy(sort.unique ? [{ column: c.sort, order: sort.order }] : [{ column: c.sort, order: sort.order }, { column: c.sortId, order: sort.order }]).limit(query.limit + 1);
}

/**
 * Items matching every word as a prefix of one of their words. item_terms holds every prefix of
 * every word (see item-terms.ts), so each typed word is an equality on the term. The longest word
 * drives: its term rows are read in the listing's order (item_terms holds kind, tag, rated_kv,
 * name and due date, so those filters need no items row, and MariaDB walks an index in the sort's
 * order and stops after a page), and each row is checked for the other words and its item's
 * status. The primary key (term, item_id) gives one row per item for a term, so an item is
 * listed once.
 */
function wordSearch(db: Db, query: ItemListQuery, cursor: Cursor | null, sort: Sort, words: string[]): Knex.QueryBuilder {
  // A word that starts another typed word adds nothing ("cor corona").
  const needed = words.filter((w) => !words.some((o) => o !== w && o.startsWith(w)));
  if (query.status === 'out-of-service' || query.status === 'retired') return uncommonStatusWordSearch(db, query, cursor, sort, needed);
  const driver = words.reduce((best, w) => (Array.from(w).length > Array.from(best).length ? w : best));
  const others = needed.filter((w) => w !== driver);
  // STRAIGHT_JOIN: term rows first. For a word in every item ("m" of model M-123) MariaDB would
  // otherwise scan items and sort them all.
  const matches = db({ t: 'item_terms' }).joinRaw('STRAIGHT_JOIN items AS i ON i.id = t.item_id').where('t.term', driver);
  // A scalar subquery: one primary-key probe per term row, before its items row is read. As
  // EXISTS or IN, MariaDB pulls the other word into the join and may read all of its rows first
  // (on the bench database, "c 1" read the 20,000 rows of "1" and sorted them on disk).
  for (const w of others) matches.whereRaw('(SELECT 1 FROM item_terms AS o WHERE o.term = ? AND o.item_id = t.item_id) IS NOT NULL', [w]);
  applyListing(matches, query, cursor, sort, TERM_COLUMNS(sort));
  return matches.select(...SUMMARY_COLUMNS.map((col) => `i.${col}`));
}

/**
 * Gear out of service or retired is a small part of a lab's gear, while a short word can match a
 * third of it, and status is not in item_terms: walking the word's rows would read every match to
 * find the few with that status (80 ms for "c" among 50,000 items, none retired). So these
 * searches start from the items with the status (index (status, tag)) and probe each word's
 * primary key instead. Same filters, order and cursor as the word-driven search.
 */
function uncommonStatusWordSearch(db: Db, query: ItemListQuery, cursor: Cursor | null, sort: Sort, words: string[]): Knex.QueryBuilder {
  // FORCE INDEX: in name order MariaDB would rather walk the name index and probe every item
  // until a page is found (31 ms for "corona" among the 1,500 out-of-service items of 50,000).
  const builder = db.from(db.raw('items FORCE INDEX (items_status_tag_index)')).select(...SUMMARY_COLUMNS);
  for (const w of words) builder.whereRaw('(SELECT 1 FROM item_terms AS o WHERE o.term = ? AND o.item_id = items.id) IS NOT NULL', [w]);
  applyListing(builder, query, cursor, sort, ITEM_COLUMNS(sort));
  return builder;
}

async function listPage(db: Db, query: ItemListQuery, cursor: Cursor | null, match: TextMatch): Promise<{ items: ItemSummary[]; nextCursor: string | null }> {
  const sort = SORTS[query.sort];
  const q = query.q?.trim();
  const words = q && match === 'words' ? searchWords(q) : [];
  let builder: Knex.QueryBuilder;
  if (words.length > 0) {
    builder = wordSearch(db, query, cursor, sort, words);
  } else {
    builder = db<ItemRow>('items').select(...SUMMARY_COLUMNS);
    if (q && match === 'tag') builder.where('tag', 'like', `${q.toUpperCase().replace(/[%_\\]/g, '')}%`);
    applyListing(builder, query, cursor, sort, ITEM_COLUMNS(sort));
  }

  const rows = (await builder) as ItemRow[];
  const page = rows.slice(0, query.limit);
  const last = page[page.length - 1];
  return {
    items: page.map(toItemSummary),
    nextCursor: rows.length > query.limit && last ? encodeCursor({ v: sort.key(last), id: last.id, m: match }) : null,
  };
}
