import { rateLimit } from 'express-rate-limit';
import { AppError } from '../errors';

/** Limits attempts per client address on sign-in and reset routes. */
export function authRateLimit(max: number) {
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError('rate_limited', 'Too many attempts. Wait a few minutes and try again.')),
  });
}
