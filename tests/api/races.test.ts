import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildApplication, buildClub } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

// Twenty people racing for one thing get one winner and nineteen clear refusals.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const N = 20;

async function clubWithSeason() {
  const club = await buildClub(t.db, { name: 'Hazel Bank Growers' });
  await t.db('fee_schedules').insert({ club_id: club.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const opened = await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2027 });
  expect(opened.status, JSON.stringify(opened.body)).toBe(201);
  return { club, coordinator, plotId: plot.id as number, seasonId: opened.body.season.id as number };
}

describe('races', () => {
  it(`${N} offers of one plot at once: exactly one is made`, async () => {
    const { club, coordinator, plotId, seasonId } = await clubWithSeason();
    const people = [];
    for (let i = 0; i < N; i++) people.push(await buildApplication(t.db, { clubId: club.id, name: `Person ${i}`, email: `p${i}@example.org` }));
    const answers = await Promise.all(people.map((p) => coordinator.post(`/api/seasons/${seasonId}/offers`, { plotId, applicationId: p.id })));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([201, ...Array(N - 1).fill(409)]);
    for (const refused of answers.filter((a) => a.status === 409)) expect(refused.body.error.message).toMatch(/already offered|Someone else has just offered/);
    expect(await t.db('offers').where({ plot_id: plotId, status: 'pending' }).count({ n: '*' }).first()).toEqual({ n: 1 });
  });

  it(`${N} accepts of one offer link at once: exactly one holder, one fee`, async () => {
    const { club, coordinator, plotId, seasonId } = await clubWithSeason();
    const person = await buildApplication(t.db, { clubId: club.id, name: 'Wren Applicant', email: 'wren.race@example.org' });
    const since = Date.now();
    expect((await coordinator.post(`/api/seasons/${seasonId}/offers`, { plotId, applicationId: person.id })).status).toBe(201);
    const mail = await waitForMail(mailUrl(), { to: 'wren.race@example.org', after: since });
    const token = new URL(extractLink(mail, '/respond/offer')).searchParams.get('token')!;
    const anon = await browserLikeAgent(t.app);
    const answers = await Promise.all(Array.from({ length: N }, () => anon.post('/api/offers/accept', { token })));
    expect(answers.map((a) => a.status).sort()).toEqual([200, ...Array(N - 1).fill(410)]);
    expect(await t.db('allocations').where({ season_id: seasonId, plot_id: plotId, status: 'active' }).count({ n: '*' }).first()).toEqual({ n: 1 });
    expect(await t.db('fees').where({ season_id: seasonId, plot_id: plotId }).count({ n: '*' }).first()).toEqual({ n: 1 });
  });
});
