import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;

/**
 * A club whose 2027 season is open: Hana held A-1 and Ines held A-2 in 2026, both paid, so both have
 * a renewal waiting; a volunteer holds nothing; an outsider belongs to another club.
 */
async function club() {
  const c = await buildClub(t.db, { name: 'Hazel Bank Growers' });
  await t.db('fee_schedules').insert({ club_id: c.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const hana = await signedInMember(t, c.id, ['plot_holder']);
  await t.db('users').where({ id: hana.person.id }).update({ name: 'Hana Holder' });
  const ines = await signedInMember(t, c.id, ['plot_holder']);
  await t.db('users').where({ id: ines.person.id }).update({ name: 'Ines Other' });
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const elsewhere = await buildClub(t.db, { name: 'Far Meadow' });
  const outsider = await signedInMember(t, elsewhere.id, ['plot_holder']);
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const plots: Array<{ id: number; label: string }> = await t.db('plots')
    .insert(['A-1', 'A-2'].map((label, i) => ({ site_id: site.id, label, x_m: i * 3.9, y_m: 0, width_m: 3, length_m: 6 })))
    .returning(['id', 'label']);
  const [last] = await t.db('seasons').insert({ club_id: c.id, year: 2026 }).returning('id');
  const allocations = await t.db('allocations')
    .insert([
      { season_id: last.id, plot_id: plots[0].id, user_id: hana.person.id, source: 'offer' },
      { season_id: last.id, plot_id: plots[1].id, user_id: ines.person.id, source: 'offer' },
    ])
    .returning('id');
  const fees = await t.db('fees')
    .insert(
      [hana, ines].map((who, i) => ({
        club_id: c.id, season_id: last.id, allocation_id: allocations[i].id, user_id: who.person.id, plot_id: plots[i].id,
        description: 'Plot 2026', plot_fee_minor: 4500, deposit_minor: 1500, currency: 'GBP', due_on: '2026-04-01',
      })),
    )
    .returning('id');
  await t.db('payments').insert(fees.map((f: { id: number }) => ({ fee_id: f.id, amount_minor: 6000, method: 'cash', paid_on: '2026-03-01' })));
  const deadline = new Date(Date.now() + 14 * DAY);
  const opened = await coordinator.post(`/api/clubs/${c.id}/seasons`, { year: 2027, renewalDeadline: deadline.toISOString() });
  expect(opened.status, JSON.stringify(opened.body)).toBe(201);
  const renewalOf = async (userId: number) => (await t.db('renewals').where({ user_id: userId }).first('id', 'deadline')) as { id: number; deadline: Date };
  return { club: c, siteId: site.id as number, plots, coordinator, hana, ines, volunteer, outsider, hanaRenewal: await renewalOf(hana.person.id), inesRenewal: await renewalOf(ines.person.id) };
}

describe('GET /api/clubs/:clubId/my-plot', () => {
  it('gives a holder their own plot and their own renewal, naming nobody else', async () => {
    const s = await club();
    const res = await s.hana.get(`/api/clubs/${s.club.id}/my-plot`).expect(200);
    expect(res.body).toEqual({
      holding: {
        plotId: s.plots[0].id,
        label: 'A-1',
        kind: 'in_ground',
        // computed: the plot is 3 m × 6 m = 18 m², on a metric site
        size: '3 m × 6 m',
        area: '18 m²',
        seasonYear: 2026,
        site: { id: s.siteId, name: 'Top field', width: 30, length: 20, units: 'metric' },
      },
      renewal: { id: s.hanaRenewal.id, seasonYear: 2027, plotLabel: 'A-1', siteName: 'Top field', deadline: s.hanaRenewal.deadline.toISOString() },
    });
    expect(JSON.stringify(res.body)).not.toContain('Ines');
    expect(JSON.stringify(res.body)).not.toContain('A-2');
  });

  it('gives a volunteer and a coordinator with no plot nothing', async () => {
    const s = await club();
    for (const who of [s.volunteer, s.coordinator]) {
      expect((await who.get(`/api/clubs/${s.club.id}/my-plot`).expect(200)).body).toEqual({ holding: null, renewal: null });
    }
  });

  it('leaves out a renewal once its deadline has passed or it is answered', async () => {
    const s = await club();
    await t.db('renewals').where({ id: s.hanaRenewal.id }).update({ deadline: new Date(Date.now() - 60_000) });
    expect((await s.hana.get(`/api/clubs/${s.club.id}/my-plot`).expect(200)).body.renewal).toBeNull();
    await s.ines.post(`/api/renewals/${s.inesRenewal.id}/release`).expect(200);
    expect((await s.ines.get(`/api/clubs/${s.club.id}/my-plot`).expect(200)).body.renewal).toBeNull();
  });

  it('refuses someone outside the club (403), a signed-out visitor (401) and a bad club id (400)', async () => {
    const s = await club();
    expect((await s.outsider.get(`/api/clubs/${s.club.id}/my-plot`)).status).toBe(403);
    const anonymous = await browserLikeAgent(t.app);
    expect((await anonymous.get(`/api/clubs/${s.club.id}/my-plot`)).status).toBe(401);
    for (const bad of ['abc', '0', '2147483648', '1.5']) {
      const res = await s.hana.get(`/api/clubs/${bad}/my-plot`);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
    }
  });
});

describe('answering one’s own renewal while signed in', () => {
  it('shows the holder the same facts the e-mailed link shows', async () => {
    const s = await club();
    const res = await s.hana.get(`/api/renewals/${s.hanaRenewal.id}`).expect(200);
    expect(res.body).toMatchObject({ kind: 'renewal', status: 'pending', name: 'Hana Holder', year: 2027, plot: { label: 'A-1', siteName: 'Top field' } });
    expect(res.body.deadline).toBe(s.hanaRenewal.deadline.toISOString());
  });

  it('keeps the plot: a 2027 allocation appears and the renewal is answered', async () => {
    const s = await club();
    const res = await s.hana.post(`/api/renewals/${s.hanaRenewal.id}/keep`).expect(200);
    expect(res.body.status).toBe('kept');
    expect((await t.db('renewals').where({ id: s.hanaRenewal.id }).first('status')).status).toBe('kept');
    const mine = await s.hana.get(`/api/clubs/${s.club.id}/my-plot`).expect(200);
    expect(mine.body.holding.seasonYear).toBe(2027);
    expect(mine.body.renewal).toBeNull();
  });

  it('answers 404 for another person’s renewal and changes nothing', async () => {
    const s = await club();
    for (const who of [s.hana, s.coordinator, s.volunteer, s.outsider]) {
      expect((await who.get(`/api/renewals/${s.inesRenewal.id}`)).status).toBe(404);
      expect((await who.post(`/api/renewals/${s.inesRenewal.id}/keep`)).status).toBe(404);
      expect((await who.post(`/api/renewals/${s.inesRenewal.id}/release`)).status).toBe(404);
    }
    expect((await t.db('renewals').where({ id: s.inesRenewal.id }).first('status')).status).toBe('pending');
  });

  it('asks a signed-out visitor to sign in and refuses bad ids with 400', async () => {
    const s = await club();
    const anonymous = await browserLikeAgent(t.app);
    expect((await anonymous.get(`/api/renewals/${s.hanaRenewal.id}`)).status).toBe(401);
    expect((await anonymous.post(`/api/renewals/${s.hanaRenewal.id}/keep`)).status).toBe(401);
    for (const bad of ['abc', '0', '-1', '2147483648', '1e3']) {
      const res = await s.hana.post(`/api/renewals/${bad}/keep`);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect((await s.hana.get(`/api/renewals/${bad}`)).status, bad).toBe(400);
    }
  });
});
