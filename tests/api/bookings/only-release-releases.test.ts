// No route other than release can move a booking to released.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { answersFor, completePre, post, scanAll } from '../../helpers/booking-flow';
import { insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

function serverFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? serverFiles(path.join(dir, e.name)) : e.name.endsWith('.ts') ? [path.join(dir, e.name)] : []));
}

describe('the released state', () => {
  it('is written in exactly one place in the server: the release service', () => {
    const writers = serverFiles(path.resolve(__dirname, '../../../server')).flatMap((file) => {
      const text = readFileSync(file, 'utf8');
      // Any update or raw SQL that writes the released status.
      return [...text.matchAll(/update\(\{[^}]*status: 'released'|status\s*=\s*'released'/g)].map(() => path.basename(file));
    });
    expect(writers).toEqual(['bookings.ts']);
    const source = readFileSync(path.resolve(__dirname, '../../../server/services/bookings.ts'), 'utf8');
    const fn = source.slice(source.indexOf('export async function releaseBooking'), source.indexOf('export async function returnBooking'));
    expect(fn).toMatch(/update\(\{ status: 'released'/);
  });

  it('is not reached by any other booking route, even when every rule would hold', async () => {
    const member = await signedInAs(ctx, 'member');
    const officer = await signedInAs(ctx, 'officer');
    const manager = await signedInAs(ctx, 'manager');
    await qualify(ctx.db, member.person.id, 40);
    const kit = await insertKit(ctx.db);
    const created = await post(member, '/api/bookings', { itemIds: kit.all.map((i) => i.id), ...windowFromNow(), location: 'Bay 1', purpose: 'Only release releases', plan: plan(10) });
    const booking = created.body.booking;
    await scanAll(member, booking);
    await completePre(member, booking);
    const id = booking.id;
    const attempts = [
      () => member.agent.patch(`/api/bookings/${id}`).set('x-csrf-token', member.csrf()).send({ purpose: 'status: released' }),
      () => member.agent.patch(`/api/bookings/${id}`).set('x-csrf-token', member.csrf()).send({ status: 'released' }),
      () => post(officer, `/api/bookings/${id}/approval`, { decision: 'approve', planVersion: booking.planVersion }),
      () => post(member, `/api/bookings/${id}/scans`, { tag: kit.stick.tag }),
      () => post(member, `/api/bookings/${id}/checklist`, { phase: 'pre', answers: answersFor(booking.checklist.pre) }),
      () => post(member, `/api/bookings/${id}/checklist`, { phase: 'return', answers: answersFor(booking.checklist.return) }),
      () => post(member, `/api/bookings/${id}/return`, {}),
      () => manager.agent.patch(`/api/items/${kit.stick.id}`).set('x-csrf-token', manager.csrf()).send({ notes: 'checked' }),
      () => post(manager, '/api/bookings', { itemIds: [kit.stick.id], ...windowFromNow(), location: 'x', purpose: 'status released', plan: plan(1) }),
    ];
    for (const attempt of attempts) {
      await attempt();
      const row = await ctx.db('bookings').where({ id }).first('status');
      expect(row.status).not.toBe('released');
    }
    const released = await post(member, `/api/bookings/${id}/release`);
    expect(released.body.booking.status).toBe('released');
  });
});
