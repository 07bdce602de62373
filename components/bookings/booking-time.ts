// The booking window's defaults and how it is shown.

/** Start of the next quarter hour from `now` (a booking made at the counter starts about now). */
export function nextQuarterHour(now = new Date()): Date {
  const next = new Date(now);
  next.setSeconds(0, 0);
  const minutes = next.getMinutes();
  next.setMinutes(minutes + (15 - (minutes % 15)));
  return next;
}

export function addHours(date: Date, hours: number): Date {
  return new Date(date.getTime() + hours * 3600_000);
}

// Typing and reading local times (with the clock changes) is shared/local-time.ts.

const shortFormat = new Intl.DateTimeFormat(undefined, { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
const timeFormat = new Intl.DateTimeFormat(undefined, { hour: '2-digit', minute: '2-digit' });

/** "Thu 3 Dec, 14:15 – 16:15", the end's date repeated only when it differs. */
export function formatWindow(startsAt: string, endsAt: string): string {
  const start = new Date(startsAt);
  const end = new Date(endsAt);
  const sameDay = start.toDateString() === end.toDateString();
  return `${shortFormat.format(start)} – ${sameDay ? timeFormat.format(end) : shortFormat.format(end)}`;
}
