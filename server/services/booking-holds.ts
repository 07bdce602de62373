// The one invariant every write that changes a booking's items or window keeps: no item is in two
// overlapping live bookings. Every such write (create, change, release) calls `holdItems`, which
// locks the item rows in id order and only then reads who holds them. The gate's connections run
// at READ COMMITTED (server/db.ts), so that read sees every booking committed by whoever held the
// item lock before us; under REPEATABLE READ an earlier plain read in the same transaction would
// have fixed an older snapshot and let two moves into the same window both pass.
import type { Db, Trx } from '../db';
import { ConflictError, ValidationError } from '../errors';
import type { ItemRow } from './item-rows';

/**
 * Item rows, locked in id order for the rest of the transaction (after the booking row, if any),
 * and written: `hold_version` moves on, so on a Galera cluster a transaction on another node that
 * locked the same items conflicts with this one at commit (migration 20261203300000).
 */
export async function lockItems(trx: Trx, itemIds: readonly number[]): Promise<ItemRow[]> {
  const ids = [...new Set(itemIds)].sort((a, b) => a - b);
  const rows = (await trx<ItemRow>('items').whereIn('id', ids).orderBy('id').forUpdate()) as ItemRow[];
  const missing = ids.filter((id) => !rows.some((r) => r.id === id));
  if (missing.length > 0) throw new ValidationError(`No item with id ${missing.join(', ')}.`, { itemIds: [`Unknown item ${missing.join(', ')}`] });
  await trx.raw(`UPDATE items SET hold_version = hold_version + 1 WHERE id IN (${ids.map(() => '?').join(', ')})`, ids);
  return rows;
}

/** Tags of the items held by another live booking overlapping the window. */
export async function clashingTags(q: Db | Trx, itemIds: readonly number[], startsAt: Date, endsAt: Date, exceptBookingId?: number): Promise<string[]> {
  const clashes = await q('booking_items as bi')
    .join('items as i', 'i.id', 'bi.item_id')
    .whereIn('bi.item_id', [...itemIds])
    .andWhere('bi.live', true)
    .andWhere('bi.starts_at', '<', endsAt)
    .andWhere('bi.ends_at', '>', startsAt)
    .modify((b) => {
      if (exceptBookingId) b.andWhereNot('bi.booking_id', exceptBookingId);
    })
    .select<{ tag: string }[]>('i.tag');
  return [...new Set(clashes.map((c) => c.tag))].sort();
}

export function itemTaken(tags: readonly string[]): ConflictError {
  return new ConflictError(`Already booked in that window: ${tags.join(', ')}. Pick another time or other gear.`, 'ITEM_TAKEN');
}

/**
 * Locks the items and refuses (409 ITEM_TAKEN) when another live booking holds any of them in
 * the window, or (409 ITEM_RETIRED) when any is retired. `lockAlso` are further items whose rows
 * must be locked in the same ordered pass (a change's current items, which it gives up).
 */
export async function holdItems(
  trx: Trx,
  itemIds: readonly number[],
  window: { startsAt: Date; endsAt: Date },
  options: { exceptBookingId?: number; lockAlso?: readonly number[] } = {},
): Promise<ItemRow[]> {
  const locked = await lockItems(trx, [...itemIds, ...(options.lockAlso ?? [])]);
  const wanted = new Set(itemIds);
  const items = locked.filter((i) => wanted.has(i.id));
  const taken = await clashingTags(trx, itemIds, window.startsAt, window.endsAt, options.exceptBookingId);
  if (taken.length > 0) throw itemTaken(taken);
  const retired = items.filter((i) => i.status === 'retired').map((i) => i.tag);
  if (retired.length > 0) throw new ConflictError(`Retired gear cannot be booked: ${retired.join(', ')}.`, 'ITEM_RETIRED');
  return items;
}
