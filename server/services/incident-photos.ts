// Photos of an incident, stored like every other file (files.ts). The reporter and staff add them;
// they are served to whoever may see the incident.
import type { IncidentPhoto } from '../../shared/schemas/incidents';
import type { SessionUser } from '../../shared/schemas/session';
import type { Config } from '../config';
import type { Db } from '../db';
import { AppError, NotFoundError } from '../errors';
import type { ObjectStore } from '../storage/object-store';
import { appendAudit } from './audit';
import { STAFF } from './booking-access';
import { checkUpload } from './file-content';
import { describeFile, storeThenRecord } from './files';

const capReached = (message: string) => new AppError(413, 'UPLOAD_CAP_REACHED', message);

export async function storeIncidentPhoto(
  db: Db,
  store: ObjectStore,
  actor: SessionUser,
  incidentId: number,
  upload: { originalName: string; buffer: Buffer },
  caps: Config['uploadCaps'],
): Promise<IncidentPhoto> {
  const file = await checkUpload(upload, ['photo']);
  const incident = await db('incidents').where({ id: incidentId }).first('id', 'reported_by');
  // Someone who may not add photos learns nothing about whether the report exists.
  if (!incident || (incident.reported_by !== actor.id && !STAFF.includes(actor.role))) throw new NotFoundError(`No incident with id ${incidentId}.`);
  return storeThenRecord(db, store, `incidents/${incidentId}`, file, async (trx, key) => {
    await trx('incidents').where({ id: incidentId }).forUpdate().first('id');
    // Counted under the incident's lock, so parallel uploads cannot all pass. The per-booking caps
    // (BOOKING_PHOTOS_MAX, BOOKING_PHOTOS_MAX_MB) serve for one report too.
    const held = (await trx('item_files')
      .where({ incident_id: incidentId })
      .first(trx.raw('COUNT(*) AS n'), trx.raw('COALESCE(SUM(size_bytes), 0) AS bytes'))) as { n: number; bytes: number };
    if (Number(held.n) + 1 > caps.bookingFiles)
      throw capReached(`This incident already has ${held.n} photos, the most one report keeps (${caps.bookingFiles}).`);
    if (Number(held.bytes) + file.sizeBytes > caps.bookingBytes)
      throw capReached('This photo would take the report’s photos past its size limit. Send a smaller photo.');
    const [id] = (await trx('item_files').insert({
      incident_id: incidentId,
      kind: 'photo',
      file_name: file.fileName,
      content_type: file.contentType,
      size_bytes: file.sizeBytes,
      storage_key: key,
      sha256: file.sha256,
      uploaded_by: actor.id,
    })) as [number];
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'incident',
      entityId: incidentId,
      action: 'incident.photo-added',
      after: { fileId: id, fileName: file.fileName, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256 },
    });
    const described = describeFile({
      id,
      kind: 'photo',
      file_name: file.fileName,
      content_type: file.contentType,
      size_bytes: file.sizeBytes,
      created_at: new Date(),
      uploaded_by_name: actor.name,
    });
    return {
      id: described.id,
      fileName: described.fileName,
      contentType: described.contentType,
      sizeBytes: described.sizeBytes,
      uploadedAt: described.uploadedAt,
    };
  });
}
