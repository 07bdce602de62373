import request from 'supertest';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';
import { put } from '../../helpers/booking-flow';

let ctx: TestContext;
let officer: Awaited<ReturnType<typeof signedInAs>>;
let member: Awaited<ReturnType<typeof signedInAs>>;
beforeAll(async () => {
  ctx = createTestContext();
  officer = await signedInAs(ctx, 'officer');
  member = await signedInAs(ctx, 'member');
});
afterAll(() => ctx.close());

describe('GET/PUT /api/lab-rules', () => {
  it('returns the lab rules with their documented defaults', async () => {
    const res = await member.agent.get('/api/lab-rules').expect(200);
    expect(Object.keys(res.body).sort()).toEqual([
      'approvalKv',
      'earlyPickupMin',
      'energyThresholdJ',
      'interlockKv',
      'overdueGraceMin',
      'ratingMarginPct',
      'safeResidualV',
    ]);
  });

  it('lets an officer change a rule, audited with before and after, and refuses members', async () => {
    const current = (await officer.agent.get('/api/lab-rules')).body;
    // overdueGraceMin does not affect the booking tests running beside this file.
    const changed = { ...current, overdueGraceMin: current.overdueGraceMin + 1 };
    const res = await put(officer, '/api/lab-rules', changed);
    expect(res.status).toBe(200);
    expect(res.body).toEqual(changed);
    const audit = await officer.agent.get('/api/audit?entity=lab-rules&id=1').expect(200);
    expect(audit.body.events[0]).toMatchObject({ action: 'lab-rules.updated', before: current, after: changed });
    await put(officer, '/api/lab-rules', current).expect(200);
    expect((await put(member, '/api/lab-rules', current)).status).toBe(403);
  });

  it('refuses incomplete or out-of-range rules with 400 and changes nothing', async () => {
    const current = (await officer.agent.get('/api/lab-rules')).body;
    expect((await put(officer, '/api/lab-rules', { ...current, ratingMarginPct: -5 })).status).toBe(400);
    expect((await put(officer, '/api/lab-rules', { approvalKv: 10 })).status).toBe(400);
    expect((await officer.agent.get('/api/lab-rules')).body).toEqual(current);
  });
});

describe('GET/PUT /api/people/:id/qualification', () => {
  it("an officer records a member's authorised voltage and expiry; the member reads their own", async () => {
    const res = await put(officer, `/api/people/${member.person.id}/qualification`, {
      authorisedKv: 30,
      expiresOn: '2027-06-30',
      notes: 'HV awareness + qualified-person course',
    });
    expect(res.status).toBe(200);
    expect(res.body.qualification).toMatchObject({ personId: member.person.id, authorisedKv: 30, expiresOn: '2027-06-30' });
    const own = await member.agent.get(`/api/people/${member.person.id}/qualification`).expect(200);
    expect(own.body.qualification.authorisedKv).toBe(30);
    const other = await signedInAs(ctx, 'member');
    expect((await other.agent.get(`/api/people/${member.person.id}/qualification`)).status).toBe(403);
    expect((await put(member, `/api/people/${member.person.id}/qualification`, { authorisedKv: 100, expiresOn: '2030-01-01' })).status).toBe(403);
    const audit = await officer.agent.get(`/api/audit?entity=qualification&id=${member.person.id}`).expect(200);
    expect(audit.body.events[0].after).toMatchObject({ authorisedKv: 30, expiresOn: '2027-06-30' });
  });

  it('answers 404 for an unknown person and 400 for a bad date', async () => {
    expect((await put(officer, '/api/people/99999999/qualification', { authorisedKv: 1, expiresOn: '2027-01-01' })).status).toBe(404);
    expect((await put(officer, `/api/people/${member.person.id}/qualification`, { authorisedKv: 1, expiresOn: '31/12/2027' })).status).toBe(400);
  });
});

describe('checklist templates', () => {
  it('officers add, change and retire lines; members cannot', async () => {
    const body = { phase: 'pre', kind: 'reading', text: 'Ozone level at the bench', unit: 'ppm', min: 0, max: 0.1, required: true, appliesWithKind: 'other' };
    const created = await officer.agent.post('/api/checklist-templates').set('x-csrf-token', officer.csrf()).send(body);
    expect(created.status).toBe(201);
    const id = created.body.template.id;
    const changed = await put(officer, `/api/checklist-templates/${id}`, { ...body, max: 0.05 });
    expect(changed.body.template.max).toBe(0.05);
    expect((await member.agent.post('/api/checklist-templates').set('x-csrf-token', member.csrf()).send(body)).status).toBe(403);
    expect(
      (
        await officer.agent
          .post('/api/checklist-templates')
          .set('x-csrf-token', officer.csrf())
          .send({ ...body, unit: null })
      ).status,
    ).toBe(400);
    await officer.agent.delete(`/api/checklist-templates/${id}`).set('x-csrf-token', officer.csrf()).expect(204);
    const list = await member.agent.get('/api/checklist-templates').expect(200);
    expect(list.body.templates.some((t: { id: number }) => t.id === id)).toBe(false);
  });
});

describe('GET /api/audit', () => {
  it('is for officers and managers, newest first, and its hash chain verifies', async () => {
    expect((await member.agent.get('/api/audit')).status).toBe(403);
    expect((await request(ctx.app).get('/api/audit')).status).toBe(401);
    const res = await officer.agent.get('/api/audit?limit=5').expect(200);
    const ids = res.body.events.map((e: { id: number }) => e.id);
    expect(ids).toEqual([...ids].sort((a: number, b: number) => b - a));
    const verify = await officer.agent.get('/api/audit/verify').expect(200);
    expect(verify.body).toMatchObject({ ok: true, brokenAtId: null });
    expect(verify.body.checked).toBeGreaterThan(0);
  });
});
