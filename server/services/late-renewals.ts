import type { Knex } from 'knex';
import { deadlineAfterDays } from '@shared/dates';
import { formatMoney } from '@shared/fees/compute';
import type { LeftOutHolder } from '@shared/schemas/seasons';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { renewalMail } from '../mail/templates';
import { enqueueMail, kickMail } from './outbox';
import { recordPlotEvent } from './plot-events';
import { previousHolders } from './seasons';
import { newToken } from './tokens';

/**
 * Last season's holders who have no renewal in this season, read afresh each time so the
 * season page says who was left out and why after a reload, and notices when a late payer has
 * since paid. A fixed number of queries whatever the number of holders.
 */
export async function leftOutHolders(db: Db, seasonId: number, now: Date = new Date()): Promise<LeftOutHolder[]> {
  const season = await db('seasons as s').join('clubs as c', 'c.id', 's.club_id').where('s.id', seasonId).first('s.id', 's.club_id', 's.year', 'c.currency');
  if (!season) throw notFound('The season');
  const renewed = new Set<number>(await db('renewals').where({ season_id: seasonId }).pluck('previous_allocation_id'));
  const rows = (await previousHolders(db, season.club_id, season.year))
    .filter((h) => !renewed.has(h.allocation_id))
    .sort((a, b) => a.site_name.localeCompare(b.site_name) || a.label.localeCompare(b.label));
  if (rows.length === 0) return [];
  const plotIds = rows.map((r) => r.plot_id);
  // Plots that are no longer free this season: someone holds them, or an offer or renewal is open
  // (one past its deadline has lapsed, swept or not).
  const busy = new Set<number>(
    (
      await db
        .select('plot_id')
        .from('allocations')
        .where({ season_id: seasonId, status: 'active' })
        .whereIn('plot_id', plotIds)
        .union((q) => q.select('plot_id').from('offers').where({ season_id: seasonId, status: 'pending' }).where('deadline', '>', now).whereIn('plot_id', plotIds))
        .union((q) => q.select('plot_id').from('renewals').where({ season_id: seasonId, status: 'pending' }).where('deadline', '>', now).whereIn('plot_id', plotIds))
    ).map((r: { plot_id: number }) => r.plot_id),
  );
  return rows.map((r) => {
    const owedMinor = Math.max(0, r.owed);
    const gone = Boolean(r.plot_removed_at || r.site_archived_at);
    let reason: string;
    if (r.plot_removed_at) reason = 'The plot was removed from the map';
    else if (r.site_archived_at) reason = `The site ${r.site_name} is archived`;
    else if (owedMinor > 0) reason = `Last season’s fee is not fully paid (${formatMoney(owedMinor, season.currency)} owed)`;
    else if (busy.has(r.plot_id)) reason = 'Paid since, but the plot has gone to someone else this season';
    else reason = 'Paid since the season opened: a renewal can be sent now';
    return {
      allocationId: r.allocation_id,
      userId: r.user_id,
      name: r.name,
      plotId: r.plot_id,
      plotLabel: r.label,
      siteName: r.site_name,
      owedMinor,
      currency: season.currency,
      reason,
      canRenew: !gone && owedMinor === 0 && !busy.has(r.plot_id),
    };
  });
}

/**
 * Sends a renewal to a holder who was left out when the season opened (they owed, and have paid
 * since). The plot must still be free; the deadline is the season's if still ahead, otherwise the
 * club's days to answer a renewal from now. Locks the plot row so it cannot be offered meanwhile.
 */
export async function renewLeftOutHolder(
  db: Knex,
  mailer: Mailer,
  opts: { seasonId: number; allocationId: number; userId: number; publicUrl: string; now?: Date },
) {
  const now = opts.now ?? new Date();
  const sentTo = await db.transaction(async (trx) => {
    const season = await trx('seasons as s')
      .join('clubs as c', 'c.id', 's.club_id')
      .where('s.id', opts.seasonId)
      .first('s.id', 's.club_id', 's.year', 's.renewal_deadline', 'c.name as club_name', 'c.renewal_days', 'c.time_zone');
    if (!season) throw notFound('The season');
    const candidate = await trx('allocations').where({ id: opts.allocationId }).first('plot_id');
    if (!candidate) throw notFound('The holder');
    await trx('plots').where({ id: candidate.plot_id }).forUpdate().first('id');
    const holder = (await leftOutHolders(trx, opts.seasonId, now)).find((h) => h.allocationId === opts.allocationId);
    if (!holder) throw new AppError('conflict', 'This holder already has a renewal for this season, or did not hold a plot last season.');
    if (!holder.canRenew) throw new AppError('conflict', `No renewal can be sent: ${holder.reason.toLowerCase()}.`);
    // The season's deadline if still ahead; otherwise the end of the club's day, its renewal days from today.
    const deadline =
      season.renewal_deadline && season.renewal_deadline > now
        ? season.renewal_deadline
        : deadlineAfterDays(season.renewal_days, season.time_zone, now);
    const { token, hash } = newToken();
    await trx('renewals').insert({
      season_id: season.id,
      previous_allocation_id: holder.allocationId,
      plot_id: holder.plotId,
      user_id: holder.userId,
      token_hash: hash,
      deadline,
    });
    await recordPlotEvent(trx, {
      plotId: holder.plotId,
      userId: opts.userId,
      kind: 'renewal_sent',
      details: { summary: `Renewal for ${season.year} sent to ${holder.name} after last season’s fee was paid` },
    });
    const user = await trx('users').where({ id: holder.userId }).first('email');
    // The e-mail is written with the renewal, in the same transaction, and sent from the outbox.
    await enqueueMail(
      trx,
      { clubId: season.club_id, kind: 'renewal' },
      renewalMail({
        to: user.email,
        name: holder.name,
        clubName: season.club_name,
        year: season.year,
        plotLabel: holder.plotLabel,
        siteName: holder.siteName,
        url: `${opts.publicUrl}/respond/renewal?token=${encodeURIComponent(token)}`,
        deadline,
        timeZone: season.time_zone,
      }),
    );
    return user.email as string;
  });
  kickMail(db, mailer);
  return { sentTo };
}
