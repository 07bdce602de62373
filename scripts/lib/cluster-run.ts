// Everything `npm run cluster` runs, as a library so the cluster tests and the bench start the
// same thing: the Galera nodes (scripts/lib/galera.ts), their health answers, one HAProxy for
// HTTP and for the database, shared mail and file stores, and the app processes.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, openSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { loadConfig } from '../../server/config';
import { createDb, type Db } from '../../server/db';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { startFakeS3, type FakeS3 } from '../../server/storage/fake-s3';
import { startCluster, nodeInstances, type ClusterLayout } from './galera';
import { startHealthServer, type HealthServer } from './galera-health';
import { startProxy, stopStrayProxy, waitUntilUp, type Proxy } from './haproxy';
import { resetDatabase, type Instance } from './mariadb';
import { migrateLatest, seedDemoIfEmpty } from './migrate';

export const ROOT = path.resolve(__dirname, '..', '..');

export interface ClusterOptions {
  /** Drop and recreate the database first (the tests); otherwise migrate and seed an empty one. */
  fresh?: boolean;
  seed?: boolean;
  /** How many app processes (1 or 2; the bench compares them). */
  appCount?: number;
  /** Extra environment for the app processes (rate limits, scheduler, mail polling…). */
  appEnv?: Record<string, string>;
  log?: (line: string) => void;
}

export class AppProcess {
  child: ChildProcess | null = null;
  private restarts = 0;
  readonly logFile: string;

  constructor(
    readonly index: number,
    readonly port: number,
    private readonly env: Record<string, string>,
    dir: string,
    private readonly layout?: ClusterLayout,
  ) {
    this.logFile = path.join(dir, `app${index + 1}.log`);
  }

  get pid(): number | undefined {
    return this.child?.pid;
  }

  /** Starts the process and waits until its /api/health answers 200. */
  async start(timeoutMs = 90_000): Promise<void> {
    const out = openSync(this.logFile, 'a');
    // One node process (tsx as a loader, not a wrapper), so a kill reaches the server itself.
    this.child = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'server', 'index.ts')], {
      cwd: ROOT,
      env: this.env as NodeJS.ProcessEnv,
      stdio: ['ignore', out, out],
    });
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline) {
      if (this.child?.exitCode !== null) throw new Error(`app${this.index + 1} exited at start; see ${this.logFile}`);
      if (await healthy(this.port)) {
        // Started again after a kill: ready once the proxy sends it requests.
        if (this.layout && this.restarts++ > 0) await waitUntilUp(this.layout, ROOT, [`apps/app${this.index + 1}`]);
        return;
      }
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
    throw new Error(`app${this.index + 1} did not answer on ${this.port}; see ${this.logFile}`);
  }

  /** kill -9: the process vanishes mid-request. */
  kill(): void {
    this.child?.kill('SIGKILL');
  }

  async stop(): Promise<void> {
    const child = this.child;
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
    child.kill('SIGTERM');
    const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
    await exited;
    clearTimeout(timer);
  }
}

export async function healthy(port: number): Promise<boolean> {
  try {
    const res = await fetch(`http://127.0.0.1:${port}/api/health`, { signal: AbortSignal.timeout(1500) });
    return res.status === 200;
  } catch {
    return false;
  }
}

export interface RunningCluster {
  layout: ClusterLayout;
  nodes: Instance[];
  apps: AppProcess[];
  url: string;
  mail: FakeSmtp | null;
  /** A database handle straight to node1 (migrations, test checks). */
  connect(nodeIndex?: number): Db;
  /** Stops the app processes, the proxy and the health answers; the nodes keep running. */
  stop(): Promise<void>;
}

/** The session secret every app process shares, made once per cluster folder. */
function sessionSecret(dir: string): string {
  const file = path.join(dir, 'session-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(24).toString('hex') + '\n', { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

export function nodeDb(layout: ClusterLayout, index: number): Db {
  const instance = nodeInstances(layout)[index]!;
  return createDb(
    loadConfig({ DB_SOCKET: instance.socket, DB_NAME: layout.database, DB_USER: 'voltcrib', DB_PASSWORD: 'voltcrib-local-only', DB_POOL_MAX: '10' }),
  );
}

export async function runCluster(layout: ClusterLayout, options: ClusterOptions = {}): Promise<RunningCluster> {
  const log = options.log ?? console.log;
  const dir = path.join(ROOT, '.data', layout.name);
  mkdirSync(dir, { recursive: true });
  const nodes = await startCluster(layout, log);

  if (options.fresh) resetDatabase(nodeOptionsFor(layout, nodes[0]!));
  const db = nodeDb(layout, 0);
  try {
    const applied = await migrateLatest(db);
    if (applied.length > 0) log(`[cluster] applied ${applied.length} migration(s)`);
    if (options.seed && (await seedDemoIfEmpty(db))) log('[cluster] demo data loaded (invented lab)');
  } finally {
    await db.destroy();
  }

  const started: { health: HealthServer[]; proxy: Proxy | null; mail: FakeSmtp | null; s3: FakeS3 | null } = { health: [], proxy: null, mail: null, s3: null };
  const apps: AppProcess[] = [];
  const stop = async () => {
    await Promise.all(apps.map((a) => a.stop()));
    await started.proxy?.stop();
    await Promise.all(started.health.map((h) => h.close()));
    await started.mail?.close();
    await started.s3?.close();
  };
  try {
    for (const [i, instance] of nodes.entries()) started.health.push(await startHealthServer(instance, layout.nodes[i]!.health));
    stopStrayProxy(layout, ROOT);
    started.proxy = await startProxy(layout, ROOT);
    // One mail server and one file store for every process, as a real deployment has.
    let smtpUrl = process.env.SMTP_URL;
    if (!smtpUrl) {
      started.mail = await startFakeSmtp({ port: 0 });
      smtpUrl = started.mail.url;
    }
    let s3Endpoint = process.env.S3_ENDPOINT;
    if (!s3Endpoint) {
      started.s3 = await startFakeS3({ directory: path.join(dir, 's3'), port: 0, bucket: 'voltcrib-files' });
      s3Endpoint = started.s3.endpoint;
    }
    const env: Record<string, string> = {};
    for (const [k, v] of Object.entries(process.env)) if (v !== undefined && !k.startsWith('DB_') && k !== 'PORT') env[k] = v;
    Object.assign(env, {
      NODE_ENV: 'development',
      HOST: '127.0.0.1',
      PUBLIC_URL: `http://127.0.0.1:${layout.proxy}`,
      TRUST_PROXY: 'true',
      DB_HOST: '127.0.0.1',
      DB_PORT: String(layout.dbBalancer),
      DB_NAME: layout.database,
      DB_USER: 'voltcrib',
      DB_PASSWORD: 'voltcrib-local-only',
      SMTP_URL: smtpUrl,
      S3_ENDPOINT: s3Endpoint,
      SESSION_SECRET: sessionSecret(dir),
      // Several processes: no process may trust its own copy of a session row (session-cache.ts).
      SESSION_CACHE_MS: '0',
      ...(options.appEnv ?? {}),
    });
    const count = options.appCount ?? layout.apps.length;
    for (let i = 0; i < count; i += 1) apps.push(new AppProcess(i, layout.apps[i]!, { ...env, PORT: String(layout.apps[i]) }, dir, layout));
    await Promise.all(apps.map((a) => a.start()));
    await waitUntilUp(
      layout,
      ROOT,
      apps.map((a) => `apps/app${a.index + 1}`),
    );
  } catch (error) {
    await stop();
    throw error;
  }
  return { layout, nodes, apps, url: `http://127.0.0.1:${layout.proxy}`, mail: started.mail, connect: (i = 0) => nodeDb(layout, i), stop };
}

function nodeOptionsFor(layout: ClusterLayout, instance: Instance) {
  return { name: instance.name, port: instance.port, database: layout.database, user: instance.user, password: instance.password };
}
