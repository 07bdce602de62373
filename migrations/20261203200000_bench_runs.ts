import type { Knex } from 'knex';

// The bench log: what each released test actually did. Readings are stored as entered (DOUBLE:
// a meter's digits, not a rounded decimal), current in mA and thrust in mN with the unit each was
// typed in. Flags are stored as computed when the run was written, so what the officer was told
// stays on record; derived figures are recomputed from the readings on every read.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('bench_runs', (t) => {
    t.increments('id');
    t.integer('booking_id').unsigned().notNullable().references('bookings.id');
    // 1, 2, 3… within the booking, allocated under the booking's row lock.
    t.integer('number').unsigned().notNullable();
    t.integer('revision').unsigned().notNullable().defaultTo(1);
    t.integer('recorded_by').unsigned().notNullable().references('people.id');
    t.datetime('recorded_at', { precision: 3 }).notNullable();
    t.datetime('updated_at', { precision: 3 }).notNullable();
    t.double('applied_kv').notNullable();
    t.enum('polarity', ['positive', 'negative']).notNullable();
    t.double('current_ma').notNullable();
    t.enum('current_unit', ['mA', 'uA']).notNullable();
    t.double('gap_mm').notNullable();
    t.integer('stages').unsigned().nullable();
    t.double('velocity_mps').nullable();
    t.double('thrust_mn').nullable();
    t.enum('thrust_unit', ['mN', 'gf']).notNullable();
    t.double('mass_g').nullable();
    t.double('outlet_area_cm2').nullable();
    t.double('temperature_c').nullable();
    t.double('pressure_kpa').nullable();
    t.double('humidity_pct').nullable();
    t.string('notes', 1000).notNullable().defaultTo('');
    t.integer('photo_file_id').unsigned().nullable().references('item_files.id');
    t.double('wire_radius_mm').nullable();
    t.double('collector_radius_mm').nullable();
    t.double('surface_factor').nullable();
    t.json('flags').notNullable();
    t.datetime('deleted_at', { precision: 3 }).nullable();
    t.integer('deleted_by').unsigned().nullable().references('people.id');
    t.unique(['booking_id', 'number']);
  });

  // Edits and deletions keep the run as it was: one row per superseded revision.
  await knex.schema.createTable('bench_run_revisions', (t) => {
    t.increments('id');
    t.integer('run_id').unsigned().notNullable().references('bench_runs.id');
    t.integer('revision').unsigned().notNullable();
    t.enum('action', ['edited', 'deleted']).notNullable();
    t.json('before').notNullable();
    t.string('reason', 500).notNullable();
    t.integer('edited_by').unsigned().notNullable().references('people.id');
    t.datetime('edited_at', { precision: 3 }).notNullable();
    t.unique(['run_id', 'revision']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('bench_run_revisions');
  await knex.schema.dropTable('bench_runs');
}
