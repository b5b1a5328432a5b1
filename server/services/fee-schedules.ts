import type { Knex } from 'knex';
import type { FeeSchedule } from '@shared/schemas/fees';
import type { Db } from '../db/knex';

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

/** Saves the club's fee schedule, creating it the first time. */
export async function saveFeeSchedule(db: Db, clubId: number, schedule: FeeSchedule): Promise<FeeSchedule> {
  const row = {
    club_id: clubId,
    basis: schedule.basis,
    area_unit: schedule.areaUnit,
    rate_minor_per_area: schedule.rateMinorPerArea,
    price_in_ground_minor: schedule.priceInGroundMinor,
    price_raised_bed_minor: schedule.priceRaisedBedMinor,
    price_container_minor: schedule.priceContainerMinor,
    price_shared_bed_minor: schedule.priceSharedBedMinor,
    concession_percent: schedule.concessionPercent,
    deposit_minor: schedule.depositMinor,
  };
  const [saved] = await db('fee_schedules')
    .insert(row)
    .onConflict('club_id')
    .merge({ ...row, updated_at: db.fn.now() })
    .returning('*');
  return toFeeSchedule(saved);
}

