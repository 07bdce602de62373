// The fault suite (`npm run test:faults`, also part of `npm test`): a real server process under a
// load of bookings and releases while its database is killed with SIGKILL and restarted, while the
// SMTP fake goes away, and while the object store goes away.
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { PNG } from 'pngjs';
import { loadConfig } from '../../server/config';
import { createDb, type Db } from '../../server/db';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { startFakeS3, type FakeS3 } from '../../server/storage/fake-s3';
import { dbEnv } from '../../scripts/lib/instances';
import { killInstance, resetDatabase, startInstance, stopInstance, type InstanceOptions } from '../../scripts/lib/mariadb';
import { insertKit, qualify } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';

const ROOT = path.resolve(__dirname, '../..');
const INSTANCE: InstanceOptions = { name: 'faults', port: Number(process.env.FAULTS_DB_PORT ?? 3310), database: 'voltcrib_faults', user: 'voltcrib', password: 'voltcrib-local-only' };

let db: Db;
let smtp: FakeSmtp;
let s3: FakeS3;
let s3Port: number;
let server: ChildProcess;
let base: string;
let exited: number | null = null;

async function freePort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', r));
  const { port } = s.address() as net.AddressInfo;
  await new Promise<void>((r) => s.close(() => r()));
  return port;
}

interface Client {
  cookie: string;
  csrf: string;
}

async function signIn(email: string, password: string): Promise<Client> {
  const first = await fetch(`${base}/api/session`);
  let cookie = (first.headers.get('set-cookie') ?? '').split(';')[0]!;
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/session`, { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken }, body: JSON.stringify({ email, password }) });
  if (res.status !== 200) throw new Error(`sign-in ${res.status}`);
  cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
  return { cookie, csrf: ((await res.json()) as { csrfToken: string }).csrfToken };
}

async function call(client: Client, method: string, url: string, body?: unknown) {
  const started = Date.now();
  try {
    const res = await fetch(`${base}${url}`, {
      method,
      headers: { cookie: client.cookie, 'x-csrf-token': client.csrf, 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: AbortSignal.timeout(10_000),
    });
    const text = await res.text();
    let json: Record<string, unknown> = {};
    try {
      json = JSON.parse(text);
    } catch {
      json = { raw: text };
    }
    return { status: res.status, json, ms: Date.now() - started };
  } catch (error) {
    return { status: 0, json: { error: String(error) }, ms: Date.now() - started };
  }
}

beforeAll(async () => {
  await startInstance(INSTANCE);
  resetDatabase(INSTANCE);
  db = createDb(loadConfig(dbEnv(INSTANCE)));
  await db.migrate.latest();
  smtp = await startFakeSmtp();
  s3Port = await freePort();
  s3 = await startFakeS3({ directory: path.join(ROOT, '.data', 'faults-s3'), port: s3Port, bucket: 'voltcrib-faults' });
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  server = spawn(path.join(ROOT, 'node_modules/.bin/tsx'), ['server/index.ts'], {
    cwd: ROOT,
    env: { ...process.env, ...dbEnv(INSTANCE), NODE_ENV: 'test', PORT: String(port), HOST: '127.0.0.1', LOG_LEVEL: 'fatal', SMTP_URL: smtp.url, S3_ENDPOINT: s3.endpoint, S3_BUCKET: 'voltcrib-faults', MAIL_POLL_MS: '300', DB_POOL_MAX: '20' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  server.once('exit', (code) => {
    exited = code ?? -1;
  });
  await new Promise<void>((resolve, reject) => {
    const t = setTimeout(() => reject(new Error('server did not start')), 30_000);
    server.stdout!.on('data', (c: Buffer) => {
      if (c.toString().includes('"listening"')) {
        clearTimeout(t);
        resolve();
      }
    });
  });
}, 120_000);

afterAll(async () => {
  server?.kill('SIGTERM');
  await db?.destroy();
  await smtp?.close();
  await s3?.close();
  await stopInstance(INSTANCE);
});

describe('the database is killed mid-load', () => {
  it('answers 503 quickly during the outage, recovers without a restart, and leaves nothing half-written', async () => {
    const people = await Promise.all(Array.from({ length: 6 }, () => createPerson(db, { role: 'member' })));
    for (const p of people) await qualify(db, p.id, 40);
    const clients = await Promise.all(people.map((p) => signIn(p.email, p.password)));
    const kits = await Promise.all(Array.from({ length: 12 }, () => insertKit(db)));

    const acknowledgedBookings = new Map<number, number>(); // booking id -> item count
    const acknowledgedReleases = new Set<number>();
    const outage = { on: false, answers: [] as { status: number; ms: number; code?: string }[] };
    let stop = false;

    const worker = async (w: number) => {
      const client = clients[w % clients.length]!;
      let round = 0;
      while (!stop) {
        const kit = kits[(w * 2 + (round % 2)) % kits.length]!;
        round += 1;
        const start = new Date(Date.now() + ((w * 1000 + round) % 50000) * 60_000);
        const res = await call(client, 'POST', '/api/bookings', { itemIds: kit.all.map((i) => i.id), startsAt: start.toISOString(), endsAt: new Date(start.getTime() + 30_000).toISOString(), location: 'Fault bay', purpose: 'Fault load', plan: { plannedKv: 5, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 } });
        if (outage.on) outage.answers.push({ status: res.status, ms: res.ms, code: (res.json.error as { code?: string } | undefined)?.code });
        if (res.status === 201) acknowledgedBookings.set((res.json.booking as { id: number }).id, kit.all.length);
        // Release path on a booking that starts now.
        const now = new Date(Date.now() - 30_000);
        const b = await call(client, 'POST', '/api/bookings', { itemIds: kit.all.map((i) => i.id), startsAt: now.toISOString(), endsAt: new Date(now.getTime() + 60_000 + w).toISOString(), location: 'Fault bay', purpose: 'Fault release', plan: { plannedKv: 5, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 } });
        if (outage.on) outage.answers.push({ status: b.status, ms: b.ms });
        if (b.status !== 201) continue;
        const booking = b.json.booking as { id: number; items: { tag: string }[]; checklist: { pre: { id: number; kind: string; required: boolean; min?: number }[] } };
        acknowledgedBookings.set(booking.id, kit.all.length);
        for (const item of booking.items) await call(client, 'POST', `/api/bookings/${booking.id}/scans`, { tag: item.tag });
        const answers = booking.checklist.pre.filter((e) => e.required).map((e) => (e.kind === 'reading' ? { itemId: e.id, value: (e.min ?? 0) + 1 } : { itemId: e.id, confirmed: true }));
        await call(client, 'POST', `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers });
        const r = await call(client, 'POST', `/api/bookings/${booking.id}/release`);
        if (outage.on) outage.answers.push({ status: r.status, ms: r.ms });
        if (r.status === 200) acknowledgedReleases.add(booking.id);
        await call(client, 'POST', `/api/bookings/${booking.id}/cancel`);
      }
    };
    const load = Promise.all(Array.from({ length: 12 }, (_, w) => worker(w)));

    await new Promise((r) => setTimeout(r, 4000));
    killInstance(INSTANCE);
    outage.on = true;
    await new Promise((r) => setTimeout(r, 4000));
    outage.on = false;
    await startInstance(INSTANCE);
    const firstAfter = await call(clients[0]!, 'GET', '/api/bookings?mine=1');
    await new Promise((r) => setTimeout(r, 3000));
    stop = true;
    await load;

    expect(exited).toBeNull();
    // During the outage: clear 503 JSON answers, each within a second, none hanging.
    const failedDuring = outage.answers.filter((a) => a.status >= 500 || a.status === 0);
    expect(failedDuring.length).toBeGreaterThan(0);
    // Listed, not just counted, so a failure says which answers were not a clean 503.
    expect(failedDuring.filter((a) => a.status !== 503)).toEqual([]);
    expect(Math.max(...failedDuring.map((a) => a.ms))).toBeLessThan(1000);
    expect(outage.answers.filter((a) => a.code).every((a) => a.code === 'SERVICE_UNAVAILABLE' || a.status < 500)).toBe(true);
    expect(firstAfter.status).toBe(200);

    // Every acknowledged booking exists with all its items; every acknowledged release kept its
    // checklist run and audit row; and nothing anywhere is half-written.
    for (const [id, count] of acknowledgedBookings) {
      const items = await db('booking_items').where({ booking_id: id }).count({ n: '*' }).first();
      expect({ id, n: Number(items?.n) }).toEqual({ id, n: count });
    }
    for (const id of acknowledgedReleases) {
      const run = await db('checklist_runs').where({ booking_id: id, phase: 'pre' }).first('id');
      const audit = await db('audit_events').where({ entity: 'booking', entity_id: String(id), action: 'booking.released' }).first('id');
      expect({ id, run: Boolean(run), audit: Boolean(audit) }).toEqual({ id, run: true, audit: true });
    }
    const orphans = await db('bookings as b').leftJoin('booking_items as bi', 'bi.booking_id', 'b.id').whereNull('bi.booking_id').count({ n: '*' }).first();
    expect(Number(orphans?.n)).toBe(0);
    const releasedWithout = await db('bookings as b')
      .whereNotNull('b.released_at')
      .andWhere((w) =>
        w
          .whereNotExists(db('checklist_runs as c').whereRaw('c.booking_id = b.id').andWhere('c.phase', 'pre'))
          .orWhereNotExists(db('audit_events as a').whereRaw("a.entity = 'booking' AND a.entity_id = CAST(b.id AS CHAR) AND a.action = 'booking.released'")),
      )
      .count({ n: '*' })
      .first();
    expect(Number(releasedWithout?.n)).toBe(0);
    console.log(`[faults] acknowledged bookings ${acknowledgedBookings.size}, releases ${acknowledgedReleases.size}; answers during outage ${outage.answers.length} (${failedDuring.length} × 503, slowest ${Math.max(...failedDuring.map((a) => a.ms))} ms); half-written found 0`);
  }, 120_000);
});

describe('the SMTP server goes away', () => {
  it('keeps the mail in the outbox and sends it when the server is back', async () => {
    const port = smtp.port;
    await smtp.close();
    const [id] = await db('outbox').insert({ kind: 'fault', to_address: 'fault@test.voltcrib.example', subject: 'Sent after the outage', text_body: 'x', html_body: '<p>x</p>', next_attempt_at: new Date() });
    const deadline = Date.now() + 15_000;
    let row = await db('outbox').where({ id }).first();
    // Until the failed attempt is recorded: the row is 'sending' while the worker tries.
    while (!(row.attempts > 0 && row.state !== 'sending') && Date.now() < deadline) {
      await new Promise((r) => setTimeout(r, 200));
      row = await db('outbox').where({ id }).first();
    }
    expect(row).toMatchObject({ state: 'pending' });
    expect(row.attempts).toBeGreaterThan(0);
    smtp = await startFakeSmtp({ port });
    const until = Date.now() + 30_000;
    while (!smtp.list().some((m) => m.subject === 'Sent after the outage')) {
      if (Date.now() > until) throw new Error('mail not delivered after the SMTP server came back');
      await new Promise((r) => setTimeout(r, 250));
    }
    expect((await db('outbox').where({ id }).first()).state).toBe('sent');
    expect(exited).toBeNull();
  }, 60_000);
});

describe('the object store goes away', () => {
  it('answers 503 to an upload and stores nothing; uploads work again when it is back', async () => {
    const manager = await createPerson(db, { role: 'manager' });
    const client = await signIn(manager.email, manager.password);
    const kit = await insertKit(db);
    const png = new PNG({ width: 2, height: 2 });
    const bytes = PNG.sync.write(png);
    const upload = async () => {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(bytes)], { type: 'image/png' }), 'photo.png');
      const res = await fetch(`${base}/api/items/${kit.probe.id}/files`, { method: 'POST', headers: { cookie: client.cookie, 'x-csrf-token': client.csrf }, body: form, signal: AbortSignal.timeout(20_000) });
      return { status: res.status, json: (await res.json()) as { error?: { code: string } } };
    };
    await s3.close();
    const down = await upload();
    expect(down.status).toBe(503);
    expect(down.json.error?.code).toBe('SERVICE_UNAVAILABLE');
    expect(await db('item_files').where({ item_id: kit.probe.id })).toHaveLength(0);
    s3 = await startFakeS3({ directory: path.join(ROOT, '.data', 'faults-s3'), port: s3Port, bucket: 'voltcrib-faults' });
    const up = await upload();
    expect(up.status).toBe(201);
    expect(await db('item_files').where({ item_id: kit.probe.id })).toHaveLength(1);
    expect(exited).toBeNull();
  }, 60_000);
});
