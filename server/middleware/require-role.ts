import type { RequestHandler } from 'express';
import type { Role, SessionUser } from '../../shared/schemas/session';
import { ForbiddenError, UnauthenticatedError } from '../errors';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express's own types declare `Express.User` in this global namespace; merging into it is how a typed req.user is written.
  namespace Express {
    // Passport's user is the snapshot we keep in the session.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type -- an interface (not a type alias) is needed to merge with Express's declaration.
    interface User extends SessionUser {}
  }
}

export const requireSignedIn: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : new UnauthenticatedError());
};

/** 401 when signed out, 403 when signed in with another role. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new UnauthenticatedError());
    if (!roles.includes(req.user.role)) {
      return next(new ForbiddenError(`Only ${roles.join(' or ')} accounts can do this.`));
    }
    next();
  };
}

/** The signed-in person; only call behind requireSignedIn/requireRole. */
export function currentUser(req: { user?: Express.User }): SessionUser {
  if (!req.user) throw new UnauthenticatedError();
  return req.user;
}
