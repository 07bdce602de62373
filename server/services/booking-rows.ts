// A booking row as the database holds it and the small pure facts read off it (the plan, whether
// it is overdue, which states are still open). It imports no other service, so every booking-*
// file, the bench log and the files service can share it without an import cycle.
import type { BookingStatus, TestPlan } from '../../shared/schemas/bookings';

export interface BookingRow {
  id: number;
  person_id: number;
  status: BookingStatus;
  starts_at: Date;
  ends_at: Date;
  location: string;
  purpose: string;
  planned_kv: number;
  polarity: TestPlan['polarity'];
  max_current_ma: number;
  people_present: number;
  plan_version: number;
  assessment: unknown;
  approval_required: boolean;
  released_at: Date | null;
  returned_at: Date | null;
  cancelled_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

/** mysql2 returns MariaDB JSON columns already parsed, sometimes as text: accept both. */
export const json = <T>(value: unknown): T => (typeof value === 'string' ? JSON.parse(value) : value) as T;

export function planOf(row: BookingRow): TestPlan {
  return { plannedKv: Number(row.planned_kv), polarity: row.polarity, maxCurrentMa: Number(row.max_current_ma), peoplePresent: row.people_present };
}

export function isOverdue(row: Pick<BookingRow, 'status' | 'ends_at'>, now = new Date()): boolean {
  return row.status === 'released' && new Date(row.ends_at).getTime() < now.getTime();
}

/**
 * The booking row's copy of its items' tags, in tag order, written whenever its items are: the
 * bookings list shows them on every row without touching booking_items.
 */
export function bookingItemTags(items: readonly { tag: string }[]): string {
  return JSON.stringify(items.map((i) => i.tag).sort());
}

/** What services that write e-mail need to know to build links. */
export interface MailContext {
  publicUrl: string;
}
