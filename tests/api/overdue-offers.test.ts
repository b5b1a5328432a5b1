import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildApplication, buildClub } from '../factories';
import { signedInMember } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

// An offer past its deadline has lapsed wherever it is read, before the sweep has run.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

describe('an offer past its deadline, before the sweep', () => {
  it('no longer shows its person as offered on the waitlist: they follow the club’s rule', async () => {
    const club = await buildClub(t.db);
    await t.db('clubs').where({ id: club.id }).update({ declined_offer_policy: 'end_of_list' });
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const [site] = await t.db('sites').insert({ club_id: club.id, name: 'Field', latitude: 51, longitude: 0, time_zone: 'Europe/London' }).returning('id');
    const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const first = await buildApplication(t.db, { clubId: club.id, name: 'Late Answerer', email: 'late@example.org', appliedAt: new Date('2025-01-01'), status: 'offered' });
    await buildApplication(t.db, { clubId: club.id, name: 'Next Person', email: 'next@example.org', appliedAt: new Date('2025-06-01') });
    await t.db('offers').insert({ season_id: season.id, plot_id: plot.id, application_id: first.id, token_hash: 'f'.repeat(64), deadline: new Date(Date.now() - 60_000) });

    const list = await coordinator.get(`/api/clubs/${club.id}/waitlist?status=all`);
    expect(list.status).toBe(200);
    const people = list.body.items.map((e: { name: string; status: string; position: number | null }) => [e.name, e.status, e.position]);
    // The club moves a lapsed offer's person to the end of the list: Next Person is now first.
    expect(people).toEqual([
      ['Next Person', 'waiting', 1],
      ['Late Answerer', 'waiting', 2],
    ]);
    expect(await t.db('offers').where({ application_id: first.id }).pluck('status')).toEqual(['lapsed']);
  });
});
