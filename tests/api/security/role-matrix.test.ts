// Who may call what. The route table (tests/helpers/route-fixtures.ts) names, for every API route,
// the roles it admits; this suite proves the table matches the routes Express really has, then
// sends each route's valid request as signed out, member, officer and manager and expects exactly
// the fixture's success status for an admitted identity, 401 signed out, and 403 for another role.
import {
  createSecurityContext,
  expectedStatus,
  IDENTITIES,
  listApiRoutes,
  ROUTES,
  send,
  World,
  type Caller,
  type Identity,
} from '../../helpers/route-fixtures';
import type { TestContext } from '../../helpers/test-app';

const KEYS = Object.keys(ROUTES).sort((a, b) => a.split(' ')[1]!.localeCompare(b.split(' ')[1]!) || a.localeCompare(b));
const MATRIX = `${KEYS.length} routes × ${IDENTITIES.length} identities = ${KEYS.length * IDENTITIES.length} requests`;

let ctx: TestContext;
let world: World;
const callers = {} as Record<Identity, Caller>;

beforeAll(async () => {
  // Public token and reset routes share one limiter per app; the matrix must not trip it. Server
  // errors are logged, so a 500 in the matrix comes with its cause.
  ctx = createSecurityContext({ LOGIN_RATE_LIMIT: '1000', LOG_LEVEL: 'error' });
  world = await World.create(ctx);
  for (const identity of IDENTITIES) callers[identity] = await world.caller(identity);
  console.log(`role matrix: ${MATRIX}`);
});
afterAll(async () => {
  await world?.close();
  await ctx.close();
});

describe('the route table', () => {
  it('lists every API route the app has, and no route the app does not have', () => {
    const inApp = listApiRoutes(ctx.app);
    expect(inApp.length).toBeGreaterThan(50);
    expect({ missingFromTable: inApp.filter((r) => !(r in ROUTES)), notInApp: KEYS.filter((k) => !inApp.includes(k)) }).toEqual({
      missingFromTable: [],
      notInApp: [],
    });
  });
});

describe(`role matrix: ${MATRIX}`, () => {
  describe.each(KEYS)('%s', (key) => {
    const fixture = ROUTES[key]!;

    it.each(IDENTITIES)('as %s', async (identity) => {
      const caller = callers[identity];
      const req = await fixture.build(world, caller);
      const res = await send(caller, key, req);
      const expected = expectedStatus(fixture.access, identity, req.status);
      if (res.status !== expected) {
        throw new Error(`${key} as ${identity}: expected ${expected}, got ${res.status}: ${res.text.slice(0, 400)}`);
      }
      if (expected === 401) expect(res.body).toEqual({ error: { code: 'UNAUTHENTICATED', message: expect.any(String) } });
      if (expected === 403) expect(res.body).toEqual({ error: { code: 'FORBIDDEN', message: expect.any(String) } });
    });
  });
});
