import { createPerson, createTestContext, signedInAgent, signedInAs, type TestContext } from '../../helpers/test-app';
import { insertItem, insertKit, plan, qualify } from '../../helpers/gear';
import { post } from '../../helpers/booking-flow';

let ctx: TestContext;
let officer: Awaited<ReturnType<typeof signedInAs>>;
let manager: Awaited<ReturnType<typeof signedInAs>>;
let member: Awaited<ReturnType<typeof signedInAs>>;
let kit: Awaited<ReturnType<typeof insertKit>>;
let bookingId: number;
const unique = `Quenby${process.pid}${Date.now().toString(36)}`;

beforeAll(async () => {
  ctx = createTestContext();
  officer = await signedInAs(ctx, 'officer');
  manager = await signedInAs(ctx, 'manager');
  const person = await createPerson(ctx.db, { role: 'member', name: `${unique} Aldous` });
  member = { person, ...(await signedInAgent(ctx.app, person)) };
  await qualify(ctx.db, person.id, 40);
  kit = await insertKit(ctx.db);
  const start = new Date(Date.now() + 120 * 86400_000);
  const res = await post(member, '/api/bookings', {
    itemIds: kit.all.map((i) => i.id),
    startsAt: start.toISOString(),
    endsAt: new Date(start.getTime() + 3600_000).toISOString(),
    location: 'Bay 2',
    purpose: 'Audit search test',
    plan: plan(5),
  });
  expect(res.status).toBe(201);
  bookingId = res.body.booking.id;
  const tagOut = await manager.agent
    .patch(`/api/items/${kit.stick.id}`)
    .set('x-csrf-token', manager.csrf())
    .send({ status: 'out-of-service', statusReason: 'Hook cracked' });
  expect(tagOut.status).toBe(200);
});
afterAll(() => ctx.close());

describe('GET /api/audit', () => {
  describe('searched by a gear tag', () => {
    it('finds the item’s own entries and the bookings it was in, each with its subject’s names', async () => {
      const res = await officer.agent.get(`/api/audit?tag=${encodeURIComponent(kit.stick.tag)}`).expect(200);
      const actions = res.body.events.map((e: { action: string }) => e.action);
      expect(actions).toEqual(['item.tagged-out', 'booking.created']);
      const [tagOut, created] = res.body.events;
      expect(tagOut.subject).toMatchObject({ tag: kit.stick.tag });
      expect(created.entityId).toBe(String(bookingId));
      expect(created.subject.personName).toBe(`${unique} Aldous`);
      expect(created.subject.tags).toEqual(expect.arrayContaining([kit.stick.tag, kit.supply.tag]));
    });

    it('answers an empty page for a tag no item has', async () => {
      const res = await officer.agent.get('/api/audit?tag=NO-SUCH-TAG-999').expect(200);
      expect(res.body).toEqual({ events: [], nextCursor: null });
    });
  });

  describe('searched by a person', () => {
    it('finds what the person did and what was done to their bookings, by part of the name', async () => {
      const res = await officer.agent.get(`/api/audit?person=${unique.toLowerCase()}`).expect(200);
      const entries = res.body.events.map((e: { action: string; entityId: string }) => `${e.action}:${e.entityId}`);
      expect(entries).toContain(`booking.created:${bookingId}`);
      // The manager's tag-out is about an item, not about this person.
      expect(entries).not.toContain(`item.tagged-out:${kit.stick.id}`);
    });

    it('combines with the tag: only entries matching both', async () => {
      const res = await officer.agent.get(`/api/audit?person=${unique}&tag=${kit.stick.tag}`).expect(200);
      expect(res.body.events.map((e: { action: string }) => e.action)).toEqual(['booking.created']);
    });
  });

  describe('searched by a time span', () => {
    it('keeps entries inside the span only', async () => {
      const now = Date.now();
      const inside = await officer.agent
        .get(`/api/audit?tag=${kit.stick.tag}&from=${new Date(now - 3600_000).toISOString()}&to=${new Date(now + 60_000).toISOString()}`)
        .expect(200);
      expect(inside.body.events).toHaveLength(2);
      const before = await officer.agent.get(`/api/audit?tag=${kit.stick.tag}&to=${new Date(now - 3600_000).toISOString()}`).expect(200);
      expect(before.body.events).toHaveLength(0);
    });
  });

  describe('with a bad search', () => {
    it.each([
      ['from=yesterday', 'from'],
      ['person=a', 'person'],
      [`from=${new Date().toISOString()}&to=${new Date(Date.now() - 1000).toISOString()}`, 'to'],
      ['tag=' + 'X'.repeat(40), 'tag'],
    ])('refuses %s with 400 naming the field', async (query, field) => {
      const res = await officer.agent.get(`/api/audit?${query}`);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('VALIDATION_FAILED');
      expect(Object.keys(res.body.error.fieldErrors ?? {})).toContain(field);
    });

    it('is still closed to members', async () => {
      expect((await member.agent.get(`/api/audit?tag=${kit.stick.tag}`)).status).toBe(403);
    });
  });

  it('item history carries the subject too, for the item page’s sentences', async () => {
    const probe = await insertItem(ctx.db, 'probe');
    await manager.agent
      .patch(`/api/items/${probe.id}`)
      .set('x-csrf-token', manager.csrf())
      .send({ status: 'retired', statusReason: 'Cracked body' })
      .expect(200);
    const res = await member.agent.get(`/api/items/${probe.id}/history`).expect(200);
    expect(res.body.events[0]).toMatchObject({ action: 'item.retired', subject: { tag: probe.tag } });
  });
});
