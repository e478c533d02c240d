import type { Request, RequestHandler } from 'express';
import { doubleCsrf } from 'csrf-csrf';
import type { Config } from '../config';
import { AppError } from '../http/errors';

// CSRF protection by the signed double-submit cookie pattern (csrf-csrf): the
// token is an HMAC bound to the session id, sent back in the x-csrf-token header.
// Why this and not an Origin check: see docs/security.md.

export const CSRF_COOKIE = 'beadloom.csrf';

export function createCsrf(config: Config) {
  const { generateCsrfToken, validateRequest } = doubleCsrf({
    getSecret: () => config.sessionSecret,
    getSessionIdentifier: (req: Request) => req.session?.id ?? '',
    cookieName: CSRF_COOKIE,
    cookieOptions: { sameSite: 'lax', secure: config.appUrl.startsWith('https://'), httpOnly: true, path: '/' },
    getCsrfTokenFromRequest: (req) => req.headers['x-csrf-token'],
  });

  const protect: RequestHandler = (req, _res, next) => {
    if (['GET', 'HEAD', 'OPTIONS'].includes(req.method)) return next();
    if (!validateRequest(req)) {
      throw new AppError(403, 'csrf_invalid', 'The CSRF token is missing or stale; fetch GET /api/auth/csrf and retry.');
    }
    next();
  };

  /** Issues a token for this session; marks the session so it is stored and its id stays stable. */
  const issue = (req: Request, res: Parameters<RequestHandler>[1]): string => {
    req.session.csrfIssued = true;
    return generateCsrfToken(req, res);
  };

  return { protect, issue };
}
