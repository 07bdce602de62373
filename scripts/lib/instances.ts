// The database instances the scripts start. Each has its own folder, port and database, so the
// dev instance, the test instance and the bench instance can run side by side.
import { loadConfig, type Config } from '../../server/config';
import { describeInstance, type InstanceOptions } from './mariadb';

const credentials = { user: 'voltcrib', password: 'voltcrib-local-only' };

/** A non-default port gets its own data folder, so two checkouts or runs never share one. */
function folder(base: string, port: number, defaultPort: number): string {
  return port === defaultPort ? base : `${base}-${port}`;
}

export function devInstance(env: NodeJS.ProcessEnv = process.env): InstanceOptions {
  const port = Number(env.DB_PORT ?? 3307);
  return { name: folder('dev', port, 3307), port, database: 'voltcrib_dev', ...credentials };
}

export function testInstance(env: NodeJS.ProcessEnv = process.env): InstanceOptions {
  const port = Number(env.TEST_DB_PORT ?? 3308);
  return { name: folder('test', port, 3308), port, database: 'voltcrib_test', ...credentials };
}

export function benchInstance(env: NodeJS.ProcessEnv = process.env): InstanceOptions {
  const port = Number(env.BENCH_DB_PORT ?? 3309);
  return {
    name: folder('bench', port, 3309),
    port,
    database: 'voltcrib_bench',
    bufferPool: '256M',
    ...credentials,
  };
}

/** `npm run bench:web`: the demo data on an instance of its own, emptied on every run. */
export function benchWebInstance(env: NodeJS.ProcessEnv = process.env): InstanceOptions {
  const port = Number(env.BENCH_WEB_DB_PORT ?? 3329);
  return { name: folder('bench-web', port, 3329), port, database: 'voltcrib_bench_web', ...credentials };
}

/** The environment a server process needs to reach an instance. */
export function dbEnv(options: InstanceOptions): Record<string, string> {
  return {
    DB_HOST: '127.0.0.1',
    DB_PORT: String(options.port),
    DB_SOCKET: describeInstance(options).socket,
    DB_NAME: options.database,
    DB_USER: options.user,
    DB_PASSWORD: options.password,
  };
}

/** The configuration the bench's processes run with: the bench instance, quiet, no sign-in limit. */
export function benchConfig(env: NodeJS.ProcessEnv = process.env): Config {
  return loadConfig({ ...env, ...dbEnv(benchInstance(env)), LOG_LEVEL: 'silent', LOGIN_RATE_LIMIT: '1000', DB_POOL_MAX: '30' });
}
