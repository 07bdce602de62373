// What was answered at the counter: every completed checklist of a booking, with its readings and
// photos, for the booking's page. Runs are never changed after they are written (a new submission
// is a new run), so this is the record an officer reviews after a test.
import type { ChecklistAnswerRecord, ChecklistRunRecord } from '../../shared/schemas/bookings';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { NotFoundError } from '../errors';
import { canSeeBooking } from './booking-access';
import { timestampToIso } from './dates';

/** A booking has a few runs (one per phase, again after a plan change); this bounds a bad case. */
const MAX_RUNS = 100;

interface RunRow {
  id: number;
  phase: 'pre' | 'return';
  plan_version: number;
  answers: string | ChecklistAnswerRecord[];
  within_limits: boolean;
  completed_at: Date;
  completed_by_name: string;
}

/** The booking's runs, newest first: two queries, whatever the number of runs. */
export async function listChecklistRuns(db: Db, actor: SessionUser, bookingId: number): Promise<ChecklistRunRecord[]> {
  const [booking, rows] = await Promise.all([
    db('bookings').where({ id: bookingId }).first('person_id', 'plan_version') as Promise<{ person_id: number; plan_version: number } | undefined>,
    db('checklist_runs as r')
      .join('people as p', 'p.id', 'r.completed_by')
      .where('r.booking_id', bookingId)
      .orderBy('r.id', 'desc')
      .limit(MAX_RUNS)
      .select('r.id', 'r.phase', 'r.plan_version', 'r.answers', 'r.within_limits', 'r.completed_at', 'p.name as completed_by_name') as Promise<RunRow[]>,
  ]);
  if (!booking || !canSeeBooking(actor, booking)) throw new NotFoundError(`No booking with id ${bookingId}.`);
  return rows.map((r) => ({
    id: r.id,
    phase: r.phase,
    planVersion: r.plan_version,
    current: r.plan_version === booking.plan_version,
    withinLimits: Boolean(r.within_limits),
    completedAt: timestampToIso(r.completed_at)!,
    completedByName: r.completed_by_name,
    answers: typeof r.answers === 'string' ? (JSON.parse(r.answers) as ChecklistAnswerRecord[]) : r.answers,
  }));
}
