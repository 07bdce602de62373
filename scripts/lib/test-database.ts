// The test database starts empty and migrated on every run, so tests never depend on leftovers.
import { loadConfig } from '../../server/config';
import { createDb } from '../../server/db';
import { dbEnv } from './instances';
import { resetDatabase, type InstanceOptions } from './mariadb';

export async function recreateDatabase(options: InstanceOptions): Promise<void> {
  resetDatabase(options);
  const db = createDb(loadConfig(dbEnv(options)));
  try {
    await db.migrate.latest();
  } finally {
    await db.destroy();
  }
}

/**
 * The mail suites count messages in the fake SMTP server, so they get a database of their own:
 * approval requests from every other suite (one per officer) would otherwise queue ahead of theirs.
 */
export const MAIL_TEST_DATABASE = 'voltcrib_test_mail';

export async function recreateMailDatabase(options: InstanceOptions): Promise<void> {
  await recreateDatabase({ ...options, database: MAIL_TEST_DATABASE });
}

/**
 * The model-based gate test edits lab rules and checklist lines, which every booking in the
 * database reads: it gets a database of its own so the other suites never see its edits.
 */
export const MODEL_TEST_DATABASE = 'voltcrib_test_model';

export async function recreateModelDatabase(options: InstanceOptions): Promise<void> {
  await recreateDatabase({ ...options, database: MODEL_TEST_DATABASE });
}
