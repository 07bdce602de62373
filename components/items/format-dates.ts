// Calendar dates (inspection days, due dates) are plain YYYY-MM-DD strings from the server. Read
// as UTC midnight and shown in UTC, so a due date never slips a day for a reader west of Greenwich.
const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeZone: 'UTC' });

export function formatDay(isoDate: string): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  return Number.isNaN(date.getTime()) ? isoDate : dateFormat.format(date);
}

/** Today in the reader's own calendar, as the inspection form's default date. */
export function localTodayIso(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
