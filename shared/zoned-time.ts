// A moment as the lab's clock shows it, naming the clock: "08:45 on Fri 4 Dec 2026 (Europe/London
// time)". The gate's times (when release opens, when a window ends) are read at a shared counter
// whose device may be set to another zone, so they never appear as raw UTC timestamps.

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

/** "08:45 on Fri 4 Dec 2026 (Europe/London time)"; an unknown zone falls back to UTC, named as such. */
export function zonedTimeWords(instant: string | Date, timeZone: string): string {
  const date = typeof instant === 'string' ? new Date(instant) : instant;
  if (Number.isNaN(date.getTime())) return String(instant);
  let zone = timeZone;
  try {
    formatsIn(zone);
  } catch {
    zone = 'UTC';
  }
  const { day, clock } = formatsIn(zone);
  return `${clock.format(date)} on ${day.format(date).replace(',', '')} (${zone} time)`;
}

/** "Thu 3 Dec 2026": a calendar date (YYYY-MM-DD, no clock) in the same words. */
export function calendarDayWords(isoDate: string): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  if (Number.isNaN(date.getTime())) return isoDate;
  return formatsIn('UTC').day.format(date).replace(',', '');
}
