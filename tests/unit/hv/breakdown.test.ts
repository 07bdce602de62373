import {
  airDensityFactor,
  coaxialOnsetV,
  coronaOnset,
  parallelWireOnsetV,
  paschenBreakdown,
  paschenMinimum,
  peekOnsetGradientKvPerCm,
  schumannBreakdownV,
  sparkoverCheck,
  uniformBreakdownV,
} from '../../../shared/hv';
import { catchHvInputError, expectWithin } from './expect-within';

describe("Peek's law (Peek 1929; Kuffel & Zaengl p. 366)", () => {
  it('δ at 76 cmHg, 25 °C = 0.9997 (Peek density factor, confirmed; domain check 19)', () => {
    expectWithin(airDensityFactor({ pressureCmHg: 76, temperatureC: 25 }), 0.9997);
  });

  it('δ at 63 cmHg, 20 °C = 0.8429 (Peek density factor, confirmed; domain check 19)', () => {
    expectWithin(airDensityFactor({ pressureCmHg: 63, temperatureC: 20 }), 0.8429);
  });

  it('accepts sub-zero temperatures: −20 °C at 76 cmHg gives δ = 1.178 (derived)', () => {
    expectWithin(airDensityFactor({ pressureCmHg: 76, temperatureC: -20 }), 1.1775);
  });

  it('g_v for r = 0.01 cm, δ = 1 is 120.3 kV/cm peak (g₀ = 30, c = 0.301, confirmed; domain check 20)', () => {
    expectWithin(peekOnsetGradientKvPerCm({ wireRadiusM: 1e-4, airDensityFactor: 1 }), 120.3);
  });

  it('coaxial onset for r = 0.01 cm in R = 2.54 cm is 6.66 kV (V = g_v·r·ln(R/r), derived; domain check 21)', () => {
    const g = peekOnsetGradientKvPerCm({ wireRadiusM: 1e-4, airDensityFactor: 1 });
    expectWithin(coaxialOnsetV({ wireRadiusM: 1e-4, outerRadiusM: 0.0254, onsetGradientKvPerCm: g }), 6.66e3);
  });

  it('at 63 cmHg and 20 °C: g_v = 108.2 kV/cm and V_c ≈ 5.99 kV (derived, domain §5.2 altitude example)', () => {
    const result = coronaOnset({ wireRadiusM: 1e-4, pressureCmHg: 63, temperatureC: 20, surfaceFactor: 1, outerRadiusM: 0.0254 });
    expectWithin(result.onsetGradientKvPerCm, 108.2);
    expectWithin(result.onsetV, 5.99e3);
  });

  it('coronaOnset at sea level reproduces 120.3 kV/cm and 6.66 kV (Peek, domain checks 20-21)', () => {
    const result = coronaOnset({ wireRadiusM: 1e-4, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 1, outerRadiusM: 0.0254 });
    expectWithin(result.airDensityFactor, 0.9997);
    expectWithin(result.onsetGradientKvPerCm, 120.3);
    expectWithin(result.onsetV, 6.66e3);
  });

  it('omits onsetV without a collector radius', () => {
    const result = coronaOnset({ wireRadiusM: 1e-4, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 1 });
    expect(result.onsetV).toBeUndefined();
  });

  it('a stranded-cable surface factor of 0.85 lowers the onset voltage in proportion (Peek surface factor m_v, confirmed)', () => {
    const smooth = coronaOnset({ wireRadiusM: 1e-4, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 1, outerRadiusM: 0.0254 });
    const stranded = coronaOnset({ wireRadiusM: 1e-4, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 0.85, outerRadiusM: 0.0254 });
    expectWithin(stranded.onsetV, 0.85 * smooth.onsetV!, 1e-12);
  });

  it('two parallel wires 10 cm apart: e_v = 8.31 kV (Peek, derived)', () => {
    expectWithin(parallelWireOnsetV({ wireRadiusM: 1e-4, spacingM: 0.1, onsetGradientKvPerCm: 120.3 }), 8.31e3);
  });

  it('rejects a collector no larger than the wire, and a surface factor above 1', () => {
    expect(catchHvInputError(() => coronaOnset({ wireRadiusM: 1e-3, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 1, outerRadiusM: 1e-3 })).field).toBe(
      'outerRadiusM',
    );
    expect(catchHvInputError(() => coronaOnset({ wireRadiusM: 1e-3, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 1.1 })).field).toBe('surfaceFactor');
    expect(catchHvInputError(() => coronaOnset({ wireRadiusM: 1e-3, pressureCmHg: 76, temperatureC: -300, surfaceFactor: 1 })).field).toBe('temperatureC');
  });
});

describe('uniform-field breakdown', () => {
  it('1 cm at δ = 1 breaks down at ≈ 30 kV (3 kV/mm rule, confirmed; domain check 22)', () => {
    expectWithin(uniformBreakdownV({ gapM: 0.01 }), 30e3);
  });

  it("Schumann's curve gives 30.3 kV at 1 cm and 71.2 kV at 2.54 cm (Schumann via Kuffel & Zaengl, from memory)", () => {
    expectWithin(schumannBreakdownV({ gapM: 0.01 }), 30.3e3);
    expectWithin(schumannBreakdownV({ gapM: 0.0254 }), 71.2e3);
  });

  it('100 kV needs about 33 mm of uniform-field air (3 kV/mm rule, domain §1.3)', () => {
    expectWithin(uniformBreakdownV({ gapM: 0.0333 }), 100e3);
  });

  it('scales with the air density factor', () => {
    expectWithin(uniformBreakdownV({ gapM: 0.01, airDensityFactor: 0.8429 }), 25.29e3);
  });
});

describe('sparkoverCheck (2 kV/mm warning, common practice, no source)', () => {
  it('20 kV across 1 cm (2 kV/mm) is near sparkover', () => {
    const result = sparkoverCheck({ voltageV: 20e3, gapM: 0.01 });
    expectWithin(result.meanFieldVPerM, 2e6);
    expect(result.nearSparkover).toBe(true);
    expect(result.aboveUniformBreakdown).toBe(false);
  });

  it('10 kV across 1 cm is not flagged', () => {
    expect(sparkoverCheck({ voltageV: 10e3, gapM: 0.01 }).nearSparkover).toBe(false);
  });

  it('35 kV across 1 cm is above the uniform-field breakdown', () => {
    const result = sparkoverCheck({ voltageV: 35e3, gapM: 0.01 });
    expect(result.aboveUniformBreakdown).toBe(true);
    expect(result.note).toMatch(/break down/);
  });

  it('uses the lab warning level when given', () => {
    expect(sparkoverCheck({ voltageV: 10e3, gapM: 0.01, warnFieldVPerM: 0.5e6 }).nearSparkover).toBe(true);
  });
});

describe("Paschen's law (educational only)", () => {
  it('pd = 760 Torr·cm (1 atm, 1 cm) gives ≈ 35.5 kV, an over-estimate: do not use for safety (A = 15, B = 365, γ = 0.01 confirmed; result derived; domain check 23)', () => {
    const result = paschenBreakdown({ pressurePa: 101_325, gapM: 0.01 });
    expectWithin(result.pdTorrCm, 760);
    expectWithin(result.breakdownV, 35.5e3);
    expect(result.doNotUseForSafety).toBe(true);
    expect(result.note).toMatch(/do not use for safety/);
  });

  it('has its minimum near 305 V at 0.84 Torr·cm (derived, domain §5.1)', () => {
    const min = paschenMinimum();
    expectWithin(min.breakdownV, 305);
    expectWithin(min.pdTorrCm, 0.836);
  });

  it('returns null, not NaN, left of the asymptote', () => {
    const result = paschenBreakdown({ pressurePa: 101_325 / 760, gapM: 0.001 }); // 0.1 Torr·cm
    expect(result.breakdownV).toBeNull();
  });
});
