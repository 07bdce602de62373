import type { Knex } from 'knex';

// audit_events.actor_id loses its foreign key. audit_append inserts the entry while holding the
// chain's one lock (audit_head), and a foreign key makes that insert take a shared lock on the
// actor's people row: any transaction holding that row (a deactivation, a role change) and then
// waiting for something the committing transaction holds deadlocked through the global lock.
// People are never deleted (they are deactivated), so the key protected nothing the chain needs.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_events', (t) => {
    t.dropForeign(['actor_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_events', (t) => {
    t.foreign('actor_id').references('people.id');
  });
}
