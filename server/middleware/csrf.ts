// CSRF protection in two forms, one per kind of visitor, so an anonymous visitor needs no session
// row (an anonymous request never writes to the sessions table):
// - signed in: a synchroniser token (csrf-sync) kept in the session, which exists anyway;
// - anonymous (sign-in, password reset, accepting an invitation): a signed double-submit token
//   (csrf-csrf): an HMAC-signed random value in an HttpOnly cookie that must come back, equal, in
//   `x-csrf-token`. Another site can neither read the cookie nor send the header.
// Either way the client reads the token from GET /api/session and sends it in `x-csrf-token`.
import { doubleCsrf } from 'csrf-csrf';
import { csrfSync } from 'csrf-sync';
import type { Request, RequestHandler, Response } from 'express';
import { ERROR_CODES } from '../../shared/errors';

const STALE = { statusCode: 403, message: 'Missing or stale security token. Reload the page and try again.', code: ERROR_CODES.csrf };

const headerToken = (req: Request) => {
  const header = req.headers['x-csrf-token'];
  return typeof header === 'string' ? header : undefined;
};

const signedIn = csrfSync({ getTokenFromRequest: headerToken, errorConfig: STALE });

export interface Csrf {
  protection: RequestHandler;
  /** The token for this visitor; `fresh` replaces any earlier one (after sign-in). */
  tokenFor(req: Request, res: Response, fresh?: boolean): string;
}

export function createCsrf(options: { secret: string; secureCookies: boolean }): Csrf {
  const anonymous = doubleCsrf({
    getSecret: () => options.secret,
    // No session to bind to: the token is bound to this app's secret and to its own cookie.
    getSessionIdentifier: () => '',
    // __Host- keeps a sibling subdomain from planting the cookie; browsers accept it only when Secure.
    cookieName: options.secureCookies ? '__Host-voltcrib.csrf' : 'voltcrib.csrf',
    cookieOptions: { sameSite: 'strict', path: '/', secure: options.secureCookies, httpOnly: true },
    getCsrfTokenFromRequest: headerToken,
    errorConfig: STALE,
  });
  return {
    protection: (req, res, next) => (req.user ? signedIn.csrfSynchronisedProtection(req, res, next) : anonymous.doubleCsrfProtection(req, res, next)),
    tokenFor: (req, res, fresh = false) => (req.user ? signedIn.generateToken(req, fresh) : anonymous.generateCsrfToken(req, res, { overwrite: fresh })),
  };
}
