// A person's HV qualification as the People screen shows it. Dates are calendar dates (YYYY-MM-DD)
// compared as text in the lab's local day, the same way the release rules compare them.
import type { Person } from '@/hooks/use-people';

export type QualificationState =
  { kind: 'none' } | { kind: 'expired'; authorisedKv: number; expiresOn: string } | { kind: 'current'; authorisedKv: number; expiresOn: string };

export function qualificationState(qualification: Person['qualification'], today: string): QualificationState {
  if (!qualification) return { kind: 'none' };
  // The release rule treats the expiry day itself as still valid (expired only once it is past).
  return qualification.expiresOn < today ? { kind: 'expired', ...qualification } : { kind: 'current', ...qualification };
}

/** Today in the device's time zone, as YYYY-MM-DD. */
export function localToday(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

const calendarDate = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

/** "2026-03-01" in the reader's locale, without a time zone shifting it to the day before. */
export function formatCalendarDate(isoDate: string): string {
  const [year, month, day] = isoDate.split('-').map(Number);
  if (!year || !month || !day) return isoDate;
  return calendarDate.format(new Date(year, month - 1, day));
}

export function describeQualification(state: QualificationState): string {
  if (state.kind === 'none') return 'No HV qualification on record';
  if (state.kind === 'expired') return `HV qualification expired ${formatCalendarDate(state.expiresOn)} (was up to ${state.authorisedKv} kV)`;
  return `HV up to ${state.authorisedKv} kV until ${formatCalendarDate(state.expiresOn)}`;
}
