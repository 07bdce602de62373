// Who may read and write a booking's runs, and when: the booker and staff, 404 for anyone else
// (as for the booking itself); writes only while released or within the grace after return.
import { answersFor, post } from '../../helpers/booking-flow';
import { insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';
import { releasedBooking, RUN } from './released-booking';

let ctx: TestContext;
let member: Awaited<ReturnType<typeof signedInAs>>;
let other: Awaited<ReturnType<typeof signedInAs>>;
let officer: Awaited<ReturnType<typeof signedInAs>>;
let manager: Awaited<ReturnType<typeof signedInAs>>;

beforeAll(async () => {
  ctx = createTestContext();
  member = await signedInAs(ctx, 'member');
  other = await signedInAs(ctx, 'member');
  officer = await signedInAs(ctx, 'officer');
  manager = await signedInAs(ctx, 'manager');
});
afterAll(async () => ctx.close());

type Entry = { id: number; kind: string; unit?: string; min?: number; max?: number; required: boolean };

async function returned(bookingId: number, checklist: { return: Entry[] }) {
  const residual = checklist.return.find((e) => e.unit === 'V');
  const done = await post(member, `/api/bookings/${bookingId}/checklist`, {
    phase: 'return',
    answers: answersFor(checklist.return, residual ? { [residual.id]: 3 } : {}),
  });
  expect(done.status).toBe(200);
  const back = await post(member, `/api/bookings/${bookingId}/return`, {});
  expect(back.status).toBe(200);
}

describe('who may see and write runs', () => {
  it('another member gets 404 for reading, exporting and writing; the booker, officer and manager are served', async () => {
    const { booking } = await releasedBooking(ctx, member);
    expect((await post(member, `/api/bookings/${booking.id}/runs`, RUN)).status).toBe(201);
    for (const path of [`/api/bookings/${booking.id}/runs`, `/api/bookings/${booking.id}/runs.csv`]) {
      const res = await other.agent.get(path);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('NOT_FOUND');
    }
    expect((await post(other, `/api/bookings/${booking.id}/runs`, RUN)).status).toBe(404);
    for (const staff of [officer, manager]) {
      expect((await staff.agent.get(`/api/bookings/${booking.id}/runs`)).status).toBe(200);
      expect((await post(staff, `/api/bookings/${booking.id}/runs`, RUN)).status).toBe(201);
    }
    const list = await member.agent.get(`/api/bookings/${booking.id}/runs`);
    expect(list.body.runs.map((r: { recordedBy: { id: number } }) => r.recordedBy.id)).toEqual([member.person.id, officer.person.id, manager.person.id]);
  });

  it('a signed-out caller gets 401', async () => {
    const { booking } = await releasedBooking(ctx, member);
    const res = await (await import('supertest')).default(ctx.app).get(`/api/bookings/${booking.id}/runs`);
    expect(res.status).toBe(401);
  });
});

describe('when runs may be written', () => {
  it('not before release: 409 BENCH_LOG_CLOSED, nothing stored; reading works and says the log is closed', async () => {
    await qualify(ctx.db, member.person.id, 40);
    const kit = await insertKit(ctx.db);
    const made = await post(member, '/api/bookings', {
      itemIds: kit.all.map((i) => i.id),
      ...windowFromNow(),
      location: 'Bay 2',
      purpose: 'Not yet released',
      plan: plan(10, { polarity: 'positive' }),
    });
    const res = await post(member, `/api/bookings/${made.body.booking.id}/runs`, RUN);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('BENCH_LOG_CLOSED');
    const list = await member.agent.get(`/api/bookings/${made.body.booking.id}/runs`);
    expect(list.body).toMatchObject({ runs: [], fit: null, fits: [], open: false, graceHours: 24 });
  });

  it('after return: within the 24 h grace runs may still be typed up; after it, 409', async () => {
    const { booking } = await releasedBooking(ctx, member);
    await returned(booking.id, booking.checklist);
    expect((await post(member, `/api/bookings/${booking.id}/runs`, RUN)).status).toBe(201);
    // As if the gear came back 25 hours ago.
    await ctx
      .db('bookings')
      .where({ id: booking.id })
      .update({ returned_at: new Date(Date.now() - 25 * 3600_000) });
    const late = await post(member, `/api/bookings/${booking.id}/runs`, RUN);
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/more than 24 h ago/);
    expect((await member.agent.get(`/api/bookings/${booking.id}/runs`)).body).toMatchObject({ open: false });
  });
});
