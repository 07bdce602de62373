import { addDaysIso, todayIso } from '../../../server/services/dates';
import { createTestContext, itemBody, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let manager: Awaited<ReturnType<typeof signedInAs>>;
let officer: Awaited<ReturnType<typeof signedInAs>>;
beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
  officer = await signedInAs(ctx, 'officer');
});
afterAll(() => ctx.close());

async function newItem(overrides: Record<string, unknown> = {}) {
  const res = await manager.agent
    .post('/api/items')
    .set('x-csrf-token', manager.csrf())
    .send(itemBody('grounding-stick', uniqueWord(), overrides));
  expect(res.status).toBe(201);
  return res.body.item as { id: number; inspectionIntervalDays: number };
}

const inspect = (who: typeof manager, id: number, body: unknown) =>
  who.agent
    .post(`/api/items/${id}/inspections`)
    .set('x-csrf-token', who.csrf())
    .send(body as object);

describe('POST /api/items/:id/inspections', () => {
  it('records a pass with readings and sets the next due date from the item interval', async () => {
    const item = await newItem({ inspectionIntervalDays: 90 });
    const res = await inspect(officer, item.id, { result: 'pass', readings: [{ label: 'Hook to clamp resistance', value: 10.2, unit: 'MΩ' }] });
    expect(res.status).toBe(201);
    expect(res.body.inspection).toMatchObject({ result: 'pass', inspectedOn: todayIso(), nextDue: addDaysIso(todayIso(), 90) });
    expect(res.body.item).toMatchObject({ status: 'in-service', inspectionState: 'current', nextInspectionDue: addDaysIso(todayIso(), 90) });
    const list = await manager.agent.get(`/api/items/${item.id}/inspections`).expect(200);
    expect(list.body.inspections[0].readings).toEqual([{ label: 'Hook to clamp resistance', value: 10.2, unit: 'MΩ' }]);
  });

  it('tags the item out when the inspection fails', async () => {
    const item = await newItem();
    const res = await inspect(manager, item.id, { result: 'fail', notes: 'Cable strands broken at the clamp' });
    expect(res.status).toBe(201);
    expect(res.body.item.status).toBe('out-of-service');
    expect(res.body.item.statusReason).toMatch(/Cable strands broken/);
  });

  it('shows overdue and due-soon states from past inspections', async () => {
    const overdue = await newItem({ inspectionIntervalDays: 30 });
    await inspect(manager, overdue.id, { result: 'pass', inspectedOn: addDaysIso(todayIso(), -40) }).expect(201);
    const soon = await newItem({ inspectionIntervalDays: 30 });
    await inspect(manager, soon.id, { result: 'pass', inspectedOn: addDaysIso(todayIso(), -20) }).expect(201);
    const a = await manager.agent.get(`/api/items/${overdue.id}`);
    const b = await manager.agent.get(`/api/items/${soon.id}`);
    expect(a.body.item.inspectionState).toBe('overdue');
    expect(b.body.item.inspectionState).toBe('due-soon');
    const dueList = await manager.agent.get('/api/items?due=overdue&limit=100&sort=nextDue').expect(200);
    expect(dueList.body.items.map((i: { id: number }) => i.id)).toContain(overdue.id);
    expect(dueList.body.items.map((i: { id: number }) => i.id)).not.toContain(soon.id);
  });

  it('does not move the due date backwards when an older inspection is entered late', async () => {
    const item = await newItem({ inspectionIntervalDays: 100 });
    await inspect(manager, item.id, { result: 'pass' }).expect(201);
    await inspect(manager, item.id, { result: 'pass', inspectedOn: addDaysIso(todayIso(), -50) }).expect(201);
    const res = await manager.agent.get(`/api/items/${item.id}`);
    expect(res.body.item.nextInspectionDue).toBe(addDaysIso(todayIso(), 100));
  });

  it('moves the item in a word search sorted by due date, and in the due filters', async () => {
    const word = uniqueWord();
    const [a, b, c] = [
      await newItem({ name: `${word} stick A`, inspectionIntervalDays: 30 }),
      await newItem({ name: `${word} stick B`, inspectionIntervalDays: 30 }),
      await newItem({ name: `${word} stick C`, inspectionIntervalDays: 30 }),
    ];
    // Inspected 40, 10 and 25 days ago on a 30-day interval: A is overdue, C due soon, B current.
    for (const [item, daysAgo] of [
      [a, 40],
      [b, 10],
      [c, 25],
    ] as const)
      expect((await inspect(officer, item.id, { result: 'pass', inspectedOn: addDaysIso(todayIso(), -daysAgo) })).status).toBe(201);
    const search = async (query: string) =>
      ((await manager.agent.get(`/api/items?q=${word}&${query}`).expect(200)).body.items as { id: number }[]).map((i) => i.id);
    expect(await search('sort=nextDue')).toEqual([a.id, c.id, b.id]);
    expect(await search('due=overdue')).toEqual([a.id]);
    expect(await search('due=soon&sort=nextDue')).toEqual([a.id, c.id]);
    // A new inspection of A moves it last.
    expect((await inspect(officer, a.id, { result: 'pass' })).status).toBe(201);
    expect(await search('sort=nextDue')).toEqual([c.id, b.id, a.id]);
    expect(await search('due=overdue')).toEqual([]);
  });

  it('refuses a failure without notes, a future date, and members', async () => {
    const item = await newItem();
    expect((await inspect(manager, item.id, { result: 'fail' })).status).toBe(400);
    expect((await inspect(manager, item.id, { result: 'pass', inspectedOn: addDaysIso(todayIso(), 3) })).status).toBe(400);
    const member = await signedInAs(ctx, 'member');
    expect((await inspect(member, item.id, { result: 'pass' })).status).toBe(403);
    const rows = await ctx.db('inspections').where({ item_id: item.id });
    expect(rows).toHaveLength(0);
  });
});
