// The cluster's one HAProxy (Debian's haproxy package): HTTP on PORT in front of the app
// processes (health-checked on /api/health), and TCP in front of the Galera nodes for the app
// processes' database connections (health-checked on each node's synced answer).
import { spawn, spawnSync } from 'node:child_process';
import { connect } from 'node:net';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { type DebianPackage, ensureDebianPackages } from './debian-packages';
import type { ClusterLayout } from './galera';

export const HAPROXY: DebianPackage = { name: 'haproxy', probe: '/usr/sbin/haproxy' };

export interface Proxy {
  pid: number;
  stop(): Promise<void>;
}

export function haproxyConfig(layout: ClusterLayout, statsSocket: string): string {
  const apps = layout.apps.map((port, i) => `  server app${i + 1} 127.0.0.1:${port} check inter 500ms fall 3 rise 2`);
  const nodes = layout.nodes.map(
    (n, i) => `  server node${i + 1} 127.0.0.1:${n.sql} check port ${n.health} inter 500ms fall 2 rise 3 on-marked-down shutdown-sessions`,
  );
  return [
    'global',
    '  maxconn 4000',
    // Read by serverStates() (and by an operator: `echo "show stat" | socat - UNIX:<path>`).
    `  stats socket ${statsSocket} mode 600 level user`,
    '',
    'defaults',
    '  timeout connect 2s',
    '  timeout client 60s',
    '  timeout server 60s',
    // While the cluster replaces a lost node, writes wait a second or two: an app answering
    // slowly is still in; an app that is gone refuses the check at once.
    '  timeout check 5s',
    '',
    '# The lab: browsers and counters on one port. A request whose connection to an app could',
    '# not be made goes to the other app; one already sent is never sent twice (it may have',
    '# written), so a process killed mid-request costs that request a 502 and nothing else.',
    'frontend http',
    `  bind 127.0.0.1:${layout.proxy}`,
    '  mode http',
    '  option forwardfor',
    '  default_backend apps',
    '',
    'backend apps',
    '  mode http',
    '  balance roundrobin',
    '  option httpchk GET /api/health',
    '  http-check expect status 200',
    '  option redispatch',
    '  retries 3',
    '  retry-on conn-failure',
    ...apps,
    '',
    "# The app processes' database connections, spread over every synced node. A node that",
    '# leaves (killed, desynced, non-primary) has its connections cut, so pools reconnect elsewhere.',
    'listen galera',
    `  bind 127.0.0.1:${layout.dbBalancer}`,
    '  mode tcp',
    '  balance leastconn',
    '  option redispatch',
    '  retries 3',
    '  timeout client 8h',
    '  timeout server 8h',
    '  option httpchk GET /',
    '  http-check expect status 200',
    ...nodes,
    '',
  ].join('\n');
}

export function proxyFiles(layout: ClusterLayout, root: string) {
  const dir = path.join(root, '.data', layout.name);
  return { cfg: path.join(dir, 'haproxy.cfg'), pid: path.join(dir, 'haproxy.pid'), sock: path.join(dir, 'haproxy.sock'), dir };
}

export async function startProxy(layout: ClusterLayout, root: string): Promise<Proxy> {
  ensureDebianPackages([HAPROXY]);
  const files = proxyFiles(layout, root);
  writeFileSync(files.cfg, haproxyConfig(layout, files.sock));
  const check = spawnSync(HAPROXY.probe, ['-c', '-q', '-f', files.cfg], { encoding: 'utf8' });
  if (check.status !== 0) throw new Error(`haproxy refused its configuration:\n${check.stdout}${check.stderr}`);
  // -db: stays in the foreground as our child, so it ends with the launcher.
  const child = spawn(HAPROXY.probe, ['-db', '-f', files.cfg], { stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr?.on('data', (chunk: Buffer) => {
    stderr = (stderr + chunk.toString()).slice(-4000);
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  await new Promise((resolve) => setTimeout(resolve, 300));
  if (child.exitCode !== null) throw new Error(`haproxy exited at start:\n${stderr}`);
  writeFileSync(files.pid, `${child.pid}\n`);
  return {
    pid: child.pid!,
    async stop() {
      if (child.exitCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}

/** A proxy left by a launcher that was itself killed. */
export function stopStrayProxy(layout: ClusterLayout, root: string): void {
  const { pid } = proxyFiles(layout, root);
  if (!existsSync(pid)) return;
  const value = Number(readFileSync(pid, 'utf8').trim());
  try {
    if (readFileSync(`/proc/${value}/cmdline`, 'utf8').includes('haproxy')) process.kill(value, 'SIGTERM');
  } catch {
    // not running
  }
}

/** Each backend server's state as the proxy sees it now: { 'apps/app1': 'UP', 'galera/node2': 'DOWN', … }. */
export function serverStates(layout: ClusterLayout, root: string): Promise<Record<string, string>> {
  const { sock } = proxyFiles(layout, root);
  return new Promise((resolve) => {
    let text = '';
    const socket = connect(sock, () => socket.write('show stat\n'));
    socket.on('data', (chunk) => {
      text += chunk.toString();
    });
    socket.on('error', () => resolve({}));
    socket.on('end', () => {
      const states: Record<string, string> = {};
      for (const line of text.split('\n').slice(1)) {
        const [proxy, server, ...rest] = line.split(',');
        if (!proxy || !server || server === 'FRONTEND' || server === 'BACKEND') continue;
        states[`${proxy}/${server}`] = rest[15] ?? '';
      }
      resolve(states);
    });
  });
}

/** Waits until the proxy sends traffic to every named server ('apps/app1'…). */
export async function waitUntilUp(layout: ClusterLayout, root: string, servers: string[], timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const states = await serverStates(layout, root);
    if (servers.every((s) => states[s] === 'UP')) return;
    if (Date.now() > deadline) throw new Error(`the proxy has not taken ${servers.join(', ')} in: ${JSON.stringify(states)}`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}
