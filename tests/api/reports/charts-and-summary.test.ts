// The reports' chart figures, their CSVs and the monthly safety summary PDF (issue 17 point 3).
// The PDF's figures are read back with poppler's pdftotext, a program independent of pdfkit.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { hoursByWeek, weekStartIso } from '../../../server/services/report-charts';
import { insertItem } from '../../helpers/gear';
import { createPerson, createTestContext, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
type Who = Awaited<ReturnType<typeof signedInAs>>;
let manager: Who;
let member: Who;
let group: { id: number; name: string };
let booker: { id: number };

// A month long past, so no other suite's rows fall in it: March 2021.
const MONTH = '2021-03';
const FROM = '2021-03-01T00:00:00.000Z';
const TO = '2021-04-01T00:00:00.000Z';

async function insertBooking(fields: { startsAt: string; endsAt: string; status: string; releasedAt?: string; returnedAt?: string | null }) {
  const [id] = await ctx.db('bookings').insert({
    person_id: booker.id,
    status: fields.status,
    starts_at: new Date(fields.startsAt),
    ends_at: new Date(fields.endsAt),
    released_at: fields.releasedAt ? new Date(fields.releasedAt) : null,
    returned_at: fields.returnedAt ? new Date(fields.returnedAt) : null,
    location: 'Bay 9',
    purpose: 'Report figures',
    planned_kv: 10,
    polarity: 'negative',
    max_current_ma: 1,
    people_present: 2,
    assessment: JSON.stringify({}),
    approval_required: false,
    item_tags: JSON.stringify([]),
  });
  return Number(id);
}

beforeAll(async () => {
  ctx = createTestContext();
  manager = await signedInAs(ctx, 'manager');
  member = await signedInAs(ctx, 'member');
  const name = `Group ${uniqueWord()}`;
  const [gid] = await ctx.db('groups').insert({ name });
  group = { id: Number(gid), name };
  const person = await createPerson(ctx.db, { role: 'member' });
  await ctx.db('people').where({ id: person.id }).update({ group_id: group.id });
  booker = person;
  // Mon 1 Mar 2021 10:00-14:00, released 10:00, back on time at 13:30: 4 h booked, 3.5 h out.
  await insertBooking({
    startsAt: '2021-03-01T10:00:00Z',
    endsAt: '2021-03-01T14:00:00Z',
    status: 'returned',
    releasedAt: '2021-03-01T10:00:00Z',
    returnedAt: '2021-03-01T13:30:00Z',
  });
  // Sun 7 Mar 22:00 to Mon 8 Mar 02:00: 2 h in each ISO week; back late (overdue), 1 h over.
  await insertBooking({
    startsAt: '2021-03-07T22:00:00Z',
    endsAt: '2021-03-08T02:00:00Z',
    status: 'returned',
    releasedAt: '2021-03-07T22:00:00Z',
    returnedAt: '2021-03-08T03:00:00Z',
  });
  // Cancelled: counts nowhere.
  await insertBooking({ startsAt: '2021-03-10T10:00:00Z', endsAt: '2021-03-10T18:00:00Z', status: 'cancelled' });
  // Incidents of the month, written as a report would leave them.
  for (const [kind, severity, status] of [
    ['shock', 'serious', 'closed'],
    ['near-miss', 'low', 'open'],
    ['near-miss', 'moderate', 'under-review'],
  ] as const) {
    await ctx.db('incidents').insert({
      kind,
      severity,
      status,
      occurred_at: new Date('2021-03-15T12:00:00Z'),
      location: 'Bay 9',
      description: 'Report figures',
      reported_by: booker.id,
      tag_out: false,
    });
  }
});
afterAll(() => ctx.close());

describe('weeks and hours (ISO 8601 weeks start on Monday)', () => {
  it('puts a day in its ISO week', () => {
    // 1 Mar 2021 was a Monday, 7 Mar a Sunday (ISO 8601; checked against any 2021 calendar).
    expect(weekStartIso(new Date('2021-03-01T00:00:00Z'))).toBe('2021-03-01');
    expect(weekStartIso(new Date('2021-03-07T23:59:00Z'))).toBe('2021-03-01');
    expect(weekStartIso(new Date('2021-03-08T00:00:00Z'))).toBe('2021-03-08');
    // 1 Jan 2021 (a Friday) is in the ISO week that began on Monday 28 Dec 2020.
    expect(weekStartIso(new Date('2021-01-01T12:00:00Z'))).toBe('2020-12-28');
  });

  it('splits hours over the weeks they fall in, clipped to the period', () => {
    const split = hoursByWeek(new Date('2021-03-07T22:00:00Z'), new Date('2021-03-08T02:00:00Z'), new Date(FROM), new Date(TO));
    expect(Object.fromEntries(split)).toEqual({ '2021-03-01': 2, '2021-03-08': 2 });
    const clipped = hoursByWeek(new Date('2021-02-28T22:00:00Z'), new Date('2021-03-01T02:00:00Z'), new Date(FROM), new Date(TO));
    expect(Object.fromEntries(clipped)).toEqual({ '2021-03-01': 2 });
  });
});

describe('GET /api/reports/charts', () => {
  it('answers the figures of the period for the lab manager', async () => {
    const res = await manager.agent.get(`/api/reports/charts?from=${FROM}&to=${TO}`);
    expect(res.status).toBe(200);
    const mine = (rows: { groupName: string }[]) => rows.filter((r) => r.groupName === group.name);
    expect(mine(res.body.bookedHours)).toEqual([
      { week: '2021-03-01', groupName: group.name, hours: 6 },
      { week: '2021-03-08', groupName: group.name, hours: 2 },
    ]);
    expect(mine(res.body.energizedHours)).toEqual([{ groupName: group.name, hours: 8.5 }]);
    expect(res.body.overdueReturns).toEqual(expect.arrayContaining([{ week: '2021-03-08', count: expect.any(Number) }]));
    const incidents = res.body.incidents as { month: string; kind: string; severity: string; count: number }[];
    expect(incidents.find((r) => r.kind === 'shock' && r.severity === 'serious')?.count).toBeGreaterThanOrEqual(1);
    expect(incidents.every((r) => r.month === MONTH)).toBe(true);
  });

  it('counts never-inspected and overdue gear in this week’s inspections due', async () => {
    const never = await insertItem(ctx.db, 'meter', { nextDue: null });
    expect(never.id).toBeGreaterThan(0);
    const res = await manager.agent.get('/api/reports/charts');
    expect(res.status).toBe(200);
    const meters = (res.body.inspectionsDue as { kind: string; never: number }[]).filter((r) => r.kind === 'meter');
    expect(meters.reduce((n, r) => n + r.never, 0)).toBeGreaterThanOrEqual(1);
  });

  it('gives each chart as CSV', async () => {
    const res = await manager.agent.get(`/api/reports/charts/booked-hours.csv?from=${FROM}&to=${TO}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.text.split('\r\n')[0]).toBe('week,groupName,hours');
    expect(res.text).toContain(`2021-03-01,${group.name},6`);
    for (const name of ['energized-hours', 'overdue-returns', 'inspections-due', 'incidents']) {
      expect((await manager.agent.get(`/api/reports/charts/${name}.csv?from=${FROM}&to=${TO}`)).status).toBe(200);
    }
    expect((await manager.agent.get('/api/reports/charts/nothing.csv')).status).toBe(404);
  });

  it('is for managers only, and refuses a bad period with 400', async () => {
    expect((await member.agent.get('/api/reports/charts')).status).toBe(403);
    expect((await request(ctx.app).get('/api/reports/charts')).status).toBe(401);
    expect((await manager.agent.get(`/api/reports/charts?from=${TO}&to=${FROM}`)).status).toBe(400);
    expect((await manager.agent.get('/api/reports/charts?from=yesterday')).status).toBe(400);
  });
});

describe('GET /api/reports/safety-summary.pdf', () => {
  it('writes the month’s figures on one page, read back with pdftotext', async () => {
    const figures = await manager.agent.get(`/api/reports/safety-summary?month=${MONTH}`);
    expect(figures.status).toBe(200);
    const s = figures.body.summary;
    expect(s.incidents.total).toBeGreaterThanOrEqual(3);

    const res = await manager.agent
      .get(`/api/reports/safety-summary.pdf?month=${MONTH}`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const dir = mkdtempSync(path.join(os.tmpdir(), 'summary-'));
    writeFileSync(path.join(dir, 's.pdf'), res.body as Buffer);
    const text = execFileSync('pdftotext', ['-layout', path.join(dir, 's.pdf'), '-']).toString();
    const info = execFileSync('pdfinfo', [path.join(dir, 's.pdf')]).toString();
    expect(info).toMatch(/Pages:\s+1\b/);
    expect(text).toContain('Safety summary, March 2021');
    expect(text).toMatch(new RegExp(`Reported this month: ${s.incidents.total}\\b`));
    expect(text).toMatch(new RegExp(`Electric shock: ${s.incidents.byKind.shock}\\b`));
    expect(text).toMatch(new RegExp(`Near miss: ${s.incidents.byKind['near-miss']}\\b`));
    expect(text).toMatch(new RegExp(`Serious: ${s.incidents.bySeverity.serious}\\b`));
    expect(text).toMatch(new RegExp(`Reviews: closed: ${s.incidents.closed}\\b`));
    expect(text).toMatch(new RegExp(`Bookings: ${s.bookings.count}\\b`));
    expect(text).toMatch(new RegExp(`Overdue returns: ${s.overdueReturns}\\b`));
    expect(text).toMatch(new RegExp(`Never inspected: ${s.inspections.never}\\b`));
    // Our two bookings are in the month's figures (others' rows may add to them).
    expect(s.bookings.count).toBeGreaterThanOrEqual(2);
    expect(s.bookings.hours).toBeGreaterThanOrEqual(8);
    expect(s.overdueReturns).toBeGreaterThanOrEqual(1);
  });

  it('refuses a month that is not YYYY-MM (400) and members (403)', async () => {
    expect((await manager.agent.get('/api/reports/safety-summary.pdf?month=2021-13')).status).toBe(400);
    expect((await manager.agent.get('/api/reports/safety-summary.pdf?month=March')).status).toBe(400);
    expect((await member.agent.get(`/api/reports/safety-summary.pdf?month=${MONTH}`)).status).toBe(403);
  });
});
