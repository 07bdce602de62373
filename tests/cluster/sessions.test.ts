// Sessions, sign-in counts and their ends hold across processes: nothing a request needs lives in
// one process's memory. Each step below talks to one app process directly (not through the
// proxy), so "the other process" is certain.
import { createPerson, TEST_PASSWORD } from '../helpers/test-app';
import { appUrl, personSignedIn, startTestCluster, type ClusterContext } from './cluster-helpers';

let ctx: ClusterContext;
beforeAll(async () => {
  // The normal sign-in limit (10 per account and address), to see it counted across processes.
  ctx = await startTestCluster('voltcrib_cluster_sessions', { LOGIN_RATE_LIMIT: '10' });
}, 600_000);
afterAll(() => ctx.close());

/** A browser by hand: one cookie, sent to whichever process the step names. */
class Browser {
  cookies = new Map<string, string>();
  csrf = '';
  get cookie() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }
  async call(url: string, method: string, path: string, body?: unknown) {
    const res = await fetch(url + path, {
      method,
      headers: { cookie: this.cookie, 'x-csrf-token': this.csrf, ...(body ? { 'content-type': 'application/json' } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    for (const set of res.headers.getSetCookie()) {
      const [pair] = set.split(';');
      const at = pair!.indexOf('=');
      this.cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    const text = await res.text();
    const json = text ? (JSON.parse(text) as Record<string, unknown>) : {};
    if (typeof json.csrfToken === 'string') this.csrf = json.csrfToken;
    return { status: res.status, body: json };
  }
  async signIn(url: string, email: string, password: string) {
    await this.call(url, 'GET', '/api/session');
    return this.call(url, 'POST', '/api/session', { email, password });
  }
}

it('signed out on process 1: refused on process 2 at once, even right after process 2 served that session', async () => {
  const person = await createPerson(ctx.db);
  const browser = new Browser();
  expect((await browser.signIn(appUrl(ctx, 0), person.email, person.password)).status).toBe(200);
  // Process 2 serves the session (it would keep a copy if copies were allowed).
  const seen = await browser.call(appUrl(ctx, 1), 'GET', '/api/bookings');
  expect(seen.status).toBe(200);
  const cookies = new Map(browser.cookies);
  expect((await browser.call(appUrl(ctx, 0), 'DELETE', '/api/session')).status).toBe(204);
  // The old cookie, replayed at once on process 2.
  browser.cookies = cookies;
  const after = await browser.call(appUrl(ctx, 1), 'GET', '/api/bookings');
  expect(after.status).toBe(401);
  expect((await browser.call(appUrl(ctx, 1), 'GET', '/api/session')).body.user).toBeNull();
}, 60_000);

it('deactivated by a manager on process 1: refused on process 2 at once', async () => {
  const manager = await personSignedIn(ctx, 'manager', appUrl(ctx, 0));
  const person = await createPerson(ctx.db);
  const browser = new Browser();
  expect((await browser.signIn(appUrl(ctx, 1), person.email, person.password)).status).toBe(200);
  expect((await browser.call(appUrl(ctx, 1), 'GET', '/api/bookings')).status).toBe(200);
  await manager.agent.patch(`/api/people/${person.id}`).set('x-csrf-token', manager.csrf()).send({ active: false }).expect(200);
  expect((await browser.call(appUrl(ctx, 1), 'GET', '/api/bookings')).status).toBe(401);
  expect((await browser.call(appUrl(ctx, 0), 'GET', '/api/bookings')).status).toBe(401);
}, 60_000);

it('wrong passwords are counted together over both processes: the 11th is refused on either', async () => {
  const person = await createPerson(ctx.db);
  const browser = new Browser();
  const statuses: number[] = [];
  for (let i = 0; i < 10; i += 1) statuses.push((await browser.signIn(appUrl(ctx, i % 2), person.email, `${TEST_PASSWORD}-wrong`)).status);
  expect(statuses).toEqual(Array(10).fill(401));
  expect((await browser.signIn(appUrl(ctx, 0), person.email, person.password)).status).toBe(429);
  expect((await browser.signIn(appUrl(ctx, 1), person.email, person.password)).status).toBe(429);
}, 60_000);
