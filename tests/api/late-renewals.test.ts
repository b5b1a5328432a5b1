import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildApplication, buildClub, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

// A holder left out of the renewals for owing last season's fee, who pays later.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;

async function setUp() {
  const club = await buildClub(t.db, { name: 'Hazel Bank Growers' });
  await t.db('fee_schedules').insert({ club_id: club.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  const late = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { name: 'Jonah Late', email: 'jonah.late@example.org' } });
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'B-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [last] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
  const [alloc] = await t.db('allocations').insert({ season_id: last.id, plot_id: plot.id, user_id: late.id, source: 'offer' }).returning('id');
  const [fee] = await t.db('fees')
    .insert({ club_id: club.id, season_id: last.id, allocation_id: alloc.id, user_id: late.id, plot_id: plot.id, description: 'x', plot_fee_minor: 4500, deposit_minor: 1500, currency: 'GBP', due_on: '2026-04-01' })
    .returning('id');
  await t.db('payments').insert({ fee_id: fee.id, amount_minor: 1000, method: 'cash', paid_on: '2026-03-01' });
  const opened = await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2027, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
  expect(opened.status).toBe(201);
  return { club, coordinator, seasonId: opened.body.season.id as number, allocationId: alloc.id as number, feeId: fee.id as number, plotId: plot.id as number };
}

describe('renewing a holder who was left out', () => {
  it('says who was left out and why, refuses while they owe, and sends the renewal once they have paid', async () => {
    const { coordinator, seasonId, allocationId, feeId } = await setUp();
    const before = await coordinator.get(`/api/seasons/${seasonId}/left-out`);
    expect(before.status).toBe(200);
    // Computed: 4,500 + 1,500 − 1,000 paid = 5,000 owed.
    expect(before.body.items).toEqual([
      expect.objectContaining({
        allocationId,
        name: 'Jonah Late',
        plotLabel: 'B-1',
        owedMinor: 5000,
        reason: 'Last season’s fee is not fully paid (£50.00 owed)',
        canRenew: false,
      }),
    ]);
    const refused = await coordinator.post(`/api/seasons/${seasonId}/late-renewals`, { allocationId });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe('No renewal can be sent: last season’s fee is not fully paid (£50.00 owed).');

    await t.db('payments').insert({ fee_id: feeId, amount_minor: 5000, method: 'cash', paid_on: '2026-12-01' });
    const paid = await coordinator.get(`/api/seasons/${seasonId}/left-out`);
    expect(paid.body.items[0]).toMatchObject({ owedMinor: 0, canRenew: true, reason: 'Paid since the season opened: a renewal can be sent now' });

    const since = Date.now();
    const sent = await coordinator.post(`/api/seasons/${seasonId}/late-renewals`, { allocationId });
    expect(sent.status, JSON.stringify(sent.body)).toBe(201);
    const mail = await waitForMail(mailUrl(), { to: 'jonah.late@example.org', after: since });
    expect(mail.subject).toMatch(/^Keep plot B-1 for 2027\?/);
    expect(extractLink(mail, '/respond/renewal')).toContain('token=');
    expect(await t.db('renewals').where({ season_id: seasonId, previous_allocation_id: allocationId }).pluck('status')).toEqual(['pending']);

    expect((await coordinator.get(`/api/seasons/${seasonId}/left-out`)).body.items).toEqual([]);
    const again = await coordinator.post(`/api/seasons/${seasonId}/late-renewals`, { allocationId });
    expect(again.status).toBe(409);
  });

  it('will not renew a plot that has been offered to someone else meanwhile, and is only for coordinators', async () => {
    const { club, coordinator, seasonId, allocationId, feeId, plotId } = await setUp();
    await t.db('payments').insert({ fee_id: feeId, amount_minor: 5000, method: 'cash', paid_on: '2026-12-01' });
    const person = await buildApplication(t.db, { clubId: club.id, name: 'Ines Carvalho', email: 'ines@example.org' });
    expect((await coordinator.post(`/api/seasons/${seasonId}/offers`, { plotId, applicationId: person.id })).status).toBe(201);
    const list = await coordinator.get(`/api/seasons/${seasonId}/left-out`);
    expect(list.body.items[0]).toMatchObject({ canRenew: false, reason: 'Paid since, but the plot has gone to someone else this season' });
    expect((await coordinator.post(`/api/seasons/${seasonId}/late-renewals`, { allocationId })).status).toBe(409);

    const holder = await signedInMember(t, club.id, ['plot_holder']);
    expect((await holder.get(`/api/seasons/${seasonId}/left-out`)).status).toBe(403);
    expect((await holder.post(`/api/seasons/${seasonId}/late-renewals`, { allocationId })).status).toBe(403);
  });
});
