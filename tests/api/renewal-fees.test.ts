import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { createFeeForAllocation } from '../../server/services/fee-charges';
import { buildClub, buildMember } from '../factories';
import { setupTestApp, truncateAll } from '../helpers/app';

// The fee a holder is charged for a new season's allocation, by what they already hold as deposit.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

async function holderWithLastSeason(payments: Array<{ kind: 'payment' | 'refund'; amount_minor: number }>) {
  const club = await buildClub(t.db);
  // £2.50 a m² and a £15 deposit (invented demo figures).
  await t.db('fee_schedules').insert({ club_id: club.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [last, next] = await t.db('seasons').insert([{ club_id: club.id, year: 2026 }, { club_id: club.id, year: 2027 }]).returning('id');
  const [old] = await t.db('allocations').insert({ season_id: last.id, plot_id: plot.id, user_id: holder.id, source: 'offer' }).returning('id');
  const [fee] = await t.db('fees')
    .insert({ club_id: club.id, season_id: last.id, allocation_id: old.id, user_id: holder.id, plot_id: plot.id, description: 'x', plot_fee_minor: 4500, deposit_minor: 1500, currency: 'GBP', due_on: '2026-04-01' })
    .returning('id');
  for (const p of payments) await t.db('payments').insert({ fee_id: fee.id, method: 'cash', paid_on: '2026-03-01', ...p });
  const [kept] = await t.db('allocations').insert({ season_id: next.id, plot_id: plot.id, user_id: holder.id, source: 'renewal' }).returning('id');
  return kept.id as number;
}

const newFee = async (allocationId: number) => {
  const id = await t.db.transaction((trx) => createFeeForAllocation(trx, { allocationId }));
  return t.db('fees').where({ id }).first('plot_fee_minor', 'deposit_minor');
};

describe('the fee for a kept plot', () => {
  it('carries the deposit held over: only the plot fee is due', async () => {
    // Computed: 4,500 fee + 1,500 deposit paid = 6,000, so 1,500 is held.
    expect(await newFee(await holderWithLastSeason([{ kind: 'payment', amount_minor: 6000 }]))).toEqual({ plot_fee_minor: 4500, deposit_minor: 0 });
  });
  it('asks for the deposit again once it was handed back', async () => {
    const kept = await holderWithLastSeason([
      { kind: 'payment', amount_minor: 6000 },
      { kind: 'refund', amount_minor: 1500 },
    ]);
    expect(await newFee(kept)).toEqual({ plot_fee_minor: 4500, deposit_minor: 1500 });
  });
  it('asks for the part of the deposit that was never paid', async () => {
    // Computed: 5,000 paid against 4,500 + 1,500: 500 of the deposit is held, 1,000 is asked.
    expect(await newFee(await holderWithLastSeason([{ kind: 'payment', amount_minor: 5000 }]))).toEqual({ plot_fee_minor: 4500, deposit_minor: 1000 });
  });
});
