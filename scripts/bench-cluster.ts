// `npm run bench:cluster`: the cluster layout (three Galera nodes, HAProxy, app processes) on this
// machine, measured through the proxy with one and with two app processes:
// - GET /api/session (signed in), 20 connections, BENCH_SECONDS (default 10) each;
// - the counter's release loop (book, 5 scans, pre checklist, release, make-safe checklist,
//   return) at 10 concurrent counters: each request's and each loop's p50/p99;
// - 1,000 bookings of the same items (20 at a time): how many transactions ran again (1213 from
//   lock conflicts or certification) per 1,000, how many ran out of retries (503).
// Its own database (voltcrib_cluster_bench) on the dev cluster's nodes; PORT is the proxy's.
// Every process shares this machine's cores: read the figures with that in mind (README).
import autocannon from 'autocannon';
import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { devCluster } from './lib/galera';
import { ROOT, runCluster, type RunningCluster } from './lib/cluster-run';
import type { Db } from '../server/db';
import { insertKit, qualify } from '../tests/helpers/gear';
import { createPerson } from '../tests/helpers/test-app';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const COUNTERS = 10;

interface Auth {
  cookie: string;
  csrf: string;
}

async function signIn(base: string, email: string, password: string): Promise<Auth> {
  const jar = new Map<string, string>();
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const at = pair!.indexOf('=');
      jar.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
  };
  const first = await fetch(`${base}/api/session`);
  keep(first);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/session`, {
    method: 'POST',
    headers: { cookie: cookie(), 'x-csrf-token': csrfToken, 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  keep(res);
  const body = (await res.json()) as { csrfToken: string };
  if (res.status !== 200) throw new Error(`bench sign-in failed: ${res.status}`);
  return { cookie: cookie(), csrf: body.csrfToken };
}

const pct = (list: number[], q: number) => [...list].sort((a, b) => a - b)[Math.min(list.length - 1, Math.floor(list.length * q))] ?? NaN;

async function sessionRoute(base: string, auth: Auth) {
  const result = await new Promise<autocannon.Result>((resolve, reject) =>
    autocannon({ url: `${base}/api/session`, headers: { cookie: auth.cookie }, connections: 20, duration: SECONDS }, (err, r) =>
      err ? reject(err) : resolve(r),
    ),
  );
  return { reqPerSec: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, non2xx: (result as unknown as { non2xx: number }).non2xx };
}

async function post(base: string, auth: Auth, p: string, body: unknown) {
  const t0 = performance.now();
  const res = await fetch(base + p, {
    method: 'POST',
    headers: { cookie: auth.cookie, 'x-csrf-token': auth.csrf, 'content-type': 'application/json' },
    body: JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, ms: performance.now() - t0, body: text ? (JSON.parse(text) as Record<string, unknown>) : {} };
}

type Line = { id: number; kind: string; min?: number; required: boolean };
const answers = (lines: Line[]) =>
  lines.filter((e) => e.required).map((e) => (e.kind === 'reading' ? { itemId: e.id, value: e.min ?? 0 } : { itemId: e.id, confirmed: true }));

async function releaseLoops(base: string, counters: { auth: Auth; kit: { ids: number[]; tags: string[] } }[]) {
  const requestMs: number[] = [];
  const loopMs: number[] = [];
  const statuses: Record<number, number> = {};
  const until = Date.now() + SECONDS * 2000;
  const step = async (auth: Auth, p: string, body: unknown) => {
    const r = await post(base, auth, p, body);
    requestMs.push(r.ms);
    statuses[r.status] = (statuses[r.status] ?? 0) + 1;
    return r;
  };
  await Promise.all(
    counters.map(async ({ auth, kit }) => {
      while (Date.now() < until) {
        const t0 = performance.now();
        const created = await step(auth, '/api/bookings', {
          itemIds: kit.ids,
          startsAt: new Date(Date.now() - 60_000).toISOString(),
          endsAt: new Date(Date.now() + 3600_000).toISOString(),
          location: 'Bench bay',
          purpose: 'Cluster bench',
          plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 },
        });
        if (created.status !== 201) continue;
        const b = created.body.booking as { id: number; checklist: { pre: Line[]; return: Line[] } };
        for (const tag of kit.tags) await step(auth, `/api/bookings/${b.id}/scans`, { tag });
        await step(auth, `/api/bookings/${b.id}/checklist`, { phase: 'pre', answers: answers(b.checklist.pre) });
        const released = await step(auth, `/api/bookings/${b.id}/release`, {});
        if (released.status === 200) loopMs.push(performance.now() - t0);
        await step(auth, `/api/bookings/${b.id}/checklist`, { phase: 'return', answers: answers(b.checklist.return) });
        await step(auth, `/api/bookings/${b.id}/return`, {});
      }
    }),
  );
  return {
    requests: requestMs.length,
    requestP50: pct(requestMs, 0.5),
    requestP99: pct(requestMs, 0.99),
    loops: loopMs.length,
    loopP50: pct(loopMs, 0.5),
    loopP99: pct(loopMs, 0.99),
    statuses,
  };
}

async function retryCounts(cluster: RunningCluster): Promise<{ retries: number; exhausted: number }> {
  let retries = 0;
  let exhausted = 0;
  for (const app of cluster.apps) {
    const body = (await (await fetch(`http://127.0.0.1:${app.port}/api/health`)).json()) as { retries: { retries: number; exhausted: number } };
    retries += body.retries.retries;
    exhausted += body.retries.exhausted;
  }
  return { retries, exhausted };
}

async function contention(cluster: RunningCluster, auth: Auth, kit: { ids: number[] }) {
  const before = await retryCounts(cluster);
  const statuses: Record<number, number> = {};
  let next = 0;
  const at = new Date(Date.now() + 40 * 24 * 3600_000);
  await Promise.all(
    Array.from({ length: 20 }, async () => {
      while (next < 1000) {
        const i = next++;
        const start = new Date(at.getTime() + (i % 50) * 60_000);
        const r = await post(cluster.url, auth, '/api/bookings', {
          itemIds: kit.ids,
          startsAt: start.toISOString(),
          endsAt: new Date(start.getTime() + 3600_000).toISOString(),
          location: 'Bench bay',
          purpose: `Contention ${i}`,
          plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 },
        });
        statuses[r.status] = (statuses[r.status] ?? 0) + 1;
      }
    }),
  );
  const after = await retryCounts(cluster);
  return { bookings: 1000, retries: after.retries - before.retries, exhausted: after.exhausted - before.exhausted, statuses };
}

async function people(db: Db, count: number) {
  const list = [];
  for (let i = 0; i < count; i += 1) {
    const person = await createPerson(db, { role: 'member' });
    await qualify(db, person.id, 30);
    const kit = await insertKit(db);
    list.push({ person, kit: { ids: kit.all.map((k) => k.id), tags: kit.all.map((k) => k.tag) } });
  }
  return list;
}

async function main(): Promise<void> {
  const layout = { ...devCluster(), database: 'voltcrib_cluster_bench' };
  const results: Record<string, unknown>[] = [];
  for (const appCount of [1, 2]) {
    console.log(`[bench:cluster] ${appCount} app process(es) behind the proxy on ${layout.proxy}…`);
    const cluster = await runCluster(layout, {
      fresh: true,
      appCount,
      appEnv: { LOG_LEVEL: 'warn', LOGIN_RATE_LIMIT: '100000', LOGIN_RATE_LIMIT_PER_ADDRESS: '1000000', SCHEDULER: 'false' },
    });
    const db = cluster.connect(0);
    try {
      const counters = await people(db, COUNTERS + 1);
      const auths: Auth[] = [];
      for (const c of counters) auths.push(await signIn(cluster.url, c.person.email, c.person.password));
      const session = await sessionRoute(cluster.url, auths[0]!);
      console.log(`  session route: ${session.reqPerSec.toFixed(0)} req/s, p50 ${session.p50} ms, p99 ${session.p99} ms`);
      const loop = await releaseLoops(
        cluster.url,
        counters.slice(0, COUNTERS).map((c, i) => ({ auth: auths[i]!, kit: c.kit })),
      );
      console.log(
        `  release loop at ${COUNTERS} counters: ${loop.loops} loops, loop p50 ${loop.loopP50.toFixed(0)} ms / p99 ${loop.loopP99.toFixed(0)} ms; each request p50 ${loop.requestP50.toFixed(0)} ms / p99 ${loop.requestP99.toFixed(0)} ms; ${JSON.stringify(loop.statuses)}`,
      );
      const contended = await contention(cluster, auths[COUNTERS]!, counters[COUNTERS]!.kit);
      console.log(
        `  1,000 contended bookings: ${contended.retries} retries (${contended.exhausted} ran out, answered 503); ${JSON.stringify(contended.statuses)}`,
      );
      results.push({ appCount, session, loop, contended });
    } finally {
      await db.destroy();
      await cluster.stop();
    }
  }
  const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, Node ${process.version}, three Galera nodes + HAProxy + app processes on one machine`;
  console.log(`\n${machine}`);
  console.log(
    '| app processes | session req/s | session p99 ms | release loop p99 ms (10 counters) | request p99 ms | retries per 1,000 contended bookings | ran out (503) |',
  );
  console.log('| --- | --- | --- | --- | --- | --- | --- |');
  for (const r of results as {
    appCount: number;
    session: { reqPerSec: number; p99: number };
    loop: { loopP99: number; requestP99: number };
    contended: { retries: number; exhausted: number };
  }[]) {
    console.log(
      `| ${r.appCount} | ${r.session.reqPerSec.toFixed(0)} | ${r.session.p99} | ${r.loop.loopP99.toFixed(0)} | ${r.loop.requestP99.toFixed(0)} | ${r.contended.retries} | ${r.contended.exhausted} |`,
    );
  }
  mkdirSync(path.join(ROOT, 'bench', 'results'), { recursive: true });
  writeFileSync(path.join(ROOT, 'bench', 'results', 'cluster-latest.json'), JSON.stringify({ at: new Date().toISOString(), machine, results }, null, 2));
  console.log('\nThe database nodes keep running; `npm run cluster:stop` stops them.');
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
