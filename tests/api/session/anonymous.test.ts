// Anonymous traffic cannot grow the sessions table: no row (and no session cookie) until a
// sign-in; the CSRF token of a signed-out visitor is a signed double-submit cookie. Expired rows
// are purged on the scheduler (server/jobs/purge.ts).
import request from 'supertest';
import { purgeExpired } from '../../../server/jobs/purge';
import { createPerson, createTestContext, uniqueEmail, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

/** Rows without a signed-in person: only anonymous visits could write them. */
async function anonymousRows(): Promise<number> {
  const row = await ctx.db('sessions').whereNull('person_id').count({ n: '*' }).first();
  return Number(row?.n);
}

const sidCookie = (res: { headers: Record<string, unknown> }) =>
  ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('voltcrib.sid='));

describe('anonymous visitors', () => {
  it('write no session row and get no session cookie, however many requests they send', async () => {
    const before = await anonymousRows();
    const answers = [];
    for (let round = 0; round < 10; round += 1) {
      answers.push(...(await Promise.all(Array.from({ length: 50 }, () => request(ctx.app).get('/api/session')))));
    }
    expect(answers.every((a) => a.status === 200 && a.body.user === null && typeof a.body.csrfToken === 'string')).toBe(true);
    expect(answers.filter(sidCookie)).toHaveLength(0);
    expect(await anonymousRows()).toBe(before);
    console.log(
      `[anonymous] ${answers.length} anonymous GET /api/session: ${answers.filter(sidCookie).length} session cookies, ${(await anonymousRows()) - before} new session rows`,
    );
  });

  it('write none either when a sign-in fails or a password reset is asked for', async () => {
    const before = await anonymousRows();
    const agent = request.agent(ctx.app);
    const { body } = await agent.get('/api/session').expect(200);
    const failed = await agent
      .post('/api/session')
      .set('x-csrf-token', body.csrfToken)
      .send({ email: uniqueEmail('nobody'), password: 'wrong' });
    expect(failed.status).toBe(401);
    expect(sidCookie(failed)).toBeUndefined();
    const reset = await agent
      .post('/api/password-resets')
      .set('x-csrf-token', body.csrfToken)
      .send({ email: uniqueEmail('nobody') });
    expect(reset.status).toBe(202);
    expect(await anonymousRows()).toBe(before);
  });

  it('sign in with the double-submit token, and only with it', async () => {
    const person = await createPerson(ctx.db);
    // Without the cookie that carries the token: refused.
    const token = (await request(ctx.app).get('/api/session')).body.csrfToken as string;
    const noCookie = await request(ctx.app).post('/api/session').set('x-csrf-token', token).send({ email: person.email, password: person.password });
    expect(noCookie.status).toBe(403);
    expect(noCookie.body.error.code).toBe('CSRF_TOKEN_INVALID');

    // With one visitor's cookie and another visitor's token: refused.
    const agent = request.agent(ctx.app);
    await agent.get('/api/session').expect(200);
    const mismatched = await agent.post('/api/session').set('x-csrf-token', token).send({ email: person.email, password: person.password });
    expect(mismatched.status).toBe(403);

    // A forged token in both places (not signed with the server's secret): refused.
    const forged = 'a'.repeat(64) + '.' + 'b'.repeat(64);
    const forgedRes = await request(ctx.app)
      .post('/api/session')
      .set('Cookie', `voltcrib.csrf=${forged}`)
      .set('x-csrf-token', forged)
      .send({ email: person.email, password: person.password });
    expect(forgedRes.status).toBe(403);

    // The visitor's own cookie and token: signed in, with a session row and a token of the session.
    const own = request.agent(ctx.app);
    const visit = await own.get('/api/session').expect(200);
    const ok = await own.post('/api/session').set('x-csrf-token', visit.body.csrfToken).send({ email: person.email, password: person.password });
    expect(ok.status).toBe(200);
    expect(sidCookie(ok)).toBeDefined();
    expect(await ctx.db('sessions').where({ person_id: person.id })).toHaveLength(1);
    // Signed in, the anonymous token no longer works; the session's own does.
    const stale = await own.delete('/api/session').set('x-csrf-token', visit.body.csrfToken);
    expect(stale.status).toBe(403);
    await own.delete('/api/session').set('x-csrf-token', ok.body.csrfToken).expect(204);
  });
});

describe('expired sessions', () => {
  it('are purged on the schedule, and live ones are kept', async () => {
    const past = new Date(Date.now() - 60_000);
    const future = new Date(Date.now() + 3600_000);
    const sids = [`purge-old-${process.pid}-${Date.now()}`, `purge-live-${process.pid}-${Date.now()}`];
    await ctx.db('sessions').insert([
      { sid: sids[0], sess: JSON.stringify({ cookie: {} }), expired: past },
      { sid: sids[1], sess: JSON.stringify({ cookie: {} }), expired: future },
    ]);
    const purged = await purgeExpired(ctx.db);
    expect(purged.sessions).toBeGreaterThanOrEqual(1);
    expect(await ctx.db('sessions').whereIn('sid', sids).pluck('sid')).toEqual([sids[1]]);
    await ctx.db('sessions').where({ sid: sids[1] }).delete();
  });

  it('purges expired throttling counters too', async () => {
    const key = `purge-test:${process.pid}:${Date.now()}`;
    await ctx.db('rate_limits').insert([
      { key: `${key}:old`, points: 3, expire: Date.now() - 1000 },
      { key: `${key}:live`, points: 3, expire: Date.now() + 600_000 },
    ]);
    await purgeExpired(ctx.db);
    expect(await ctx.db('rate_limits').where('key', 'like', `${key}:%`).pluck('key')).toEqual([`${key}:live`]);
  });
});
