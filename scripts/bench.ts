// `npm run bench`: the product at scale on its own database, driven over loopback by autocannon
// from this process, while the server runs in a process of its own (scripts/bench-server.ts).
// Every figure is also given as a ratio to a reference route (one primary-key SELECT through the
// same knex pool, no session) measured just before and just after it, because the machine is
// shared and absolute numbers swing between and within runs. Results: stdout table +
// bench/results/<time>.json.
import autocannon from 'autocannon';
import { fork, type ChildProcess } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { createDb } from '../server/db';
import type { BenchServerMessage } from './bench-server';
import { benchConfig, benchInstance } from './lib/instances';
import { BENCH_PASSWORD, KITS, seedBench } from './lib/bench-seed';
import { startInstance } from './lib/mariadb';
import { migrateLatest } from './lib/migrate';

const ROOT = path.resolve(__dirname, '..');
const DURATION_S = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 50;
/** How long the reference runs before each route. */
const REFERENCE_S = Math.max(3, Math.round(DURATION_S / 2));
/** BENCH_ONLY=session,search measures just the routes whose key is listed (the reference always). */
const ONLY = process.env.BENCH_ONLY?.split(',').filter(Boolean) ?? null;
const LIST_URLS = [
  '/api/items?q=corona&kind=probe&minKv=50',
  '/api/items?q=c&sort=name',
  '/api/items?q=corona&kind=probe&sort=nextDue',
  '/api/items?q=corona&status=out-of-service&sort=name',
  '/api/items',
  '/api/items?kind=probe&minKv=50&sort=ratedKv',
  '/api/items?due=overdue&sort=nextDue',
  '/api/bookings?mine=1',
  '/api/bookings?status=overdue',
  '/api/audit?limit=50',
];

interface Row {
  route: string;
  reqPerSec: number;
  p50Ms: number;
  p99Ms: number;
  ratio: number;
  statuses: Record<string, number>;
  serverMsMedian?: number;
  /** Server process CPU time per request, microseconds. */
  serverCpuUs?: number;
  /** The mean of the reference's req/s measured just before and just after this route: the ratio's denominator. */
  referenceReqPerSec?: number;
  /** Those two reference runs, before and after, to show how far the machine drifted meanwhile. */
  referenceAround?: [number, number];
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
  const res = await fetch(`${base}/api/session`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email, password: BENCH_PASSWORD }),
  });
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

type ChecklistLine = { id: number; kind: string; required: boolean; min?: number; max?: number };
interface LoopBooking {
  id: number;
  checklist: { pre: ChecklistLine[]; return: ChecklistLine[] };
}
/** What one connection carries through a loop (autocannon starts it afresh for each loop). */
interface LoopContext {
  kit?: number;
  booking?: LoopBooking;
  startedAt?: number;
}

/** Every required line answered: confirmations confirmed, readings at their lower limit. */
const answersFor = (list: ChecklistLine[]) =>
  list.filter((e) => e.required).map((e) => (e.kind === 'reading' ? { itemId: e.id, value: e.min ?? 0 } : { itemId: e.id, confirmed: true }));

/**
 * The counter loop: book a kit, scan its five items, pre-energize checklist, release, make-safe
 * checklist, return. Driven by autocannon like every other route: each of the 50 connections sends
 * the ten requests in turn with its own kit, carried in the connection's context. (The fetch loop
 * it replaces spent about 1 ms of CPU per request in the bench process, on the two cores the
 * server needs.)
 */
async function releaseLoop(base: string, auth: { cookie: string; csrf: string }, kits: string[][], kitIds: number[][]) {
  const freeKits = kits.map((_, k) => k);
  const loopMs: number[] = [];
  const step = (
    build: (ctx: LoopContext) => { path: string; body?: unknown } | null,
    after?: (status: number, body: string, ctx: LoopContext) => void,
  ): autocannon.SequenceRequest => ({
    method: 'POST',
    setupRequest: (request, context) => {
      const built = build(context as LoopContext);
      return built && { ...request, method: 'POST', path: built.path, body: JSON.stringify(built.body ?? {}) };
    },
    ...(after ? { onResponse: (status: number, body: string, context: Record<string, unknown>) => after(status, body, context as LoopContext) } : {}),
  });
  // Later steps of a loop whose booking was refused are skipped: the sequence starts over.
  const ofBooking = (path: (booking: LoopBooking) => string, body?: (booking: LoopBooking, ctx: LoopContext) => unknown) => (ctx: LoopContext) =>
    ctx.booking ? { path: path(ctx.booking), body: body?.(ctx.booking, ctx) } : null;

  const requests = [
    step(
      (ctx) => {
        // A kit nobody is using; should none be free, any kit (the server refuses the overlap).
        ctx.kit = freeKits.shift() ?? Math.floor(Math.random() * kits.length);
        ctx.startedAt = performance.now();
        const startsAt = new Date(Date.now() - 60_000).toISOString();
        const endsAt = new Date(Date.now() + 3600_000).toISOString();
        return {
          path: '/api/bookings',
          body: {
            itemIds: kitIds[ctx.kit],
            startsAt,
            endsAt,
            location: 'Bench bay',
            purpose: 'Bench release loop',
            plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 },
          },
        };
      },
      (status, body, ctx) => {
        if (status === 201) ctx.booking = (JSON.parse(body) as { booking: LoopBooking }).booking;
        else if (ctx.kit !== undefined) freeKits.push(ctx.kit);
      },
    ),
    ...[0, 1, 2, 3, 4].map((j) =>
      step(
        ofBooking(
          (b) => `/api/bookings/${b.id}/scans`,
          (_b, ctx) => ({ tag: kits[ctx.kit!]![j] }),
        ),
      ),
    ),
    step(
      ofBooking(
        (b) => `/api/bookings/${b.id}/checklist`,
        (b) => ({ phase: 'pre', answers: answersFor(b.checklist.pre) }),
      ),
    ),
    step(
      ofBooking((b) => `/api/bookings/${b.id}/release`),
      (status, _body, ctx) => {
        if (status === 200) loopMs.push(performance.now() - ctx.startedAt!);
      },
    ),
    // Put the kit back so the next loop can book it again.
    step(
      ofBooking(
        (b) => `/api/bookings/${b.id}/checklist`,
        (b) => ({ phase: 'return', answers: answersFor(b.checklist.return) }),
      ),
    ),
    step(
      ofBooking((b) => `/api/bookings/${b.id}/return`),
      (status, _body, ctx) => {
        // A kit whose return failed stays booked; it is not handed out again in this run.
        if (status === 200) freeKits.push(ctx.kit!);
      },
    ),
  ];
  const result = await run({ url: base, headers: { cookie: auth.cookie, 'x-csrf-token': auth.csrf, 'content-type': 'application/json' }, requests });
  const at = (list: number[], q: number) => list.sort((a, b) => a - b)[Math.floor(list.length * q)] ?? NaN;
  return {
    loopsPerSec: loopMs.length / DURATION_S,
    p50: at(loopMs, 0.5),
    p99: at(loopMs, 0.99),
    requestsPerSec: result.requests.average,
    requestP50: result.latency.p50,
    requestP99: result.latency.p99,
    requestsTotal: (result.requests as unknown as { total: number }).total,
    statuses: statusCounts(result),
  };
}

/** Starts scripts/bench-server.ts in its own process and waits for its address. */
function startBenchServer(): Promise<{ child: ChildProcess; base: string }> {
  // BENCH_CPU_PROF=<dir> writes a V8 CPU profile of the server process there, to see where time goes.
  const profile = process.env.BENCH_CPU_PROF ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_CPU_PROF}`] : [];
  const child = fork(path.join(__dirname, 'bench-server.ts'), [], { execArgv: ['--import', 'tsx', ...profile], env: process.env });
  return new Promise((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`bench server exited with ${code}`)));
    child.once('message', (message: BenchServerMessage) => {
      if (message.type === 'ready') resolve({ child, base: message.base });
    });
  });
}

/** Sends the bench server a request and waits for its answer of the given type. */
function ask<K extends BenchServerMessage['type']>(
  child: ChildProcess,
  request: Record<string, unknown>,
  answer: K,
): Promise<Extract<BenchServerMessage, { type: K }>> {
  return new Promise((resolve) => {
    const listener = (message: BenchServerMessage) => {
      if (message.type !== answer) return;
      child.off('message', listener);
      resolve(message as Extract<BenchServerMessage, { type: K }>);
    };
    child.on('message', listener);
    child.send(request);
  });
}

const serverCpuMicros = async (child: ChildProcess) => (await ask(child, { type: 'cpu' }, 'cpu')).micros;
const explainLists = async (child: ChildProcess, urls: string[], headers: Record<string, string>) =>
  (await ask(child, { type: 'explain', urls, headers }, 'explains')).explains;

async function main(): Promise<void> {
  const options = benchInstance();
  await startInstance(options);
  const config = benchConfig();
  const db = createDb(config);
  await migrateLatest(db);
  if (Number((await db('items').count({ n: '*' }).first())?.n) < 50_000) await seedBench(db);
  const { child, base } = await startBenchServer();

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
  await db('booking_items')
    .whereIn(
      'item_id',
      kitRows.map((r) => r.id),
    )
    .update({ live: false });

  const rows: Row[] = [];
  // Each route runs between two runs of the reference, one just before and one just after, and
  // its ratio is to their mean: the shared machine drifts by half or more within one bench run,
  // so only neighbouring measurements compare, and two neighbours average out a drift.
  const referenceUrl = `${base}/api/bench/reference`;
  const referenceNow = async () => (await run({ url: referenceUrl, duration: REFERENCE_S })).requests.average;
  const around = async <T>(measureRoute: () => Promise<T>): Promise<{ result: T; referenceReqPerSec: number; referenceAround: [number, number] }> => {
    const before = await referenceNow();
    const result = await measureRoute();
    const after = await referenceNow();
    return { result, referenceReqPerSec: (before + after) / 2, referenceAround: [before, after] };
  };
  const measure = async (key: string, route: string, opts: autocannon.Options, serverUrl?: string) => {
    if (ONLY && key !== 'reference' && !ONLY.includes(key)) return;
    const timed = async () => {
      const cpuBefore = await serverCpuMicros(child);
      const result = await run(opts);
      return { result, cpuPerRequest: ((await serverCpuMicros(child)) - cpuBefore) / Math.max(1, (result.requests as unknown as { total: number }).total) };
    };
    const {
      result: { result, cpuPerRequest },
      referenceReqPerSec,
      referenceAround,
    } = key === 'reference' ? { result: await timed(), referenceReqPerSec: undefined, referenceAround: undefined } : await around(timed);
    const row: Row = {
      route,
      reqPerSec: result.requests.average,
      p50Ms: result.latency.p50,
      p99Ms: result.latency.p99,
      ratio: 0,
      statuses: statusCounts(result),
      serverCpuUs: cpuPerRequest,
      referenceReqPerSec,
      referenceAround,
    };
    if (serverUrl) row.serverMsMedian = await serverTime(base, serverUrl, headers);
    rows.push(row);
    console.log(
      `[bench] ${route}: ${row.reqPerSec.toFixed(0)} req/s, p50 ${row.p50Ms} ms, p99 ${row.p99Ms} ms, server CPU ${row.serverCpuUs?.toFixed(0)} µs/request`,
    );
  };

  const lastKit = KITS - 1;
  // Warm-up, not recorded: JIT, the pool's connections and MariaDB's buffer pool would otherwise
  // all be charged to whichever route runs first.
  for (const url of [`${base}/api/bench/reference`, `${base}/api/session`, `${base}/api/items?q=corona&kind=probe&minKv=50`, `${base}/api/bookings?mine=1`]) {
    await run({ url, headers, duration: 3 });
  }
  await measure('reference', "reference: primary-key SELECT, no session (behind the app's headers and log)", { url: referenceUrl });
  await measure('bare', 'same SELECT on a bare Express app (no headers, log or timing)', { url: `${base}/bench/bare` });
  await measure('session', 'GET /api/session (signed in)', { url: `${base}/api/session`, headers });
  await measure(
    'search',
    'GET /api/items?q=corona&kind=probe&minKv=50',
    { url: `${base}/api/items?q=corona&kind=probe&minKv=50`, headers },
    '/api/items?q=corona&kind=probe&minKv=50',
  );
  await measure('bookings', 'GET /api/bookings?mine=1', { url: `${base}/api/bookings?mine=1`, headers }, '/api/bookings?mine=1');
  await measure('assessments', 'POST /api/assessments', {
    url: `${base}/api/assessments`,
    method: 'POST',
    headers: { ...headers, 'x-csrf-token': member.csrf, 'content-type': 'application/json' },
    body: JSON.stringify({ itemIds: kitIds[lastKit], plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 } }),
  });
  const contention = new Date(Date.now() + 30 * 24 * 3600_000);
  await measure('contention', 'POST /api/bookings (50 clients, same items)', {
    url: `${base}/api/bookings`,
    method: 'POST',
    headers: { ...headers, 'x-csrf-token': member.csrf, 'content-type': 'application/json' },
    body: JSON.stringify({
      itemIds: kitIds[lastKit - 1],
      startsAt: contention.toISOString(),
      endsAt: new Date(contention.getTime() + 3600_000).toISOString(),
      location: 'Bench bay',
      purpose: 'Contention',
      plan: { plannedKv: 10, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 },
    }),
  });
  if (!ONLY || ONLY.includes('release')) {
    const {
      result: { loop, serverCpuUs },
      referenceReqPerSec,
      referenceAround,
    } = await around(async () => {
      const cpuBefore = await serverCpuMicros(child);
      const loop = await releaseLoop(base, member, kits, kitIds);
      return { loop, serverCpuUs: ((await serverCpuMicros(child)) - cpuBefore) / Math.max(1, loop.requestsTotal) };
    });
    rows.push({
      route: 'release loop, each request (book, 5 scans, checklists, release, return)',
      reqPerSec: loop.requestsPerSec,
      p50Ms: Math.round(loop.requestP50),
      p99Ms: Math.round(loop.requestP99),
      ratio: 0,
      statuses: loop.statuses,
      serverCpuUs,
      referenceReqPerSec,
      referenceAround,
    });
    rows.push({
      route: 'release loop, whole loop (book to release)',
      reqPerSec: loop.loopsPerSec,
      p50Ms: Math.round(loop.p50),
      p99Ms: Math.round(loop.p99),
      ratio: 0,
      statuses: {},
    });
  }

  // A whole loop is eight requests; a ratio of loops to single requests would mean nothing.
  for (const row of rows) {
    if (row.route.includes('whole loop')) row.ratio = NaN;
    else row.ratio = row.reqPerSec / (row.referenceReqPerSec ?? rows[0]!.reqPerSec);
  }
  // An officer sees every list, the staff-only ones (all bookings, audit) included.
  const officer = await signIn(base, 'bench-1@voltcrib.example');
  const explains = await explainLists(child, LIST_URLS, { cookie: officer.cookie });
  const bundle = mainBundle();

  const table = [
    '| route | req/s | reference req/s before / after | ratio to reference (mean of the two) | p50 ms | p99 ms | server ms (median) | server CPU µs/request | statuses |',
    '| --- | --- | --- | --- | --- | --- | --- | --- | --- |',
    ...rows.map(
      (r) =>
        `| ${r.route} | ${r.reqPerSec.toFixed(r.reqPerSec < 10 ? 2 : 0)} | ${r.referenceAround?.map((v) => v.toFixed(0)).join(' / ') ?? ''} | ${Number.isNaN(r.ratio) ? '' : r.ratio.toFixed(2)} | ${r.p50Ms} | ${r.p99Ms} | ${r.serverMsMedian?.toFixed(1) ?? ''} | ${r.serverCpuUs?.toFixed(0) ?? ''} | ${Object.entries(
          r.statuses,
        )
          .filter(([, v]) => v)
          .map(([k, v]) => `${k}:${v}`)
          .join(' ')} |`,
    ),
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
  child.send({ type: 'stop' });
  await db.destroy();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
