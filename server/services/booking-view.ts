// Reading bookings: one booking as its page shows it (`getBooking`, one query) and the list.
import { checklistCoverage } from '../../shared/rules/checklist-coverage';
import { rulesForPerson } from '../../shared/rules/lab-rules';
import type { Assessment } from '../../shared/schemas/assessment';
import { LIVE_STATUSES, type Booking, type BookingSummary, type LabRules } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { NotFoundError, ValidationError } from '../errors';
import { canSeeBooking, STAFF } from './booking-access';
import { approvalHolds, DECISIONS_SQL, decisionsOf, type DecisionColumns } from './booking-decisions';
import { isOverdue, json, planOf, type BookingRow } from './booking-rows';
import { activeTemplates, applicableEntries, type TemplateRow } from './checklists';
import { timestampToIso } from './dates';
import { toItemSummary } from './item-rows';
import { getLabRulesState } from './lab-rules';

// The booking's items (summary columns) with whether each was scanned for it, in tag order, as a
// JSON column of the same query: booking_scans' key is booking + item. DATE values come out as
// 'YYYY-MM-DD' text and DECIMAL as JSON numbers. A booking holds at most 30 items (the schema),
// a few kilobytes, far below the aggregate's group_concat_max_len (1 MB by default).
const ITEMS_SQL = `
  (SELECT JSON_ARRAYAGG(JSON_OBJECT('id', i.id, 'tag', i.tag, 'kind', i.kind, 'name', i.name, 'status', i.status,
      'status_reason', i.status_reason, 'rated_kv', i.rated_kv, 'location', i.location,
      'next_inspection_due', i.next_inspection_due, 'scanned', bs.item_id IS NOT NULL) ORDER BY i.tag)
    FROM booking_items AS bi JOIN items AS i ON i.id = bi.item_id
    LEFT JOIN booking_scans AS bs ON bs.booking_id = bi.booking_id AND bs.item_id = bi.item_id
    WHERE bi.booking_id = b.id) AS items_json`;

type BookedItem = Parameters<typeof toItemSummary>[0] & { scanned: boolean | number };
type ViewRow = BookingRow & DecisionColumns & { person_name: string; person_active: boolean; items_json: unknown };

function bookingView(row: ViewRow, templates: readonly TemplateRow[], rules: LabRules): Booking {
  const { approval, runs } = decisionsOf(row);
  const plan = planOf(row);
  const itemRows = row.items_json === null ? [] : json<BookedItem[]>(row.items_json);
  const kinds = [...new Set(itemRows.map((i) => i.kind as string))];
  const checklist = {
    pre: applicableEntries(templates, 'pre', plan.plannedKv, kinds, rules),
    return: applicableEntries(templates, 'return', plan.plannedKv, kinds, rules),
  };
  const runState = (phase: 'pre' | 'return') => {
    const run = runs[phase];
    if (!run) return null;
    // Counted against the lines in force now: a line added or changed since makes it incomplete.
    const coverage = checklistCoverage(checklist[phase], run.answers);
    return { completedAt: run.completedAt, withinLimits: coverage.withinLimits, complete: coverage.complete, gaps: coverage.gaps };
  };
  const overdue = isOverdue(row);
  const bookerActive = Boolean(row.person_active);
  return {
    id: row.id,
    personId: row.person_id,
    personName: row.person_name,
    bookerActive,
    status: row.status,
    overdue,
    needsReturn: row.status === 'released' && (overdue || !bookerActive),
    startsAt: timestampToIso(row.starts_at)!,
    endsAt: timestampToIso(row.ends_at)!,
    location: row.location,
    purpose: row.purpose,
    plan,
    planVersion: row.plan_version,
    itemIds: itemRows.map((i) => i.id),
    items: itemRows.map(toItemSummary),
    assessment: json<Assessment>(row.assessment),
    approvalRequired: Boolean(row.approval_required),
    approval: approval && {
      decision: approval.decision,
      officerName: approval.officerName,
      conditions: approval.conditions,
      reason: approval.reason,
      decidedAt: approval.decidedAt,
      planVersion: approval.planVersion,
      current: approvalHolds(approval, row.plan_version),
    },
    checklist,
    checklistRuns: { pre: runState('pre'), return: runState('return') },
    scannedItemIds: itemRows.flatMap((i) => (i.scanned ? [i.id] : [])),
    releasedAt: timestampToIso(row.released_at),
    returnedAt: timestampToIso(row.returned_at),
    cancelledAt: timestampToIso(row.cancelled_at),
    createdAt: timestampToIso(row.created_at)!,
  };
}

/** A booking as its page shows it: one query, whatever it holds (checklist lines and lab rules are shared reads). */
export async function getBooking(db: Db, actor: SessionUser, id: number): Promise<Booking> {
  const [row, templates, rules] = await Promise.all([
    db('bookings as b')
      .join('people as p', 'p.id', 'b.person_id')
      .where('b.id', id)
      .first('b.*', 'p.name as person_name', 'p.active as person_active', db.raw(DECISIONS_SQL), db.raw(ITEMS_SQL)) as Promise<ViewRow | undefined>,
    activeTemplates(db),
    getLabRulesState(db),
  ]);
  if (!row || !canSeeBooking(actor, row)) throw new NotFoundError(`No booking with id ${id}.`);
  return bookingView(row, templates, rulesForPerson(rules, row.person_id));
}

export async function listBookings(
  db: Db,
  actor: SessionUser,
  query: { mine?: string; status?: string; itemId?: number; cursor?: string; limit: number },
): Promise<{ bookings: BookingSummary[]; nextCursor: string | null }> {
  const mine = query.mine === '1' || query.mine === 'true' || !STAFF.includes(actor.role);
  // Only the summary's columns: the stored assessment JSON is kilobytes a row and not needed here.
  const builder = db('bookings as b')
    .join('people as p', 'p.id', 'b.person_id')
    // item_tags is kept on the booking row (see bookingItemTags), so a page is one index range.
    .select(
      'b.id',
      'b.person_id',
      'b.status',
      'b.starts_at',
      'b.ends_at',
      'b.location',
      'b.purpose',
      'b.planned_kv',
      'b.approval_required',
      'b.item_tags',
      'p.name as person_name',
    );
  if (mine) builder.where('b.person_id', actor.id);
  if (query.status === 'overdue') builder.where('b.status', 'released').andWhere('b.ends_at', '<', new Date());
  else if (query.status === 'live') builder.whereIn('b.status', LIVE_STATUSES);
  else if (query.status) builder.where('b.status', query.status);
  if (query.itemId) builder.whereExists(db('booking_items as bi').whereRaw('bi.booking_id = b.id').andWhere('bi.item_id', query.itemId));
  if (query.cursor) {
    const before = Number(query.cursor);
    if (!Number.isInteger(before) || before <= 0) throw new ValidationError('The page cursor is not valid.', { cursor: ['Invalid cursor'] });
    builder.where('b.id', '<', before);
  }
  const rows = await builder.orderBy('b.id', 'desc').limit(query.limit + 1);
  const page = rows.slice(0, query.limit);
  return {
    bookings: page.map((r) => ({
      id: r.id,
      personId: r.person_id,
      personName: r.person_name,
      status: r.status,
      overdue: isOverdue(r),
      startsAt: timestampToIso(r.starts_at)!,
      endsAt: timestampToIso(r.ends_at)!,
      location: r.location,
      purpose: r.purpose,
      plannedKv: Number(r.planned_kv),
      approvalRequired: Boolean(r.approval_required),
      itemTags: JSON.parse(r.item_tags) as string[],
    })),
    nextCursor: rows.length > query.limit ? String(page[page.length - 1]!.id) : null,
  };
}
