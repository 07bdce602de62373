// No route other than release can move a booking to released.
import type { Express } from 'express';
import { answersFor, completePre, post, scanAll } from '../../helpers/booking-flow';
import { insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
beforeAll(() => {
  ctx = createTestContext();
});
afterAll(() => ctx.close());

interface RouteEntry {
  method: string;
  path: string;
}

// Express 5's router keeps each mounted router's layers in `handle.stack` and each route's path
// and methods on `layer.route`; the mount path is the layer's `rawPath`.
interface LayerLike {
  rawPath?: unknown;
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
}

/** Every route the app answers, with its full path, walked from the app's own route table. */
function routeTable(stack: readonly LayerLike[], prefix = ''): RouteEntry[] {
  return stack.flatMap((layer) => {
    if (layer.route) return Object.keys(layer.route.methods).map((method) => ({ method: method.toUpperCase(), path: prefix + layer.route!.path }));
    const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
    return layer.handle?.stack ? routeTable(layer.handle.stack, prefix + mount) : [];
  });
}

const appRoutes = (app: Express) => routeTable((app as unknown as { router: { stack: LayerLike[] } }).router.stack);
const WRITES = ['POST', 'PUT', 'PATCH', 'DELETE'];
const RELEASE = 'POST /api/bookings/:id/release';

async function readyBooking() {
  const member = await signedInAs(ctx, 'member');
  await qualify(ctx.db, member.person.id, 40);
  const kit = await insertKit(ctx.db);
  const created = await post(member, '/api/bookings', {
    itemIds: kit.all.map((i) => i.id),
    ...windowFromNow(),
    location: 'Bay 1',
    purpose: 'Only release releases',
    plan: plan(10),
  });
  const booking = created.body.booking;
  await scanAll(member, booking);
  await completePre(member, booking);
  return { member, kit, booking: booking as { id: number; status: string } };
}

// Confirming lab rules acts on the whole lab (server/services/lab-rules.ts writes no booking) and
// would confirm another test file's pending change; signing in and out touches no booking, and
// skipping it keeps the callers signed in.
const SKIPPED = (r: RouteEntry) => r.path.startsWith('/api/session') || r.path === '/api/lab-rules/confirm';

describe('the released state', () => {
  it('is reached through no write route of the app but the release, whoever calls it with whatever body', async () => {
    const officer = await signedInAs(ctx, 'officer');
    const manager = await signedInAs(ctx, 'manager');
    let ready = await readyBooking();
    const routes = appRoutes(ctx.app);
    // The walk must see the app: the release route and the booking writes are in it.
    expect(routes.map((r) => `${r.method} ${r.path}`)).toEqual(expect.arrayContaining([RELEASE, 'PATCH /api/bookings/:id', 'POST /api/bookings/:id/approval']));
    const writes = routes.filter((r) => WRITES.includes(r.method) && r.path.startsWith('/api/') && `${r.method} ${r.path}` !== RELEASE && !SKIPPED(r));
    expect(writes.length).toBeGreaterThan(20);
    for (const route of writes) {
      for (const who of [ready.member, officer, manager]) {
        for (const body of [{}, { status: 'released' }]) {
          // Each resource's own id where it names one: the booking, its booker, one of its items.
          const url = route.path
            .replace(/^\/api\/items\/:id/, `/api/items/${ready.kit.stick.id}`)
            .replace(/^\/api\/people\/:id/, `/api/people/${ready.member.person.id}`)
            .replace(/:[A-Za-z]+/g, String(ready.booking.id));
          await who.agent[route.method.toLowerCase() as 'post'](url).set('x-csrf-token', who.csrf()).send(body);
          const row = await ctx.db('bookings').where({ id: ready.booking.id }).first('status');
          expect(`${route.method} ${route.path} left it ${row.status}`).not.toBe(`${route.method} ${route.path} left it released`);
          // A write that moved it elsewhere (a cancellation) leaves nothing to release: start again.
          if (row.status !== ready.booking.status) ready = await readyBooking();
        }
      }
    }
    const released = await post(ready.member, `/api/bookings/${ready.booking.id}/release`);
    expect(released.body.booking.status).toBe('released');
    // The audit agrees: one entry moved the booking to released, and it is the release's.
    const entries = await ctx
      .db('audit_events')
      .where({ entity: 'booking', entity_id: String(ready.booking.id) })
      .select('action', 'after');
    const toReleased = entries.filter((e) => (typeof e.after === 'string' ? JSON.parse(e.after) : e.after)?.status === 'released').map((e) => e.action);
    expect(toReleased).toEqual(['booking.released']);
  });

  it('is not reached by any other booking route, even when every rule would hold', async () => {
    const member = await signedInAs(ctx, 'member');
    const officer = await signedInAs(ctx, 'officer');
    const manager = await signedInAs(ctx, 'manager');
    await qualify(ctx.db, member.person.id, 40);
    const kit = await insertKit(ctx.db);
    const created = await post(member, '/api/bookings', {
      itemIds: kit.all.map((i) => i.id),
      ...windowFromNow(),
      location: 'Bay 1',
      purpose: 'Only release releases',
      plan: plan(10),
    });
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
