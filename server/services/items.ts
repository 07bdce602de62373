// Gear registry operations: an item created, read and changed. Every write runs in one
// transaction with its audit entry. Inspections are in inspections.ts, the listing and word
// search in item-search.ts.
import { ERROR_CODES } from '../../shared/errors';
import {
  DEFAULT_INSPECTION_DAYS,
  KIND_TAG_CODES,
  RATINGS_SCHEMAS,
  ratedKvOf,
  type Item,
  type ItemCreateInput,
  type ItemKind,
  type ItemRatings,
  type ItemUpdateInput,
} from '../../shared/schemas/items';
import type { SessionUser } from '../../shared/schemas/session';
import { isDuplicateKey, type Db, type Trx } from '../db';
import { ConflictError, NotFoundError } from '../errors';
import { validate } from '../middleware/validate';
import { passedSinceTagOut } from './item-clearance';
import { appendAudit, auditedTransaction } from './audit';
import { lockBookingsHolding, replanBookingsHolding } from './booking-cascades';
import type { MailContext } from './booking-rows';
import { addDaysIso, dateColumnToIso, timestampToIso } from './dates';
import { writeItemTerms } from './item-terms';
import { lockItem, toItemSummary, type ItemRow } from './item-rows';

function parseRatings(value: unknown): ItemRatings['ratings'] {
  return (typeof value === 'string' ? JSON.parse(value) : value) as ItemRatings['ratings'];
}

export function toItem(row: ItemRow, publicUrl: string): Item {
  return {
    ...toItemSummary(row),
    make: row.make,
    model: row.model,
    serial: row.serial,
    notes: row.notes,
    ratings: parseRatings(row.ratings),
    inspectionIntervalDays: row.inspection_interval_days,
    lastInspectedOn: dateColumnToIso(row.last_inspected_on),
    lastInspectionResult: row.last_inspection_result ?? null,
    photoFileId: row.photo_file_id,
    labelUrl: labelUrl(publicUrl, row.tag),
    createdAt: timestampToIso(row.created_at)!,
    updatedAt: timestampToIso(row.updated_at)!,
  };
}

export function labelUrl(publicUrl: string, tag: string): string {
  return `${publicUrl}/i/${encodeURIComponent(tag)}`;
}

/** Next tag for a kind, e.g. MUL-0008. The sequence row is locked, so two managers never collide. */
async function issueTag(trx: Trx, kind: ItemKind): Promise<string> {
  const code = KIND_TAG_CODES[kind];
  await trx.raw('INSERT INTO tag_sequences (code, last_value) VALUES (?, 1) ON DUPLICATE KEY UPDATE last_value = last_value + 1', [code]);
  const row = await trx('tag_sequences').where({ code }).first<{ last_value: number }>();
  return `${code}-${String(row!.last_value).padStart(4, '0')}`;
}

export async function getItem(db: Db, id: number): Promise<ItemRow> {
  const row = await db<ItemRow>('items').where({ id }).first();
  if (!row) throw new NotFoundError(`No item with id ${id}.`);
  return row;
}

export async function getItemByTag(db: Db, tag: string): Promise<ItemRow> {
  const row = await db<ItemRow>('items').where({ tag: tag.trim().toUpperCase() }).first();
  if (!row) throw new NotFoundError(`No item carries the tag ${tag}.`);
  return row;
}

export async function createItem(db: Db, actor: SessionUser, input: ItemCreateInput & { kind: ItemKind; ratings: ItemRatings['ratings'] }): Promise<ItemRow> {
  return auditedTransaction(db, async (trx) => {
    const tag = input.tag ?? (await issueTag(trx, input.kind));
    const record = {
      tag,
      kind: input.kind,
      name: input.name,
      make: input.make ?? '',
      model: input.model ?? '',
      serial: input.serial ?? '',
      location: input.location,
      notes: input.notes ?? '',
      ratings: JSON.stringify(input.ratings),
      rated_kv: ratedKvOf({ kind: input.kind, ratings: input.ratings } as ItemRatings),
      inspection_interval_days: input.inspectionIntervalDays ?? DEFAULT_INSPECTION_DAYS[input.kind],
    };
    let id: number;
    try {
      [id] = (await trx('items').insert(record)) as [number];
    } catch (error) {
      if (isDuplicateKey(error)) throw new ConflictError(`The tag ${tag} has already been issued; tags are never reused.`, ERROR_CODES.tagTaken);
      throw error;
    }
    const row = await lockItem(trx, id);
    await writeItemTerms(trx, row);
    await appendAudit(trx, { actorId: actor.id, entity: 'item', entityId: id, action: 'item.created', after: { ...record, ratings: input.ratings } });
    return row;
  });
}

function auditView(row: ItemRow) {
  return {
    name: row.name,
    make: row.make,
    model: row.model,
    serial: row.serial,
    location: row.location,
    notes: row.notes,
    ratings: parseRatings(row.ratings),
    status: row.status,
    statusReason: row.status_reason,
    inspectionIntervalDays: row.inspection_interval_days,
  };
}

export async function updateItem(db: Db, actor: SessionUser, id: number, input: ItemUpdateInput, mail: MailContext): Promise<ItemRow> {
  return auditedTransaction(db, async (trx) => {
    if (input.ratings !== undefined) await lockBookingsHolding(trx, id);
    const before = await lockItem(trx, id);
    if (before.status === 'retired') throw new ConflictError(`${before.tag} is retired; retired gear cannot be changed.`, ERROR_CODES.itemRetired);
    const changes: Partial<ItemRow> & { ratings?: string; updated_at: Date } = { updated_at: new Date() };
    for (const key of ['name', 'make', 'model', 'serial', 'location', 'notes'] as const) {
      if (input[key] !== undefined) changes[key] = input[key];
    }
    if (input.inspectionIntervalDays !== undefined) {
      changes.inspection_interval_days = input.inspectionIntervalDays;
      if (before.last_inspected_on) changes.next_inspection_due = addDaysIso(dateColumnToIso(before.last_inspected_on)!, input.inspectionIntervalDays);
    }
    if (input.ratings !== undefined) {
      const ratings = validate(RATINGS_SCHEMAS[before.kind], input.ratings, `ratings for a ${before.kind}`, 'ratings');
      changes.ratings = JSON.stringify(ratings);
      changes.rated_kv = ratedKvOf({ kind: before.kind, ratings } as ItemRatings);
    }
    if (input.status === 'in-service' && before.status === 'out-of-service') {
      // Lockout/tagout: the same check the item page asks before offering the button (item-clearance.ts).
      const passed = await passedSinceTagOut(trx, before);
      if (!passed)
        throw new ConflictError(
          `${before.tag} is tagged out: record a passing inspection carried out since the tag-out before clearing it.`,
          ERROR_CODES.inspectionRequired,
        );
    }
    if (input.status !== undefined && input.status !== before.status) {
      changes.status = input.status;
      changes.status_changed_at = new Date();
      changes.status_reason = input.status === 'in-service' ? null : (input.statusReason ?? null);
    } else if (input.statusReason !== undefined && before.status !== 'in-service') {
      changes.status_reason = input.statusReason;
    }
    await trx('items').where({ id }).update(changes);
    const after = await lockItem(trx, id);
    // New ratings change what every open booking of the item means: each is assessed again
    // under a new plan version, voiding an approval given for the old figures.
    if (changes.ratings !== undefined && changes.ratings !== JSON.stringify(typeof before.ratings === 'string' ? JSON.parse(before.ratings) : before.ratings)) {
      await replanBookingsHolding(trx, actor, id, mail);
    }
    // Name, make, model, serial, location and rating can all change what the item is found by.
    await writeItemTerms(trx, after);
    const action =
      changes.status === 'out-of-service'
        ? 'item.tagged-out'
        : changes.status === 'in-service'
          ? 'item.cleared'
          : changes.status === 'retired'
            ? 'item.retired'
            : 'item.updated';
    await appendAudit(trx, { actorId: actor.id, entity: 'item', entityId: id, action, before: auditView(before), after: auditView(after) });
    return after;
  });
}
