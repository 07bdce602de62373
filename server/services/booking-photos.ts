// Photos taken at the counter for a booking's checklist lines. Stored like item files
// (files.ts); a checklist answer may only name a photo of its own booking.
import { LIVE_STATUSES, type BookingPhoto } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import { ConflictError, NotFoundError } from '../errors';
import type { ObjectStore } from '../storage/object-store';
import { appendAudit } from './audit';
import { assertCounterAccess, lockBooking } from './booking-access';
import type { BookingRow } from './bookings';
import { checkUpload } from './file-content';
import { describeFile, insertFileRow, storeThenRecord } from './files';

/** Checklists are answered while a booking is live: before release (pre) and while out (make-safe). */
function assertTakesPhotos(row: Pick<BookingRow, 'status'>): void {
  if (!LIVE_STATUSES.includes(row.status)) throw new ConflictError(`Checklist photos are for live bookings; this booking is ${row.status}.`, 'BOOKING_LOCKED');
}

export async function storeBookingPhoto(db: Db, store: ObjectStore, actor: SessionUser, bookingId: number, upload: { originalName: string; buffer: Buffer }): Promise<BookingPhoto> {
  const file = await checkUpload(upload, ['photo']);
  // Checked before the object is stored, so a refused request stores nothing; checked again under
  // the booking's lock, since it may have been cancelled or returned meanwhile.
  const before = await db<BookingRow>('bookings').where({ id: bookingId }).first('id', 'person_id', 'status');
  if (!before) throw new NotFoundError(`No booking with id ${bookingId}.`);
  assertCounterAccess(actor, before);
  assertTakesPhotos(before);

  return storeThenRecord(db, store, `bookings/${bookingId}`, file, async (trx, key) => {
    const row = await lockBooking(trx, bookingId);
    assertCounterAccess(actor, row);
    assertTakesPhotos(row);
    const id = await insertFileRow(trx, { booking_id: bookingId }, file, key, actor);
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'booking.photo-added',
      after: { fileId: id, fileName: file.fileName, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256 },
    });
    return { ...describeFile({ id, kind: 'photo', file_name: file.fileName, content_type: file.contentType, size_bytes: file.sizeBytes, created_at: new Date(), uploaded_by_name: actor.name }), kind: 'photo', bookingId };
  });
}

/** Of `fileIds`, those that are photos of this booking (anything else is not an answer for it). */
export async function bookingPhotoIdsAmong(trx: Trx, bookingId: number, fileIds: number[]): Promise<Set<number>> {
  if (fileIds.length === 0) return new Set();
  const ids = await trx('item_files').where({ booking_id: bookingId, kind: 'photo' }).whereIn('id', fileIds).pluck('id');
  return new Set(ids.map(Number));
}
