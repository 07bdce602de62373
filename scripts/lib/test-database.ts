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
