// The outbox: e-mail is enqueued inside the transaction that causes it, then delivered by a
// worker that claims rows with a lease (SELECT … FOR UPDATE SKIP LOCKED), so any number of server
// processes can run workers and each message is sent once.
import { randomUUID } from 'node:crypto';
import type { Transporter } from 'nodemailer';
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

const LEASE_MS = 60_000;
const MAX_ATTEMPTS = 8;

/** 5 s, 10 s, 20 s … capped at 10 minutes. */
export function backoffMs(attempts: number): number {
  return Math.min(5_000 * 2 ** Math.max(0, attempts - 1), 10 * 60_000);
}

export class OutboxWorker {
  readonly owner = randomUUID();
  private running = false;

  constructor(
    private readonly db: Db,
    private readonly transport: Transporter,
    private readonly from: string,
    private readonly log: { warn(obj: object, msg: string): void } = { warn: () => {} },
  ) {}

  /** Claims due messages in one short transaction; the sending happens outside it. */
  private async claim(limit: number): Promise<{ id: number; to_address: string; subject: string; text_body: string; html_body: string; attempts: number }[]> {
    return this.db.transaction(async (trx) => {
      const now = new Date();
      const rows = await trx('outbox')
        .where((w) => w.where('state', 'pending').andWhere('next_attempt_at', '<=', now))
        .orWhere((w) => w.where('state', 'sending').andWhere('lease_expires_at', '<', now))
        .orderBy('id')
        .limit(limit)
        .forUpdate()
        .skipLocked()
        .select('id', 'to_address', 'subject', 'text_body', 'html_body', 'attempts');
      if (rows.length === 0) return [];
      await trx('outbox')
        .whereIn('id', rows.map((r) => r.id))
        .update({ state: 'sending', lease_owner: this.owner, lease_expires_at: new Date(now.getTime() + LEASE_MS), attempts: trx.raw('attempts + 1') });
      return rows.map((r) => ({ ...r, attempts: r.attempts + 1 }));
    });
  }

  /** Sends what is due; returns how many were sent. Safe to call from many processes at once. */
  async drain(limit = 20): Promise<{ sent: number; failed: number }> {
    if (this.running) return { sent: 0, failed: 0 };
    this.running = true;
    let sent = 0;
    let failed = 0;
    try {
      for (const row of await this.claim(limit)) {
        try {
          await this.transport.sendMail({ from: this.from, to: row.to_address, subject: row.subject, text: row.text_body, html: row.html_body });
          await this.db('outbox').where({ id: row.id, lease_owner: this.owner }).update({ state: 'sent', sent_at: new Date(), lease_owner: null, lease_expires_at: null, last_error: null });
          sent += 1;
        } catch (error) {
          failed += 1;
          const message = error instanceof Error ? error.message : String(error);
          const giveUp = row.attempts >= MAX_ATTEMPTS;
          await this.db('outbox')
            .where({ id: row.id, lease_owner: this.owner })
            .update({ state: giveUp ? 'failed' : 'pending', next_attempt_at: new Date(Date.now() + backoffMs(row.attempts)), lease_owner: null, lease_expires_at: null, last_error: message.slice(0, 2000) })
            .catch(() => undefined);
          this.log.warn({ outboxId: row.id, attempts: row.attempts, err: message }, 'mail delivery failed; will retry');
        }
      }
    } finally {
      this.running = false;
    }
    return { sent, failed };
  }
}
