import type { Knex } from 'knex';
import { depositDue } from '@shared/fees/compute';
import { addCalendarDays, localToday } from '@shared/dates';
import { clubTimeZone } from './clubs';
import { depositHeld, hasConcession, quotePlotFee } from './fee-quotes';

/**
 * Creates the fee due for a new allocation (on accepting an offer or keeping a plot), due in
 * 30 days (counted in the club's calendar, from today where the club is); inside the caller's
 * transaction; a member with the concession pays the concession rate. Returns the fee id.
 */
export async function createFeeForAllocation(
  trx: Knex.Transaction,
  opts: { allocationId: number; now?: Date },
): Promise<number> {
  const a = await trx('allocations as a')
    .join('seasons as s', 's.id', 'a.season_id')
    .join('plots as p', 'p.id', 'a.plot_id')
    .where('a.id', opts.allocationId)
    .first('a.id', 'a.season_id', 'a.user_id', 'a.plot_id', 's.club_id', 's.year', 'p.label');
  const concession = await hasConcession(trx, a.club_id, a.user_id);
  const quote = await quotePlotFee(trx, a.club_id, a.plot_id, concession);
  const deposit = depositDue(quote.depositMinor, await depositHeld(trx, a.club_id, a.user_id));
  const dueOn = addCalendarDays(localToday(await clubTimeZone(trx, a.club_id), opts.now ?? new Date()), 30);
  const [row] = await trx('fees')
    .insert({
      club_id: a.club_id,
      season_id: a.season_id,
      allocation_id: a.id,
      user_id: a.user_id,
      plot_id: a.plot_id,
      description: `Plot ${a.label}, ${a.year} season`,
      plot_fee_minor: quote.plotFeeMinor,
      deposit_minor: deposit,
      is_concession: concession,
      currency: quote.currency,
      due_on: dueOn,
    })
    .returning('id');
  return row.id;
}


/**
 * Re-prices a member's fees that have nothing paid or refunded yet after their concession changed,
 * from the club's current schedule; fees with any payment stay as they were charged.
 */
export async function repriceUnpaidFees(
  trx: Knex.Transaction,
  opts: { clubId: number; userId: number; concession: boolean },
): Promise<number> {
  const fees = await trx('fees as f')
    .where({ 'f.club_id': opts.clubId, 'f.user_id': opts.userId })
    .whereNot('f.is_concession', opts.concession)
    .whereNotExists(trx('payments as p').whereRaw('p.fee_id = f.id'))
    .select('f.id', 'f.plot_id');
  for (const f of fees) {
    const quote = await quotePlotFee(trx, opts.clubId, f.plot_id, opts.concession);
    await trx('fees').where({ id: f.id }).update({ plot_fee_minor: quote.plotFeeMinor, is_concession: opts.concession });
  }
  return fees.length;
}
