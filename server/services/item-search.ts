// The gear listing: filters, sorts and keyset pagination, and the word search over item_terms
// (written by item-terms.ts). The cursor is the last row's sort key and id, base64url JSON.
import type { Knex } from 'knex';
import { DUE_SOON_DAYS, type ItemListQuery, type ItemSummary } from '../../shared/schemas/items';
import type { Db } from '../db';
import { ValidationError } from '../errors';
import { addDaysIso, dateColumnToIso, todayIso } from './dates';
import { searchWords } from './item-terms';
import { SUMMARY_COLUMNS, toItemSummary, type ItemRow } from './item-rows';

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
  ratedKv: {
    column: 'rated_kv',
    order: 'desc',
    unique: false,
    term: { column: 't.rated_kv', id: 't.item_id' },
    key: (r: ItemRow) => (r.rated_kv === null ? null : Number(r.rated_kv)),
  },
  nextDue: {
    column: 'next_inspection_due',
    order: 'asc',
    unique: false,
    term: { column: 't.next_inspection_due', id: 't.item_id' },
    key: (r: ItemRow) => dateColumnToIso(r.next_inspection_due),
  },
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

const ITEM_COLUMNS = (sort: Sort): Columns => ({
  kind: 'kind',
  ratedKv: 'rated_kv',
  status: 'status',
  nextDue: 'next_inspection_due',
  sort: sort.column,
  sortId: 'id',
});
const TERM_COLUMNS = (sort: Sort): Columns => ({
  kind: 't.kind',
  ratedKv: 't.rated_kv',
  status: 'i.status',
  nextDue: 't.next_inspection_due',
  sort: sort.term.column,
  sortId: sort.term.id,
});

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
      else
        builder.where((w) =>
          w
            .where(col, '<', v)
            .orWhere((x) => x.where(col, v).andWhere(idCol, '<', id))
            .orWhereNull(col),
        );
    }
  }
  builder
    .orderBy(
      sort.unique
        ? [{ column: c.sort, order: sort.order }]
        : [
            { column: c.sort, order: sort.order },
            { column: c.sortId, order: sort.order },
          ],
    )
    .limit(query.limit + 1);
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
