// The release gate. `releaseCheck` gathers what the pure rules in shared/rules/release.ts read
// and serves both the release and GET /api/bookings/:id/release-check, so the screen and the
// gate say the same thing. Releasing is the only write that sets a booking to released.
import { ERROR_CODES } from '../../shared/errors';
import { approvalStanding, releaseFailures } from '../../shared/rules/release';
import type { Booking, ReleasePreview } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { ConflictError, NotFoundError } from '../errors';
import { labTimeZone } from '../mail/lab-time';
import { appendAudit, auditedTransaction } from './audit';
import { assertCounterAccess, canSeeBooking, lockBooking } from './booking-access';
import { assess, basisOf, entriesFor, loadItems, rowBasisInput } from './booking-assessment';
import { DECISIONS_SQL, decisionsOf, type DecisionColumns } from './booking-decisions';
import { clashingTags, lockItems } from './booking-holds';
import { planOf, type BookingRow } from './booking-rows';
import { getBooking } from './booking-view';
import { activeTemplates } from './checklists';
import type { ItemRow } from './item-rows';
import { labRulesFor } from './lab-rules';

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
    scannedItemIds: scans.map((s: { item_id: number }) => s.item_id),
    assessment,
    basis,
    approval,
    checklistEntries: entriesFor(templates, 'pre', row, items, rules),
    checklist: runs.pre,
    clashingTags: clashes,
    timeZone: labTimeZone(),
  });
  return { failures, assessment, basis, approval, rules, opensAt: new Date(new Date(row.starts_at).getTime() - rules.earlyPickupMin * 60_000) };
}

/** What release would answer now, for the screen before the last button (no locks, no writes). */
export async function previewRelease(db: Db, actor: SessionUser, id: number, now = new Date()): Promise<ReleasePreview> {
  const row = await db<BookingRow>('bookings').where({ id }).first();
  if (!row || !canSeeBooking(actor, row)) throw new NotFoundError(`No booking with id ${id}.`);
  const itemIds = (await db('booking_items').where({ booking_id: id }).pluck('item_id')) as number[];
  const { failures, opensAt } = await releaseCheck(
    db,
    row,
    await loadItems(
      db,
      [...itemIds].sort((a, b) => a - b),
    ),
    now,
  );
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
      throw new ConflictError(`Release refused: ${failures.length} rule${failures.length === 1 ? '' : 's'} not met.`, ERROR_CODES.releaseRefused, failures);
    }
    const approvedBy =
      approval && approvalStanding(approval, row.plan_version, basis).current ? { officer: approval.officerName, conditions: approval.conditions } : null;
    await trx('bookings')
      .where({ id })
      .update({
        status: 'released',
        released_at: now,
        assessment: JSON.stringify(assessment),
        approval_required: assessment.approvalRequired,
        updated_at: new Date(),
      });
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
