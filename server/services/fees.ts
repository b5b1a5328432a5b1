import type { Knex } from 'knex';
import { area } from '@shared/geometry';
import { computePlotFee } from '@shared/fees/compute';
import type { FeeSchedule } from '@shared/schemas/fees';

interface FeeScheduleRow {
  basis: 'area' | 'kind';
  area_unit: 'm2' | 'ft2';
  rate_minor_per_area: number;
  price_in_ground_minor: number;
  price_raised_bed_minor: number;
  price_container_minor: number;
  price_shared_bed_minor: number;
  concession_percent: number;
  deposit_minor: number;
}

/** A club's fee schedule as the API shows it (all zero until the coordinator sets one). */
export function toFeeSchedule(r: FeeScheduleRow | undefined): FeeSchedule {
  return {
    basis: r?.basis ?? 'kind',
    areaUnit: r?.area_unit ?? 'm2',
    rateMinorPerArea: r?.rate_minor_per_area ?? 0,
    priceInGroundMinor: r?.price_in_ground_minor ?? 0,
    priceRaisedBedMinor: r?.price_raised_bed_minor ?? 0,
    priceContainerMinor: r?.price_container_minor ?? 0,
    priceSharedBedMinor: r?.price_shared_bed_minor ?? 0,
    concessionPercent: r?.concession_percent ?? 0,
    depositMinor: r?.deposit_minor ?? 0,
  };
}

/** The club's fee schedule. */
export async function getFeeSchedule(db: Knex | Knex.Transaction, clubId: number): Promise<FeeSchedule> {
  return toFeeSchedule(await db('fee_schedules').where({ club_id: clubId }).first());
}

/** What a plot would cost a person this season under the club's schedule. */
export async function quotePlotFee(db: Knex | Knex.Transaction, clubId: number, plotId: number, concession = false) {
  const plot = await db('plots').where({ id: plotId }).first('x_m', 'y_m', 'width_m', 'length_m', 'rotation', 'kind');
  const club = await db('clubs').where({ id: clubId }).first('currency');
  const schedule = await getFeeSchedule(db, clubId);
  const areaM2 = area({ x: plot.x_m, y: plot.y_m, width: plot.width_m, length: plot.length_m, rotation: plot.rotation });
  return { ...computePlotFee(schedule, { areaM2, kind: plot.kind }, { concession }), currency: club.currency as string };
}

/**
 * Creates the fee due for a new allocation (on accepting an offer or keeping a plot), due in
 * 30 days; inside the caller's transaction. Returns the fee id.
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
  const due = new Date((opts.now ?? new Date()).getTime() + 30 * 24 * 3600 * 1000);
  const [row] = await trx('fees')
    .insert({
      club_id: a.club_id,
      season_id: a.season_id,
      allocation_id: a.id,
      user_id: a.user_id,
      plot_id: a.plot_id,
      description: `Plot ${a.label}, ${a.year} season`,
      plot_fee_minor: quote.plotFeeMinor,
      deposit_minor: quote.depositMinor,
      is_concession: opts.concession ?? false,
      currency: quote.currency,
      due_on: due.toISOString().slice(0, 10),
    })
    .returning('id');
  return row.id;
}
