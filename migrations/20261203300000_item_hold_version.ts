import type { Knex } from 'knex';

// A counter every transaction that locks item rows bumps (lockItems, server/services/booking-holds.ts).
// On one MariaDB server the row lock alone orders two bookings of the same item. On a Galera
// cluster a lock is local to its node, and a transaction on another node is stopped only when
// both wrote the same row: writing the locked rows makes certification see every such pair, so
// one of them fails with 1213 and runs again (deadlock-retry.ts) seeing the other's booking.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('items', (t) => {
    t.integer('hold_version').unsigned().notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('items', (t) => {
    t.dropColumn('hold_version');
  });
}
