// A project-local MariaDB instance: its own data folder, port and socket, started in its own
// session so Ctrl-C on the app leaves it running. /etc/mysql is never read: every tool gets our
// generated my.cnf as its FIRST argument (`--defaults-file` is only honoured there).
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ensureDebianPackages, MARIADB } from './debian-packages';

export interface InstanceOptions {
  /** Folder name under .data/ and part of the database name: dev, test, bench… */
  name: string;
  port: number;
  database: string;
  user: string;
  password: string;
  /** Buffer pool size; small for tests, larger for the bench. */
  bufferPool?: string;
  /** More [mariadbd] lines (a Galera node's wsrep settings, scripts/lib/galera.ts). */
  extraConfig?: string[];
}

export interface StartOptions {
  /** Extra mariadbd arguments for this start only (`--wsrep-new-cluster` to bootstrap). */
  args?: string[];
  /** How long to wait for the server to answer; a Galera joiner first copies a snapshot. */
  timeoutMs?: number;
  /** Awaited once the server answers, before the database and users are set up (a joiner syncing). */
  untilReady?: (instance: Instance) => Promise<void>;
}

export interface Instance extends InstanceOptions {
  dir: string;
  cnf: string;
  socket: string;
  pidFile: string;
  errorLog: string;
}

const ROOT = path.resolve(__dirname, '..', '..');

export function describeInstance(options: InstanceOptions): Instance {
  const dir = path.join(ROOT, '.data', options.name);
  let socket = path.join(dir, 'mariadb.sock');
  // Unix socket paths are limited to 107 bytes; deep checkouts fall back to a short /tmp path.
  if (Buffer.byteLength(socket) > 100) {
    const digest = createHash('sha1').update(dir).digest('hex').slice(0, 10);
    socket = `/tmp/voltcrib-${digest}.sock`;
  }
  return {
    ...options,
    dir,
    cnf: path.join(dir, 'my.cnf'),
    socket,
    pidFile: path.join(dir, 'mariadbd.pid'),
    errorLog: path.join(dir, 'error.log'),
  };
}

function writeConfig(instance: Instance): void {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  const lines = [
    '[client-server]',
    `port=${instance.port}`,
    `socket=${instance.socket}`,
    '',
    '[mariadbd]',
    `datadir=${path.join(instance.dir, 'data')}`,
    `pid-file=${instance.pidFile}`,
    `log-error=${instance.errorLog}`,
    // Loopback only, never 0.0.0.0: the lab's database is not for the network.
    'bind-address=127.0.0.1',
    'skip-name-resolve',
    'character-set-server=utf8mb4',
    'collation-server=utf8mb4_unicode_ci',
    "default-time-zone='+00:00'",
    'default-storage-engine=InnoDB',
    `innodb_buffer_pool_size=${instance.bufferPool ?? '64M'}`,
    'innodb_log_file_size=48M',
    'max_connections=400',
    // Gear search has its own word table now (item_terms); these two matter only if its migration
    // is rolled back to the FULLTEXT index: tag parts such as "KV" or "01" are two characters
    // long, and words such as "for" or "on" are legitimate parts of gear names.
    'innodb_ft_min_token_size=2',
    'innodb_ft_enable_stopword=OFF',
    // mariadbd refuses to run as root unless told to; running as `mysql` fails on private parents.
    ...(isRoot ? ['user=root'] : []),
    ...(instance.extraConfig ?? []),
  ];
  mkdirSync(instance.dir, { recursive: true });
  writeFileSync(instance.cnf, lines.join('\n') + '\n');
}

function bin(name: string): string {
  for (const dir of ['/usr/bin', '/usr/sbin']) {
    const candidate = path.join(dir, name);
    if (existsSync(candidate)) return candidate;
  }
  return name;
}

/** A killed mariadbd lingers as a zombie for a moment, so "running" reads the process state. */
export function isRunning(instance: Instance): boolean {
  if (!existsSync(instance.pidFile)) return false;
  const pid = Number(readFileSync(instance.pidFile, 'utf8').trim());
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const state = stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3);
    return state !== 'Z' && state !== 'X';
  } catch {
    return false;
  }
}

export function ping(instance: Instance): boolean {
  const result = spawnSync(bin('mariadb-admin'), [`--defaults-file=${instance.cnf}`, '-uroot', 'ping'], {
    stdio: 'ignore',
  });
  return result.status === 0;
}

export function sql(instance: Instance, statements: string): void {
  execFileSync(bin('mariadb'), [`--defaults-file=${instance.cnf}`, '-uroot', '-e', statements], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

async function sleep(ms: number): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve, ms));
}

/** Starts the instance if needed. Returns true when this call started it (so it may stop it). */
export async function startInstance(options: InstanceOptions, start: StartOptions = {}): Promise<{ instance: Instance; started: boolean }> {
  ensureDebianPackages([MARIADB]);
  const instance = describeInstance(options);
  writeConfig(instance);
  const dataDir = path.join(instance.dir, 'data');
  let started = false;

  if (!existsSync(path.join(dataDir, 'mysql'))) {
    mkdirSync(dataDir, { recursive: true });
    execFileSync(bin('mariadb-install-db'), [`--defaults-file=${instance.cnf}`, '--auth-root-authentication-method=normal', '--skip-test-db'], {
      stdio: 'ignore',
    });
  }

  if (!isRunning(instance) || !ping(instance)) {
    const logSize = existsSync(instance.errorLog) ? readFileSync(instance.errorLog).length : 0;
    const child = spawn(bin('mariadbd'), [`--defaults-file=${instance.cnf}`, ...(start.args ?? [])], {
      detached: true, // its own session: Ctrl-C on `npm start` must not stop the database
      stdio: 'ignore',
    });
    child.unref();
    const deadline = Date.now() + (start.timeoutMs ?? 30_000);
    while (!ping(instance)) {
      if (Date.now() > deadline) {
        const log = existsSync(instance.errorLog) ? readFileSync(instance.errorLog, 'utf8').slice(logSize) : '';
        throw new Error(`MariaDB (${instance.name}) did not start on port ${instance.port}.\n${log.slice(-2000)}`);
      }
      await sleep(200);
    }
    started = true;
  }
  await start.untilReady?.(instance);

  const db = instance.database;
  sql(
    instance,
    [
      `CREATE DATABASE IF NOT EXISTS \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      ...APP_HOSTS.map((host) => `CREATE USER IF NOT EXISTS '${instance.user}'@'${host}' IDENTIFIED BY '${instance.password}'`),
      ...grantsOn(instance, db),
    ].join(';'),
  );
  return { instance, started };
}

/** The app connects over loopback TCP (127.0.0.1) or over the instance's Unix socket (localhost). */
const APP_HOSTS = ['127.0.0.1', 'localhost'];

function grantsOn(instance: Instance, db: string): string[] {
  return APP_HOSTS.map((host) => `GRANT ALL PRIVILEGES ON \`${db}\`.* TO '${instance.user}'@'${host}'`);
}

export async function stopInstance(options: InstanceOptions, hardAfterMs?: number): Promise<boolean> {
  const instance = describeInstance(options);
  if (!existsSync(instance.cnf) || !isRunning(instance)) return false;
  const pid = Number(readFileSync(instance.pidFile, 'utf8').trim());
  process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + (hardAfterMs ?? 30_000);
  while (isRunning(instance) && Date.now() < deadline) await sleep(100);
  // A Galera node can hang in shutdown after leaving the group; its data is safe on disk and
  // the next start recovers its position, so it is killed rather than left holding its files.
  if (hardAfterMs !== undefined && isRunning(instance)) {
    process.kill(pid, 'SIGKILL');
    while (isRunning(instance)) await sleep(100);
  }
  return true;
}

/** Hard kill, for the fault suite: the database vanishes mid-request. */
export function killInstance(options: InstanceOptions): void {
  const instance = describeInstance(options);
  if (!isRunning(instance)) return;
  const pid = Number(readFileSync(instance.pidFile, 'utf8').trim());
  process.kill(pid, 'SIGKILL');
}

/** Drops and recreates the instance's database (tests start from an empty, freshly migrated one). */
export function resetDatabase(options: InstanceOptions): void {
  const instance = describeInstance(options);
  const db = instance.database;
  sql(
    instance,
    [`DROP DATABASE IF EXISTS \`${db}\``, `CREATE DATABASE \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`, ...grantsOn(instance, db)].join(';'),
  );
}
