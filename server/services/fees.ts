import type { Knex } from 'knex';
import Papa from 'papaparse';
import { area } from '@shared/geometry';
import { computePlotFee, depositDue, feeBalance, formatMoney } from '@shared/fees/compute';
import { minorToDecimal } from '@shared/fees/money';
import { addCalendarDays, localToday } from '@shared/dates';
import type { Fee, FeeSchedule, FeesList, FeesQuery, MyFee, Payment, PaymentBody } from '@shared/schemas/fees';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { paymentReceiptMail } from '../mail/fee-templates';
import type { Mailer } from '../mail/mailer';
import { enqueueMail, kickMail } from './outbox';
import { clubTimeZone } from './clubs';

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

/** The club a fee belongs to, or null. */
export async function clubOfFee(db: Db, feeId: number): Promise<number | null> {
  const row = await db('fees').where({ id: feeId }).first('club_id');
  return row ? row.club_id : null;
}

interface FeeRow {
  id: number;
  club_id: number;
  club_name: string;
  year: number;
  user_id: number;
  holder_name: string;
  holder_email: string;
  plot_id: number;
  plot_label: string;
  site_name: string;
  description: string;
  plot_fee_minor: number;
  deposit_minor: number;
  is_concession: boolean;
  currency: string;
  due_on: string;
}

interface PaymentRow {
  id: number;
  fee_id: number;
  kind: Payment['kind'];
  amount_minor: number;
  method: Payment['method'];
  paid_on: string;
  note: string;
  recorded_by: string | null;
}

function feeRows(db: Db) {
  return db('fees as f')
    .join('seasons as s', 's.id', 'f.season_id')
    .join('users as u', 'u.id', 'f.user_id')
    .join('plots as p', 'p.id', 'f.plot_id')
    .join('sites as st', 'st.id', 'p.site_id')
    .join('clubs as c', 'c.id', 'f.club_id')
    .select(
      'f.id',
      'f.club_id',
      'c.name as club_name',
      's.year',
      'f.user_id',
      'u.name as holder_name',
      'u.email as holder_email',
      'f.plot_id',
      'p.label as plot_label',
      'st.name as site_name',
      'f.description',
      'f.plot_fee_minor',
      'f.deposit_minor',
      'f.is_concession',
      'f.currency',
      'f.due_on',
    );
}

/** Fees with their payments and balances, owed ones first, then by due date. */
async function withPayments(db: Db, rows: FeeRow[]): Promise<Array<Fee & { clubId: number; clubName: string }>> {
  const payments: PaymentRow[] = rows.length
    ? await db('payments as pm')
        .leftJoin('users as u', 'u.id', 'pm.recorded_by_user_id')
        .whereIn(
          'pm.fee_id',
          rows.map((r) => r.id),
        )
        .orderBy([{ column: 'pm.paid_on' }, { column: 'pm.id' }])
        .select('pm.id', 'pm.fee_id', 'pm.kind', 'pm.amount_minor', 'pm.method', 'pm.paid_on', 'pm.note', 'u.name as recorded_by')
    : [];
  const byFee = new Map<number, Payment[]>();
  for (const p of payments) {
    const list = byFee.get(p.fee_id) ?? [];
    list.push({ id: p.id, kind: p.kind, amountMinor: p.amount_minor, method: p.method, paidOn: p.paid_on, note: p.note, recordedBy: p.recorded_by });
    byFee.set(p.fee_id, list);
  }
  const fees = rows.map((r) => {
    const list = byFee.get(r.id) ?? [];
    const balance = feeBalance({ plotFeeMinor: r.plot_fee_minor, depositMinor: r.deposit_minor }, list);
    return {
      id: r.id,
      clubId: r.club_id,
      clubName: r.club_name,
      seasonYear: r.year,
      userId: r.user_id,
      holderName: r.holder_name,
      holderEmail: r.holder_email,
      plotId: r.plot_id,
      plotLabel: r.plot_label,
      siteName: r.site_name,
      description: r.description,
      plotFeeMinor: r.plot_fee_minor,
      depositMinor: r.deposit_minor,
      isConcession: r.is_concession,
      currency: r.currency,
      dueOn: r.due_on,
      ...balance,
      payments: list,
    };
  });
  return fees.sort(
    (a, b) =>
      Number(b.balanceMinor > 0) - Number(a.balanceMinor > 0) ||
      a.dueOn.localeCompare(b.dueOn) ||
      a.holderName.localeCompare(b.holderName) ||
      a.id - b.id,
  );
}

const withoutClub = ({ clubId: _clubId, clubName: _clubName, ...fee }: Fee & { clubId: number; clubName: string }): Fee => fee;

/** A club's fees for one season (or all), filtered to unpaid (balance above zero) or paid, with totals in minor units. */
export async function listFees(db: Db, clubId: number, query: FeesQuery): Promise<FeesList> {
  const q = feeRows(db).where('f.club_id', clubId);
  if (query.year !== undefined) q.where('s.year', query.year);
  const all = await withPayments(db, await q);
  const items = all
    .filter((f) => query.status === 'all' || (query.status === 'unpaid' ? f.balanceMinor > 0 : f.balanceMinor <= 0))
    .map(withoutClub);
  const totals = { dueMinor: 0, paidMinor: 0, refundedMinor: 0, outstandingMinor: 0 };
  for (const f of items) {
    totals.dueMinor += f.plotFeeMinor + f.depositMinor;
    totals.paidMinor += f.paidMinor;
    totals.refundedMinor += f.refundedMinor;
    // Money paid beyond one person's fee does not settle anyone else's.
    totals.outstandingMinor += Math.max(0, f.balanceMinor);
  }
  return { items, page: 1, total: items.length, totals };
}

/** One fee with its payments. */
export async function getFee(db: Db, feeId: number): Promise<Fee> {
  const rows: FeeRow[] = await feeRows(db).where('f.id', feeId);
  if (rows.length === 0) throw notFound('The fee');
  return withoutClub((await withPayments(db, rows))[0]);
}

/** The signed-in person's own fees in every club they belong to. */
export async function listMyFees(db: Db, userId: number): Promise<{ items: MyFee[]; page: number; total: number }> {
  const rows: FeeRow[] = await feeRows(db).where('f.user_id', userId);
  const items = await withPayments(db, rows);
  return { items, page: 1, total: items.length };
}

// Text cells that a spreadsheet would run as a formula get a leading apostrophe (OWASP, "CSV Injection").
const FORMULA_START = /^[=+\-@\t\r]/;
const textCell = (s: string) => (FORMULA_START.test(s) ? `'${s}` : s);

export const feeCsvColumns = [
  'season',
  'holder',
  'email',
  'site',
  'plot',
  'description',
  'currency',
  'plot_fee',
  'deposit',
  'concession',
  'due_on',
  'paid',
  'refunded',
  'deposit_held',
  'balance',
] as const;

/** The club's fees as CSV, amounts as decimals with two places in each fee's currency, in the list's order. */
export async function exportFeesCsv(db: Db, clubId: number, query: FeesQuery): Promise<string> {
  const { items } = await listFees(db, clubId, query);
  const data = items.map((f) => [
    f.seasonYear,
    textCell(f.holderName),
    textCell(f.holderEmail),
    textCell(f.siteName),
    textCell(f.plotLabel),
    textCell(f.description),
    f.currency,
    minorToDecimal(f.plotFeeMinor),
    minorToDecimal(f.depositMinor),
    f.isConcession ? 'yes' : 'no',
    f.dueOn,
    minorToDecimal(f.paidMinor),
    minorToDecimal(f.refundedMinor),
    minorToDecimal(f.depositHeldMinor),
    minorToDecimal(f.balanceMinor),
  ]);
  return Papa.unparse({ fields: [...feeCsvColumns], data }, { newline: '\r\n' });
}

/**
 * Records a payment against a fee, or a refund of the deposit held, then e-mails the holder a receipt.
 * The fee row is locked while the payments are summed, so two payments recorded at once are both
 * checked against what is really owed and both counted.
 */
export async function recordPayment(
  db: Knex,
  mailer: Mailer,
  opts: { feeId: number; userId: number; body: PaymentBody },
): Promise<Fee> {
  const { feeId, body } = opts;
  const fee = await db.transaction(async (trx) => {
    const fee = await trx('fees').where({ id: feeId }).forUpdate().first('id', 'plot_fee_minor', 'deposit_minor', 'currency');
    if (!fee) throw notFound('The fee');
    const payments = await trx('payments').where({ fee_id: feeId }).select('kind', 'amount_minor');
    const now = feeBalance(
      { plotFeeMinor: fee.plot_fee_minor, depositMinor: fee.deposit_minor },
      payments.map((p) => ({ kind: p.kind, amountMinor: p.amount_minor })),
    );
    const money = (minor: number) => formatMoney(minor, fee.currency);
    if (body.kind === 'refund' && body.amountMinor > now.depositHeldMinor) {
      throw new AppError('validation_failed', 'Only the deposit the club holds can be refunded.', {
        amountMinor: now.depositHeldMinor > 0 ? `At most ${money(now.depositHeldMinor)}, the deposit held` : 'No deposit is held for this fee',
      });
    }
    if (body.kind === 'payment' && body.amountMinor > now.balanceMinor) {
      throw new AppError('validation_failed', 'That is more than is owed.', {
        amountMinor: now.balanceMinor > 0 ? `At most ${money(now.balanceMinor)}, what is still owed` : 'This fee is fully paid',
      });
    }
    await trx('payments').insert({
      fee_id: feeId,
      kind: body.kind,
      amount_minor: body.amountMinor,
      method: body.method,
      paid_on: body.paidOn,
      note: body.note,
      recorded_by_user_id: opts.userId,
    });
    // The receipt is written with the payment; the outbox sends it, so a mail failure never fails the request.
    const saved = await getFee(trx, feeId);
    const club = await trx('fees as f').join('clubs as c', 'c.id', 'f.club_id').where('f.id', feeId).first('c.id', 'c.name');
    await enqueueMail(trx, { clubId: club.id, kind: 'payment_receipt' }, paymentReceiptMail({
      to: saved.holderEmail,
      name: saved.holderName,
      clubName: club.name,
      description: saved.description,
      currency: saved.currency,
      payment: body,
      balanceMinor: saved.balanceMinor,
      depositHeldMinor: saved.depositHeldMinor,
    }));
    return saved;
  });
  kickMail(db, mailer);
  return fee;
}
