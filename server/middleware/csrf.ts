import crypto from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { AppError } from '../errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
export const CSRF_HEADER = 'x-csrf-token';

/** Returns the session's CSRF token, creating one on first use. */
export function csrfToken(req: Request): string {
  req.session.csrfToken ??= crypto.randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

/** Refuses a state-changing request whose X-CSRF-Token header does not match the session's token. */
export const requireCsrf: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  const sent = req.get(CSRF_HEADER) ?? '';
  const expected = req.session?.csrfToken ?? '';
  const ok =
    sent.length > 0 &&
    sent.length === expected.length &&
    crypto.timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
  if (!ok) return next(new AppError('csrf_failed', 'The page was out of date. Reload it and try again.'));
  next();
};
