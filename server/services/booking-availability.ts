// An item's bookings, for its page and the booking form: who holds it in a window, and its history.
import type { BookingStatus, BusyWindow, ItemBooking } from '../../shared/schemas/bookings';
import type { Db } from '../db';
import { isOverdue } from './booking-rows';
import { timestampToIso } from './dates';

/** Live bookings holding an item in a window: what the booking form shows as availability. */
export async function itemAvailability(db: Db, itemId: number, from: Date, to: Date): Promise<BusyWindow[]> {
  const rows = await db('booking_items as bi')
    .join('bookings as b', 'b.id', 'bi.booking_id')
    .join('people as p', 'p.id', 'b.person_id')
    .where('bi.item_id', itemId)
    .andWhere('bi.live', true)
    .andWhere('bi.starts_at', '<', to)
    .andWhere('bi.ends_at', '>', from)
    .orderBy('bi.starts_at')
    .select('b.id', 'b.status', 'bi.starts_at', 'bi.ends_at', 'p.name as person_name');
  return rows.map((r) => ({
    bookingId: r.id,
    status: r.status,
    startsAt: timestampToIso(r.starts_at)!,
    endsAt: timestampToIso(r.ends_at)!,
    personName: r.person_name,
  }));
}

/** An item's booking history for its page (newest first). */
export async function itemBookingHistory(db: Db, itemId: number, limit = 50): Promise<ItemBooking[]> {
  const rows = await db('booking_items as bi')
    .join('bookings as b', 'b.id', 'bi.booking_id')
    .join('people as p', 'p.id', 'b.person_id')
    .where('bi.item_id', itemId)
    .orderBy('b.id', 'desc')
    .limit(limit)
    .select('b.id', 'b.person_id', 'b.status', 'b.starts_at', 'b.ends_at', 'b.planned_kv', 'p.name as person_name');
  return rows.map((r) => ({
    bookingId: r.id,
    personId: r.person_id as number,
    status: r.status as BookingStatus,
    overdue: isOverdue(r),
    startsAt: timestampToIso(r.starts_at)!,
    endsAt: timestampToIso(r.ends_at)!,
    plannedKv: Number(r.planned_kv),
    personName: r.person_name as string,
  }));
}
