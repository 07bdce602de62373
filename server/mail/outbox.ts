// The outbox: e-mail is enqueued inside the transaction that causes it (enqueue.ts), then delivered
// by a worker that claims rows with a lease (SELECT … FOR UPDATE SKIP LOCKED), so any number of
// server processes can run workers.
//
// Delivery guarantee: at least once, with duplicate suppression. Each message carries a Message-ID
// made from its outbox row (id and creation time), the same on every attempt, so a receiving
// server or mail client can drop a second copy. A send whose row could not be marked sent (the
// database went away right after the SMTP server accepted it) is remembered by the worker and
// marked before it claims or sends anything else, so this process never sends it again. A second
// copy is still possible when the process ends between the send and the mark, or when the
// database is gone for longer than the lease and another process claims the row meanwhile.
import { randomUUID } from 'node:crypto';
import type { Transporter } from 'nodemailer';
import type { Db, Trx } from '../db';
import { auditedTransaction } from '../services/audit';
import { withDeadlockRetry } from '../services/deadlock-retry';
import { PASSWORD_RESET_REQUEST, preparePasswordReset } from '../services/accounts';
import type { MailContent } from './messages';

export { enqueueMail, type EnqueueInput } from './enqueue';

const DEFAULT_LEASE_MS = 60_000;
const MAX_ATTEMPTS = 8;

/** 5 s, 10 s, 20 s … capped at 10 minutes. */
export function backoffMs(attempts: number): number {
  return Math.min(5_000 * 2 ** Math.max(0, attempts - 1), 10 * 60_000);
}

/** The Message-ID of an outbox row: stable across attempts and processes, unique per row. */
export function messageIdOf(row: { id: number; created_at: Date | string }, from: string): string {
  const domain = /@([A-Za-z0-9.-]+)>?\s*$/.exec(from)?.[1] ?? 'voltcrib.invalid';
  return `<outbox.${row.id}.${new Date(row.created_at).getTime()}@${domain}>`;
}

/**
 * Writes the message of a deferred row (enqueueDeferred) inside the worker's transaction, from the
 * facts the request stored; null means there is nothing to send and the row is dropped.
 */
export type Preparer = (trx: Trx, to: string, facts: Record<string, unknown>) => Promise<{ kind: string; content: MailContent } | null>;

const PREPARERS: Record<string, Preparer> = { [PASSWORD_RESET_REQUEST]: preparePasswordReset };

interface ClaimedRow {
  id: number;
  kind: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string;
  attempts: number;
  created_at: Date;
}

export interface OutboxWorkerOptions {
  /** How long a claim is held before another worker may take the row over. */
  leaseMs?: number;
}

export class OutboxWorker {
  readonly owner = randomUUID();
  private running = false;
  private readonly leaseMs: number;
  /** Rows this process sent but could not yet mark sent (the database went away meanwhile). */
  private readonly unmarked = new Set<number>();

  constructor(
    private readonly db: Db,
    private readonly transport: Transporter,
    private readonly from: string,
    private readonly log: { warn(obj: object, msg: string): void } = { warn: () => {} },
    options: OutboxWorkerOptions = {},
  ) {
    this.leaseMs = options.leaseMs ?? DEFAULT_LEASE_MS;
  }

  /** How many sends wait to be marked (for the fault suite and logs). */
  get unmarkedCount(): number {
    return this.unmarked.size;
  }

  /** Claims due messages in one short transaction; the sending happens outside it. */
  private claim(limit: number): Promise<ClaimedRow[]> {
    return withDeadlockRetry(() =>
      this.db.transaction(async (trx) => {
        const now = new Date();
        const rows = (await trx('outbox')
          .where((w) => w.where('state', 'pending').andWhere('next_attempt_at', '<=', now))
          .orWhere((w) => w.where('state', 'sending').andWhere('lease_expires_at', '<', now))
          .orderBy('id')
          .limit(limit)
          .forUpdate()
          .skipLocked()
          .select('id', 'kind', 'to_address', 'subject', 'text_body', 'html_body', 'attempts', 'created_at')) as ClaimedRow[];
        if (rows.length === 0) return [];
        await trx('outbox')
          .whereIn(
            'id',
            rows.map((r) => r.id),
          )
          .update({ state: 'sending', lease_owner: this.owner, lease_expires_at: new Date(now.getTime() + this.leaseMs), attempts: trx.raw('attempts + 1') });
        return rows.map((r) => ({ ...r, attempts: r.attempts + 1 }));
      }),
    );
  }

  /** Marks the remembered sends; throws (and so stops the drain) while the database is away. */
  private async markRemembered(): Promise<void> {
    for (const id of [...this.unmarked]) {
      await this.markSent(id);
      this.unmarked.delete(id);
    }
  }

  /** Once sent, the row is marked whoever holds its lease now: it must not go out again. */
  private async markSent(id: number): Promise<void> {
    await this.db('outbox').where({ id }).update({ state: 'sent', sent_at: new Date(), lease_owner: null, lease_expires_at: null, last_error: null });
  }

  /** A deferred row gets its message now; undefined when it had nothing to send (row dropped). */
  private async prepare(row: ClaimedRow): Promise<ClaimedRow | undefined> {
    const preparer = PREPARERS[row.kind];
    if (!preparer) return row;
    return auditedTransaction(this.db, async (trx) => {
      const held = await trx('outbox').where({ id: row.id, lease_owner: this.owner }).forUpdate().first('id');
      if (!held) return undefined;
      const prepared = await preparer(trx, row.to_address, JSON.parse(row.text_body) as Record<string, unknown>);
      if (!prepared) {
        await trx('outbox').where({ id: row.id }).delete();
        return undefined;
      }
      const { subject, text, html } = prepared.content;
      await trx('outbox')
        .where({ id: row.id })
        .update({ kind: prepared.kind, subject: subject.slice(0, 200), text_body: text, html_body: html });
      return { ...row, kind: prepared.kind, subject, text_body: text, html_body: html };
    });
  }

  /** Sends what is due; returns how many were sent. Safe to call from many processes at once. */
  async drain(limit = 20): Promise<{ sent: number; failed: number }> {
    if (this.running) return { sent: 0, failed: 0 };
    this.running = true;
    let sent = 0;
    let failed = 0;
    try {
      await this.markRemembered();
      for (const claimed of await this.claim(limit)) {
        let row: ClaimedRow | undefined;
        try {
          row = await this.prepare(claimed);
          if (!row) continue;
          await this.transport.sendMail({
            from: this.from,
            to: row.to_address,
            subject: row.subject,
            text: row.text_body,
            html: row.html_body,
            messageId: messageIdOf(row, this.from),
          });
        } catch (error) {
          failed += 1;
          const message = error instanceof Error ? error.message : String(error);
          const giveUp = claimed.attempts >= MAX_ATTEMPTS;
          await this.db('outbox')
            .where({ id: claimed.id, lease_owner: this.owner })
            .update({
              state: giveUp ? 'failed' : 'pending',
              next_attempt_at: new Date(Date.now() + backoffMs(claimed.attempts)),
              lease_owner: null,
              lease_expires_at: null,
              last_error: message.slice(0, 2000),
            })
            .catch(() => undefined);
          this.log.warn({ outboxId: claimed.id, attempts: claimed.attempts, err: message }, 'mail delivery failed; will retry');
          continue;
        }
        sent += 1;
        try {
          await this.markSent(row.id);
        } catch (error) {
          // Sent, but not recorded: remembered, and marked before this worker does anything else.
          this.unmarked.add(row.id);
          this.log.warn(
            { outboxId: row.id, err: error instanceof Error ? error.message : String(error) },
            'mail sent but not yet marked; will mark before any other send',
          );
          break;
        }
      }
    } finally {
      this.running = false;
    }
    return { sent, failed };
  }
}
