// No route's query count grows with page size or with how much a record has: lists load related
// rows in one query per page, never one per row. Counted through knex's query events.
import { addDaysIso, todayIso } from '../../../server/services/dates';
import { post } from '../../helpers/booking-flow';
import { insertItem, insertKit, plan, qualify } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;
let member: Awaited<ReturnType<typeof signedInAs>>;

beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
  member = await signedInAs(ctx, 'member');
  await qualify(ctx.db, member.person.id, 40);
  // Enough rows for full pages: 30 bookings of the member, each with five items.
  for (let i = 0; i < 30; i += 1) {
    const kit = await insertKit(ctx.db);
    const start = new Date(Date.now() + (i + 1) * 3600_000);
    const res = await post(member, '/api/bookings', {
      itemIds: kit.all.map((k) => k.id),
      startsAt: start.toISOString(),
      endsAt: new Date(start.getTime() + 1800_000).toISOString(),
      location: 'Bay',
      purpose: `Page ${i}`,
      plan: plan(5),
    });
    expect(res.status).toBe(201);
  }
});
afterAll(() => ctx.close());

async function queriesFor(agent: typeof manager.agent, url: string): Promise<number> {
  let n = 0;
  const listener = () => {
    n += 1;
  };
  ctx.db.on('query', listener);
  try {
    const res = await agent.get(url);
    expect(res.status).toBe(200);
  } finally {
    ctx.db.removeListener('query', listener);
  }
  return n;
}

describe('queries per request', () => {
  it.each([
    ['/api/items?limit=1', '/api/items?limit=100'],
    ['/api/items?sort=ratedKv&limit=1', '/api/items?sort=ratedKv&limit=100'],
    // Word search: one query whatever the page size, the sort or the number of words.
    ['/api/items?q=unit&limit=1', '/api/items?q=unit&limit=100'],
    ['/api/items?q=uni%20probe&sort=name&limit=1', '/api/items?q=unit%20pro&sort=name&limit=100'],
    ['/api/items?q=unit&kind=probe&minKv=10&sort=nextDue&limit=1', '/api/items?q=unit&kind=probe&minKv=10&sort=nextDue&limit=100'],
    ['/api/bookings?limit=1', '/api/bookings?limit=100'],
    ['/api/audit?limit=1', '/api/audit?limit=200'],
  ])('%s and %s need the same number of queries', async (small, large) => {
    const who = small.startsWith('/api/bookings') ? member : manager;
    const a = await queriesFor(who.agent, small);
    const b = await queriesFor(who.agent, large);
    expect(b).toBe(a);
    // Session read plus the route's own few queries; a per-row query would show up as dozens.
    expect(a).toBeLessThanOrEqual(4);
  });

  it('an item page costs the same with one inspection or many', async () => {
    const one = await insertItem(ctx.db, 'probe');
    const many = await insertItem(ctx.db, 'probe');
    for (const [id, count] of [
      [one.id, 1],
      [many.id, 12],
    ] as const) {
      for (let i = 0; i < count; i += 1) {
        await ctx.db('inspections').insert({
          item_id: id,
          inspected_on: addDaysIso(todayIso(), -i),
          inspector_id: manager.person.id,
          result: 'pass',
          readings: '[]',
          notes: '',
          next_due: addDaysIso(todayIso(), 100),
        });
      }
    }
    expect(await queriesFor(manager.agent, `/api/items/${many.id}/inspections`)).toBe(await queriesFor(manager.agent, `/api/items/${one.id}/inspections`));
  });

  it('a booking costs the same with one item or five', async () => {
    const kit = await insertKit(ctx.db);
    const small = await post(member, '/api/bookings', {
      itemIds: [kit.stick.id],
      startsAt: new Date(Date.now() + 90 * 86400_000).toISOString(),
      endsAt: new Date(Date.now() + 90 * 86400_000 + 3600_000).toISOString(),
      location: 'Bay',
      purpose: 'One item',
      plan: plan(5),
    });
    const big = await post(member, '/api/bookings', {
      itemIds: [kit.supply.id, kit.stand.id, kit.interlock.id, kit.probe.id],
      startsAt: new Date(Date.now() + 91 * 86400_000).toISOString(),
      endsAt: new Date(Date.now() + 91 * 86400_000 + 3600_000).toISOString(),
      location: 'Bay',
      purpose: 'Four items',
      plan: plan(5),
    });
    expect(await queriesFor(member.agent, `/api/bookings/${big.body.booking.id}`)).toBe(
      await queriesFor(member.agent, `/api/bookings/${small.body.booking.id}`),
    );
  });

  it('signed-in reads load their session in at most one statement and write nothing back', async () => {
    const seen: string[] = [];
    const listener = (q: { sql: string }) => seen.push(q.sql);
    ctx.db.on('query', listener);
    try {
      for (let i = 0; i < 3; i += 1) expect((await member.agent.get('/api/session')).status).toBe(200);
    } finally {
      ctx.db.removeListener('query', listener);
    }
    // At most one read of the session row (then the process's fresh copy serves it, see
    // server/auth/session-cache.ts); the user comes from the session's snapshot, and the expiry is
    // only rewritten when it would move by minutes (server/auth/session-store.ts).
    expect(seen.length).toBeLessThanOrEqual(1);
    expect(seen.every((sql) => /^select .* from `?sessions`?/i.test(sql))).toBe(true);
  });
});
