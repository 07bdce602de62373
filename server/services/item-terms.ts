// The search terms of each item in `item_terms`, written in the same transaction as the item.
//
// Prefix rows: every word of an item is stored with all of its prefixes ("coronal" gives "c",
// "co", … "coronal"), once per item. A typed word then matches by equality alone, and an
// equality on the term walks the (term, kind, tag, rated_kv) or (term, tag, rated_kv) index in
// the listing's order and stops after a page: one index range, no LIKE branch, no check that an
// item is listed once (the primary key (term, item_id) already makes it so). The cost is about
// four times the rows and the table size (bench database: 0.76 to 3.1 million rows), paid when an
// item is written rather than in the optimizer on every search.
//
// Accent folding: "pruf" and "prüf" both find "Prüfspitze". Words are NFKD-decomposed, lower-cased,
// stripped of the combining marks that follow Latin, Greek or Cyrillic letters (accents people
// often leave out when typing), then recomposed (NFC). Marks of other scripts stay: Devanagari
// vowel signs or the Japanese voicing mark are part of the letter, and dropping them would make
// different words equal. Letters that do not decompose (ß, ł, ø) stay as they are. Stored and
// typed text go through the same wordsOf, so the two sides always agree.
//
// The kind, tag and rated_kv of the item are copied into each row, so the common search
// (a word, a kind, "rated at or above N kV", in tag order) is answered from one index alone.
// Name and next inspection due date are copied too (migration 20261202001400), so a word search
// in name, due-date or rating order walks an index (term, key, item_id) and stops after a page
// instead of sorting every match: a one-letter word matches a third of the gear. Recording an
// inspection moves the due date, so it updates the copies (`updateTermsDueDate`). Status is not
// copied (too many places change it); searches join items for it.
//
// Changing how words are folded, split, cut or expanded needs a new migration that rewrites
// every item's rows (see migrations/20261202001200_item_term_prefixes.ts).
import type { Knex } from 'knex';
import type { ItemKind } from '../../shared/schemas/items';

/** Longest stored word, in characters (code points); longer words are cut to this prefix. */
export const TERM_MAX_LENGTH = 32;

/** Most words a search uses; the rest of the typed text is ignored. */
export const MAX_SEARCH_WORDS = 8;

/** The item fields whose words are searchable, and the copied filter and sort columns. */
export const TERM_SOURCE_COLUMNS = ['id', 'kind', 'tag', 'rated_kv', 'next_inspection_due', 'name', 'make', 'model', 'serial', 'location'] as const;

export interface TermSource {
  id: number;
  kind: ItemKind;
  tag: string;
  rated_kv: number | string | null;
  /** A DATE: 'YYYY-MM-DD' text as the app reads it, or a Date as some inserts hold it. */
  next_inspection_due: string | Date | null;
  name: string;
  make: string;
  model: string;
  serial: string;
  location: string;
}

/** Combining marks (one or more) right after a letter of a script whose accents are optional. */
const OPTIONAL_ACCENTS = /(?<=[\p{Script=Latin}\p{Script=Greek}\p{Script=Cyrillic}])\p{M}+/gu;

/** Anything that is not part of a word; marks count as part (they are kept outside Latin, Greek, Cyrillic). */
const WORD_SEPARATORS = /[^\p{L}\p{M}\p{N}]+/u;

/**
 * Words of a text: folded (compatibility forms, case and optional accents; see the header),
 * split on anything that is not a letter, mark or digit, each cut to TERM_MAX_LENGTH. Typed
 * searches and stored terms go through this one function, so they agree.
 */
export function wordsOf(text: string): string[] {
  return (
    text
      .normalize('NFKD')
      .toLowerCase()
      // Lower-casing can decompose again ("İ" becomes "i" and a combining dot).
      .normalize('NFKD')
      .replace(OPTIONAL_ACCENTS, '')
      .normalize('NFC')
      .split(WORD_SEPARATORS)
      .filter((w) => w.length > 0)
      .map((w) => Array.from(w).slice(0, TERM_MAX_LENGTH).join(''))
  );
}

/** Every prefix of a word, one character (code point) longer each time, the word itself last. */
export function prefixesOf(word: string): string[] {
  const chars = Array.from(word);
  return chars.map((_, i) => chars.slice(0, i + 1).join(''));
}

/** The distinct terms an item is found by: every prefix of every one of its words. */
export function termsOf(item: Pick<TermSource, 'tag' | 'name' | 'make' | 'model' | 'serial' | 'location'>): string[] {
  const text = [item.tag, item.name, item.make, item.model, item.serial, item.location].join(' ');
  return [...new Set(wordsOf(text).flatMap(prefixesOf))];
}

/** The words of a search, deduplicated, at most MAX_SEARCH_WORDS of them. */
export function searchWords(q: string): string[] {
  return [...new Set(wordsOf(q))].slice(0, MAX_SEARCH_WORDS);
}

export function termRowsOf(item: TermSource) {
  return termsOf(item).map((term) => ({
    term,
    item_id: item.id,
    kind: item.kind,
    tag: item.tag,
    rated_kv: item.rated_kv,
    name: item.name,
    next_inspection_due: item.next_inspection_due,
  }));
}

/** The columns item_terms has at the latest migration; earlier migrations name their own. */
const TERM_ROW_COLUMNS = ['term', 'item_id', 'kind', 'tag', 'rated_kv', 'name', 'next_inspection_due'] as const;
export type TermRowColumn = (typeof TERM_ROW_COLUMNS)[number];

/**
 * Rows inserted per statement when many items are written at once. Counted in rows, not items,
 * so prefix rows (about four times as many per item) do not grow a statement: a row is at most
 * ~830 bytes of SQL (a 32-character term, a 32-character tag and a 120-character name at 4 bytes
 * each, kind, number, date, id), so 2000 rows stay under 2 MB, far below MariaDB's default
 * max_allowed_packet of 16 MB.
 */
const INSERT_CHUNK = 2000;

/**
 * Replaces the term rows of the given items. Runs in the caller's transaction (or connection),
 * so an item and its terms never disagree. A migration passes the columns the table had then.
 */
export async function writeItemTerms(
  trx: Knex | Knex.Transaction,
  items: TermSource | readonly TermSource[],
  columns: readonly TermRowColumn[] = TERM_ROW_COLUMNS,
): Promise<void> {
  const list = Array.isArray(items) ? (items as readonly TermSource[]) : [items as TermSource];
  if (list.length === 0) return;
  await trx('item_terms')
    .whereIn(
      'item_id',
      list.map((i) => i.id),
    )
    .delete();
  const rows = list.flatMap(termRowsOf).map((row) => Object.fromEntries(columns.map((c) => [c, row[c]])));
  for (let start = 0; start < rows.length; start += INSERT_CHUNK) {
    await trx('item_terms').insert(rows.slice(start, start + INSERT_CHUNK));
  }
}

/** Keeps the copied due date in step when an inspection moves it (the words stay the same). */
export async function updateTermsDueDate(trx: Knex.Transaction, itemId: number, nextDue: string | null): Promise<void> {
  await trx('item_terms').where({ item_id: itemId }).update({ next_inspection_due: nextDue });
}
