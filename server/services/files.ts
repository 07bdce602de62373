// Stored files: photos and documents of items, and checklist photos of bookings. Every file is
// one row of item_files (so GET /api/files/:id serves both) owned by exactly one item or booking.
// The object is stored first, then the row; if the row cannot be written the object is removed
// again, so nothing is ever half-stored.
import { ERROR_CODES } from '../../shared/errors';
import { randomUUID } from 'node:crypto';
import type { ItemFile } from '../../shared/schemas/items';
import type { SessionUser } from '../../shared/schemas/session';
import { isDataTooLong, type Db, type Trx } from '../db';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { ObjectStore } from '../storage/object-store';
import { appendAudit, auditedTransaction } from './audit';
import { canSeeBooking } from './booking-access';
import { timestampToIso } from './dates';
import { checkUpload, type CheckedFile, type FileKind } from './file-content';
import { canSeeIncident } from './incidents';

export interface FileRow {
  id: number;
  item_id: number | null;
  booking_id: number | null;
  incident_id?: number | null;
  kind: FileKind;
  file_name: string;
  content_type: string;
  size_bytes: number;
  storage_key: string;
  created_at: Date;
  uploaded_by_name?: string | null;
}

export type FileOwner = { item_id: number } | { booking_id: number };

/** What every stored file answers with; the owner's id is added by the owner's own shape. */
export function describeFile(row: Pick<FileRow, 'id' | 'kind' | 'file_name' | 'content_type' | 'size_bytes' | 'created_at' | 'uploaded_by_name'>) {
  return {
    id: row.id,
    kind: row.kind,
    fileName: row.file_name,
    contentType: row.content_type,
    sizeBytes: row.size_bytes,
    uploadedAt: timestampToIso(row.created_at)!,
    uploadedByName: row.uploaded_by_name ?? null,
  };
}

/** Writes the file's row for its owner and returns its id. */
export async function insertFileRow(
  trx: Trx,
  owner: FileOwner,
  file: CheckedFile,
  storageKey: string,
  actor: SessionUser,
  kind: FileKind = file.kind,
): Promise<number> {
  const [id] = (await trx('item_files')
    .insert({
      ...owner,
      kind,
      file_name: file.fileName,
      content_type: file.contentType,
      size_bytes: file.sizeBytes,
      storage_key: storageKey,
      sha256: file.sha256,
      uploaded_by: actor.id,
    })
    .catch((error: unknown) => {
      // The stored name is the sent one with the extension its bytes show, which can make a
      // name that passed the 200-character check longer than the column (item_files.file_name).
      if (isDataTooLong(error))
        throw new ValidationError('The file name is too long; rename the file (at most 200 characters) and send it again.', { file: ['Name too long'] });
      throw error;
    })) as [number];
  return id;
}

/**
 * Stores the object under `keyPrefix`, then runs `record` (which writes the row, its owner's
 * checks and the audit entry) in one audited transaction. If anything in it fails, the object is
 * removed again. An object store outage fails the put with a 503 before any row exists.
 */
export async function storeThenRecord<T>(
  db: Db,
  store: ObjectStore,
  keyPrefix: string,
  file: CheckedFile,
  record: (trx: Trx, storageKey: string) => Promise<T>,
): Promise<T> {
  const key = `${keyPrefix}/${randomUUID()}`;
  await store.put(key, file.buffer, file.contentType);
  try {
    return await auditedTransaction(db, (trx) => record(trx, key));
  } catch (error) {
    await store.remove(key).catch(() => undefined);
    throw error;
  }
}

// ------------------------------------------------------------------------------------------
// Item files

function toItemFile(row: FileRow & { item_id: number }): ItemFile {
  return { ...describeFile(row), itemId: row.item_id };
}

export async function storeItemFile(
  db: Db,
  store: ObjectStore,
  actor: SessionUser,
  itemId: number,
  upload: { originalName: string; buffer: Buffer },
  requestedKind?: FileKind,
): Promise<ItemFile> {
  const file = await checkUpload(upload, requestedKind === 'photo' ? ['photo'] : ['photo', 'document']);
  const item = await db('items').where({ id: itemId }).first('id', 'status');
  if (!item) throw new NotFoundError(`No item with id ${itemId}.`);
  if (item.status === 'retired') throw new ConflictError('Retired gear takes no new files.', ERROR_CODES.itemRetired);

  const kind = requestedKind ?? file.kind;
  return storeThenRecord(db, store, `items/${itemId}`, file, async (trx, key) => {
    const id = await insertFileRow(trx, { item_id: itemId }, file, key, actor, kind);
    if (kind === 'photo') await trx('items').where({ id: itemId }).update({ photo_file_id: id, updated_at: new Date() });
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'item',
      entityId: itemId,
      action: 'item.file-added',
      after: { fileId: id, kind, fileName: file.fileName, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256 },
    });
    return toItemFile({
      id,
      item_id: itemId,
      booking_id: null,
      kind,
      file_name: file.fileName,
      content_type: file.contentType,
      size_bytes: file.sizeBytes,
      storage_key: key,
      created_at: new Date(),
      uploaded_by_name: actor.name,
    });
  });
}

export async function listItemFiles(db: Db, itemId: number): Promise<ItemFile[]> {
  const rows = await db('item_files as f')
    .leftJoin('people as p', 'p.id', 'f.uploaded_by')
    .where('f.item_id', itemId)
    .orderBy('f.id', 'desc')
    .select('f.*', 'p.name as uploaded_by_name');
  return rows.map(toItemFile);
}

// ------------------------------------------------------------------------------------------
// Reading any file

/**
 * A file's description and bytes. An item's files are for everyone signed in; a booking's photos
 * only for those who may see the booking (the booker and staff): to anyone else they do not exist.
 */
export async function readFile(
  db: Db,
  store: ObjectStore,
  actor: SessionUser,
  fileId: number,
): Promise<{ file: ReturnType<typeof describeFile>; body: Buffer }> {
  const row = (await db('item_files as f')
    .leftJoin('bookings as b', 'b.id', 'f.booking_id')
    .where('f.id', fileId)
    .first('f.*', 'b.person_id as booking_person_id')) as (FileRow & { booking_person_id: number | null; incident_id: number | null }) | undefined;
  if (!row) throw new NotFoundError(`No file with id ${fileId}.`);
  if (row.booking_id !== null && !canSeeBooking(actor, { person_id: row.booking_person_id! })) throw new NotFoundError(`No file with id ${fileId}.`);
  if (row.incident_id !== null && !(await canSeeIncident(db, actor, row.incident_id))) throw new NotFoundError(`No file with id ${fileId}.`);
  const body = await store.get(row.storage_key).catch((error: { code?: string }) => {
    if (error.code === 'NoSuchKey') throw new NotFoundError('The file is missing from storage.');
    throw error;
  });
  return { file: describeFile(row), body };
}
