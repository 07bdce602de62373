import request from 'supertest';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

describe('GET /api/people (manager only)', () => {
  it('answers 401 with the error envelope when signed out', async () => {
    const res = await request(ctx.app).get('/api/people');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'UNAUTHENTICATED', message: expect.any(String) } });
  });

  it.each(['member', 'officer'] as const)('answers 403 for a %s', async (role) => {
    const { agent } = await signedInAs(ctx, role);
    const res = await agent.get('/api/people');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('FORBIDDEN');
  });

  it('lists people with role, group and last sign-in for a manager', async () => {
    const { agent, person } = await signedInAs(ctx, 'manager');
    const res = await agent.get('/api/people').expect(200);
    const me = res.body.people.find((p: { id: number }) => p.id === person.id);
    expect(me).toMatchObject({ email: person.email, role: 'manager', active: true, groupName: null });
    expect(new Date(me.lastSignInAt).getTime()).toBeGreaterThan(Date.now() - 60_000);
    expect(res.body.people[0]).not.toHaveProperty('password_hash');
  });
});
