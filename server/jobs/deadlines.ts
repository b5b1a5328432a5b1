import type { Knex } from 'knex';
import { lapseOffer, lapseRenewal } from '../services/offers';

/**
 * Lapses every open offer and renewal whose deadline has passed at `now`. Rows are claimed
 * with FOR UPDATE SKIP LOCKED, so several servers running this at once never handle one twice.
 */
export async function sweepDeadlines(db: Knex, now: Date): Promise<{ offersLapsed: number; renewalsLapsed: number }> {
  return db.transaction(async (trx) => {
    const offers = await trx('offers as o')
      .join('applications as a', 'a.id', 'o.application_id')
      .join('seasons as s', 's.id', 'o.season_id')
      .join('clubs as c', 'c.id', 's.club_id')
      .where('o.status', 'pending')
      .where('o.deadline', '<=', now)
      .forUpdate('o')
      .skipLocked()
      .select('o.id', 'o.plot_id', 'o.application_id', 'a.name', 'c.declined_offer_policy');
    for (const o of offers) await lapseOffer(trx, o, now);
    const renewals = await trx('renewals as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where('r.status', 'pending')
      .where('r.deadline', '<=', now)
      .forUpdate('r')
      .skipLocked()
      .select('r.id', 'r.plot_id', 'u.name');
    for (const r of renewals) await lapseRenewal(trx, r, now);
    return { offersLapsed: offers.length, renewalsLapsed: renewals.length };
  });
}
