// An officer's decision on a booking awaiting approval. It binds to the plan version the officer
// read and records the basis (what was approved), which release compares with the booking then.
import { ERROR_CODES } from '../../shared/errors';
import type { Booking, BookingStatus } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { ConflictError, ForbiddenError } from '../errors';
import { enqueueMail } from '../mail/enqueue';
import { messages } from '../mail/messages';
import { appendAudit, auditedTransaction } from './audit';
import { lockBooking } from './booking-access';
import { assess, basisOf, rowBasisInput } from './booking-assessment';
import { lockItems } from './booking-holds';
import { factsFor } from './booking-mail';
import { planOf, type MailContext } from './booking-rows';
import { getBooking } from './booking-view';

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
    if (row.status !== 'awaiting-approval')
      throw new ConflictError(`Only bookings awaiting approval can be decided; this one is ${row.status}.`, ERROR_CODES.notAwaitingApproval);
    // The decision binds to the version the officer read, never to whatever is current at the click.
    if (input.planVersion !== undefined && input.planVersion !== row.plan_version) {
      throw new ConflictError(
        `The plan changed while you were reviewing it (version ${input.planVersion} → ${row.plan_version}). Read it again before deciding.`,
        ERROR_CODES.planChanged,
      );
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
    await enqueueMail(trx, {
      kind: 'approval-decided',
      to: facts.personEmail,
      ...messages.approvalDecided(mail.publicUrl, facts, input.decision, actor.name, note),
    });
  });
  return getBooking(db, actor, id);
}
