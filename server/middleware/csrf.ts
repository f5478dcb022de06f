import { randomBytes } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { AppError } from '../lib/errors';
import { safeEqual } from '../lib/tokens';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The session's synchronizer token, created on first use (OWASP CSRF Prevention Cheat Sheet). */
export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

/** Refuses every state-changing request whose x-csrf-token header is not the session's token. */
export const requireCsrf: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  const sent = req.get('x-csrf-token');
  const expected = req.session?.csrfToken;
  if (!sent || !expected || !safeEqual(sent, expected)) {
    throw new AppError(
      403,
      'CSRF_INVALID',
      'Your session has expired or the form is out of date. Reload the page and try again.',
    );
  }
  next();
};
