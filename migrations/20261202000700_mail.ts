import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // Every e-mail is written here in the same transaction as the change that causes it, then sent
  // by a worker holding a lease. `dedupe_key` makes scheduled reminders unique across servers.
  await knex.schema.createTable('outbox', (t) => {
    t.bigIncrements('id');
    t.string('dedupe_key', 191).nullable().unique();
    t.string('kind', 40).notNullable();
    t.string('to_address', 254).notNullable();
    t.string('subject', 200).notNullable();
    t.text('text_body').notNullable();
    t.text('html_body').notNullable();
    t.enum('state', ['pending', 'sending', 'sent', 'failed']).notNullable().defaultTo('pending');
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.datetime('next_attempt_at', { precision: 3 }).notNullable();
    t.string('lease_owner', 64).nullable();
    t.datetime('lease_expires_at', { precision: 3 }).nullable();
    t.text('last_error').nullable();
    t.datetime('sent_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['state', 'next_attempt_at']);
  });

  // One-time links for invitations and password resets; only the SHA-256 of a token is stored.
  await knex.schema.createTable('person_tokens', (t) => {
    t.increments('id');
    t.integer('person_id').unsigned().notNullable().references('people.id');
    t.enum('purpose', ['invitation', 'password-reset']).notNullable();
    t.string('token_hash', 64).notNullable().unique();
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('used_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['person_id', 'purpose']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('person_tokens');
  await knex.schema.dropTable('outbox');
}
