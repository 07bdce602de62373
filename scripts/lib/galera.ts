// A three-node MariaDB Galera cluster on loopback, each node a project-local instance
// (scripts/lib/mariadb.ts) with its own folder under .data/<cluster>/nodeN, its own client port
// and its own group-communication, IST and SST ports. Debian's galera-4 provider does the
// replication; snapshots for a fresh joiner go by mariabackup (Debian's wsrep_sst_mariabackup).
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { type DebianPackage, ensureDebianPackages } from './debian-packages';
import { describeInstance, isRunning, killInstance, ping, sql, startInstance, stopInstance, type Instance, type InstanceOptions } from './mariadb';

export const GALERA: DebianPackage = { name: 'galera-4', probe: '/usr/lib/galera/libgalera_smm.so' };
// rsync's snapshot daemon drops to "nobody" when the node runs as root and cannot write the
// joiner's data folder; mariabackup streams the snapshot over socat as the server's own user.
export const MARIABACKUP: DebianPackage = { name: 'mariadb-backup', probe: '/usr/bin/mariabackup' };
export const SOCAT: DebianPackage = { name: 'socat', probe: '/usr/bin/socat' };

/** The donor's snapshot account (loopback only, created on bootstrap, replicated to joiners). */
const SST_USER = 'voltcrib_sst';
const SST_PASSWORD = 'voltcrib-sst-local-only';

export interface NodePorts {
  /** The MariaDB client port. */
  sql: number;
  /** Group communication (gmcast), incremental state transfer, full snapshot transfer. */
  gcomm: number;
  ist: number;
  sst: number;
  /** The node's health answer for the balancers (scripts/lib/galera-health.ts). */
  health: number;
}

export interface ClusterLayout {
  /** Folder under .data/ holding node1…node3. */
  name: string;
  database: string;
  nodes: NodePorts[];
  /** The TCP balancer in front of the nodes that the app processes connect to. */
  dbBalancer: number;
  /** The app processes' own ports, behind the HTTP proxy. */
  apps: number[];
  /** The HTTP proxy's port (PORT). */
  proxy: number;
}

const credentials = { user: 'voltcrib', password: 'voltcrib-local-only' };

/** keepalive ≤ check period ≤ suspect ≤ inactive (Galera's own ordering of these timeouts). */
const FAILURE_DETECTION =
  'evs.keepalive_period=PT0.5S;evs.inactive_check_period=PT0.5S;evs.suspect_timeout=PT1.5S;evs.inactive_timeout=PT3S;evs.install_timeout=PT1.5S';

/** Node N's ports are 44N1…44N4 (dev) or 44N5…44N8 (the test suite's cluster). */
function nodePorts(sqlBase: number, galeraBase: number): NodePorts[] {
  return [0, 1, 2].map((i) => ({
    sql: sqlBase + i,
    gcomm: galeraBase + 10 * i,
    ist: galeraBase + 10 * i + 1,
    sst: galeraBase + 10 * i + 2,
    health: galeraBase + 10 * i + 3,
  }));
}

/** `npm run cluster`: nodes 3441–3443, balancer 3444, apps 8141–8142, proxy on PORT (8090). */
export function devCluster(env: NodeJS.ProcessEnv = process.env): ClusterLayout {
  return { name: 'cluster', database: 'voltcrib_cluster', nodes: nodePorts(3441, 4441), dbBalancer: 3444, apps: [8141, 8142], proxy: Number(env.PORT ?? 8090) };
}

/** `npm run test:cluster`: a cluster of its own beside the dev one. */
export function testCluster(): ClusterLayout {
  return { name: 'cluster-test', database: 'voltcrib_cluster_test', nodes: nodePorts(3445, 4445), dbBalancer: 3448, apps: [8143, 8144], proxy: 8145 };
}

export function nodeOptions(layout: ClusterLayout, index: number): InstanceOptions {
  const ports = layout.nodes[index]!;
  const peers = layout.nodes.map((n) => `127.0.0.1:${n.gcomm}`).join(',');
  return {
    name: path.join(layout.name, `node${index + 1}`),
    port: ports.sql,
    database: layout.database,
    bufferPool: '64M',
    ...credentials,
    extraConfig: [
      'wsrep_on=ON',
      `wsrep_provider=${GALERA.probe}`,
      `wsrep_cluster_name=voltcrib-${layout.name}`,
      `wsrep_cluster_address=gcomm://${peers}`,
      `wsrep_node_name=node${index + 1}`,
      `wsrep_node_address=127.0.0.1:${ports.gcomm}`,
      // On loopback a killed node is gone for good, not a slow link: it is declared dead after
      // 1.5 s of silence instead of Galera's 5 s (writes wait for the membership change). The
      // defaults suit separate machines (README "Several machines").
      `wsrep_provider_options="gmcast.listen_addr=tcp://127.0.0.1:${ports.gcomm};ist.recv_addr=127.0.0.1:${ports.ist};gcache.size=256M;${FAILURE_DETECTION}"`,
      `wsrep_sst_receive_address=127.0.0.1:${ports.sst}`,
      'wsrep_sst_method=mariabackup',
      `wsrep_sst_auth=${SST_USER}:${SST_PASSWORD}`,
      // Galera needs row events and interleaved auto-increment locks; it adds its own offsets.
      'binlog_format=ROW',
      'innodb_autoinc_lock_mode=2',
      // Every table must have a primary key (Galera certifies by key); CREATE TABLE without one fails.
      'wsrep_mode=REQUIRED_PRIMARY_KEY',
      // Causal reads: a SELECT waits until this node has applied everything the cluster committed
      // before it, so a session row written through one node is seen through the next.
      'wsrep_sync_wait=1',
      // Durability comes from the other nodes holding the write set; flushing the log every
      // second is the usual Galera setting (MariaDB KB "Configuring MariaDB Galera Cluster").
      'innodb_flush_log_at_trx_commit=2',
      'wsrep_slave_threads=2',
    ],
  };
}

export function nodeInstances(layout: ClusterLayout): Instance[] {
  return layout.nodes.map((_, i) => describeInstance(nodeOptions(layout, i)));
}

/** One value from a node (the first column of the first row), or null when it does not answer. */
export function queryValue(instance: Instance, statement: string): string | null {
  try {
    const out = execFileSync('/usr/bin/mariadb', [`--defaults-file=${instance.cnf}`, '-uroot', '-N', '-B', '-e', statement], {
      stdio: ['ignore', 'pipe', 'ignore'],
      timeout: 5000,
    });
    return out.toString().trim().split('\n')[0]?.split('\t').pop() ?? null;
  } catch {
    return null;
  }
}

export interface NodeState {
  running: boolean;
  /** wsrep_local_state_comment: Synced, Joining, Donor/Desynced… */
  state: string | null;
  clusterSize: number;
  ready: boolean;
}

export function nodeState(instance: Instance): NodeState {
  if (!isRunning(instance) || !ping(instance)) return { running: isRunning(instance), state: null, clusterSize: 0, ready: false };
  const state = queryValue(instance, "SHOW GLOBAL STATUS LIKE 'wsrep_local_state_comment'");
  const size = Number(queryValue(instance, "SHOW GLOBAL STATUS LIKE 'wsrep_cluster_size'") ?? 0);
  const ready = queryValue(instance, "SHOW GLOBAL STATUS LIKE 'wsrep_ready'") === 'ON';
  return { running: true, state, clusterSize: size, ready };
}

async function sleep(ms: number): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve, ms));
}

export async function waitSynced(instance: Instance, clusterSize: number, timeoutMs = 180_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const s = nodeState(instance);
    if (s.ready && s.state === 'Synced' && s.clusterSize >= clusterSize) return;
    if (Date.now() > deadline)
      throw new Error(`${instance.name}: not synced in a cluster of ${clusterSize} (state ${s.state ?? 'down'}, size ${s.clusterSize})`);
    await sleep(300);
  }
}

interface GraState {
  seqno: number;
  safeToBootstrap: boolean;
}

function grastate(instance: Instance): GraState | null {
  const file = path.join(instance.dir, 'data', 'grastate.dat');
  if (!existsSync(file)) return null;
  const text = readFileSync(file, 'utf8');
  return { seqno: Number(/seqno:\s*(-?\d+)/.exec(text)?.[1] ?? -1), safeToBootstrap: /safe_to_bootstrap:\s*1/.test(text) };
}

/**
 * Which node starts a new cluster when none is running: the one Galera marked safe (the last to
 * stop cleanly), else the one with the most history (highest seqno), else node1 on first start.
 */
function bootstrapIndex(instances: Instance[]): number {
  const states = instances.map(grastate);
  const safe = states.findIndex((s) => s?.safeToBootstrap);
  if (safe >= 0) return safe;
  let best = 0;
  states.forEach((s, i) => {
    if ((s?.seqno ?? -1) > (states[best]?.seqno ?? -1)) best = i;
  });
  // After every node crashed no one is marked safe; Galera asks the operator to mark the most
  // advanced node by hand (MariaDB KB "Getting Started with MariaDB Galera Cluster"). We do it.
  const file = path.join(instances[best]!.dir, 'data', 'grastate.dat');
  if (existsSync(file)) writeFileSync(file, readFileSync(file, 'utf8').replace(/safe_to_bootstrap:\s*0/, 'safe_to_bootstrap: 1'));
  return best;
}

/** Starts whatever nodes are down: bootstraps one when none runs, then joins the rest; waits for 3 synced. */
export async function startCluster(layout: ClusterLayout, log: (line: string) => void = console.log): Promise<Instance[]> {
  ensureDebianPackages([GALERA, MARIABACKUP, SOCAT]);
  const instances = nodeInstances(layout);
  const anyRunning = instances.some((i) => isRunning(i) && ping(i));
  let order = instances.map((_, i) => i);
  if (!anyRunning) {
    const first = bootstrapIndex(instances);
    log(`[cluster] bootstrapping a new cluster on node${first + 1}`);
    await startInstance(nodeOptions(layout, first), { args: ['--wsrep-new-cluster'], timeoutMs: 120_000, untilReady: (i) => waitSynced(i, 1) });
    sql(
      instances[first]!,
      [
        `CREATE USER IF NOT EXISTS '${SST_USER}'@'localhost' IDENTIFIED BY '${SST_PASSWORD}'`,
        `GRANT RELOAD, PROCESS, LOCK TABLES, BINLOG MONITOR ON *.* TO '${SST_USER}'@'localhost'`,
      ].join(';'),
    );
    order = [first, ...order.filter((i) => i !== first)];
  }
  for (const i of order) {
    if (isRunning(instances[i]!) && ping(instances[i]!)) continue;
    log(`[cluster] node${i + 1} joining (127.0.0.1:${layout.nodes[i]!.sql})`);
    // A joiner answers only after its state transfer (IST or a full rsync snapshot).
    await startInstance(nodeOptions(layout, i), { timeoutMs: 300_000, untilReady: (n) => waitSynced(n, 2) });
  }
  for (const instance of instances) await waitSynced(instance, instances.length);
  log(`[cluster] ${instances.length} nodes synced`);
  return instances;
}

/** Starts one node again (after a kill): it rejoins the running cluster and catches up. */
export async function restartNode(layout: ClusterLayout, index: number): Promise<Instance> {
  const { instance } = await startInstance(nodeOptions(layout, index), { timeoutMs: 300_000, untilReady: (n) => waitSynced(n, 2) });
  await waitSynced(instance, layout.nodes.length);
  return instance;
}

/** Stops the nodes one after another; the last one stopped is the one marked safe to bootstrap. */
export async function stopCluster(layout: ClusterLayout): Promise<number> {
  let stopped = 0;
  for (let i = layout.nodes.length - 1; i >= 0; i -= 1) if (await stopInstance(nodeOptions(layout, i), 60_000)) stopped += 1;
  return stopped;
}

export function killNode(layout: ClusterLayout, index: number): void {
  killInstance(nodeOptions(layout, index));
}
