import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('items', (t) => {
    t.increments('id');
    // Items are retired, never deleted, so a tag is never issued twice.
    t.string('tag', 32).notNullable().unique();
    t.enum('kind', ['multiplier', 'hv-supply', 'probe', 'isolation-stand', 'grounding-stick', 'interlock', 'meter', 'other']).notNullable();
    t.string('name', 120).notNullable();
    t.string('make', 80).notNullable().defaultTo('');
    t.string('model', 80).notNullable().defaultTo('');
    t.string('serial', 80).notNullable().defaultTo('');
    t.string('location', 120).notNullable();
    t.text('notes').notNullable();
    t.json('ratings').notNullable();
    // Denormalised from ratings so "rated at or above N kV" is an index range scan.
    t.decimal('rated_kv', 7, 2).nullable();
    t.enum('status', ['in-service', 'out-of-service', 'retired']).notNullable().defaultTo('in-service');
    t.string('status_reason', 500).nullable();
    t.integer('inspection_interval_days').unsigned().notNullable();
    t.date('last_inspected_on').nullable();
    t.date('next_inspection_due').nullable();
    t.integer('photo_file_id').unsigned().nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['kind', 'tag']);
    t.index(['status', 'tag']);
    t.index(['rated_kv', 'id']);
    t.index(['next_inspection_due', 'id']);
    t.index(['name', 'id']);
  });
  await knex.raw('ALTER TABLE items ADD FULLTEXT INDEX items_search (tag, name, make, model, serial, location)');

  await knex.schema.createTable('tag_sequences', (t) => {
    t.string('code', 8).primary();
    t.integer('last_value').unsigned().notNullable();
  });

  await knex.schema.createTable('inspections', (t) => {
    t.increments('id');
    t.integer('item_id').unsigned().notNullable().references('items.id');
    t.date('inspected_on').notNullable();
    t.integer('inspector_id').unsigned().notNullable().references('people.id');
    t.enum('result', ['pass', 'fail']).notNullable();
    t.json('readings').notNullable();
    t.text('notes').notNullable();
    t.date('next_due').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['item_id', 'inspected_on']);
  });

  await knex.schema.createTable('item_files', (t) => {
    t.increments('id');
    t.integer('item_id').unsigned().notNullable().references('items.id');
    t.enum('kind', ['photo', 'document']).notNullable();
    t.string('file_name', 200).notNullable();
    t.string('content_type', 100).notNullable();
    t.integer('size_bytes').unsigned().notNullable();
    t.string('storage_key', 200).notNullable().unique();
    t.string('sha256', 64).notNullable();
    t.integer('uploaded_by').unsigned().nullable().references('people.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['item_id', 'id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('item_files');
  await knex.schema.dropTable('inspections');
  await knex.schema.dropTable('tag_sequences');
  await knex.schema.dropTable('items');
}
