// The booking window as people type it at a counter: local date and time, "2026-12-03 14:15".
const pad = (n: number) => String(n).padStart(2, '0');

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

/** Local time, in the one format the window fields accept. */
export function toLocalText(date: Date): string {
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())} ${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

/** "2026-12-03 14:15" (a T or a space between) in local time, or null if it is not a real time. */
export function parseLocalText(text: string): Date | null {
  const match = /^\s*(\d{4})-(\d{1,2})-(\d{1,2})[ T]+(\d{1,2}):(\d{2})\s*$/.exec(text);
  if (!match) return null;
  const [year, month, day, hour, minute] = match.slice(1).map(Number) as [number, number, number, number, number];
  const date = new Date(year, month - 1, day, hour, minute);
  // Date rolls 2026-02-30 over into March: refuse instead of booking the wrong day.
  if (date.getMonth() !== month - 1 || date.getDate() !== day || hour > 23 || minute > 59) return null;
  return date;
}

const shortFormat = new Intl.DateTimeFormat(undefined, { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
const timeFormat = new Intl.DateTimeFormat(undefined, { hour: '2-digit', minute: '2-digit' });

/** "Thu 3 Dec, 14:15 – 16:15", the end's date repeated only when it differs. */
export function formatWindow(startsAt: string, endsAt: string): string {
  const start = new Date(startsAt);
  const end = new Date(endsAt);
  const sameDay = start.toDateString() === end.toDateString();
  return `${shortFormat.format(start)} – ${sameDay ? timeFormat.format(end) : shortFormat.format(end)}`;
}
