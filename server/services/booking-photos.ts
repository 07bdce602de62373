// Photos taken at the counter for a booking's checklist lines. Stored like item files
// (files.ts); a checklist answer may only name a photo of its own booking.
import { ERROR_CODES } from '../../shared/errors';
import { LIVE_STATUSES, type BookingPhoto } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db, Trx } from '../db';
import type { Config } from '../config';
import { AppError, ConflictError, NotFoundError } from '../errors';
import type { ObjectStore } from '../storage/object-store';
import { appendAudit } from './audit';
import { assertCounterAccess, lockBooking } from './booking-access';
import type { BookingRow } from './booking-rows';
import { checkUpload } from './file-content';
import { describeFile, insertFileRow, storeThenRecord } from './files';

/** Checklists are answered while a booking is live: before release (pre) and while out (make-safe). */
function assertTakesPhotos(row: Pick<BookingRow, 'status'>): void {
  if (!LIVE_STATUSES.includes(row.status))
    throw new ConflictError(`Checklist photos are for live bookings; this booking is ${row.status}.`, ERROR_CODES.bookingLocked);
}

export type UploadCaps = Config['uploadCaps'];

const mb = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;
const capReached = (message: string) => new AppError(413, ERROR_CODES.uploadCapReached, message);

/**
 * 413 unless one more photo of `sizeBytes` keeps the booking within its count and bytes, and the
 * person within theirs over the last 24 hours (settings BOOKING_PHOTOS_MAX, BOOKING_PHOTOS_MAX_MB,
 * PERSON_UPLOADS_PER_DAY, PERSON_UPLOAD_MB_PER_DAY).
 */
async function assertWithinCaps(q: Db | Trx, caps: UploadCaps, actor: SessionUser, bookingId: number, sizeBytes: number): Promise<void> {
  const booking = (await q('item_files').where({ booking_id: bookingId }).first(q.raw('COUNT(*) AS n'), q.raw('COALESCE(SUM(size_bytes), 0) AS bytes'))) as {
    n: number;
    bytes: number;
  };
  if (Number(booking.n) + 1 > caps.bookingFiles)
    throw capReached(`This booking already has ${booking.n} photos, the most one booking keeps (${caps.bookingFiles}).`);
  if (Number(booking.bytes) + sizeBytes > caps.bookingBytes)
    throw capReached(`This photo would take the booking's photos past ${mb(caps.bookingBytes)} (${mb(Number(booking.bytes))} so far). Send a smaller photo.`);
  const since = new Date(Date.now() - 24 * 3600_000);
  const person = (await q('item_files')
    .where({ uploaded_by: actor.id })
    .whereNotNull('booking_id')
    .andWhere('created_at', '>', since)
    .first(q.raw('COUNT(*) AS n'), q.raw('COALESCE(SUM(size_bytes), 0) AS bytes'))) as { n: number; bytes: number };
  if (Number(person.n) + 1 > caps.personFilesPerDay)
    throw capReached(`You have sent ${person.n} booking photos in the last 24 hours, the most one person may (${caps.personFilesPerDay}). Try again later.`);
  if (Number(person.bytes) + sizeBytes > caps.personBytesPerDay)
    throw capReached(
      `This photo would take your booking photos of the last 24 hours past ${mb(caps.personBytesPerDay)} (${mb(Number(person.bytes))} so far). Try again later or send a smaller photo.`,
    );
}

export async function storeBookingPhoto(
  db: Db,
  store: ObjectStore,
  actor: SessionUser,
  bookingId: number,
  upload: { originalName: string; buffer: Buffer },
  caps: UploadCaps,
): Promise<BookingPhoto> {
  const file = await checkUpload(upload, ['photo']);
  // Checked before the object is stored, so a refused request stores nothing; checked again under
  // the booking's lock, since it may have been cancelled or returned meanwhile.
  const before = await db<BookingRow>('bookings').where({ id: bookingId }).first('id', 'person_id', 'status');
  if (!before) throw new NotFoundError(`No booking with id ${bookingId}.`);
  assertCounterAccess(actor, before);
  assertTakesPhotos(before);
  await assertWithinCaps(db, caps, actor, bookingId, file.sizeBytes);

  return storeThenRecord(db, store, `bookings/${bookingId}`, file, async (trx, key) => {
    const row = await lockBooking(trx, bookingId);
    assertCounterAccess(actor, row);
    assertTakesPhotos(row);
    // Counted again under the booking's lock and the person's, so parallel uploads cannot all pass.
    await trx('people').where({ id: actor.id }).forUpdate().first('id');
    await assertWithinCaps(trx, caps, actor, bookingId, file.sizeBytes);
    const id = await insertFileRow(trx, { booking_id: bookingId }, file, key, actor);
    await appendAudit(trx, {
      actorId: actor.id,
      entity: 'booking',
      entityId: bookingId,
      action: 'booking.photo-added',
      after: { fileId: id, fileName: file.fileName, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256 },
    });
    return {
      ...describeFile({
        id,
        kind: 'photo',
        file_name: file.fileName,
        content_type: file.contentType,
        size_bytes: file.sizeBytes,
        created_at: new Date(),
        uploaded_by_name: actor.name,
      }),
      kind: 'photo',
      bookingId,
    };
  });
}

/** Of `fileIds`, those that are photos of this booking (anything else is not an answer for it). */
export async function bookingPhotoIdsAmong(trx: Trx, bookingId: number, fileIds: number[]): Promise<Set<number>> {
  if (fileIds.length === 0) return new Set();
  const ids = await trx('item_files').where({ booking_id: bookingId, kind: 'photo' }).whereIn('id', fileIds).pluck('id');
  return new Set(ids.map(Number));
}
