import {
  boundariesBodySchema,
  coronaBodySchema,
  dischargeBodySchema,
  energyBodySchema,
  hazardBodySchema,
  multiplierBodySchema,
} from '../../../shared/schemas/calc';

const issuePaths = (result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (result.error?.issues ?? []).map((issue) => issue.path.join('.'));

describe('calculation body schemas', () => {
  it('accept the documented bodies', () => {
    expect(energyBodySchema.safeParse({ capacitanceF: 1e-6, voltageV: 10e3 }).success).toBe(true);
    expect(dischargeBodySchema.safeParse({ resistanceOhm: 1e8, capacitanceF: 1e-6, initialV: 10e3, safeV: 50 }).success).toBe(true);
    expect(hazardBodySchema.safeParse({ voltageV: 10e3, currentA: 1e-4, capacitanceF: 5e-9 }).success).toBe(true);
    expect(boundariesBodySchema.safeParse({ voltageV: 500, system: 'dc' }).success).toBe(true);
    expect(multiplierBodySchema.safeParse({ stages: 5, peakInputV: 1e4, frequencyHz: 5e4, stageCapacitanceF: 1e-9, loadCurrentA: 0 }).success).toBe(true);
    expect(coronaBodySchema.safeParse({ wireRadiusM: 1e-4, pressureCmHg: 76, temperatureC: -10, surfaceFactor: 1 }).success).toBe(true);
  });

  it('put a safe voltage at or above the initial voltage on safeV', () => {
    const result = dischargeBodySchema.safeParse({ resistanceOhm: 1e8, capacitanceF: 1e-6, initialV: 50, safeV: 50 });
    expect(result.success).toBe(false);
    expect(issuePaths(result)).toEqual(['safeV']);
  });

  it('put a collector no larger than the wire on outerRadiusM', () => {
    const result = coronaBodySchema.safeParse({ wireRadiusM: 1e-3, pressureCmHg: 76, temperatureC: 25, surfaceFactor: 1, outerRadiusM: 1e-3 });
    expect(issuePaths(result)).toEqual(['outerRadiusM']);
  });

  it.each([
    ['NaN', Number.NaN],
    ['Infinity', Infinity],
    ['a negative', -1],
    ['a string', '1e-6'],
  ])('reject %s capacitance', (_label, capacitanceF) => {
    expect(issuePaths(energyBodySchema.safeParse({ capacitanceF, voltageV: 10 }))).toEqual(['capacitanceF']);
  });

  it('reject unknown fields (strict objects), e.g. a unit mix-up', () => {
    expect(energyBodySchema.safeParse({ capacitanceNf: 1, voltageV: 10 }).success).toBe(false);
    expect(energyBodySchema.safeParse({ capacitanceF: 1e-9, voltageV: 10, extra: 1 }).success).toBe(false);
  });

  it('limit stages to whole numbers 1…50 and loadCurrentA to ≥ 0', () => {
    const body = { stages: 5, peakInputV: 1e4, frequencyHz: 5e4, stageCapacitanceF: 1e-9, loadCurrentA: 1e-3 };
    expect(issuePaths(multiplierBodySchema.safeParse({ ...body, stages: 2.5 }))).toEqual(['stages']);
    expect(issuePaths(multiplierBodySchema.safeParse({ ...body, stages: 0 }))).toEqual(['stages']);
    expect(issuePaths(multiplierBodySchema.safeParse({ ...body, stages: 51 }))).toEqual(['stages']);
    expect(issuePaths(multiplierBodySchema.safeParse({ ...body, loadCurrentA: -1e-3 }))).toEqual(['loadCurrentA']);
  });

  it('limit the surface factor to 0 < m ≤ 1 and the system to dc or ac', () => {
    const corona = { wireRadiusM: 1e-4, pressureCmHg: 76, temperatureC: 25 };
    expect(issuePaths(coronaBodySchema.safeParse({ ...corona, surfaceFactor: 0 }))).toEqual(['surfaceFactor']);
    expect(issuePaths(coronaBodySchema.safeParse({ ...corona, surfaceFactor: 1.2 }))).toEqual(['surfaceFactor']);
    expect(issuePaths(boundariesBodySchema.safeParse({ voltageV: 500, system: 'rf' }))).toEqual(['system']);
  });
});
