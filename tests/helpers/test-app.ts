// Builds the real app against the test database (started by `npm test`), plus helpers to make
// people and sign them in through the real endpoints (CSRF token included).
import bcrypt from 'bcrypt';
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import { createDb, type Db } from '../../server/db';
import { createLogger } from '../../server/logger';
import type { Role } from '../../shared/schemas/session';

export const TEST_PASSWORD = 'correct horse battery staple';
const TEST_HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

export function testConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    DB_PORT: process.env.VOLTCRIB_TEST_DB_PORT ?? '3308',
    DB_NAME: 'voltcrib_test',
    PORT: '0',
    S3_ENDPOINT: process.env.VOLTCRIB_TEST_S3_ENDPOINT ?? 'http://127.0.0.1:4599',
    S3_BUCKET: 'voltcrib-test',
    // Throttling counts live in the shared test database and every suite comes from 127.0.0.1:
    // the per-address ceiling is out of the way unless a test sets it (tests/api/security/throttling).
    LOGIN_RATE_LIMIT_PER_ADDRESS: '1000000',
    ...overrides,
  });
}

export interface TestContext {
  db: Db;
  app: Express;
  config: Config;
  close(): Promise<void>;
}

export function createTestContext(overrides: Record<string, string> = {}): TestContext {
  const config = testConfig(overrides);
  const db = createDb(config);
  const app = createApp({ db, config, logger: createLogger((process.env.TEST_LOG_LEVEL as 'silent') ?? 'silent') });
  return { db, app, config, close: () => db.destroy() };
}

let counter = 0;
export function uniqueEmail(prefix = 'person'): string {
  counter += 1;
  return `${prefix}-${process.pid}-${Date.now().toString(36)}-${counter}@test.voltcrib.example`;
}

export async function createPerson(db: Db, fields: { role?: Role; name?: string; email?: string; active?: boolean } = {}) {
  const email = fields.email ?? uniqueEmail(fields.role ?? 'member');
  const name = fields.name ?? `Test ${fields.role ?? 'member'} ${counter}`;
  const [id] = await db('people').insert({
    email,
    name,
    role: fields.role ?? 'member',
    password_hash: TEST_HASH,
    active: fields.active ?? true,
  });
  return { id: Number(id), email, name, password: TEST_PASSWORD, role: fields.role ?? 'member' };
}

export type Agent = ReturnType<typeof request.agent>;

/** A supertest agent with a session; `csrf()` gives the current token for state-changing calls. */
export async function anonymousAgent(app: Express): Promise<{ agent: Agent; csrf: () => string; refresh: () => Promise<void> }> {
  const agent = request.agent(app);
  let token = '';
  const refresh = async () => {
    const res = await agent.get('/api/session').expect(200);
    token = res.body.csrfToken;
  };
  await refresh();
  return { agent, csrf: () => token, refresh };
}

export async function signedInAgent(app: Express, person: { email: string; password: string }) {
  const session = await anonymousAgent(app);
  const res = await session.agent.post('/api/session').set('x-csrf-token', session.csrf()).send({ email: person.email, password: person.password });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  await session.refresh();
  return session;
}

export async function signedInAs(ctx: TestContext, role: Role) {
  const person = await createPerson(ctx.db, { role });
  const session = await signedInAgent(ctx.app, person);
  return { person, ...session };
}

/** A valid item body for each kind, with a unique name word so searches can find just these. */
export function itemBody(kind: string, word: string, overrides: Record<string, unknown> = {}): Record<string, unknown> {
  const ratings: Record<string, Record<string, unknown>> = {
    multiplier: { stages: 6, stageCapacitanceNf: 2.2, driveFrequencyHz: 20000, maxInputKvPeak: 10, maxOutputKv: 80, maxMa: 1.5, polarity: 'positive' },
    'hv-supply': { maxKv: 30, maxMa: 2, polarity: 'negative', outputCapacitanceNf: 5, bleederMohm: 300, hasInterlockInput: true },
    probe: { maxKv: 40, ratio: 1000, inputResistanceMohm: 1000 },
    'isolation-stand': { withstandKv: 100 },
    'grounding-stick': { ratedKv: 100, hookResistanceMohm: 10, cableLengthM: 3 },
    interlock: { ratedKv: 60 },
    meter: { maxKv: null },
    other: { maxKv: 5 },
  };
  return {
    kind,
    name: `${word} ${kind} unit`,
    location: 'Bay 2, cabinet B',
    make: 'Orrin Works',
    model: 'T-1',
    serial: `SN-${word}`,
    ratings: ratings[kind],
    ...overrides,
  };
}

export function uniqueWord(): string {
  counter += 1;
  return `w${process.pid.toString(36)}${Date.now().toString(36)}${counter}`;
}
