// The fault suite (`npm run test:faults`, also part of `npm test`): a real server process under a
// load of bookings and releases while its database is killed with SIGKILL and restarted, while the
// SMTP fake goes away, and while the object store goes away. The database cases run twice: with
// the server reaching MariaDB over its Unix socket and over TCP (their failures differ: a socket
// connect fails with ENOENT, a TCP one with ECONNREFUSED).
import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { PNG } from 'pngjs';
import { loadConfig } from '../../server/config';
import { createDb, type Db } from '../../server/db';
import { startFakeSmtp, type FakeSmtp, type ReceivedMessage } from '../../server/mail/fake-smtp';
import { messageIdOf } from '../../server/mail/outbox';
import { startFakeS3, type FakeS3 } from '../../server/storage/fake-s3';
import { dbEnv } from '../../scripts/lib/instances';
import { describeInstance, killInstance, resetDatabase, startInstance, stopInstance, type InstanceOptions } from '../../scripts/lib/mariadb';
import { insertKit, qualify } from '../helpers/gear';
import { createPerson } from '../helpers/test-app';

const ROOT = path.resolve(__dirname, '../..');
// Two above the test instance's port unless set, so parallel checkouts never share an instance.
const FAULTS_PORT = Number(process.env.FAULTS_DB_PORT ?? Number(process.env.VOLTCRIB_TEST_DB_PORT ?? 3308) + 2);
const INSTANCE: InstanceOptions = {
  name: FAULTS_PORT === 3310 ? 'faults' : `faults-${FAULTS_PORT}`,
  port: FAULTS_PORT,
  database: 'voltcrib_faults',
  user: 'voltcrib',
  password: 'voltcrib-local-only',
};
const MAIL_FROM = 'Voltcrib <voltcrib@faults.voltcrib.example>';
/** Short, so a send that could not be marked would be claimed again within the outage. */
const LEASE_MS = 1500;

let db: Db;
let smtp: FakeSmtp;
let s3: FakeS3;
let s3Port: number;
let smtpPort: number;
/** Set by a case: what the fake SMTP does when a message arrives, before it answers 250. */
let onMessage: ((m: ReceivedMessage) => void) | undefined;

async function freePort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', r));
  const { port } = s.address() as net.AddressInfo;
  await new Promise<void>((r) => s.close(() => r()));
  return port;
}

interface ServerProcess {
  base: string;
  exited(): number | null;
  stop(): void;
}

/** Starts `server/index.ts` in a process of its own, reaching the database over the socket or TCP. */
async function startServer(overSocket: boolean): Promise<ServerProcess> {
  const port = await freePort();
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    ...dbEnv(INSTANCE),
    NODE_ENV: 'test',
    PORT: String(port),
    HOST: '127.0.0.1',
    LOG_LEVEL: 'fatal',
    SMTP_URL: smtp.url,
    MAIL_FROM,
    MAIL_LEASE_MS: String(LEASE_MS),
    S3_ENDPOINT: s3.endpoint,
    S3_BUCKET: 'voltcrib-faults',
    MAIL_POLL_MS: '300',
    DB_POOL_MAX: '20',
    // Every visitor here is 127.0.0.1; the address ceiling is tested in tests/api/security/throttling.
    LOGIN_RATE_LIMIT_PER_ADDRESS: '1000000',
  };
  if (!overSocket) delete env.DB_SOCKET;
  const child: ChildProcess = spawn(path.join(ROOT, 'node_modules/.bin/tsx'), ['server/index.ts'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'inherit'] });
  let exited: number | null = null;
  child.once('exit', (code) => {
    exited = code ?? -1;
  });
  await new Promise<void>((resolve, reject) => {
    const t = setTimeout(() => reject(new Error('server did not start')), 30_000);
    child.stdout!.on('data', (c: Buffer) => {
      if (c.toString().includes('"listening"')) {
        clearTimeout(t);
        resolve();
      }
    });
  });
  return { base: `http://127.0.0.1:${port}`, exited: () => exited, stop: () => void child.kill('SIGTERM') };
}

interface Client {
  cookie: string;
  csrf: string;
}

const cookieOf = (res: Response, name: string) =>
  res.headers
    .getSetCookie()
    .find((c) => c.startsWith(`${name}=`))
    ?.split(';')[0];

async function signIn(base: string, email: string, password: string): Promise<Client> {
  const first = await fetch(`${base}/api/session`);
  const csrfCookie = cookieOf(first, 'voltcrib.csrf') ?? '';
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/session`, {
    method: 'POST',
    headers: { cookie: csrfCookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in ${res.status}`);
  return { cookie: cookieOf(res, 'voltcrib.sid')!, csrf: ((await res.json()) as { csrfToken: string }).csrfToken };
}

interface Answer {
  status: number;
  /** When the request was sent (epoch ms). */
  startedAt: number;
  json: Record<string, unknown>;
  ms: number;
  /** A session cookie the answer tried to set (never wanted during an outage). */
  newSessionCookie: boolean;
  /** The server's own time for the answer (Server-Timing), apart from the client's waits. */
  serverMs: number | null;
}

async function call(base: string, client: Client | null, method: string, url: string, body?: unknown): Promise<Answer> {
  const started = Date.now();
  try {
    const res = await fetch(`${base}${url}`, {
      method,
      headers: { ...(client ? { cookie: client.cookie, 'x-csrf-token': client.csrf } : {}), 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: AbortSignal.timeout(10_000),
    });
    const newSessionCookie = res.headers.getSetCookie().some((c) => c.startsWith('voltcrib.sid='));
    const text = await res.text();
    let json: Record<string, unknown> = {};
    try {
      json = JSON.parse(text);
    } catch {
      json = { raw: text };
    }
    const timing = /app;dur=([\d.]+)/.exec(res.headers.get('server-timing') ?? '');
    const answer = { status: res.status, json, startedAt: started, ms: Date.now() - started, newSessionCookie, serverMs: timing ? Number(timing[1]) : null };
    // A client told "unavailable" waits a moment before its next request (timed before the pause),
    // so the load does not become a busy loop that starves the server of CPU on a shared machine.
    if (res.status === 503) await new Promise((r) => setTimeout(r, 100));
    return answer;
  } catch (error) {
    return { status: 0, json: { error: String(error) }, startedAt: started, ms: Date.now() - started, newSessionCookie: false, serverMs: null };
  }
}

const byStatus = (answers: { status: number }[]) => answers.reduce<Record<string, number>>((acc, a) => ({ ...acc, [a.status]: (acc[a.status] ?? 0) + 1 }), {});

beforeAll(async () => {
  await startInstance(INSTANCE);
  resetDatabase(INSTANCE);
  db = createDb(loadConfig(dbEnv(INSTANCE)));
  await db.migrate.latest();
  smtp = await startFakeSmtp({ onMessage: (m) => onMessage?.(m) });
  smtpPort = smtp.port;
  s3Port = await freePort();
  s3 = await startFakeS3({ directory: path.join(ROOT, '.data', 'faults-s3'), port: s3Port, bucket: 'voltcrib-faults' });
}, 120_000);

afterAll(async () => {
  await db?.destroy();
  await smtp?.close();
  await s3?.close();
  await stopInstance(INSTANCE);
});

const TRANSPORTS = [
  { transport: 'the Unix socket', overSocket: true },
  { transport: 'TCP', overSocket: false },
];

const figures: string[] = [];
afterAll(() => console.log(`[faults] ${figures.join('\n[faults] ')}`));

const bookingBody = (itemIds: number[], start: Date, ms: number, purpose: string) => ({
  itemIds,
  startsAt: start.toISOString(),
  endsAt: new Date(start.getTime() + ms).toISOString(),
  location: 'Fault bay',
  purpose,
  plan: { plannedKv: 5, polarity: 'negative', maxCurrentMa: 1, peoplePresent: 2 },
});

/**
 * The outage test leaves its bookings' approval requests queued; a mail test's own row would wait
 * behind hundreds of them (more when the machine is quiet and more bookings got through). They are
 * not what these tests look at: set them aside so the worker reaches the row under test at once.
 */
async function setAsideQueuedMail(db: Db): Promise<void> {
  await db('outbox').whereIn('state', ['pending', 'sending']).update({ state: 'failed', last_error: 'set aside by the fault suite' });
}

describe.each(TRANSPORTS)('over $transport', ({ transport, overSocket }) => {
  let server: ServerProcess;
  beforeAll(async () => {
    server = await startServer(overSocket);
  }, 60_000);
  afterAll(() => server?.stop());

  it('answers 503 within a second to everyone during an outage, keeps everyone signed in, recovers without a restart, and leaves nothing half-written', async () => {
    const { base } = server;
    const people = await Promise.all(Array.from({ length: 6 }, () => createPerson(db, { role: 'member' })));
    for (const p of people) await qualify(db, p.id, 40);
    const clients = await Promise.all(people.map((p) => signIn(base, p.email, p.password)));
    const kits = await Promise.all(Array.from({ length: 12 }, () => insertKit(db)));

    const acknowledgedBookings = new Map<number, number>(); // booking id -> item count
    const acknowledgedReleases = new Set<number>();
    const outage = { on: false, killedAt: 0, answers: [] as (Answer & { what: string; afterKillMs: number })[] };
    const record = (what: string, a: Answer) => {
      // How long the answer took once the outage could affect it: from the kill for a request in flight then.
      if (outage.on) outage.answers.push({ ...a, what, afterKillMs: a.startedAt + a.ms - Math.max(a.startedAt, outage.killedAt) });
      return a;
    };
    let stop = false;

    const worker = async (w: number) => {
      const client = clients[w % clients.length]!;
      let round = 0;
      while (!stop) {
        const kit = kits[(w * 2 + (round % 2)) % kits.length]!;
        round += 1;
        // Reads as well as writes, so a session the cache no longer holds is read from the store.
        record('read session', await call(base, client, 'GET', '/api/session'));
        record('read list', await call(base, client, 'GET', '/api/bookings?mine=1'));
        const start = new Date(Date.now() + ((w * 1000 + round) % 50000) * 60_000);
        const res = record(
          'book',
          await call(
            base,
            client,
            'POST',
            '/api/bookings',
            bookingBody(
              kit.all.map((i) => i.id),
              start,
              30_000,
              'Fault load',
            ),
          ),
        );
        if (res.status === 201) acknowledgedBookings.set((res.json.booking as { id: number }).id, kit.all.length);
        // Release path on a booking that starts now.
        const now = new Date(Date.now() - 30_000);
        const b = record(
          'book now',
          await call(
            base,
            client,
            'POST',
            '/api/bookings',
            bookingBody(
              kit.all.map((i) => i.id),
              now,
              60_000 + w,
              'Fault release',
            ),
          ),
        );
        if (b.status !== 201) continue;
        const booking = b.json.booking as {
          id: number;
          items: { tag: string }[];
          checklist: { pre: { id: number; kind: string; required: boolean; min?: number }[] };
        };
        acknowledgedBookings.set(booking.id, kit.all.length);
        for (const item of booking.items) record('scan', await call(base, client, 'POST', `/api/bookings/${booking.id}/scans`, { tag: item.tag }));
        const answers = booking.checklist.pre
          .filter((e) => e.required)
          .map((e) => (e.kind === 'reading' ? { itemId: e.id, value: (e.min ?? 0) + 1 } : { itemId: e.id, confirmed: true }));
        record('checklist', await call(base, client, 'POST', `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers }));
        const r = record('release', await call(base, client, 'POST', `/api/bookings/${booking.id}/release`));
        if (r.status === 200) acknowledgedReleases.add(booking.id);
        record('cancel', await call(base, client, 'POST', `/api/bookings/${booking.id}/cancel`));
      }
    };
    // Visitors who are not signed in: sign-in attempts and password-reset requests need the database too.
    const visitors = async () => {
      while (!stop) {
        const visit = await fetch(`${base}/api/session`).catch(() => null);
        if (!visit) continue;
        const csrfCookie = cookieOf(visit, 'voltcrib.csrf') ?? '';
        const { csrfToken } = (await visit.json()) as { csrfToken: string };
        const anonymous = { cookie: csrfCookie, csrf: csrfToken };
        record('anonymous sign-in', await call(base, anonymous, 'POST', '/api/session', { email: people[0]!.email, password: 'not the password' }));
        record('anonymous reset', await call(base, anonymous, 'POST', '/api/password-resets', { email: people[1]!.email }));
        await new Promise((r) => setTimeout(r, 50));
      }
    };
    const load = Promise.all([...Array.from({ length: 12 }, (_, w) => worker(w)), visitors()]);

    await new Promise((r) => setTimeout(r, 4000));
    killInstance(INSTANCE);
    outage.killedAt = Date.now();
    // A stopped or restarting MariaDB leaves no socket file: connecting then fails with ENOENT,
    // which express-session would read as "no such session" if the store passed it on.
    if (overSocket) rmSync(describeInstance(INSTANCE).socket, { force: true });
    outage.on = true;
    // Longer than the session cache's 5 s, so every signed-in request has to ask the store.
    await new Promise((r) => setTimeout(r, 6500));
    outage.on = false;
    await startInstance(INSTANCE);
    const firstAfter = await call(base, clients[0]!, 'GET', '/api/bookings?mine=1');
    await new Promise((r) => setTimeout(r, 3000));
    stop = true;
    await load;

    expect(server.exited()).toBeNull();
    const during = outage.answers;
    const failedDuring = during.filter((a) => a.status >= 500 || a.status === 0);
    expect(failedDuring.length).toBeGreaterThan(0);
    // Listed, not just counted, so a failure says which answers were not a clean 503.
    const summary = (a: Answer & { what: string }) => ({ what: a.what, status: a.status, code: (a.json.error as { code?: string } | undefined)?.code });
    expect(failedDuring.filter((a) => a.status !== 503).map(summary)).toEqual([]);
    expect(failedDuring.filter((a) => (a.json.error as { code?: string } | undefined)?.code !== 'SERVICE_UNAVAILABLE').map(summary)).toEqual([]);
    // A request sent during the outage is answered within a second by the server's own clock
    // (Server-Timing): this client shares two cores with the server, MariaDB and other work, and
    // its own stalls would otherwise be counted. On a machine loaded far past its two cores (load
    // average 15 seen during `npm test`) a rare answer waits for CPU a little longer, so: 99 % within
    // 1 s, every one within 3 s. A request already running at the kill (its work before the kill
    // included) within 3 s; seen from the client, everything far below the 10 s abort.
    const startedDuring = failedDuring.filter((a) => a.startedAt >= outage.killedAt);
    const inFlight = failedDuring.filter((a) => a.startedAt < outage.killedAt);
    const slowest = Math.max(...startedDuring.map((a) => a.serverMs ?? Infinity));
    const detail = (a: (typeof failedDuring)[number]) => ({ ...summary(a), serverMs: a.serverMs, ms: a.ms, afterKillMs: a.afterKillMs });
    expect(startedDuring.length).toBeGreaterThan(0);
    const withinSecond = startedDuring.filter((a) => a.serverMs !== null && a.serverMs < 1000).length;
    expect(withinSecond / startedDuring.length).toBeGreaterThanOrEqual(0.99);
    expect(startedDuring.filter((a) => !(a.serverMs !== null && a.serverMs < 3000)).map(detail)).toEqual([]);
    expect(inFlight.filter((a) => !(a.serverMs !== null && a.serverMs < 3000)).map(detail)).toEqual([]);
    expect(failedDuring.filter((a) => a.afterKillMs >= 5000).map(detail)).toEqual([]);
    const slowestSeen = Math.max(...failedDuring.map((a) => a.afterKillMs));
    // A valid session is never taken for a missing one: no 401/403, no new session cookie.
    // (An anonymous sign-in with a wrong password checked just before the kill is a true 401.)
    expect(during.filter((a) => !a.what.startsWith('anonymous') && (a.status === 401 || a.status === 403)).map(summary)).toEqual([]);
    expect(during.filter((a) => a.newSessionCookie).map(summary)).toEqual([]);
    // Reads from the session store really happened while it was down (not all served from the cache).
    expect(during.filter((a) => a.what === 'read session' && a.status === 503).length).toBeGreaterThan(0);
    expect(firstAfter.status).toBe(200);

    // Everyone is still signed in, with the cookie they had before the outage.
    const after = await Promise.all(clients.map((c) => call(base, c, 'GET', '/api/session')));
    const intact = after.filter((a, i) => a.status === 200 && (a.json.user as { id?: number } | null)?.id === people[i]!.id).length;
    expect(intact).toBe(clients.length);

    // Every acknowledged booking exists with all its items; every acknowledged release kept its
    // checklist run and audit row; and nothing anywhere is half-written.
    for (const [id, count] of acknowledgedBookings) {
      const items = await db('booking_items').where({ booking_id: id }).count({ n: '*' }).first();
      expect({ id, n: Number(items?.n) }).toEqual({ id, n: count });
    }
    for (const id of acknowledgedReleases) {
      const run = await db('checklist_runs').where({ booking_id: id, phase: 'pre' }).first('id');
      const audit = await db('audit_events')
        .where({ entity: 'booking', entity_id: String(id), action: 'booking.released' })
        .first('id');
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
    figures.push(
      `over ${transport}: acknowledged bookings ${acknowledgedBookings.size}, releases ${acknowledgedReleases.size}; ${during.length} answers during the 6.5 s outage by status ${JSON.stringify(byStatus(during))} ` +
        `(${withinSecond}/${startedDuring.length} sent during it answered within 1 s in the server, slowest ${slowest.toFixed(0)} ms; slowest seen by the client after the kill ${slowestSeen} ms, ${during.filter((a) => a.newSessionCookie).length} new session cookies); sessions intact after ${intact}/${clients.length}; half-written found 0`,
    );
  }, 120_000);

  it('never delivers a reminder twice when the database dies right after its send', async () => {
    const subject = `Overdue reminder, database killed after the send (${transport})`;
    await setAsideQueuedMail(db);
    let killedAt = 0;
    onMessage = (m) => {
      // Before the fake answers 250: by the time the worker hears "sent", the database is gone.
      if (m.subject === subject && killedAt === 0) {
        killInstance(INSTANCE);
        killedAt = Date.now();
      }
    };
    try {
      const [id] = await db('outbox').insert({
        dedupe_key: `fault-overdue:${transport}`,
        kind: 'overdue-member',
        to_address: 'late@test.voltcrib.example',
        subject,
        text_body: 'Return the gear.',
        html_body: '<p>Return the gear.</p>',
        next_attempt_at: new Date(),
      });
      // The worker is still retrying the outage test's mail with back-off: give it time.
      const deadline = Date.now() + 60_000;
      while (killedAt === 0) {
        if (Date.now() > deadline) {
          const row = await db('outbox').where({ id }).first('state', 'attempts', 'next_attempt_at', 'last_error');
          throw new Error(`the reminder was never sent: ${JSON.stringify(row)}`);
        }
        await new Promise((r) => setTimeout(r, 100));
      }
      // Down for longer than the lease: a worker that forgot the send would claim the row again.
      await new Promise((r) => setTimeout(r, LEASE_MS * 2));
      await startInstance(INSTANCE);
      // Several polls and lease lengths with the database back.
      await new Promise((r) => setTimeout(r, LEASE_MS * 3));
      const copies = smtp.list().filter((m) => m.subject === subject);
      const row = await db('outbox').where({ id }).first();
      expect(copies).toHaveLength(1);
      // Claims may be retried while the database comes back (each counts an attempt); what must
      // hold is one delivery and the row marked sent.
      expect(row.state).toBe('sent');
      expect(copies[0]!.messageId).toBe(messageIdOf(row, MAIL_FROM));
      expect(server.exited()).toBeNull();
      figures.push(
        `over ${transport}: database killed right after a reminder's send, down ${LEASE_MS * 2} ms (lease ${LEASE_MS} ms): ${copies.length} delivery, duplicates ${copies.length - 1}, row ${row.state} after ${row.attempts} claim(s)`,
      );
    } finally {
      onMessage = undefined;
    }
  }, 120_000);

  if (overSocket) {
    it('keeps the mail in the outbox while the SMTP server is away and sends it when it is back', async () => {
      await smtp.close();
      await setAsideQueuedMail(db);
      const [id] = await db('outbox').insert({
        kind: 'fault',
        to_address: 'fault@test.voltcrib.example',
        subject: 'Sent after the outage',
        text_body: 'x',
        html_body: '<p>x</p>',
        next_attempt_at: new Date(),
      });
      const deadline = Date.now() + 15_000;
      let row = await db('outbox').where({ id }).first();
      // Until the failed attempt is recorded: the row is 'sending' while the worker tries.
      while (!(row.attempts > 0 && row.state !== 'sending') && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 200));
        row = await db('outbox').where({ id }).first();
      }
      expect(row).toMatchObject({ state: 'pending' });
      expect(row.attempts).toBeGreaterThan(0);
      smtp = await startFakeSmtp({ port: smtpPort, onMessage: (m) => onMessage?.(m) });
      const until = Date.now() + 30_000;
      while (!smtp.list().some((m) => m.subject === 'Sent after the outage')) {
        if (Date.now() > until) throw new Error('mail not delivered after the SMTP server came back');
        await new Promise((r) => setTimeout(r, 250));
      }
      expect((await db('outbox').where({ id }).first()).state).toBe('sent');
      expect(server.exited()).toBeNull();
    }, 60_000);

    it('answers 503 to an upload while the object store is away and stores nothing; uploads work again when it is back', async () => {
      const manager = await createPerson(db, { role: 'manager' });
      const client = await signIn(server.base, manager.email, manager.password);
      const kit = await insertKit(db);
      const png = new PNG({ width: 2, height: 2 });
      const bytes = PNG.sync.write(png);
      const upload = async () => {
        const form = new FormData();
        form.append('file', new Blob([new Uint8Array(bytes)], { type: 'image/png' }), 'photo.png');
        const res = await fetch(`${server.base}/api/items/${kit.probe.id}/files`, {
          method: 'POST',
          headers: { cookie: client.cookie, 'x-csrf-token': client.csrf },
          body: form,
          signal: AbortSignal.timeout(20_000),
        });
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
      expect(server.exited()).toBeNull();
    }, 60_000);
  }
});
