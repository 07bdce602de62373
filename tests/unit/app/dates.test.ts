// The date helpers keep text per day for speed; the engine's own Date (ECMAScript's Date.prototype
// .toISOString and setUTCDate) is the reference they must agree with everywhere.
import fc from 'fast-check';
import { addDaysIso, isoOfMillis, timestampToIso, todayIso } from '../../../server/services/dates';

const MAX_TIME = 8.64e15;

describe('isoOfMillis', () => {
  it('writes every instant as Date#toISOString does, years past 9999 and before 1970 included', () => {
    fc.assert(
      fc.property(fc.integer({ min: -MAX_TIME, max: MAX_TIME }), (ms) => {
        expect(isoOfMillis(ms)).toBe(new Date(ms).toISOString());
      }),
      { numRuns: 20_000 },
    );
  });

  it('agrees at the edges of a day, of the epoch and of the representable range', () => {
    for (const ms of [
      0,
      -1,
      1,
      86_399_999,
      86_400_000,
      -86_400_000,
      -86_400_001,
      MAX_TIME,
      -MAX_TIME,
      Date.UTC(2026, 11, 31, 23, 59, 59, 999),
      Date.UTC(2028, 1, 29, 12),
    ]) {
      expect(isoOfMillis(ms)).toBe(new Date(ms).toISOString());
    }
  });

  it('drops a fraction of a millisecond as Date does', () => {
    expect(isoOfMillis(1.9)).toBe(new Date(1.9).toISOString());
    expect(isoOfMillis(-1.9)).toBe(new Date(-1.9).toISOString());
  });

  it('throws the RangeError Date throws for a time it cannot hold', () => {
    for (const ms of [NaN, Infinity, -Infinity, MAX_TIME + 1]) expect(() => isoOfMillis(ms)).toThrow(RangeError);
  });
});

describe('timestampToIso', () => {
  it('reads Date values and ISO text alike, and passes null through', () => {
    const at = new Date(Date.UTC(2026, 11, 2, 9, 5, 7, 42));
    expect(timestampToIso(at)).toBe('2026-12-02T09:05:07.042Z');
    expect(timestampToIso('2026-12-02T09:05:07.042Z')).toBe('2026-12-02T09:05:07.042Z');
    expect(timestampToIso(null)).toBeNull();
  });
});

describe('todayIso and addDaysIso', () => {
  it('give the UTC calendar day (the date part of toISOString), whatever day was asked before', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -MAX_TIME, max: MAX_TIME }), { minLength: 1, maxLength: 5 }), (times) => {
        for (const ms of times) {
          const iso = new Date(ms).toISOString();
          expect(todayIso(new Date(ms))).toBe(iso.slice(0, iso.indexOf('T')));
        }
      }),
    );
  });

  it('adds days across months, leap days and years, as setUTCDate does', () => {
    fc.assert(
      fc.property(fc.integer({ min: Date.UTC(1900, 0, 1), max: Date.UTC(2200, 0, 1) }), fc.integer({ min: -800, max: 800 }), (ms, days) => {
        const from = new Date(ms).toISOString().slice(0, 10);
        const expected = new Date(`${from}T00:00:00Z`);
        expected.setUTCDate(expected.getUTCDate() + days);
        // Asked twice: the second answer comes from the kept one.
        expect(addDaysIso(from, days)).toBe(expected.toISOString().slice(0, 10));
        expect(addDaysIso(from, days)).toBe(expected.toISOString().slice(0, 10));
      }),
    );
    // Gregorian calendar facts (common knowledge, no source): 2028 is a leap year, 2100 is not.
    expect(addDaysIso('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDaysIso('2100-02-28', 1)).toBe('2100-03-01');
    expect(addDaysIso('2026-12-31', 1)).toBe('2027-01-01');
  });

  it('refuses a date that is not one', () => {
    expect(() => addDaysIso('not-a-date', 1)).toThrow(RangeError);
  });
});
