// Runs the reminder scans and the purge of expired sessions and throttling counters on a cron
// schedule, and drains the outbox often. Every server process runs it; dedupe keys and leased
// claims keep each message single.
import { Cron } from 'croner';
import type { Logger } from 'pino';
import type { Db } from '../db';
import type { OutboxWorker } from '../mail/outbox';
import { purgeExpired } from './purge';
import { enqueueInspectionDigests, enqueueOverdueReminders } from './reminders';

export interface Scheduler {
  runOnce(): Promise<void>;
  stop(): void;
}

export function startScheduler(options: { db: Db; worker: OutboxWorker; publicUrl: string; cron: string; pollMs: number; logger: Logger }): Scheduler {
  const { db, worker, publicUrl, logger } = options;
  const runOnce = async () => {
    try {
      await enqueueOverdueReminders(db, publicUrl);
      await enqueueInspectionDigests(db, publicUrl);
      await purgeExpired(db);
      await worker.drain();
    } catch (err) {
      logger.warn({ err }, 'scheduled reminders failed; next run will retry');
    }
  };
  const job = new Cron(options.cron, { protect: true }, runOnce);
  const poll = setInterval(() => {
    worker.drain().catch((err: unknown) => logger.warn({ err }, 'outbox drain failed'));
  }, options.pollMs);
  poll.unref();
  return {
    runOnce,
    stop() {
      job.stop();
      clearInterval(poll);
    },
  };
}
