// The counter steps around release (booking-release.ts): scanning the booked gear, answering a
// checklist, and the make-safe return. Whoever may see a booking may work them.
import { ERROR_CODES } from '../../shared/errors';
import { returnFailures } from '../../shared/rules/release';
import { PRE_RELEASE_STATUSES, type Booking, type ChecklistSubmitInput } from '../../shared/schemas/bookings';
import type { ItemKind } from '../../shared/schemas/items';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../errors';
import { appendAudit, auditedTransaction } from './audit';
import { assertCounterAccess, lockBooking } from './booking-access';
import { entriesFor } from './booking-assessment';
import { decisionsInTransaction } from './booking-decisions';
import { lockItems } from './booking-holds';
import { bookingPhotoIdsAmong } from './booking-photos';
import { getBooking } from './booking-view';
import { activeTemplates, applicableEntries, evaluateAnswers } from './checklists';
import { recordIncidentInTransaction, type IncidentMail } from './incidents';
import { labRulesFor } from './lab-rules';

export async function recordScan(db: Db, actor: SessionUser, id: number, tag: string): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    assertCounterAccess(actor, row);
    if (!PRE_RELEASE_STATUSES.includes(row.status))
      throw new ConflictError(`Scanning is for release; this booking is ${row.status}.`, ERROR_CODES.bookingLocked);
    // The item, whether the booking holds it and whether it was scanned already, in one round trip.
    const item = (await trx('items as i')
      .leftJoin('booking_items as bi', (j) => j.on('bi.item_id', 'i.id').andOnVal('bi.booking_id', id))
      .leftJoin('booking_scans as bs', (j) => j.on('bs.item_id', 'i.id').andOnVal('bs.booking_id', id))
      .where('i.tag', tag.trim().toUpperCase())
      .first('i.id', 'i.tag', 'bi.item_id as booked', 'bs.item_id as scanned')) as
      { id: number; tag: string; booked: number | null; scanned: number | null } | undefined;
    if (!item) throw new NotFoundError(`No gear carries the tag ${tag}.`);
    if (item.booked === null)
      throw new AppError(409, ERROR_CODES.itemNotInBooking, `${item.tag} is not part of this booking. Put it back and scan the booked gear.`);
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
    if (input.phase === 'pre' && !PRE_RELEASE_STATUSES.includes(row.status))
      throw new ConflictError(`The pre-energize checklist is for release; this booking is ${row.status}.`, ERROR_CODES.bookingLocked);
    if (input.phase === 'return' && row.status !== 'released')
      throw new ConflictError('The make-safe checklist is for returning released gear.', ERROR_CODES.bookingLocked);
    const [templates, rules, kinds] = await Promise.all([
      activeTemplates(trx),
      labRulesFor(trx, row.person_id),
      trx('booking_items as bi').join('items as i', 'i.id', 'bi.item_id').where('bi.booking_id', id).distinct('i.kind'),
    ]);
    const entries = applicableEntries(
      templates,
      input.phase,
      Number(row.planned_kv),
      kinds.map((k: { kind: ItemKind }) => k.kind),
      rules,
    );
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

export async function returnBooking(
  db: Db,
  actor: SessionUser,
  id: number,
  input: { damagedItemIds: number[]; notes: string },
  mail: IncidentMail,
): Promise<Booking> {
  await auditedTransaction(db, async (trx) => {
    const row = await lockBooking(trx, id);
    assertCounterAccess(actor, row);
    if (row.status !== 'released') throw new ConflictError(`Only released gear can be returned; this booking is ${row.status}.`, ERROR_CODES.bookingLocked);
    const itemIds = (await trx('booking_items').where({ booking_id: id }).orderBy('item_id').select('item_id')).map((r) => r.item_id as number);
    const stray = input.damagedItemIds.filter((d) => !itemIds.includes(d));
    if (stray.length > 0)
      throw new ValidationError(`Items ${stray.join(', ')} are not part of this booking.`, { damagedItemIds: ['Only items of this booking'] });
    const items = await lockItems(trx, itemIds);
    const [rules, templates, { runs }] = await Promise.all([labRulesFor(trx, row.person_id), activeTemplates(trx), decisionsInTransaction(trx, id)]);
    const failures = returnFailures({
      status: row.status,
      planVersion: row.plan_version,
      checklistEntries: entriesFor(templates, 'return', row, items, rules),
      checklist: runs.return,
    });
    if (failures.length > 0) throw new ConflictError('Return refused: the gear is not yet made safe.', ERROR_CODES.returnRefused, failures);

    const now = new Date();
    // Damage found at return is an incident like any other (issue 17): one report naming the
    // damaged items, tagged out in this transaction, and the officers e-mailed once.
    if (input.damagedItemIds.length > 0) {
      await recordIncidentInTransaction(
        trx,
        actor,
        {
          kind: 'damage',
          severity: 'moderate',
          occurredAt: now.toISOString(),
          location: row.location,
          description: input.notes,
          itemIds: input.damagedItemIds,
          bookingId: id,
          tagOut: true,
        },
        mail,
        { tagOutAction: 'item.tagged-out-at-return', tagOutReason: `Damaged on return of booking ${id}: ${input.notes}` },
      );
    }
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
