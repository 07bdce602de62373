// One refusal per release rule (product.md "Release rules"), each proving the rule's code, and
// the full path that releases and returns.
import { addDaysIso, todayIso } from '../../../server/services/dates';
import { answersFor, completePre, post, scanAll } from '../../helpers/booking-flow';
import { insertItem, insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let member: Awaited<ReturnType<typeof signedInAs>>;
let officer: Awaited<ReturnType<typeof signedInAs>>;

beforeAll(async () => {
  ctx = createTestContext();
  member = await signedInAs(ctx, 'member');
  officer = await signedInAs(ctx, 'officer');
  await qualify(ctx.db, member.person.id, 40);
});
afterAll(() => ctx.close());

async function book(itemIds: number[], plannedKv: number, window = windowFromNow()) {
  const res = await post(member, '/api/bookings', { itemIds, ...window, location: 'Bay 1', purpose: 'Release rule check', plan: plan(plannedKv) });
  expect(res.status).toBe(201);
  return res.body.booking;
}

/** A booking with every step done, so each test can break exactly one thing. */
async function readyBooking(plannedKv = 10, options: { skip?: 'scan' | 'checklist'; itemIds?: number[] } = {}) {
  const kit = await insertKit(ctx.db);
  let booking = await book(options.itemIds ?? kit.all.map((i) => i.id), plannedKv);
  if (booking.status === 'awaiting-approval')
    booking = (await post(officer, `/api/bookings/${booking.id}/approval`, { decision: 'approve', planVersion: booking.planVersion })).body.booking;
  if (options.skip !== 'scan') await scanAll(member, booking);
  if (options.skip !== 'checklist') booking = await completePre(member, booking);
  return { kit, booking };
}

async function refusedRules(bookingId: number): Promise<string[]> {
  const res = await post(member, `/api/bookings/${bookingId}/release`);
  expect(res.status).toBe(409);
  expect(res.body.error.code).toBe('RELEASE_REFUSED');
  for (const failure of res.body.error.failures) expect(failure.message).toEqual(expect.any(String));
  const after = await member.agent.get(`/api/bookings/${bookingId}`);
  expect(after.body.booking.status).not.toBe('released');
  return res.body.error.failures.map((f: { rule: string }) => f.rule);
}

describe('POST /api/bookings/:id/release', () => {
  it('releases when every rule holds, and the make-safe return closes it', async () => {
    const { booking } = await readyBooking(10);
    const res = await post(member, `/api/bookings/${booking.id}/release`);
    expect(res.status).toBe(200);
    expect(res.body.booking.status).toBe('released');
    expect(res.body.booking.releasedAt).toEqual(expect.any(String));

    const returnList = res.body.booking.checklist.return;
    const residual = returnList.find((e: { unit?: string }) => e.unit === 'V');
    await post(member, `/api/bookings/${booking.id}/checklist`, { phase: 'return', answers: answersFor(returnList, { [residual.id]: 3 }) }).expect(200);
    const returned = await post(member, `/api/bookings/${booking.id}/return`, {});
    expect(returned.status).toBe(200);
    expect(returned.body.booking.status).toBe('returned');
    const audit = await ctx
      .db('audit_events')
      .where({ entity: 'booking', entity_id: String(booking.id) })
      .pluck('action');
    expect(audit).toEqual(
      expect.arrayContaining([
        'booking.created',
        'booking.item-scanned',
        'checklist.pre-completed',
        'booking.released',
        'checklist.return-completed',
        'booking.returned',
      ]),
    );
  });

  it('rule "approval": above the approval voltage without an officer decision', async () => {
    const kit = await insertKit(ctx.db);
    const booking = await book(
      kit.all.map((i) => i.id),
      25,
    );
    await scanAll(member, booking);
    await completePre(member, booking);
    expect(await refusedRules(booking.id)).toContain('approval');
  });

  it('rule "approval": a plan changed after approval needs a new decision', async () => {
    const { booking } = await readyBooking(25);
    await member.agent
      .patch(`/api/bookings/${booking.id}`)
      .set('x-csrf-token', member.csrf())
      .send({ plan: plan(26) })
      .expect(200);
    expect(await refusedRules(booking.id)).toContain('approval');
  });

  it('rule "window": too early to pick up', async () => {
    const kit = await insertKit(ctx.db);
    const booking = await book(
      kit.all.map((i) => i.id),
      10,
      windowFromNow(120),
    );
    await scanAll(member, booking);
    await completePre(member, booking);
    expect(await refusedRules(booking.id)).toEqual(['window']);
  });

  it('rule "scanned": an item not scanned at the counter', async () => {
    const { booking } = await readyBooking(10, { skip: 'scan' });
    await post(member, `/api/bookings/${booking.id}/scans`, { tag: booking.items[0].tag }).expect(200);
    expect(await refusedRules(booking.id)).toEqual(['scanned']);
  });

  it('scanning an item that is not in the booking says so', async () => {
    const { booking } = await readyBooking(10, { skip: 'scan' });
    const stranger = await insertItem(ctx.db, 'probe');
    const res = await post(member, `/api/bookings/${booking.id}/scans`, { tag: stranger.tag });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('ITEM_NOT_IN_BOOKING');
    expect(res.body.error.message).toContain(stranger.tag);
  });

  it('rule "in-service": an item tagged out after booking', async () => {
    const { booking, kit } = await readyBooking(10);
    await ctx.db('items').where({ id: kit.probe.id }).update({ status: 'out-of-service', status_reason: 'Cracked housing' });
    expect(await refusedRules(booking.id)).toEqual(['in-service']);
  });

  it('rule "inspection": an item whose inspection is overdue', async () => {
    const { booking, kit } = await readyBooking(10);
    await ctx
      .db('items')
      .where({ id: kit.stick.id })
      .update({ next_inspection_due: addDaysIso(todayIso(), -1) });
    expect(await refusedRules(booking.id)).toEqual(['inspection']);
  });

  it('rule "rating": an item rated below the planned voltage with the margin', async () => {
    // 38 kV with a 10 % margin needs 41.8 kV: the 40 kV probe falls short.
    const { booking } = await readyBooking(38);
    expect(await refusedRules(booking.id)).toEqual(expect.arrayContaining(['rating']));
  });

  it('rule "grounding-stick": no grounding stick in the set', async () => {
    const kit = await insertKit(ctx.db);
    const { booking } = await readyBooking(10, { itemIds: [kit.supply.id, kit.stand.id, kit.interlock.id] });
    expect(await refusedRules(booking.id)).toEqual(['grounding-stick']);
  });

  it('rule "isolation-stand": no isolation stand rated for the plan', async () => {
    const kit = await insertKit(ctx.db);
    const lowStand = await insertItem(ctx.db, 'isolation-stand', { ratings: { withstandKv: 5 } });
    const { booking } = await readyBooking(10, { itemIds: [kit.supply.id, kit.stick.id, kit.interlock.id, lowStand.id] });
    expect(await refusedRules(booking.id)).toEqual(expect.arrayContaining(['isolation-stand']));
  });

  it('rule "interlock": above the lab interlock voltage without an interlock', async () => {
    const kit = await insertKit(ctx.db);
    const { booking } = await readyBooking(10, { itemIds: [kit.supply.id, kit.stick.id, kit.stand.id] });
    expect(await refusedRules(booking.id)).toEqual(['interlock']);
  });

  it('rule "checklist": pre-energize checklist not completed', async () => {
    const { booking } = await readyBooking(10, { skip: 'checklist' });
    expect(await refusedRules(booking.id)).toEqual(['checklist']);
  });

  it('rule "checklist": a reading outside its limits', async () => {
    const { booking } = await readyBooking(10, { skip: 'checklist' });
    const bleeder = booking.checklist.pre.find((e: { kind: string }) => e.kind === 'reading');
    await completePre(member, booking, { [bleeder.id]: 5 }); // below the 10 MΩ lower limit
    expect(await refusedRules(booking.id)).toEqual(['checklist']);
  });

  it('an incomplete checklist is refused outright with 400 and nothing recorded', async () => {
    const { booking } = await readyBooking(10, { skip: 'checklist' });
    const res = await post(member, `/api/bookings/${booking.id}/checklist`, { phase: 'pre', answers: [] });
    expect(res.status).toBe(400);
    expect(await ctx.db('checklist_runs').where({ booking_id: booking.id })).toHaveLength(0);
  });

  it('rule "qualification": the member is not qualified and no officer approved', async () => {
    const unqualified = await signedInAs(ctx, 'member');
    await qualify(ctx.db, unqualified.person.id, 5);
    const kit = await insertKit(ctx.db);
    const res = await post(unqualified, '/api/bookings', {
      itemIds: kit.all.map((i) => i.id),
      ...windowFromNow(),
      location: 'Bay 1',
      purpose: 'Unqualified run',
      plan: plan(10),
    });
    const booking = res.body.booking;
    expect(booking.assessment.approvalReasons.map((r: { code: string }) => r.code)).toEqual(['qualification']);
    await scanAll(unqualified, booking);
    await completePre(unqualified, booking);
    const release = await post(unqualified, `/api/bookings/${booking.id}/release`);
    expect(release.status).toBe(409);
    expect(release.body.error.failures.map((f: { rule: string }) => f.rule).sort()).toEqual(['approval', 'qualification']);
    // An officer's approval covers it.
    await post(officer, `/api/bookings/${booking.id}/approval`, {
      decision: 'approve',
      planVersion: booking.planVersion,
      conditions: 'Supervised by I. Achterberg',
    }).expect(200);
    const released = await post(unqualified, `/api/bookings/${booking.id}/release`);
    expect(released.status).toBe(200);
    // The answer shows the stored approval and checklist run as they are, times to the millisecond.
    const approvalRow = await ctx.db('approvals').where({ booking_id: booking.id }).first();
    const runRow = await ctx.db('checklist_runs').where({ booking_id: booking.id, phase: 'pre' }).orderBy('id', 'desc').first();
    const { name: officerName } = await ctx.db('people').where({ id: officer.person.id }).first('name');
    expect(released.body.booking.approval).toEqual({
      decision: 'approve',
      officerName,
      conditions: 'Supervised by I. Achterberg',
      reason: null,
      decidedAt: new Date(approvalRow.decided_at).toISOString(),
      planVersion: 1,
      current: true,
    });
    expect(released.body.booking.checklistRuns.pre).toEqual({
      completedAt: new Date(runRow.completed_at).toISOString(),
      withinLimits: true,
      complete: true,
      gaps: [],
    });
    expect(released.body.booking.checklistRuns.return).toBeNull();
  });

  it('rule "status": a cancelled booking cannot be released', async () => {
    const { booking } = await readyBooking(10);
    await post(member, `/api/bookings/${booking.id}/cancel`).expect(200);
    expect(await refusedRules(booking.id)).toContain('status');
  });
});

describe('POST /api/bookings/:id/return', () => {
  async function released() {
    const { booking, kit } = await readyBooking(10);
    const res = await post(member, `/api/bookings/${booking.id}/release`);
    expect(res.status).toBe(200);
    return { booking: res.body.booking, kit };
  }

  it('is refused until the make-safe checklist is done', async () => {
    const { booking } = await released();
    const res = await post(member, `/api/bookings/${booking.id}/return`, {});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('RETURN_REFUSED');
  });

  it('is refused while the residual voltage reading is above the safe level', async () => {
    const { booking } = await released();
    const residual = booking.checklist.return.find((e: { unit?: string }) => e.unit === 'V');
    await post(member, `/api/bookings/${booking.id}/checklist`, {
      phase: 'return',
      answers: answersFor(booking.checklist.return, { [residual.id]: 400 }),
    }).expect(200);
    const res = await post(member, `/api/bookings/${booking.id}/return`, {});
    expect(res.status).toBe(409);
    expect(res.body.error.failures[0].message).toMatch(/residual/i);
  });

  it('tags a damaged item out with an incident record', async () => {
    const { booking, kit } = await released();
    const residual = booking.checklist.return.find((e: { unit?: string }) => e.unit === 'V');
    await post(member, `/api/bookings/${booking.id}/checklist`, {
      phase: 'return',
      answers: answersFor(booking.checklist.return, { [residual.id]: 0 }),
    }).expect(200);
    expect((await post(member, `/api/bookings/${booking.id}/return`, { damagedItemIds: [kit.probe.id] })).status).toBe(400);
    const res = await post(member, `/api/bookings/${booking.id}/return`, { damagedItemIds: [kit.probe.id], notes: 'Probe tip bent after an arc-over' });
    expect(res.status).toBe(200);
    const probe = await ctx.db('items').where({ id: kit.probe.id }).first();
    expect(probe.status).toBe('out-of-service');
    expect(probe.status_reason).toMatch(/arc-over/);
    // The same incident a report makes (issue 17): kind damage, the item named, officers mailed once.
    const incidents = await ctx.db('incidents').where({ booking_id: booking.id });
    expect(incidents).toHaveLength(1);
    expect(incidents[0]).toMatchObject({ kind: 'damage', status: 'open', reported_by: member.person.id, description: 'Probe tip bent after an arc-over' });
    expect(Boolean(incidents[0].tag_out)).toBe(true);
    expect(await ctx.db('incident_items').where({ incident_id: incidents[0].id }).pluck('item_id')).toEqual([kit.probe.id]);
    const mail = await ctx
      .db('outbox')
      .where({ kind: 'incident-reported', to_address: officer.person.email })
      .andWhere('dedupe_key', `incident-reported:${incidents[0].id}:${officer.person.id}`);
    expect(mail).toHaveLength(1);
    expect(mail[0].text_body).toContain('Taken out of service now');
    // The officer's queue shows it.
    const queue = await officer.agent.get('/api/incidents?status=open');
    expect(queue.body.incidents.map((i: { id: number }) => i.id)).toContain(incidents[0].id);
  });
});
