import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { signedInMember, type Agent } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;

/**
 * A club in its 2027 season: Hana (plot holder) waits to answer her renewal of A-1, an applicant
 * has an offer of A-2, Owen owed last season's fee so A-3 was not offered back, Ines holds A-4.
 */
async function club() {
  const c = await buildClub(t.db, { name: 'Hazel Bank Growers' });
  await t.db('fee_schedules').insert({ club_id: c.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const holder = await signedInMember(t, c.id, ['plot_holder']);
  await t.db('users').where({ id: holder.person.id }).update({ name: 'Hana Holder' });
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const owing = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'], user: { name: 'Owen Owing', email: 'owen@example.org' } });
  const ines = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'], user: { name: 'Ines Other', email: 'ines@example.org' } });
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const plots: Array<{ id: number; label: string }> = await t.db('plots')
    .insert(['A-1', 'A-2', 'A-3', 'A-4'].map((label, i) => ({ site_id: site.id, label, x_m: i * 3.9, y_m: 0, width_m: 3, length_m: 6 })))
    .returning(['id', 'label']);
  const [last] = await t.db('seasons').insert({ club_id: c.id, year: 2026 }).returning('id');
  const [a1, a3] = await t.db('allocations')
    .insert([
      { season_id: last.id, plot_id: plots[0].id, user_id: holder.person.id, source: 'offer' },
      { season_id: last.id, plot_id: plots[2].id, user_id: owing.id, source: 'offer' },
    ])
    .returning('id');
  const fee = (allocationId: number, userId: number, plotId: number) => ({
    club_id: c.id, season_id: last.id, allocation_id: allocationId, user_id: userId, plot_id: plotId,
    description: 'Plot 2026', plot_fee_minor: 4500, deposit_minor: 1500, currency: 'GBP', due_on: '2026-04-01',
  });
  const [f1] = await t.db('fees').insert([fee(a1.id, holder.person.id, plots[0].id), fee(a3.id, owing.id, plots[2].id)]).returning('id');
  await t.db('payments').insert({ fee_id: f1.id, amount_minor: 6000, method: 'cash', paid_on: '2026-03-01' });

  const opened = await coordinator.post(`/api/clubs/${c.id}/seasons`, { year: 2027, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
  expect(opened.status, JSON.stringify(opened.body)).toBe(201);
  const seasonId = opened.body.season.id as number;
  await t.db('allocations').insert({ season_id: seasonId, plot_id: plots[3].id, user_id: ines.id, source: 'offer' });
  const [app] = await t.db('applications')
    .insert({ club_id: c.id, name: 'Abel Applicant', email: 'abel@example.org', applied_at: new Date(), queue_at: new Date() })
    .returning('id');
  const offer = await coordinator.post(`/api/seasons/${seasonId}/offers`, { plotId: plots[1].id, applicationId: app.id });
  expect(offer.status, JSON.stringify(offer.body)).toBe(201);
  return { club: c, coordinator, holder, volunteer, seasonId, siteId: site.id as number, plots };
}

// Everything only a coordinator may read: other people's names and e-mail addresses, and arrears.
const PRIVATE = ['Abel Applicant', 'abel@example.org', 'Owen Owing', 'owen@example.org', 'Ines Other', 'ines@example.org', 'fee'];

const states = async (c: Agent, seasonId: number, siteId: number) => {
  const res = await c.get(`/api/seasons/${seasonId}/plot-states?siteId=${siteId}`);
  expect(res.status).toBe(200);
  return res.body.items as Array<{ plotId: number; status: string; holder: { name: string } | null; offer: { name: string } | null; renewal: { name: string } | null }>;
};

describe('who sees what on the season map', () => {
  it('shows a coordinator every name, state and offer', async () => {
    const s = await club();
    const items = await states(s.coordinator, s.seasonId, s.siteId);
    expect(items.map((i) => [i.status, i.holder?.name ?? i.offer?.name ?? i.renewal?.name ?? null])).toEqual([
      ['renewal_pending', 'Hana Holder'],
      ['offered', 'Abel Applicant'],
      ['free', null],
      ['taken', 'Ines Other'],
    ]);
  });

  it('shows a plot holder free or taken, and their own renewal with their name', async () => {
    const s = await club();
    const items = await states(s.holder, s.seasonId, s.siteId);
    expect(items.map((i) => [i.status, i.holder, i.offer, i.renewal?.name ?? null])).toEqual([
      ['renewal_pending', null, null, 'Hana Holder'],
      ['taken', null, null, null],
      ['free', null, null, null],
      ['taken', null, null, null],
    ]);
    for (const word of PRIVATE) expect(JSON.stringify(items)).not.toContain(word);
  });

  it('shows a volunteer free or taken only', async () => {
    const s = await club();
    const items = await states(s.volunteer, s.seasonId, s.siteId);
    expect(items.map((i) => [i.status, i.holder, i.offer, i.renewal])).toEqual([
      ['taken', null, null, null],
      ['taken', null, null, null],
      ['free', null, null, null],
      ['taken', null, null, null],
    ]);
    expect(JSON.stringify(items)).not.toContain('Hana Holder');
  });
});

describe('who sees what on a plot page', () => {
  it('gives a coordinator the holder and the whole history, arrears included', async () => {
    const s = await club();
    const a3 = await s.coordinator.get(`/api/plots/${s.plots[2].id}`).expect(200);
    expect(a3.body.history.map((e: { summary: string }) => e.summary)).toContain('Not offered for renewal to Owen Owing for 2027: last season’s fee is not fully paid');
    const a4 = await s.coordinator.get(`/api/plots/${s.plots[3].id}`).expect(200);
    expect(a4.body.holder).toMatchObject({ name: 'Ines Other', season: 2027 });
    // Last season's holder waiting to renew is not "this season's" holder: the newest season says where it stands.
    const a1 = await s.coordinator.get(`/api/plots/${s.plots[0].id}`).expect(200);
    expect(a1.body.holder).toBeNull();
    expect(a1.body.season).toMatchObject({ year: 2027, state: { status: 'renewal_pending', renewal: { name: 'Hana Holder' } } });
  });

  for (const who of ['holder', 'volunteer'] as const) {
    it(`gives a ${who} no names, offers or arrears: only the plot's own history`, async () => {
      const s = await club();
      for (const plot of [...s.plots].reverse()) {
        const res = await s[who].get(`/api/plots/${plot.id}`).expect(200);
        const text = JSON.stringify(res.body);
        for (const word of PRIVATE) expect(text, `${plot.label} shows ${word}`).not.toContain(word);
        expect(res.body.history.every((e: { byName: string | null }) => e.byName === null)).toBe(true);
      }
      // "This season" is 2027, open while Hana's renewal of her 2026 plot waits: she sees her own renewal, a volunteer only "taken".
      const mine = await s[who].get(`/api/plots/${s.plots[0].id}`).expect(200);
      expect(mine.body.holder).toBeNull();
      expect(mine.body.season).toMatchObject(
        who === 'holder'
          ? { year: 2027, state: { status: 'renewal_pending', holder: null, offer: null, renewal: { name: 'Hana Holder' } } }
          : { year: 2027, state: { status: 'taken', holder: null, offer: null, renewal: null } },
      );
    });
  }
});
