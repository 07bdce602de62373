// When a booking may be: the same rule for a new booking and for a change to one, so an edit can
// never reach a window that a new request would be refused.

export const BOOKING_WINDOW = {
  /** The longest booking: two working weeks of a bench (lab policy, common practice, no source). */
  maxLengthDays: 14,
  /** How far ahead a booking may start: a year, so the calendar stays plannable (lab policy). */
  horizonDays: 365,
  /** A booking made at the counter starts "now": a few minutes of slack for the clock and typing. */
  pastSlackMin: 10,
} as const;

const DAY_MS = 24 * 3600_000;

/** Field errors for a booking window, empty when it is acceptable at `now`. */
export function bookingWindowErrors(startsAt: Date, endsAt: Date, now: Date): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  const add = (field: 'startsAt' | 'endsAt', message: string) => (errors[field] ??= []).push(message);
  const start = startsAt.getTime();
  const end = endsAt.getTime();
  if (!Number.isFinite(start)) add('startsAt', 'Pick a valid start');
  if (!Number.isFinite(end)) add('endsAt', 'Pick a valid end');
  if (Object.keys(errors).length > 0) return errors;
  if (end <= start) add('endsAt', 'The end must be after the start');
  else if (end - start > BOOKING_WINDOW.maxLengthDays * DAY_MS) add('endsAt', `A booking can last at most ${BOOKING_WINDOW.maxLengthDays} days`);
  if (end <= now.getTime()) add('endsAt', 'Pick an end in the future');
  if (start < now.getTime() - BOOKING_WINDOW.pastSlackMin * 60_000) add('startsAt', 'Pick a start from now on');
  if (start > now.getTime() + BOOKING_WINDOW.horizonDays * DAY_MS) add('startsAt', `Book at most ${BOOKING_WINDOW.horizonDays} days ahead`);
  return errors;
}
