import { approachBoundaries, approachTableMaxV, HvInputError, metresToFeetInches, NFPA70E_AC_TABLE, NFPA70E_DC_TABLE } from '../../../shared/hv';
import { catchHvInputError } from './expect-within';

const dc = (voltageV: number) => approachBoundaries({ voltageV, system: 'dc' });
const ac = (voltageV: number) => approachBoundaries({ voltageV, system: 'ac' });

describe('approachBoundaries, DC (NFPA 70E Table 130.4(E)(b))', () => {
  it('500 V: LAB movable 3.0 m, fixed 1.0 m (3 ft 6 in), RAB 0.3 m (1 ft 0 in) (NFPA 70E T130.4(E)(b), confirmed; domain check 10)', () => {
    const b = dc(500);
    expect([b.limitedMovableM, b.limitedFixedM, b.restrictedM]).toEqual([3.0, 1.0, 0.3]);
    expect(b.limitedFixedImperial).toBe('3 ft 6 in');
    expect(b.restrictedImperial).toBe('1 ft 0 in');
    expect(b.marker).toBe('confirmed');
    expect(b.rowLabel).toBe('301 V – 1 kV');
  });

  it('3 kV: 3.0 / 1.5 / 0.5 m (2021 table as paraphrased, partly confirmed; domain check 11)', () => {
    const b = dc(3e3);
    expect([b.limitedMovableM, b.limitedFixedM, b.restrictedM]).toEqual([3.0, 1.5, 0.5]);
    expect(b.marker).toBe('partly-confirmed');
  });

  it('10 kV: 3.0 / 1.5 / 0.7 m (partly confirmed; domain check 11)', () => {
    const b = dc(10e3);
    expect([b.limitedMovableM, b.limitedFixedM, b.restrictedM]).toEqual([3.0, 1.5, 0.7]);
  });

  it('exactly 5 kV takes the 5–15 kV row, RAB 0.7 m (more protective row at a shared edge, common practice; domain check 12)', () => {
    const b = dc(5e3);
    expect(b.rowLabel).toBe('5 kV – 15 kV');
    expect(b.restrictedM).toBe(0.7);
  });

  it('30 kV: fixed LAB 2.5 m, RAB 0.8 m (from memory; domain check 13)', () => {
    const b = dc(30e3);
    expect([b.limitedFixedM, b.restrictedM]).toEqual([2.5, 0.8]);
    expect(b.marker).toBe('from-memory');
  });

  it('70 kV: fixed LAB 2.5 m, RAB 1.0 m (from memory; domain check 13)', () => {
    const b = dc(70e3);
    expect([b.limitedFixedM, b.restrictedM]).toEqual([2.5, 1.0]);
  });

  it('100 kV: fixed LAB 3.0 m, RAB 1.2 m, movable 3.3 m (from memory; domain check 13)', () => {
    const b = dc(100e3);
    expect([b.limitedMovableM, b.limitedFixedM, b.restrictedM]).toEqual([3.3, 3.0, 1.2]);
  });

  it('40 V: not specified, with JSON-safe nulls (2021 edition, partly confirmed; domain check 14)', () => {
    const b = dc(40);
    expect(b.notSpecified).toBe(true);
    expect([b.limitedMovableM, b.limitedFixedM, b.restrictedM]).toEqual([null, null, null]);
    expect(b.limitedFixedImperial).toBe('Not specified');
    expect(JSON.parse(JSON.stringify(b))).toEqual(b);
  });

  it('50 V is inside the table (the protective reading of the edition note)', () => {
    const b = dc(50);
    expect(b.notSpecified).toBe(false);
    expect(b.limitedFixedM).toBe(1.0);
    expect(b.restrictedM).toBeNull();
    expect(b.restrictedImperial).toBe('Avoid contact');
  });

  it('1.05 kV, in the gap between 1 kV and 1.1 kV, takes the higher row (protective gap rule, common practice)', () => {
    expect(dc(1.05e3).rowLabel).toBe('1.1 kV – 5 kV');
  });

  it('300.5 V takes the 301 V – 1 kV row, and 15.05 kV the 15.1–45 kV row', () => {
    expect(dc(300.5).rowLabel).toBe('301 V – 1 kV');
    expect(dc(15.05e3).rowLabel).toBe('15.1 kV – 45 kV');
  });

  it('60 kV on an open bench: fixed LAB 2.5 m, RAB 1.0 m (domain §1.2 worked example, from memory)', () => {
    const b = dc(60e3);
    expect([b.limitedFixedM, b.restrictedM]).toEqual([2.5, 1.0]);
  });

  it('200 kV returns the 150.1–250 kV row flagged as outside the tool scope', () => {
    const b = dc(200e3);
    expect(b.outsideToolScope).toBe(true);
    expect(b.limitedFixedM).toBe(3.6);
  });

  it('throws above the highest row rather than understate the distances', () => {
    expect(approachTableMaxV({ system: 'dc' })).toBe(250e3);
    const error = catchHvInputError(() => dc(250.05e3));
    expect(error.field).toBe('voltageV');
    expect(error.code).toBe('INVALID_INPUT');
  });

  it('carries the table imperial text, not a conversion (1.0 m is printed 3 ft 6 in; it converts to 3 ft 3 in)', () => {
    expect(dc(500).limitedFixedImperial).toBe('3 ft 6 in');
    expect(metresToFeetInches(1.0).text).toBe('3 ft 3 in');
  });

  it('names the table edition and source on every answer', () => {
    const b = dc(500);
    expect(b.edition).toMatch(/2021/);
    expect(b.source).toMatch(/130\.4\(E\)\(b\)/);
  });
});

describe('approachBoundaries, AC (NFPA 70E Table 130.4(E)(a))', () => {
  it('208 V: fixed LAB 1.0 m (3 ft 6 in), RAB 0.3 m (1 ft 0 in) (T130.4(E)(a), confirmed; domain check 15)', () => {
    const b = ac(208);
    expect([b.limitedFixedM, b.restrictedM]).toEqual([1.0, 0.3]);
    expect(b.limitedFixedImperial).toBe('3 ft 6 in');
    expect(b.restrictedImperial).toBe('1 ft 0 in');
  });

  it('480 V gives 3 ft 6 in / 1 ft 0 in (T130.4(E)(a), confirmed)', () => {
    const b = ac(480);
    expect([b.limitedFixedImperial, b.restrictedImperial]).toEqual(['3 ft 6 in', '1 ft 0 in']);
  });

  it('15 kV gives 5 ft 0 in / 2 ft 2 in (T130.4(E)(a), confirmed)', () => {
    const b = ac(15e3);
    expect([b.limitedFixedImperial, b.restrictedImperial]).toEqual(['5 ft 0 in', '2 ft 2 in']);
  });

  it('throws above 121 kV', () => {
    expect(approachTableMaxV({ system: 'ac' })).toBe(121e3);
    expect(() => ac(130e3)).toThrow(HvInputError);
  });
});

describe('boundary tables as data', () => {
  it.each([
    ['dc', NFPA70E_DC_TABLE],
    ['ac', NFPA70E_AC_TABLE],
  ] as const)('%s rows ascend and every row carries a source, edition and marker', (_name, table) => {
    table.rows.forEach((row, i) => {
      expect(row.lowerV).toBeLessThanOrEqual(row.upperV);
      if (i > 0) expect(row.lowerV).toBeGreaterThanOrEqual(table.rows[i - 1]!.upperV);
      expect(row.source.length).toBeGreaterThan(10);
      expect(row.edition.length).toBeGreaterThan(0);
      expect(['confirmed', 'partly-confirmed', 'from-memory', 'common-practice', 'derived']).toContain(row.marker);
    });
  });

  it('rejects an unknown system, naming the field', () => {
    expect(catchHvInputError(() => approachBoundaries({ voltageV: 500, system: 'rf' as 'dc' })).field).toBe('system');
  });
});
