// The search words of each item, one row per word in `item_terms`, written in the same
// transaction as the item. Gear search matches typed words against these rows by prefix.
//
// The kind, tag and rated_kv of the item are copied into each row, so the common search
// (a word, a kind, "rated at or above N kV", in tag order) is answered from one index alone.
// Status is not copied (too many places change it); searches join items for it.
//
// The migration that created the table filled it with this tokeniser. Changing how words are
// split or cut needs a new migration that rewrites every item's rows.
import type { Knex } from 'knex';
import type { ItemKind } from '../../shared/schemas/items';

/** Longest stored word, in characters (code points); longer words are cut to this prefix. */
export const TERM_MAX_LENGTH = 32;

/** Most words a search uses; the rest of the typed text is ignored. */
export const MAX_SEARCH_WORDS = 8;

/** The item fields whose words are searchable, and the copied filter and sort columns. */
export const TERM_SOURCE_COLUMNS = ['id', 'kind', 'tag', 'rated_kv', 'name', 'make', 'model', 'serial', 'location'] as const;

export interface TermSource {
  id: number;
  kind: ItemKind;
  tag: string;
  rated_kv: number | string | null;
  name: string;
  make: string;
  model: string;
  serial: string;
  location: string;
}

/**
 * Words of a text: NFKC, lower case, split on anything that is not a letter or a digit, each cut
 * to TERM_MAX_LENGTH. Typed searches and stored terms go through the same function, so they agree.
 */
export function wordsOf(text: string): string[] {
  return text
    .normalize('NFKC')
    .toLowerCase()
    .normalize('NFKC')
    .split(/[^\p{L}\p{N}]+/u)
    .filter((w) => w.length > 0)
    .map((w) => Array.from(w).slice(0, TERM_MAX_LENGTH).join(''));
}

/** The distinct terms an item is found by. */
export function termsOf(item: Pick<TermSource, 'tag' | 'name' | 'make' | 'model' | 'serial' | 'location'>): string[] {
  const text = [item.tag, item.name, item.make, item.model, item.serial, item.location].join(' ');
  return [...new Set(wordsOf(text))];
}

/** The words of a search, deduplicated, at most MAX_SEARCH_WORDS of them. */
export function searchWords(q: string): string[] {
  return [...new Set(wordsOf(q))].slice(0, MAX_SEARCH_WORDS);
}

/** A LIKE pattern matching values that start with `prefix`, with `%`, `_` and `\` literal. */
export function likePrefix(prefix: string): string {
  return `${prefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export function termRowsOf(item: TermSource) {
  return termsOf(item).map((term) => ({ term, item_id: item.id, kind: item.kind, tag: item.tag, rated_kv: item.rated_kv }));
}

/** Rows inserted per statement when many items are written at once. */
const INSERT_CHUNK = 2000;

/**
 * Replaces the term rows of the given items. Runs in the caller's transaction (or connection),
 * so an item and its terms never disagree.
 */
export async function writeItemTerms(trx: Knex | Knex.Transaction, items: TermSource | readonly TermSource[]): Promise<void> {
  const list = Array.isArray(items) ? (items as readonly TermSource[]) : [items as TermSource];
  if (list.length === 0) return;
  await trx('item_terms')
    .whereIn(
      'item_id',
      list.map((i) => i.id),
    )
    .delete();
  const rows = list.flatMap(termRowsOf);
  for (let start = 0; start < rows.length; start += INSERT_CHUNK) {
    await trx('item_terms').insert(rows.slice(start, start + INSERT_CHUNK));
  }
}
