import type { Knex } from 'knex';
import type { PlotSeasonState } from '@shared/schemas/seasons';
import type { Db } from '../db/knex';
import { seesPeople, type Viewer } from './visibility';

/**
 * The season's plot states for one of the club's live sites, as a list; a site of another club or an
 * archived one gives an empty list.
 */
export async function listSeasonPlotStates(
  db: Db,
  opts: { seasonId: number; clubId: number; siteId: number; viewer: Viewer },
): Promise<{ items: PlotSeasonState[]; page: number; total: number }> {
  const items = await seasonPlotStates(db, opts.seasonId, opts.siteId, opts.viewer, new Date(), opts.clubId);
  return { items, page: 1, total: items.length };
}

interface StateRow {
  plot_id: number;
  holder_user_id: number | null;
  holder_name: string | null;
  offer_id: number | null;
  offer_application_id: number | null;
  offer_deadline: Date | null;
  offer_name: string | null;
  renewal_id: number | null;
  renewal_user_id: number | null;
  renewal_deadline: Date | null;
  renewal_name: string | null;
}

/**
 * Where every plot of a site stands in a season: taken, offered, waiting for a renewal answer, or free.
 * A coordinator sees who; anyone else sees free or taken, and names only on their own holding or renewal.
 * An offer or renewal past its deadline at `now` has lapsed, whether or not the sweep has run.
 * One query (the map reads it on every visit): each live plot with its active holder, pending offer and
 * pending renewal, each at most one by the unique indexes. With `clubId`, a site of another club or an
 * archived site gives no plots.
 */
export async function seasonPlotStates(
  db: Db,
  seasonId: number,
  siteId: number,
  viewer: Viewer,
  now: Date = new Date(),
  clubId?: number,
): Promise<PlotSeasonState[]> {
  const { rows }: { rows: StateRow[] } = await db.raw(
    `select p.id as plot_id,
            h.user_id as holder_user_id, h.name as holder_name,
            o.id as offer_id, o.application_id as offer_application_id, o.deadline as offer_deadline, o.name as offer_name,
            r.id as renewal_id, r.user_id as renewal_user_id, r.deadline as renewal_deadline, r.name as renewal_name
       from plots p
       join sites s on s.id = p.site_id
       left join lateral (
         select a.user_id, u.name from allocations a join users u on u.id = a.user_id
          where a.season_id = :seasonId and a.plot_id = p.id and a.status = 'active' limit 1) h on true
       left join lateral (
         select o.id, o.application_id, o.deadline, ap.name from offers o join applications ap on ap.id = o.application_id
          where o.season_id = :seasonId and o.plot_id = p.id and o.status = 'pending' and o.deadline > :now limit 1) o on true
       left join lateral (
         select r.id, r.user_id, r.deadline, u.name from renewals r join users u on u.id = r.user_id
          where r.season_id = :seasonId and r.plot_id = p.id and r.status = 'pending' and r.deadline > :now limit 1) r on true
      where p.site_id = :siteId and p.deleted_at is null
        and (cast(:clubId as integer) is null or (s.club_id = :clubId and s.archived_at is null))
      order by p.id`,
    { seasonId, siteId, now, clubId: clubId ?? null },
  );
  const full = seesPeople(viewer);
  return rows.map((row): PlotSeasonState => {
    const holder = row.holder_user_id !== null ? { userId: row.holder_user_id, name: row.holder_name! } : null;
    const hasOffer = row.offer_id !== null;
    const hasRenewal = row.renewal_id !== null;
    const renewal = hasRenewal ? { id: row.renewal_id!, name: row.renewal_name!, deadline: new Date(row.renewal_deadline!).toISOString() } : null;
    if (!full) {
      const ownHolding = holder?.userId === viewer.userId;
      const ownRenewal = !holder && !hasOffer && row.renewal_user_id === viewer.userId;
      return {
        plotId: row.plot_id,
        status: ownRenewal ? 'renewal_pending' : holder || hasOffer || hasRenewal ? 'taken' : 'free',
        holder: ownHolding ? holder : null,
        offer: null,
        renewal: ownRenewal ? renewal : null,
      };
    }
    return {
      plotId: row.plot_id,
      status: holder ? 'taken' : hasOffer ? 'offered' : hasRenewal ? 'renewal_pending' : 'free',
      holder,
      offer: hasOffer
        ? { id: row.offer_id!, applicationId: row.offer_application_id!, name: row.offer_name!, deadline: new Date(row.offer_deadline!).toISOString() }
        : null,
      renewal,
    };
  });
}

/** Refuses, with a 409-worthy message, a plot that is not free in the season (call with the plot row locked). */
export async function plotBlocker(trx: Knex.Transaction, seasonId: number, plotId: number, now: Date = new Date()): Promise<string | null> {
  const taken = await trx('allocations as a')
    .join('users as u', 'u.id', 'a.user_id')
    .where({ 'a.season_id': seasonId, 'a.plot_id': plotId, 'a.status': 'active' })
    .first('u.name');
  if (taken) return `it is held by ${taken.name} this season`;
  const offered = await trx('offers as o')
    .join('applications as ap', 'ap.id', 'o.application_id')
    .where({ 'o.season_id': seasonId, 'o.plot_id': plotId, 'o.status': 'pending' })
    .where('o.deadline', '>', now)
    .first('ap.name');
  if (offered) return `it is already offered to ${offered.name}`;
  const renewing = await trx('renewals as r')
    .join('users as u', 'u.id', 'r.user_id')
    .where({ 'r.season_id': seasonId, 'r.plot_id': plotId, 'r.status': 'pending' })
    .where('r.deadline', '>', now)
    .first('u.name');
  if (renewing) return `${renewing.name} has not yet answered the renewal for it`;
  return null;
}
