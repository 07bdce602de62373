import type { Knex } from 'knex';

// Each booking keeps the tags of its items, in tag order, as a JSON array. The bookings list shows
// them on every row; gathering them per row with a subquery cost MariaDB about three quarters of
// the list's time (26 subqueries a page). A booking's items change only through the bookings
// service, which writes this column in the same statement group (server/services/booking-rows.ts
// `bookingItemTags`); tags themselves never change (items are retired, never renamed by tag).
export async function up(knex: Knex): Promise<void> {
  // At most 30 items of at most 32 characters: well under TEXT's limit. Raw SQL because knex drops
  // the default of a TEXT column, and rows written outside the service (tests, imports) need it.
  await knex.raw("ALTER TABLE bookings ADD COLUMN item_tags TEXT NOT NULL DEFAULT '[]'");
  await knex.raw(`
    UPDATE bookings AS b
    SET b.item_tags = COALESCE(
      (SELECT JSON_ARRAYAGG(i.tag ORDER BY i.tag) FROM booking_items AS bi JOIN items AS i ON i.id = bi.item_id WHERE bi.booking_id = b.id),
      '[]')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bookings', (t) => {
    t.dropColumn('item_tags');
  });
}
