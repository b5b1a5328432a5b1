import type { Knex } from 'knex';
import { deadlineAfterDays, formatDate } from '@shared/dates';
import { formatMoney } from '@shared/fees/compute';
import type { LinkPreview, Offer } from '@shared/schemas/seasons';
import { AppError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { offerMail, welcomeHolderMail } from '../mail/templates';
import { enqueueMail, kickMail } from './outbox';
import { createFeeForAllocation } from './fee-charges';
import { quoteForPerson } from './fee-quotes';
import { plotFacts } from './link-preview';
import { clubIdVia, grantRoles, type ClubLookup } from './memberships';
import { createPasswordLink } from './password-resets';
import { recordPlotEvent } from './plot-events';
import { clubOfPlot } from './plots';
import { plotBlocker } from './season-plots';
import { hashToken, newToken } from './tokens';

function toOffer(r: { id: number; season_id: number; plot_id: number; application_id: number; status: Offer['status']; deadline: Date; created_at: Date }): Offer {
  return {
    id: r.id,
    seasonId: r.season_id,
    plotId: r.plot_id,
    applicationId: r.application_id,
    status: r.status,
    deadline: r.deadline.toISOString(),
    createdAt: r.created_at.toISOString(),
  };
}

/** The club an offer belongs to, or null. */
export const clubOfOffer: ClubLookup = (db, offerId) =>
  db('offers as o').join('seasons as s', 's.id', 'o.season_id').where('o.id', offerId).select('s.club_id');

/**
 * Offers a free plot to someone on the waiting list. The plot row is locked so two coordinators
 * dropping onto the same plot at once get one offer and one refusal; unique indexes back it up.
 */
export async function createOffer(
  db: Knex,
  mailer: Mailer,
  opts: { seasonId: number; plotId: number; applicationId: number; userId: number; deadline?: Date; publicUrl: string; now?: Date },
): Promise<Offer> {
  const now = opts.now ?? new Date();
  const offer = await db
    .transaction(async (trx) => {
      const season = await trx('seasons as s').join('clubs as c', 'c.id', 's.club_id').where('s.id', opts.seasonId).first('s.*', 'c.name as club_name', 'c.offer_days', 'c.allow_multiple_offers', 'c.currency', 'c.time_zone');
      if (!season) throw notFound('The season');
      const plot = await trx('plots as p')
        .join('sites as st', 'st.id', 'p.site_id')
        .where('p.id', opts.plotId)
        .whereNull('p.deleted_at')
        .whereNull('st.archived_at')
        .forUpdate('p')
        .first('p.id', 'p.label', 'p.kind', 'st.club_id');
      if (!plot || plot.club_id !== season.club_id) {
        throw new AppError('validation_failed', 'That plot is not on one of this club’s sites.', { plotId: 'Unknown plot' });
      }
      if (plot.kind === 'shared_bed') {
        throw new AppError('validation_failed', `${plot.label} is a shared bed: the club tends it together, so it is not offered to one person.`, {
          plotId: 'Shared beds are not offered',
        });
      }
      // An offer or renewal past its deadline has lapsed, swept or not: lapse it here, in this transaction.
      await lapseOverdue(trx, { plotId: opts.plotId }, now);
      await lapseOverdue(trx, { applicationId: opts.applicationId }, now);
      const blocker = await plotBlocker(trx, opts.seasonId, opts.plotId, now);
      if (blocker) throw new AppError('conflict', `Plot ${plot.label} cannot be offered: ${blocker}.`);
      const app = await trx('applications').where({ id: opts.applicationId }).forUpdate().first();
      if (!app || app.club_id !== season.club_id) {
        throw new AppError('validation_failed', 'That person is not on this club’s waiting list.', { applicationId: 'Unknown person' });
      }
      const mayHoldMore = season.allow_multiple_offers && app.status === 'offered';
      if (app.status !== 'waiting' && !mayHoldMore) {
        throw new AppError(
          'conflict',
          app.status === 'offered'
            ? `${app.name} already has an open offer; the club allows one at a time.`
            : `${app.name} is no longer waiting (${app.status}).`,
        );
      }
      // By default the offer stays open to the end of the club's day, offer_days from today.
      const deadline = opts.deadline ?? deadlineAfterDays(season.offer_days, season.time_zone, now);
      if (deadline <= now) throw new AppError('validation_failed', 'The deadline must be in the future.', { deadline: 'Choose a later date' });
      const { token, hash } = newToken();
      const [row] = await trx('offers')
        .insert({
          season_id: opts.seasonId,
          plot_id: opts.plotId,
          application_id: app.id,
          token_hash: hash,
          deadline,
          is_exclusive: !season.allow_multiple_offers,
          created_by_user_id: opts.userId,
        })
        .returning('*');
      await trx('applications').where({ id: app.id }).update({ status: 'offered', updated_at: now });
      await recordPlotEvent(trx, {
        plotId: plot.id,
        userId: opts.userId,
        kind: 'offered',
        details: { summary: `Offered to ${app.name} for ${season.year}, answer by ${formatDate(deadline, season.time_zone)}` },
      });
      const quote = await quoteForPerson(trx, season.club_id, plot.id, app.user_id);
      const facts = await plotFacts(trx, plot.id);
      // The offer e-mail is written with the offer, in the same transaction, and sent from the outbox.
      await enqueueMail(trx, { clubId: season.club_id, kind: 'offer' }, offerMail({
        to: app.email,
        name: app.name,
        clubName: season.club_name,
        year: season.year,
        plotLabel: facts.label,
        siteName: facts.siteName,
        size: `${facts.size}, ${facts.area}`,
        fee: `${formatMoney(quote.plotFeeMinor, quote.currency)} plus a refundable deposit of ${formatMoney(quote.depositMinor, quote.currency)}`,
        url: `${opts.publicUrl}/respond/offer?token=${encodeURIComponent(token)}`,
        deadline,
        timeZone: season.time_zone,
      }));
      return toOffer(row);
    })
    .catch((err: { code?: string; constraint?: string }) => {
      // The partial unique indexes are the last word if two requests slipped past the checks.
      if (err?.code === '23505' && err.constraint === 'offers_one_per_plot') {
        throw new AppError('conflict', 'Someone else has just offered this plot.');
      }
      if (err?.code === '23505' && err.constraint === 'offers_one_per_person') {
        throw new AppError('conflict', 'That person has just been offered another plot.');
      }
      throw err;
    });
  kickMail(db, mailer);
  return offer;
}

async function findOffer(db: Knex | Knex.Transaction, token: string, lock = false) {
  const q = db('offers as o')
    .join('applications as a', 'a.id', 'o.application_id')
    .join('seasons as s', 's.id', 'o.season_id')
    .join('clubs as c', 'c.id', 's.club_id')
    .where('o.token_hash', hashToken(token))
    .first('o.*', 'a.name', 'a.email', 'a.user_id', 's.year', 's.club_id', 'c.name as club_name', 'c.declined_offer_policy', 'c.time_zone');
  if (lock) q.forUpdate('o');
  const row = await q;
  if (!row) throw notFound('That offer link');
  return row;
}

function assertPending(row: { status: string; deadline: Date }, now: Date) {
  if (row.status === 'withdrawn') throw new AppError('gone', 'This offer has been closed by the club.');
  if (row.status !== 'pending') throw new AppError('gone', `This offer has already been ${row.status}.`);
  if (row.deadline <= now) throw new AppError('gone', 'This offer has expired; the plot has gone to the next person.');
}

/** Whether the plot is still on the map (not removed, its site not archived). */
export async function plotStillThere(trx: Knex.Transaction, plotId: number): Promise<boolean> {
  return (await clubIdVia(trx, clubOfPlot, plotId)) !== null;
}

const PLOT_REMOVED = 'The club has taken this plot off its map since the offer was sent, so it can no longer be accepted. Your place on the waiting list is kept.';

/**
 * Closes an open offer whose plot has been removed (the person keeps their place), in its own
 * transaction so the refusal that follows does not roll it back.
 */
async function closeOfferOfRemovedPlot(db: Knex, offerId: number, now: Date) {
  await db.transaction(async (trx) => {
    const o = await trx('offers as o').join('applications as a', 'a.id', 'o.application_id').where('o.id', offerId).forUpdate('o').first('o.*', 'a.name');
    if (!o || o.status !== 'pending') return;
    await trx('offers').where({ id: o.id }).update({ status: 'withdrawn', answered_at: now });
    await restoreWaiting(trx, o.application_id, now);
    await recordPlotEvent(trx, { plotId: o.plot_id, userId: null, kind: 'offer_withdrawn', details: { summary: `Offer to ${o.name} closed: the plot was removed` } });
  });
}

/** Puts an offered person back to waiting (place kept) unless they still have another open offer. */
async function restoreWaiting(trx: Knex.Transaction, applicationId: number, now: Date) {
  const other = await trx('offers').where({ application_id: applicationId, status: 'pending' }).first('id');
  if (other) return;
  await trx('applications').where({ id: applicationId, status: 'offered' }).update({ status: 'waiting', updated_at: now });
}

/**
 * Lapses, inside the caller's transaction, every open offer and renewal past its deadline on a plot
 * or of a person, as the sweep would: the deadline decides, not when the sweep last ran.
 */
export async function lapseOverdue(
  trx: Knex.Transaction,
  where: { plotId?: number; applicationId?: number; clubId?: number },
  now: Date,
  opts: { skipLocked?: boolean } = {},
): Promise<{ offersLapsed: number; renewalsLapsed: number }> {
  const offers = await trx('offers as o')
    .join('applications as a', 'a.id', 'o.application_id')
    .join('seasons as s', 's.id', 'o.season_id')
    .join('clubs as c', 'c.id', 's.club_id')
    .where('o.status', 'pending')
    .where('o.deadline', '<=', now)
    .modify((q) => {
      if (where.plotId !== undefined) q.where('o.plot_id', where.plotId);
      if (where.applicationId !== undefined) q.where('o.application_id', where.applicationId);
      if (where.clubId !== undefined) q.where('s.club_id', where.clubId);
    })
    .forUpdate('o')
    .modify((q) => {
      if (opts.skipLocked) q.skipLocked();
    })
    .select('o.id', 'o.plot_id', 'o.application_id', 'a.name', 'c.declined_offer_policy');
  for (const o of offers) await lapseOffer(trx, o, now);
  // Renewals belong to a plot: lapsed for one plot, or for all when nothing narrows the call (the sweep).
  const everything = where.plotId === undefined && where.applicationId === undefined && where.clubId === undefined;
  let renewalsLapsed = 0;
  if (where.plotId !== undefined || everything) {
    const renewals = await trx('renewals as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where('r.status', 'pending')
      .where('r.deadline', '<=', now)
      .modify((q) => {
        if (where.plotId !== undefined) q.where('r.plot_id', where.plotId);
      })
      .forUpdate('r')
      .modify((q) => {
        if (opts.skipLocked) q.skipLocked();
      })
      .select('r.id', 'r.plot_id', 'u.name');
    for (const r of renewals) await lapseRenewal(trx, r, now);
    renewalsLapsed = renewals.length;
  }
  return { offersLapsed: offers.length, renewalsLapsed };
}

/** Lapses one open offer at its deadline; the person follows the club's rule. Inside the caller's transaction. */
export async function lapseOffer(
  trx: Knex.Transaction,
  o: { id: number; plot_id: number; application_id: number; name: string; declined_offer_policy: string },
  now: Date,
) {
  await trx('offers').where({ id: o.id }).update({ status: 'lapsed', answered_at: now });
  await applyDeclinePolicy(trx, o, 'lapsed', now);
  await recordPlotEvent(trx, { plotId: o.plot_id, userId: null, kind: 'offer_lapsed', details: { summary: `Offer to ${o.name} lapsed at its deadline; the plot is free` } });
}

/** Lapses one open renewal at its deadline: the plot is free. Inside the caller's transaction. */
export async function lapseRenewal(trx: Knex.Transaction, r: { id: number; plot_id: number; name: string }, now: Date) {
  await trx('renewals').where({ id: r.id }).update({ status: 'lapsed', answered_at: now });
  await recordPlotEvent(trx, { plotId: r.plot_id, userId: null, kind: 'renewal_lapsed', details: { summary: `${r.name} did not answer the renewal in time; the plot is free` } });
}

/** What the offer page shows. */
export async function previewOffer(db: Knex, token: string): Promise<LinkPreview> {
  const o = await findOffer(db, token);
  const quote = await quoteForPerson(db, o.club_id, o.plot_id, o.user_id);
  return {
    kind: 'offer',
    status: o.status,
    clubName: o.club_name,
    name: o.name,
    year: o.year,
    plot: await plotFacts(db, o.plot_id),
    deadline: o.deadline.toISOString(),
    timeZone: o.time_zone,
    fee: { plotFeeMinor: quote.plotFeeMinor, depositMinor: quote.depositMinor, currency: quote.currency },
  };
}

/**
 * Accepts an offer once, before its deadline: the person becomes a plot holder of the club for
 * the season (an account is made for them if they have none) and the fee becomes due.
 */
export async function acceptOffer(db: Knex, mailer: Mailer, opts: { token: string; publicUrl: string; now?: Date }) {
  const now = opts.now ?? new Date();
  const outcome = await db.transaction(async (trx) => {
    const o = await findOffer(trx, opts.token, true);
    assertPending(o, now);
    if (!(await plotStillThere(trx, o.plot_id))) return { removedOfferId: o.id as number, mail: false, message: '' };
    // The person may hold several offers (if the club allows it) but take only one plot.
    const app = await trx('applications').where({ id: o.application_id }).forUpdate().first('status');
    if (app?.status !== 'offered') {
      throw new AppError('gone', app?.status === 'allocated' ? 'You have already accepted another plot from this club.' : 'This offer is no longer open: you are not on the waiting list any more.');
    }
    let user = await trx('users').whereRaw('lower(email) = lower(?)', [o.email]).first('id', 'password_hash');
    if (!user) {
      [user] = await trx('users').insert({ email: o.email.toLowerCase(), name: o.name, password_hash: null }).returning(['id', 'password_hash']);
    }
    await grantRoles(trx, o.club_id, user.id, ['plot_holder']);
    const [allocation] = await trx('allocations')
      .insert({ season_id: o.season_id, plot_id: o.plot_id, user_id: user.id, source: 'offer' })
      .returning('id');
    const feeId = await createFeeForAllocation(trx, { allocationId: allocation.id, now });
    await trx('offers').where({ id: o.id }).update({ status: 'accepted', answered_at: now });
    await trx('applications').where({ id: o.application_id }).update({ status: 'allocated', user_id: user.id, updated_at: now });
    // Their other open offers close with this answer, and those plots are free for the next person.
    const others = await trx('offers').where({ application_id: o.application_id, status: 'pending' }).forUpdate().select('id', 'plot_id');
    for (const other of others) {
      await trx('offers').where({ id: other.id }).update({ status: 'withdrawn', answered_at: now });
      await recordPlotEvent(trx, {
        plotId: other.plot_id,
        userId: null,
        kind: 'offer_withdrawn',
        details: { summary: `Offer to ${o.name} closed: they accepted another plot; this plot is free` },
      });
    }
    await recordPlotEvent(trx, {
      plotId: o.plot_id,
      userId: user.id,
      kind: 'accepted',
      details: { summary: `${o.name} accepted the offer and holds the plot for ${o.year}` },
    });
    const fee = await trx('fees').where({ id: feeId }).first();
    const passwordUrl = user.password_hash ? null : await createPasswordLink(trx, { userId: user.id, publicUrl: opts.publicUrl, now });
    const facts = await plotFacts(trx, o.plot_id);
    await enqueueMail(trx, { clubId: o.club_id, kind: 'welcome_holder' }, welcomeHolderMail({
        to: o.email,
        name: o.name,
        clubName: o.club_name,
        plotLabel: facts.label,
        siteName: facts.siteName,
        year: o.year,
        feeDue: formatMoney(fee.plot_fee_minor + fee.deposit_minor, fee.currency),
        dueOn: fee.due_on,
        timeZone: o.time_zone,
        passwordUrl,
      }));
    return {
      mail: true,
      message: `Plot ${facts.label} is yours for ${o.year}. We have sent you an e-mail with what happens next.`,
      removedOfferId: undefined,
    };
  });
  if (!outcome.mail) {
    await closeOfferOfRemovedPlot(db, outcome.removedOfferId!, now);
    throw new AppError('gone', PLOT_REMOVED);
  }
  kickMail(db, mailer);
  return { status: 'accepted', message: outcome.message };
}

/** Moves a person who declined or let an offer lapse, as the club's policy says; inside the caller's transaction. */
export async function applyDeclinePolicy(
  trx: Knex.Transaction,
  o: { application_id: number; declined_offer_policy: string },
  kind: 'declined' | 'lapsed',
  now: Date,
) {
  // Someone who took another plot, or still has another open offer, stays where they are.
  const app = await trx('applications').where({ id: o.application_id }).first('status');
  if (app?.status !== 'offered') return;
  if (await trx('offers').where({ application_id: o.application_id, status: 'pending' }).first('id')) return;
  if (o.declined_offer_policy === 'remove') {
    await trx('applications')
      .where({ id: o.application_id })
      .update({ status: 'removed', removed_reason: kind === 'declined' ? 'Declined an offer' : 'Did not answer an offer in time', updated_at: now });
    await trx('waitlist_moves').insert({ application_id: o.application_id, kind: 'removed', reason: `Offer ${kind}; the club removes people who ${kind === 'declined' ? 'decline' : 'do not answer'}` });
  } else {
    await trx('applications').where({ id: o.application_id }).update({ status: 'waiting', queue_at: now, updated_at: now });
    await trx('waitlist_moves').insert({ application_id: o.application_id, kind: `${kind}_moved`, reason: `Offer ${kind}; moved to the end of the list (club rule)` });
  }
}

/** Declines an offer: the plot is free again and the person is moved or removed as the club's rule says. */
export async function declineOffer(db: Knex, opts: { token: string; now?: Date }) {
  const now = opts.now ?? new Date();
  return db.transaction(async (trx) => {
    const o = await findOffer(trx, opts.token, true);
    assertPending(o, now);
    await trx('offers').where({ id: o.id }).update({ status: 'declined', answered_at: now });
    await applyDeclinePolicy(trx, o, 'declined', now);
    await recordPlotEvent(trx, { plotId: o.plot_id, userId: null, kind: 'declined', details: { summary: `${o.name} declined the offer; the plot is free` } });
    return { status: 'declined', message: 'Thank you for letting us know. The plot will be offered to the next person.' };
  });
}

/** The coordinator takes back an open offer; the person keeps their place on the waiting list. */
export async function withdrawOffer(db: Knex, opts: { offerId: number; userId: number; now?: Date }) {
  const now = opts.now ?? new Date();
  await db.transaction(async (trx) => {
    const o = await trx('offers as o').join('applications as a', 'a.id', 'o.application_id').where('o.id', opts.offerId).forUpdate('o').first('o.*', 'a.name');
    if (!o) throw notFound('The offer');
    if (o.status !== 'pending') throw new AppError('conflict', `This offer has already been ${o.status}.`);
    // Past its deadline it has lapsed, swept or not; withdrawing would wrongly keep the person's place.
    if (o.deadline <= now) throw new AppError('conflict', 'This offer has already lapsed at its deadline.');
    await trx('offers').where({ id: o.id }).update({ status: 'withdrawn', answered_at: now });
    await restoreWaiting(trx, o.application_id, now);
    await recordPlotEvent(trx, { plotId: o.plot_id, userId: opts.userId, kind: 'offer_withdrawn', details: { summary: `Offer to ${o.name} withdrawn` } });
  });
}

/**
 * Lapses a club's overdue offers before its waiting list is read, so nobody reads as "offered" past
 * the deadline while the sweep has yet to run. Writes only when something is overdue.
 */
export async function lapseOverdueOffersOfClub(db: Knex, clubId: number, now: Date) {
  const overdue = await db('offers as o')
    .join('seasons as s', 's.id', 'o.season_id')
    .where({ 's.club_id': clubId, 'o.status': 'pending' })
    .where('o.deadline', '<=', now)
    .first('o.id');
  if (overdue) await db.transaction(async (trx) => void (await lapseOverdue(trx, { clubId }, now)));
}
