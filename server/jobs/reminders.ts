// Scheduled reminders. Each message has a dedupe key, so however many servers run this at the
// same moment, the outbox holds one copy and the worker sends it once.
import type { Db } from '../db';
import { enqueueMail } from '../mail/outbox';
import { messages } from '../mail/messages';
import { bookingFacts } from '../services/booking-mail';
import { addDaysIso, todayIso } from '../services/dates';
import { getLabRules } from '../services/lab-rules';
import { pastDueActions } from '../services/incidents';
import { pastDueActionLines } from '../mail/incident-messages';

export async function enqueueOverdueReminders(db: Db, publicUrl: string, now = new Date()): Promise<number> {
  const rules = await getLabRules(db);
  const overdue = await db('bookings').where('status', 'released').andWhere('ends_at', '<', now).orderBy('id').limit(500).pluck('id');
  const facts = await bookingFacts(db, overdue);
  const officers = await db('people').where({ role: 'officer', active: true }).select('id', 'email');
  let queued = 0;
  for (const b of facts.values()) {
    if (await enqueueMail(db, { kind: 'overdue-member', to: b.personEmail, dedupeKey: `overdue-member:${b.id}`, ...messages.overdueToMember(publicUrl, b) }))
      queued += 1;
    if (now.getTime() - b.endsAtDate.getTime() >= rules.overdueGraceMin * 60_000) {
      for (const officer of officers) {
        const content = messages.overdueToOfficer(publicUrl, b, rules.overdueGraceMin);
        if (await enqueueMail(db, { kind: 'overdue-officer', to: officer.email, dedupeKey: `overdue-officer:${b.id}:${officer.id}`, ...content })) queued += 1;
      }
    }
  }
  return queued;
}

/** One digest a day per manager: items whose inspection is due within 7 days, and overdue ones. */
export async function enqueueInspectionDigests(db: Db, publicUrl: string, today = todayIso()): Promise<number> {
  const due = await db('items')
    .whereNot('status', 'retired')
    .andWhere('next_inspection_due', '<=', addDaysIso(today, 7))
    .orderBy('next_inspection_due')
    .limit(101)
    .select('id', 'tag', 'name', 'next_inspection_due');
  const actions = await pastDueActions(db, null, today);
  if (due.length === 0 && actions.length === 0) return 0;
  const managers = await db('people').where({ role: 'manager', active: true }).select('id', 'email');
  const toDue = (i: { tag: string; name: string; next_inspection_due: string }) => ({ tag: i.tag, name: i.name, dueOn: i.next_inspection_due });
  const content = messages.inspectionDigest(
    publicUrl,
    due.filter((i) => i.next_inspection_due < today).map(toDue),
    due.filter((i) => i.next_inspection_due >= today).map(toDue),
    today,
    pastDueActionLines(actions),
  );
  let queued = 0;
  for (const manager of managers) {
    if (await enqueueMail(db, { kind: 'inspection-digest', to: manager.email, dedupeKey: `inspection-digest:${today}:${manager.id}`, ...content })) queued += 1;
  }
  return queued;
}
