// Putting e-mail in the outbox, inside the transaction that causes it (the worker in outbox.ts
// sends it). Apart from the worker so services can enqueue without importing the worker.
import type { Db, Trx } from '../db';
import type { MailContent } from './messages';

export interface EnqueueInput extends MailContent {
  kind: string;
  to: string;
  /** Same key, same message: a second enqueue is ignored (scheduled reminders). */
  dedupeKey?: string;
}

/** Returns true when the message was queued, false when its dedupe key was already used. */
export async function enqueueMail(trx: Db | Trx, input: EnqueueInput): Promise<boolean> {
  const [result] = (await trx.raw(
    'INSERT IGNORE INTO outbox (dedupe_key, kind, to_address, subject, text_body, html_body, next_attempt_at) VALUES (?, ?, ?, ?, ?, ?, ?)',
    [input.dedupeKey ?? null, input.kind, input.to, input.subject.slice(0, 200), input.text, input.html, new Date()],
  )) as [{ affectedRows: number }];
  return result.affectedRows === 1;
}

/**
 * Queues work whose message the worker writes when it claims the row (outbox.ts `Preparer`):
 * the request answers after one INSERT whatever the work turns out to be.
 */
export async function enqueueDeferred(db: Db | Trx, kind: string, to: string, facts: Record<string, unknown>): Promise<void> {
  await enqueueMail(db, { kind, to, subject: `(${kind})`, text: JSON.stringify(facts), html: '' });
}
