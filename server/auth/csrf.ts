import { csrfSync } from 'csrf-sync';

export const CSRF_HEADER = 'x-csrf-token';

/**
 * Synchroniser-token CSRF protection: the token lives in the server-side session and every
 * cookie-authenticated write must echo it in a header. GET, HEAD and OPTIONS are exempt.
 */
export const { csrfSynchronisedProtection: csrfProtection, generateToken: csrfToken } = csrfSync({
  getTokenFromRequest: (req) => req.headers[CSRF_HEADER] as string | undefined,
  errorConfig: {
    statusCode: 403,
    message: 'Missing or stale security token; reload the page and try again',
    code: 'csrf_invalid',
  },
});
