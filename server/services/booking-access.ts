// Who may see and work a booking. Shared by the bookings service and by the files it owns
// (checklist photos), so a photo is visible to exactly the people who may see its booking.
import type { Role, SessionUser } from '../../shared/schemas/session';
import type { Trx } from '../db';
import { NotFoundError } from '../errors';
import type { BookingRow } from './booking-rows';

export const STAFF: Role[] = ['officer', 'manager'];

/** The booker and staff see a booking; to anyone else it does not exist. */
export function canSeeBooking(actor: SessionUser, row: Pick<BookingRow, 'person_id'>): boolean {
  return row.person_id === actor.id || STAFF.includes(actor.role);
}

/** Whoever sees a booking may work its counter steps (scans, checklists, photos, release, return). */
export function assertCounterAccess(actor: SessionUser, row: Pick<BookingRow, 'id' | 'person_id'>): void {
  if (!canSeeBooking(actor, row)) throw new NotFoundError(`No booking with id ${row.id}.`);
}

/** The booking row, locked for the rest of the transaction (always the first lock taken). */
export async function lockBooking(trx: Trx, id: number): Promise<BookingRow> {
  const row = await trx<BookingRow>('bookings').where({ id }).forUpdate().first();
  if (!row) throw new NotFoundError(`No booking with id ${id}.`);
  return row;
}
