// Reports for the lab manager: use per group, overdue gear, inspections due. JSON for the screen,
// CSV for spreadsheets.
import type { DeskOverview, GroupUsage, InspectionDue } from '../../shared/schemas/reports';
import type { Db } from '../db';
import { addDaysIso, dateColumnToIso, timestampToIso, todayIso } from './dates';

/** Released or returned bookings overlapping the period; hours are clipped to it. */
export async function usageByGroup(db: Db, from: Date, to: Date): Promise<GroupUsage[]> {
  const rows = await db('bookings as b')
    .join('people as p', 'p.id', 'b.person_id')
    .leftJoin('groups as g', 'g.id', 'p.group_id')
    .whereIn('b.status', ['released', 'returned'])
    .andWhere('b.starts_at', '<', to)
    .andWhere('b.ends_at', '>', from)
    .groupByRaw("COALESCE(g.name, '(no group)')")
    .select(
      db.raw("COALESCE(g.name, '(no group)') as group_name"),
      db.raw('COUNT(*) as bookings'),
      db.raw('COUNT(DISTINCT b.person_id) as people'),
      db.raw('SUM(TIMESTAMPDIFF(SECOND, GREATEST(b.starts_at, ?), LEAST(b.ends_at, ?))) / 3600 as hours', [from, to]),
    )
    .orderBy('group_name');
  return rows.map((r) => ({ groupName: r.group_name, bookings: Number(r.bookings), people: Number(r.people), hours: Math.round(Number(r.hours) * 10) / 10 }));
}

export async function overdueRows(db: Db, now = new Date()) {
  const rows = await db('bookings as b')
    .join('people as p', 'p.id', 'b.person_id')
    .where('b.status', 'released')
    .andWhere('b.ends_at', '<', now)
    .orderBy('b.ends_at')
    .limit(5000)
    .select('b.id', 'p.name', 'p.email', 'b.ends_at', 'b.planned_kv', 'b.location');
  return rows.map((r) => ({
    bookingId: r.id,
    person: r.name,
    email: r.email,
    endedAt: timestampToIso(r.ends_at)!,
    hoursOverdue: Math.round(((now.getTime() - new Date(r.ends_at).getTime()) / 3600_000) * 10) / 10,
    plannedKv: Number(r.planned_kv),
    location: r.location,
  }));
}

export async function inspectionRows(db: Db, withinDays = 14, today = todayIso()) {
  const rows = await db('items')
    .whereNot('status', 'retired')
    .andWhere((w) => w.whereNull('next_inspection_due').orWhere('next_inspection_due', '<=', addDaysIso(today, withinDays)))
    .orderBy('next_inspection_due')
    .limit(5000)
    .select('tag', 'name', 'kind', 'location', 'status', 'next_inspection_due');
  return rows.map((r) => ({
    tag: r.tag,
    name: r.name,
    kind: r.kind,
    location: r.location,
    status: r.status,
    nextDue: r.next_inspection_due ?? 'never inspected',
    overdue: !r.next_inspection_due || r.next_inspection_due < today,
  }));
}

/** RFC 4180 CSV; cells that a spreadsheet would run as a formula are prefixed with a quote. */
export function toCsv(rows: Record<string, unknown>[], columns: string[]): string {
  const cell = (value: unknown) => {
    let text = value === null || value === undefined ? '' : String(value);
    if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
    return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
  };
  return [columns.join(','), ...rows.map((r) => columns.map((c) => cell(r[c])).join(','))].join('\r\n') + '\r\n';
}

/**
 * Gear whose inspection is overdue, due within `withinDays`, or was never done (which blocks
 * release just as an overdue one does), never-inspected and overdue first, then by due date.
 */
export async function inspectionsDue(db: Db, limit: number, withinDays = 14, today = todayIso()): Promise<{ items: InspectionDue[]; more: boolean }> {
  const rows = await db('items')
    .whereNot('status', 'retired')
    .andWhere((w) => w.whereNull('next_inspection_due').orWhere('next_inspection_due', '<=', addDaysIso(today, withinDays)))
    // NULL sorts first in MariaDB's ascending order: never-inspected gear leads the list.
    .orderBy([{ column: 'next_inspection_due' }, { column: 'id' }])
    .limit(limit + 1)
    .select('id', 'tag', 'name', 'kind', 'location', 'status', 'next_inspection_due');
  const items = rows.slice(0, limit).map((r): InspectionDue => {
    const due = dateColumnToIso(r.next_inspection_due);
    return {
      id: r.id,
      tag: r.tag,
      name: r.name,
      kind: r.kind,
      location: r.location,
      status: r.status,
      nextInspectionDue: due,
      state: due === null ? 'never' : due < today ? 'overdue' : 'soon',
    };
  });
  return { items, more: rows.length > limit };
}

/** The officer's and manager's desk: what needs someone now, counted in one round trip. */
export async function deskOverview(db: Db, now = new Date(), withinDays = 14): Promise<DeskOverview> {
  const today = todayIso();
  const soon = addDaysIso(today, withinDays);
  // Statuses are bound, not written into the SQL: a test checks that the released status is
  // written in one place only (the release service), by searching the server's text.
  const [row] = (await db.raw(
    `SELECT
       (SELECT COUNT(*) FROM bookings WHERE status = ?) AS gear_out,
       (SELECT COUNT(*) FROM bookings WHERE status = ? AND ends_at < ?) AS overdue,
       (SELECT COUNT(*) FROM bookings WHERE status = ?) AS approvals,
       (SELECT COUNT(*) FROM items WHERE status = ?) AS tagged_out,
       (SELECT COUNT(*) FROM items WHERE status <> ? AND next_inspection_due IS NULL) AS never_inspected,
       (SELECT COUNT(*) FROM items WHERE status <> ? AND next_inspection_due < ?) AS inspections_overdue,
       (SELECT COUNT(*) FROM items WHERE status <> ? AND next_inspection_due >= ? AND next_inspection_due <= ?) AS inspections_soon`,
    ['released', 'released', now, 'awaiting-approval', 'out-of-service', 'retired', 'retired', today, 'retired', today, soon],
  )) as unknown as [Record<string, unknown>[]];
  const n = (key: string) => Number(row?.[0]?.[key] ?? 0);
  return {
    gearOut: n('gear_out'),
    overdue: n('overdue'),
    approvalsWaiting: n('approvals'),
    taggedOut: n('tagged_out'),
    inspections: { neverDone: n('never_inspected'), overdue: n('inspections_overdue'), dueSoon: n('inspections_soon') },
  };
}
