// Sign-in, password-reset and invitation-link throttling (server/auth/throttle.ts): counted in the
// database per account and address (LOGIN_RATE_LIMIT, 10 per 15 min) and per address
// (LOGIN_RATE_LIMIT_PER_ADDRESS, 100 per 15 min). Behind TRUST_PROXY each case sends from an
// address of its own (X-Forwarded-For), so cases and suites never share a count.
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { createPerson, createTestContext, uniqueEmail, type TestContext } from '../../helpers/test-app';

const LIMITS = { LOGIN_RATE_LIMIT: '10', LOGIN_RATE_LIMIT_PER_ADDRESS: '100', TRUST_PROXY: 'true' };

let ctx: TestContext;
let second: TestContext;
beforeAll(() => {
  ctx = createTestContext(LIMITS);
  // A second app on the same database: another server process.
  second = createTestContext(LIMITS);
});
afterAll(async () => {
  await ctx.close();
  await second.close();
});

let lastOctet = 0;
/** An address no other case or run uses. */
function newAddress(): string {
  lastOctet += 1;
  return `10.${process.pid % 250}.${randomBytes(1)[0]!}.${lastOctet}`;
}

/** A visitor at `address`: its own cookie jar and anonymous CSRF token. */
async function visitor(app: TestContext['app'], address: string) {
  const agent = request.agent(app);
  const res = await agent.get('/api/session').set('X-Forwarded-For', address).expect(200);
  const token = res.body.csrfToken as string;
  const post = (path: string, body: unknown) =>
    agent
      .post(path)
      .set('X-Forwarded-For', address)
      .set('x-csrf-token', token)
      .send(body as object);
  return { signIn: (email: string, password: string) => post('/api/session', { email, password }), post };
}

const figures: string[] = [];
afterAll(() => console.log(`[throttling] ${figures.join('; ')}`));

describe('sign-in throttling', () => {
  it('limits one account from one address to 10 wrong passwords per 15 minutes, and lets another account sign in from the same address', async () => {
    const address = newAddress();
    const alice = await createPerson(ctx.db);
    const bob = await createPerson(ctx.db);
    const v = await visitor(ctx.app, address);
    const statuses: number[] = [];
    for (let i = 0; i < 10; i += 1) statuses.push((await v.signIn(alice.email, `wrong-${i}`)).status);
    expect(statuses).toEqual(Array(10).fill(401));
    const blocked = await v.signIn(alice.email, alice.password);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('RATE_LIMITED');
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(800);

    // The shared counter computer is not locked out: Bob signs in from it at once.
    const other = await visitor(ctx.app, address);
    expect((await other.signIn(bob.email, bob.password)).status).toBe(200);
    // And Alice herself, from her own desk.
    expect((await (await visitor(ctx.app, newAddress())).signIn(alice.email, alice.password)).status).toBe(200);
    figures.push(`account+address: 10 × 401 then 429 (Retry-After ${blocked.headers['retry-after']} s), another account from that address 200`);
  });

  it('answers an unknown account exactly as a known one, limit included', async () => {
    const address = newAddress();
    const known = await createPerson(ctx.db);
    const v = await visitor(ctx.app, address);
    const answers = async (email: string) => {
      const out: { status: number; body: unknown }[] = [];
      for (let i = 0; i < 11; i += 1) {
        const res = await v.signIn(email, 'not the password');
        out.push({ status: res.status, body: res.body });
      }
      return out;
    };
    const forKnown = await answers(known.email);
    const forUnknown = await answers(uniqueEmail('nobody'));
    expect(forUnknown).toEqual(forKnown);
    expect(forKnown.map((a) => a.status)).toEqual([...Array(10).fill(401), 429]);
  });

  it('counts malformed bodies as 400 against the address only, up to the address ceiling of 100', async () => {
    const address = newAddress();
    const person = await createPerson(ctx.db);
    const v = await visitor(ctx.app, address);
    // Fifty malformed bodies naming the person's e-mail: none counts against the account.
    for (let i = 0; i < 50; i += 1) {
      const res = await v.post('/api/session', { email: person.email, password: '' });
      expect(res.status).toBe(400);
    }
    for (let i = 0; i < 9; i += 1) expect((await v.signIn(person.email, `typo-${i}`)).status).toBe(401);
    expect((await v.signIn(person.email, person.password)).status).toBe(200);

    // The rest of the address's 100: 50 + 9 wrong so far (the success was given back) → 41 left.
    const anonymous = await visitor(ctx.app, address);
    const statuses: number[] = [];
    for (let i = 0; i < 45; i += 1) statuses.push((await anonymous.post('/api/session', { email: 'not-an-email' })).status);
    expect(statuses.filter((s) => s === 400)).toHaveLength(41);
    expect(statuses.slice(41)).toEqual([429, 429, 429, 429]);
    // Now the address is at its ceiling: even a right password waits.
    const fresh = await createPerson(ctx.db);
    expect((await (await visitor(ctx.app, address)).signIn(fresh.email, fresh.password)).status).toBe(429);
    figures.push('address ceiling: 50 malformed (400) + 9 wrong (401) + 1 right (200) + 41 malformed (400), then 429 for everything from that address');
  });

  it('caps one address at 100 wrong passwords spread over many accounts', async () => {
    const address = newAddress();
    const people = await Promise.all(Array.from({ length: 20 }, () => createPerson(ctx.db)));
    const v = await visitor(ctx.app, address);
    let unauthorised = 0;
    for (const p of people) for (let i = 0; i < 5; i += 1) if ((await v.signIn(p.email, `wrong-${i}`)).status === 401) unauthorised += 1;
    expect(unauthorised).toBe(100);
    const next = await createPerson(ctx.db);
    expect((await v.signIn(next.email, next.password)).status).toBe(429);
    figures.push('100 wrong over 20 accounts (5 each) from one address: all 401, the 101st attempt 429');
  });

  it('shares the counts between server processes', async () => {
    const address = newAddress();
    const person = await createPerson(ctx.db);
    const one = await visitor(ctx.app, address);
    const two = await visitor(second.app, address);
    for (let i = 0; i < 5; i += 1) expect((await one.signIn(person.email, `a-${i}`)).status).toBe(401);
    for (let i = 0; i < 5; i += 1) expect((await two.signIn(person.email, `b-${i}`)).status).toBe(401);
    expect((await one.signIn(person.email, person.password)).status).toBe(429);
    expect((await two.signIn(person.email, person.password)).status).toBe(429);
    figures.push('two processes: 5 + 5 wrong, then 429 on both');
  });

  it('counts parallel guesses before checking them, so a burst cannot overtake the limit', async () => {
    const address = newAddress();
    const person = await createPerson(ctx.db);
    const v = await visitor(ctx.app, address);
    const statuses = (await Promise.all(Array.from({ length: 25 }, (_, i) => v.signIn(person.email, `burst-${i}`)))).map((r) => r.status);
    expect(statuses.filter((s) => s === 401)).toHaveLength(10);
    expect(statuses.filter((s) => s === 429)).toHaveLength(15);
    figures.push(`25 parallel wrong passwords: ${statuses.filter((s) => s === 401).length} × 401, ${statuses.filter((s) => s === 429).length} × 429`);
  });
});

describe('password-reset throttling', () => {
  it('limits requests for one e-mail from one address to 10, while other e-mails from that address go on', async () => {
    const address = newAddress();
    const v = await visitor(ctx.app, address);
    const email = uniqueEmail('reset');
    const statuses: number[] = [];
    for (let i = 0; i < 11; i += 1) statuses.push((await v.post('/api/password-resets', { email })).status);
    expect(statuses).toEqual([...Array(10).fill(202), 429]);
    expect((await v.post('/api/password-resets', { email: uniqueEmail('reset') })).status).toBe(202);
    // A malformed request: 400, counted against the address only.
    expect((await v.post('/api/password-resets', { mail: email })).status).toBe(400);
  });

  it('limits tries of one reset link from one address to 10', async () => {
    const v = await visitor(ctx.app, newAddress());
    const token = randomBytes(32).toString('base64url');
    const statuses: number[] = [];
    for (let i = 0; i < 11; i += 1) statuses.push((await v.post(`/api/password-resets/${token}`, { password: 'a long enough password' })).status);
    expect(statuses).toEqual([...Array(10).fill(410), 429]);
  });
});

describe('invitation-link throttling', () => {
  it('limits tries of one invitation link from one address to 10, and a malformed link counts only against the address', async () => {
    const v = await visitor(ctx.app, newAddress());
    const token = randomBytes(32).toString('base64url');
    for (let i = 0; i < 20; i += 1) expect((await v.post('/api/invitations/short', { password: 'a long enough password' })).status).toBe(400);
    const statuses: number[] = [];
    for (let i = 0; i < 11; i += 1) statuses.push((await v.post(`/api/invitations/${token}`, { password: 'a long enough password' })).status);
    expect(statuses).toEqual([...Array(10).fill(410), 429]);
  });
});
