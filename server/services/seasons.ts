import type { Knex } from 'knex';
import { deadlineAfterDays, formatDate } from '@shared/dates';
import type { Season, SeasonOpeningPreview } from '@shared/schemas/seasons';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import type { Mailer } from '../mail/mailer';
import { renewalMail } from '../mail/templates';
import { enqueueMail, kickMail } from './outbox';
import { recordPlotEvent } from './plot-events';
import { newToken } from './tokens';
import type { ClubLookup } from './memberships';

/** The club a season belongs to, or null. */
export const clubOfSeason: ClubLookup = (db, seasonId) => db('seasons').where({ id: seasonId }).select('club_id');

async function withCounts(
  db: Db,
  rows: Array<{ id: number; club_id: number; year: number; renewal_deadline: Date | null; created_at: Date; opened_by: string | null }>,
  now: Date = new Date(),
): Promise<Season[]> {
  const ids = rows.map((r) => r.id);
  // A renewal still pending past its deadline counts as lapsed, swept or not.
  const renewals = await db('renewals')
    .whereIn('season_id', ids)
    .groupBy('season_id', 'shown_status')
    .select('season_id', db.raw("case when status = 'pending' and deadline <= ? then 'lapsed' else status end as shown_status", [now]))
    .count({ n: '*' });
  const offers = await db('offers').whereIn('season_id', ids).where({ status: 'pending' }).where('deadline', '>', now).groupBy('season_id').select('season_id').count({ n: '*' });
  const taken = await db('allocations').whereIn('season_id', ids).where({ status: 'active' }).groupBy('season_id').select('season_id').count({ n: '*' });
  const pick = (list: Array<Record<string, unknown>>, id: number, status?: string) =>
    Number(list.find((r) => r.season_id === id && (status === undefined || r.shown_status === status))?.n ?? 0);
  return rows.map((r) => ({
    id: r.id,
    clubId: r.club_id,
    year: r.year,
    renewalDeadline: r.renewal_deadline ? r.renewal_deadline.toISOString() : null,
    createdAt: r.created_at.toISOString(),
    openedBy: r.opened_by,
    counts: {
      renewalsPending: pick(renewals, r.id, 'pending'),
      renewalsKept: pick(renewals, r.id, 'kept'),
      renewalsReleased: pick(renewals, r.id, 'released'),
      renewalsLapsed: pick(renewals, r.id, 'lapsed'),
      offersPending: pick(offers, r.id),
      taken: pick(taken, r.id),
    },
  }));
}

const seasonRows = (db: Db) =>
  db('seasons as s').leftJoin('users as u', 'u.id', 's.opened_by_user_id').select('s.*', 'u.name as opened_by');

/** A club's seasons, newest first. */
export async function listSeasons(db: Db, clubId: number) {
  const rows = await seasonRows(db).where('s.club_id', clubId).orderBy('s.year', 'desc');
  return { items: await withCounts(db, rows), page: 1, total: rows.length };
}

/** One season with its counts. */
export async function getSeason(db: Db, seasonId: number): Promise<Season> {
  const row = await seasonRows(db).where('s.id', seasonId).first();
  if (!row) throw notFound('The season');
  return (await withCounts(db, [row]))[0];
}

/** Holders of the club's latest season before `year`, each with what they still owe on its fee. */
export async function previousHolders(trx: Db, clubId: number, year: number) {
  const prev = await trx('seasons').where({ club_id: clubId }).where('year', '<', year).orderBy('year', 'desc').first('id', 'year');
  if (!prev) return [];
  const rows = await trx('allocations as a')
    .join('users as u', 'u.id', 'a.user_id')
    .join('plots as p', 'p.id', 'a.plot_id')
    .join('sites as s', 's.id', 'p.site_id')
    .leftJoin('fees as f', 'f.allocation_id', 'a.id')
    .where({ 'a.season_id': prev.id, 'a.status': 'active' })
    .select(
      'p.deleted_at as plot_removed_at',
      's.archived_at as site_archived_at',
      'a.id as allocation_id',
      'a.plot_id',
      'u.id as user_id',
      'u.name',
      'u.email',
      'p.label',
      's.name as site_name',
      trx.raw(
        `coalesce(f.plot_fee_minor + f.deposit_minor - (select coalesce(sum(amount_minor), 0) from payments where fee_id = f.id and kind = 'payment'), 0) as owed`,
      ),
    );
  return rows.map((r) => ({ ...r, owed: Number(r.owed) }));
}

type PreviousHolder = Awaited<ReturnType<typeof previousHolders>>[number];

/**
 * Who a new season's renewals go to: last season's holders whose plot is still on the map and
 * whose fee is paid. The others are left out, each with the reason the coordinator is shown.
 */
async function renewalPlan(trx: Db, clubId: number, year: number) {
  const renew: PreviousHolder[] = [];
  const leftOut: Array<{ holder: PreviousHolder; reason: string; owes: boolean }> = [];
  for (const h of await previousHolders(trx, clubId, year)) {
    if (h.plot_removed_at) leftOut.push({ holder: h, reason: 'The plot was removed from the map', owes: false });
    else if (h.site_archived_at) leftOut.push({ holder: h, reason: `The site ${h.site_name} is archived`, owes: false });
    else if (h.owed > 0) leftOut.push({ holder: h, reason: 'Last season’s fee is not fully paid', owes: true });
    else renew.push(h);
  }
  return { renew, leftOut };
}

/**
 * Refuses a season that cannot be opened: one already open, one before a later season, or a
 * renewal deadline that is past or not after the previous season's (its renewals would still be running).
 */
async function checkOpening(trx: Db, clubId: number, year: number, renewalDeadline: Date, timeZone: string, now: Date) {
  if (renewalDeadline <= now) {
    throw new AppError('validation_failed', 'The renewal deadline must be in the future.', { renewalDeadline: 'Choose a later date' });
  }
  const exists = await trx('seasons').where({ club_id: clubId, year }).first('id');
  if (exists) throw new AppError('conflict', `The ${year} season is already open.`, { year: 'Already open' });
  const later = await trx('seasons').where({ club_id: clubId }).where('year', '>', year).orderBy('year', 'desc').first('year');
  if (later) throw new AppError('conflict', `The ${later.year} season is already open; an earlier season cannot be opened after it.`, { year: `Choose a year after ${later.year}` });
  const before = await trx('seasons').where({ club_id: clubId }).where('year', '<', year).orderBy('year', 'desc').first('year', 'renewal_deadline');
  if (before?.renewal_deadline && renewalDeadline <= before.renewal_deadline) {
    const when = formatDate(before.renewal_deadline, timeZone);
    throw new AppError('validation_failed', `Renewals for ${year} must close after the ${before.year} renewals, which close on ${when}.`, {
      renewalDeadline: `Choose a date after ${when}`,
    });
  }
}

/** What opening a season would do, for the confirm step: how many renewal e-mails go, and who is left out. Sends nothing. */
export async function previewSeasonOpening(db: Db, opts: { clubId: number; year: number }): Promise<SeasonOpeningPreview> {
  const { renew, leftOut } = await renewalPlan(db, opts.clubId, opts.year);
  const prev = await db('seasons').where({ club_id: opts.clubId }).where('year', '<', opts.year).orderBy('year', 'desc').first('year');
  return {
    year: opts.year,
    previousYear: prev ? prev.year : null,
    renewals: renew.length,
    notRenewed: leftOut.map(({ holder, reason }) => ({ name: holder.name, plotLabel: holder.label, reason })),
  };
}

/**
 * Opens a season: last season's holders in good standing get a renewal link with the deadline;
 * holders who still owe fees get none, so their plots are free. Each renewal e-mail is written to the
 * outbox with its renewal, so a mail server that is down delays them but loses none.
 */
export async function openSeason(
  db: Knex,
  mailer: Mailer,
  opts: { clubId: number; userId: number; year: number; renewalDeadline?: Date; publicUrl: string; now?: Date },
) {
  const now = opts.now ?? new Date();
  const club = await db('clubs').where({ id: opts.clubId }).first('name', 'renewal_days', 'time_zone');
  if (!club) throw notFound('The club');
  // By default renewals stay open to the end of the club's day, renewal_days from today.
  const renewalDeadline = opts.renewalDeadline ?? deadlineAfterDays(club.renewal_days, club.time_zone, now);
  let renewalsSent = 0;
  const notRenewed: Array<{ name: string; plotLabel: string; reason: string }> = [];
  const season = await db.transaction(async (trx) => {
    // One opening at a time per club, so two coordinators cannot both pass the checks.
    await trx('clubs').where({ id: opts.clubId }).forUpdate().first('id');
    await checkOpening(trx, opts.clubId, opts.year, renewalDeadline, club.time_zone, now);
    const [row] = await trx('seasons')
      .insert({ club_id: opts.clubId, year: opts.year, renewal_deadline: renewalDeadline, opened_by_user_id: opts.userId })
      .returning('*');
    const plan = await renewalPlan(trx, opts.clubId, opts.year);
    for (const { holder: h, reason, owes } of plan.leftOut) {
      // A holder whose plot has left the map gets no renewal, and the coordinator is told why.
      notRenewed.push({ name: h.name, plotLabel: h.label, reason });
      if (owes) {
        await recordPlotEvent(trx, {
          plotId: h.plot_id,
          userId: opts.userId,
          kind: 'not_renewed',
          details: { summary: `Not offered for renewal to ${h.name} for ${opts.year}: last season’s fee is not fully paid` },
        });
      }
    }
    for (const h of plan.renew) {
      const { token, hash } = newToken();
      await trx('renewals').insert({
        season_id: row.id,
        previous_allocation_id: h.allocation_id,
        plot_id: h.plot_id,
        user_id: h.user_id,
        token_hash: hash,
        deadline: renewalDeadline,
      });
      await recordPlotEvent(trx, {
        plotId: h.plot_id,
        userId: opts.userId,
        kind: 'renewal_sent',
        details: { summary: `Renewal for ${opts.year} sent to ${h.name}, answer by ${formatDate(renewalDeadline, club.time_zone)}` },
      });
      renewalsSent++;
      await enqueueMail(trx, { clubId: opts.clubId, kind: 'renewal' }, renewalMail({
        to: h.email,
        name: h.name,
        clubName: club.name,
        year: opts.year,
        plotLabel: h.label,
        siteName: h.site_name,
        url: `${opts.publicUrl}/respond/renewal?token=${encodeURIComponent(token)}`,
        deadline: renewalDeadline,
        timeZone: club.time_zone,
      }));
    }
    return row;
  });
  kickMail(db, mailer);
  return { season: await getSeason(db, season.id), renewalsSent, notRenewed };
}
