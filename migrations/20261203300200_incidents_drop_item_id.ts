import type { Knex } from 'knex';

// The items of an incident live in incident_items (20261203300000); the return path now writes
// there too, so the older single-item column goes. Any row written since that migration by the
// older return path is copied over first.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('INSERT IGNORE INTO incident_items (incident_id, item_id) SELECT id, item_id FROM incidents WHERE item_id IS NOT NULL');
  await knex.schema.alterTable('incidents', (t) => {
    t.dropForeign(['item_id']);
    t.dropIndex(['item_id', 'id']);
    t.dropColumn('item_id');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('incidents', (t) => {
    t.integer('item_id').unsigned().nullable().references('items.id');
    t.index(['item_id', 'id']);
  });
  await knex.raw('UPDATE incidents i SET item_id = (SELECT MIN(item_id) FROM incident_items ii WHERE ii.incident_id = i.id)');
}
