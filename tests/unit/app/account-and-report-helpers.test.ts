// Pure helpers behind People, the Outbox and Reports.
import { splitMailText } from '../../../components/outbox/mail-text';
import { formatCalendarDate, localToday, qualificationState } from '../../../components/people/qualification';
import { formatHours, formatOverdueFor } from '../../../components/reports/format';
import { customPeriodSchema, lastDays } from '../../../components/reports/period';
import { periodToInstants, reportUrls } from '../../../hooks/use-reports';

describe('qualificationState', () => {
  const q = { authorisedKv: 30, expiresOn: '2026-05-10' };
  it('is current through its expiry day and expired after it, as the release rule reads it', () => {
    expect(qualificationState(q, '2026-05-10').kind).toBe('current');
    expect(qualificationState(q, '2026-05-11').kind).toBe('expired');
    expect(qualificationState(null, '2026-05-11').kind).toBe('none');
  });

  it('formats a calendar date without shifting it a day', () => {
    expect(formatCalendarDate('2026-01-01')).toContain('2026');
    expect(formatCalendarDate('2026-01-01')).not.toContain('2025');
    expect(localToday(new Date(2026, 0, 5, 23, 59))).toBe('2026-01-05');
  });
});

describe('splitMailText', () => {
  it('marks http(s) links and leaves sentence punctuation outside them', () => {
    const lines = splitMailText('Hello,\n\nSet your password: https://lab.example/invitation/abc_DEF-123.\nftp://nope');
    expect(lines).toHaveLength(4);
    expect(lines[1]).toEqual({ parts: [], hasLink: false });
    expect(lines[2]!.parts).toEqual([
      { kind: 'text', text: 'Set your password: ' },
      { kind: 'link', url: 'https://lab.example/invitation/abc_DEF-123' },
      { kind: 'text', text: '.' },
    ]);
    expect(lines[3]!.hasLink).toBe(false);
  });
});

describe('report periods', () => {
  it('counts the last N days with today included', () => {
    expect(lastDays(30, new Date(2026, 2, 31, 15))).toEqual({ from: '2026-03-02', to: '2026-03-31' });
    expect(lastDays(1, new Date(2026, 2, 31, 15))).toEqual({ from: '2026-03-31', to: '2026-03-31' });
  });

  it('sends local midnight to the midnight after the last day', () => {
    const { from, to } = periodToInstants({ from: '2026-03-02', to: '2026-03-31' });
    expect(new Date(from).getTime()).toBe(new Date(2026, 2, 2).getTime());
    expect(new Date(to).getTime()).toBe(new Date(2026, 3, 1).getTime());
    expect(reportUrls.usageCsv({ from: '2026-03-02', to: '2026-03-31' })).toBe(
      `/api/reports/usage.csv?from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`,
    );
  });

  it('accepts two dates in order and says what is wrong otherwise', () => {
    expect(customPeriodSchema.safeParse({ from: '2026-03-01', to: '2026-03-01' }).success).toBe(true);
    const reversed = customPeriodSchema.safeParse({ from: '2026-03-02', to: '2026-03-01' });
    expect(reversed.success ? [] : reversed.error.issues.map((i) => i.message)).toEqual(['The end must not be before the start']);
    const malformed = customPeriodSchema.safeParse({ from: '2026-3-1', to: '2026-03-01' });
    expect(malformed.success ? [] : malformed.error.issues.map((i) => i.message)).toEqual(['Use the form YYYY-MM-DD']);
  });

  it('formats hours and time overdue with units', () => {
    expect(formatHours(3)).toBe('3 h');
    expect(formatHours(136.66)).toBe('136.7 h');
    const now = new Date('2026-03-04T12:00:00Z');
    expect(formatOverdueFor('2026-03-04T11:15:00Z', now)).toBe('45 min');
    expect(formatOverdueFor('2026-03-04T09:00:00Z', now)).toBe('3 h');
    expect(formatOverdueFor('2026-03-01T12:00:00Z', now)).toBe('3 days');
  });
});
