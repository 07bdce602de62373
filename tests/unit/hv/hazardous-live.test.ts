import { classifyHazardousLive, energyAtChargeLimitJ, maxNonHazardousCapacitanceF } from '../../../shared/hv';
import { expectWithin } from './expect-within';

const weakSource = 0.1e-3; // 0.1 mA available: below the 2 mA DC current level

describe('classifyHazardousLive (IEC 61010-1 6.3.1)', () => {
  it('10 kV DC, 0.1 mA, 5 nF is hazardous: Q = 50 µC > 45 µC (6.3.1 c) Figure 3 line A, confirmed; domain check 6)', () => {
    const result = classifyHazardousLive({ voltageV: 10e3, currentA: weakSource, capacitanceF: 5e-9 });
    expect(result.hazardous).toBe(true);
    expect(result.criterion).toBe('charge-above-45uC');
    expectWithin(result.chargeC, 50e-6);
  });

  it('30 kV, 0.1 mA, 1 nF is hazardous: 0.45 J > 350 mJ (Figure 3 line B, from memory in 61010-1, confirmed in IEC 60335-1 / EN 50191; domain check 7)', () => {
    const result = classifyHazardousLive({ voltageV: 30e3, currentA: weakSource, capacitanceF: 1e-9 });
    expect(result.hazardous).toBe(true);
    expect(result.criterion).toBe('energy-above-350mJ');
    expectWithin(result.energyJ, 0.45);
  });

  it('30 kV, 0.1 mA, 0.5 nF is not hazardous: 0.225 J < 350 mJ (line B; domain check 7)', () => {
    const result = classifyHazardousLive({ voltageV: 30e3, currentA: weakSource, capacitanceF: 0.5e-9 });
    expect(result.hazardous).toBe(false);
    expect(result.criterion).toBe('below-current-and-capacitance-limits');
    expectWithin(result.energyJ, 0.225);
  });

  it('70 V DC is not hazardous whatever the current or capacitance (6.3.1 a) 70 V DC, partly confirmed)', () => {
    const result = classifyHazardousLive({ voltageV: 70, currentA: 10, capacitanceF: 1 });
    expect(result.hazardous).toBe(false);
    expect(result.criterion).toBe('voltage-below-limit');
    expect(result.maxNonHazardousCapacitanceF).toBeNull();
  });

  it('71 V DC from a source able to drive 3 mA is hazardous (6.3.1 b) 2 mA DC, partly confirmed)', () => {
    const result = classifyHazardousLive({ voltageV: 71, currentA: 3e-3, capacitanceF: 0 });
    expect(result.hazardous).toBe(true);
    expect(result.criterion).toBe('current-above-limit');
  });

  it('exactly 2 mA is not above the current level', () => {
    expect(classifyHazardousLive({ voltageV: 1e3, currentA: 2e-3, capacitanceF: 0 }).hazardous).toBe(false);
  });

  it('reports every exceeded limit, current first', () => {
    const result = classifyHazardousLive({ voltageV: 10e3, currentA: 5e-3, capacitanceF: 5e-9 });
    expect(result.criteria).toEqual(['current-above-limit', 'charge-above-45uC']);
    expect(result.explanation).toMatch(/45 µC/);
  });

  it('a 30 kV / 1 nF electrospinning node at 15 kV holds 15 µC, under 45 µC (derived worked example, domain §2.2)', () => {
    const result = classifyHazardousLive({ voltageV: 15e3, currentA: 0, capacitanceF: 1e-9 });
    expect(result.hazardous).toBe(false);
    expectWithin(result.chargeC, 15e-6);
  });

  it('holds the 3 nF line A limit just above 15 kV, where line B alone would allow 3.11 nF (protective edge rule, derived)', () => {
    // 3.05 nF: 45.75 µC at 15 kV (hazardous by line A), only 0.344 J at 15.01 kV (not by line B alone).
    expect(classifyHazardousLive({ voltageV: 15e3, currentA: 0, capacitanceF: 3.05e-9 }).criterion).toBe('charge-above-45uC');
    const above = classifyHazardousLive({ voltageV: 15.01e3, currentA: 0, capacitanceF: 3.05e-9 });
    expect(above.hazardous).toBe(true);
    expect(above.criterion).toBe('capacitance-above-15kV-junction');
  });

  it('explains a non-hazardous result in words', () => {
    expect(classifyHazardousLive({ voltageV: 30e3, currentA: weakSource, capacitanceF: 0.5e-9 }).explanation).toMatch(/^Not hazardous live/);
  });
});

describe('maxNonHazardousCapacitanceF (derived from Figure 3)', () => {
  it('10 kV allows 4.5 nF (45 µC / 10 kV, derived; domain check 8)', () => {
    expectWithin(maxNonHazardousCapacitanceF({ voltageV: 10e3 }), 4.5e-9);
  });

  it('30 kV allows 0.778 nF (2 × 350 mJ / (30 kV)², derived; domain check 8)', () => {
    expectWithin(maxNonHazardousCapacitanceF({ voltageV: 30e3 }), 0.778e-9);
  });

  // Domain §2.1 list of the largest non-hazardous capacitance per voltage (derived).
  it.each([
    [1e3, 45e-9],
    [5e3, 9e-9],
    [15e3, 3e-9],
    [20e3, 1.75e-9],
    [30e3, 0.778e-9],
    [50e3, 0.28e-9],
    [100e3, 70e-12],
  ])('%s V allows %s F (derived, domain §2.1)', (voltageV, expected) => {
    expectWithin(maxNonHazardousCapacitanceF({ voltageV }), expected);
  });

  it('is null at or below 70 V, where no capacitance makes a part hazardous', () => {
    expect(maxNonHazardousCapacitanceF({ voltageV: 70 })).toBeNull();
    expect(maxNonHazardousCapacitanceF({ voltageV: 0 })).toBeNull();
  });
});

describe('energyAtChargeLimitJ', () => {
  it('½ · 45 µC · 15 kV = 0.3375 J, why the curve switches to 350 mJ at 15 kV (derived; domain check 9)', () => {
    expectWithin(energyAtChargeLimitJ({ voltageV: 15e3 }), 0.3375);
  });
});
