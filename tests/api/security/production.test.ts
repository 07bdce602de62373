// What changes when NODE_ENV=production: no Server-Timing (it would time the server's work for any
// visitor, e.g. whether a password reset found an account), and never the local mailbox.
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logger';
import type { Mailbox } from '../../../server/mail/fake-smtp';
import { createPerson, signedInAgent, testConfig } from '../../helpers/test-app';
import { createDb, type Db } from '../../../server/db';

const mailbox: Mailbox = {
  list: () => [
    { id: 1, to: ['a@test.voltcrib.example'], from: 'x', subject: 'Hello', text: 'x', html: null, messageId: null, receivedAt: new Date().toISOString() },
  ],
};

let db: Db;
beforeAll(() => {
  db = createDb(testConfig());
});
afterAll(() => db.destroy());

function appFor(env: 'test' | 'production', withMailbox: boolean) {
  const config = testConfig(env === 'production' ? { NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(32) } : {});
  return createApp({ db, config, logger: createLogger('silent'), mailbox: withMailbox ? mailbox : undefined });
}

describe('Server-Timing', () => {
  it('is sent outside production', async () => {
    const res = await request(appFor('test', false)).get('/api/session');
    expect(res.headers['server-timing']).toMatch(/^app;dur=/);
  });

  it('is never sent in production, on any answer', async () => {
    const app = appFor('production', false);
    for (const path of ['/api/session', '/api/health', '/api/items', '/api/nothing-here']) {
      const res = await request(app).get(path);
      expect({ path, timing: res.headers['server-timing'] }).toEqual({ path, timing: undefined });
    }
    const reset = await request(app).post('/api/password-resets').send({ email: 'x@test.voltcrib.example' });
    expect(reset.headers['server-timing']).toBeUndefined();
  });
});

describe('GET /api/mailbox', () => {
  it('shows the local fake SMTP’s messages to managers only', async () => {
    const app = appFor('test', true);
    const manager = await signedInAgent(app, await createPerson(db, { role: 'manager' }));
    const member = await signedInAgent(app, await createPerson(db, { role: 'member' }));
    const officer = await signedInAgent(app, await createPerson(db, { role: 'officer' }));
    const res = await manager.agent.get('/api/mailbox').expect(200);
    expect(res.body.messages).toEqual([expect.objectContaining({ subject: 'Hello' })]);
    expect((await member.agent.get('/api/mailbox')).status).toBe(403);
    expect((await officer.agent.get('/api/mailbox')).status).toBe(403);
    expect((await request(app).get('/api/mailbox')).status).toBe(401);
  });

  it('is not there when real SMTP is in use', async () => {
    const app = appFor('test', false);
    const manager = await signedInAgent(app, await createPerson(db, { role: 'manager' }));
    const res = await manager.agent.get('/api/mailbox');
    expect(res.status).toBe(404);
    expect(res.body.messages).toBeUndefined();
  });

  it('is never there in production, even if a mailbox is handed to the app', async () => {
    const app = appFor('production', true);
    const manager = await signedInAgent(app, await createPerson(db, { role: 'manager' }));
    const res = await manager.agent.get('/api/mailbox');
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain('Hello');
  });
});
