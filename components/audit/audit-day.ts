// The audit trail's day filter: a calendar day typed as YYYY-MM-DD, searched from its local
// midnight to the next, so "3 Dec" means the reader's 3 Dec wherever the server's clock is.

export type DayRange = { from: string; to: string };

/** The day's span as ISO instants, '' for no filter, or null when the text is not a real day. */
export function dayRange(text: string): DayRange | '' | null {
  const trimmed = text.trim();
  if (trimmed === '') return '';
  const match = /^(\d{4})-(\d{1,2})-(\d{1,2})$/.exec(trimmed);
  if (!match) return null;
  const [year, month, day] = match.slice(1).map(Number) as [number, number, number];
  const start = new Date(year, month - 1, day);
  if (start.getFullYear() !== year || start.getMonth() !== month - 1 || start.getDate() !== day) return null;
  // The next local midnight, not start + 24 h: a day with a clock change is 23 or 25 hours long.
  const end = new Date(year, month - 1, day + 1);
  return { from: start.toISOString(), to: end.toISOString() };
}
