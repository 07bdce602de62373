// Local times where the clocks change. Expected instants follow the published rules, not this code:
// - European Union, Directive 2000/84/EC: summer time from 01:00 UTC on the last Sunday of March
//   to 01:00 UTC on the last Sunday of October (2026: 29 March and 25 October); Berlin is UTC+01:00
//   in winter and UTC+02:00 in summer.
// - United States, Energy Policy Act of 2005 §110: from 02:00 local on the second Sunday of March
//   to 02:00 local on the first Sunday of November (2026: 8 March and 1 November); New York is
//   UTC−05:00 (EST) and UTC−04:00 (EDT).
// - Nepal keeps UTC+05:45 all year (a zone whose offset is not whole hours), common knowledge of
//   the trade, from memory.
import { formatUtcOffset, offsetMinutesAt, resolveLocalText, resolveWallTime, wallTextOf } from '../../../shared/local-time';

const iso = (d: Date) => d.toISOString();

describe('resolveLocalText in Europe/Berlin', () => {
  const zone = 'Europe/Berlin';

  it('finds exactly one instant for an ordinary time', () => {
    const r = resolveLocalText('2026-07-01 14:15', zone);
    expect(r.kind).toBe('exact');
    if (r.kind === 'exact')
      expect({ at: iso(r.candidate.instant), offset: r.candidate.offsetMinutes }).toEqual({ at: '2026-07-01T12:15:00.000Z', offset: 120 });
  });

  it('refuses 02:30 on 29 March 2026: clocks jump from 02:00 to 03:00', () => {
    expect(resolveLocalText('2026-03-29 02:30', zone)).toEqual({ kind: 'nonexistent', offsetBeforeMinutes: 60, offsetAfterMinutes: 120 });
    expect(resolveLocalText('2026-03-29 02:00', zone).kind).toBe('nonexistent');
    expect(resolveLocalText('2026-03-29 02:59', zone).kind).toBe('nonexistent');
    // Either side of the gap is an ordinary time.
    const before = resolveLocalText('2026-03-29 01:59', zone);
    const after = resolveLocalText('2026-03-29 03:00', zone);
    expect(before.kind === 'exact' && iso(before.candidate.instant)).toBe('2026-03-29T00:59:00.000Z');
    expect(after.kind === 'exact' && iso(after.candidate.instant)).toBe('2026-03-29T01:00:00.000Z');
  });

  it('gives both instants of 02:30 on 25 October 2026, earlier (UTC+02:00) first', () => {
    const r = resolveLocalText('2026-10-25 02:30', zone);
    expect(r.kind).toBe('ambiguous');
    if (r.kind !== 'ambiguous') return;
    expect({ at: iso(r.earlier.instant), offset: formatUtcOffset(r.earlier.offsetMinutes) }).toEqual({ at: '2026-10-25T00:30:00.000Z', offset: 'UTC+02:00' });
    expect({ at: iso(r.later.instant), offset: formatUtcOffset(r.later.offsetMinutes) }).toEqual({ at: '2026-10-25T01:30:00.000Z', offset: 'UTC+01:00' });
    expect(resolveLocalText('2026-10-25 03:00', zone).kind).toBe('exact');
    expect(resolveLocalText('2026-10-25 01:59', zone).kind).toBe('exact');
  });
});

describe('resolveLocalText in America/New_York', () => {
  const zone = 'America/New_York';

  it('refuses 02:30 on 8 March 2026 and doubles 01:30 on 1 November 2026', () => {
    expect(resolveLocalText('2026-03-08 02:30', zone)).toEqual({ kind: 'nonexistent', offsetBeforeMinutes: -300, offsetAfterMinutes: -240 });
    const r = resolveLocalText('2026-11-01 01:30', zone);
    expect(r.kind).toBe('ambiguous');
    if (r.kind !== 'ambiguous') return;
    expect([iso(r.earlier.instant), formatUtcOffset(r.earlier.offsetMinutes)]).toEqual(['2026-11-01T05:30:00.000Z', 'UTC−04:00']);
    expect([iso(r.later.instant), formatUtcOffset(r.later.offsetMinutes)]).toEqual(['2026-11-01T06:30:00.000Z', 'UTC−05:00']);
  });
});

describe('zones without changes and bad input', () => {
  it('handles a zone with a quarter-hour offset and UTC itself', () => {
    const r = resolveLocalText('2026-03-29 02:30', 'Asia/Kathmandu');
    expect(r.kind === 'exact' && [iso(r.candidate.instant), formatUtcOffset(r.candidate.offsetMinutes)]).toEqual(['2026-03-28T20:45:00.000Z', 'UTC+05:45']);
    const utc = resolveLocalText('2026-10-25 02:30', 'UTC');
    expect(utc.kind === 'exact' && iso(utc.candidate.instant)).toBe('2026-10-25T02:30:00.000Z');
  });

  it.each(['2026-02-30 10:00', '2026-13-01 10:00', '2026-01-01 24:00', '2026-01-01 10:60', 'tomorrow at ten', ''])('calls %j invalid', (text) => {
    expect(resolveLocalText(text, 'Europe/Berlin')).toEqual({ kind: 'invalid' });
  });

  it('accepts a T between date and time, as ISO 8601 writes it', () => {
    expect(resolveWallTime({ year: 2026, month: 12, day: 3, hour: 14, minute: 15 }, 'Europe/Berlin')).toEqual(
      resolveLocalText('2026-12-03T14:15', 'Europe/Berlin'),
    );
  });
});

describe('offsets and wall text', () => {
  it('reads the offset on each side of a change', () => {
    expect(offsetMinutesAt(new Date('2026-03-29T00:59:59Z'), 'Europe/Berlin')).toBe(60);
    expect(offsetMinutesAt(new Date('2026-03-29T01:00:00Z'), 'Europe/Berlin')).toBe(120);
  });

  it('writes an instant back as the wall clock shows it, round-tripping every exact time', () => {
    expect(wallTextOf(new Date('2026-10-25T00:30:00Z'), 'Europe/Berlin')).toBe('2026-10-25 02:30');
    expect(wallTextOf(new Date('2026-10-25T01:30:00Z'), 'Europe/Berlin')).toBe('2026-10-25 02:30');
    for (let minutes = 0; minutes < 48 * 60; minutes += 15) {
      const instant = new Date(Date.UTC(2026, 2, 28) + minutes * 60_000);
      const r = resolveLocalText(wallTextOf(instant, 'Europe/Berlin'), 'Europe/Berlin');
      expect(r.kind === 'exact' ? iso(r.candidate.instant) : r.kind).toBe(iso(instant));
    }
  });
});
