// Inspections of an item: recording one moves its due date (never backwards) and a failed one
// tags the item out of service.
import { ERROR_CODES } from '../../shared/errors';
import { inspectionCreateSchema, type Inspection } from '../../shared/schemas/items';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { ConflictError, ValidationError } from '../errors';
import { validate } from '../middleware/validate';
import { appendAudit, auditedTransaction } from './audit';
import { addDaysIso, dateColumnToIso, todayIso } from './dates';
import { updateTermsDueDate } from './item-terms';
import { lockItem, tagOutInTransaction } from './item-rows';

export async function recordInspection(db: Db, actor: SessionUser, itemId: number, body: unknown): Promise<Inspection> {
  const input = validate(inspectionCreateSchema, body, 'inspection');
  const inspectedOn = input.inspectedOn ?? todayIso();
  if (inspectedOn > todayIso()) throw new ValidationError('An inspection cannot be dated in the future.', { inspectedOn: ['Pick today or an earlier date'] });
  return auditedTransaction(db, async (trx) => {
    const item = await lockItem(trx, itemId);
    if (item.status === 'retired') throw new ConflictError(`${item.tag} is retired.`, ERROR_CODES.itemRetired);
    const nextDue = addDaysIso(inspectedOn, item.inspection_interval_days);
    const [id] = (await trx('inspections').insert({
      item_id: itemId,
      inspected_on: inspectedOn,
      inspector_id: actor.id,
      result: input.result,
      readings: JSON.stringify(input.readings),
      notes: input.notes,
      next_due: nextDue,
    })) as [number];
    // A later inspection entered for an earlier date must not move the due date backwards.
    const latest = dateColumnToIso(item.last_inspected_on);
    if (!latest || inspectedOn >= latest) {
      await trx('items')
        .where({ id: itemId })
        .update({ last_inspected_on: inspectedOn, next_inspection_due: nextDue, last_inspection_result: input.result, updated_at: new Date() });
      await updateTermsDueDate(trx, itemId, nextDue);
    }
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'item',
      entityId: itemId,
      action: `inspection.${input.result}`,
      after: { inspectionId: id, inspectedOn, result: input.result, readings: input.readings, notes: input.notes, nextDue },
    });
    if (input.result === 'fail') {
      await tagOutInTransaction(trx, actor.id, itemId, `Failed inspection on ${inspectedOn}: ${input.notes}`);
    }
    return {
      id,
      itemId,
      inspectedOn,
      inspectorName: actor.name,
      result: input.result,
      readings: input.readings,
      notes: input.notes,
      nextDue,
    };
  });
}

export async function listInspections(db: Db, itemId: number, limit = 50): Promise<Inspection[]> {
  const rows = await db('inspections as i')
    .join('people as p', 'p.id', 'i.inspector_id')
    .where('i.item_id', itemId)
    .orderBy([
      { column: 'i.inspected_on', order: 'desc' },
      { column: 'i.id', order: 'desc' },
    ])
    .limit(limit)
    .select('i.*', 'p.name as inspector_name');
  return rows.map((r) => ({
    id: r.id,
    itemId: r.item_id,
    inspectedOn: dateColumnToIso(r.inspected_on)!,
    inspectorName: r.inspector_name,
    result: r.result,
    readings: typeof r.readings === 'string' ? JSON.parse(r.readings) : r.readings,
    notes: r.notes,
    nextDue: dateColumnToIso(r.next_due)!,
  }));
}
