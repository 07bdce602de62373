import type { z } from 'zod';

import { bookingCreateSchema } from '@/shared/schemas/bookings';

import type { Booking } from '@/hooks/use-bookings';

import { addHours, nextQuarterHour } from './booking-time';

/** What the form holds while being filled: the shared schema's input, numbers possibly missing. */
export type BookFormValues = z.input<typeof bookingCreateSchema>;

/** The server's field names, for mapping its fieldErrors onto the form. */
export const BOOK_FIELDS = [
  'itemIds',
  'startsAt',
  'endsAt',
  'location',
  'purpose',
  'plan.plannedKv',
  'plan.polarity',
  'plan.maxCurrentMa',
  'plan.peoplePresent',
] as const;

/** A new booking starts at the next quarter hour and runs two hours; the plan is left to the member. */
export function newBookingDefaults(now = new Date()): Partial<BookFormValues> {
  const start = nextQuarterHour(now);
  return {
    itemIds: [],
    startsAt: start.toISOString(),
    endsAt: addHours(start, 2).toISOString(),
    location: '',
    purpose: '',
    plan: {} as BookFormValues['plan'],
  };
}

export function bookingDefaults(booking: Booking): BookFormValues {
  return {
    itemIds: booking.itemIds,
    startsAt: booking.startsAt,
    endsAt: booking.endsAt,
    location: booking.location,
    purpose: booking.purpose,
    plan: booking.plan,
  };
}

/** "Book again": the same gear, place, purpose and plan in a new window from the next quarter hour. */
export function copiedDefaults(booking: Booking, now = new Date()): BookFormValues {
  const hours = Math.max(1, Math.round((new Date(booking.endsAt).getTime() - new Date(booking.startsAt).getTime()) / 3600_000));
  const start = nextQuarterHour(now);
  return { ...bookingDefaults(booking), startsAt: start.toISOString(), endsAt: addHours(start, hours).toISOString() };
}
