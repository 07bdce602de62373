// Demo data only: qualifications and a few bookings of the invented Kestrel Hall lab, so a fresh
// demo shows each screen in use: an approved test for tomorrow, one waiting in the officer's queue
// and a teaching demo whose gear is out now. Everything goes through the services, so each booking
// carries its assessment, checklist runs and audit entries exactly as if made in the app.
import type { Knex } from 'knex';
import type { BookingCreateInput, ChecklistEntry } from '../shared/schemas/bookings';
import type { SessionUser } from '../shared/schemas/session';
import { decideApproval } from '../server/services/booking-approvals';
import { createBooking } from '../server/services/booking-plans';
import { recordScan, submitChecklist } from '../server/services/booking-counter';
import { releaseBooking } from '../server/services/booking-release';
import { addDaysIso, todayIso } from '../server/services/dates';
import { setQualification } from '../server/services/qualifications';
import { loadConfig } from '../server/config';

// The address the server is actually reached at (PUBLIC_URL, else HOST:PORT), as in every e-mail.
const MAIL = { publicUrl: loadConfig().publicUrl };
const HOUR = 3600_000;

async function person(knex: Knex, email: string): Promise<SessionUser> {
  return knex('people').where({ email }).first('id', 'email', 'name', 'role');
}

async function itemIds(knex: Knex, models: string[]): Promise<number[]> {
  const rows = await knex('items').whereIn('model', models).select('id', 'model');
  return models.map((m) => rows.find((r) => r.model === m)!.id as number);
}

/** The next whole hour `days` days from now, in UTC. */
function hourFromNow(days: number, hourUtc: number): Date {
  const at = new Date(Date.now() + days * 24 * HOUR);
  at.setUTCHours(hourUtc, 0, 0, 0);
  return at;
}

/** Answers every required line the way a careful member would: confirmed, readings in limits. */
function carefulAnswers(entries: ChecklistEntry[]) {
  return entries
    .filter((e) => e.required)
    .map((e) => (e.kind === 'reading' ? { itemId: e.id, value: e.min ?? e.max ?? 0 } : { itemId: e.id, confirmed: true }));
}

export async function seed(knex: Knex): Promise<void> {
  const manager = await person(knex, 'manager@voltcrib.example');
  const officer = await person(knex, 'officer@voltcrib.example');
  const noor = await person(knex, 'member@voltcrib.example');
  const kofi = await person(knex, 'kofi.brandvold@voltcrib.example');
  const ansel = await person(knex, 'ansel.oyelaran@voltcrib.example');
  const expiresOn = addDaysIso(todayIso(), 300);
  await setQualification(knex, officer, noor.id, { authorisedKv: 30, expiresOn, notes: 'HV induction and supervised sessions in bay 1.' });
  await setQualification(knex, officer, kofi.id, { authorisedKv: 60, expiresOn, notes: 'Corona work up to 60 kV.' });
  await setQualification(knex, manager, ansel.id, { authorisedKv: 20, expiresOn, notes: 'Teaching demonstrations only.' });

  const book = async (who: SessionUser, models: string[], startsAt: Date, hours: number, details: Pick<BookingCreateInput, 'location' | 'purpose' | 'plan'>) =>
    createBooking(
      knex,
      who,
      { itemIds: await itemIds(knex, models), startsAt: startsAt.toISOString(), endsAt: new Date(startsAt.getTime() + hours * HOUR).toISOString(), ...details },
      MAIL,
    );

  // Tomorrow: Noor's ionic-wind sweep, approved by the officer.
  const sweep = await book(noor, ['HI-30R', 'OW-GS100R', 'KS-PT150', 'KS-IL1', 'OW-RD100'], hourFromNow(1, 9), 3, {
    location: 'Kestrel Hall, bay 1',
    purpose: 'Ionic wind thrust sweep, wire-to-mesh gap 30 mm',
    plan: { plannedKv: 12, polarity: 'positive', maxCurrentMa: 0.5, peoplePresent: 2 },
  });
  if (sweep.status === 'awaiting-approval')
    await decideApproval(
      knex,
      officer,
      sweep.id,
      { decision: 'approve', planVersion: sweep.planVersion, conditions: 'Barrier at the limited approach distance before energizing.' },
      MAIL,
    );

  // The day after: Kofi's corona onset run above the approval voltage, waiting in the queue.
  await book(kofi, ['HI-60N', 'OW-GS100S', 'KS-PT150', 'KS-IL1', 'OW-RD100'], hourFromNow(2, 13), 2, {
    location: 'Kestrel Hall, bay 1',
    purpose: 'Corona onset voltage, needle-to-plane, negative polarity',
    plan: { plannedKv: 45, polarity: 'negative', maxCurrentMa: 0.2, peoplePresent: 2 },
  });

  // Now: Ansel's teaching demonstration, scanned, checked and released at the counter.
  let demo = await book(ansel, ['TE-FB20', 'BW-GS150', 'BW-PT120', 'TE-EN1', 'BW-P75'], new Date(), 3, {
    location: 'Teaching lab, bench 3',
    purpose: 'Corona wind demonstration for first-year students',
    plan: { plannedKv: 8, polarity: 'positive', maxCurrentMa: 0.5, peoplePresent: 3 },
  });
  if (demo.status === 'awaiting-approval')
    demo = await decideApproval(
      knex,
      officer,
      demo.id,
      { decision: 'approve', planVersion: demo.planVersion, conditions: 'Students stay behind the enclosure.' },
      MAIL,
    );
  for (const item of demo.items) demo = await recordScan(knex, ansel, demo.id, item.tag);
  // A required photo line (if an officer has added one) cannot be answered by a seed: the demo
  // booking then simply waits at the counter.
  if (demo.checklist.pre.some((e) => e.required && e.kind === 'photo')) return;
  demo = await submitChecklist(knex, ansel, demo.id, { phase: 'pre', answers: carefulAnswers(demo.checklist.pre) });
  await releaseBooking(knex, officer, demo.id);
}
