import { toCsv } from '../../../server/services/reports';
import { insertKit } from '../../helpers/gear';
import { createPerson, createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

describe('reports', () => {
  it('counts use per group for released and returned bookings, clipped to the period', async () => {
    const manager = await signedInAs(ctx, 'manager');
    const [groupId] = await ctx.db('groups').insert({ name: `Report group ${Date.now()}` });
    const person = await createPerson(ctx.db);
    await ctx.db('people').where({ id: person.id }).update({ group_id: groupId });
    const kit = await insertKit(ctx.db);
    const from = new Date('2026-03-01T00:00:00Z');
    const to = new Date('2026-03-02T00:00:00Z');
    const base = {
      person_id: person.id,
      location: 'Bay',
      purpose: 'Report',
      planned_kv: 5,
      polarity: 'positive',
      max_current_ma: 1,
      people_present: 2,
      assessment: '{}',
      approval_required: false,
    };
    // 3 h inside, 2 h of 4 h inside (clipped), one cancelled (not counted).
    await ctx.db('bookings').insert([
      { ...base, status: 'returned', starts_at: new Date('2026-03-01T09:00:00Z'), ends_at: new Date('2026-03-01T12:00:00Z') },
      { ...base, status: 'released', starts_at: new Date('2026-03-01T22:00:00Z'), ends_at: new Date('2026-03-02T02:00:00Z') },
      { ...base, status: 'cancelled', starts_at: new Date('2026-03-01T13:00:00Z'), ends_at: new Date('2026-03-01T15:00:00Z') },
    ]);
    expect(kit.all).toHaveLength(5);
    const res = await manager.agent.get(`/api/reports/usage?from=${from.toISOString()}&to=${to.toISOString()}`).expect(200);
    const group = res.body.groups.find((g: { groupName: string }) => g.groupName.startsWith('Report group'));
    expect(group).toEqual({ groupName: expect.any(String), bookings: 2, hours: 5, people: 1 });
    const csv = await manager.agent.get(`/api/reports/usage.csv?from=${from.toISOString()}&to=${to.toISOString()}`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.text.split('\r\n')[0]).toBe('groupName,bookings,hours,people');
    const member = await signedInAs(ctx, 'member');
    expect((await member.agent.get('/api/reports/usage')).status).toBe(403);
    expect((await manager.agent.get('/api/reports/usage?from=2026-03-02T00:00:00Z&to=2026-03-01T00:00:00Z')).status).toBe(400);
  });

  it('writes CSV that spreadsheets read as data, never as formulas', () => {
    const csv = toCsv([{ a: '=HYPERLINK("x")', b: 'plain, with comma', c: 'line\nbreak' }], ['a', 'b', 'c']);
    expect(csv).toBe(`a,b,c\r\n"'=HYPERLINK(""x"")","plain, with comma","line\nbreak"\r\n`);
  });
});
