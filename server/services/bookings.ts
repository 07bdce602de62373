// Bookings and the safety gate. Every state change runs in one transaction that locks the booking
// row first, then its items in id order, and appends its audit entry last (the audit chain lock),
// so concurrent requests queue instead of deadlocking.
import { approvalBasisOf, type ApprovalBasis } from '../../shared/rules/approval-basis';
import { assessSetup, type AssessedItem, type Assessment } from '../../shared/rules/assessment';
import { bookingWindowErrors } from '../../shared/rules/booking-window';
import { checklistCoverage } from '../../shared/rules/checklist-coverage';
import { approvalStanding, releaseFailures, returnFailures, type ApprovalRecord, type CompletedChecklist } from '../../shared/rules/release';
import {
  LIVE_STATUSES,
  type Booking,
  type BookingSummary,
  type BusyWindow,
  type ItemBooking,
  type BookingCreateInput,
  type BookingStatus,
  type BookingUpdateInput,
  type ChecklistAnswerRecord,
  type ReleasePreview,
  type ChecklistSubmitInput,
  type LabRules,
  type TestPlan,
} from '../../shared/schemas/bookings';
import type { ItemKind } from '../../shared/schemas/items';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { AppError, ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import { messages, type BookingFacts } from '../mail/messages';
import { enqueueMail } from '../mail/enqueue';
import { appendAudit, auditedTransaction } from './audit';
import { assertCounterAccess, canSeeBooking, lockBooking, STAFF } from './booking-access';
import { clashingTags, holdItems, itemTaken, lockItems } from './booking-holds';
import { bookingPhotoIdsAmong } from './booking-photos';
import { activeTemplates, applicableEntries, evaluateAnswers, type TemplateRow } from './checklists';
import { timestampToIso, todayIso } from './dates';
import { inspectionStateOf, tagOutInTransaction, toItemSummary, type ItemRow } from './item-rows';
import { getLabRulesState, labRulesFor } from './lab-rules';
import { rulesForPerson } from '../../shared/rules/lab-rules';
import { getQualification } from './qualifications';

export interface BookingRow {
  id: number;
  person_id: number;
  status: BookingStatus;
  starts_at: Date;
  ends_at: Date;
  location: string;
  purpose: string;
  planned_kv: number;
  polarity: TestPlan['polarity'];
  max_current_ma: number;
  people_present: number;
  plan_version: number;
  assessment: unknown;
  approval_required: boolean;
  released_at: Date | null;
  returned_at: Date | null;
  cancelled_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

const EDITABLE: BookingStatus[] = ['requested', 'awaiting-approval', 'approved', 'refused'];
const PRE_RELEASE: BookingStatus[] = ['requested', 'awaiting-approval', 'approved'];

const json = <T>(value: unknown): T => (typeof value === 'string' ? JSON.parse(value) : value) as T;

export function planOf(row: BookingRow): TestPlan {
  return { plannedKv: Number(row.planned_kv), polarity: row.polarity, maxCurrentMa: Number(row.max_current_ma), peoplePresent: row.people_present };
}

export function isOverdue(row: Pick<BookingRow, 'status' | 'ends_at'>, now = new Date()): boolean {
  return row.status === 'released' && new Date(row.ends_at).getTime() < now.getTime();
}

// ------------------------------------------------------------------------------------------
// Assessment inputs

function toAssessedItem(row: ItemRow): AssessedItem {
  return {
    id: row.id,
    tag: row.tag,
    name: row.name,
    kind: row.kind,
    ratedKv: row.rated_kv === null ? null : Number(row.rated_kv),
    ratings: json<Record<string, unknown>>(row.ratings),
    status: row.status,
    inspectionState: inspectionStateOf(row.next_inspection_due),
  };
}

async function loadItems(db: Db | Trx, itemIds: number[]): Promise<ItemRow[]> {
  const rows = (await db<ItemRow>('items').whereIn('id', itemIds).orderBy('id')) as ItemRow[];
  const missing = itemIds.filter((id) => !rows.some((r) => r.id === id));
  if (missing.length > 0) throw new ValidationError(`No item with id ${missing.join(', ')}.`, { itemIds: [`Unknown item ${missing.join(', ')}`] });
  return rows;
}

/** The assessment of a plan with these items for this person, under the lab rules that apply to them. */
export async function assess(db: Db | Trx, items: ItemRow[], plan: TestPlan, personId: number, rules?: LabRules): Promise<Assessment> {
  const [labRules, qualification] = await Promise.all([rules ?? labRulesFor(db, personId), getQualification(db, personId)]);
  return assessSetup({ items: items.map(toAssessedItem), plan, rules: labRules, qualification, today: todayIso() });
}

export async function assessPlan(db: Db, itemIds: number[], plan: TestPlan, personId: number): Promise<Assessment> {
  return assess(db, await loadItems(db, itemIds), plan, personId);
}

/** The booking as an approval records it, from its row (or a change to it) and its items now. */
function basisOf(booking: { plan: TestPlan; startsAt: Date; endsAt: Date; location: string; purpose: string }, items: ItemRow[], assessment: Assessment): ApprovalBasis {
  return approvalBasisOf(
    { plan: booking.plan, startsAt: booking.startsAt.toISOString(), endsAt: booking.endsAt.toISOString(), location: booking.location, purpose: booking.purpose },
    items.map(toAssessedItem),
    assessment,
  );
}

const rowBasisInput = (row: BookingRow) => ({ plan: planOf(row), startsAt: new Date(row.starts_at), endsAt: new Date(row.ends_at), location: row.location, purpose: row.purpose });

// ------------------------------------------------------------------------------------------
// Reading bookings


/** A completed checklist run as the gate reads it. */
interface StoredRun extends CompletedChecklist {
  withinLimits: boolean;
  completedAt: string;
}

/** What officers and members decided about a booking: its latest approval and checklist runs. */
interface Decisions {
  approval: (ApprovalRecord & { officerName: string; conditions: string | null; reason: string | null; decidedAt: string }) | null;
  /** The latest run of each phase for the booking's current plan. */
  runs: { pre: StoredRun | null; return: StoredRun | null };
}

// The latest approval and the current plan's latest checklist run of each phase, as JSON columns
// of a query on `bookings AS b`: each is one key lookup, and the booking's answer needs no query
// of its own for them. JSON_EXTRACT(…, '$') embeds a stored JSON document as JSON rather than as
// a string. Times go out as epoch milliseconds (UNIX_TIMESTAMP of a TIMESTAMP ignores the
// session's time zone).
const runSql = (phase: 'pre' | 'return') => `
  (SELECT JSON_OBJECT('planVersion', r.plan_version, 'withinLimits', r.within_limits,
      'completedAtMs', UNIX_TIMESTAMP(r.completed_at) * 1000, 'answers', JSON_EXTRACT(r.answers, '$'))
    FROM checklist_runs AS r WHERE r.booking_id = b.id AND r.phase = '${phase}' AND r.plan_version = b.plan_version
    ORDER BY r.id DESC LIMIT 1) AS ${phase}_run_json`;
const DECISIONS_SQL = `
  (SELECT JSON_OBJECT('decision', a.decision, 'officerName', o.name, 'conditions', a.conditions, 'reason', a.reason,
      'decidedAtMs', UNIX_TIMESTAMP(a.decided_at) * 1000, 'voided', a.voided_at IS NOT NULL, 'planVersion', a.plan_version,
      'basis', JSON_EXTRACT(a.basis, '$'))
    FROM approvals AS a JOIN people AS o ON o.id = a.officer_id WHERE a.booking_id = b.id ORDER BY a.id DESC LIMIT 1) AS approval_json,
  ${runSql('pre')},
  ${runSql('return')}`;

interface DecisionColumns {
  approval_json: unknown;
  pre_run_json: unknown;
  return_run_json: unknown;
}

function decisionsOf(row: DecisionColumns): Decisions {
  type Stored = { decision: 'approve' | 'refuse'; officerName: string; conditions: string | null; reason: string | null; decidedAtMs: number; voided: number | boolean; planVersion: number; basis: ApprovalBasis | null };
  type Run = { planVersion: number; withinLimits: number | boolean; completedAtMs: number; answers: ChecklistAnswerRecord[] | string };
  const a = row.approval_json === null ? null : json<Stored>(row.approval_json);
  const run = (value: unknown): StoredRun | null => {
    if (value === null || value === undefined) return null;
    const r = json<Run>(value);
    return { planVersion: r.planVersion, withinLimits: Boolean(r.withinLimits), completedAt: new Date(Number(r.completedAtMs)).toISOString(), answers: json<ChecklistAnswerRecord[]>(r.answers) };
  };
  return {
    approval: a && {
      decision: a.decision,
      planVersion: a.planVersion,
      voided: Boolean(a.voided),
      basis: a.basis === null ? null : json<ApprovalBasis>(a.basis),
      officerName: a.officerName,
      conditions: a.conditions,
      reason: a.reason,
      decidedAt: new Date(Number(a.decidedAtMs)).toISOString(),
    },
    runs: { pre: run(row.pre_run_json), return: run(row.return_run_json) },
  };
}

/** The decisions about a booking locked in this transaction: one query. */
async function decisionsInTransaction(trx: Trx, id: number): Promise<Decisions> {
  const columns = (await trx('bookings as b').where('b.id', id).first(trx.raw(DECISIONS_SQL))) as DecisionColumns;
  return decisionsOf(columns);
}

/** An approval counts for the view while it is an approval of the current plan version that nothing voided. */
const approvalHolds = (approval: Decisions['approval'], planVersion: number) => Boolean(approval && approval.decision === 'approve' && !approval.voided && approval.planVersion === planVersion);

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
  const checklist = { pre: applicableEntries(templates, 'pre', plan.plannedKv, kinds, rules), return: applicableEntries(templates, 'return', plan.plannedKv, kinds, rules) };
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
    db('bookings as b').join('people as p', 'p.id', 'b.person_id').where('b.id', id).first('b.*', 'p.name as person_name', 'p.active as person_active', db.raw(DECISIONS_SQL), db.raw(ITEMS_SQL)) as Promise<ViewRow | undefined>,
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
    .select('b.id', 'b.person_id', 'b.status', 'b.starts_at', 'b.ends_at', 'b.location', 'b.purpose', 'b.planned_kv', 'b.approval_required', 'b.item_tags', 'p.name as person_name');
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

/** Live bookings holding an item in a window: what the booking form shows as availability. */
export async function itemAvailability(db: Db, itemId: number, from: Date, to: Date): Promise<BusyWindow[]> {
  const rows = await db('booking_items as bi')
    .join('bookings as b', 'b.id', 'bi.booking_id')
    .join('people as p', 'p.id', 'b.person_id')
    .where('bi.item_id', itemId)
    .andWhere('bi.live', true)
    .andWhere('bi.starts_at', '<', to)
    .andWhere('bi.ends_at', '>', from)
    .orderBy('bi.starts_at')
    .select('b.id', 'b.status', 'bi.starts_at', 'bi.ends_at', 'p.name as person_name');
  return rows.map((r) => ({ bookingId: r.id, status: r.status, startsAt: timestampToIso(r.starts_at)!, endsAt: timestampToIso(r.ends_at)!, personName: r.person_name }));
}

// ------------------------------------------------------------------------------------------
// Writing bookings

export interface MailContext {
  publicUrl: string;
}

async function factsFor(trx: Trx, bookingId: number): Promise<BookingFacts & { personEmail: string; personId: number }> {
  const b = await trx('bookings as b').join('people as p', 'p.id', 'b.person_id').where('b.id', bookingId).first('b.id', 'b.person_id', 'b.ends_at', 'b.planned_kv', 'b.purpose', 'b.item_tags', 'p.name', 'p.email');
  return { id: b.id, personId: b.person_id, personName: b.name, personEmail: b.email, plannedKv: Number(b.planned_kv), purpose: b.purpose, endsAt: timestampToIso(b.ends_at)!, itemTags: JSON.parse(b.item_tags) as string[] };
}

/** Approval requests go to every active officer except the booker, once per plan version. */
async function notifyOfficers(trx: Trx, bookingId: number, planVersion: number, assessment: Assessment, mail: MailContext): Promise<void> {
  const facts = await factsFor(trx, bookingId);
  const officers = await trx('people').where({ role: 'officer', active: true }).whereNot('id', facts.personId).select('id', 'email');
  const content = messages.approvalRequested(mail.publicUrl, facts, assessment.approvalReasons.map((r) => r.message));
  for (const officer of officers) {
    await enqueueMail(trx, { kind: 'approval-requested', to: officer.email, dedupeKey: `approval-requested:${bookingId}:${planVersion}:${officer.id}`, ...content });
  }
}

/**
 * The booking row's copy of its items' tags, in tag order, written whenever its items are: the
 * bookings list shows them on every row without touching booking_items.
 */
export function bookingItemTags(items: readonly { tag: string }[]): string {
  return JSON.stringify(items.map((i) => i.tag).sort());
}

function assertWindow(startsAt: Date, endsAt: Date): void {
  const errors = bookingWindowErrors(startsAt, endsAt, new Date());
  if (Object.keys(errors).length > 0) throw new ValidationError(Object.values(errors)[0]![0]!, errors);
}

function statusFor(assessment: Assessment): BookingStatus {
  return assessment.approvalRequired ? 'awaiting-approval' : 'requested';
}

/**
 * Voids the booking's standing approval (if any) because what it covered changed, in the
 * caller's transaction: audited with what changed. The caller bumps the plan version.
 */
async function voidApproval(trx: Trx, actorId: number, row: BookingRow, planVersion: number, changes: string[]): Promise<void> {
  const voided = await trx('approvals').where({ booking_id: row.id }).whereNull('voided_at').update({ voided_at: new Date() });
  if (voided === 0) return;
  await appendAudit(trx, { actorId, entity: 'booking', entityId: row.id, action: 'approval.voided', before: { status: row.status, planVersion: row.plan_version }, after: { planVersion, changes } });
}

export async function createBooking(db: Db, actor: SessionUser, input: BookingCreateInput, mail: MailContext): Promise<Booking> {
  const startsAt = new Date(input.startsAt);
  const endsAt = new Date(input.endsAt);
  assertWindow(startsAt, endsAt);
  // A clash already committed is refused without a transaction or a lock: when many people
  // reach for the same gear at once, the losers no longer queue behind the item locks.
  // holdItems below still decides every race this one cannot see.
  const taken = await clashingTags(db, input.itemIds, startsAt, endsAt);
  if (taken.length > 0) throw itemTaken(taken);
  const id = await auditedTransaction(db, async (trx) => {
    // The booker's row, shared-locked first: a deactivation (which takes it exclusively, after
    // the person's open bookings) either waits for this booking and cancels it, or has already
    // committed and this request is refused.
    const booker = await trx('people').where({ id: actor.id }).forShare().first('active');
    if (!booker?.active) throw new ForbiddenError('Your account is not active.');
    const items = await holdItems(trx, input.itemIds, { startsAt, endsAt });
    const assessment = await assess(trx, items, input.plan, actor.id);
    const record = {
      person_id: actor.id,
      status: statusFor(assessment),
      starts_at: startsAt,
      ends_at: endsAt,
      location: input.location,
      purpose: input.purpose,
      planned_kv: input.plan.plannedKv,
      polarity: input.plan.polarity,
      max_current_ma: input.plan.maxCurrentMa,
      people_present: input.plan.peoplePresent,
      assessment: JSON.stringify(assessment),
      approval_required: assessment.approvalRequired,
      item_tags: bookingItemTags(items),
    };
    const [bookingId] = (await trx('bookings').insert(record)) as [number];
    await trx('booking_items').insert(items.map((i) => ({ booking_id: bookingId, item_id: i.id, starts_at: startsAt, ends_at: endsAt, live: true })));
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'booking.created',
      after: { status: record.status, itemIds: items.map((i) => i.id), startsAt: input.startsAt, endsAt: input.endsAt, location: input.location, purpose: input.purpose, plan: input.plan, approvalReasons: assessment.approvalReasons.map((r) => r.code) },
    });
    if (record.status === 'awaiting-approval') await notifyOfficers(trx, bookingId, 1, assessment, mail);
    return bookingId;
  });
  return getBooking(db, actor, id);
}

const sameIds = (a: readonly number[], b: readonly number[]) => [...a].sort((x, y) => x - y).join() === [...b].sort((x, y) => x - y).join();

export async function updateBooking(db: Db, actor: SessionUser, id: number, input: BookingUpdateInput, mail: MailContext): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    if (row.person_id !== actor.id) throw new ForbiddenError('Only the person who booked can change the booking.');
    if (!EDITABLE.includes(row.status)) throw new ConflictError(`A ${row.status} booking cannot be changed.`, 'BOOKING_LOCKED');
    // The booking row is locked, so its item set cannot change under us.
    const currentItems = (await trx('booking_items').where({ booking_id: id }).select('item_id')).map((r) => r.item_id as number);
    const itemIds = input.itemIds ?? currentItems;
    const startsAt = input.startsAt ? new Date(input.startsAt) : new Date(row.starts_at);
    const endsAt = input.endsAt ? new Date(input.endsAt) : new Date(row.ends_at);
    const location = input.location ?? row.location;
    const purpose = input.purpose ?? row.purpose;
    const plan = input.plan ?? planOf(row);
    const itemsChanged = !sameIds(itemIds, currentItems);
    const windowChanged = startsAt.getTime() !== new Date(row.starts_at).getTime() || endsAt.getTime() !== new Date(row.ends_at).getTime();
    const planChanged = JSON.stringify(plan) !== JSON.stringify(planOf(row));
    const detailsChanged = location !== row.location || purpose !== row.purpose;
    // The merged window is checked exactly as a new booking's would be.
    if (windowChanged) assertWindow(startsAt, endsAt);
    // Everything an approval covers bumps the version: an officer's decision binds to one version.
    const bumps = itemsChanged || windowChanged || planChanged || detailsChanged;
    const reholds = itemsChanged || windowChanged || row.status === 'refused';
    const items = reholds
      ? await holdItems(trx, itemIds, { startsAt, endsAt }, { exceptBookingId: id, lockAlso: currentItems })
      : await lockItems(trx, itemIds);
    const assessment = await assess(trx, items, plan, row.person_id);
    const status = bumps || row.status === 'refused' ? statusFor(assessment) : row.status;
    const planVersion = bumps ? row.plan_version + 1 : row.plan_version;
    await trx('bookings').where({ id }).update({
      status,
      starts_at: startsAt,
      ends_at: endsAt,
      location,
      purpose,
      planned_kv: plan.plannedKv,
      polarity: plan.polarity,
      max_current_ma: plan.maxCurrentMa,
      people_present: plan.peoplePresent,
      plan_version: planVersion,
      assessment: JSON.stringify(assessment),
      approval_required: assessment.approvalRequired,
      item_tags: bookingItemTags(items),
      updated_at: new Date(),
    });
    if (bumps) {
      const changes = [itemsChanged && 'items', windowChanged && 'window', planChanged && 'plan', location !== row.location && 'location', purpose !== row.purpose && 'purpose'].filter((c): c is string => Boolean(c));
      await voidApproval(trx, actor.id, row, planVersion, changes);
      await trx('booking_scans').where({ booking_id: id }).whereNotIn('item_id', itemIds).delete();
    }
    if (reholds) {
      await trx('booking_items').where({ booking_id: id }).delete();
      await trx('booking_items').insert(items.map((i) => ({ booking_id: id, item_id: i.id, starts_at: startsAt, ends_at: endsAt, live: true })));
    }
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: id,
      action: bumps ? 'booking.plan-changed' : 'booking.updated',
      before: { status: row.status, planVersion: row.plan_version, itemIds: currentItems, startsAt: row.starts_at, endsAt: row.ends_at, plan: planOf(row), location: row.location, purpose: row.purpose },
      after: { status, planVersion, itemIds, startsAt, endsAt, plan, location, purpose },
    });
    if (status === 'awaiting-approval' && (bumps || row.status === 'refused')) await notifyOfficers(trx, id, planVersion, assessment, mail);
  });
  return getBooking(db, actor, id);
}

export async function cancelBooking(db: Db, actor: SessionUser, id: number): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    if (!canSeeBooking(actor, row)) throw new NotFoundError(`No booking with id ${id}.`);
    if (row.person_id !== actor.id && !STAFF.includes(actor.role)) throw new ForbiddenError();
    if (!EDITABLE.includes(row.status)) throw new ConflictError(`A ${row.status} booking cannot be cancelled.`, 'BOOKING_LOCKED');
    await trx('bookings').where({ id }).update({ status: 'cancelled', cancelled_at: new Date(), updated_at: new Date() });
    await trx('booking_items').where({ booking_id: id }).update({ live: false });
    await appendAudit(trx, { actorId: actor.id, entity: 'booking', entityId: id, action: 'booking.cancelled', before: { status: row.status }, after: { status: 'cancelled' } });
  });
  return getBooking(db, actor, id);
}

export async function decideApproval(
  db: Db,
  actor: SessionUser,
  id: number,
  input: { decision: 'approve' | 'refuse'; planVersion?: number; conditions?: string; reason?: string },
  mail: MailContext,
): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    // Nobody approves their own test, whatever their role.
    if (row.person_id === actor.id) throw new ForbiddenError('You cannot decide on your own booking; another officer must.');
    if (row.status !== 'awaiting-approval') throw new ConflictError(`Only bookings awaiting approval can be decided; this one is ${row.status}.`, 'NOT_AWAITING_APPROVAL');
    // The decision binds to the version the officer read, never to whatever is current at the click.
    if (input.planVersion !== undefined && input.planVersion !== row.plan_version) {
      throw new ConflictError(`The plan changed while you were reviewing it (version ${input.planVersion} → ${row.plan_version}). Read it again before deciding.`, 'PLAN_CHANGED');
    }
    // What the officer approves, recorded as it stands under the locks: release compares it with the booking then.
    const itemIds = (await trx('booking_items').where({ booking_id: id }).select('item_id')).map((r) => r.item_id as number);
    const items = await lockItems(trx, itemIds);
    const assessment = await assess(trx, items, planOf(row), row.person_id);
    const basis = basisOf(rowBasisInput(row), items, assessment);
    await trx('approvals').insert({
      booking_id: id,
      officer_id: actor.id,
      decision: input.decision,
      conditions: input.conditions || null,
      reason: input.reason || null,
      plan_version: row.plan_version,
      basis: JSON.stringify(basis),
    });
    const status: BookingStatus = input.decision === 'approve' ? 'approved' : 'refused';
    await trx('bookings').where({ id }).update({ status, updated_at: new Date() });
    if (status === 'refused') await trx('booking_items').where({ booking_id: id }).update({ live: false });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: id,
      action: input.decision === 'approve' ? 'approval.granted' : 'approval.refused',
      before: { status: row.status },
      after: { status, planVersion: row.plan_version, conditions: input.conditions ?? null, reason: input.reason ?? null, basis },
    });
    const facts = await factsFor(trx, id);
    const note = (input.decision === 'approve' ? input.conditions : input.reason) || null;
    await enqueueMail(trx, { kind: 'approval-decided', to: facts.personEmail, ...messages.approvalDecided(mail.publicUrl, facts, input.decision, actor.name, note) });
  });
  return getBooking(db, actor, id);
}

export async function recordScan(db: Db, actor: SessionUser, id: number, tag: string): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    assertCounterAccess(actor, row);
    if (!PRE_RELEASE.includes(row.status)) throw new ConflictError(`Scanning is for release; this booking is ${row.status}.`, 'BOOKING_LOCKED');
    // The item, whether the booking holds it and whether it was scanned already, in one round trip.
    const item = (await trx('items as i')
      .leftJoin('booking_items as bi', (j) => j.on('bi.item_id', 'i.id').andOnVal('bi.booking_id', id))
      .leftJoin('booking_scans as bs', (j) => j.on('bs.item_id', 'i.id').andOnVal('bs.booking_id', id))
      .where('i.tag', tag.trim().toUpperCase())
      .first('i.id', 'i.tag', 'bi.item_id as booked', 'bs.item_id as scanned')) as { id: number; tag: string; booked: number | null; scanned: number | null } | undefined;
    if (!item) throw new NotFoundError(`No gear carries the tag ${tag}.`);
    if (item.booked === null) throw new AppError(409, 'ITEM_NOT_IN_BOOKING', `${item.tag} is not part of this booking. Put it back and scan the booked gear.`);
    if (item.scanned === null) {
      await trx('booking_scans').insert({ booking_id: id, item_id: item.id, scanned_by: actor.id });
      await appendAudit(trx, { actorId: actor.id, entity: 'booking', entityId: id, action: 'booking.item-scanned', after: { itemId: item.id, tag: item.tag } });
    }
  });
  return getBooking(db, actor, id);
}

export async function submitChecklist(db: Db, actor: SessionUser, id: number, input: ChecklistSubmitInput): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    assertCounterAccess(actor, row);
    if (input.phase === 'pre' && !PRE_RELEASE.includes(row.status)) throw new ConflictError(`The pre-energize checklist is for release; this booking is ${row.status}.`, 'BOOKING_LOCKED');
    if (input.phase === 'return' && row.status !== 'released') throw new ConflictError('The make-safe checklist is for returning released gear.', 'BOOKING_LOCKED');
    const [templates, rules, kinds] = await Promise.all([
      activeTemplates(trx),
      labRulesFor(trx, row.person_id),
      trx('booking_items as bi').join('items as i', 'i.id', 'bi.item_id').where('bi.booking_id', id).distinct('i.kind'),
    ]);
    const entries = applicableEntries(templates, input.phase, Number(row.planned_kv), kinds.map((k: { kind: ItemKind }) => k.kind), rules);
    const fileIds = input.answers.map((a) => a.fileId).filter((f): f is number => f !== undefined);
    const evaluated = evaluateAnswers(entries, input.answers, await bookingPhotoIdsAmong(trx, id, fileIds));
    const [runId] = (await trx('checklist_runs').insert({
      booking_id: id,
      phase: input.phase,
      plan_version: row.plan_version,
      answers: JSON.stringify(evaluated.snapshot),
      complete: evaluated.complete,
      within_limits: evaluated.withinLimits,
      completed_by: actor.id,
    })) as [number];
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: id,
      action: `checklist.${input.phase}-completed`,
      after: { runId, planVersion: row.plan_version, withinLimits: evaluated.withinLimits, answers: evaluated.snapshot },
    });
  });
  return getBooking(db, actor, id);
}

/** The lines of a phase that apply to a booking now, from its plan and the kinds of its items. */
function entriesFor(templates: readonly TemplateRow[], phase: 'pre' | 'return', row: BookingRow, items: readonly { kind: ItemKind }[], rules: LabRules) {
  return applicableEntries(templates, phase, Number(row.planned_kv), [...new Set(items.map((i) => i.kind))], rules);
}

/**
 * The release rules on the booking as it stands: the gear, the person, the lab rules that apply
 * to them, the lines in force, the approval and the checklist run, read through `q`. The release
 * runs it inside its transaction after locking the booking and its items; the release screen asks
 * for it beforehand (GET /api/bookings/:id/release-check), so both say the same thing.
 */
async function releaseCheck(q: Db | Trx, row: BookingRow, items: ItemRow[], now: Date) {
  const itemIds = items.map((i) => i.id);
  const [rules, templates, booker, scans, { approval, runs }, clashes] = await Promise.all([
    labRulesFor(q, row.person_id),
    activeTemplates(q),
    q('people').where({ id: row.person_id }).first('active'),
    q('booking_scans').where({ booking_id: row.id }).select('item_id'),
    decisionsOf((await q('bookings as b').where('b.id', row.id).first(q.raw(DECISIONS_SQL))) as DecisionColumns),
    clashingTags(q, itemIds, new Date(row.starts_at), new Date(row.ends_at), row.id),
  ]);
  const assessment = await assess(q, items, planOf(row), row.person_id, rules);
  const basis = basisOf(rowBasisInput(row), items, assessment);
  const failures = releaseFailures({
    status: row.status,
    bookerActive: Boolean(booker?.active),
    now,
    startsAt: new Date(row.starts_at),
    endsAt: new Date(row.ends_at),
    earlyPickupMin: rules.earlyPickupMin,
    planVersion: row.plan_version,
    itemIds,
    scannedItemIds: scans.map((s: { item_id: number }) => s.item_id),
    assessment,
    basis,
    approval,
    checklistEntries: entriesFor(templates, 'pre', row, items, rules),
    checklist: runs.pre,
    clashingTags: clashes,
  });
  return { failures, assessment, basis, approval, rules, opensAt: new Date(new Date(row.starts_at).getTime() - rules.earlyPickupMin * 60_000) };
}

/** What release would answer now, for the screen before the last button (no locks, no writes). */
export async function previewRelease(db: Db, actor: SessionUser, id: number, now = new Date()): Promise<ReleasePreview> {
  const row = await db<BookingRow>('bookings').where({ id }).first();
  if (!row || !canSeeBooking(actor, row)) throw new NotFoundError(`No booking with id ${id}.`);
  const itemIds = (await db('booking_items').where({ booking_id: id }).pluck('item_id')) as number[];
  const { failures, opensAt } = await releaseCheck(db, row, await loadItems(db, [...itemIds].sort((a, b) => a - b)), now);
  return { failures, opensAt: opensAt.toISOString(), checkedAt: now.toISOString() };
}

export async function releaseBooking(db: Db, actor: SessionUser, id: number, now = new Date()): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    assertCounterAccess(actor, row);
    const itemIds = (await trx('booking_items').where({ booking_id: id }).orderBy('item_id').select('item_id')).map((r) => r.item_id as number);
    // Everything the check reads is read under the booking and item locks, at READ COMMITTED:
    // the gear, the person, the rules and the lines as they are now, not as they were when booked.
    const items = await lockItems(trx, itemIds);
    const { failures, assessment, basis, approval, rules } = await releaseCheck(trx, row, items, now);
    if (failures.length > 0) {
      throw new ConflictError(`Release refused: ${failures.length} rule${failures.length === 1 ? '' : 's'} not met.`, 'RELEASE_REFUSED', failures);
    }
    const approvedBy = approval && approvalStanding(approval, row.plan_version, basis).current ? { officer: approval.officerName, conditions: approval.conditions } : null;
    await trx('bookings').where({ id }).update({ status: 'released', released_at: now, assessment: JSON.stringify(assessment), approval_required: assessment.approvalRequired, updated_at: new Date() });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: id,
      action: 'booking.released',
      before: { status: row.status },
      after: { status: 'released', planVersion: row.plan_version, plannedKv: Number(row.planned_kv), itemIds, approval: approvedBy, basis, rules },
    });
  });
  return getBooking(db, actor, id);
}

export async function returnBooking(db: Db, actor: SessionUser, id: number, input: { damagedItemIds: number[]; notes: string }): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    assertCounterAccess(actor, row);
    if (row.status !== 'released') throw new ConflictError(`Only released gear can be returned; this booking is ${row.status}.`, 'BOOKING_LOCKED');
    const itemIds = (await trx('booking_items').where({ booking_id: id }).orderBy('item_id').select('item_id')).map((r) => r.item_id as number);
    const stray = input.damagedItemIds.filter((d) => !itemIds.includes(d));
    if (stray.length > 0) throw new ValidationError(`Items ${stray.join(', ')} are not part of this booking.`, { damagedItemIds: ['Only items of this booking'] });
    const items = await lockItems(trx, itemIds);
    const [rules, templates, { runs }] = await Promise.all([labRulesFor(trx, row.person_id), activeTemplates(trx), decisionsInTransaction(trx, id)]);
    const failures = returnFailures({ status: row.status, planVersion: row.plan_version, checklistEntries: entriesFor(templates, 'return', row, items, rules), checklist: runs.return });
    if (failures.length > 0) throw new ConflictError('Return refused: the gear is not yet made safe.', 'RETURN_REFUSED', failures);

    for (const itemId of input.damagedItemIds) {
      await trx('incidents').insert({ booking_id: id, item_id: itemId, kind: 'damage', description: input.notes, reported_by: actor.id });
      await tagOutInTransaction(trx, actor.id, itemId, `Damaged on return of booking ${id}: ${input.notes}`, 'item.tagged-out-at-return');
    }
    const now = new Date();
    await trx('bookings').where({ id }).update({ status: 'returned', returned_at: now, updated_at: now });
    await trx('booking_items').where({ booking_id: id }).update({ live: false });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: id,
      action: 'booking.returned',
      before: { status: 'released' },
      after: { status: 'returned', damagedItemIds: input.damagedItemIds, notes: input.notes, late: now > new Date(row.ends_at) },
    });
  });
  return getBooking(db, actor, id);
}

/** Open bookings holding an item. */
function openBookingsHolding(trx: Trx, itemId: number): Promise<number[]> {
  return trx('booking_items as bi')
    .join('bookings as b', 'b.id', 'bi.booking_id')
    .where('bi.item_id', itemId)
    .andWhere('bi.live', true)
    .whereIn('b.status', PRE_RELEASE)
    .orderBy('b.id')
    .pluck('b.id');
}

/**
 * Before an item's ratings change: locks the rows of the open bookings holding it, in id order,
 * so the edit takes its locks in the gate's order (bookings, then items) and never deadlocks
 * against a release or a change of one of those bookings.
 */
export async function lockBookingsHolding(trx: Trx, itemId: number): Promise<void> {
  const ids = await openBookingsHolding(trx, itemId);
  if (ids.length > 0) await trx('bookings').whereIn('id', ids).orderBy('id').forUpdate().select('id');
}

/**
 * An item's ratings changed (server/services/items.ts, in its transaction, with the item row
 * locked): every booking that holds it and is not yet released is assessed again under a new plan
 * version, so an officer's approval or a checklist answered for the old figures no longer counts
 * and an officer reviewing the booking must read it again.
 */
export async function replanBookingsHolding(trx: Trx, actor: SessionUser, itemId: number, mail: MailContext): Promise<number[]> {
  const affected = await openBookingsHolding(trx, itemId);
  for (const bookingId of affected) {
    // Locked already by lockBookingsHolding, except a booking that took the item while this
    // edit waited for the item lock; a deadlock there is retried (server/services/audit.ts).
    const row = await lockBooking(trx, bookingId);
    if (!PRE_RELEASE.includes(row.status)) continue;
    const itemIds = (await trx('booking_items').where({ booking_id: bookingId }).select('item_id')).map((r) => r.item_id as number);
    const items = await lockItems(trx, itemIds);
    const assessment = await assess(trx, items, planOf(row), row.person_id);
    const status = statusFor(assessment);
    const planVersion = row.plan_version + 1;
    await trx('bookings').where({ id: bookingId }).update({ status, plan_version: planVersion, assessment: JSON.stringify(assessment), approval_required: assessment.approvalRequired, updated_at: new Date() });
    await voidApproval(trx, actor.id, row, planVersion, [`item ${itemId} ratings`]);
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'booking.gear-changed',
      before: { status: row.status, planVersion: row.plan_version },
      after: { status, planVersion, itemId },
    });
    if (status === 'awaiting-approval') await notifyOfficers(trx, bookingId, planVersion, assessment, mail);
  }
  return affected;
}

/**
 * Before a person's row is locked to deactivate them: locks their open bookings, in id order.
 * Counter writes lock a booking and then, through their rows' foreign keys, share-lock the
 * person; taking the bookings first keeps that order, so the two never deadlock.
 */
export async function lockOpenBookingsOf(trx: Trx, personId: number): Promise<void> {
  const ids = (await trx('bookings').where({ person_id: personId }).whereIn('status', EDITABLE).pluck('id')) as number[];
  if (ids.length > 0) await trx('bookings').whereIn('id', ids).orderBy('id').forUpdate().select('id');
}

/**
 * A person was deactivated (in the caller's transaction, person row locked): their bookings not
 * yet released are cancelled, and officers are told once. Gear already out stays out until it is
 * returned; the booking shows it as needing return.
 */
export async function cancelOpenBookingsOf(trx: Trx, actor: SessionUser, personId: number, mail: MailContext): Promise<number[]> {
  const open = (await trx('bookings').where({ person_id: personId }).whereIn('status', EDITABLE).orderBy('id').pluck('id')) as number[];
  const cancelled: number[] = [];
  for (const bookingId of open) {
    const row = await lockBooking(trx, bookingId);
    if (!EDITABLE.includes(row.status)) continue;
    await trx('bookings').where({ id: bookingId }).update({ status: 'cancelled', cancelled_at: new Date(), updated_at: new Date() });
    await trx('booking_items').where({ booking_id: bookingId }).update({ live: false });
    await appendAudit(trx, { actorId: actor.id, entity: 'booking', entityId: bookingId, action: 'booking.cancelled-on-deactivation', before: { status: row.status }, after: { status: 'cancelled', personId } });
    cancelled.push(bookingId);
  }
  if (cancelled.length > 0) {
    const person = await trx('people').where({ id: personId }).first('name');
    const officers = await trx('people').where({ role: 'officer', active: true }).whereNot('id', personId).select('id', 'email');
    const content = messages.bookingsCancelledOnDeactivation(mail.publicUrl, String(person?.name ?? `Person ${personId}`), cancelled);
    for (const officer of officers) {
      await enqueueMail(trx, { kind: 'bookings-cancelled', to: officer.email, dedupeKey: `deactivated:${personId}:${cancelled.join('-')}:${officer.id}`, ...content });
    }
  }
  return cancelled;
}

/** An item's booking history for its page (newest first). */
export async function itemBookingHistory(db: Db, itemId: number, limit = 50): Promise<ItemBooking[]> {
  const rows = await db('booking_items as bi')
    .join('bookings as b', 'b.id', 'bi.booking_id')
    .join('people as p', 'p.id', 'b.person_id')
    .where('bi.item_id', itemId)
    .orderBy('b.id', 'desc')
    .limit(limit)
    .select('b.id', 'b.person_id', 'b.status', 'b.starts_at', 'b.ends_at', 'b.planned_kv', 'p.name as person_name');
  return rows.map((r) => ({
    bookingId: r.id,
    personId: r.person_id as number,
    status: r.status as BookingStatus,
    overdue: isOverdue(r),
    startsAt: timestampToIso(r.starts_at)!,
    endsAt: timestampToIso(r.ends_at)!,
    plannedKv: Number(r.planned_kv),
    personName: r.person_name as string,
  }));
}
