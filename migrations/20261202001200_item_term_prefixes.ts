import type { Knex } from 'knex';
import { TERM_MAX_LENGTH, TERM_SOURCE_COLUMNS, writeItemTerms, type TermSource } from '../server/services/item-terms';

// Gear search by prefix rows with accent folding (see server/services/item-terms.ts): every
// item's terms are rewritten as all prefixes of its folded words, so a typed word matches by
// equality on one index range instead of a LIKE range plus checks that list an item once.
//
// The indexes stay (checked with EXPLAIN on the bench database): (term, kind, tag, rated_kv) and
// (term, tag, rated_kv) drive the searches with and without a kind; the primary key serves the
// other words' probes and the sorts other than tag; (item_id, term) no longer serves a search, but
// the foreign key to items needs it (MariaDB refuses to drop it) and writeItemTerms deletes an
// item's rows by it.

const BATCH = 2000;
/** item_terms' columns as this migration leaves them (20261202001400 adds name and due date). */
const COLUMNS_THEN = ['term', 'item_id', 'kind', 'tag', 'rated_kv'] as const;
const INSERT_CHUNK = 2000;

export async function up(knex: Knex): Promise<void> {
  await rewriteAll(knex, (items) => writeItemTerms(knex, items, COLUMNS_THEN));
}

export async function down(knex: Knex): Promise<void> {
  await rewriteAll(knex, async (items) => {
    await knex('item_terms')
      .whereIn(
        'item_id',
        items.map((i) => i.id),
      )
      .delete();
    const rows = items.flatMap((item) =>
      wholeWordsOf(item).map((term) => ({ term, item_id: item.id, kind: item.kind, tag: item.tag, rated_kv: item.rated_kv })),
    );
    for (let start = 0; start < rows.length; start += INSERT_CHUNK) await knex('item_terms').insert(rows.slice(start, start + INSERT_CHUNK));
  });
}

/** Rewrites the rows of every item, a batch of items at a time, then refreshes the statistics. */
async function rewriteAll(knex: Knex, write: (items: TermSource[]) => Promise<void>): Promise<void> {
  for (let after = 0; ;) {
    const items = (await knex('items')
      .where('id', '>', after)
      .orderBy('id')
      .limit(BATCH)
      .select(...TERM_SOURCE_COLUMNS)) as TermSource[];
    if (items.length === 0) break;
    await write(items);
    after = items[items.length - 1]!.id;
  }
  // Row counts per term change several-fold; the optimizer's index choice depends on them.
  await knex.raw('ANALYZE TABLE item_terms');
}

/**
 * The terms as the previous release stored them: whole words, NFKC and lower case, no accent
 * folding, cut to TERM_MAX_LENGTH. Kept here, frozen, so rolling back restores exactly what
 * that release searches.
 */
function wholeWordsOf(item: TermSource): string[] {
  const text = [item.tag, item.name, item.make, item.model, item.serial, item.location].join(' ');
  const words = text
    .normalize('NFKC')
    .toLowerCase()
    .normalize('NFKC')
    .split(/[^\p{L}\p{N}]+/u)
    .filter((w) => w.length > 0)
    .map((w) => Array.from(w).slice(0, TERM_MAX_LENGTH).join(''));
  return [...new Set(words)];
}
