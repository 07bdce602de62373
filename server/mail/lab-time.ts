// Times in e-mail are read away from the app, often on another device, so they carry the lab's
// own clock and say which clock it is ("Thu 3 Dec 2026, 14:39 (Europe/London)"). The lab's time
// zone is LAB_TIME_ZONE (an IANA name, checked by server/config.ts at start), else the server's.
import { calendarDayWords, zonedTimeWords } from '../../shared/zoned-time';

export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

export function labTimeZone(env: Record<string, string | undefined> = process.env): string {
  const named = env.LAB_TIME_ZONE;
  if (named && isTimeZone(named)) return named;
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

/** "at 14:39 on Thu 3 Dec 2026 (UTC time)": a server timestamp on the lab's clock, naming the clock. */
export function mailTime(iso: string | Date, timeZone = labTimeZone()): string {
  return `at ${zonedTimeWords(iso, timeZone)}`;
}

/** "Thu 3 Dec 2026": a calendar date (YYYY-MM-DD, no clock) in the same words. */
export const mailDay = calendarDayWords;
