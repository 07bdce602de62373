// Mail through a real SMTP conversation with the local fake server.
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logger';
import { startFakeSmtp, type FakeSmtp } from '../../../server/mail/fake-smtp';
import { OutboxWorker } from '../../../server/mail/outbox';
import { createTransport } from '../../../server/mail/transport';
import { post } from '../../helpers/booking-flow';
import { insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { MAIL_TEST_DATABASE } from '../../../scripts/lib/test-database';
import { anonymousAgent, createPerson, createTestContext, signedInAgent, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let smtp: FakeSmtp;
let worker: OutboxWorker;

beforeAll(async () => {
  ctx = createTestContext({ DB_NAME: MAIL_TEST_DATABASE });
  smtp = await startFakeSmtp();
  // The app under test, with the fake's mailbox wired in.
  ctx.app = createApp({ db: ctx.db, config: ctx.config, logger: createLogger('silent'), mailbox: smtp });
  worker = new OutboxWorker(ctx.db, createTransport(smtp.url), 'Voltcrib <voltcrib@localhost>');
});
afterAll(async () => {
  await smtp.close();
  await ctx.close();
});

async function drainUntil(predicate: () => boolean, timeoutMs = 10_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!predicate()) {
    if (Date.now() > deadline) throw new Error('timed out waiting for mail');
    await worker.drain(50);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const tokenFrom = (text: string, path: string) => new RegExp(`/${path}/([A-Za-z0-9_-]+)`).exec(text)?.[1];

describe('approval mail', () => {
  it('asks the officers when a booking needs approval, and tells the member the decision', async () => {
    const member = await signedInAs(ctx, 'member');
    const officer = await signedInAs(ctx, 'officer');
    await qualify(ctx.db, member.person.id, 50);
    const kit = await insertKit(ctx.db);
    const res = await post(member, '/api/bookings', {
      itemIds: kit.all.map((i) => i.id),
      ...windowFromNow(),
      location: 'Bay 1',
      purpose: 'Wire-cylinder corona at 25 kV',
      plan: plan(25),
    });
    const id = res.body.booking.id;
    await drainUntil(() => smtp.list().some((m) => m.to.includes(officer.person.email) && m.subject.includes(`booking #${id}`)));
    const request_ = smtp.list().find((m) => m.to.includes(officer.person.email) && m.subject.includes(`booking #${id}`))!;
    expect(request_.subject).toMatch(/Approval needed: 25 kV/);
    expect(request_.text).toMatch(/above the lab's approval voltage/);
    expect(request_.text).toContain(`${ctx.config.publicUrl}/approvals`);
    expect(request_.html).toContain('<a href=');

    await post(officer, `/api/bookings/${id}/approval`, {
      decision: 'approve',
      planVersion: res.body.booking.planVersion,
      conditions: 'Observer present',
    }).expect(200);
    await drainUntil(() => smtp.list().some((m) => m.to.includes(member.person.email) && m.subject.startsWith('Approved')));
    const decision = smtp.list().find((m) => m.to.includes(member.person.email) && m.subject.startsWith('Approved'))!;
    expect(decision.text).toContain('Conditions: Observer present');
  });
});

describe('outbox retries', () => {
  it('keeps the mail while the SMTP server is down and delivers it when it comes back', async () => {
    const port = smtp.port;
    const down = await startFakeSmtp();
    const localWorker = new OutboxWorker(ctx.db, createTransport(down.url), 'Voltcrib <voltcrib@localhost>');
    await down.close();
    const [id] = await ctx.db('outbox').insert({
      kind: 'test',
      to_address: 'retry@test.voltcrib.example',
      subject: 'Retry check',
      text_body: 'x',
      html_body: '<p>x</p>',
      next_attempt_at: new Date(),
    });
    // Only this row is due for the local worker: drain until it has tried ours.
    for (let i = 0; i < 20; i += 1) {
      await localWorker.drain(200);
      const row = await ctx.db('outbox').where({ id }).first();
      if (row.attempts > 0) break;
    }
    const failed = await ctx.db('outbox').where({ id }).first();
    expect(failed).toMatchObject({ state: 'pending', attempts: 1 });
    expect(failed.last_error).toMatch(/ECONNREFUSED|connect/i);
    expect(new Date(failed.next_attempt_at).getTime()).toBeGreaterThan(Date.now());

    const back = await startFakeSmtp({ port: down.port });
    try {
      const worker2 = new OutboxWorker(ctx.db, createTransport(back.url), 'Voltcrib <voltcrib@localhost>');
      const deadline = Date.now() + 15_000;
      while (!back.list().some((m) => m.subject === 'Retry check')) {
        if (Date.now() > deadline) throw new Error('not delivered after the SMTP server came back');
        await worker2.drain(200);
        await new Promise((r) => setTimeout(r, 250));
      }
      const sent = await ctx.db('outbox').where({ id }).first();
      expect(sent).toMatchObject({ state: 'sent', attempts: 2 });
      expect(back.list().filter((m) => m.subject === 'Retry check')).toHaveLength(1);
    } finally {
      await back.close();
    }
    expect(port).toBe(smtp.port);
  }, 30_000);
});

describe('password reset', () => {
  it('answers 202 whatever the e-mail, and sends a single-use link to real accounts', async () => {
    const person = await createPerson(ctx.db);
    const a = await anonymousAgent(ctx.app);
    const unknown = await a.agent.post('/api/password-resets').set('x-csrf-token', a.csrf()).send({ email: 'nobody@test.voltcrib.example' });
    const known = await a.agent.post('/api/password-resets').set('x-csrf-token', a.csrf()).send({ email: person.email });
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(unknown.body).toEqual(known.body);

    const session = await signedInAgent(ctx.app, person);
    await drainUntil(() => smtp.list().some((m) => m.to.includes(person.email)));
    const mail = smtp.list().find((m) => m.to.includes(person.email))!;
    const token = tokenFrom(mail.text, 'reset-password')!;
    expect(token).toBeDefined();
    const stored = await ctx.db('person_tokens').where({ person_id: person.id }).first();
    expect(stored.token_hash).not.toContain(token);

    const weak = await a.agent.post(`/api/password-resets/${token}`).set('x-csrf-token', a.csrf()).send({ password: 'short' });
    expect(weak.status).toBe(400);
    const ok = await a.agent.post(`/api/password-resets/${token}`).set('x-csrf-token', a.csrf()).send({ password: 'a brand new long password' });
    expect(ok.status).toBe(200);
    const again = await a.agent.post(`/api/password-resets/${token}`).set('x-csrf-token', a.csrf()).send({ password: 'another long password!' });
    expect(again.status).toBe(410);
    // The old session ended; the new password works, the old one does not.
    expect((await session.agent.get('/api/session')).body.user).toBeNull();
    await expect(signedInAgent(ctx.app, { email: person.email, password: person.password })).rejects.toThrow(/401/);
    await signedInAgent(ctx.app, { email: person.email, password: 'a brand new long password' });
  });

  it('refuses an expired link', async () => {
    const person = await createPerson(ctx.db);
    const a = await anonymousAgent(ctx.app);
    await a.agent.post('/api/password-resets').set('x-csrf-token', a.csrf()).send({ email: person.email }).expect(202);
    await drainUntil(() => smtp.list().some((m) => m.to.includes(person.email)));
    const token = tokenFrom(smtp.list().find((m) => m.to.includes(person.email))!.text, 'reset-password')!;
    await ctx
      .db('person_tokens')
      .where({ person_id: person.id })
      .update({ expires_at: new Date(Date.now() - 1000) });
    const res = await a.agent.post(`/api/password-resets/${token}`).set('x-csrf-token', a.csrf()).send({ password: 'a brand new long password' });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('LINK_EXPIRED');
  });
});

describe('invitations and people', () => {
  it('a manager invites; the link sets a password once; the person signs in', async () => {
    const manager = await signedInAs(ctx, 'manager');
    const email = `invitee-${Date.now()}@test.voltcrib.example`;
    const res = await post(manager, '/api/invitations', { email, name: 'Ilse Varga-Thorne', role: 'member' });
    expect(res.status).toBe(201);
    expect((await post(manager, '/api/invitations', { email, name: 'Again', role: 'member' })).status).toBe(409);
    await drainUntil(() => smtp.list().some((m) => m.to.includes(email)));
    const token = tokenFrom(smtp.list().find((m) => m.to.includes(email))!.text, 'invitation')!;
    const a = await anonymousAgent(ctx.app);
    expect((await a.agent.post(`/api/invitations/${token}`).set('x-csrf-token', a.csrf()).send({ password: 'my first lab password' })).status).toBe(200);
    expect((await a.agent.post(`/api/invitations/${token}`).set('x-csrf-token', a.csrf()).send({ password: 'my second lab password' })).status).toBe(410);
    await signedInAgent(ctx.app, { email, password: 'my first lab password' });
    const member = await signedInAs(ctx, 'member');
    expect((await post(member, '/api/invitations', { email: 'x@test.voltcrib.example', name: 'X Y', role: 'manager' })).status).toBe(403);
  });

  it('deactivating a person ends their sessions at once and blocks sign-in; a role change signs them out', async () => {
    const manager = await signedInAs(ctx, 'manager');
    const target = await signedInAs(ctx, 'member');
    const roleChange = await manager.agent.patch(`/api/people/${target.person.id}`).set('x-csrf-token', manager.csrf()).send({ role: 'officer' });
    expect(roleChange.body.person.role).toBe('officer');
    expect((await target.agent.get('/api/session')).body.user).toBeNull();

    const again = await signedInAgent(ctx.app, target.person);
    expect((await again.agent.get('/api/session')).body.user.role).toBe('officer');
    await manager.agent.patch(`/api/people/${target.person.id}`).set('x-csrf-token', manager.csrf()).send({ active: false }).expect(200);
    expect((await again.agent.get('/api/session')).body.user).toBeNull();
    await expect(signedInAgent(ctx.app, target.person)).rejects.toThrow(/401/);
    const audit = await manager.agent.get(`/api/audit?entity=person&id=${target.person.id}`).expect(200);
    expect(audit.body.events.map((e: { action: string }) => e.action)).toEqual(['person.deactivated', 'person.updated']);
    expect((await manager.agent.patch(`/api/people/${manager.person.id}`).set('x-csrf-token', manager.csrf()).send({ active: false })).status).toBe(403);
  });
});

describe('GET /api/mailbox', () => {
  it('lists what the fake SMTP server received, newest first, for managers only', async () => {
    const manager = await signedInAs(ctx, 'manager');
    const res = await manager.agent.get('/api/mailbox').expect(200);
    expect(res.body.messages.length).toBeGreaterThan(0);
    const first = res.body.messages[0];
    expect(Object.keys(first).sort()).toEqual(['id', 'receivedAt', 'subject', 'text', 'to']);
    const times = res.body.messages.map((m: { receivedAt: string }) => m.receivedAt);
    expect(times).toEqual([...times].sort().reverse());
    const member = await signedInAs(ctx, 'member');
    expect((await member.agent.get('/api/mailbox')).status).toBe(403);
  });

  it('answers 404 when no local fake is in use', async () => {
    const plain = createTestContext({ DB_NAME: MAIL_TEST_DATABASE });
    try {
      const manager = await signedInAs(plain, 'manager');
      expect((await manager.agent.get('/api/mailbox')).status).toBe(404);
      expect((await request(plain.app).get('/api/mailbox')).status).toBe(401);
    } finally {
      await plain.close();
    }
  });
});
