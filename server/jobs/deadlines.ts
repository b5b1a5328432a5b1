import type { Knex } from 'knex';
import { lapseOverdue } from '../services/offers';

/**
 * Lapses every open offer and renewal whose deadline has passed at `now`. Rows are claimed
 * with FOR UPDATE SKIP LOCKED, so several servers running this at once never handle one twice.
 */
export async function sweepDeadlines(db: Knex, now: Date): Promise<{ offersLapsed: number; renewalsLapsed: number }> {
  return db.transaction((trx) => lapseOverdue(trx, {}, now, { skipLocked: true }));
}
