// `npm run bench`: the product at scale on its own database, driven over loopback by autocannon.
// Every figure is also given as a ratio to a reference route measured in the same run (one
// primary-key SELECT through the same knex pool, no session), because the machine is shared and
// absolute numbers swing between runs. Results: stdout table + bench/results/<time>.json.
import autocannon from 'autocannon';
import express from 'express';
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { createApp } from '../server/app';
import { loadConfig } from '../server/config';
import { createDb, type Db } from '../server/db';
import { createLogger } from '../server/logger';
import { startFakeS3 } from '../server/storage/fake-s3';
import { benchInstance, dbEnv } from './lib/instances';
import { BENCH_PASSWORD, KITS, seedBench } from './lib/bench-seed';
import { startInstance } from './lib/mariadb';
import { migrateLatest } from './lib/migrate';

const ROOT = path.resolve(__dirname, '..');
const DURATION_S = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 50;

interface Row {
  route: string;
  reqPerSec: number;
  p50Ms: number;
  p99Ms: number;
  ratio: number;
  statuses: Record<string, number>;
  serverMsMedian?: number;
}

function mainBundle(): { file: string; rawBytes: number; gzipBytes: number } | null {
  const dir = path.join(ROOT, 'dist', '_expo', 'static', 'js', 'web');
  try {
    const file = readdirSync(dir).find((f) => f.startsWith('entry-') && f.endsWith('.js'));
    if (!file) return null;
    const bytes = readFileSync(path.join(dir, file));
    return { file, rawBytes: bytes.length, gzipBytes: gzipSync(bytes, { level: 9 }).length };
  } catch {
    return null;
  }
}

async function signIn(base: string, email: string): Promise<{ cookie: string; csrf: string }> {
  const first = await fetch(`${base}/api/session`);
  let cookie = (first.headers.get('set-cookie') ?? '').split(';')[0]!;
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/session`, { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password: BENCH_PASSWORD }) });
  if (res.status !== 200) throw new Error(`bench sign-in failed: ${res.status}`);
  cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
  const body = (await res.json()) as { csrfToken: string };
  return { cookie, csrf: body.csrfToken };
}

function run(opts: autocannon.Options): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    autocannon({ connections: CONNECTIONS, duration: DURATION_S, ...opts }, (err, result) => (err ? reject(err) : resolve(result)));
  });
}

function statusCounts(result: autocannon.Result): Record<string, number> {
  const r = result as unknown as Record<string, number>;
  return { '2xx': r['2xx'] ?? 0, '4xx': r['4xx'] ?? 0, '5xx': r['5xx'] ?? 0, errors: result.errors, timeouts: result.timeouts };
}

async function serverTime(base: string, url: string, headers: Record<string, string>, n = 25): Promise<number> {
  const times: number[] = [];
  for (let i = 0; i < n; i += 1) {
    const res = await fetch(`${base}${url}`, { headers });
    await res.arrayBuffer();
    const dur = /dur=([\d.]+)/.exec(res.headers.get('server-timing') ?? '')?.[1];
    if (dur) times.push(Number(dur));
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)] ?? NaN;
}

/** The counter loop: book a kit, scan its five items, pre-energize checklist, release, make safe, return. */
async function releaseLoop(base: string, auth: { cookie: string; csrf: string }, kits: string[][], kitIds: number[][]) {
  const headers = { cookie: auth.cookie, 'x-csrf-token': auth.csrf, 'content-type': 'application/json' };
  const call = async (method: string, url: string, body?: unknown) => {
    const res = await fetch(`${base}${url}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    const json = (await res.json()) as Record<string, unknown>;
    return { status: res.status, json };
  };
  const latencies: number[] = [];
  const statuses: Record<string, number> = {};
  const deadline = Date.now() + DURATION_S * 1000;
  let loops = 0;
  const count = (s: number) => (statuses[`${Math.floor(s / 100)}xx`] = (statuses[`${Math.floor(s / 100)}xx`] ?? 0) + 1);
  await Promise.all(
    kits.slice(0, CONNECTIONS).map(async (tags, k) => {
      while (Date.now() < deadline) {
        const t0 = performance.now();
        const start = new Date(Date.now() - 60_000).toISOString();
        const end = new Date(Date.now() + 3600_000).toISOString();
        const created = await call('POST', '/api/bookings', { itemIds: kitIds[k], startsAt: start, endsAt: end, location: 'Bench bay', purpose: 'Bench release loop', plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 } });
        count(created.status);
        if (created.status !== 201) continue;
        const booking = created.json.booking as { id: number; checklist: { pre: { id: number; kind: string; required: boolean; min?: number; max?: number }[]; return: { id: number; kind: string; required: boolean; min?: number; max?: number }[] } };
        for (const tag of tags) count((await call('POST', `/api/bookings/${booking.id}/scans`, { tag })).status);
        const answer = (list: typeof booking.checklist.pre) => list.filter((e) => e.required).map((e) => (e.kind === 'reading' ? { itemId: e.id, value: e.min ?? 0 } : { itemId: e.id, confirmed: true }));
        count((await call('POST', `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: answer(booking.checklist.pre) })).status);
        count((await call('POST', `/api/bookings/${booking.id}/release`)).status);
        latencies.push(performance.now() - t0);
        loops += 1;
        // Put the kit back so the next loop can book it again.
        count((await call('POST', `/api/bookings/${booking.id}/checklist`, { phase: 'return', answers: answer(booking.checklist.return) })).status);
        count((await call('POST', `/api/bookings/${booking.id}/return`, {})).status);
      }
    }),
  );
  latencies.sort((a, b) => a - b);
  return { loopsPerSec: loops / DURATION_S, p50: latencies[Math.floor(latencies.length * 0.5)] ?? NaN, p99: latencies[Math.floor(latencies.length * 0.99)] ?? NaN, statuses };
}

async function explainLists(db: Db, base: string, headers: Record<string, string>): Promise<{ url: string; sql: string; scans: string[] }[]> {
  const urls = ['/api/items?q=corona&kind=probe&minKv=50', '/api/items', '/api/items?kind=probe&minKv=50&sort=ratedKv', '/api/items?due=overdue&sort=nextDue', '/api/bookings?mine=1', '/api/bookings?status=overdue', '/api/audit?limit=50'];
  const out: { url: string; sql: string; scans: string[] }[] = [];
  for (const url of urls) {
    const captured: { sql: string; bindings: unknown[] }[] = [];
    const listener = (q: { sql: string; bindings: unknown[] }) => captured.push(q);
    db.on('query', listener);
    await (await fetch(`${base}${url}`, { headers })).arrayBuffer();
    db.removeListener('query', listener);
    for (const q of captured.filter((c) => /^select/i.test(c.sql) && !/from `sessions`/i.test(c.sql))) {
      const [rows] = (await db.raw(`EXPLAIN ${q.sql}`, q.bindings as never)) as [{ table: string; type: string; key: string | null; rows: number }[]];
      out.push({ url, sql: q.sql.slice(0, 160), scans: rows.map((r) => `${r.table}:${r.type}${r.key ? `(${r.key})` : ''}~${r.rows}`) });
    }
  }
  return out;
}

async function main(): Promise<void> {
  const options = benchInstance();
  await startInstance(options);
  const config = { ...loadConfig({ ...process.env, ...dbEnv(options), LOG_LEVEL: 'silent', LOGIN_RATE_LIMIT: '1000', DB_POOL_MAX: '30' }) };
  const db = createDb(config);
  await migrateLatest(db);
  if (Number((await db('items').count({ n: '*' }).first())?.n) < 50_000) await seedBench(db);
  const s3 = await startFakeS3({ directory: path.join(ROOT, '.data', 'bench-s3'), port: 0, bucket: config.s3.bucket });
  const app = createApp({ db, config: { ...config, s3: { ...config.s3, endpoint: s3.endpoint } }, logger: createLogger('silent') });

  // The reference: one primary-key SELECT through the same pool, mounted only here.
  const outer = express();
  const maxId = Number((await db('items').max({ m: 'id' }).first())?.m);
  outer.get('/bench/reference', async (_req, res) => {
    res.json(await db('items').where({ id: 1 + Math.floor(Math.random() * maxId) }).first('id', 'tag', 'name'));
  });
  outer.use(app);
  const server = outer.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  const member = await signIn(base, 'bench-10@voltcrib.example');
  const headers = { cookie: member.cookie };
  const kitRows = await db('items').where('tag', 'like', 'BK-%').orderBy('tag').select('id', 'tag');
  const kits: string[][] = [];
  const kitIds: number[][] = [];
  for (let k = 0; k < KITS; k += 1) {
    const rows = kitRows.filter((r) => r.tag.startsWith(`BK-${String(k).padStart(3, '0')}-`));
    kits.push(rows.map((r) => r.tag));
    kitIds.push(rows.map((r) => r.id));
  }
  // Free any kit left released by an interrupted earlier run.
  await db('booking_items').whereIn('item_id', kitRows.map((r) => r.id)).update({ live: false });

  const rows: Row[] = [];
  const measure = async (route: string, opts: autocannon.Options, serverUrl?: string) => {
    const result = await run(opts);
    const row: Row = { route, reqPerSec: result.requests.average, p50Ms: result.latency.p50, p99Ms: result.latency.p99, ratio: 0, statuses: statusCounts(result) };
    if (serverUrl) row.serverMsMedian = await serverTime(base, serverUrl, headers);
    rows.push(row);
    console.log(`[bench] ${route}: ${row.reqPerSec.toFixed(0)} req/s, p50 ${row.p50Ms} ms, p99 ${row.p99Ms} ms`);
  };

  const lastKit = KITS - 1;
  await measure('reference: primary-key SELECT, no session', { url: `${base}/bench/reference` });
  await measure('GET /api/session (signed in)', { url: `${base}/api/session`, headers });
  await measure('GET /api/items?q=corona&kind=probe&minKv=50', { url: `${base}/api/items?q=corona&kind=probe&minKv=50`, headers }, '/api/items?q=corona&kind=probe&minKv=50');
  await measure('GET /api/bookings?mine=1', { url: `${base}/api/bookings?mine=1`, headers }, '/api/bookings?mine=1');
  await measure('POST /api/assessments', {
    url: `${base}/api/assessments`,
    method: 'POST',
    headers: { ...headers, 'x-csrf-token': member.csrf, 'content-type': 'application/json' },
    body: JSON.stringify({ itemIds: kitIds[lastKit], plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 } }),
  });
  const contention = new Date(Date.now() + 30 * 24 * 3600_000);
  await measure('POST /api/bookings (50 clients, same items)', {
    url: `${base}/api/bookings`,
    method: 'POST',
    headers: { ...headers, 'x-csrf-token': member.csrf, 'content-type': 'application/json' },
    body: JSON.stringify({ itemIds: kitIds[lastKit - 1], startsAt: contention.toISOString(), endsAt: new Date(contention.getTime() + 3600_000).toISOString(), location: 'Bench bay', purpose: 'Contention', plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 } }),
  });
  const loop = await releaseLoop(base, member, kits, kitIds);
  rows.push({ route: 'release loop (book, 5 scans, checklist, release) per loop', reqPerSec: loop.loopsPerSec, p50Ms: Math.round(loop.p50), p99Ms: Math.round(loop.p99), ratio: 0, statuses: loop.statuses });

  const reference = rows[0]!.reqPerSec;
  for (const row of rows) row.ratio = row.reqPerSec / reference;
  const explains = await explainLists(db, base, headers);
  const bundle = mainBundle();

  const table = [
    '| route | req/s | ratio to reference | p50 ms | p99 ms | server ms (median) | statuses |',
    '| --- | --- | --- | --- | --- | --- | --- |',
    ...rows.map((r) => `| ${r.route} | ${r.reqPerSec.toFixed(r.reqPerSec < 10 ? 2 : 0)} | ${r.ratio.toFixed(2)} | ${r.p50Ms} | ${r.p99Ms} | ${r.serverMsMedian?.toFixed(1) ?? ''} | ${Object.entries(r.statuses).filter(([, v]) => v).map(([k, v]) => `${k}:${v}`).join(' ')} |`),
  ].join('\n');
  const machine = `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}, ${(os.totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}, ${DURATION_S} s per route, ${CONNECTIONS} connections`;
  console.log(`\n${machine}\n\n${table}\n`);
  if (bundle) console.log(`main web bundle ${bundle.file}: ${(bundle.rawBytes / 1024).toFixed(0)} KB raw, ${(bundle.gzipBytes / 1024).toFixed(0)} KB gzip`);
  console.log('\nEXPLAIN of every list query:');
  for (const e of explains) console.log(`  ${e.url}\n    ${e.scans.join('  ')}`);

  mkdirSync(path.join(ROOT, 'bench', 'results'), { recursive: true });
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const json = { at: new Date().toISOString(), machine, rows, bundle, explains, table };
  writeFileSync(path.join(ROOT, 'bench', 'results', `${stamp}.json`), JSON.stringify(json, null, 2));
  writeFileSync(path.join(ROOT, 'bench', 'results', 'latest.json'), JSON.stringify(json, null, 2));
  server.close();
  await s3.close();
  await db.destroy();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
