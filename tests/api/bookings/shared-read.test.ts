// Lab rules are read from a shared copy outside transactions: a change through the app shows at
// once, a change by another process within the freshness window, and decisions inside a
// transaction always see the row.
import { getLabRules } from '../../../server/services/lab-rules';
import { sharedRead } from '../../../server/services/shared-read';
import { put } from '../../helpers/booking-flow';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

describe('shared reads of lab rules', () => {
  it('a change through the API is seen by the next read at once', async () => {
    const officer = await signedInAs(ctx, 'officer');
    const before = await getLabRules(ctx.db);
    const changed = { ...before, overdueGraceMin: before.overdueGraceMin + 1 };
    expect((await put(officer, '/api/lab-rules', changed)).status).toBe(200);
    expect((await getLabRules(ctx.db)).overdueGraceMin).toBe(changed.overdueGraceMin);
    expect((await officer.agent.get('/api/lab-rules')).body.overdueGraceMin).toBe(changed.overdueGraceMin);
  });

  it('inside a transaction the row is read, never the copy', async () => {
    const copy = await getLabRules(ctx.db);
    // Another server process changes the row behind this one's back.
    await ctx
      .db('lab_rules')
      .where({ id: 1 })
      .update({ early_pickup_min: copy.earlyPickupMin + 7 });
    expect((await getLabRules(ctx.db)).earlyPickupMin).toBe(copy.earlyPickupMin);
    await ctx.db.transaction(async (trx) => {
      expect((await getLabRules(trx)).earlyPickupMin).toBe(copy.earlyPickupMin + 7);
    });
    await ctx.db('lab_rules').where({ id: 1 }).update({ early_pickup_min: copy.earlyPickupMin });
  });

  it('a copy older than its window is read again, and a failed read is not kept', async () => {
    let loads = 0;
    let fail = false;
    const read = sharedRead(async () => {
      loads += 1;
      if (fail) throw new Error('database down');
      return loads;
    }, 40);
    expect(await read.read(ctx.db)).toBe(1);
    expect(await read.read(ctx.db)).toBe(1);
    await new Promise((resolve) => setTimeout(resolve, 60));
    fail = true;
    await expect(read.read(ctx.db)).rejects.toThrow('database down');
    fail = false;
    expect(await read.read(ctx.db)).toBe(3);
  });
});
