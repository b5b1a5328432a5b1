import type { OfferQuote } from '@shared/schemas/seasons';
import { deadlineAfterDays } from '@shared/dates';
import { meetsNeeds } from '@shared/spring-round/suggest';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import { quoteForPerson } from './fee-quotes';

/**
 * What offering this plot to this person would send, for the coordinator's confirm step: read
 * only, nothing is written and no e-mail goes. Refuses what the offer itself would refuse
 * (a plot that is not free, a person no longer waiting) so the confirm never promises more.
 */
export async function quoteOffer(
  db: Db,
  opts: { seasonId: number; clubId: number; plotId: number; applicationId: number; now?: Date },
): Promise<OfferQuote> {
  const now = opts.now ?? new Date();
  const season = await db('seasons as s')
    .join('clubs as c', 'c.id', 's.club_id')
    .where({ 's.id': opts.seasonId, 's.club_id': opts.clubId })
    .first('s.id', 's.club_id', 'c.offer_days', 'c.time_zone');
  if (!season) throw notFound('The season');
  const plot = await db('plots as p')
    .join('sites as st', 'st.id', 'p.site_id')
    .where({ 'p.id': opts.plotId, 'st.club_id': opts.clubId })
    .whereNull('p.deleted_at')
    .whereNull('st.archived_at')
    .first('p.id', 'p.label', 'p.kind', 'p.is_accessible', 'p.site_id', 'st.name as site_name');
  if (!plot) throw notFound('The plot');
  if (plot.kind === 'shared_bed') throw new AppError('conflict', 'A shared bed is tended by the club together and is not offered to one person.');
  const app = await db('applications').where({ id: opts.applicationId, club_id: opts.clubId }).first();
  if (!app) throw notFound('The person on the waiting list');
  if (app.status !== 'waiting') throw new AppError('conflict', `${app.name} is no longer waiting for a plot.`);
  const quote = await quoteForPerson(db, opts.clubId, plot.id, app.user_id);
  return {
    personName: app.name,
    personEmail: app.email,
    plotLabel: plot.label,
    siteName: plot.site_name,
    // The same rule as making the offer: the end of the club's day, its offer days from today.
    deadline: deadlineAfterDays(season.offer_days, season.time_zone, now).toISOString(),
    offerDays: season.offer_days,
    fee: {
      plotFeeMinor: quote.plotFeeMinor,
      depositMinor: quote.depositMinor,
      totalMinor: quote.plotFeeMinor + quote.depositMinor,
      currency: quote.currency,
    },
    fitsNeeds: meetsNeeds(
      {
        id: app.id,
        preferredSize: app.preferred_size,
        needsAccessible: app.needs_accessible,
        needsRaised: app.needs_raised,
        preferredSiteId: app.preferred_site_id,
      },
      { kind: plot.kind, isAccessible: plot.is_accessible, siteId: plot.site_id },
    ),
  };
}
