// Photos and documents of an item. Content is checked by its bytes (not its name) against an
// allow-list; the object is stored first, then the row; if the row cannot be written the object
// is removed again, so nothing is ever half-stored.
import { createHash, randomUUID } from 'node:crypto';
import type { ItemFile } from '../../shared/schemas/items';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../errors';
import type { ObjectStore } from '../storage/object-store';
import { appendAudit, auditedTransaction } from './audit';
import { timestampToIso } from './dates';

// file-type 16 is the last CommonJS release; it reads magic numbers, not names.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { fromBuffer } = require('file-type') as { fromBuffer(buffer: Buffer): Promise<{ ext: string; mime: string } | undefined> };

export const ALLOWED_TYPES: Record<string, 'photo' | 'document'> = {
  'image/jpeg': 'photo',
  'image/png': 'photo',
  'image/webp': 'photo',
  'application/pdf': 'document',
};

/** Refuses names that look like paths or carry control characters, instead of guessing. */
export function checkFileName(name: string): string {
  const trimmed = name.toWellFormed().normalize('NFC').trim();
  // eslint-disable-next-line no-control-regex
  if (trimmed.length === 0 || trimmed.length > 200 || /[\\/\u0000-\u001f\u007f]/.test(trimmed) || trimmed.split('.').every((p) => p === '')) {
    throw new ValidationError('The file name is not acceptable: use a plain name without folders.', { file: ['Plain file names only'] });
  }
  if (trimmed.includes('..')) throw new ValidationError('The file name is not acceptable: use a plain name without folders.', { file: ['Plain file names only'] });
  return trimmed;
}

function toItemFile(row: { id: number; item_id: number; kind: 'photo' | 'document'; file_name: string; content_type: string; size_bytes: number; created_at: Date; uploaded_by_name?: string | null }): ItemFile {
  return {
    id: row.id,
    itemId: row.item_id,
    kind: row.kind,
    fileName: row.file_name,
    contentType: row.content_type,
    sizeBytes: row.size_bytes,
    uploadedAt: timestampToIso(row.created_at)!,
    uploadedByName: row.uploaded_by_name ?? null,
  };
}

export async function storeItemFile(
  db: Db,
  store: ObjectStore,
  actor: SessionUser,
  itemId: number,
  upload: { originalName: string; buffer: Buffer },
  requestedKind?: 'photo' | 'document',
): Promise<ItemFile> {
  const fileName = checkFileName(upload.originalName);
  // A truncated file makes the detector throw; it is simply not an allowed type.
  const detected = await fromBuffer(upload.buffer).catch(() => undefined);
  const kind = detected ? ALLOWED_TYPES[detected.mime] : undefined;
  if (!detected || !kind) {
    throw new AppError(415, 'UNSUPPORTED_FILE_TYPE', 'Only JPEG, PNG or WebP photos and PDF documents can be uploaded; this file is none of those.');
  }
  if (requestedKind === 'photo' && kind !== 'photo') {
    throw new AppError(415, 'UNSUPPORTED_FILE_TYPE', 'A photo must be a JPEG, PNG or WebP image.');
  }
  const item = await db('items').where({ id: itemId }).first('id', 'status');
  if (!item) throw new NotFoundError(`No item with id ${itemId}.`);
  if (item.status === 'retired') throw new ConflictError('Retired gear takes no new files.', 'ITEM_RETIRED');

  const key = `items/${itemId}/${randomUUID()}`;
  await store.put(key, upload.buffer, detected.mime);
  try {
    return await auditedTransaction(db, async (trx) => {
      const record = {
        item_id: itemId,
        kind: requestedKind ?? kind,
        file_name: fileName,
        content_type: detected.mime,
        size_bytes: upload.buffer.length,
        storage_key: key,
        sha256: createHash('sha256').update(upload.buffer).digest('hex'),
        uploaded_by: actor.id,
      };
      const [id] = (await trx('item_files').insert(record)) as [number];
      if (record.kind === 'photo') await trx('items').where({ id: itemId }).update({ photo_file_id: id, updated_at: new Date() });
      await appendAudit(trx, { actorId: actor.id, entity: 'item', entityId: itemId, action: 'item.file-added', after: { fileId: id, kind: record.kind, fileName, contentType: detected.mime, sizeBytes: record.size_bytes, sha256: record.sha256 } });
      return toItemFile({ ...record, id, created_at: new Date(), uploaded_by_name: actor.name });
    });
  } catch (error) {
    await store.remove(key).catch(() => undefined);
    throw error;
  }
}

export async function listItemFiles(db: Db, itemId: number): Promise<ItemFile[]> {
  const rows = await db('item_files as f')
    .leftJoin('people as p', 'p.id', 'f.uploaded_by')
    .where('f.item_id', itemId)
    .orderBy('f.id', 'desc')
    .select('f.*', 'p.name as uploaded_by_name');
  return rows.map(toItemFile);
}

export async function readItemFile(db: Db, store: ObjectStore, fileId: number): Promise<{ file: ItemFile; body: Buffer }> {
  const row = await db('item_files').where({ id: fileId }).first();
  if (!row) throw new NotFoundError(`No file with id ${fileId}.`);
  const body = await store.get(row.storage_key).catch((error: { code?: string }) => {
    if (error.code === 'NoSuchKey') throw new NotFoundError('The file is missing from storage.');
    throw error;
  });
  return { file: toItemFile(row), body };
}
