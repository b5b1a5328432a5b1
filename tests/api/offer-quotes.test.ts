import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, endOfLocalDay, localToday } from '@shared/dates';
import { buildApplication, buildClub, buildMember } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';
import { signedInMember } from '../helpers/api';

// The confirm step before an offer: what it would say, with nothing written and no mail sent.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;

async function setUp() {
  const club = await buildClub(t.db, { name: 'Hazel Bank Growers' });
  await t.db('clubs').where({ id: club.id }).update({ offer_days: 7 });
  // £2.50 a square metre and a £15 deposit (invented demo figures).
  await t.db('fee_schedules').insert({ club_id: club.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-3', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [shared] = await t.db('plots').insert({ site_id: site.id, label: 'Herbs', x_m: 10, y_m: 0, width_m: 2, length_m: 2, kind: 'shared_bed' }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027, renewal_deadline: new Date(Date.now() + 14 * DAY) }).returning('id');
  const person = await buildApplication(t.db, { clubId: club.id, name: 'Ines Carvalho', email: 'ines@example.org' });
  return { club, coordinator, plotId: plot.id as number, sharedId: shared.id as number, seasonId: season.id as number, person };
}

describe('offer quote (the confirm step)', () => {
  it('names the person and the plot, the deadline from the club’s days to answer, and the fee with its deposit', async () => {
    const { club, coordinator, plotId, seasonId, person } = await setUp();
    const before = Date.now();
    const res = await coordinator.get(`/api/seasons/${seasonId}/offer-quote?plotId=${plotId}&applicationId=${person.id}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // Computed: 3 m × 6 m = 18 m² at 250 minor units a m² = 4,500; plus the 1,500 deposit = 6,000.
    expect(res.body).toMatchObject({
      personName: 'Ines Carvalho',
      personEmail: 'ines@example.org',
      plotLabel: 'A-3',
      siteName: 'Top field',
      offerDays: 7,
      fee: { plotFeeMinor: 4500, depositMinor: 1500, totalMinor: 6000, currency: 'GBP' },
      fitsNeeds: true,
    });
    // The rule offers use: the end of the club's day, 7 calendar days from today in its zone.
    const { time_zone: zone } = await t.db('clubs').where({ id: club.id }).first('time_zone');
    const expected = endOfLocalDay(addCalendarDays(localToday(zone, new Date(before)), 7), zone);
    expect(res.body.deadline).toBe(expected.toISOString());
    expect(await t.db('offers').count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('refuses a shared bed, a person no longer waiting, other clubs and non-coordinators', async () => {
    const { club, coordinator, plotId, sharedId, seasonId, person } = await setUp();
    const shared = await coordinator.get(`/api/seasons/${seasonId}/offer-quote?plotId=${sharedId}&applicationId=${person.id}`);
    expect(shared.status).toBe(409);
    expect(shared.body.error.message).toBe('A shared bed is tended by the club together and is not offered to one person.');

    await t.db('applications').where({ id: person.id }).update({ status: 'withdrawn' });
    const gone = await coordinator.get(`/api/seasons/${seasonId}/offer-quote?plotId=${plotId}&applicationId=${person.id}`);
    expect(gone.status).toBe(409);
    expect(gone.body.error.message).toBe('Ines Carvalho is no longer waiting for a plot.');

    const holder = await signedInMember(t, club.id, ['plot_holder']);
    expect((await holder.get(`/api/seasons/${seasonId}/offer-quote?plotId=${plotId}&applicationId=${person.id}`)).status).toBe(403);

    const other = await buildClub(t.db);
    const stranger = await buildMember(t.db, { clubId: other.id, roles: ['coordinator'] });
    const agent = await browserLikeAgent(t.app);
    await agent.signIn(stranger.email, stranger.password!);
    expect((await agent.get(`/api/seasons/${seasonId}/offer-quote?plotId=${plotId}&applicationId=${person.id}`)).status).toBe(404);

    const bad = await coordinator.get(`/api/seasons/${seasonId}/offer-quote?plotId=2147483648&applicationId=${person.id}`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['plotId']);
  });
});
