import type { Knex } from 'knex';

// The per-person cap on booking photos (services/booking-photos.ts) sums a person's uploads of the
// last 24 hours: an index range instead of every file the person ever sent.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('item_files', (t) => {
    t.index(['uploaded_by', 'created_at'], 'item_files_uploaded_by_created_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('item_files', (t) => {
    t.dropIndex(['uploaded_by', 'created_at'], 'item_files_uploaded_by_created_at_index');
  });
}
