// Times in e-mail are read away from the app, often on another device, so they carry the lab's
// own clock and say which clock it is ("Thu 3 Dec 2026, 14:39 (Europe/London)"). The lab's time
// zone is LAB_TIME_ZONE (an IANA name, checked by server/config.ts at start), else the server's.

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

const formats = new Map<string, { day: Intl.DateTimeFormat; clock: Intl.DateTimeFormat }>();

function formatsIn(timeZone: string) {
  let pair = formats.get(timeZone);
  if (!pair) {
    pair = {
      day: new Intl.DateTimeFormat('en-GB', { timeZone, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }),
      clock: new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }),
    };
    formats.set(timeZone, pair);
  }
  return pair;
}

/** "at 14:39 on Thu 3 Dec 2026 (UTC)": a server timestamp on the lab's clock, naming the clock. */
export function mailTime(iso: string | Date, timeZone = labTimeZone()): string {
  const date = typeof iso === 'string' ? new Date(iso) : iso;
  if (Number.isNaN(date.getTime())) return String(iso);
  const { day, clock } = formatsIn(timeZone);
  return `at ${clock.format(date)} on ${day.format(date).replace(',', '')} (${timeZone} time)`;
}

/** "Thu 3 Dec 2026": a calendar date (YYYY-MM-DD, no clock) in the same words. */
export function mailDay(isoDate: string): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  if (Number.isNaN(date.getTime())) return isoDate;
  return formatsIn('UTC').day.format(date).replace(',', '');
}
