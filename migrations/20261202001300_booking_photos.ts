import type { Knex } from 'knex';

// Photos taken at the counter for a booking's checklist live in the same table as item files, so
// every stored file has one id and GET /api/files/:id serves both. A file belongs to exactly one
// owner: an item or a booking, never both and never neither.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE item_files MODIFY item_id INT UNSIGNED NULL');
  await knex.schema.alterTable('item_files', (t) => {
    t.integer('booking_id').unsigned().nullable().references('bookings.id');
    t.index(['booking_id', 'id']);
  });
  await knex.raw('ALTER TABLE item_files ADD CONSTRAINT item_files_one_owner CHECK ((item_id IS NULL) <> (booking_id IS NULL))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE item_files DROP CONSTRAINT item_files_one_owner');
  // Booking photos have no place in the older shape; their stored objects stay in the bucket.
  await knex('item_files').whereNull('item_id').delete();
  await knex.schema.alterTable('item_files', (t) => {
    t.dropForeign(['booking_id']);
    t.dropIndex(['booking_id', 'id']);
    t.dropColumn('booking_id');
  });
  await knex.raw('ALTER TABLE item_files MODIFY item_id INT UNSIGNED NOT NULL');
}
