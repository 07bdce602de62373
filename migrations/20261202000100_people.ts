import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('groups', (t) => {
    t.increments('id');
    t.string('name', 120).notNullable().unique();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
  await knex.schema.createTable('people', (t) => {
    t.increments('id');
    t.string('email', 254).notNullable().unique();
    t.string('name', 120).notNullable();
    t.enum('role', ['member', 'officer', 'manager']).notNullable().defaultTo('member');
    t.integer('group_id').unsigned().nullable().references('groups.id').onDelete('SET NULL');
    // Null until an invited person sets a password.
    t.string('password_hash', 100).nullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('last_sign_in_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('people');
  await knex.schema.dropTable('groups');
}
