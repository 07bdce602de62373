// The web-facing defences: the session cookie's flags, session ids across sign-in and sign-out,
// the Content-Security-Policy, how stored uploads are served, the rate limits on the account
// endpoints, and the audit chain's tamper evidence.
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { verifyAuditChain } from '../../../server/services/audit';
import { pngBytes, World } from '../../helpers/route-fixtures';
import { anonymousAgent, createPerson, createTestContext, signedInAs, uniqueEmail, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

const SID = 'voltcrib.sid';

function sessionCookie(res: { headers: Record<string, unknown> }): string | undefined {
  const cookies = ([] as string[]).concat((res.headers['set-cookie'] as string[] | string | undefined) ?? []);
  return cookies.find((c) => c.startsWith(`${SID}=`));
}

/** The session id as the store keys it: the cookie carries `s:<id>.<signature>`. */
function sessionId(cookie: string | undefined): string {
  const value = decodeURIComponent(cookie!.split(';')[0]!.slice(SID.length + 1));
  return value.slice(2, value.lastIndexOf('.'));
}

async function sessionRow(sid: string) {
  return ctx.db('sessions').where({ sid }).first('sid');
}

const CSRF_COOKIE = 'voltcrib.csrf';

function cookieNamed(res: { headers: Record<string, unknown> }, name: string): string | undefined {
  const cookies = ([] as string[]).concat((res.headers['set-cookie'] as string[] | string | undefined) ?? []);
  return cookies.find((c) => c.startsWith(`${name}=`));
}

/** Signs in with plain requests (no cookie jar), so every cookie the server sets can be read. */
async function signInRaw(app: TestContext['app'], person: { email: string; password: string }, headers: Record<string, string> = {}) {
  const visit = await request(app).get('/api/session').set(headers).expect(200);
  const csrfCookie = ([] as string[]).concat((visit.headers['set-cookie'] as unknown as string[]) ?? []).find((c) => /voltcrib\.csrf=/.test(c))!;
  const res = await request(app)
    .post('/api/session')
    .set(headers)
    .set('Cookie', csrfCookie.split(';')[0]!)
    .set('x-csrf-token', visit.body.csrfToken)
    .send({ email: person.email, password: person.password });
  return { visit, res };
}

describe('the session cookie', () => {
  it('is set only at sign-in, HttpOnly and SameSite=Lax, and not Secure over plain http', async () => {
    const person = await createPerson(ctx.db);
    const { visit, res } = await signInRaw(ctx.app, person);
    expect(res.status).toBe(200);
    // A signed-out visit has no session at all; its CSRF token rides in a signed cookie of its own.
    expect(sessionCookie(visit)).toBeUndefined();
    const csrf = cookieNamed(visit, CSRF_COOKIE);
    expect(csrf).toMatch(/;\s*HttpOnly/i);
    expect(csrf).toMatch(/;\s*SameSite=Strict/i);
    const cookie = sessionCookie(res);
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).not.toMatch(/;\s*Secure/i);
  });

  describe('when PUBLIC_URL is https', () => {
    let https: TestContext;
    beforeAll(() => {
      // Behind a TLS-terminating proxy: the app learns the scheme from X-Forwarded-Proto.
      https = createTestContext({ PUBLIC_URL: 'https://hv.example.org', SESSION_SECRET: 'x'.repeat(32), TRUST_PROXY: 'true' });
    });
    afterAll(() => https.close());

    it('is also Secure, and the CSRF cookie is a Secure __Host- cookie', async () => {
      const person = await createPerson(https.db);
      const { visit, res } = await signInRaw(https.app, person, { 'X-Forwarded-Proto': 'https' });
      expect(res.status).toBe(200);
      expect(cookieNamed(visit, `__Host-${CSRF_COOKIE}`)).toMatch(/;\s*Secure/i);
      const cookie = sessionCookie(res);
      expect(cookie).toMatch(/;\s*Secure/i);
      expect(cookie).toMatch(/;\s*HttpOnly/i);
      expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    });

    it('is never sent over plain http', async () => {
      const person = await createPerson(https.db);
      const { res } = await signInRaw(https.app, person);
      expect(sessionCookie(res)).toBeUndefined();
    });

    it('asks browsers to upgrade insecure requests', async () => {
      const res = await request(https.app).get('/api/health').set('X-Forwarded-Proto', 'https');
      expect(String(res.headers['content-security-policy'])).toMatch(/(^|;)\s*upgrade-insecure-requests/);
    });
  });
});

describe('the session id', () => {
  it('is new at sign-in (a signed-out visit has none) and its row is deleted at sign-out', async () => {
    const person = await createPerson(ctx.db);
    const agent = request.agent(ctx.app);
    const visit = await agent.get('/api/session').expect(200);
    expect(sessionCookie(visit)).toBeUndefined();

    const signIn = await agent
      .post('/api/session')
      .set('x-csrf-token', visit.body.csrfToken)
      .send({ email: person.email, password: person.password })
      .expect(200);
    const signedSid = sessionId(sessionCookie(signIn));
    expect(await sessionRow(signedSid)).toBeDefined();

    const token = (await agent.get('/api/session').expect(200)).body.csrfToken as string;
    await agent.delete('/api/session').set('x-csrf-token', token).expect(204);
    expect(await sessionRow(signedSid)).toBeUndefined();
    // The old cookie, replayed, is a signed-out visitor.
    const replay = await request(ctx.app)
      .get('/api/session')
      .set('Cookie', `${SID}=${encodeURIComponent(`s:${signedSid}`)}`);
    expect(replay.body.user).toBeNull();
  });

  it('refuses a state-changing request without the CSRF token, even when signed in', async () => {
    const who = await signedInAs(ctx, 'manager');
    const res = await who.agent.post('/api/items').send({ kind: 'meter', name: 'No token', location: 'Bay 1', ratings: { maxKv: null } });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CSRF_TOKEN_INVALID');
  });
});

/** Directive name → its source list, from a CSP header. */
function parseCsp(header: unknown): Record<string, string[]> {
  return Object.fromEntries(
    String(header ?? '')
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...values]) => [name!.toLowerCase(), values]),
  );
}

describe('the Content-Security-Policy', () => {
  it.each(['/', '/i/KH-MUL-0001', '/api/health'])('on %s allows only our own origin, no inline script, no plugins, no framing', async (path) => {
    // The web app's index may be 503 text when dist/ is not built; the header is there either way.
    const res = await request(ctx.app).get(path);
    const csp = parseCsp(res.headers['content-security-policy']);
    expect(csp['default-src']).toEqual(["'self'"]);
    expect(csp['script-src']).toBeDefined();
    expect(csp['script-src']).not.toContain("'unsafe-inline'");
    expect(csp['script-src']).not.toContain("'unsafe-eval'");
    expect(csp['script-src']!.some((s) => s === '*' || s.startsWith('http:') || s === 'data:')).toBe(false);
    expect(csp['object-src']).toEqual(["'none'"]);
    expect(csp['frame-ancestors']).toEqual(["'none'"]);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('caching', () => {
  it('forbids any copy of an API answer and sends no ETag to revalidate one', async () => {
    const member = await signedInAs(ctx, 'member');
    for (const path of ['/api/session', '/api/items', '/api/bookings?mine=1', '/api/no-such-route']) {
      const res = await member.agent.get(path);
      expect(res.headers['cache-control']).toBe('no-store');
      expect(res.headers.etag).toBeUndefined();
    }
  });

  it('lets the browser revalidate the web app (ETag, no-cache) and keep its hashed bundles', async () => {
    // `npm test` builds the web app before the suites run.
    const index = await request(ctx.app).get('/gear');
    expect(index.status).toBe(200);
    expect(index.headers['cache-control']).toBe('no-cache');
    expect(index.headers.etag).toMatch(/^W\/"/);
    expect((await request(ctx.app).get('/gear').set('If-None-Match', index.headers.etag!)).status).toBe(304);
    const bundle = /src="(\/_expo\/static\/js\/web\/[^"]+\.js)"/.exec(index.text)?.[1];
    expect(bundle).toBeDefined();
    const js = await request(ctx.app).get(bundle!);
    expect(js.status).toBe(200);
    expect(js.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(js.headers['x-powered-by']).toBeUndefined();
  });
});

describe('stored uploads', () => {
  let world: World;
  let officer: Awaited<ReturnType<World['caller']>>;
  beforeAll(async () => {
    world = await World.create(ctx);
    officer = await world.caller('officer');
  });
  afterAll(() => world.close());

  async function upload(fileName: string, bytes: Buffer) {
    const item = await world.item('probe');
    const res = await officer.agent
      .post(`/api/items/${item.id}/files`)
      .set('x-csrf-token', officer.csrf())
      .attach('file', bytes, { filepath: fileName } as unknown as string);
    expect(res.status).toBe(201);
    return res.body.file as { id: number; fileName: string };
  }

  it('are served as data: Content-Disposition, nosniff, their real type and a sandboxing policy', async () => {
    const file = await upload('bench.png', pngBytes());
    const res = await officer.agent.get(`/api/files/${file.id}`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['content-disposition']).toMatch(/^inline; filename="bench\.png"; filename\*=UTF-8''bench\.png$/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    const csp = parseCsp(res.headers['content-security-policy']);
    expect(csp['default-src']).toEqual(["'none'"]);
    expect(csp.sandbox).toBeDefined();
    // A file never changes under its id: the browser may keep it, for this person only.
    expect(res.headers['cache-control']).toBe('private, max-age=3600');
  });

  it('keep a hostile stored name from breaking out of the Content-Disposition header', async () => {
    const file = await upload('bench"; filename=evil.html; x=".png', pngBytes());
    const res = await officer.agent.get(`/api/files/${file.id}`).buffer(true);
    expect(res.status).toBe(200);
    const disposition = String(res.headers['content-disposition']);
    const quoted = disposition.match(/^inline; filename="([^"]*)"; filename\*=UTF-8''([^;\s]+)$/);
    expect(quoted).not.toBeNull();
    expect(quoted![1]).not.toContain('"');
    expect(decodeURIComponent(quoted![2]!)).toBe(file.fileName);
  });

  it('keep a non-ASCII name as sent (UTF-8 in the multipart header, UTF-8 in filename*)', async () => {
    const file = await upload('Prüfbericht 🔌.png', pngBytes());
    expect(file.fileName).toBe('Prüfbericht 🔌.png');
    const res = await officer.agent.get(`/api/files/${file.id}`).buffer(true);
    const encoded = /filename\*=UTF-8''([^;\s]+)/.exec(String(res.headers['content-disposition']))?.[1];
    expect(decodeURIComponent(encoded ?? '')).toBe('Prüfbericht 🔌.png');
  });

  it('are not served to signed-out visitors', async () => {
    const file = await upload('bench.png', pngBytes());
    const res = await request(ctx.app).get(`/api/files/${file.id}`);
    expect(res.status).toBe(401);
  });
});

describe('rate limits (LOGIN_RATE_LIMIT=3)', () => {
  // Counts live in the database; each case uses an account, e-mail or link of its own.
  let limited: TestContext;
  beforeEach(() => {
    limited = createTestContext({ LOGIN_RATE_LIMIT: '3' });
  });
  afterEach(() => limited.close());

  async function hammer(path: string, body: object, times: number) {
    const { agent, csrf } = await anonymousAgent(limited.app);
    const statuses: number[] = [];
    let last: { status: number; body: { error?: { code?: string } } } | undefined;
    for (let i = 0; i < times; i += 1) {
      last = await agent.post(path).set('x-csrf-token', csrf()).send(body);
      statuses.push(last.status);
    }
    return { statuses, last: last! };
  }

  it('answers 429 on the fourth failed sign-in', async () => {
    const person = await createPerson(limited.db);
    const { statuses, last } = await hammer('/api/session', { email: person.email, password: 'not the password' }, 4);
    expect(statuses).toEqual([401, 401, 401, 429]);
    expect(last.body.error?.code).toBe('RATE_LIMITED');
  });

  it('answers 429 on the fourth password-reset request', async () => {
    const { statuses, last } = await hammer('/api/password-resets', { email: uniqueEmail('nobody') }, 4);
    expect(statuses).toEqual([202, 202, 202, 429]);
    expect(last.body.error?.code).toBe('RATE_LIMITED');
  });

  it('answers 429 on the fourth attempt to accept an invitation', async () => {
    const { statuses, last } = await hammer(`/api/invitations/${randomBytes(32).toString('base64url')}`, { password: 'a long enough password' }, 4);
    expect(statuses).toEqual([410, 410, 410, 429]);
    expect(last.body.error?.code).toBe('RATE_LIMITED');
  });
});

describe('the audit chain', () => {
  it('verifies through the API', async () => {
    const officer = await signedInAs(ctx, 'officer');
    const res = await officer.agent.get('/api/audit/verify');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, checked: expect.any(Number), brokenAtId: null });
  });

  // Tampering with the shared chain would break every suite running beside this one, so the edits
  // happen inside a transaction that is rolled back. verifyAuditChain(db) takes a Knex; a
  // transaction is one, and its own transaction then nests as a savepoint that sees the edit.
  async function auditIdOfNewItem(): Promise<number> {
    const manager = await signedInAs(ctx, 'manager');
    const res = await manager.agent
      .post('/api/items')
      .set('x-csrf-token', manager.csrf())
      .send({ kind: 'meter', name: 'Audit probe meter', location: 'Bay 1', ratings: { maxKv: null } });
    expect(res.status).toBe(201);
    const row = await ctx
      .db('audit_events')
      .where({ entity: 'item', entity_id: String(res.body.item.id), action: 'item.created' })
      .first('id');
    return Number(row.id);
  }

  it('chains entries in the database exactly as the verifier recomputes them, whatever the text', async () => {
    // The database hashes the UTF-8 bytes (migration 20261202001000); Node's verifier must agree
    // for accents, symbols outside the BMP, quotes and backslashes alike.
    const manager = await signedInAs(ctx, 'manager');
    const name = 'Prüfspitze “Ω” ⚡ 𝛀 \\ "quoted" 探针';
    const res = await manager.agent
      .post('/api/items')
      .set('x-csrf-token', manager.csrf())
      .send({ kind: 'meter', name, location: 'Bay 1', ratings: { maxKv: null } });
    expect(res.status).toBe(201);
    const row = await ctx
      .db('audit_events')
      .where({ entity: 'item', entity_id: String(res.body.item.id), action: 'item.created' })
      .first('after', 'hash');
    expect((typeof row.after === 'string' ? JSON.parse(row.after) : row.after).name).toBe(name);
    expect(row.hash).toMatch(/^[0-9a-f]{64}$/);
    expect((await verifyAuditChain(ctx.db)).ok).toBe(true);
  });

  it('finds an entry edited behind the application’s back', async () => {
    const id = await auditIdOfNewItem();
    const trx = await ctx.db.transaction();
    try {
      await trx('audit_events')
        .where({ id })
        .update({ after: JSON.stringify({ name: 'Someone else’s meter' }) });
      expect(await verifyAuditChain(trx)).toEqual({ ok: false, checked: expect.any(Number), brokenAtId: id });
    } finally {
      await trx.rollback();
    }
    expect((await verifyAuditChain(ctx.db)).ok).toBe(true);
  });

  it('finds an entry removed from the middle of the chain', async () => {
    const id = await auditIdOfNewItem();
    await auditIdOfNewItem(); // so the removed entry has a successor
    const trx = await ctx.db.transaction();
    try {
      await trx('audit_events').where({ id }).delete();
      const result = await verifyAuditChain(trx);
      expect(result.ok).toBe(false);
      expect(result.brokenAtId).toBeGreaterThan(id);
    } finally {
      await trx.rollback();
    }
  });
});
