// Whether a tagged-out item can be put back in service now. Lockout/tagout practice: a tag comes
// off after the item is inspected and passes; the inspection must be recorded after the tag-out,
// carried out on or after its day (an old inspection entered late is no evidence) and not dated
// in the future. The item page asks this before it offers "Put back in service", so the button is
// never shown for a change the server would refuse (updateItem runs the same check under its lock).
import type { Db, Trx } from '../db';
import { isoOfMillis, todayIso } from './dates';
import type { ItemRow } from './item-rows';

export async function passedSinceTagOut(q: Db | Trx, item: Pick<ItemRow, 'id' | 'status_changed_at'>): Promise<boolean> {
  const since = item.status_changed_at ?? new Date(0);
  const passed = await q('inspections')
    .where({ item_id: item.id, result: 'pass' })
    .andWhere('created_at', '>=', since)
    .andWhere('inspected_on', '>=', isoOfMillis(new Date(since).getTime()).slice(0, 10))
    .andWhere('inspected_on', '<=', todayIso())
    .first('id');
  return Boolean(passed);
}

export interface ItemClearance {
  /** True when the item is tagged out and "Put back in service" would be accepted now. */
  clearable: boolean;
  /** Why not, in the lab's words; null when clearable or not tagged out. */
  reason: string | null;
}

export async function itemClearance(db: Db, item: ItemRow): Promise<ItemClearance> {
  if (item.status !== 'out-of-service') return { clearable: false, reason: null };
  if (await passedSinceTagOut(db, item)) return { clearable: true, reason: null };
  return { clearable: false, reason: 'To put it back in service, first record an inspection that passes, carried out since it was tagged out.' };
}
