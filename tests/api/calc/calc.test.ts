// The API answers with the shared functions' values; the check values themselves are proven
// against their sources in tests/unit/hv. Here: field names, units, sources, and 400s.
import request from 'supertest';
import { createTestContext, signedInAs, type TestContext } from '../../helpers/test-app';

let ctx: TestContext;
let member: Awaited<ReturnType<typeof signedInAs>>;
beforeAll(async () => {
  ctx = createTestContext();
  member = await signedInAs(ctx, 'member');
});
afterAll(() => ctx.close());

const calc = (path: string, body: unknown) =>
  member.agent
    .post(`/api/calc/${path}`)
    .set('x-csrf-token', member.csrf())
    .send(body as object);

describe('POST /api/calc/*', () => {
  it('energy: 1 µF at 10 kV holds 50 J and 10 mC (E = ½CV², Q = CV, textbook)', async () => {
    const res = await calc('energy', { capacitanceF: 1e-6, voltageV: 10e3 });
    expect(res.status).toBe(200);
    expect(res.body.energyJ).toBeCloseTo(50, 6);
    expect(res.body.chargeC).toBeCloseTo(0.01, 9);
    expect(res.body.source).toEqual(expect.any(String));
  });

  it('discharge: 100 MΩ, 1 µF, 10 kV to 50 V takes 529.8 s and 5τ is not enough (t = RC ln(V0/Vs))', async () => {
    const res = await calc('discharge', { resistanceOhm: 100e6, capacitanceF: 1e-6, initialV: 10e3, safeV: 50 });
    expect(res.status).toBe(200);
    expect(res.body.timeS).toBeCloseTo(529.83, 1);
    expect(res.body.timeConstants).toBeCloseTo(5.298, 3);
    expect(res.body.residualAfter5TauV).toBeCloseTo(67.38, 1);
    expect(res.body.fiveTauIsEnough).toBe(false);
  });

  it('discharge: a safe voltage at or above the start is a 400 naming safeV', async () => {
    const res = await calc('discharge', { resistanceOhm: 100e6, capacitanceF: 1e-6, initialV: 50, safeV: 50 });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.safeV).toBeDefined();
  });

  it('hazard: 10 kV with 5 nF is hazardous by the 45 µC line (IEC 61010-1 6.3.1 c))', async () => {
    const res = await calc('hazard', { voltageV: 10e3, currentA: 0.1e-3, capacitanceF: 5e-9 });
    expect(res.body).toMatchObject({ hazardous: true, criterion: 'charge-above-45uC' });
  });

  it('boundaries: 500 V DC gives 3.0 / 1.0 / 0.3 m with the edition and marker (NFPA 70E T130.4(E)(b))', async () => {
    const res = await calc('boundaries', { voltageV: 500, system: 'dc' });
    expect(res.body).toMatchObject({ limitedMovableM: 3, limitedFixedM: 1, restrictedM: 0.3, limitedFixedImperial: '3 ft 6 in' });
    expect(res.body.edition).toEqual(expect.any(String));
    expect(res.body.marker).toEqual(expect.any(String));
  });

  it('multiplier: n=5, 10 kV, 50 kHz, 1 nF, 1 mA gives 100 kV, 1.9 kV drop, 300 V ripple (Kuffel cascade formulas)', async () => {
    const res = await calc('multiplier', { stages: 5, peakInputV: 10e3, frequencyHz: 50e3, stageCapacitanceF: 1e-9, loadCurrentA: 1e-3 });
    expect(res.body.noLoadV).toBeCloseTo(100e3, 3);
    expect(res.body.dropV).toBeCloseTo(1900, 3);
    expect(res.body.rippleV).toBeCloseTo(300, 3);
    expect(res.body.loadedV).toBeCloseTo(98.1e3, 0);
    expect(res.body.optimumStages).toBeCloseTo(22.36, 2);
    for (const key of ['outputCapacitanceF', 'outputEnergyJ', 'stackEnergyJ']) expect(Number.isFinite(res.body[key])).toBe(true);
  });

  it('corona: δ at 76 cmHg, 25 °C is 0.9997 (Peek)', async () => {
    const res = await calc('corona', { wireRadiusM: 1e-4, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 1, outerRadiusM: 0.0254 });
    expect(res.status).toBe(200);
    expect(res.body.airDensityFactor).toBeCloseTo(0.9997, 4);
    expect(res.body.onsetGradientKvPerCm).toBeCloseTo(120.3, 0);
    expect(res.body.onsetV).toBeCloseTo(6660, -2);
  });

  it.each([
    ['energy', { capacitanceF: -1, voltageV: 10 }],
    ['energy', { capacitanceF: 'big', voltageV: 10 }],
    ['energy', { capacitanceF: 1e-9 }],
    // An overflowed number: JSON.stringify sends it as null, which the schema refuses.
    ['hazard', { voltageV: Number.POSITIVE_INFINITY, currentA: 0, capacitanceF: 0 }],
    ['boundaries', { voltageV: 1000, system: 'rf' }],
    ['multiplier', { stages: 0, peakInputV: 1, frequencyHz: 1, stageCapacitanceF: 1, loadCurrentA: 0 }],
    ['corona', { wireRadiusM: 0.01, pressureCmHg: 76, temperatureC: 20, surfaceFactor: 1, outerRadiusM: 0.001 }],
    ['energy', { capacitanceF: 1e-9, voltageV: 10, extra: true }],
  ])('%s refuses %j with 400 and field errors, never NaN', async (path, body) => {
    const res = await calc(path, body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    expect(res.body.error.fieldErrors).toBeDefined();
    expect(JSON.stringify(res.body)).not.toMatch(/NaN|Infinity/);
  });

  it('is for signed-in people', async () => {
    expect((await request(ctx.app).post('/api/calc/energy').send({ capacitanceF: 1e-9, voltageV: 1 })).status).toBe(403);
  });
});
