// The facts a booking's e-mails show (booker, gear, voltage, end), read once here for the
// services' messages and the scheduled reminders (server/jobs/reminders.ts), and the approval
// request to officers.
import type { Assessment } from '../../shared/schemas/assessment';
import type { Db, Trx } from '../db';
import { enqueueMail } from '../mail/enqueue';
import { messages, type BookingFacts } from '../mail/messages';
import type { MailContext } from './booking-rows';
import { timestampToIso } from './dates';

export interface BookingMailFacts extends BookingFacts {
  personId: number;
  personEmail: string;
  endsAtDate: Date;
}

/** The mail facts of these bookings, by id. The tags come from the booking row's own copy (bookings.item_tags). */
export async function bookingFacts(q: Db | Trx, ids: readonly number[]): Promise<Map<number, BookingMailFacts>> {
  if (ids.length === 0) return new Map();
  const rows = await q('bookings as b')
    .join('people as p', 'p.id', 'b.person_id')
    .whereIn('b.id', [...ids])
    .select('b.id', 'b.person_id', 'b.ends_at', 'b.planned_kv', 'b.purpose', 'b.item_tags', 'p.name', 'p.email');
  return new Map(
    rows.map((r) => [
      r.id as number,
      {
        id: r.id,
        personId: r.person_id,
        personName: r.name,
        personEmail: r.email,
        plannedKv: Number(r.planned_kv),
        purpose: r.purpose,
        endsAt: timestampToIso(r.ends_at)!,
        endsAtDate: new Date(r.ends_at),
        itemTags: JSON.parse(r.item_tags) as string[],
      },
    ]),
  );
}

/** One booking's mail facts (it exists: the caller holds its row). */
export async function factsFor(q: Db | Trx, bookingId: number): Promise<BookingMailFacts> {
  return (await bookingFacts(q, [bookingId])).get(bookingId)!;
}

/** Approval requests go to every active officer except the booker, once per plan version. */
export async function notifyOfficers(trx: Trx, bookingId: number, planVersion: number, assessment: Assessment, mail: MailContext): Promise<void> {
  const facts = await factsFor(trx, bookingId);
  const officers = await trx('people').where({ role: 'officer', active: true }).whereNot('id', facts.personId).select('id', 'email');
  const content = messages.approvalRequested(
    mail.publicUrl,
    facts,
    assessment.approvalReasons.map((r) => r.message),
  );
  for (const officer of officers) {
    await enqueueMail(trx, {
      kind: 'approval-requested',
      to: officer.email,
      dedupeKey: `approval-requested:${bookingId}:${planVersion}:${officer.id}`,
      ...content,
    });
  }
}
