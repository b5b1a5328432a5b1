import type { Knex } from 'knex';
import { applyDeclinePolicy } from '../services/offers';
import { recordPlotEvent } from '../services/plot-events';

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
    for (const o of offers) {
      await trx('offers').where({ id: o.id }).update({ status: 'lapsed', answered_at: now });
      await applyDeclinePolicy(trx, o, 'lapsed', now);
      await recordPlotEvent(trx, { plotId: o.plot_id, userId: null, kind: 'offer_lapsed', details: { summary: `Offer to ${o.name} lapsed at its deadline; the plot is free` } });
    }
    const renewals = await trx('renewals as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where('r.status', 'pending')
      .where('r.deadline', '<=', now)
      .forUpdate('r')
      .skipLocked()
      .select('r.id', 'r.plot_id', 'u.name');
    for (const r of renewals) {
      await trx('renewals').where({ id: r.id }).update({ status: 'lapsed', answered_at: now });
      await recordPlotEvent(trx, { plotId: r.plot_id, userId: null, kind: 'renewal_lapsed', details: { summary: `${r.name} did not answer the renewal in time; the plot is free` } });
    }
    return { offersLapsed: offers.length, renewalsLapsed: renewals.length };
  });
}
