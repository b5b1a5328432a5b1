import { rateLimit } from 'express-rate-limit';
import { AppError } from '../errors';

/** Limits a public form (the waitlist application) to `max` submissions per client address per hour. */
export function publicFormRateLimit(max: number) {
  return rateLimit({
    windowMs: 60 * 60 * 1000,
    limit: max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError('rate_limited', 'Too many applications from this connection. Try again in an hour.')),
  });
}
