// The private calendar feed (issue 17 point 4), read back with ical.js, an iCalendar parser
// independent of the ical-generator that writes it.
import ICAL from 'ical.js';
import request from 'supertest';
import { hashToken } from '../../../server/services/calendar-feed';
import { addDaysIso, todayIso } from '../../../server/services/dates';
import { post } from '../../helpers/booking-flow';
import { insertItem, insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
type Who = Awaited<ReturnType<typeof signedInAs>>;
let member: Who;
let otherMember: Who;
let officer: Who;
let manager: Who;

beforeAll(async () => {
  ctx = createTestContext();
  member = await signedInAs(ctx, 'member');
  otherMember = await signedInAs(ctx, 'member');
  officer = await signedInAs(ctx, 'officer');
  manager = await signedInAs(ctx, 'manager');
  await qualify(ctx.db, member.person.id, 40);
  await qualify(ctx.db, otherMember.person.id, 40);
});
afterAll(() => ctx.close());

const del = (who: Who, path: string) => who.agent.delete(path).set('x-csrf-token', who.csrf());

function pathOf(url: string): string {
  return new URL(url).pathname;
}

async function fetchFeed(url: string) {
  const res = await request(ctx.app).get(pathOf(url));
  return res;
}

function parse(text: string) {
  const calendar = new ICAL.Component(ICAL.parse(text));
  return calendar.getAllSubcomponents('vevent').map((vevent) => {
    const event = new ICAL.Event(vevent);
    return {
      uid: event.uid,
      sequence: event.sequence,
      summary: event.summary,
      location: event.location,
      status: vevent.getFirstPropertyValue('status'),
      start: event.startDate,
      end: event.endDate,
      url: vevent.getFirstPropertyValue('url'),
    };
  });
}

async function book(who: Who, plannedKv = 10, startMin = 24 * 60) {
  const kit = await insertKit(ctx.db);
  const res = await post(who, '/api/bookings', {
    itemIds: kit.all.map((i) => i.id),
    ...windowFromNow(startMin),
    location: 'Bay 4',
    purpose: 'Corona onset on a rod-plane gap',
    plan: plan(plannedKv),
  });
  expect(res.status).toBe(201);
  return res.body.booking;
}

describe('GET/POST/DELETE /api/calendar-feed', () => {
  it('has no feed until one is turned on, then the same address on every read', async () => {
    const who = await signedInAs(ctx, 'member');
    expect((await who.agent.get('/api/calendar-feed')).body).toEqual({ url: null, scopes: null });
    const created = await post(who, '/api/calendar-feed', {});
    expect(created.status).toBe(200);
    expect(created.body.url).toMatch(/\/cal\/[A-Za-z0-9_-]{43}\.ics$/);
    expect((await who.agent.get('/api/calendar-feed')).body.url).toBe(created.body.url);
  });

  it('stores only the token’s hash, never the token', async () => {
    const { body } = await post(member, '/api/calendar-feed', {});
    const token = /\/cal\/(.+)\.ics$/.exec(body.url)![1]!;
    const row = await ctx.db('calendar_feeds').where({ person_id: member.person.id }).first();
    expect(row.token_hash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
  });

  it('rotates: the old address answers 404 at once, the new one serves the feed', async () => {
    const first = (await post(member, '/api/calendar-feed', {})).body.url;
    expect((await fetchFeed(first)).status).toBe(200);
    const second = (await post(member, '/api/calendar-feed', {})).body.url;
    expect(second).not.toBe(first);
    expect((await fetchFeed(first)).status).toBe(404);
    expect((await fetchFeed(second)).status).toBe(200);
  });

  it('revokes: the address answers 404 and the account shows no feed', async () => {
    const who = await signedInAs(ctx, 'member');
    const url = (await post(who, '/api/calendar-feed', {})).body.url;
    expect((await del(who, '/api/calendar-feed')).status).toBe(204);
    expect((await fetchFeed(url)).status).toBe(404);
    expect((await who.agent.get('/api/calendar-feed')).body.url).toBeNull();
  });

  it('lets only officers add the queue and lab bookings, only managers the inspections (403, nothing changed)', async () => {
    const who = await signedInAs(ctx, 'member');
    expect((await post(who, '/api/calendar-feed', { labBookings: true })).status).toBe(403);
    expect((await post(officer, '/api/calendar-feed', { inspections: true })).status).toBe(403);
    expect((await post(manager, '/api/calendar-feed', { approvals: true })).status).toBe(403);
    expect((await post(who, '/api/calendar-feed', { colour: 'red' })).status).toBe(400);
    expect(await ctx.db('calendar_feeds').where({ person_id: who.person.id })).toHaveLength(0);
  });

  it('answers 401 when signed out', async () => {
    expect((await request(ctx.app).get('/api/calendar-feed')).status).toBe(401);
  });
});

describe('GET /cal/:token.ics', () => {
  it('answers 404 for a made-up, malformed or missing token', async () => {
    for (const path of ['/cal/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA.ics', '/cal/short.ics', '/cal/.ics', '/cal/nothing']) {
      const res = await request(ctx.app).get(path);
      expect(res.status).toBe(404);
      expect(res.text).not.toContain('BEGIN:VCALENDAR');
    }
  });

  it('holds the person’s bookings with stable UIDs, UTC times, status and a link back', async () => {
    const booking = await book(member);
    const theirs = await book(otherMember);
    const url = (await post(member, '/api/calendar-feed', {})).body.url;
    const res = await fetchFeed(url);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    const events = parse(res.text);
    const mine = events.find((e) => e.uid.startsWith(`booking-${booking.id}@`))!;
    expect(mine).toBeDefined();
    expect(events.some((e) => e.uid.startsWith(`booking-${theirs.id}@`))).toBe(false);
    expect(mine.summary).toContain(booking.items[0].tag);
    expect(mine.summary).toContain('10 kV');
    expect(mine.location).toBe('Bay 4');
    expect(mine.url).toMatch(new RegExp(`/bookings/${booking.id}$`));
    expect(mine.status).toBe('CONFIRMED');
    // UTC, written with Z: the parser reads them in the UTC zone and at the booked instants.
    expect(mine.start.zone?.tzid).toBe('UTC');
    // iCalendar times have whole seconds (RFC 5545 3.3.5).
    const toSecond = (iso: string) => iso.replace(/\.\d{3}Z$/, '.000Z');
    expect(mine.start.toJSDate().toISOString()).toBe(toSecond(booking.startsAt));
    expect(mine.end.toJSDate().toISOString()).toBe(toSecond(booking.endsAt));
    expect(res.text).toMatch(new RegExp(`DTSTART:${booking.startsAt.replace(/[-:]/g, '').replace(/\.\d{3}/, '')}`));
    // The same UID on the next read.
    const again = parse((await fetchFeed(url)).text).find((e) => e.uid === mine.uid)!;
    expect(again.sequence).toBe(mine.sequence);
  });

  it('raises SEQUENCE when a booking changes and marks a cancelled one STATUS:CANCELLED', async () => {
    const booking = await book(member);
    const url = (await post(member, '/api/calendar-feed', {})).body.url;
    const before = parse((await fetchFeed(url)).text).find((e) => e.uid.startsWith(`booking-${booking.id}@`))!;
    // updated_at moves on in whole seconds for SEQUENCE; wait past the next second.
    await new Promise((r) => setTimeout(r, 1100));
    expect((await post(member, `/api/bookings/${booking.id}/cancel`)).status).toBe(200);
    const after = parse((await fetchFeed(url)).text).find((e) => e.uid === before.uid)!;
    expect(after.status).toBe('CANCELLED');
    expect(after.sequence).toBeGreaterThan(before.sequence);
  });

  it('adds the approval queue and lab bookings to an officer’s feed only when asked', async () => {
    const waiting = await book(otherMember, 25);
    expect(waiting.status).toBe('awaiting-approval');
    const plain = (await post(officer, '/api/calendar-feed', {})).body.url;
    expect(parse((await fetchFeed(plain)).text).some((e) => e.uid.startsWith(`booking-${waiting.id}@`))).toBe(false);
    const withQueue = (await post(officer, '/api/calendar-feed', { approvals: true })).body.url;
    const queued = parse((await fetchFeed(withQueue)).text).find((e) => e.uid.startsWith(`booking-${waiting.id}@`))!;
    expect(queued.summary).toMatch(/^Approval waiting: /);
    expect(queued.status).toBe('TENTATIVE');
    const plainBooking = await book(otherMember, 10);
    const withLab = (await post(officer, '/api/calendar-feed', { labBookings: true })).body.url;
    expect(parse((await fetchFeed(withLab)).text).some((e) => e.uid.startsWith(`booking-${plainBooking.id}@`))).toBe(true);
  });

  it('adds inspections due to a manager’s feed as all-day events', async () => {
    const due = addDaysIso(todayIso(), 20);
    const item = await insertItem(ctx.db, 'probe', { nextDue: due });
    const url = (await post(manager, '/api/calendar-feed', { inspections: true })).body.url;
    const event = parse((await fetchFeed(url)).text).find((e) => e.uid.startsWith(`inspection-${item.id}-`))!;
    expect(event).toBeDefined();
    expect(event.start.isDate).toBe(true);
    expect(event.start.toString()).toBe(due);
    expect(event.summary).toContain(item.tag);
  });

  it('stops serving a deactivated person’s feed', async () => {
    const who = await signedInAs(ctx, 'member');
    const url = (await post(who, '/api/calendar-feed', {})).body.url;
    await ctx.db('people').where({ id: who.person.id }).update({ active: false });
    expect((await fetchFeed(url)).status).toBe(404);
  });
});
