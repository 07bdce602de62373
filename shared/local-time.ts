// Local wall-clock times in a named time zone (IANA, e.g. "Europe/Berlin"), as a person types them
// at the counter. Where clocks change, a wall time can name no instant (the hour skipped when
// clocks go forward) or two (the hour repeated when they go back); this module says which, so the
// form can refuse the first and ask about the second instead of silently moving or picking.
// Pure: it reads offsets through Intl only, the same on the server, in tests and in the browser.

export interface WallTime {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
}

export interface Candidate {
  instant: Date;
  /** Minutes east of UTC at that instant (UTC+02:00 → 120). */
  offsetMinutes: number;
}

export type LocalTimeResolution =
  | { kind: 'invalid' }
  | { kind: 'exact'; candidate: Candidate }
  /** No such time here: clocks jump from `offsetBefore` to `offsetAfter` over it. */
  | { kind: 'nonexistent'; offsetBeforeMinutes: number; offsetAfterMinutes: number }
  /** Twice here: the earlier instant first. */
  | { kind: 'ambiguous'; earlier: Candidate; later: Candidate };

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

/** The zone's offset from UTC at `instant`, in whole minutes east. */
export function offsetMinutesAt(instant: Date, timeZone: string): number {
  const parts: Record<string, number> = {};
  for (const part of formatterFor(timeZone).formatToParts(instant)) if (part.type !== 'literal') parts[part.type] = Number(part.value);
  const asUtc = Date.UTC(parts.year!, parts.month! - 1, parts.day!, parts.hour! % 24, parts.minute!, parts.second!);
  const wholeSeconds = Math.floor(instant.getTime() / 1000) * 1000;
  return Math.round((asUtc - wholeSeconds) / 60_000);
}

/** "UTC+02:00", "UTC−05:00" (a real minus sign), "UTC+05:45". */
export function formatUtcOffset(offsetMinutes: number): string {
  const sign = offsetMinutes < 0 ? '−' : '+';
  const abs = Math.abs(offsetMinutes);
  return `UTC${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
}

const DAY_MS = 24 * 3600_000;

/** Every instant at which the zone's clocks read `wall`: none, one, or two. */
export function resolveWallTime(wall: WallTime, timeZone: string): LocalTimeResolution {
  const { year, month, day, hour, minute } = wall;
  if (![year, month, day, hour, minute].every(Number.isInteger) || hour > 23 || minute > 59 || month < 1 || month > 12 || day < 1) return { kind: 'invalid' };
  const wallAsUtc = Date.UTC(year, month - 1, day, hour, minute);
  const check = new Date(wallAsUtc);
  // Date.UTC rolls 2026-02-30 into March: refuse instead of booking the wrong day.
  if (check.getUTCMonth() !== month - 1 || check.getUTCDate() !== day) return { kind: 'invalid' };

  // The offsets in force a day either side cover any single change of the clocks in between.
  const offsets = new Set([
    offsetMinutesAt(new Date(wallAsUtc - DAY_MS), timeZone),
    offsetMinutesAt(new Date(wallAsUtc), timeZone),
    offsetMinutesAt(new Date(wallAsUtc + DAY_MS), timeZone),
  ]);
  const candidates: Candidate[] = [];
  for (const offset of offsets) {
    const instant = new Date(wallAsUtc - offset * 60_000);
    if (offsetMinutesAt(instant, timeZone) === offset) candidates.push({ instant, offsetMinutes: offset });
  }
  candidates.sort((a, b) => a.instant.getTime() - b.instant.getTime());
  if (candidates.length === 1) return { kind: 'exact', candidate: candidates[0]! };
  if (candidates.length >= 2) return { kind: 'ambiguous', earlier: candidates[0]!, later: candidates[candidates.length - 1]! };
  const before = offsetMinutesAt(new Date(wallAsUtc - DAY_MS), timeZone);
  const after = offsetMinutesAt(new Date(wallAsUtc + DAY_MS), timeZone);
  return { kind: 'nonexistent', offsetBeforeMinutes: before, offsetAfterMinutes: after };
}

/** "2026-12-03 14:15" (a T or a space between), resolved in `timeZone`; invalid when it is not that shape. */
export function resolveLocalText(text: string, timeZone: string): LocalTimeResolution {
  const match = /^\s*(\d{4})-(\d{1,2})-(\d{1,2})[ T]+(\d{1,2}):(\d{2})\s*$/.exec(text);
  if (!match) return { kind: 'invalid' };
  const [year, month, day, hour, minute] = match.slice(1).map(Number) as [number, number, number, number, number];
  return resolveWallTime({ year, month, day, hour, minute }, timeZone);
}

/** The zone this device's clock is set to (the browser's, at the counter). */
export function deviceTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

/** `instant` as the zone's wall clock shows it, in the form fields' format "YYYY-MM-DD HH:MM". */
export function wallTextOf(instant: Date, timeZone: string): string {
  const local = new Date(instant.getTime() + offsetMinutesAt(instant, timeZone) * 60_000);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${local.getUTCFullYear()}-${pad(local.getUTCMonth() + 1)}-${pad(local.getUTCDate())} ${pad(local.getUTCHours())}:${pad(local.getUTCMinutes())}`;
}
