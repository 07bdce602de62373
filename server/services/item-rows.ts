// Item rows as the database holds them and the few operations on them that other services share
// (summaries, inspection state, the row lock, tagging out). It imports no other service, so the
// bookings service and the registry can both use it.
import { DUE_SOON_DAYS, type InspectionState, type ItemKind, type ItemStatus, type ItemSummary } from '../../shared/schemas/items';
import type { Trx } from '../db';
import { NotFoundError } from '../errors';
import { appendAudit } from './audit';
import { addDaysIso, dateColumnToIso, todayIso } from './dates';

export interface ItemRow {
  id: number;
  tag: string;
  kind: ItemKind;
  name: string;
  make: string;
  model: string;
  serial: string;
  location: string;
  notes: string;
  ratings: unknown;
  rated_kv: number | null;
  status: ItemStatus;
  status_reason: string | null;
  inspection_interval_days: number;
  last_inspected_on: string | null;
  next_inspection_due: string | null;
  photo_file_id: number | null;
  status_changed_at: Date | null;
  last_inspection_result: 'pass' | 'fail' | null;
  created_at: Date;
  updated_at: Date;
}

export const SUMMARY_COLUMNS = ['id', 'tag', 'kind', 'name', 'status', 'status_reason', 'rated_kv', 'location', 'next_inspection_due'] as const;

export function inspectionStateOf(nextDue: string | null, today = todayIso()): InspectionState {
  if (!nextDue) return 'never';
  if (nextDue < today) return 'overdue';
  if (nextDue <= addDaysIso(today, DUE_SOON_DAYS)) return 'due-soon';
  return 'current';
}

export function toItemSummary(row: Pick<ItemRow, (typeof SUMMARY_COLUMNS)[number]>): ItemSummary {
  const nextDue = dateColumnToIso(row.next_inspection_due);
  return {
    id: row.id,
    tag: row.tag,
    kind: row.kind,
    name: row.name,
    status: row.status,
    statusReason: row.status_reason,
    ratedKv: row.rated_kv === null ? null : Number(row.rated_kv),
    location: row.location,
    nextInspectionDue: nextDue,
    inspectionState: inspectionStateOf(nextDue),
  };
}

/** The item row, locked for the rest of the transaction. */
export async function lockItem(trx: Trx, id: number): Promise<ItemRow> {
  const row = await trx<ItemRow>('items').where({ id }).forUpdate().first();
  if (!row) throw new NotFoundError(`No item with id ${id}.`);
  return row;
}

/** Tags an item out of service inside a caller's transaction (failed inspection, damage at return). */
export async function tagOutInTransaction(trx: Trx, actorId: number, id: number, reason: string, action = 'item.tagged-out'): Promise<void> {
  const before = await lockItem(trx, id);
  if (before.status === 'retired') return;
  await trx('items')
    .where({ id })
    .update({ status: 'out-of-service', status_reason: reason.slice(0, 500), status_changed_at: new Date(), updated_at: new Date() });
  await appendAudit(trx, {
    actorId,
    entity: 'item',
    entityId: id,
    action,
    before: { status: before.status, statusReason: before.status_reason },
    after: { status: 'out-of-service', statusReason: reason.slice(0, 500) },
  });
}
