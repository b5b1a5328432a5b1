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
  const site = await db('sites').where({ id: opts.siteId, club_id: opts.clubId }).whereNull('archived_at').first('id');
  const items = site ? await seasonPlotStates(db, opts.seasonId, opts.siteId, opts.viewer) : [];
  return { items, page: 1, total: items.length };
}

/**
 * Where every plot of a site stands in a season: taken, offered, waiting for a renewal answer, or free.
 * A coordinator sees who; anyone else sees free or taken, and names only on their own holding or renewal.
 * An offer or renewal past its deadline at `now` has lapsed, whether or not the sweep has run.
 */
export async function seasonPlotStates(
  db: Db,
  seasonId: number,
  siteId: number,
  viewer: Viewer,
  now: Date = new Date(),
): Promise<PlotSeasonState[]> {
  const plots = await db('plots').where({ site_id: siteId }).whereNull('deleted_at').select('id');
  const holders = await db('allocations as a')
    .join('users as u', 'u.id', 'a.user_id')
    .where({ 'a.season_id': seasonId, 'a.status': 'active' })
    .select('a.plot_id', 'u.id as user_id', 'u.name');
  const offers = await db('offers as o')
    .join('applications as ap', 'ap.id', 'o.application_id')
    .where({ 'o.season_id': seasonId, 'o.status': 'pending' })
    .where('o.deadline', '>', now)
    .select('o.id', 'o.plot_id', 'o.application_id', 'o.deadline', 'ap.name');
  const renewals = await db('renewals as r')
    .join('users as u', 'u.id', 'r.user_id')
    .where({ 'r.season_id': seasonId, 'r.status': 'pending' })
    .where('r.deadline', '>', now)
    .select('r.id', 'r.plot_id', 'r.deadline', 'u.id as user_id', 'u.name');
  const byPlot = <T extends { plot_id: number }>(rows: T[]) => new Map(rows.map((r) => [r.plot_id, r]));
  const h = byPlot(holders);
  const o = byPlot(offers);
  const r = byPlot(renewals);
  const full = seesPeople(viewer);
  return plots.map(({ id }): PlotSeasonState => {
    const holder = h.get(id);
    const offer = o.get(id);
    const renewal = r.get(id);
    if (!full) {
      const ownHolding = holder?.user_id === viewer.userId;
      const ownRenewal = !holder && !offer && renewal?.user_id === viewer.userId;
      return {
        plotId: id,
        status: ownRenewal ? 'renewal_pending' : holder || offer || renewal ? 'taken' : 'free',
        holder: ownHolding ? { userId: holder.user_id, name: holder.name } : null,
        offer: null,
        renewal: ownRenewal ? { id: renewal.id, name: renewal.name, deadline: new Date(renewal.deadline).toISOString() } : null,
      };
    }
    return {
      plotId: id,
      status: holder ? 'taken' : offer ? 'offered' : renewal ? 'renewal_pending' : 'free',
      holder: holder ? { userId: holder.user_id, name: holder.name } : null,
      offer: offer
        ? { id: offer.id, applicationId: offer.application_id, name: offer.name, deadline: new Date(offer.deadline).toISOString() }
        : null,
      renewal: renewal ? { id: renewal.id, name: renewal.name, deadline: new Date(renewal.deadline).toISOString() } : null,
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
