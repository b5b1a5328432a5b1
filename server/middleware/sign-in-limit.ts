import crypto from 'node:crypto';
import type { Knex } from 'knex';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type { Config } from '../config';
import { AppError } from '../errors';

export const SIGN_IN_LIMITS_TABLE = 'sign_in_limits';

/** A fixed-length key that keeps the address itself out of the table. */
const keyOf = (text: string) => crypto.createHash('sha256').update(text.trim().toLowerCase()).digest('base64url');

export interface SignInLimiter {
  /**
   * Counts one attempt for the account and the client address, answering the seconds to wait when
   * either has used its failures (the attempt must then be refused); call before checking the password.
   */
  begin(email: string, address: string): Promise<{ retryAfterSeconds: number } | null>;
  /** A right password: the attempt does not count, and the account's count starts again. */
  succeeded(email: string, address: string): Promise<void>;
}

/**
 * Failed sign-ins counted in PostgreSQL (so several servers share the counts): per account, so a
 * password cannot be guessed from many addresses, and per client address, where only failures
 * count, so many members signing in from one hall network are not locked out.
 */
export function createSignInLimiter(db: Knex, config: Config): SignInLimiter {
  const seconds = config.signInLockMinutes * 60;
  const common = { storeClient: db, storeType: 'knex', tableName: SIGN_IN_LIMITS_TABLE, tableCreated: true, duration: seconds, blockDuration: seconds };
  const perAccount = new RateLimiterPostgres({ ...common, keyPrefix: 'account', points: config.signInMaxFailuresPerAccount });
  const perAddress = new RateLimiterPostgres({ ...common, keyPrefix: 'address', points: config.signInMaxFailuresPerAddress });

  const locked = (res: RateLimiterRes) => ({ retryAfterSeconds: Math.max(1, Math.ceil(res.msBeforeNext / 1000)) });

  return {
    async begin(email, address) {
      const account = keyOf(email);
      const from = keyOf(address);
      try {
        await perAddress.consume(from);
      } catch (e) {
        if (e instanceof RateLimiterRes) return locked(e);
        throw e;
      }
      try {
        await perAccount.consume(account);
      } catch (e) {
        // The address's count stands: a locked account's attempts are failures too.
        if (e instanceof RateLimiterRes) return locked(e);
        throw e;
      }
      return null;
    },
    async succeeded(email, address) {
      await perAccount.delete(keyOf(email));
      await perAddress.reward(keyOf(address), 1);
    },
  };
}

/** The 429 a locked sign-in answers (the route sets Retry-After). */
export const signInLocked = () => new AppError('rate_limited', 'Too many failed sign-ins. Wait a few minutes and try again.');
