import type { Knex } from 'knex';

// Append-only trail of every state change. Each row carries the hash of the previous row so an
// officer can verify that nothing was edited or removed afterwards.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (t) => {
    t.bigIncrements('id');
    t.timestamp('at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.integer('actor_id').unsigned().nullable().references('people.id');
    t.string('entity', 40).notNullable();
    t.string('entity_id', 64).notNullable();
    t.string('action', 60).notNullable();
    t.json('before').nullable();
    t.json('after').nullable();
    t.string('prev_hash', 64).notNullable();
    t.string('hash', 64).notNullable();
    t.index(['entity', 'entity_id', 'id']);
    t.index(['actor_id', 'id']);
  });
  // One row holding the newest hash: locking it serialises appends so the chain never forks.
  await knex.schema.createTable('audit_head', (t) => {
    t.tinyint('id').unsigned().primary();
    t.string('hash', 64).notNullable();
  });
  await knex('audit_head').insert({ id: 1, hash: '0'.repeat(64) });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_head');
  await knex.schema.dropTable('audit_events');
}
