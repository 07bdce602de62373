// GET …/runs fits (Townsend's I = C·V·(V − V₀) per gap and polarity), the CSV export with units
// in its headers, and the all-or-nothing CSV import.
import Papa from 'papaparse';
import { linearRegression } from 'simple-statistics';
import { post } from '../../helpers/booking-flow';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';
import { coronaSweep } from '../../unit/hv/corona-sweep';
import { expectWithin } from '../../unit/hv/expect-within';
import { releasedBooking, RUN } from './released-booking';

let ctx: TestContext;
let member: Awaited<ReturnType<typeof signedInAs>>;

beforeAll(async () => {
  ctx = createTestContext();
  member = await signedInAs(ctx, 'member');
});
afterAll(async () => ctx.close());

// 0.004 mA/kV² with V₀ = 5 kV at 20 mm; 0.002 mA/kV², V₀ = 6.5 kV at 30 mm (2 % noise), up to the plan's 10 kV.
const SWEEPS = [
  { gapMm: 20, cAPerV2: 4e-12, onsetV: 5000 },
  { gapMm: 30, cAPerV2: 2e-12, onsetV: 6500 },
];

describe('GET /api/bookings/:id/runs fits', () => {
  it('fits each gap with four or more runs above onset, recovering C and V₀, and agrees with simple-statistics', async () => {
    const { booking } = await releasedBooking(ctx, member, { maxCurrentMa: 1 });
    const sent: Record<number, { voltageV: number; currentA: number }[]> = {};
    for (const [i, s] of SWEEPS.entries()) {
      const points = coronaSweep({
        ...s,
        voltagesV: [4000, 6000, 7000, 7500, 8000, 8500, 9000, 9500, 10000].filter((v) => v > s.onsetV - 2500),
        noise: 0.02,
        seed: 11 + i,
      });
      sent[s.gapMm] = points;
      for (const p of points) {
        const res = await post(member, `/api/bookings/${booking.id}/runs`, {
          appliedKv: p.voltageV / 1e3,
          currentMa: p.currentA * 1e3,
          gapMm: s.gapMm,
          wireRadiusMm: 0.1,
          collectorRadiusMm: 25.4,
        });
        expect(res.status).toBe(201);
      }
    }
    // Three runs at a third gap: too few for a fit.
    for (const kv of [7, 8, 9]) await post(member, `/api/bookings/${booking.id}/runs`, { appliedKv: kv, currentMa: 0.05 * kv, gapMm: 40 });
    const res = await member.agent.get(`/api/bookings/${booking.id}/runs`);
    expect(res.status).toBe(200);
    const { fits, fit } = res.body;
    expect(fits.map((f: { gapMm: number }) => f.gapMm)).toEqual([20, 30]);
    expect(fit).toBeNull(); // the latest run's gap (40 mm) has only three runs
    for (const s of SWEEPS) {
      const f = fits.find((x: { gapMm: number }) => x.gapMm === s.gapMm);
      expect(f).toMatchObject({
        polarity: 'positive',
        n: expect.any(Number),
        onsetKv: expect.any(Number),
        onsetKvStdErr: expect.any(Number),
        c: expect.any(Number),
        r2: expect.any(Number),
      });
      expectWithin(f.c, s.cAPerV2 * 1e9, 0.1);
      expectWithin(f.onsetKv, s.onsetV / 1e3, 0.05);
      const pts = sent[s.gapMm]!.filter((p) => p.currentA > 0);
      const { m, b } = linearRegression(pts.map((p) => [p.voltageV / 1e3, (p.currentA * 1e3) / (p.voltageV / 1e3)]));
      expectWithin(f.c, m, 1e-6); // mA/kV² straight from a regression in the bench units
      expectWithin(f.onsetKv, -b / m, 1e-6);
      // Peek's coaxial onset for r = 0.1 mm in a 25.4 mm tube at δ = 1: 6.66 kV (domain brief §9 #21).
      expectWithin(f.peekOnsetKv, 6.66, 0.005);
      console.log(
        `API fit at ${s.gapMm} mm: n = ${f.n}, C = ${f.c.toPrecision(4)} ± ${f.cStdErr.toPrecision(2)} mA/kV² (true ${s.cAPerV2 * 1e9}), V₀ = ${f.onsetKv.toFixed(3)} ± ${f.onsetKvStdErr.toFixed(3)} kV (true ${s.onsetV / 1e3}), R² = ${f.r2.toFixed(4)}`,
      );
    }
  });
});

describe('GET /api/bookings/:id/runs.csv', () => {
  it('exports one row per run with units in the headers, re-readable by papaparse', async () => {
    const { booking } = await releasedBooking(ctx, member);
    await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, notes: '=cmd|calc, with a comma' });
    await post(member, `/api/bookings/${booking.id}/runs`, { ...RUN, thrustMn: 60, velocityMps: undefined });
    const res = await member.agent.get(`/api/bookings/${booking.id}/runs.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="?booking-\d+-runs\.csv"?/);
    const parsed = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.meta.fields).toEqual(
      expect.arrayContaining([
        'applied voltage (kV)',
        'current (mA)',
        'gap (mm)',
        'thrust (mN)',
        'power (W)',
        '1-D thrust bound (mN)',
        'air density (kg/m³)',
        'flags',
      ]),
    );
    expect(parsed.data).toHaveLength(2);
    expect(parsed.data[0]!['power (W)']).toBe('2.5');
    // A text cell that a spreadsheet would run as a formula is quoted.
    expect(parsed.data[0]!.notes).toBe("'=cmd|calc, with a comma");
    expect(parsed.data[1]!.flags).toBe('thrust-above-ehd-bound');
  });
});

describe('POST /api/bookings/:id/runs/import', () => {
  const LOGGER = [
    'Time,HV (kV),I (uA),Gap,Thrust (g),T (C),P (kPa),RH',
    '10:01,7.0,40,30,0.3,21.5,100.9,45',
    '10:02,8.0,95,30,0.7,21.5,100.9,45',
    '10:03,9.0,160,30,1.2,21.6,100.9,44',
  ].join('\n');
  const MAPPING = {
    appliedKv: 'HV (kV)',
    currentUa: 'I (uA)',
    gapMm: 'Gap',
    thrustGf: 'Thrust (g)',
    temperatureC: 'T (C)',
    pressureKpa: 'P (kPa)',
    humidityPct: 'RH',
  };

  it('imports every row of a mapped logger file in order, converting µA and grams-force', async () => {
    const { booking } = await releasedBooking(ctx, member);
    const res = await post(member, `/api/bookings/${booking.id}/runs/import`, { csv: LOGGER, mapping: MAPPING });
    expect(res.status).toBe(201);
    expect(res.body.imported).toBe(3);
    expect(res.body.runs.map((r: { number: number; currentMa: number; currentUnit: string }) => [r.number, r.currentMa, r.currentUnit])).toEqual([
      [1, 0.04, 'µA'],
      [2, 0.095, 'µA'],
      [3, 0.16, 'µA'],
    ]);
    expectWithin(res.body.runs[2].thrustMn, 1.2 * 9.80665);
    const audit = await ctx
      .db('audit_events')
      .where({ entity: 'booking', entity_id: String(booking.id), action: 'bench-run.imported' })
      .first();
    expect(audit).toBeDefined();
  });

  it('re-imports its own export (headers recognised by name)', async () => {
    const { booking } = await releasedBooking(ctx, member);
    await post(member, `/api/bookings/${booking.id}/runs`, RUN);
    const csv = (await member.agent.get(`/api/bookings/${booking.id}/runs.csv`)).text;
    const { guessMapping, parseCsv } = await import('../../../shared/schemas/bench-runs-csv');
    const mapping = guessMapping(parseCsv(csv).headers);
    expect(mapping).toMatchObject({ appliedKv: 'applied voltage (kV)', currentMa: 'current (mA)', gapMm: 'gap (mm)', thrustMn: 'thrust (mN)' });
    const res = await post(member, `/api/bookings/${booking.id}/runs/import`, { csv, mapping });
    expect(res.status).toBe(201);
    expect(res.body.runs[0]).toMatchObject({ number: 2, appliedKv: 10, currentMa: 0.25, gapMm: 30, thrustMn: 15 });
  });

  it('refuses the whole file when one row is bad, naming each bad line, and imports nothing', async () => {
    const { booking } = await releasedBooking(ctx, member);
    const bad = `${LOGGER}\n10:04,ten,200,30,1.5,21.6,100.9,44\n10:05,10.0,220,0,1.6,21.6,100.9,44`;
    const res = await post(member, `/api/bookings/${booking.id}/runs/import`, { csv: bad, mapping: MAPPING });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/2 rows cannot be read; nothing was imported/);
    expect(res.body.error.failures).toEqual([
      { rule: 'line-5', message: expect.stringContaining('"ten" is not a number') },
      { rule: 'line-5', message: expect.stringContaining('applied voltage (kV)') },
      { rule: 'line-6', message: expect.stringContaining('gap (mm)') },
    ]);
    expect(await ctx.db('bench_runs').where({ booking_id: booking.id }).count<{ n: number }[]>('id as n')).toEqual([{ n: 0 }]);
  });

  it('refuses a mapping onto a column the file lacks, or without the voltage, current and gap', async () => {
    const { booking } = await releasedBooking(ctx, member);
    const missing = await post(member, `/api/bookings/${booking.id}/runs/import`, { csv: LOGGER, mapping: { ...MAPPING, gapMm: 'Gap (mm)' } });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fieldErrors.mapping[0]).toMatch(/no column "Gap \(mm\)"/);
    const thin = await post(member, `/api/bookings/${booking.id}/runs/import`, { csv: LOGGER, mapping: { appliedKv: 'HV (kV)' } });
    expect(thin.status).toBe(400);
    expect(await ctx.db('bench_runs').where({ booking_id: booking.id }).count<{ n: number }[]>('id as n')).toEqual([{ n: 0 }]);
  });
});
