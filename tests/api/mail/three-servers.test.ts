// Three real server processes run the reminder schedule against one database at the same time;
// the fake SMTP server must receive each overdue message exactly once.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { bookingItemTags } from '../../../server/services/booking-rows';
import { startFakeSmtp, type FakeSmtp } from '../../../server/mail/fake-smtp';
import { MAIL_TEST_DATABASE } from '../../../scripts/lib/test-database';
import { insertKit } from '../../helpers/gear';
import { createPerson, createTestContext, testConfig, type TestContext } from '../../helpers/test-app';

const ROOT = path.resolve(__dirname, '../../..');
let ctx: TestContext;
let smtp: FakeSmtp;
const servers: ChildProcess[] = [];

function startServerProcess(): Promise<ChildProcess> {
  const config = testConfig({ DB_NAME: MAIL_TEST_DATABASE });
  const child = spawn(path.join(ROOT, 'node_modules/.bin/tsx'), ['server/index.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: '0',
      LOG_LEVEL: 'warn',
      DB_PORT: String(config.db.port),
      DB_NAME: config.db.database,
      S3_ENDPOINT: config.s3.endpoint ?? '',
      S3_BUCKET: config.s3.bucket,
      SMTP_URL: smtp.url,
      MAIL_CRON: '* * * * * *',
      MAIL_POLL_MS: '200',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  servers.push(child);
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('server did not start in 30 s')), 30_000);
    child.stdout!.on('data', (chunk: Buffer) => {
      if (chunk.toString().includes('"listening"')) {
        clearTimeout(timer);
        resolve(child);
      }
    });
    child.once('exit', (code) => reject(new Error(`server exited with ${code}`)));
  });
}

beforeAll(async () => {
  ctx = createTestContext({ DB_NAME: MAIL_TEST_DATABASE });
  smtp = await startFakeSmtp();
});
afterAll(async () => {
  for (const child of servers) child.kill('SIGTERM');
  await Promise.all(servers.map((c) => new Promise((r) => (c.exitCode !== null ? r(null) : c.once('exit', r)))));
  await smtp.close();
  await ctx.close();
});

it('sends one overdue reminder to the member and one per officer, with three schedulers racing', async () => {
  const member = await createPerson(ctx.db, { role: 'member', name: 'Overdue Olafsdottir' });
  const kit = await insertKit(ctx.db);
  const endsAt = new Date(Date.now() - 2 * 3600_000);
  const [bookingId] = await ctx.db('bookings').insert({
    person_id: member.id,
    status: 'released',
    starts_at: new Date(endsAt.getTime() - 3600_000),
    ends_at: endsAt,
    released_at: new Date(endsAt.getTime() - 3600_000),
    location: 'Bay 2',
    purpose: 'Overdue reminder check',
    planned_kv: 10,
    polarity: 'negative',
    max_current_ma: 1,
    people_present: 2,
    assessment: '{}',
    approval_required: false,
    item_tags: bookingItemTags(kit.all),
  });
  await ctx
    .db('booking_items')
    .insert(kit.all.map((i) => ({ booking_id: bookingId, item_id: i.id, starts_at: new Date(endsAt.getTime() - 3600_000), ends_at: endsAt, live: true })));

  await Promise.all([startServerProcess(), startServerProcess(), startServerProcess()]);
  const about = (m: { subject: string }) => m.subject.includes(`booking #${bookingId}`);
  const deadline = Date.now() + 30_000;
  while (!smtp.list().some((m) => about(m) && m.to.includes(member.email))) {
    if (Date.now() > deadline) throw new Error('no overdue reminder arrived');
    await new Promise((r) => setTimeout(r, 200));
  }
  // Let all three schedulers run several more times before counting.
  await new Promise((r) => setTimeout(r, 4000));
  const received = smtp.list().filter(about);
  expect(received.filter((m) => m.to.includes(member.email))).toHaveLength(1);
  // The reminder names the gear still out, in tag order.
  expect(received.find((m) => m.to.includes(member.email))!.text).toContain(
    kit.all
      .map((i) => i.tag)
      .sort()
      .join(', '),
  );
  const officers = await ctx.db('people').where({ role: 'officer', active: true }).pluck('email');
  for (const email of officers) expect(received.filter((m) => m.to.includes(email))).toHaveLength(1);
  expect(received).toHaveLength(1 + officers.length);
  const rows = await ctx.db('outbox').where('dedupe_key', 'like', `overdue-%:${bookingId}%`);
  expect(rows.every((r) => r.state === 'sent' && r.attempts === 1)).toBe(true);
}, 90_000);
