import { feeBalance } from '@shared/fees/compute';
import type { Fee, FeesList, FeesQuery, MyFee, Payment } from '@shared/schemas/fees';
import { notFound } from '../errors';
import type { Db } from '../db/knex';
import type { ClubLookup } from './memberships';

/** The club a fee belongs to, or null. */
export const clubOfFee: ClubLookup = (db, feeId) => db('fees').where({ id: feeId }).select('club_id');

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

