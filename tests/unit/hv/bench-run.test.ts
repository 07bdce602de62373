import { benchRunFlags, deriveBenchRun, type BenchRunContext, type BenchRunReadings } from '../../../shared/hv';
import { expectWithin } from './expect-within';

const PLAN: BenchRunContext = { plannedKv: 12, maxCurrentMa: 0.5, supplies: [{ tag: 'KH-SUP-1', maxKv: 30, maxMa: 2 }] };
const RUN: BenchRunReadings = {
  appliedKv: 10,
  currentMa: 0.25,
  gapMm: 30,
  thrustMn: 15,
  massG: 40,
  outletAreaCm2: 100,
  velocityMps: 1.2,
  temperatureC: 20,
  pressureKpa: 101.325,
  humidityPct: 0,
};

const codes = (run: BenchRunReadings, ctx = PLAN) => benchRunFlags(run, deriveBenchRun(run), ctx).map((f) => f.code);

describe('deriveBenchRun', () => {
  it('works out power, ratios, density, the 1-D bound and the momentum velocity in the bench units', () => {
    const d = deriveBenchRun(RUN);
    expectWithin(d.powerW, 2.5); // 10 kV × 0.25 mA
    expectWithin(d.thrustPerPowerMnPerW!, 6); // 15 mN / 2.5 W
    expectWithin(d.thrustToWeightPct!, (15e-3 / (0.04 * 9.80665)) * 100); // T/(m·g₀)
    expectWithin(d.airDensityKgM3!, 1.204, 0.001); // dry 20 °C, 101.325 kPa (handbook)
    expectWithin(d.ehdThrustBoundMn, 37.5); // 0.25 mA × 30 mm / 2e-4
    expectWithin(d.momentumVelocityMps!, Math.sqrt(15e-3 / (1.204 * 0.01)), 0.002);
    expectWithin(d.wattsPerGramForce!, 2.5 / (15 / 9.80665));
  });

  it('gives null where an input is missing', () => {
    const d = deriveBenchRun({ appliedKv: 10, currentMa: 0.25, gapMm: 30 });
    expect(d).toEqual({
      powerW: 2.5,
      thrustPerPowerMnPerW: null,
      thrustToWeightPct: null,
      wattsPerGramForce: null,
      airDensityKgM3: null,
      ehdThrustBoundMn: expect.any(Number),
      momentumVelocityMps: null,
    });
  });
});

describe('benchRunFlags', () => {
  it('a plausible run in the plan has no flag', () => {
    expect(codes(RUN)).toEqual([]);
  });

  it('flags voltage and current beyond the plan, and beyond the supply', () => {
    expect(codes({ ...RUN, appliedKv: 13 })).toEqual(['above-plan-kv']);
    expect(codes({ ...RUN, currentMa: 0.6, thrustMn: 20 })).toEqual(['above-plan-current']);
    expect(codes({ ...RUN, appliedKv: 31, gapMm: 40, currentMa: 0.4, thrustMn: 20 })).toEqual(['above-plan-kv', 'above-supply-rating']);
  });

  it('flags a thrust more than 40 % above I·d/μ, not one just under it', () => {
    expect(codes({ ...RUN, thrustMn: 37.5 * 1.39, velocityMps: undefined })).toEqual([]);
    const flags = benchRunFlags({ ...RUN, thrustMn: 60, velocityMps: undefined }, deriveBenchRun({ ...RUN, thrustMn: 60 }), PLAN);
    expect(flags.map((f) => f.code)).toEqual(['thrust-above-ehd-bound']);
    expect(flags[0]!.message).toMatch(/60 mN is above the one-dimensional bound I·d\/μ = 37.5 mN/);
  });

  it('flags velocity and thrust more than a factor 2 apart by momentum flux', () => {
    expect(codes({ ...RUN, velocityMps: 2.4 })).toEqual(['momentum-mismatch']);
    expect(codes({ ...RUN, velocityMps: 0.5 })).toEqual(['momentum-mismatch']);
  });

  it("flags a mean field at or above sparkoverCheck's 2 kV/mm", () => {
    expect(codes({ ...RUN, appliedKv: 12, gapMm: 6, currentMa: 0.05, thrustMn: 1, velocityMps: undefined })).toEqual(['near-sparkover']);
  });
});
