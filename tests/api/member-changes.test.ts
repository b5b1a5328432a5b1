import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { newToken } from '../../server/services/tokens';
import { buildClub, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;
const rolesOf = async (clubId: number, userId: number) =>
  (await t.db('memberships').where({ club_id: clubId, user_id: userId }).orderBy('role').pluck('role')) as string[];

// A per-area schedule: 2.50 a m², deposit 15.00, concession 40 % off the plot fee.
const schedule = {
  basis: 'area',
  areaUnit: 'm2',
  rateMinorPerArea: 250,
  priceInGroundMinor: 4000,
  priceRaisedBedMinor: 2500,
  priceContainerMinor: 800,
  priceSharedBedMinor: 0,
  concessionPercent: 40,
  depositMinor: 1500,
};

async function siteWithPlot(clubId: number) {
  const [site] = await t.db('sites')
    .insert({ club_id: clubId, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  return { siteId: site.id as number, plotId: plot.id as number };
}

describe('changing a member', () => {
  it('answers 401 signed out, 403 to other roles, 404 for someone not in the club, 400 naming the field', async () => {
    const club = await buildClub(t.db);
    const other = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const holder = await signedInMember(t, club.id, ['plot_holder']);
    const outsider = await buildMember(t.db, { clubId: other.id, roles: ['volunteer'] });
    const url = `/api/clubs/${club.id}/members/${holder.person.id}`;

    const anon = await browserLikeAgent(t.app);
    expect((await anon.patch(url, { roles: ['volunteer'] })).status).toBe(401);
    expect((await holder.patch(url, { roles: ['coordinator'] })).status).toBe(403);
    expect(await rolesOf(club.id, holder.person.id)).toEqual(['plot_holder']);
    expect((await coordinator.patch(`/api/clubs/${club.id}/members/${outsider.id}`, { roles: ['volunteer'] })).status).toBe(404);
    expect(await rolesOf(club.id, outsider.id)).toEqual([]);

    for (const [body, field] of [
      [{ roles: [] }, 'roles'],
      [{ roles: ['gardener'] }, 'roles.0'],
      [{ roles: ['volunteer', 'volunteer'] }, 'roles'],
      [{ concession: 'yes' }, 'concession'],
      [{}, 'roles'],
    ] as const) {
      const res = await coordinator.patch(url, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.fields, JSON.stringify(body)).toHaveProperty([field]);
    }
    expect((await coordinator.patch(url, { roles: ['volunteer'], admin: true })).status).toBe(400);
    expect(await rolesOf(club.id, holder.person.id)).toEqual(['plot_holder']);
  });

  it('sets the whole set of roles; the list shows them', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const member = await buildMember(t.db, { clubId: club.id, roles: ['volunteer'] });
    const res = await coordinator.patch(`/api/clubs/${club.id}/members/${member.id}`, { roles: ['coordinator', 'plot_holder'] });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ userId: member.id, roles: ['coordinator', 'plot_holder'], concession: false });
    expect(await rolesOf(club.id, member.id)).toEqual(['coordinator', 'plot_holder']);
    const list = await coordinator.get(`/api/clubs/${club.id}/members`);
    expect(list.body.items.find((m: { userId: number }) => m.userId === member.id).roles).toEqual(['coordinator', 'plot_holder']);
  });

  it('keeps the last coordinator: changing their own roles without coordinator is refused and changes nothing', async () => {
    const club = await buildClub(t.db);
    const only = await signedInMember(t, club.id, ['coordinator']);
    const res = await only.patch(`/api/clubs/${club.id}/members/${only.person.id}`, { roles: ['plot_holder'], concession: true });
    expect(res.status).toBe(409);
    expect(res.body.error).toEqual({ code: 'conflict', message: 'A club needs at least one coordinator. Make someone else coordinator first.' });
    expect(await rolesOf(club.id, only.person.id)).toEqual(['coordinator']);
    // The refused change is one transaction: the concession in the same request was not kept either.
    expect(await t.db('member_settings').where({ club_id: club.id })).toEqual([]);
  });

  it('taking plot holder away through a change releases their pending renewal, as removal does', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
    const { plotId } = await siteWithPlot(club.id);
    const [last] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const [prev] = await t.db('allocations').insert({ season_id: last.id, plot_id: plotId, user_id: holder.id, source: 'offer' }).returning('id');
    const { hash } = newToken();
    await t.db('renewals').insert({ season_id: season.id, previous_allocation_id: prev.id, plot_id: plotId, user_id: holder.id, token_hash: hash, deadline: new Date(Date.now() + 14 * DAY) });

    expect((await coordinator.patch(`/api/clubs/${club.id}/members/${holder.id}`, { roles: ['volunteer'] })).status).toBe(200);
    expect(await rolesOf(club.id, holder.id)).toEqual(['volunteer']);
    expect(await t.db('renewals').pluck('status')).toEqual(['released']);
  });
});

describe('a member’s concession', () => {
  it('prices renewals and new fees at the concession rate and re-prices fees with nothing paid', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    expect((await coordinator.put(`/api/clubs/${club.id}/fee-schedule`, schedule)).status).toBe(200);
    const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
    const { siteId, plotId } = await siteWithPlot(club.id);
    const [plot2] = await t.db('plots').insert({ site_id: siteId, label: 'A-2', x_m: 4, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    const [last] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    // Last season's fee for A-2, part paid: it must stay as charged.
    const [oldAlloc] = await t.db('allocations').insert({ season_id: last.id, plot_id: plot2.id, user_id: holder.id, source: 'offer' }).returning('id');
    const [paidFee] = await t.db('fees')
      .insert({ club_id: club.id, season_id: last.id, allocation_id: oldAlloc.id, user_id: holder.id, plot_id: plot2.id, description: 'Plot A-2, 2026 season', plot_fee_minor: 4500, deposit_minor: 0, currency: 'GBP', due_on: '2026-04-01' })
      .returning('id');
    await t.db('payments').insert({ fee_id: paidFee.id, amount_minor: 1000, method: 'cash', paid_on: '2026-03-01' });
    const [prev] = await t.db('allocations').insert({ season_id: last.id, plot_id: plotId, user_id: holder.id, source: 'offer' }).returning('id');
    const { token, hash } = newToken();
    await t.db('renewals').insert({ season_id: season.id, previous_allocation_id: prev.id, plot_id: plotId, user_id: holder.id, token_hash: hash, deadline: new Date(Date.now() + 14 * DAY) });

    const anon = await browserLikeAgent(t.app);
    const before = await anon.get(`/api/renewals/preview?token=${encodeURIComponent(token)}`);
    // 3 × 6 m = 18 m² × 250 = 4500 (computed).
    expect(before.body.fee.plotFeeMinor).toBe(4500);

    const set = await coordinator.patch(`/api/clubs/${club.id}/members/${holder.id}`, { concession: true });
    expect(set.status).toBe(200);
    expect(set.body).toMatchObject({ userId: holder.id, concession: true, roles: ['plot_holder'] });
    const listed = await coordinator.get(`/api/clubs/${club.id}/members`);
    expect(listed.body.items.find((m: { userId: number }) => m.userId === holder.id).concession).toBe(true);
    // 4500 × (100 − 40) % = 2700 (computed).
    expect((await anon.get(`/api/renewals/preview?token=${encodeURIComponent(token)}`)).body.fee.plotFeeMinor).toBe(2700);

    expect((await anon.post('/api/renewals/keep', { token })).status).toBe(200);
    const newFee = await t.db('fees').where({ season_id: season.id, user_id: holder.id }).first('plot_fee_minor', 'is_concession');
    expect(newFee).toEqual({ plot_fee_minor: 2700, is_concession: true });
    // The part-paid fee keeps what it was charged.
    expect(await t.db('fees').where({ id: paidFee.id }).first('plot_fee_minor', 'is_concession')).toEqual({ plot_fee_minor: 4500, is_concession: false });

    // Taking the concession away re-prices the unpaid new fee back to the full rate.
    expect((await coordinator.patch(`/api/clubs/${club.id}/members/${holder.id}`, { concession: false })).status).toBe(200);
    expect(await t.db('fees').where({ season_id: season.id, user_id: holder.id }).first('plot_fee_minor', 'is_concession')).toEqual({ plot_fee_minor: 4500, is_concession: false });
  });
});
