// Calendar dates (inspection due dates) are plain YYYY-MM-DD strings in UTC, the lab's record.
//
// Lists call these once or twice a row. The bench profile of a 50-row bookings page spent a tenth
// of the server's time in Date#toISOString and another tenth of a search page in todayIso and
// addDaysIso, so each day's text is made once and reused.

const DAY_MS = 86_400_000;

/** The UTC day number of an instant (days since 1970-01-01; negative before it). */
const dayOf = (ms: number) => Math.floor(ms / DAY_MS);

// "YYYY-MM-DDT" of recent days, by day number. Cleared when full: a list spans few days.
const dayPrefixes = new Map<number, string>();
const MAX_DAYS = 4096;

function dayPrefix(day: number): string {
  let prefix = dayPrefixes.get(day);
  if (prefix === undefined) {
    const iso = new Date(day * DAY_MS).toISOString();
    // Years past 9999 are written "+010000-…", so cut at the T rather than at a fixed length.
    prefix = iso.slice(0, iso.indexOf('T') + 1);
    if (dayPrefixes.size >= MAX_DAYS) dayPrefixes.clear();
    dayPrefixes.set(day, prefix);
  }
  return prefix;
}

const TWO_DIGITS = Array.from({ length: 60 }, (_, n) => String(n).padStart(2, '0'));
const THREE_DIGITS = Array.from({ length: 1000 }, (_, n) => String(n).padStart(3, '0'));

/** Exactly `new Date(ms).toISOString()` (a RangeError for an invalid time included), faster. */
export function isoOfMillis(ms: number): string {
  // Date keeps whole milliseconds within ±8.64e15 (ECMAScript TimeClip); leave anything else to it.
  const time = Math.trunc(ms);
  if (!(Math.abs(time) <= 8.64e15)) return new Date(ms).toISOString();
  const day = dayOf(time);
  let rest = time - day * DAY_MS;
  const hours = Math.floor(rest / 3_600_000);
  rest -= hours * 3_600_000;
  const minutes = Math.floor(rest / 60_000);
  rest -= minutes * 60_000;
  const seconds = Math.floor(rest / 1000);
  const millis = rest - seconds * 1000;
  return `${dayPrefix(day)}${TWO_DIGITS[hours]}:${TWO_DIGITS[minutes]}:${TWO_DIGITS[seconds]}.${THREE_DIGITS[millis]}Z`;
}

let today = { day: NaN, iso: '' };

export function todayIso(now: Date | number = Date.now()): string {
  const day = dayOf(typeof now === 'number' ? now : now.getTime());
  if (day !== today.day) today = { day, iso: dayPrefix(day).slice(0, -1) };
  return today.iso;
}

let added = { from: '', days: NaN, iso: '' };

/** The date `days` after `dateIso`; the last answer is kept, as lists ask "due soon?" for every row. */
export function addDaysIso(dateIso: string, days: number): string {
  if (dateIso === added.from && days === added.days) return added.iso;
  const date = new Date(`${dateIso}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  added = { from: dateIso, days, iso: date.toISOString().slice(0, 10) };
  return added.iso;
}

/** mysql2 hands DATE columns back as Date objects at UTC midnight (timezone 'Z'). */
export function dateColumnToIso(value: Date | string | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string') return value.slice(0, 10);
  return value.toISOString().slice(0, 10);
}

export function timestampToIso(value: Date | string | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  return isoOfMillis(typeof value === 'string' ? new Date(value).getTime() : value.getTime());
}
