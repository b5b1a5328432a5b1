import type { Knex } from 'knex';
import type { LinkPreview } from '@shared/schemas/seasons';
import { AppError, notFound } from '../errors';
import { depositDue } from '@shared/fees/compute';
import { createFeeForAllocation } from './fee-charges';
import { depositHeld, quoteForPerson } from './fee-quotes';
import { plotFacts } from './link-preview';
import { plotStillThere } from './offers';
import { recordPlotEvent } from './plot-events';
import { hashToken } from './tokens';

/**
 * A renewal is reached by its e-mailed token, or by its id when its own holder is signed in (from the
 * club home). Another person's id is not found, so nobody learns whose renewals exist.
 */
export type RenewalRef = { token: string } | { renewalId: number; userId: number };

async function findRenewal(db: Knex | Knex.Transaction, ref: RenewalRef, lock = false) {
  const q = db('renewals as r')
    .join('seasons as s', 's.id', 'r.season_id')
    .join('clubs as c', 'c.id', 's.club_id')
    .join('users as u', 'u.id', 'r.user_id')
    .first('r.*', 's.year', 's.club_id', 'c.name as club_name', 'c.time_zone', 'u.name as user_name');
  if ('token' in ref) q.where('r.token_hash', hashToken(ref.token));
  else q.where({ 'r.id': ref.renewalId, 'r.user_id': ref.userId });
  if (lock) q.forUpdate('r');
  const row = await q;
  if (!row) throw notFound('token' in ref ? 'That renewal link' : 'That renewal');
  return row;
}

function assertOpen(row: { status: string; deadline: Date }, now: Date) {
  if (row.status !== 'pending') throw new AppError('gone', `This renewal has already been answered (${row.status}).`);
  if (row.deadline <= now) throw new AppError('gone', 'The deadline for this renewal has passed; the plot has gone back to the club.');
}

/** What the renewal page shows. */
export async function previewRenewal(db: Knex, ref: RenewalRef): Promise<LinkPreview> {
  const r = await findRenewal(db, ref);
  const quote = await quoteForPerson(db, r.club_id, r.plot_id, r.user_id);
  // A deposit the holder already paid carries over: only a shortfall is asked for.
  const deposit = depositDue(quote.depositMinor, await depositHeld(db, r.club_id, r.user_id));
  return {
    kind: 'renewal',
    status: r.status,
    clubName: r.club_name,
    name: r.user_name,
    year: r.year,
    plot: await plotFacts(db, r.plot_id),
    deadline: r.deadline.toISOString(),
    timeZone: r.time_zone,
    fee: { plotFeeMinor: quote.plotFeeMinor, depositMinor: deposit, currency: quote.currency },
  };
}

/** "Keep my plot": the holder keeps it for the new season and the season's fee becomes due. */
export async function keepPlot(db: Knex, opts: RenewalRef & { now?: Date }) {
  const now = opts.now ?? new Date();
  return db.transaction(async (trx) => {
    const r = await findRenewal(trx, opts, true);
    assertOpen(r, now);
    if (!(await plotStillThere(trx, r.plot_id))) {
      throw new AppError('gone', 'The club has taken this plot off its map, so it cannot be kept for the new season. Please ask your coordinator about another plot.');
    }
    await trx('renewals').where({ id: r.id }).update({ status: 'kept', answered_at: now });
    const [allocation] = await trx('allocations')
      .insert({ season_id: r.season_id, plot_id: r.plot_id, user_id: r.user_id, source: 'renewal' })
      .returning('id');
    await createFeeForAllocation(trx, { allocationId: allocation.id, now });
    await recordPlotEvent(trx, {
      plotId: r.plot_id,
      userId: r.user_id,
      kind: 'renewed',
      details: { summary: `${r.user_name} kept the plot for ${r.year}` },
    });
    return { status: 'kept', message: `Thank you. Plot ${(await plotFacts(trx, r.plot_id)).label} is yours for ${r.year}.` };
  });
}

/** "Give it up": the plot is free for the waiting list. */
export async function releasePlot(db: Knex, opts: RenewalRef & { now?: Date }) {
  const now = opts.now ?? new Date();
  return db.transaction(async (trx) => {
    const r = await findRenewal(trx, opts, true);
    assertOpen(r, now);
    await trx('renewals').where({ id: r.id }).update({ status: 'released', answered_at: now });
    await recordPlotEvent(trx, {
      plotId: r.plot_id,
      userId: r.user_id,
      kind: 'released',
      details: { summary: `${r.user_name} gave the plot up for ${r.year}` },
    });
    return { status: 'released', message: 'Thank you for letting us know. The plot will go to someone on the waiting list.' };
  });
}
