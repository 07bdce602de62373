// `npm start`: one command from a fresh machine to a running lab server with demo data.
// Safe to run twice: the database is reused, migrations are idempotent, demo data only goes into
// an empty database, and the web app is rebuilt only when its sources changed.
import { loadConfig } from '../server/config';
import { createDb } from '../server/db';
import { startServer } from '../server/index';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../seeds/01-people';
import { buildWebIfStale } from './build-web';
import { dbEnv, devInstance } from './lib/instances';
import { startInstance } from './lib/mariadb';
import { migrateLatest, seedDemoIfEmpty } from './lib/migrate';

async function main(): Promise<void> {
  const t0 = Date.now();
  const options = devInstance();
  const { instance, started } = await startInstance(options);
  console.log(`[db] MariaDB ${started ? 'started' : 'already running'} on 127.0.0.1:${instance.port} (data in ${instance.dir})`);

  const env = { ...process.env, ...dbEnv(options) };
  const config = loadConfig(env);
  const db = createDb(config);
  try {
    const applied = await migrateLatest(db);
    if (applied.length > 0) console.log(`[db] applied ${applied.length} migration(s)`);
    if (config.env !== 'production' && (await seedDemoIfEmpty(db))) console.log('[db] demo data loaded (invented lab)');
  } finally {
    await db.destroy();
  }

  await buildWebIfStale();
  const app = await startServer(env);
  const url = `http://${app.config.host === '0.0.0.0' ? '127.0.0.1' : app.config.host}:${app.port}`;
  console.log(`\nVoltcrib is running: ${url}   (ready in ${((Date.now() - t0) / 1000).toFixed(1)} s)`);
  console.log(`Demo sign-ins (password "${DEMO_PASSWORD}"):`);
  for (const p of DEMO_PEOPLE.slice(0, 3)) console.log(`  ${p.role.padEnd(8)} ${p.email}`);
  console.log('Ctrl-C stops the server; `npm run db:stop` stops the database.\n');

  const stop = () => {
    console.log('\nStopping the server (the database keeps running; `npm run db:stop` stops it).');
    app.close().finally(() => process.exit(0));
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
