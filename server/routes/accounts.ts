import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { invitationSchema, passwordResetRequestSchema, setPasswordSchema, tokenParamSchema } from '../../shared/schemas/accounts';
import { ERROR_CODES } from '../../shared/errors';
import type { Config } from '../config';
import type { Db } from '../db';
import { currentUser, requireRole } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { acceptInvitation, completePasswordReset, invitePerson, requestPasswordReset } from '../services/accounts';

function limiter(limit: number, message: string) {
  return rateLimit({
    windowMs: 15 * 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: ERROR_CODES.rateLimited, message } });
    },
  });
}

export function invitationsRouter(db: Db, config: Config): Router {
  const router = Router();
  router.post('/', requireRole('manager'), async (req, res) => {
    const person = await invitePerson(db, currentUser(req), validate(invitationSchema, req.body, 'invitation'), config.publicUrl);
    res.status(201).json({ person });
  });
  router.post('/:token', limiter(config.loginRateLimit, 'Too many attempts. Wait 15 minutes and try again.'), async (req, res) => {
    const { token } = validate(tokenParamSchema, req.params, 'link');
    const { password } = validate(setPasswordSchema, req.body, 'password');
    await acceptInvitation(db, token, password);
    res.json({ ok: true });
  });
  return router;
}

export function passwordResetsRouter(db: Db, config: Config): Router {
  const router = Router();
  const limit = limiter(config.loginRateLimit, 'Too many password-reset requests. Wait 15 minutes and try again.');
  router.post('/', limit, async (req, res) => {
    const { email } = validate(passwordResetRequestSchema, req.body, 'request');
    await requestPasswordReset(db, email, config.publicUrl);
    // The same answer whether or not the e-mail belongs to someone.
    res.status(202).json({ ok: true, message: 'If that e-mail belongs to an account, a reset link is on its way.' });
  });
  router.post('/:token', limit, async (req, res) => {
    const { token } = validate(tokenParamSchema, req.params, 'link');
    const { password } = validate(setPasswordSchema, req.body, 'password');
    await completePasswordReset(db, token, password);
    res.json({ ok: true });
  });
  return router;
}
