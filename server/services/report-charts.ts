// The figures behind the reports' charts (issue 17 point 3), each also a CSV: booked hours per
// group per week, released (energized) hours per group, overdue returns per week, inspections
// coming due over the next 12 weeks by kind, incidents per month by kind and severity.
// Weeks start on Monday, in UTC (ISO 8601 weeks); months are calendar months in UTC.
import type { ChartsReport } from '../../shared/schemas/report-charts';
import type { Db } from '../db';
import { addDaysIso, dateColumnToIso, todayIso } from './dates';

const HOUR_MS = 3600_000;
const DAY_MS = 24 * HOUR_MS;

/** The Monday (YYYY-MM-DD, UTC) of the ISO week holding `at`. */
export function weekStartIso(at: Date): string {
  const day = new Date(Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate()));
  const sinceMonday = (day.getUTCDay() + 6) % 7;
  return new Date(day.getTime() - sinceMonday * DAY_MS).toISOString().slice(0, 10);
}

export function monthIso(at: Date): string {
  return at.toISOString().slice(0, 7);
}

const round1 = (n: number) => Math.round(n * 10) / 10;

/**
 * Hours of [start, end) clipped to [from, to), split over the ISO weeks they fall in, so a
 * booking over a weekend counts in both weeks.
 */
export function hoursByWeek(start: Date, end: Date, from: Date, to: Date): Map<string, number> {
  const out = new Map<string, number>();
  let a = Math.max(start.getTime(), from.getTime());
  const b = Math.min(end.getTime(), to.getTime());
  while (a < b) {
    const week = weekStartIso(new Date(a));
    const next = Math.min(b, new Date(`${week}T00:00:00Z`).getTime() + 7 * DAY_MS);
    out.set(week, (out.get(week) ?? 0) + (next - a) / HOUR_MS);
    a = next;
  }
  return out;
}

function groupName(value: unknown): string {
  return typeof value === 'string' && value !== '' ? value : '(no group)';
}

export async function chartsReport(db: Db, from: Date, to: Date, now = new Date()): Promise<ChartsReport> {
  const bookings = await db('bookings as b')
    .join('people as p', 'p.id', 'b.person_id')
    .leftJoin('groups as g', 'g.id', 'p.group_id')
    .whereNotIn('b.status', ['cancelled', 'refused'])
    .andWhere('b.starts_at', '<', to)
    .andWhere('b.ends_at', '>', from)
    .limit(50_000)
    .select('b.status', 'b.starts_at', 'b.ends_at', 'b.released_at', 'b.returned_at', 'g.name as group_name');

  const booked = new Map<string, number>();
  const energized = new Map<string, number>();
  for (const b of bookings) {
    const group = groupName(b.group_name);
    for (const [week, hours] of hoursByWeek(new Date(b.starts_at), new Date(b.ends_at), from, to)) {
      const key = `${week}\u0000${group}`;
      booked.set(key, (booked.get(key) ?? 0) + hours);
    }
    // Released gear is out with its person and may be energized: from release to return (or now).
    if (b.released_at) {
      const end = b.returned_at ? new Date(b.returned_at) : now;
      let hours = 0;
      for (const h of hoursByWeek(new Date(b.released_at), end, from, to).values()) hours += h;
      energized.set(group, (energized.get(group) ?? 0) + hours);
    }
  }

  // A return is overdue when it came back after the end, or has not come back and the end passed.
  const overdueRows = await db('bookings')
    .whereIn('status', ['released', 'returned'])
    .andWhere('ends_at', '>=', from)
    .andWhere('ends_at', '<', to)
    .andWhere((w) => w.whereRaw('returned_at > ends_at').orWhere((o) => o.whereNull('returned_at').andWhere('ends_at', '<', now)))
    .limit(50_000)
    .select('ends_at');
  const overdue = new Map<string, number>();
  for (const r of overdueRows) {
    const week = weekStartIso(new Date(r.ends_at));
    overdue.set(week, (overdue.get(week) ?? 0) + 1);
  }

  const today = todayIso(now);
  const horizon = addDaysIso(today, 12 * 7);
  const dueRows = await db('items')
    .whereNot('status', 'retired')
    .andWhere((w) => w.whereNull('next_inspection_due').orWhere('next_inspection_due', '<', horizon))
    .limit(50_000)
    .select('kind', 'next_inspection_due');
  // Never inspected and overdue both block release now: they lead, in the current week.
  const thisWeek = weekStartIso(new Date(`${today}T00:00:00Z`));
  const due = new Map<string, { count: number; overdue: number; never: number }>();
  for (const r of dueRows) {
    const nextDue = dateColumnToIso(r.next_inspection_due);
    const week = nextDue === null || nextDue < today ? thisWeek : weekStartIso(new Date(`${nextDue}T00:00:00Z`));
    const key = `${week}\u0000${r.kind}`;
    const cell = due.get(key) ?? { count: 0, overdue: 0, never: 0 };
    cell.count += 1;
    if (nextDue === null) cell.never += 1;
    else if (nextDue < today) cell.overdue += 1;
    due.set(key, cell);
  }

  const incidentRows = await db('incidents')
    .where('occurred_at', '>=', from)
    .andWhere('occurred_at', '<', to)
    .limit(50_000)
    .select('occurred_at', 'kind', 'severity');
  const incidents = new Map<string, number>();
  for (const r of incidentRows) {
    const key = `${monthIso(new Date(r.occurred_at))}\u0000${r.kind}\u0000${r.severity}`;
    incidents.set(key, (incidents.get(key) ?? 0) + 1);
  }

  const split = (key: string) => key.split('\u0000') as [string, string, string?];
  return {
    from: from.toISOString(),
    to: to.toISOString(),
    bookedHours: [...booked]
      .map(([key, hours]) => ({ week: split(key)[0], groupName: split(key)[1], hours: round1(hours) }))
      .sort((a, b) => a.week.localeCompare(b.week) || a.groupName.localeCompare(b.groupName)),
    energizedHours: [...energized].map(([groupName, hours]) => ({ groupName, hours: round1(hours) })).sort((a, b) => a.groupName.localeCompare(b.groupName)),
    overdueReturns: [...overdue].map(([week, count]) => ({ week, count })).sort((a, b) => a.week.localeCompare(b.week)),
    inspectionsDue: [...due]
      .map(([key, cell]) => ({ week: split(key)[0], kind: split(key)[1], ...cell }))
      .sort((a, b) => a.week.localeCompare(b.week) || a.kind.localeCompare(b.kind)),
    incidents: [...incidents]
      .map(([key, count]) => ({ month: split(key)[0], kind: split(key)[1], severity: split(key)[2]!, count }))
      .sort((a, b) => a.month.localeCompare(b.month) || a.kind.localeCompare(b.kind) || a.severity.localeCompare(b.severity)),
  };
}
