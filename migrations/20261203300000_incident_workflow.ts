import type { Knex } from 'knex';

// Incidents become a workflow (issue 17): any signed-in person reports one (kind, severity, when,
// where, what happened, the items involved), an officer reviews it (open → under review →
// closed) and closes it only with a cause and corrective actions. The items involved move to
// their own table, since one report can name several; the older single `item_id` values are
// copied there (the column itself goes in a later migration, once nothing writes it).
export async function up(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE incidents MODIFY kind ENUM('shock', 'arc-over', 'burn', 'damage', 'near-miss', 'other') NOT NULL");
  await knex.schema.alterTable('incidents', (t) => {
    t.enum('severity', ['low', 'moderate', 'serious', 'severe']).notNullable().defaultTo('moderate');
    t.enum('status', ['open', 'under-review', 'closed']).notNullable().defaultTo('open');
    t.timestamp('occurred_at', { precision: 3 }).nullable();
    t.string('location', 200).notNullable().defaultTo('');
    t.boolean('tag_out').notNullable().defaultTo(false);
    t.text('cause').nullable();
    t.integer('closed_by').unsigned().nullable().references('people.id');
    t.timestamp('closed_at', { precision: 3 }).nullable();
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['status', 'id']);
    t.index(['reported_by', 'id']);
    t.index(['booking_id', 'id']);
  });
  await knex.raw('UPDATE incidents SET occurred_at = created_at, tag_out = (kind = ?)', ['damage']);
  await knex.raw('ALTER TABLE incidents MODIFY occurred_at TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3)');

  await knex.schema.createTable('incident_items', (t) => {
    t.integer('incident_id').unsigned().notNullable().references('incidents.id');
    t.integer('item_id').unsigned().notNullable().references('items.id');
    t.primary(['incident_id', 'item_id']);
    t.index(['item_id', 'incident_id']);
  });
  await knex.raw('INSERT INTO incident_items (incident_id, item_id) SELECT id, item_id FROM incidents WHERE item_id IS NOT NULL');

  await knex.schema.createTable('incident_actions', (t) => {
    t.increments('id');
    t.integer('incident_id').unsigned().notNullable().references('incidents.id');
    t.string('action', 500).notNullable();
    t.integer('owner_id').unsigned().notNullable().references('people.id');
    t.date('due_on').notNullable();
    t.timestamp('done_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['incident_id', 'id']);
    // Past-due actions for Today and the digest: open ones by due date, and a person's own.
    t.index(['done_at', 'due_on']);
    t.index(['owner_id', 'done_at', 'due_on']);
  });

  // Incident photos are stored files like item and booking files, with a third possible owner.
  await knex.raw('ALTER TABLE item_files DROP CONSTRAINT item_files_one_owner');
  await knex.schema.alterTable('item_files', (t) => {
    t.integer('incident_id').unsigned().nullable().references('incidents.id');
    t.index(['incident_id', 'id']);
  });
  await knex.raw(
    'ALTER TABLE item_files ADD CONSTRAINT item_files_one_owner CHECK ((item_id IS NOT NULL) + (booking_id IS NOT NULL) + (incident_id IS NOT NULL) = 1)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE item_files DROP CONSTRAINT item_files_one_owner');
  await knex('item_files').whereNotNull('incident_id').delete();
  await knex.schema.alterTable('item_files', (t) => {
    t.dropForeign(['incident_id']);
    t.dropIndex(['incident_id', 'id']);
    t.dropColumn('incident_id');
  });
  await knex.raw('ALTER TABLE item_files ADD CONSTRAINT item_files_one_owner CHECK ((item_id IS NULL) <> (booking_id IS NULL))');
  await knex.schema.dropTable('incident_actions');
  // The older shape holds one item per row: keep the first item of each report.
  await knex.raw('UPDATE incidents i SET item_id = (SELECT MIN(item_id) FROM incident_items ii WHERE ii.incident_id = i.id) WHERE item_id IS NULL');
  await knex.schema.dropTable('incident_items');
  // Kinds the older shape has no word for become the nearest one it has.
  await knex.raw("UPDATE incidents SET kind = 'near-miss' WHERE kind IN ('burn', 'other')");
  await knex.raw("ALTER TABLE incidents MODIFY kind ENUM('damage', 'shock', 'arc-over', 'near-miss') NOT NULL");
  await knex.schema.alterTable('incidents', (t) => {
    t.dropIndex(['status', 'id']);
    t.dropIndex(['reported_by', 'id']);
    t.dropIndex(['booking_id', 'id']);
    for (const c of ['severity', 'status', 'occurred_at', 'location', 'tag_out', 'cause', 'closed_at', 'updated_at']) t.dropColumn(c);
    t.dropForeign(['closed_by']);
    t.dropColumn('closed_by');
  });
}
