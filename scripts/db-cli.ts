// npm run db:start | db:stop | db:migrate | db:seed — the development database.
import { loadConfig } from '../server/config';
import { createDb } from '../server/db';
import { dbEnv, devInstance } from './lib/instances';
import { startInstance, stopInstance } from './lib/mariadb';
import { migrateLatest, seedDemoIfEmpty } from './lib/migrate';

async function main(command: string | undefined): Promise<void> {
  const options = devInstance();
  if (command === 'stop') {
    const stopped = await stopInstance(options);
    console.log(stopped ? `Stopped the dev database (port ${options.port}).` : 'The dev database was not running.');
    return;
  }
  await startInstance(options);
  if (command === 'start') {
    console.log(`Dev database running on 127.0.0.1:${options.port}.`);
    return;
  }
  const db = createDb(loadConfig({ ...process.env, ...dbEnv(options) }));
  try {
    if (command === 'migrate') console.log(`Applied: ${(await migrateLatest(db)).join(', ') || 'nothing new'}`);
    else if (command === 'seed') console.log((await seedDemoIfEmpty(db)) ? 'Demo data loaded.' : 'Database not empty; demo data not loaded.');
    else throw new Error('usage: db-cli start|stop|migrate|seed');
  } finally {
    await db.destroy();
  }
}

main(process.argv[2]).catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
