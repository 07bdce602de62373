import type { Db } from '../../server/db';

export async function migrateLatest(db: Db): Promise<string[]> {
  const [, applied] = (await db.migrate.latest()) as [number, string[]];
  return applied;
}

/** Loads the demo data, but only into an empty database (never over real records). */
export async function seedDemoIfEmpty(db: Db): Promise<boolean> {
  const row = await db('people').count<{ n: number }[]>({ n: '*' }).first();
  if (Number(row?.n ?? 0) > 0) return false;
  await db.seed.run();
  return true;
}
