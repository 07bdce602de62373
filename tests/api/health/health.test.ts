import net from 'node:net';
import { sign } from 'cookie-signature';
import request from 'supertest';
import { createTestContext } from '../../helpers/test-app';

/** A loopback port with nothing listening: a database that is down. */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe('GET /api/health', () => {
  it('answers { ok: true, db: "up" } when the database answers', async () => {
    const ctx = createTestContext();
    try {
      const res = await request(ctx.app).get('/api/health').expect(200);
      expect(res.body).toEqual({ ok: true, db: 'up', retries: { retries: expect.any(Number), exhausted: expect.any(Number), outages: expect.any(Number) } });
    } finally {
      await ctx.close();
    }
  });

  it('answers 503 { db: "down" } quickly when the database is unreachable, and API calls get a JSON 503', async () => {
    const ctx = createTestContext({ DB_PORT: String(await closedPort()) });
    try {
      const started = Date.now();
      const res = await request(ctx.app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ ok: false, db: 'down' });
      expect(Date.now() - started).toBeLessThan(3000);

      // A validly signed session cookie, so the session store has to ask the database.
      const cookie = `voltcrib.sid=${encodeURIComponent('s:' + sign('some-session-id', ctx.config.session.secret))}`;
      const people = await request(ctx.app).get('/api/people').set('Cookie', cookie);
      expect(people.status).toBe(503);
      expect(people.body.error.code).toBe('SERVICE_UNAVAILABLE');
      expect(JSON.stringify(people.body)).not.toMatch(/ECONNREFUSED|at .*\.ts/);
    } finally {
      await ctx.close();
    }
  });
});
