// A signed-in request reads its session from this process's recent copy (server/auth/session-cache.ts);
// every way a session ends must still take effect on the very next request.
import request from 'supertest';
import { createPerson, createTestContext, anonymousAgent, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

/** Signs in and hands back the raw session cookie, so a request can replay it after sign-out. */
async function signInForCookie(person: { email: string; password: string }) {
  const session = await anonymousAgent(ctx.app);
  const res = await session.agent.post('/api/session').set('x-csrf-token', session.csrf()).send({ email: person.email, password: person.password }).expect(200);
  const cookie = String(res.headers['set-cookie']).split(';')[0]!;
  await session.refresh();
  return { ...session, cookie };
}

describe('the session copy never outlives the session', () => {
  it('a replayed cookie is signed out right after sign-out', async () => {
    const person = await createPerson(ctx.db);
    const { agent, csrf, cookie } = await signInForCookie(person);
    // Twice, so the second read is served from the copy.
    for (let i = 0; i < 2; i += 1) await request(ctx.app).get('/api/bookings').set('cookie', cookie).expect(200);
    await agent.delete('/api/session').set('x-csrf-token', csrf()).expect(204);
    expect((await request(ctx.app).get('/api/bookings').set('cookie', cookie)).status).toBe(401);
  });

  it.each([
    ['a role change', { role: 'officer' }],
    ['a deactivation', { active: false }],
  ])('%s signs the person out on their next request', async (_what, change) => {
    const manager = await signedInAs(ctx, 'manager');
    const member = await signedInAs(ctx, 'member');
    for (let i = 0; i < 2; i += 1) await member.agent.get('/api/bookings').expect(200);
    await manager.agent.patch(`/api/people/${member.person.id}`).set('x-csrf-token', manager.csrf()).send(change).expect(200);
    expect((await member.agent.get('/api/bookings')).status).toBe(401);
  });
  // A new password ending the old sessions is checked in tests/api/mail/outbox.test.ts.
});
