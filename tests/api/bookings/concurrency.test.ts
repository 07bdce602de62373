// An item is never in two overlapping live bookings, however many requests arrive at once.
import { insertKit, plan, windowFromNow } from '../../helpers/gear';
import { post } from '../../helpers/booking-flow';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext({ DB_POOL_MAX: '30' });
});
afterAll(() => ctx.close());

describe('POST /api/bookings under contention', () => {
  it('200 concurrent requests for the same item: exactly one wins, the rest get 409 with a clear message, no 5xx', async () => {
    const members = await Promise.all(Array.from({ length: 8 }, () => signedInAs(ctx, 'member')));
    const kit = await insertKit(ctx.db);
    const base = windowFromNow(30, 2);
    const requests = Array.from({ length: 200 }, (_, i) => {
      // Every window overlaps the first one, shifted by up to 50 minutes.
      const start = new Date(new Date(base.startsAt).getTime() + (i % 50) * 60_000);
      const body = {
        itemIds: [kit.stick.id, kit.all[(i % 4) + 1]!.id].filter((v, idx, arr) => arr.indexOf(v) === idx),
        startsAt: start.toISOString(),
        endsAt: new Date(start.getTime() + 3600_000).toISOString(),
        location: 'Bay 2',
        purpose: `Contention ${i}`,
        plan: plan(5),
      };
      return post(members[i % members.length]!, '/api/bookings', body);
    });
    const responses = await Promise.all(requests);
    const statuses = responses.map((r) => r.status);
    expect(statuses.filter((s) => s >= 500)).toEqual([]);
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(199);
    for (const r of responses.filter((x) => x.status === 409)) {
      expect(r.body.error.code).toBe('ITEM_TAKEN');
      expect(r.body.error.message).toContain(kit.stick.tag);
    }
    const live = await ctx.db('booking_items').where({ item_id: kit.stick.id, live: true });
    expect(live).toHaveLength(1);
  }, 60_000);
});
