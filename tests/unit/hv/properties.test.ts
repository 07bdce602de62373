import fc from 'fast-check';
import {
  approachBoundaries,
  approachTableMaxV,
  classifyHazardousLive,
  maxNonHazardousCapacitanceF,
  NFPA70E_AC_TABLE,
  NFPA70E_DC_TABLE,
  nextDue,
  storedEnergyJ,
  timeToSafeVoltageS,
  type ApproachBoundaries,
  type VoltageSystem,
} from '../../../shared/hv';

// Property-based checks of the invariants a safety tool must never break.

const voltage = fc.double({ min: 0, max: 1e6, noNaN: true });
const capacitance = fc.double({ min: 1e-15, max: 1e-2, noNaN: true });
const resistance = fc.double({ min: 1, max: 1e12, noNaN: true });

describe('energy', () => {
  it('scales with V²: E(C, kV) = k²·E(C, V)', () => {
    fc.assert(
      fc.property(
        capacitance,
        fc.double({ min: 1e-3, max: 1e5, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        (capacitanceF, voltageV, k) => {
          const scaled = storedEnergyJ({ capacitanceF, voltageV: k * voltageV });
          const expected = k * k * storedEnergyJ({ capacitanceF, voltageV });
          expect(Math.abs(scaled - expected)).toBeLessThanOrEqual(expected * 1e-12);
        },
      ),
    );
  });
});

describe('discharge time', () => {
  const safeV = fc.double({ min: 1, max: 100, noNaN: true });

  it('never falls as the start voltage rises', () => {
    fc.assert(
      fc.property(
        resistance,
        capacitance,
        safeV,
        fc.double({ min: 1.0001, max: 1e4, noNaN: true }),
        fc.double({ min: 1, max: 1e3, noNaN: true }),
        (resistanceOhm, capacitanceF, s, ratio, factor) => {
          const low = timeToSafeVoltageS({ resistanceOhm, capacitanceF, safeV: s, initialV: s * ratio });
          const high = timeToSafeVoltageS({ resistanceOhm, capacitanceF, safeV: s, initialV: s * ratio * factor });
          expect(high).toBeGreaterThanOrEqual(low);
        },
      ),
    );
  });

  it('never falls as R·C rises', () => {
    fc.assert(
      fc.property(fc.tuple(resistance, capacitance), fc.tuple(resistance, capacitance), (a, b) => {
        const [small, large] = a[0] * a[1] <= b[0] * b[1] ? [a, b] : [b, a];
        const plan = { initialV: 30e3, safeV: 50 };
        const tSmall = timeToSafeVoltageS({ ...plan, resistanceOhm: small[0], capacitanceF: small[1] });
        const tLarge = timeToSafeVoltageS({ ...plan, resistanceOhm: large[0], capacitanceF: large[1] });
        expect(tLarge).toBeGreaterThanOrEqual(tSmall);
      }),
    );
  });
});

describe('approach boundaries', () => {
  const distances = (b: ApproachBoundaries) => [b.limitedMovableM ?? 0, b.limitedFixedM ?? 0, b.restrictedM ?? 0];

  // Row edges and their neighbours, where a lookup mistake would show, plus random voltages.
  const voltagesFor = (system: VoltageSystem) => {
    const table = system === 'dc' ? NFPA70E_DC_TABLE : NFPA70E_AC_TABLE;
    const top = approachTableMaxV({ system });
    const edges = table.rows.flatMap((r) => [r.lowerV, r.upperV, r.lowerV - 0.5, r.upperV + 0.5]).filter((v) => v >= 0 && v <= top);
    return fc.oneof(fc.constantFrom(...edges), fc.double({ min: 0, max: top, noNaN: true }));
  };

  it.each(['dc', 'ac'] as const)('never shrink as the voltage rises (%s)', (system) => {
    fc.assert(
      fc.property(voltagesFor(system), voltagesFor(system), (a, b) => {
        const [v1, v2] = a <= b ? [a, b] : [b, a];
        const lower = distances(approachBoundaries({ voltageV: v1, system }));
        const higher = distances(approachBoundaries({ voltageV: v2, system }));
        higher.forEach((d, i) => expect(d).toBeGreaterThanOrEqual(lower[i]!));
      }),
      { numRuns: 500 },
    );
  });
});

describe('hazardous-live classification', () => {
  // Voltages concentrated around the 70 V and 15 kV switch points as well as across the range.
  // Between 15 kV and ≈ 15.3 kV, line B alone would allow more capacitance than line A at 15 kV.
  const hazardVoltage = fc.oneof(voltage, fc.double({ min: 14.9e3, max: 15.4e3, noNaN: true }), fc.double({ min: 60, max: 80, noNaN: true }));
  const hazardCapacitance = fc.oneof(capacitance, fc.double({ min: 2.95e-9, max: 3.15e-9, noNaN: true }), fc.constant(0));
  // Mostly below the 2 mA level, where the capacitance criterion decides.
  const current = fc.oneof(fc.constant(0), fc.double({ min: 0, max: 2e-3, noNaN: true }), fc.double({ min: 0, max: 10e-3, noNaN: true }));

  it('never flips back to safe as C rises', () => {
    fc.assert(
      fc.property(hazardVoltage, current, hazardCapacitance, hazardCapacitance, (voltageV, currentA, c1, c2) => {
        const [low, high] = c1 <= c2 ? [c1, c2] : [c2, c1];
        if (classifyHazardousLive({ voltageV, currentA, capacitanceF: low }).hazardous) {
          expect(classifyHazardousLive({ voltageV, currentA, capacitanceF: high }).hazardous).toBe(true);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('never flips back to safe as V rises', () => {
    fc.assert(
      fc.property(hazardVoltage, hazardVoltage, current, hazardCapacitance, (v1, v2, currentA, capacitanceF) => {
        const [low, high] = v1 <= v2 ? [v1, v2] : [v2, v1];
        if (classifyHazardousLive({ voltageV: low, currentA, capacitanceF }).hazardous) {
          expect(classifyHazardousLive({ voltageV: high, currentA, capacitanceF }).hazardous).toBe(true);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('never flips back to safe as V crosses the 15 kV switch from line A (charge) to line B (energy)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 14.9e3, max: 15e3, noNaN: true }),
        fc.double({ min: 15e3, max: 15.4e3, noNaN: true }),
        fc.double({ min: 2.95e-9, max: 3.15e-9, noNaN: true }),
        (below, above, capacitanceF) => {
          if (classifyHazardousLive({ voltageV: below, currentA: 0, capacitanceF }).hazardous) {
            expect(classifyHazardousLive({ voltageV: above, currentA: 0, capacitanceF }).hazardous).toBe(true);
          }
        },
      ),
    );
  });

  it('agrees with maxNonHazardousCapacitanceF when the source cannot drive a hazardous current', () => {
    fc.assert(
      fc.property(hazardVoltage, hazardCapacitance, (voltageV, capacitanceF) => {
        const limit = maxNonHazardousCapacitanceF({ voltageV });
        const hazardous = classifyHazardousLive({ voltageV, currentA: 0, capacitanceF }).hazardous;
        expect(hazardous).toBe(limit !== null && capacitanceF > limit);
      }),
    );
  });
});

describe('retest dates', () => {
  it('always fall after the last test and are real dates', () => {
    const date = fc.record({ year: fc.integer({ min: 1990, max: 2100 }), month: fc.integer({ min: 1, max: 12 }), day: fc.integer({ min: 1, max: 28 }) });
    fc.assert(
      fc.property(date, fc.constantFrom('glove', 'sleeve', 'blanket', 'hot-stick' as const), ({ year, month, day }, equipment) => {
        const lastTestDate = `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
        const { dueDate } = nextDue({ equipment, lastTestDate });
        expect(dueDate > lastTestDate).toBe(true);
        expect(dueDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);
        expect(dueDate.slice(8)).toBe(lastTestDate.slice(8));
      }),
    );
  });
});
