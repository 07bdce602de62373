import { Router } from 'express';
import { NotFoundError } from '../errors';
import type { Mailbox } from '../mail/fake-smtp';
import { requireRole } from '../middleware/require-role';

/** What the local fake SMTP server received; absent (404) when real SMTP is configured. */
export function mailboxRouter(mailbox: Mailbox | undefined): Router {
  const router = Router();
  router.get('/', requireRole('manager'), (_req, res) => {
    if (!mailbox) throw new NotFoundError('There is no local mailbox: mail goes to the real SMTP server.');
    res.set('Cache-Control', 'no-store').json({
      messages: mailbox.list().map((m) => ({ id: m.id, to: m.to.join(', '), subject: m.subject, text: m.text, receivedAt: m.receivedAt })),
    });
  });
  return router;
}
