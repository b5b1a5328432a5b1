import { rateLimit } from 'express-rate-limit';
import { AppError } from '../errors';

/** Limits requests per client address to `limit` in each window of `windowMs`, answering 429 with `message`. */
export function clientRateLimit({ windowMs, limit, message }: { windowMs: number; limit: number; message: string }) {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError('rate_limited', message)),
  });
}

/** Limits attempts per client address on sign-in and reset routes. */
export function authRateLimit(max: number) {
  return clientRateLimit({ windowMs: 15 * 60 * 1000, limit: max, message: 'Too many attempts. Wait a few minutes and try again.' });
}

/** Limits a public form (the waiting list application) to `max` submissions per client address per hour. */
export function publicFormRateLimit(max: number) {
  return clientRateLimit({
    windowMs: 60 * 60 * 1000,
    limit: max,
    message: 'Too many applications from this connection. Try again in an hour.',
  });
}
