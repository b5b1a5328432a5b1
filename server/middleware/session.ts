import type { Request, RequestHandler } from 'express';

/** Replaces the session with a fresh one (new id) that belongs to userId. */
export function signIn(req: Request, userId: number): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      // The roles read with the old session are not this person's: the role checks query afresh.
      req.memberships = undefined;
      req.session.userId = userId;
      req.session.refreshedAt = Date.now();
      req.session.save((err2) => (err2 ? reject(err2) : resolve()));
    });
  });
}

/** Destroys the session in the store. */
export function signOut(req: Request): Promise<void> {
  req.memberships = undefined;
  return new Promise((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Keeps a signed-in session alive for 14 days after its last use while writing it at most once a
 * day: the store does not touch rows on each request and the cookie is not rolled, so only a
 * session last refreshed a day ago or more is marked changed (saved, cookie sent again).
 * Anonymous visitors have no session to refresh.
 */
export const refreshSession: RequestHandler = (req, _res, next) => {
  if (req.session?.userId) {
    const now = Date.now();
    if (!req.session.refreshedAt || now - req.session.refreshedAt >= DAY_MS) req.session.refreshedAt = now;
  }
  next();
};

/** Log paths dropped whatever the serializers let through (headers with cookies or tokens, bodies with passwords). */
export const LOG_REDACT_PATHS = [
  'req.headers',
  'res.headers',
  'req.body',
  '*.password',
  '*.newPassword',
  '*.token',
  '*.csrfToken',
];
