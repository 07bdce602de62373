import request from 'supertest';
import { anonymousAgent, createPerson, createTestContext, signedInAgent, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

describe('POST /api/session', () => {
  describe('with the right e-mail and password', () => {
    it('signs in, returns the person and a fresh CSRF token, and sets an HttpOnly SameSite cookie', async () => {
      const person = await createPerson(ctx.db, { role: 'officer' });
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const before = csrf();
      const res = await agent.post('/api/session').set('x-csrf-token', before).send({ email: person.email, password: person.password });
      expect(res.status).toBe(200);
      expect(res.body.user).toEqual({ id: person.id, email: person.email, name: expect.any(String), role: 'officer' });
      expect(res.body.csrfToken).toEqual(expect.any(String));
      expect(res.body.csrfToken).not.toBe(before);
      const cookie = String(res.headers['set-cookie']);
      expect(cookie).toMatch(/voltcrib\.sid=/);
      expect(cookie).toMatch(/HttpOnly/i);
      expect(cookie).toMatch(/SameSite=Lax/i);

      const session = await agent.get('/api/session').expect(200);
      expect(session.body.user).toMatchObject({ id: person.id, email: person.email, role: 'officer' });
    });

    it('accepts the e-mail in any case and with spaces around it', async () => {
      const person = await createPerson(ctx.db);
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const res = await agent
        .post('/api/session')
        .set('x-csrf-token', csrf())
        .send({ email: `  ${person.email.toUpperCase()} `, password: person.password });
      expect(res.status).toBe(200);
    });

    it('gives a new session id at sign-in (no session fixation)', async () => {
      const person = await createPerson(ctx.db);
      const { agent, csrf } = await anonymousAgent(ctx.app);
      const anon = await agent.get('/api/session');
      const anonCookie = String(anon.headers['set-cookie'] ?? '');
      const res = await agent.post('/api/session').set('x-csrf-token', csrf()).send({ email: person.email, password: person.password });
      const sid = /voltcrib\.sid=([^;]+)/.exec(String(res.headers['set-cookie']))?.[1];
      expect(sid).toBeDefined();
      expect(anonCookie).not.toContain(sid!);
    });
  });

  describe('with a wrong password or an unknown e-mail', () => {
    it('answers 401 with the same body either way, so e-mails cannot be probed', async () => {
      const person = await createPerson(ctx.db);
      const a = await anonymousAgent(ctx.app);
      const wrong = await a.agent.post('/api/session').set('x-csrf-token', a.csrf()).send({ email: person.email, password: 'not the password' });
      const b = await anonymousAgent(ctx.app);
      const unknown = await b.agent
        .post('/api/session')
        .set('x-csrf-token', b.csrf())
        .send({ email: 'nobody-here@test.voltcrib.example', password: 'whatever' });
      expect(wrong.status).toBe(401);
      expect(unknown.status).toBe(401);
      expect(wrong.body).toEqual(unknown.body);
      expect(wrong.body.error.code).toBe('INVALID_CREDENTIALS');
    });

    it('refuses a deactivated person with the same answer', async () => {
      const person = await createPerson(ctx.db, { active: false });
      const a = await anonymousAgent(ctx.app);
      const res = await a.agent.post('/api/session').set('x-csrf-token', a.csrf()).send({ email: person.email, password: person.password });
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('INVALID_CREDENTIALS');
    });
  });

  describe('with a malformed body', () => {
    it('answers 400 with field errors', async () => {
      const a = await anonymousAgent(ctx.app);
      const res = await a.agent.post('/api/session').set('x-csrf-token', a.csrf()).send({ email: 'not-an-email', password: '' });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('VALIDATION_FAILED');
      expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['email', 'password']);
    });
  });

  describe('without the CSRF token', () => {
    it('answers 403 and does not sign in', async () => {
      const person = await createPerson(ctx.db);
      const agent = request.agent(ctx.app);
      await agent.get('/api/session');
      const res = await agent.post('/api/session').send({ email: person.email, password: person.password });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('CSRF_TOKEN_INVALID');
      const session = await agent.get('/api/session');
      expect(session.body.user).toBeNull();
    });
  });

  describe('after too many failures', () => {
    it('answers 429 even for the right password, without saying whether the e-mail exists', async () => {
      const limited = createTestContext({ LOGIN_RATE_LIMIT: '3' });
      try {
        const person = await createPerson(limited.db);
        const a = await anonymousAgent(limited.app);
        for (let i = 0; i < 3; i += 1) {
          const res = await a.agent
            .post('/api/session')
            .set('x-csrf-token', a.csrf())
            .send({ email: person.email, password: `wrong-${i}` });
          expect(res.status).toBe(401);
        }
        const blocked = await a.agent.post('/api/session').set('x-csrf-token', a.csrf()).send({ email: person.email, password: person.password });
        expect(blocked.status).toBe(429);
        expect(blocked.body.error.code).toBe('RATE_LIMITED');
      } finally {
        await limited.close();
      }
    });
  });
});

describe('DELETE /api/session', () => {
  it('signs out and ends the session on the server', async () => {
    const person = await createPerson(ctx.db);
    const { agent, csrf } = await signedInAgent(ctx.app, person);
    await agent.delete('/api/session').set('x-csrf-token', csrf()).expect(204);
    const res = await agent.get('/api/session').expect(200);
    expect(res.body.user).toBeNull();
    const rows = await ctx.db('sessions').where({ person_id: person.id });
    expect(rows).toHaveLength(0);
  });
});

describe('GET /api/session', () => {
  it('returns a null user and a CSRF token when signed out', async () => {
    const res = await request(ctx.app).get('/api/session').expect(200);
    expect(res.body).toEqual({ user: null, csrfToken: expect.any(String), labTimeZone: expect.any(String) });
    expect(res.headers['cache-control']).toBe('no-store');
  });
});
