// Synchroniser-token CSRF protection (csrf-sync): the token lives in the session and must come
// back in `x-csrf-token` on every state-changing request, sign-in included.
import { csrfSync } from 'csrf-sync';
import { ERROR_CODES } from '../../shared/errors';

export const csrf = csrfSync({
  getTokenFromRequest: (req) => {
    const header = req.headers['x-csrf-token'];
    return typeof header === 'string' ? header : undefined;
  },
  errorConfig: { statusCode: 403, message: 'Missing or stale security token. Reload the page and try again.', code: ERROR_CODES.csrf },
});
