import type { Knex } from 'knex';

// The table connect-session-knex reads and writes (created here, not by the store, so the schema
// is versioned). `person_id` is a generated column so a person's sessions can be ended at once.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid', 255).primary();
    t.json('sess').notNullable();
    t.datetime('expired').notNullable().index();
  });
  await knex.raw(
    "ALTER TABLE sessions ADD COLUMN person_id INT UNSIGNED AS (JSON_VALUE(sess, '$.passport.user.id')) VIRTUAL, ADD INDEX sessions_person_id_index (person_id)",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
