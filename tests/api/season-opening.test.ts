import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

// Opening a season sends e-mails, so the coordinator first sees how many and to whom, and a
// season cannot be opened with renewals closing before the previous season's.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;

async function clubWithHolders() {
  const club = await buildClub(t.db, { name: 'Hazel Bank Growers' });
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const [last] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
  const holders = [
    ['Ada Paid', 'A-1', 0],
    ['Bo Paid', 'A-2', 0],
    ['Cy Owes', 'A-3', 2000],
  ] as const;
  for (const [i, [name, label, owed]] of holders.entries()) {
    const person = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { name } });
    const [plot] = await t.db('plots').insert({ site_id: site.id, label, x_m: i * 4, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    const [alloc] = await t.db('allocations').insert({ season_id: last.id, plot_id: plot.id, user_id: person.id, source: 'offer' }).returning('id');
    const [fee] = await t.db('fees')
      .insert({ club_id: club.id, season_id: last.id, allocation_id: alloc.id, user_id: person.id, plot_id: plot.id, description: 'x', plot_fee_minor: 4000, deposit_minor: 0, currency: 'GBP', due_on: '2026-04-01' })
      .returning('id');
    await t.db('payments').insert({ fee_id: fee.id, amount_minor: 4000 - owed, method: 'cash', paid_on: '2026-03-01' });
  }
  return { club, coordinator };
}

describe('opening a season', () => {
  it('previews how many renewal e-mails would go and who is left out, and sends nothing', async () => {
    const { club, coordinator } = await clubWithHolders();
    const preview = await coordinator.get(`/api/clubs/${club.id}/seasons/opening-preview?year=2027`);
    expect(preview.status).toBe(200);
    // Two of the three 2026 holders have paid in full (set up above); Cy still owes £20.
    expect(preview.body).toEqual({
      year: 2027,
      previousYear: 2026,
      renewals: 2,
      notRenewed: [{ name: 'Cy Owes', plotLabel: 'A-3', reason: 'Last season’s fee is not fully paid' }],
    });
    expect(await t.db('seasons').where({ club_id: club.id, year: 2027 }).first()).toBeUndefined();
    expect(Number((await t.db('mail_outbox').count({ n: '*' }).first())?.n)).toBe(0);

    // The preview's count is what opening sends.
    const opened = await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2027, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
    expect(opened.status).toBe(201);
    expect(opened.body.renewalsSent).toBe(2);
    expect(opened.body.notRenewed).toEqual(preview.body.notRenewed);
  });

  it('keeps who opened the season and when, so the page can say it after a reload', async () => {
    const { club, coordinator } = await clubWithHolders();
    await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2027, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
    const list = await coordinator.get(`/api/clubs/${club.id}/seasons`);
    expect(list.body.items[0]).toMatchObject({ year: 2027, openedBy: coordinator.person.name, counts: { renewalsPending: 2 } });
  });

  it('refuses renewals that close before the previous season’s, and an earlier season after a later one', async () => {
    const { club, coordinator } = await clubWithHolders();
    const deadline2027 = new Date(Date.now() + 30 * DAY);
    expect((await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2027, renewalDeadline: deadline2027.toISOString() })).status).toBe(201);
    const early = await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2028, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
    expect(early.status).toBe(400);
    expect(early.body.error.message).toMatch(/^Renewals for 2028 must close after the 2027 renewals, which close on /);
    expect(early.body.error.fields.renewalDeadline).toMatch(/^Choose a date after /);
    expect(await t.db('seasons').where({ club_id: club.id, year: 2028 }).first()).toBeUndefined();

    const older = await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2025, renewalDeadline: new Date(Date.now() + 60 * DAY).toISOString() });
    expect(older.status).toBe(409);
    expect(older.body.error.fields).toEqual({ year: 'Choose a year after 2027' });

    const later = await coordinator.post(`/api/clubs/${club.id}/seasons`, { year: 2028, renewalDeadline: new Date(deadline2027.getTime() + DAY).toISOString() });
    expect(later.status).toBe(201);
  });

  it('is for coordinators only, and refuses bad years', async () => {
    const { club, coordinator } = await clubWithHolders();
    const volunteer = await signedInMember(t, club.id, ['volunteer', 'plot_holder']);
    expect((await volunteer.get(`/api/clubs/${club.id}/seasons/opening-preview?year=2027`)).status).toBe(403);
    for (const year of ['', 'abc', '1999', '2101', '2027.5', '99999999999999999999', '%00']) {
      const res = await coordinator.get(`/api/clubs/${club.id}/seasons/opening-preview?year=${year}`);
      expect(res.status, year).toBe(400);
      expect(res.body.error.fields).toHaveProperty('year');
    }
  });
});
