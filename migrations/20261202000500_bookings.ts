import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // One row: the lab's rules, editable by officers (every change audited).
  await knex.schema.createTable('lab_rules', (t) => {
    t.tinyint('id').unsigned().primary();
    t.decimal('approval_kv', 7, 2).notNullable();
    t.decimal('energy_threshold_j', 12, 4).notNullable();
    t.decimal('rating_margin_pct', 6, 2).notNullable();
    t.decimal('interlock_kv', 7, 2).notNullable();
    t.decimal('safe_residual_v', 8, 2).notNullable();
    t.integer('early_pickup_min').unsigned().notNullable();
    t.integer('overdue_grace_min').unsigned().notNullable();
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.integer('updated_by').unsigned().nullable().references('people.id');
  });
  // Defaults justified in the README ("Lab rules").
  await knex('lab_rules').insert({
    id: 1,
    approval_kv: 15,
    energy_threshold_j: 0.35,
    rating_margin_pct: 10,
    interlock_kv: 1.5,
    safe_residual_v: 50,
    early_pickup_min: 15,
    overdue_grace_min: 30,
  });

  await knex.schema.createTable('qualifications', (t) => {
    t.integer('person_id').unsigned().primary().references('people.id');
    t.decimal('authorised_kv', 7, 2).notNullable();
    t.date('expires_on').notNullable();
    t.string('notes', 500).notNullable().defaultTo('');
    t.integer('recorded_by').unsigned().nullable().references('people.id');
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });

  await knex.schema.createTable('bookings', (t) => {
    t.increments('id');
    t.integer('person_id').unsigned().notNullable().references('people.id');
    t.enum('status', ['requested', 'awaiting-approval', 'approved', 'refused', 'released', 'returned', 'cancelled']).notNullable();
    t.datetime('starts_at', { precision: 3 }).notNullable();
    t.datetime('ends_at', { precision: 3 }).notNullable();
    t.string('location', 120).notNullable();
    t.string('purpose', 500).notNullable();
    t.decimal('planned_kv', 7, 2).notNullable();
    t.enum('polarity', ['positive', 'negative', 'reversible']).notNullable();
    t.decimal('max_current_ma', 10, 3).notNullable();
    t.integer('people_present').unsigned().notNullable();
    // Bumped whenever plan, items or window change: approvals and checklist runs bind to it.
    t.integer('plan_version').unsigned().notNullable().defaultTo(1);
    t.json('assessment').notNullable();
    t.boolean('approval_required').notNullable();
    t.datetime('released_at', { precision: 3 }).nullable();
    t.datetime('returned_at', { precision: 3 }).nullable();
    t.datetime('cancelled_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['person_id', 'id']);
    t.index(['status', 'ends_at']);
    t.index(['starts_at']);
  });

  await knex.schema.createTable('booking_items', (t) => {
    t.integer('booking_id').unsigned().notNullable().references('bookings.id');
    t.integer('item_id').unsigned().notNullable().references('items.id');
    // Copied from the booking so the overlap check reads one index.
    t.datetime('starts_at', { precision: 3 }).notNullable();
    t.datetime('ends_at', { precision: 3 }).notNullable();
    t.boolean('live').notNullable().defaultTo(true);
    t.primary(['booking_id', 'item_id']);
    t.index(['item_id', 'live', 'starts_at', 'ends_at']);
  });

  await knex.schema.createTable('approvals', (t) => {
    t.increments('id');
    t.integer('booking_id').unsigned().notNullable().references('bookings.id');
    t.integer('officer_id').unsigned().notNullable().references('people.id');
    t.enum('decision', ['approve', 'refuse']).notNullable();
    t.text('conditions').nullable();
    t.text('reason').nullable();
    t.integer('plan_version').unsigned().notNullable();
    t.timestamp('decided_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('voided_at', { precision: 3 }).nullable();
    t.index(['booking_id', 'id']);
  });

  await knex.schema.createTable('booking_scans', (t) => {
    t.integer('booking_id').unsigned().notNullable().references('bookings.id');
    t.integer('item_id').unsigned().notNullable().references('items.id');
    t.integer('scanned_by').unsigned().notNullable().references('people.id');
    t.timestamp('scanned_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.primary(['booking_id', 'item_id']);
  });

  await knex.schema.createTable('checklist_templates', (t) => {
    t.increments('id');
    t.enum('phase', ['pre', 'return']).notNullable();
    t.enum('kind', ['confirm', 'reading', 'photo']).notNullable();
    t.string('text', 300).notNullable();
    t.string('unit', 20).nullable();
    t.decimal('min_value', 14, 4).nullable();
    t.decimal('max_value', 14, 4).nullable();
    t.string('max_from_rule', 30).nullable();
    t.boolean('required').notNullable().defaultTo(true);
    t.decimal('applies_from_kv', 7, 2).nullable();
    t.string('applies_with_kind', 30).nullable();
    t.integer('position').unsigned().notNullable().defaultTo(0);
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['phase', 'active', 'position']);
  });

  await knex.schema.createTable('checklist_runs', (t) => {
    t.increments('id');
    t.integer('booking_id').unsigned().notNullable().references('bookings.id');
    t.enum('phase', ['pre', 'return']).notNullable();
    t.integer('plan_version').unsigned().notNullable();
    t.json('answers').notNullable();
    t.boolean('complete').notNullable();
    t.boolean('within_limits').notNullable();
    t.integer('completed_by').unsigned().notNullable().references('people.id');
    t.timestamp('completed_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['booking_id', 'phase', 'id']);
  });

  await knex.schema.createTable('incidents', (t) => {
    t.increments('id');
    t.integer('booking_id').unsigned().nullable().references('bookings.id');
    t.integer('item_id').unsigned().nullable().references('items.id');
    t.enum('kind', ['damage', 'shock', 'arc-over', 'near-miss']).notNullable();
    t.text('description').notNullable();
    t.integer('reported_by').unsigned().notNullable().references('people.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['item_id', 'id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [
    'incidents',
    'checklist_runs',
    'checklist_templates',
    'booking_scans',
    'approvals',
    'booking_items',
    'bookings',
    'qualifications',
    'lab_rules',
  ]) {
    await knex.schema.dropTable(table);
  }
}
