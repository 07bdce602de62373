import { Router, type Request } from 'express';
import type { PassportStatic } from 'passport';
import { ERROR_CODES } from '../../shared/errors';
import { signInSchema, type SessionResponse, type SessionUser } from '../../shared/schemas/session';
import { addressOf, type Throttle } from '../auth/throttle';
import type { Db } from '../db';
import { labTimeZone } from '../mail/lab-time';
import { AppError } from '../errors';
import type { Csrf } from '../middleware/csrf';
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

export function sessionRouter(db: Db, passport: PassportStatic, csrf: Csrf, throttle: Throttle): Router {
  const router = Router();

  router.get('/', (req, res) => {
    const body: SessionResponse = { user: req.user ?? null, csrfToken: csrf.tokenFor(req, res), labTimeZone: labTimeZone() };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const address = addressOf(req);
    const { email } = await throttle.parse(req, res, signInSchema, req.body, 'sign-in');
    // Counted before the password is checked, so parallel guesses cannot overtake the count.
    await throttle.attempt(address, email, res);
    const user = await authenticate(passport, req);
    if (!user) {
      // The same words whether the e-mail is unknown, the password wrong or the account inactive.
      throw new AppError(401, ERROR_CODES.invalidCredentials, 'E-mail or password is not right.');
    }
    await throttle.succeeded(address, email);
    await logIn(req, user);
    await recordSignIn(db, user.id);
    res.json({ user, csrfToken: csrf.tokenFor(req, res, true) });
  });

  router.delete('/', async (req, res) => {
    await new Promise<void>((resolve, reject) => req.logOut((error) => (error ? reject(error) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((error) => (error ? reject(error) : resolve())));
    res.clearCookie('voltcrib.sid');
    res.status(204).end();
  });

  return router;
}
