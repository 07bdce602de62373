import { Router, type Request } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { PassportStatic } from 'passport';
import { ERROR_CODES } from '../../shared/errors';
import { signInSchema, type SessionResponse, type SessionUser } from '../../shared/schemas/session';
import type { Config } from '../config';
import type { Db } from '../db';
import { AppError } from '../errors';
import { csrf } from '../middleware/csrf';
import { validate } from '../middleware/validate';
import { recordSignIn } from '../services/people';

function authenticate(passport: PassportStatic, req: Request): Promise<SessionUser | false> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (error: unknown, user: SessionUser | false) => {
      if (error) reject(error);
      else resolve(user);
    })(req);
  });
}

function logIn(req: Request, user: SessionUser): Promise<void> {
  // passport 0.7 regenerates the session id here (no fixation).
  return new Promise((resolve, reject) => req.logIn(user, (error) => (error ? reject(error) : resolve())));
}

export function sessionRouter(db: Db, passport: PassportStatic, config: Config): Router {
  const router = Router();

  // Failed attempts only: a lab's shared counter PC must not lock out everyone who signs in fine.
  const signInLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: config.loginRateLimit,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({
        error: { code: ERROR_CODES.rateLimited, message: 'Too many failed sign-ins. Wait 15 minutes and try again.' },
      });
    },
  });

  router.get('/', (req, res) => {
    const body: SessionResponse = { user: req.user ?? null, csrfToken: csrf.generateToken(req) };
    res.json(body);
  });

  router.post('/', signInLimiter, async (req, res) => {
    validate(signInSchema, req.body, 'sign-in');
    const user = await authenticate(passport, req);
    if (!user) {
      // The same words whether the e-mail is unknown, the password wrong or the account inactive.
      throw new AppError(401, ERROR_CODES.invalidCredentials, 'E-mail or password is not right.');
    }
    await logIn(req, user);
    await recordSignIn(db, user.id);
    res.json({ user, csrfToken: csrf.generateToken(req, true) });
  });

  router.delete('/', async (req, res) => {
    await new Promise<void>((resolve, reject) => req.logOut((error) => (error ? reject(error) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((error) => (error ? reject(error) : resolve())));
    res.clearCookie('voltcrib.sid');
    res.status(204).end();
  });

  return router;
}
