// Incidents (issue 17 points 1 and 2): POST /api/incidents reports, tags out in the same
// transaction and mails once; GET shows each role what it may see; PATCH is the officer's review.
import { PNG } from 'pngjs';
import { addDaysIso, todayIso } from '../../../server/services/dates';
import { post } from '../../helpers/booking-flow';
import { insertItem, insertKit, plan, qualify, windowFromNow } from '../../helpers/gear';
import { createTestContext, signedInAs, uniqueWord, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
type Who = Awaited<ReturnType<typeof signedInAs>>;
let reporter: Who;
let otherMember: Who;
let officer: Who;
let manager: Who;

beforeAll(async () => {
  ctx = createTestContext();
  reporter = await signedInAs(ctx, 'member');
  otherMember = await signedInAs(ctx, 'member');
  officer = await signedInAs(ctx, 'officer');
  manager = await signedInAs(ctx, 'manager');
});
afterAll(() => ctx.close());

const patch = (who: Who, path: string, body: unknown) =>
  who.agent
    .patch(path)
    .set('x-csrf-token', who.csrf())
    .send(body as object);
const minutesAgo = (n: number) => new Date(Date.now() - n * 60_000).toISOString();

function report(overrides: Record<string, unknown> = {}) {
  return {
    kind: 'damage',
    severity: 'moderate',
    occurredAt: minutesAgo(5),
    location: `Bay 3 ${uniqueWord()}`,
    description: 'Probe lead insulation split near the tip',
    itemIds: [] as number[],
    tagOut: true,
    ...overrides,
  };
}

async function mailTo(email: string, kind = 'incident-reported') {
  return ctx.db('outbox').where({ to_address: email, kind }).select('dedupe_key', 'subject', 'text_body');
}

async function counts() {
  const [incidents, outbox, audit] = await Promise.all([
    ctx.db('incidents').count({ n: '*' }).first(),
    ctx.db('outbox').where({ kind: 'incident-reported' }).count({ n: '*' }).first(),
    ctx.db('audit_events').where({ entity: 'incident' }).count({ n: '*' }).first(),
  ]);
  return { incidents: Number(incidents!.n), outbox: Number(outbox!.n), audit: Number(audit!.n) };
}

describe('POST /api/incidents', () => {
  it('records the report, tags the items out in its transaction and audits both', async () => {
    const probe = await insertItem(ctx.db, 'probe');
    const stick = await insertItem(ctx.db, 'grounding-stick');
    const res = await post(reporter, '/api/incidents', report({ itemIds: [stick.id, probe.id] }));
    expect(res.status).toBe(201);
    const { incident } = res.body;
    expect(incident).toMatchObject({
      kind: 'damage',
      severity: 'moderate',
      status: 'open',
      tagOut: true,
      bookingId: null,
      reportedBy: { id: reporter.person.id },
      cause: null,
      correctiveActions: [],
    });
    expect(incident.items.map((i: { id: number }) => i.id).sort()).toEqual([probe.id, stick.id].sort());
    for (const item of [probe, stick]) {
      const row = await ctx.db('items').where({ id: item.id }).first('status', 'status_reason');
      expect(row.status).toBe('out-of-service');
      expect(row.status_reason).toContain(`Incident #${incident.id}`);
      const audit = await ctx.db('audit_events').where({ entity: 'item', entity_id: String(item.id), action: 'item.tagged-out-for-incident' });
      expect(audit).toHaveLength(1);
    }
    expect(await ctx.db('audit_events').where({ entity: 'incident', entity_id: String(incident.id), action: 'incident.reported' })).toHaveLength(1);
  });

  it('leaves the items in service when "take out of service" is off', async () => {
    const item = await insertItem(ctx.db, 'meter');
    const res = await post(reporter, '/api/incidents', report({ kind: 'near-miss', severity: 'low', itemIds: [item.id], tagOut: false }));
    expect(res.status).toBe(201);
    expect((await ctx.db('items').where({ id: item.id }).first('status')).status).toBe('in-service');
  });

  it('e-mails each officer once, and the lab manager too for a shock or a burn', async () => {
    const damage = await post(reporter, '/api/incidents', report({ kind: 'damage' }));
    expect(damage.status).toBe(201);
    const officerMail = (await mailTo(officer.person.email)).filter(
      (m) => m.dedupe_key === `incident-reported:${damage.body.incident.id}:${officer.person.id}`,
    );
    expect(officerMail).toHaveLength(1);
    expect(officerMail[0].text_body).toContain('Probe lead insulation split');
    expect((await mailTo(manager.person.email)).filter((m) => m.dedupe_key?.startsWith(`incident-reported:${damage.body.incident.id}:`))).toHaveLength(0);

    const shock = await post(
      reporter,
      '/api/incidents',
      report({ kind: 'shock', severity: 'severe', description: 'Felt a tingle through the left hand at the HV lead' }),
    );
    expect(shock.status).toBe(201);
    const key = (p: { id: number }) => `incident-reported:${shock.body.incident.id}:${p.id}`;
    expect((await mailTo(officer.person.email)).filter((m) => m.dedupe_key === key(officer.person))).toHaveLength(1);
    expect((await mailTo(manager.person.email)).filter((m) => m.dedupe_key === key(manager.person))).toHaveLength(1);
    // The reporter is not told of their own report.
    expect((await mailTo(reporter.person.email)).filter((m) => m.dedupe_key === key(reporter.person))).toHaveLength(0);
  });

  it.each([
    ['an unknown kind', { kind: 'explosion' }, 'kind'],
    ['an unknown severity', { severity: 'critical' }, 'severity'],
    ['no time', { occurredAt: undefined }, 'occurredAt'],
    ['a time in the future', { occurredAt: new Date(Date.now() + 3 * 3600_000).toISOString() }, 'occurredAt'],
    ['no place', { location: '  ' }, 'location'],
    ['no description', { description: '' }, 'description'],
    ['an item that does not exist', { itemIds: [2_000_000_000] }, 'itemIds'],
    ['no tag-out choice', { tagOut: undefined }, 'tagOut'],
    ['a field the API does not know', { reportedBy: 1 }, '_'],
  ])('answers 400 for %s and changes nothing', async (_label, overrides, field) => {
    const item = await insertItem(ctx.db, 'probe');
    const before = await counts();
    const res = await post(
      reporter,
      '/api/incidents',
      report({ itemIds: [item.id], ...overrides, ...('itemIds' in overrides ? { itemIds: [item.id, ...(overrides.itemIds as number[])] } : {}) }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    expect(Object.keys(res.body.error.fieldErrors ?? { _: [] }).join(' ')).toContain(field);
    expect(await counts()).toEqual(before);
    expect((await ctx.db('items').where({ id: item.id }).first('status')).status).toBe('in-service');
  });

  it('refuses a booking that is not the reporter’s (400), and accepts their own', async () => {
    await qualify(ctx.db, otherMember.person.id, 40);
    const kit = await insertKit(ctx.db);
    const booked = await post(otherMember, '/api/bookings', {
      itemIds: kit.all.map((i) => i.id),
      ...windowFromNow(60),
      location: 'Bay 1',
      purpose: 'Incident booking check',
      plan: plan(10),
    });
    expect(booked.status).toBe(201);
    const before = await counts();
    const refused = await post(reporter, '/api/incidents', report({ bookingId: booked.body.booking.id, itemIds: [kit.probe.id] }));
    expect(refused.status).toBe(400);
    expect(refused.body.error.fieldErrors.bookingId).toBeDefined();
    expect(await counts()).toEqual(before);
    expect((await ctx.db('items').where({ id: kit.probe.id }).first('status')).status).toBe('in-service');

    const own = await post(
      otherMember,
      '/api/incidents',
      report({ kind: 'arc-over', bookingId: booked.body.booking.id, itemIds: [kit.probe.id], tagOut: false }),
    );
    expect(own.status).toBe(201);
    expect(own.body.incident.bookingId).toBe(booked.body.booking.id);
    const listed = await otherMember.agent.get(`/api/incidents?bookingId=${booked.body.booking.id}`);
    expect(listed.body.incidents.map((i: { id: number }) => i.id)).toEqual([own.body.incident.id]);
  });

  it('rolls the tag-out back when anything later in the report fails (one transaction)', async () => {
    const item = await insertItem(ctx.db, 'probe');
    const marker = `rollback-${uniqueWord()}`;
    // Fails the officers' e-mail, the last write of the report, for this report only.
    const trigger = `fail_${marker.replace(/[^a-z0-9]/gi, '_')}`.slice(0, 60);
    await ctx.db.raw(
      `CREATE TRIGGER ${trigger} BEFORE INSERT ON outbox FOR EACH ROW BEGIN IF NEW.text_body LIKE ? THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'test: outbox refused'; END IF; END`.replace(
        '?',
        `'%${marker}%'`,
      ),
    );
    try {
      const before = await counts();
      const res = await post(reporter, '/api/incidents', report({ itemIds: [item.id], location: marker }));
      expect(res.status).toBe(500);
      expect((await ctx.db('items').where({ id: item.id }).first('status')).status).toBe('in-service');
      expect(await ctx.db('audit_events').where({ entity: 'item', entity_id: String(item.id) })).toHaveLength(0);
      expect(await counts()).toEqual(before);
    } finally {
      await ctx.db.raw(`DROP TRIGGER IF EXISTS ${trigger}`);
    }
  });

  it('answers 401 when signed out', async () => {
    const res = await (await import('supertest')).default(ctx.app).post('/api/incidents').send(report());
    expect([401, 403]).toContain(res.status);
  });
});

describe('GET /api/incidents and /api/incidents/:id', () => {
  let mine: number;
  let onBookedGear: number;
  let unrelated: number;
  let item: { id: number; tag: string };

  beforeAll(async () => {
    const viewer = otherMember;
    await qualify(ctx.db, viewer.person.id, 40);
    const kit = await insertKit(ctx.db);
    item = kit.probe;
    // The viewer has booked this gear; someone else later reports a problem with it.
    const booked = await post(viewer, '/api/bookings', {
      itemIds: kit.all.map((i) => i.id),
      ...windowFromNow(24 * 60),
      location: 'Bay 2',
      purpose: 'Visibility check',
      plan: plan(10),
    });
    expect(booked.status).toBe(201);
    onBookedGear = (await post(reporter, '/api/incidents', report({ kind: 'burn', severity: 'serious', itemIds: [item.id], tagOut: false }))).body.incident.id;
    mine = (await post(viewer, '/api/incidents', report({ kind: 'near-miss', severity: 'low', tagOut: false }))).body.incident.id;
    const stray = await insertItem(ctx.db, 'meter');
    unrelated = (await post(reporter, '/api/incidents', report({ kind: 'other', itemIds: [stray.id], tagOut: false }))).body.incident.id;
  });

  it('shows a member their own reports and those on gear they booked, nothing else', async () => {
    const res = await otherMember.agent.get('/api/incidents');
    expect(res.status).toBe(200);
    const ids = res.body.incidents.map((i: { id: number }) => i.id);
    expect(ids).toEqual(expect.arrayContaining([mine, onBookedGear]));
    expect(ids).not.toContain(unrelated);
    expect((await otherMember.agent.get(`/api/incidents/${unrelated}`)).status).toBe(404);
    expect((await otherMember.agent.get(`/api/incidents/${onBookedGear}`)).status).toBe(200);
  });

  it('shows officers and managers every report', async () => {
    for (const who of [officer, manager]) {
      const ids = (await who.agent.get('/api/incidents')).body.incidents.map((i: { id: number }) => i.id);
      expect(ids).toEqual(expect.arrayContaining([mine, onBookedGear, unrelated]));
      expect((await who.agent.get(`/api/incidents/${unrelated}`)).status).toBe(200);
    }
  });

  it('filters by status, kind and item', async () => {
    const byItem = await officer.agent.get(`/api/incidents?itemId=${item.id}`);
    expect(byItem.body.incidents.map((i: { id: number }) => i.id)).toEqual([onBookedGear]);
    const burns = await officer.agent.get('/api/incidents?kind=burn&status=open');
    expect(burns.body.incidents.every((i: { kind: string; status: string }) => i.kind === 'burn' && i.status === 'open')).toBe(true);
    expect(burns.body.incidents.map((i: { id: number }) => i.id)).toContain(onBookedGear);
  });

  it('answers 400 for an unknown filter value and 404 for an unknown id', async () => {
    expect((await officer.agent.get('/api/incidents?status=pending')).status).toBe(400);
    expect((await officer.agent.get('/api/incidents?colour=red')).status).toBe(400);
    expect((await officer.agent.get('/api/incidents/999999999')).status).toBe(404);
    expect((await officer.agent.get('/api/incidents/abc')).status).toBe(400);
  });
});

describe('PATCH /api/incidents/:id (the officer’s review)', () => {
  async function openIncident() {
    const res = await post(reporter, '/api/incidents', report({ kind: 'arc-over', severity: 'serious', tagOut: false }));
    expect(res.status).toBe(201);
    return res.body.incident.id as number;
  }
  const action = (dueOn = addDaysIso(todayIso(), 14)) => ({
    action: 'Replace the cracked HV lead and add a strain relief',
    ownerId: reporter.person.id,
    dueOn,
  });

  it('is for officers only: members and managers get 403 and change nothing', async () => {
    const id = await openIncident();
    for (const who of [reporter, manager]) {
      const res = await patch(who, `/api/incidents/${id}`, { status: 'under-review' });
      expect(res.status).toBe(403);
    }
    expect((await ctx.db('incidents').where({ id }).first('status')).status).toBe('open');
  });

  it('moves open → under review → closed, closing only with a cause and an action', async () => {
    const id = await openIncident();
    const review = await patch(officer, `/api/incidents/${id}`, { status: 'under-review' });
    expect(review.status).toBe(200);
    expect(review.body.incident.status).toBe('under-review');

    const noCause = await patch(officer, `/api/incidents/${id}`, { status: 'closed', correctiveActions: [action()] });
    expect(noCause.status).toBe(400);
    expect(noCause.body.error.fieldErrors.cause).toBeDefined();
    const noAction = await patch(officer, `/api/incidents/${id}`, { status: 'closed', cause: 'Lead routed over a sharp bench edge' });
    expect(noAction.status).toBe(400);
    expect(noAction.body.error.fieldErrors.correctiveActions).toBeDefined();
    const emptyActions = await patch(officer, `/api/incidents/${id}`, {
      status: 'closed',
      cause: 'Lead routed over a sharp bench edge',
      correctiveActions: [],
    });
    expect(emptyActions.status).toBe(400);
    // Nothing of the refused closings was kept.
    const row = await ctx.db('incidents').where({ id }).first('status', 'cause');
    expect(row).toEqual({ status: 'under-review', cause: null });
    expect(await ctx.db('incident_actions').where({ incident_id: id })).toHaveLength(0);

    const closed = await patch(officer, `/api/incidents/${id}`, {
      status: 'closed',
      cause: 'Lead routed over a sharp bench edge',
      correctiveActions: [action()],
    });
    expect(closed.status).toBe(200);
    expect(closed.body.incident).toMatchObject({ status: 'closed', cause: 'Lead routed over a sharp bench edge', closedAt: expect.any(String) });
    expect(closed.body.incident.correctiveActions).toEqual([
      expect.objectContaining({ action: action().action, ownerId: reporter.person.id, ownerName: reporter.person.name, doneAt: null, pastDue: false }),
    ]);

    const again = await patch(officer, `/api/incidents/${id}`, { status: 'open' });
    expect(again.status).toBe(409);
    const audit = await ctx
      .db('audit_events')
      .where({ entity: 'incident', entity_id: String(id) })
      .orderBy('id')
      .pluck('action');
    expect(audit).toEqual(['incident.reported', 'incident.under-review', 'incident.closed']);
  });

  it('answers 400 for a bad status, a bad date or an unknown owner, and changes nothing', async () => {
    const id = await openIncident();
    for (const body of [
      { status: 'done' },
      { status: 'under-review', correctiveActions: [{ ...action(), dueOn: '14/12/2026' }] },
      { status: 'under-review', correctiveActions: [{ ...action(), ownerId: 2_000_000_000 }] },
      { status: 'under-review', correctiveActions: [{ ...action(), action: '' }] },
    ]) {
      const res = await patch(officer, `/api/incidents/${id}`, body);
      expect(res.status).toBe(400);
    }
    expect((await ctx.db('incidents').where({ id }).first('status')).status).toBe('open');
    expect(await ctx.db('incident_actions').where({ incident_id: id })).toHaveLength(0);
  });

  it('lists past-due actions for their owner and every officer until the owner marks them done', async () => {
    const id = await openIncident();
    const yesterday = addDaysIso(todayIso(), -1);
    const res = await patch(officer, `/api/incidents/${id}`, {
      status: 'closed',
      cause: 'Interlock bypassed for a quick check',
      correctiveActions: [action(yesterday)],
    });
    expect(res.status).toBe(200);
    const actionId = res.body.incident.correctiveActions[0].id;
    expect(res.body.incident.correctiveActions[0].pastDue).toBe(true);

    const forOwner = await reporter.agent.get('/api/incidents/actions/past-due');
    expect(forOwner.body.actions.map((a: { id: number }) => a.id)).toContain(actionId);
    const forOfficer = await officer.agent.get('/api/incidents/actions/past-due');
    expect(forOfficer.body.actions.map((a: { id: number }) => a.id)).toContain(actionId);
    const forOther = await otherMember.agent.get('/api/incidents/actions/past-due');
    expect(forOther.body.actions.map((a: { id: number }) => a.id)).not.toContain(actionId);

    expect((await patch(otherMember, `/api/incidents/actions/${actionId}`, { done: true })).status).toBe(403);
    const done = await patch(reporter, `/api/incidents/actions/${actionId}`, { done: true });
    expect(done.status).toBe(200);
    expect(done.body.incident.correctiveActions[0].doneAt).toEqual(expect.any(String));
    expect((await reporter.agent.get('/api/incidents/actions/past-due')).body.actions.map((a: { id: number }) => a.id)).not.toContain(actionId);
  });
});

describe('POST /api/incidents/:id/photos', () => {
  function pngBytes(): Buffer {
    const png = new PNG({ width: 4, height: 4 });
    png.data.fill(90);
    return PNG.sync.write(png);
  }

  it('keeps a photo with the report, served only to those who may see the report', async () => {
    const id = (await post(reporter, '/api/incidents', report({ tagOut: false }))).body.incident.id;
    const up = await reporter.agent
      .post(`/api/incidents/${id}/photos`)
      .set('x-csrf-token', reporter.csrf())
      .attach('file', pngBytes(), { filename: 'lead.png', contentType: 'image/png' });
    expect(up.status).toBe(201);
    const fileId = up.body.file.id;
    expect((await reporter.agent.get(`/api/incidents/${id}`)).body.incident.photos.map((p: { id: number }) => p.id)).toEqual([fileId]);
    expect((await reporter.agent.get(`/api/files/${fileId}`)).status).toBe(200);
    expect((await officer.agent.get(`/api/files/${fileId}`)).status).toBe(200);
    expect((await otherMember.agent.get(`/api/files/${fileId}`)).status).toBe(404);
    // Someone else cannot add to the report.
    const refused = await otherMember.agent
      .post(`/api/incidents/${id}/photos`)
      .set('x-csrf-token', otherMember.csrf())
      .attach('file', pngBytes(), { filename: 'x.png', contentType: 'image/png' });
    expect(refused.status).toBe(404);
  });
});
