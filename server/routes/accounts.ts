import { Router, type Request, type Response } from 'express';
import { invitationSchema, passwordResetRequestSchema, setPasswordSchema, tokenParamSchema } from '../../shared/schemas/accounts';
import { addressOf, type Throttle } from '../auth/throttle';
import type { Config } from '../config';
import type { Db } from '../db';
import { currentUser, requireRole } from '../middleware/require-role';
import { validate } from '../middleware/validate';
import { acceptInvitation, completePasswordReset, invitePerson, requestPasswordReset } from '../services/accounts';

/**
 * POST /:token for a one-time link: every try counts against the link and the address; a
 * success starts the link's count over. A malformed link or password counts against the address only.
 */
function redeemRoute(throttle: Throttle, redeem: (token: string, password: string) => Promise<void>) {
  return async (req: Request, res: Response) => {
    const { token } = await throttle.parse(req, res, tokenParamSchema, req.params, 'link');
    const { password } = await throttle.parse(req, res, setPasswordSchema, req.body, 'password');
    const address = addressOf(req);
    await throttle.attempt(address, token, res);
    await redeem(token, password);
    await throttle.succeeded(address, token);
    res.json({ ok: true });
  };
}

export function invitationsRouter(db: Db, config: Config, throttle: Throttle): Router {
  const router = Router();
  router.post('/', requireRole('manager'), async (req, res) => {
    const person = await invitePerson(db, currentUser(req), validate(invitationSchema, req.body, 'invitation'), config.publicUrl);
    res.status(201).json({ person });
  });
  router.post(
    '/:token',
    redeemRoute(throttle, (token, password) => acceptInvitation(db, token, password)),
  );
  return router;
}

export function passwordResetsRouter(db: Db, config: Config, throttle: Throttle): Router {
  const router = Router();
  router.post('/', async (req, res) => {
    const { email } = await throttle.parse(req, res, passwordResetRequestSchema, req.body, 'request');
    // Every request counts (there is no failure to wait for): per e-mail and address, and per address.
    await throttle.attempt(addressOf(req), email, res);
    await requestPasswordReset(db, email, config.publicUrl);
    // The same answer, after the same work, whether or not the e-mail belongs to someone.
    res.status(202).json({ ok: true, message: 'If that e-mail belongs to an account, a reset link is on its way.' });
  });
  router.post(
    '/:token',
    redeemRoute(throttle, (token, password) => completePasswordReset(db, token, password)),
  );
  return router;
}
