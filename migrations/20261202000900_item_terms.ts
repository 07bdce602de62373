import type { Knex } from 'knex';
import { TERM_MAX_LENGTH, TERM_SOURCE_COLUMNS, writeItemTerms, type TermSource } from '../server/services/item-terms';

// Gear search by word: one row per word of an item (see server/services/item-terms.ts), replacing
// the FULLTEXT index. FULLTEXT has to produce every match of a frequent word before the kind,
// voltage and status filters and the tag sort apply; a prefix range over these rows, in an index
// that also holds kind, tag and rated_kv, filters without touching items and sorts few rows.

const BATCH = 2000;
/** item_terms' columns as this migration leaves them (20261202001400 adds name and due date). */
const COLUMNS_THEN = ['term', 'item_id', 'kind', 'tag', 'rated_kv'] as const;

export async function up(knex: Knex): Promise<void> {
  // The copied tag must sort and compare exactly like items.tag (keyset cursors compare it).
  const [[tagColumn]] = (await knex.raw(
    "SELECT COLLATION_NAME AS collation FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'items' AND COLUMN_NAME = 'tag'",
  )) as [{ collation: string }[]];

  await knex.schema.createTable('item_terms', (t) => {
    // Already lower-cased and NFKC-normalised by the app, so compared byte for byte: a prefix
    // LIKE is a plain index range, and "straße"/"strasse" or "prüf"/"pruf" stay distinct keys.
    t.string('term', TERM_MAX_LENGTH).collate('utf8mb4_bin').notNullable();
    t.integer('item_id').unsigned().notNullable().references('items.id').onDelete('CASCADE');
    // Copies of the item's columns, same types; written with the item in one transaction.
    t.enum('kind', ['multiplier', 'hv-supply', 'probe', 'isolation-stand', 'grounding-stick', 'interlock', 'meter', 'other']).notNullable();
    t.string('tag', 32).collate(tagColumn!.collation).notNullable();
    t.decimal('rated_kv', 7, 2).nullable();
    t.primary(['term', 'item_id']);
    // The other words of a search are checked per item; also serves the foreign key and rewrites.
    t.index(['item_id', 'term']);
    // A word and a kind in tag order; a word alone in tag order. rated_kv rides along for minKv.
    t.index(['term', 'kind', 'tag', 'rated_kv']);
    t.index(['term', 'tag', 'rated_kv']);
  });

  for (let after = 0; ;) {
    const items = (await knex('items')
      .where('id', '>', after)
      .orderBy('id')
      .limit(BATCH)
      .select(...TERM_SOURCE_COLUMNS)) as TermSource[];
    if (items.length === 0) break;
    await writeItemTerms(knex, items, COLUMNS_THEN);
    after = items[items.length - 1]!.id;
  }
  await knex.raw('ANALYZE TABLE item_terms');

  await knex.raw('ALTER TABLE items DROP INDEX items_search');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE items ADD FULLTEXT INDEX items_search (tag, name, make, model, serial, location)');
  await knex.schema.dropTable('item_terms');
}
