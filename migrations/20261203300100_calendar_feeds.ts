import type { Knex } from 'knex';

// A person's private calendar feed (issue 17): the database keeps only the SHA-256 of the feed's
// token and the nonce the server derives it from with its secret (server/services/calendar-feed.ts),
// so a copy of this table alone opens no feed.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('calendar_feeds', (t) => {
    t.integer('person_id').unsigned().notNullable().primary().references('people.id');
    t.specificType('token_hash', 'CHAR(64)').notNullable().unique();
    t.specificType('nonce', 'CHAR(32)').notNullable();
    t.boolean('approvals').notNullable().defaultTo(false);
    t.boolean('lab_bookings').notNullable().defaultTo(false);
    t.boolean('inspections').notNullable().defaultTo(false);
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('calendar_feeds');
}
