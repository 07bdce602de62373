// Removes what has expired: session rows past their expiry and throttling counters past their
// window. Runs with the reminders on the scheduler (every server process; deleting is idempotent),
// in batches so one run never holds many row locks.
import type { Db } from '../db';
import { THROTTLE_TABLE } from '../auth/throttle';

const BATCH = 1000;

async function deleteInBatches(run: () => Promise<number>): Promise<number> {
  let total = 0;
  for (;;) {
    const n = await run();
    total += n;
    if (n < BATCH) return total;
  }
}

export async function purgeExpired(db: Db, now = new Date()): Promise<{ sessions: number; rateLimits: number }> {
  const sessions = await deleteInBatches(() => db('sessions').where('expired', '<=', now).limit(BATCH).delete());
  const rateLimits = await deleteInBatches(() => db(THROTTLE_TABLE).where('expire', '<=', now.getTime()).limit(BATCH).delete());
  return { sessions, rateLimits };
}
