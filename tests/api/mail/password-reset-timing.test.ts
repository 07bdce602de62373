// A password-reset request costs the same whether or not the e-mail belongs to someone: the answer
// comes after the same statements (one outbox row), and the worker does the rest afterwards
// (services/accounts.ts preparePasswordReset). Server-Timing is off in production
// (tests/api/security/production.test.ts).
import { startFakeSmtp, type FakeSmtp } from '../../../server/mail/fake-smtp';
import { OutboxWorker } from '../../../server/mail/outbox';
import { createTransport } from '../../../server/mail/transport';
import { MAIL_TEST_DATABASE } from '../../../scripts/lib/test-database';
import { anonymousAgent, createPerson, createTestContext, uniqueEmail, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let smtp: FakeSmtp;
let worker: OutboxWorker;
beforeAll(async () => {
  ctx = createTestContext({ DB_NAME: MAIL_TEST_DATABASE });
  smtp = await startFakeSmtp();
  worker = new OutboxWorker(ctx.db, createTransport(smtp.url), 'Voltcrib <voltcrib@localhost>');
});
afterAll(async () => {
  await smtp.close();
  await ctx.close();
});

/** The SQL the app ran while answering, values left out (they differ by e-mail and time). */
async function statementsOf(send: () => Promise<{ status: number }>): Promise<{ status: number; sql: string[]; ms: number }> {
  const sql: string[] = [];
  const listener = (q: { sql: string }) => sql.push(q.sql);
  ctx.db.on('query', listener);
  const started = process.hrtime.bigint();
  try {
    const res = await send();
    return { status: res.status, sql, ms: Number(process.hrtime.bigint() - started) / 1e6 };
  } finally {
    ctx.db.off('query', listener);
  }
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

describe('POST /api/password-resets', () => {
  it('runs the same statements and gives the same answer for a known and an unknown e-mail', async () => {
    const a = await anonymousAgent(ctx.app);
    const post = (email: string) => a.agent.post('/api/password-resets').set('x-csrf-token', a.csrf()).send({ email });
    const known: Awaited<ReturnType<typeof statementsOf>>[] = [];
    const unknown: Awaited<ReturnType<typeof statementsOf>>[] = [];
    for (let i = 0; i < 8; i += 1) {
      const person = await createPerson(ctx.db);
      known.push(await statementsOf(() => post(person.email)));
      unknown.push(await statementsOf(() => post(uniqueEmail('nobody'))));
    }
    for (const [k, u] of known.map((k, i) => [k, unknown[i]!] as const)) {
      expect(k.status).toBe(202);
      expect(u.status).toBe(202);
      expect(u.sql).toEqual(k.sql);
    }
    // Throttling (two counters) and the one outbox row: nothing that reads people.
    expect(known[0]!.sql.join('\n')).not.toMatch(/people|person_tokens|audit/);
    console.log(
      `[reset timing] statements per request ${known[0]!.sql.length} for both; median ms known ${median(known.map((k) => k.ms)).toFixed(1)}, unknown ${median(unknown.map((u) => u.ms)).toFixed(1)} (8 each, interleaved)`,
    );
  });

  it('sends the link to a known e-mail afterwards, and leaves nothing behind for an unknown one', async () => {
    const person = await createPerson(ctx.db);
    const nobody = uniqueEmail('nobody');
    const a = await anonymousAgent(ctx.app);
    await a.agent.post('/api/password-resets').set('x-csrf-token', a.csrf()).send({ email: person.email }).expect(202);
    await a.agent.post('/api/password-resets').set('x-csrf-token', a.csrf()).send({ email: nobody }).expect(202);
    // Another suite's workers may drain this database too: wait for the outcome, whoever sends.
    const deadline = Date.now() + 20_000;
    for (;;) {
      await worker.drain(50);
      const rows = await ctx.db('outbox').whereIn('to_address', [person.email, nobody]).select('to_address', 'kind', 'state');
      const sentToPerson = rows.some((r) => r.to_address === person.email && r.kind === 'password-reset' && r.state === 'sent');
      if (sentToPerson && !rows.some((r) => r.to_address === nobody)) break;
      if (Date.now() > deadline) throw new Error(`reset not processed: ${JSON.stringify(rows)}`);
      await new Promise((r) => setTimeout(r, 100));
    }
    const tokens = await ctx.db('person_tokens').where({ person_id: person.id, purpose: 'password-reset' });
    expect(tokens).toHaveLength(1);
    const audit = await ctx.db('audit_events').where({ entity: 'person', entity_id: String(person.id), action: 'person.password-reset-requested' });
    expect(audit).toHaveLength(1);
  });
});
