// What other services' writes do to open bookings: an item's new ratings re-plan the bookings
// holding it (server/services/items.ts), a deactivation cancels the person's open bookings
// (server/services/accounts.ts). Both first lock the bookings, keeping the lock order of
// DEVELOPERS.md (bookings, then items, then a person's row).
import { OPEN_STATUSES, PRE_RELEASE_STATUSES } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Trx } from '../db';
import { enqueueMail } from '../mail/enqueue';
import { messages } from '../mail/messages';
import { appendAudit } from './audit';
import { lockBooking } from './booking-access';
import { assess, statusFor } from './booking-assessment';
import { lockItems } from './booking-holds';
import { notifyOfficers } from './booking-mail';
import { voidApproval } from './booking-plans';
import { planOf, type MailContext } from './booking-rows';

/** Open bookings holding an item. */
function openBookingsHolding(trx: Trx, itemId: number): Promise<number[]> {
  return trx('booking_items as bi')
    .join('bookings as b', 'b.id', 'bi.booking_id')
    .where('bi.item_id', itemId)
    .andWhere('bi.live', true)
    .whereIn('b.status', PRE_RELEASE_STATUSES)
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
    if (!PRE_RELEASE_STATUSES.includes(row.status)) continue;
    const itemIds = (await trx('booking_items').where({ booking_id: bookingId }).select('item_id')).map((r) => r.item_id as number);
    const items = await lockItems(trx, itemIds);
    const assessment = await assess(trx, items, planOf(row), row.person_id);
    const status = statusFor(assessment);
    const planVersion = row.plan_version + 1;
    await trx('bookings')
      .where({ id: bookingId })
      .update({
        status,
        plan_version: planVersion,
        assessment: JSON.stringify(assessment),
        approval_required: assessment.approvalRequired,
        updated_at: new Date(),
      });
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
  const ids = (await trx('bookings').where({ person_id: personId }).whereIn('status', OPEN_STATUSES).pluck('id')) as number[];
  if (ids.length > 0) await trx('bookings').whereIn('id', ids).orderBy('id').forUpdate().select('id');
}

/**
 * A person was deactivated (in the caller's transaction, person row locked): their bookings not
 * yet released are cancelled, and officers are told once. Gear already out stays out until it is
 * returned; the booking shows it as needing return.
 */
export async function cancelOpenBookingsOf(trx: Trx, actor: SessionUser, personId: number, mail: MailContext): Promise<number[]> {
  const open = (await trx('bookings').where({ person_id: personId }).whereIn('status', OPEN_STATUSES).orderBy('id').pluck('id')) as number[];
  const cancelled: number[] = [];
  for (const bookingId of open) {
    const row = await lockBooking(trx, bookingId);
    if (!OPEN_STATUSES.includes(row.status)) continue;
    await trx('bookings').where({ id: bookingId }).update({ status: 'cancelled', cancelled_at: new Date(), updated_at: new Date() });
    await trx('booking_items').where({ booking_id: bookingId }).update({ live: false });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'booking.cancelled-on-deactivation',
      before: { status: row.status },
      after: { status: 'cancelled', personId },
    });
    cancelled.push(bookingId);
  }
  if (cancelled.length > 0) {
    const person = await trx('people').where({ id: personId }).first('name');
    const officers = await trx('people').where({ role: 'officer', active: true }).whereNot('id', personId).select('id', 'email');
    const content = messages.bookingsCancelledOnDeactivation(mail.publicUrl, String(person?.name ?? `Person ${personId}`), cancelled);
    for (const officer of officers) {
      await enqueueMail(trx, {
        kind: 'bookings-cancelled',
        to: officer.email,
        dedupeKey: `deactivated:${personId}:${cancelled.join('-')}:${officer.id}`,
        ...content,
      });
    }
  }
  return cancelled;
}
