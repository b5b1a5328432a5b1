import crypto from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import type { Config } from '../config';
import { AppError } from '../errors';
import { sameSecret } from '../services/tokens';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
export const CSRF_HEADER = 'x-csrf-token';
/** Carries an anonymous visitor's CSRF token, so nothing is stored for them until they sign in. */
export const CSRF_COOKIE = 'tillwell.csrf';

const sign = (secret: string, value: string) =>
  crypto.createHmac('sha256', secret).update(`csrf-anonymous|${value}`).digest('base64url');

function cookieValue(req: Request, name: string): string {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const at = part.indexOf('=');
    if (at > 0 && part.slice(0, at).trim() === name) {
      try {
        return decodeURIComponent(part.slice(at + 1).trim());
      } catch {
        return '';
      }
    }
  }
  return '';
}

/** True when the token is "<random>.<HMAC of it with the session secret>". */
function validSigned(secret: string, token: string): boolean {
  const [value, mac, extra] = token.split('.');
  return !!value && !!mac && extra === undefined && sameSecret(mac, sign(secret, value));
}

/**
 * The CSRF token the client sends back in X-CSRF-Token. Signed in: a token kept in the session.
 * Anonymous: a signed double-submit token in a cookie (created on first use), so anonymous
 * visits leave no session row.
 */
export function csrfToken(req: Request, res: Response, config: Pick<Config, 'sessionSecret' | 'cookieSecure'>): string {
  if (req.session?.userId) {
    req.session.csrfToken ??= crypto.randomBytes(32).toString('base64url');
    return req.session.csrfToken;
  }
  const held = cookieValue(req, CSRF_COOKIE);
  if (validSigned(config.sessionSecret, held)) return held;
  const value = crypto.randomBytes(32).toString('base64url');
  const token = `${value}.${sign(config.sessionSecret, value)}`;
  res.cookie(CSRF_COOKIE, token, { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, path: '/' });
  return token;
}

/**
 * Refuses a state-changing request whose X-CSRF-Token header does not match: the session's
 * token when signed in, else the signed cookie (which must also carry a valid signature).
 */
export function requireCsrf(sessionSecret: string): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    const sent = req.get(CSRF_HEADER) ?? '';
    const ok = req.session?.userId
      ? sameSecret(sent, req.session.csrfToken ?? '')
      : sameSecret(sent, cookieValue(req, CSRF_COOKIE)) && validSigned(sessionSecret, sent);
    if (!ok) return next(new AppError('csrf_failed', 'The page was out of date. Reload it and try again.'));
    next();
  };
}
