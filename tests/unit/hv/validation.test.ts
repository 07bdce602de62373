import fc from 'fast-check';
import {
  airDensityFactor,
  approachBoundaries,
  bleederPowerW,
  capacitorEnergy,
  classifyHazardousLive,
  coronaOnset,
  currentFromPowerA,
  dischargePlan,
  energyAtChargeLimitJ,
  hotStickTestVoltage,
  HvInputError,
  maxNonHazardousCapacitanceF,
  multiplierOutput,
  paschenBreakdown,
  peekOnsetGradientKvPerCm,
  ratingMargin,
  residualAfterTimeConstantsV,
  residualVoltageV,
  schumannBreakdownV,
  sparkoverCheck,
  specificPowerWPerG,
  storedChargeC,
  storedEnergyJ,
  thrustToWeightRatio,
  timeConstantsToSafe,
  timeToSafeVoltageS,
  uniformBreakdownV,
} from '../../../shared/hv';
import { catchHvInputError, expectAllFinite } from './expect-within';

// Every calculation must answer valid input with finite, JSON-safe numbers and refuse invalid
// input with an HvInputError naming the offending field, never with NaN or Infinity.

interface Case {
  readonly name: string;
  readonly call: (input: Record<string, unknown>) => unknown;
  readonly valid: fc.Arbitrary<Record<string, unknown>>;
  /** Fields where zero is also invalid (divided by, logged, or meaningless at zero). */
  readonly positive: readonly string[];
  /** Fields where zero is valid but negatives are not. */
  readonly nonNegative: readonly string[];
  /** Optional fields: leaving them out (undefined) is valid and picks the default. */
  readonly optional: readonly string[];
}

function caseOf<T extends object>(
  name: string,
  fn: (input: T) => unknown,
  valid: fc.Arbitrary<T>,
  positive: readonly (keyof T & string)[],
  nonNegative: readonly (keyof T & string)[],
  optional: readonly (keyof T & string)[] = [],
): Case {
  return {
    name,
    call: (input) => fn(input as unknown as T),
    valid: valid as unknown as fc.Arbitrary<Record<string, unknown>>,
    positive,
    nonNegative,
    optional,
  };
}

const range = (min: number, max: number) => fc.double({ min, max, noNaN: true });
const volts = range(0, 1e6);
const farads = range(0, 1);
const posFarads = range(1e-15, 1);
const ohms = range(1, 1e12);

const startAndSafe = fc
  .tuple(range(1, 1e6), range(1e-3, 0.999))
  .map(([initialV, fraction]) => ({ initialV, safeV: Math.max(initialV * fraction, 1e-3) }))
  .filter(({ initialV, safeV }) => safeV < initialV);

const cases: readonly Case[] = [
  caseOf('storedEnergyJ', storedEnergyJ, fc.record({ capacitanceF: farads, voltageV: volts }), [], ['capacitanceF', 'voltageV']),
  caseOf('storedChargeC', storedChargeC, fc.record({ capacitanceF: farads, voltageV: volts }), [], ['capacitanceF', 'voltageV']),
  caseOf('capacitorEnergy', capacitorEnergy, fc.record({ capacitanceF: farads, voltageV: volts }), [], ['capacitanceF', 'voltageV']),
  caseOf(
    'residualVoltageV',
    residualVoltageV,
    fc.record({ resistanceOhm: ohms, capacitanceF: posFarads, initialV: volts, timeS: range(0, 1e6) }),
    ['resistanceOhm', 'capacitanceF'],
    ['initialV', 'timeS'],
  ),
  caseOf(
    'residualAfterTimeConstantsV',
    residualAfterTimeConstantsV,
    fc.record({ initialV: volts, timeConstants: range(0, 100) }),
    [],
    ['initialV', 'timeConstants'],
  ),
  caseOf('timeConstantsToSafe', timeConstantsToSafe, startAndSafe, ['initialV', 'safeV'], []),
  caseOf(
    'timeToSafeVoltageS',
    timeToSafeVoltageS,
    fc.tuple(ohms, posFarads, startAndSafe).map(([resistanceOhm, capacitanceF, s]) => ({ resistanceOhm, capacitanceF, ...s })),
    ['resistanceOhm', 'capacitanceF', 'initialV', 'safeV'],
    [],
  ),
  caseOf(
    'dischargePlan',
    dischargePlan,
    fc.tuple(ohms, posFarads, startAndSafe).map(([resistanceOhm, capacitanceF, s]) => ({ resistanceOhm, capacitanceF, ...s })),
    ['resistanceOhm', 'capacitanceF', 'initialV', 'safeV'],
    [],
  ),
  caseOf('bleederPowerW', bleederPowerW, fc.record({ voltageV: volts, resistanceOhm: ohms }), ['resistanceOhm'], ['voltageV']),
  caseOf(
    'classifyHazardousLive',
    classifyHazardousLive,
    fc.record({ voltageV: volts, currentA: range(0, 10), capacitanceF: farads }),
    [],
    ['voltageV', 'currentA', 'capacitanceF'],
  ),
  caseOf('maxNonHazardousCapacitanceF', maxNonHazardousCapacitanceF, fc.record({ voltageV: volts }), [], ['voltageV']),
  caseOf('energyAtChargeLimitJ', energyAtChargeLimitJ, fc.record({ voltageV: range(1e-3, 1e6) }), ['voltageV'], []),
  caseOf(
    'approachBoundaries',
    approachBoundaries,
    fc.record({ voltageV: range(0, 121e3), system: fc.constantFrom('dc' as const, 'ac' as const) }),
    [],
    ['voltageV'],
  ),
  caseOf(
    'multiplierOutput',
    multiplierOutput,
    fc.record({
      stages: fc.integer({ min: 1, max: 50 }),
      peakInputV: range(1, 1e6),
      frequencyHz: range(1, 1e6),
      stageCapacitanceF: range(1e-12, 1e-3),
      loadCurrentA: fc.oneof(fc.constant(0), range(0, 1)),
    }),
    ['stages', 'peakInputV', 'frequencyHz', 'stageCapacitanceF'],
    ['loadCurrentA'],
  ),
  caseOf(
    'uniformBreakdownV',
    uniformBreakdownV,
    fc.record({ gapM: range(1e-6, 10), airDensityFactor: range(0.1, 2) }),
    ['gapM', 'airDensityFactor'],
    [],
    ['airDensityFactor'],
  ),
  caseOf(
    'schumannBreakdownV',
    schumannBreakdownV,
    fc.record({ gapM: range(1e-6, 10), airDensityFactor: range(0.1, 2) }),
    ['gapM', 'airDensityFactor'],
    [],
    ['airDensityFactor'],
  ),
  caseOf(
    'sparkoverCheck',
    sparkoverCheck,
    fc.record({ voltageV: volts, gapM: range(1e-6, 10), warnFieldVPerM: range(1e3, 1e7) }),
    ['gapM', 'warnFieldVPerM'],
    ['voltageV'],
    ['warnFieldVPerM'],
  ),
  caseOf('paschenBreakdown', paschenBreakdown, fc.record({ pressurePa: range(1, 1e7), gapM: range(1e-7, 1) }), ['pressurePa', 'gapM'], []),
  caseOf('airDensityFactor', airDensityFactor, fc.record({ pressureCmHg: range(1, 200), temperatureC: range(-80, 200) }), ['pressureCmHg'], []),
  caseOf(
    'peekOnsetGradientKvPerCm',
    peekOnsetGradientKvPerCm,
    fc.record({ wireRadiusM: range(1e-6, 0.1), airDensityFactor: range(0.1, 2) }),
    ['wireRadiusM', 'airDensityFactor'],
    [],
  ),
  caseOf(
    'coronaOnset',
    coronaOnset,
    fc
      .record({
        wireRadiusM: range(1e-6, 0.01),
        ratio: range(1.01, 1e3),
        pressureCmHg: range(1, 200),
        temperatureC: range(-80, 200),
        surfaceFactor: range(0.5, 1),
      })
      .map(({ ratio, ...rest }) => ({ ...rest, outerRadiusM: rest.wireRadiusM * ratio })),
    ['wireRadiusM', 'pressureCmHg', 'surfaceFactor', 'outerRadiusM'],
    [],
    ['outerRadiusM'],
  ),
  caseOf(
    'ratingMargin',
    ratingMargin,
    fc.record({ ratedKv: range(0, 1e3), plannedKv: range(1e-3, 1e3), marginPct: range(0, 100) }),
    ['plannedKv'],
    ['ratedKv', 'marginPct'],
  ),
  caseOf('currentFromPowerA', currentFromPowerA, fc.record({ powerW: range(0, 1e4), voltageV: range(1, 1e6) }), ['voltageV'], ['powerW']),
  caseOf('thrustToWeightRatio', thrustToWeightRatio, fc.record({ thrustN: range(0, 1e3), massKg: range(1e-3, 1e3) }), ['massKg'], ['thrustN']),
  caseOf('specificPowerWPerG', specificPowerWPerG, fc.record({ powerW: range(0, 1e4), massKg: range(1e-3, 1e3) }), ['massKg'], ['powerW']),
  caseOf(
    'hotStickTestVoltage',
    hotStickTestVoltage,
    fc.record({
      lengthM: range(0.01, 20),
      material: fc.constantFrom('frp' as const, 'wood' as const),
      test: fc.constantFrom('design' as const, 'in-service' as const),
    }),
    ['lengthM'],
    [],
  ),
];

const notANumber = fc.constantFrom<unknown>(Number.NaN, Infinity, -Infinity, '5', null, undefined);
const negative = fc.double({ max: -Number.MIN_VALUE, noNaN: true });
const invalidNonNegative = fc.oneof(notANumber, negative);
const invalidPositive = fc.oneof(notANumber, negative, fc.constantFrom(0, -0));

describe.each(cases)('$name', ({ call, valid, positive, nonNegative, optional }) => {
  it('returns only finite numbers for valid input', () => {
    fc.assert(
      fc.property(valid, (input) => {
        expectAllFinite(call(input));
      }),
    );
  });

  const fields = [...positive.map((field) => ({ field, bad: invalidPositive })), ...nonNegative.map((field) => ({ field, bad: invalidNonNegative }))];
  it.each(fields)('throws HvInputError naming $field when it is invalid', ({ field, bad }) => {
    fc.assert(
      fc.property(valid, bad, (input, value) => {
        fc.pre(!(value === undefined && optional.includes(field)));
        const error = catchHvInputError(() => call({ ...input, [field]: value }));
        expect(error.field).toBe(field);
        expect(error.code).toBe('INVALID_INPUT');
        expect(error.message.length).toBeGreaterThan(0);
      }),
    );
  });
});

describe('overflowing inputs', () => {
  it('throw instead of returning Infinity', () => {
    expect(() => storedEnergyJ({ capacitanceF: 1e300, voltageV: 1e300 })).toThrow(HvInputError);
    expect(() => classifyHazardousLive({ voltageV: 1e300, currentA: 0, capacitanceF: 1e300 })).toThrow(HvInputError);
  });
});

describe('temperature', () => {
  it('refuses NaN and temperatures at or below −273 °C, naming temperatureC', () => {
    for (const temperatureC of [Number.NaN, Infinity, -273, -300]) {
      expect(catchHvInputError(() => airDensityFactor({ pressureCmHg: 76, temperatureC })).field).toBe('temperatureC');
    }
  });
});

describe('HvInputError', () => {
  it('is an Error with code INVALID_INPUT, a field and a message', () => {
    const error = new HvInputError('voltageV', 'voltageV must not be negative');
    expect(error).toBeInstanceOf(Error);
    expect(error.name).toBe('HvInputError');
    expect(error.code).toBe('INVALID_INPUT');
    expect(error.field).toBe('voltageV');
    expect(error.message).toBe('voltageV must not be negative');
  });
});
