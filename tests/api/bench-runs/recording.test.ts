// POST /api/bookings/:id/runs and GET …/runs: recording, derived figures, flags, the officers'
// e-mail for a run beyond the plan, corrections with history and deletion by staff.
import { post, put } from '../../helpers/booking-flow';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';
import { expectWithin } from '../../unit/hv/expect-within';
import { releasedBooking, RUN } from './released-booking';

let ctx: TestContext;
let member: Awaited<ReturnType<typeof signedInAs>>;
let officer: Awaited<ReturnType<typeof signedInAs>>;

beforeAll(async () => {
  ctx = createTestContext();
  member = await signedInAs(ctx, 'member');
  officer = await signedInAs(ctx, 'officer');
});
afterAll(async () => ctx.close());

const auditActions = async (bookingId: number) =>
  (await ctx
    .db('audit_events')
    .where({ entity: 'booking', entity_id: String(bookingId) })
    .orderBy('id')
    .pluck('action')) as string[];

describe('POST /api/bookings/:id/runs', () => {
  describe('on a released booking, by its booker', () => {
    it('records the run with its derived figures (201 { run }) and audits it', async () => {
      const { booking } = await releasedBooking(ctx, member);
      const res = await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, stages: 1, notes: 'first point' });
      expect(res.status).toBe(201);
      const run = res.body.run;
      expect(run).toMatchObject({
        bookingId: booking.id,
        number: 1,
        revision: 1,
        appliedKv: 10,
        currentMa: 0.25,
        currentUnit: 'mA',
        gapMm: 30,
        polarity: 'positive',
        stages: 1,
        notes: 'first point',
        flags: [],
      });
      expect(Object.keys(run.derived).sort()).toEqual([
        'airDensityKgM3',
        'ehdThrustBoundMn',
        'momentumVelocityMps',
        'powerW',
        'thrustPerPowerMnPerW',
        'thrustToWeightPct',
        'wattsPerGramForce',
      ]);
      expectWithin(run.derived.powerW, 2.5); // P = V·I
      expectWithin(run.derived.ehdThrustBoundMn, 37.5); // I·d/μ, μ = 2e-4
      expectWithin(run.derived.airDensityKgM3, 1.204, 0.001); // dry air, 20 °C, 101.325 kPa (handbook)
      expectWithin(run.derived.thrustPerPowerMnPerW, 6);
      expect(await auditActions(booking.id)).toContain('bench-run.recorded');
    });

    it('accepts µA and grams-force, stores mA and mN, and remembers the unit typed', async () => {
      const { booking } = await releasedBooking(ctx, member);
      const res = await post(member, `/api/bookings/${booking.id}/runs`, { appliedKv: 9, currentUa: 180, gapMm: 30, thrustGf: 1.2 });
      expect(res.status).toBe(201);
      expect(res.body.run).toMatchObject({ currentMa: 0.18, currentUnit: 'µA', thrustUnit: 'gf' });
      expectWithin(res.body.run.thrustMn, 1.2 * 9.80665); // 1 gf = 9.80665 mN (standard gravity)
    });

    it('fills temperature, pressure and humidity from the previous run, and null derived figures where inputs are missing', async () => {
      const { booking } = await releasedBooking(ctx, member);
      await post(member, `/api/bookings/${booking.id}/runs`, { appliedKv: 8, currentMa: 0.1, gapMm: 30 });
      const first = (await ctx.db('bench_runs').where({ booking_id: booking.id }).first()) as { temperature_c: number | null };
      expect(first.temperature_c).toBeNull();
      await post(member, `/api/bookings/${booking.id}/runs`, {
        appliedKv: 9,
        currentMa: 0.15,
        gapMm: 30,
        temperatureC: 22,
        pressureKpa: 99.8,
        humidityPct: 40,
      });
      const third = await post(member, `/api/bookings/${booking.id}/runs`, { appliedKv: 10, currentMa: 0.2, gapMm: 30 });
      expect(third.body.run).toMatchObject({ number: 3, temperatureC: 22, pressureKpa: 99.8, humidityPct: 40 });
      expect(third.body.run.derived).toMatchObject({ thrustPerPowerMnPerW: null, thrustToWeightPct: null, wattsPerGramForce: null, momentumVelocityMps: null });
      expect(third.body.run.derived.airDensityKgM3).toBeGreaterThan(1.1);
    });

    it('takes the polarity from the plan, or from the run; a reversible plan needs it said', async () => {
      const { booking } = await releasedBooking(ctx, member, { polarity: 'reversible' });
      const without = await post(member, `/api/bookings/${booking.id}/runs`, RUN);
      expect(without.status).toBe(400);
      expect(without.body.error.fieldErrors.polarity).toBeDefined();
      const withIt = await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, polarity: 'negative' });
      expect(withIt.status).toBe(201);
      expect(withIt.body.run.polarity).toBe('negative');
    });
  });

  describe('when a reading is impossible or beyond the plan', () => {
    it('flags a thrust above the 1-D bound, a momentum mismatch and a near-sparkover gap, each with a message', async () => {
      const { booking } = await releasedBooking(ctx, member);
      const bound = await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, thrustMn: 60, velocityMps: undefined });
      expect(bound.body.run.flags).toEqual([{ code: 'thrust-above-ehd-bound', message: expect.stringContaining('37.5 mN') }]);
      const momentum = await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, velocityMps: 4 });
      expect(momentum.body.run.flags.map((f: { code: string }) => f.code)).toEqual(['momentum-mismatch']);
      const spark = await post(member, `/api/bookings/${booking.id}/runs`, { appliedKv: 9, currentMa: 0.1, gapMm: 4 });
      expect(spark.body.run.flags.map((f: { code: string }) => f.code)).toEqual(['near-sparkover']);
    });

    it('records a run above the planned kV and current, flags and audits it, and e-mails the officers once', async () => {
      const { booking } = await releasedBooking(ctx, member);
      const officers = await ctx.db('people').where({ role: 'officer', active: true }).count<{ n: number }[]>('id as n');
      const over = await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, appliedKv: 13, currentMa: 0.6, thrustMn: 20, velocityMps: undefined });
      expect(over.status).toBe(201);
      expect(over.body.run.flags.map((f: { code: string }) => f.code)).toEqual(['above-plan-kv', 'above-plan-current']);
      const again = await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, appliedKv: 14, currentMa: 0.3, thrustMn: 20, velocityMps: undefined });
      expect(again.body.run.flags.map((f: { code: string }) => f.code)).toEqual(['above-plan-kv']);
      const mails = await ctx.db('outbox').where('dedupe_key', 'like', `bench-run-beyond-plan:${booking.id}:%`).select('to_address', 'subject', 'text_body');
      expect(mails).toHaveLength(Number(officers[0]!.n));
      expect(mails.map((m) => m.to_address)).toContain(officer.person.email);
      expect(mails[0]!.text_body).toMatch(/13 kV/);
      expect((await auditActions(booking.id)).filter((a) => a === 'bench-run.beyond-plan')).toHaveLength(2);
      const list = await member.agent.get(`/api/bookings/${booking.id}/runs`);
      expect(list.body.runs.map((r: { number: number }) => r.number)).toEqual([1, 2]);
    });

    it('flags a current beyond the supply rating (30 kV / 2 mA kit supply)', async () => {
      const { booking } = await releasedBooking(ctx, member, { maxCurrentMa: 5 });
      const res = await post(member, `/api/bookings/${booking.id}/runs`, { appliedKv: 9, currentMa: 2.5, gapMm: 40 });
      expect(res.body.run.flags).toEqual([{ code: 'above-supply-rating', message: expect.stringContaining('2.5 mA against its 2 mA') }]);
    });
  });

  describe('when the input is bad', () => {
    it.each([
      ['no current', { appliedKv: 10, gapMm: 30 }],
      ['both mA and µA', { appliedKv: 10, currentMa: 0.2, currentUa: 200, gapMm: 30 }],
      ['a zero gap', { appliedKv: 10, currentMa: 0.2, gapMm: 0 }],
      ['a humidity over 100 %', { ...RUN, humidityPct: 120 }],
      ['an unknown field', { ...RUN, voltageV: 10000 }],
      ['a photo of another booking', { ...RUN, photoFileId: 2_000_000_000 }],
    ])('answers 400 for %s and records nothing', async (_label, body) => {
      const { booking } = await releasedBooking(ctx, member);
      const res = await post(member, `/api/bookings/${booking.id}/runs`, body);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('VALIDATION_FAILED');
      expect(await ctx.db('bench_runs').where({ booking_id: booking.id }).count<{ n: number }[]>('id as n')).toEqual([{ n: 0 }]);
    });
  });
});

describe('PUT /api/bookings/:id/runs/:runId and DELETE', () => {
  it('a correction keeps the run as it was in its revisions, and is audited', async () => {
    const { booking } = await releasedBooking(ctx, member);
    const run = (await post(member, `/api/bookings/${booking.id}/runs`, RUN)).body.run;
    const noReason = await put(member, `/api/bookings/${booking.id}/runs/${run.id}`, { ...RUN, currentMa: 0.26 });
    expect(noReason.status).toBe(400);
    const fixed = await put(member, `/api/bookings/${booking.id}/runs/${run.id}`, { ...RUN, currentMa: 0.26, reason: 'Misread the meter' });
    expect(fixed.status).toBe(200);
    expect(fixed.body.run).toMatchObject({ id: run.id, revision: 2, currentMa: 0.26 });
    const history = await member.agent.get(`/api/bookings/${booking.id}/runs/${run.id}/revisions`);
    expect(history.body.revisions).toEqual([
      expect.objectContaining({ revision: 1, action: 'edited', reason: 'Misread the meter', before: expect.objectContaining({ current_ma: 0.25 }) }),
    ]);
    expect(await auditActions(booking.id)).toContain('bench-run.edited');
  });

  it('only staff delete; the run leaves the list but keeps its history and audit entry', async () => {
    const { booking } = await releasedBooking(ctx, member);
    const run = (await post(member, `/api/bookings/${booking.id}/runs`, RUN)).body.run;
    const byMember = await member.agent.delete(`/api/bookings/${booking.id}/runs/${run.id}`).set('x-csrf-token', member.csrf()).send({ reason: 'duplicate' });
    expect(byMember.status).toBe(403);
    const noReason = await officer.agent.delete(`/api/bookings/${booking.id}/runs/${run.id}`).set('x-csrf-token', officer.csrf()).send({});
    expect(noReason.status).toBe(400);
    const byOfficer = await officer.agent
      .delete(`/api/bookings/${booking.id}/runs/${run.id}`)
      .set('x-csrf-token', officer.csrf())
      .send({ reason: 'Duplicate of run 1' });
    expect(byOfficer.status).toBe(204);
    expect((await member.agent.get(`/api/bookings/${booking.id}/runs`)).body.runs).toEqual([]);
    const history = await officer.agent.get(`/api/bookings/${booking.id}/runs/${run.id}/revisions`);
    expect(history.body.revisions).toEqual([expect.objectContaining({ action: 'deleted', reason: 'Duplicate of run 1' })]);
    expect(await auditActions(booking.id)).toContain('bench-run.deleted');
  });
});
