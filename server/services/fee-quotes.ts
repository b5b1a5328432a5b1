import type { Knex } from 'knex';
import { area } from '@shared/geometry';
import { computePlotFee, feeBalance } from '@shared/fees/compute';
import type { Db } from '../db/knex';
import { getFeeSchedule } from './fee-schedules';

/** Whether a member pays the club's concession rate on plot fees. */
export async function hasConcession(db: Db, clubId: number, userId: number): Promise<boolean> {
  const row = await db('member_settings').where({ club_id: clubId, user_id: userId }).first('has_concession');
  return row?.has_concession ?? false;
}

/** What a plot would cost this person (a member with the concession, or someone not yet a member) this season. */
export async function quoteForPerson(db: Knex | Knex.Transaction, clubId: number, plotId: number, userId: number | null) {
  return quotePlotFee(db, clubId, plotId, userId === null ? false : await hasConcession(db, clubId, userId));
}

/** What a plot would cost a person this season under the club's schedule. */
export async function quotePlotFee(db: Knex | Knex.Transaction, clubId: number, plotId: number, concession = false) {
  const plot = await db('plots').where({ id: plotId }).first('x_m', 'y_m', 'width_m', 'length_m', 'rotation', 'kind');
  const club = await db('clubs').where({ id: clubId }).first('currency');
  const schedule = await getFeeSchedule(db, clubId);
  const areaM2 = area({ x: plot.x_m, y: plot.y_m, width: plot.width_m, length: plot.length_m, rotation: plot.rotation });
  return { ...computePlotFee(schedule, { areaM2, kind: plot.kind }, { concession }), currency: club.currency as string };
}

/** What a person's earlier fees at the club still hold as deposit (paid beyond the plot fee, less refunds). */
export async function depositHeld(db: Db, clubId: number, userId: number): Promise<number> {
  const fees = await db('fees').where({ club_id: clubId, user_id: userId }).select('id', 'plot_fee_minor', 'deposit_minor');
  if (fees.length === 0) return 0;
  const payments = await db('payments').whereIn('fee_id', fees.map((f) => f.id)).select('fee_id', 'kind', 'amount_minor');
  return fees.reduce((held, f) => {
    const mine = payments.filter((p) => p.fee_id === f.id).map((p) => ({ kind: p.kind, amountMinor: p.amount_minor }));
    return held + feeBalance({ plotFeeMinor: f.plot_fee_minor, depositMinor: f.deposit_minor }, mine).depositHeldMinor;
  }, 0);
}

