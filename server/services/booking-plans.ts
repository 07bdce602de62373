// A member's booking: created, changed and cancelled. Every write runs in one audited
// transaction that locks the booking row first, then its items in id order (holdItems), so
// concurrent requests queue instead of deadlocking.
import { ERROR_CODES } from '../../shared/errors';
import { bookingWindowErrors } from '../../shared/rules/booking-window';
import { OPEN_STATUSES, type Booking, type BookingCreateInput, type BookingUpdateInput } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import { appendAudit, auditedTransaction } from './audit';
import { canSeeBooking, lockBooking, STAFF } from './booking-access';
import { assess, statusFor } from './booking-assessment';
import { clashingTags, holdItems, itemTaken, lockItems } from './booking-holds';
import { notifyOfficers } from './booking-mail';
import { bookingItemTags, planOf, type BookingRow, type MailContext } from './booking-rows';
import { getBooking } from './booking-view';

function assertWindow(startsAt: Date, endsAt: Date): void {
  const errors = bookingWindowErrors(startsAt, endsAt, new Date());
  if (Object.keys(errors).length > 0) throw new ValidationError(Object.values(errors)[0]![0]!, errors);
}

/**
 * Voids the booking's standing approval (if any) because what it covered changed, in the
 * caller's transaction: audited with what changed. The caller bumps the plan version.
 */
export async function voidApproval(trx: Trx, actorId: number, row: BookingRow, planVersion: number, changes: string[]): Promise<void> {
  const voided = await trx('approvals').where({ booking_id: row.id }).whereNull('voided_at').update({ voided_at: new Date() });
  if (voided === 0) return;
  await appendAudit(trx, {
    actorId,
    entity: 'booking',
    entityId: row.id,
    action: 'approval.voided',
    before: { status: row.status, planVersion: row.plan_version },
    after: { planVersion, changes },
  });
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
      after: {
        status: record.status,
        itemIds: items.map((i) => i.id),
        startsAt: input.startsAt,
        endsAt: input.endsAt,
        location: input.location,
        purpose: input.purpose,
        plan: input.plan,
        approvalReasons: assessment.approvalReasons.map((r) => r.code),
      },
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
    if (!OPEN_STATUSES.includes(row.status)) throw new ConflictError(`A ${row.status} booking cannot be changed.`, ERROR_CODES.bookingLocked);
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
    await trx('bookings')
      .where({ id })
      .update({
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
      const changes = [
        itemsChanged && 'items',
        windowChanged && 'window',
        planChanged && 'plan',
        location !== row.location && 'location',
        purpose !== row.purpose && 'purpose',
      ].filter((c): c is string => Boolean(c));
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
      before: {
        status: row.status,
        planVersion: row.plan_version,
        itemIds: currentItems,
        startsAt: row.starts_at,
        endsAt: row.ends_at,
        plan: planOf(row),
        location: row.location,
        purpose: row.purpose,
      },
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
    if (!OPEN_STATUSES.includes(row.status)) throw new ConflictError(`A ${row.status} booking cannot be cancelled.`, ERROR_CODES.bookingLocked);
    await trx('bookings').where({ id }).update({ status: 'cancelled', cancelled_at: new Date(), updated_at: new Date() });
    await trx('booking_items').where({ booking_id: id }).update({ live: false });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: id,
      action: 'booking.cancelled',
      before: { status: row.status },
      after: { status: 'cancelled' },
    });
  });
  return getBooking(db, actor, id);
}
