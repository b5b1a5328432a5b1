import type { Knex } from 'knex';
import { depositDue } from '@shared/fees/compute';
import { addCalendarDays, localToday } from '@shared/dates';
import { clubTimeZone } from './clubs';
import { depositHeld, quotePlotFee } from './fee-quotes';

/**
 * Creates the fee due for a new allocation (on accepting an offer or keeping a plot), due in
 * 30 days (counted in the club's calendar, from today where the club is); inside the caller's
 * transaction. Returns the fee id.
 */
export async function createFeeForAllocation(
  trx: Knex.Transaction,
  opts: { allocationId: number; concession?: boolean; now?: Date },
): Promise<number> {
  const a = await trx('allocations as a')
    .join('seasons as s', 's.id', 'a.season_id')
    .join('plots as p', 'p.id', 'a.plot_id')
    .where('a.id', opts.allocationId)
    .first('a.id', 'a.season_id', 'a.user_id', 'a.plot_id', 's.club_id', 's.year', 'p.label');
  const quote = await quotePlotFee(trx, a.club_id, a.plot_id, opts.concession ?? false);
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
      is_concession: opts.concession ?? false,
      currency: quote.currency,
      due_on: dueOn,
    })
    .returning('id');
  return row.id;
}

