import type { Knex } from 'knex';

// The counters of sign-in, password-reset and invitation throttling (server/auth/throttle.ts),
// in the layout rate-limiter-flexible's MySQL store reads and writes: `expire` is epoch
// milliseconds. Created here rather than by the library, so the schema is versioned; the
// index lets the scheduler purge expired counters without a scan.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    'CREATE TABLE rate_limits (`key` VARCHAR(255) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL, `points` INT NOT NULL DEFAULT 0, `expire` BIGINT UNSIGNED NULL, PRIMARY KEY (`key`), INDEX rate_limits_expire_index (`expire`)) ENGINE = InnoDB',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_limits');
}
