import type { Knex } from 'knex';

// When the status last changed and how the last inspection went: a tagged-out item may only be
// cleared after a passing inspection recorded since it was tagged out.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('items', (t) => {
    t.timestamp('status_changed_at', { precision: 3 }).nullable();
    t.enum('last_inspection_result', ['pass', 'fail']).nullable();
  });
  await knex.raw(
    'UPDATE items i SET last_inspection_result = (SELECT result FROM inspections x WHERE x.item_id = i.id ORDER BY x.inspected_on DESC, x.id DESC LIMIT 1)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('items', (t) => {
    t.dropColumn('status_changed_at');
    t.dropColumn('last_inspection_result');
  });
}
