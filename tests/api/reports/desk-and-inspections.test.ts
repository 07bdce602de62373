import { addDaysIso, todayIso } from '../../../server/services/dates';
import { insertItem } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

describe('GET /api/reports/inspections', () => {
  it('lists never-inspected gear (which blocks release) first, then overdue, then due soon', async () => {
    const officer = await signedInAs(ctx, 'officer');
    const never = await insertItem(ctx.db, 'probe', { nextDue: null });
    const overdue = await insertItem(ctx.db, 'probe', { nextDue: addDaysIso(todayIso(), -3) });
    const soon = await insertItem(ctx.db, 'probe', { nextDue: addDaysIso(todayIso(), 5) });
    const later = await insertItem(ctx.db, 'probe', { nextDue: addDaysIso(todayIso(), 60) });
    const res = await officer.agent.get('/api/reports/inspections?limit=200').expect(200);
    const ids = res.body.items.map((i: { id: number }) => i.id);
    expect(res.body.items.find((i: { id: number }) => i.id === never.id)).toMatchObject({ tag: never.tag, nextInspectionDue: null, state: 'never' });
    expect(res.body.items.find((i: { id: number }) => i.id === overdue.id)).toMatchObject({ state: 'overdue' });
    expect(res.body.items.find((i: { id: number }) => i.id === soon.id)).toMatchObject({ state: 'soon' });
    expect(ids).not.toContain(later.id);
    const states = res.body.items.map((i: { state: string }) => i.state);
    // Never first, then by due date (so every overdue one before every due-soon one).
    expect(states.lastIndexOf('never')).toBeLessThan(states.indexOf('overdue') === -1 ? Infinity : states.indexOf('overdue'));
    expect(states.lastIndexOf('overdue')).toBeLessThan(states.indexOf('soon'));
  });

  it('refuses members and bad limits', async () => {
    const member = await signedInAs(ctx, 'member');
    const manager = await signedInAs(ctx, 'manager');
    expect((await member.agent.get('/api/reports/inspections')).status).toBe(403);
    const bad = await manager.agent.get('/api/reports/inspections?limit=0');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.limit).toEqual(['At least 1']);
  });
});

describe('GET /api/reports/desk', () => {
  it('counts never-inspected and tagged-out gear as it is added', async () => {
    const manager = await signedInAs(ctx, 'manager');
    const before = (await manager.agent.get('/api/reports/desk').expect(200)).body;
    expect(Object.keys(before).sort()).toEqual(['approvalsWaiting', 'gearOut', 'inspections', 'overdue', 'taggedOut']);
    await insertItem(ctx.db, 'probe', { nextDue: null });
    await insertItem(ctx.db, 'probe', { status: 'out-of-service' });
    const after = (await manager.agent.get('/api/reports/desk').expect(200)).body;
    expect(after.inspections.neverDone).toBeGreaterThanOrEqual(before.inspections.neverDone + 1);
    expect(after.taggedOut).toBeGreaterThanOrEqual(before.taggedOut + 1);
  });

  it('is for officers and managers only', async () => {
    const member = await signedInAs(ctx, 'member');
    const officer = await signedInAs(ctx, 'officer');
    expect((await member.agent.get('/api/reports/desk')).status).toBe(403);
    expect((await officer.agent.get('/api/reports/desk')).status).toBe(200);
  });
});
