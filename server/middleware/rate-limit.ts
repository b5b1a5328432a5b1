import crypto from 'node:crypto';
import type { Knex } from 'knex';
import { rateLimit, type ClientRateLimitInfo, type Store } from 'express-rate-limit';
import { RateLimiterPostgres } from 'rate-limiter-flexible';
import { AppError } from '../errors';

export const RATE_LIMITS_TABLE = 'rate_limits';

/** A fixed-length key that keeps the client address itself out of the table. */
const keyOf = (text: string) => crypto.createHash('sha256').update(text).digest('base64url');

/**
 * express-rate-limit's counts kept in PostgreSQL by rate-limiter-flexible (the table of migration
 * 20261204000500_rate_limits), so every server on one database counts the same hits. A window starts at a
 * client's first hit and lasts `windowMs`, as in express-rate-limit's own memory store; `name`
 * keeps each limiter's counts apart and must be the same on every server.
 */
class PostgresStore implements Store {
  readonly localKeys = false;
  readonly prefix: string;
  private readonly limiter: RateLimiterPostgres;

  constructor(db: Knex, name: string, windowMs: number) {
    this.prefix = `${name}:`;
    this.limiter = new RateLimiterPostgres({
      storeClient: db,
      storeType: 'knex',
      tableName: RATE_LIMITS_TABLE,
      tableCreated: true,
      keyPrefix: name,
      // Only counted here, never refused by rate-limiter-flexible: express-rate-limit compares with the limit.
      points: Number.MAX_SAFE_INTEGER,
      duration: Math.ceil(windowMs / 1000),
    });
  }

  private info(res: { consumedPoints: number; msBeforeNext: number }): ClientRateLimitInfo {
    return { totalHits: res.consumedPoints, resetTime: res.msBeforeNext >= 0 ? new Date(Date.now() + res.msBeforeNext) : undefined };
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const res = await this.limiter.get(keyOf(key));
    return res ? this.info(res) : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    // penalty() adds a hit in one upsert (a new window when the last one ended) and never rejects.
    return this.info(await this.limiter.penalty(keyOf(key), 1));
  }

  async decrement(key: string): Promise<void> {
    await this.limiter.reward(keyOf(key), 1);
  }

  async resetKey(key: string): Promise<void> {
    await this.limiter.delete(keyOf(key));
  }
}

/**
 * Limits requests per client address to `limit` in each window of `windowMs`, answering 429 with
 * `message`; the counts live in PostgreSQL under `name`, shared by every server.
 */
export function clientRateLimit(db: Knex, { name, windowMs, limit, message }: { name: string; windowMs: number; limit: number; message: string }) {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PostgresStore(db, name, windowMs),
    handler: (_req, _res, next) => next(new AppError('rate_limited', message)),
  });
}

/** Limits attempts per client address on sign-in, reset and e-mailed-link routes; `name` is the limiter's own count. */
export function authRateLimit(db: Knex, name: string, max: number) {
  return clientRateLimit(db, { name, windowMs: 15 * 60 * 1000, limit: max, message: 'Too many attempts. Wait a few minutes and try again.' });
}

/** Limits a public form (the waiting list application) to `max` submissions per client address per hour. */
export function publicFormRateLimit(db: Knex, max: number) {
  return clientRateLimit(db, {
    name: 'apply',
    windowMs: 60 * 60 * 1000,
    limit: max,
    message: 'Too many applications from this connection. Try again in an hour.',
  });
}
