// One log line per API request, after the answer; server errors logged with the request but never
// with its cookie or CSRF token.
import type { Express } from 'express';
import pino from 'pino';
import { Writable } from 'node:stream';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createDb, type Db } from '../../../server/db';
import { testConfig } from '../../helpers/test-app';

let db: Db;
let app: Express;
const lines: Record<string, unknown>[] = [];

beforeAll(() => {
  const config = testConfig();
  db = createDb(config);
  const sink = new Writable({
    write(chunk: Buffer, _encoding, done) {
      lines.push(JSON.parse(chunk.toString('utf8')) as Record<string, unknown>);
      done();
    },
  });
  app = createApp({
    db,
    config,
    logger: pino({ level: 'info' }, sink),
    // A route that fails the way a bug would, mounted only here.
    mountBeforeSession: (inner) =>
      inner.get('/api/health/boom-for-test', () => {
        throw new Error('kaboom');
      }),
  });
});
afterAll(() => db.destroy());

const settle = () => new Promise((resolve) => setImmediate(resolve));

describe('request log', () => {
  it('writes one line per API request with method, URL, status and time', async () => {
    lines.length = 0;
    await request(app).get('/api/no-such-route?x=1').set('cookie', 'voltcrib.sid=secret-cookie');
    await settle();
    const line = lines.find((l) => l.msg === 'request');
    expect(line).toMatchObject({ method: 'GET', url: '/api/no-such-route?x=1', status: 404 });
    expect(typeof line?.ms).toBe('number');
    expect(JSON.stringify(lines)).not.toContain('secret-cookie');
  });

  it('logs a server error with the request and the error, but not the cookie or token', async () => {
    lines.length = 0;
    const res = await request(app).get('/api/health/boom-for-test').set('cookie', 'voltcrib.sid=secret-cookie').set('x-csrf-token', 'secret-token');
    await settle();
    expect(lines.find((l) => l.msg === 'server error')).toMatchObject({ method: 'GET', url: '/api/health/boom-for-test', err: { message: 'kaboom' } });
    expect(lines.find((l) => l.msg === 'request failed')).toMatchObject({ status: 500 });
    expect(JSON.stringify(lines)).not.toMatch(/secret-cookie|secret-token/);
    expect(JSON.stringify(res.body)).not.toContain('kaboom');
  });
});
