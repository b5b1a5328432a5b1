import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import { mailIdle } from '../../server/services/outbox';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { listMail, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

type Agent = Awaited<ReturnType<typeof browserLikeAgent>>;

async function signIn(person: { email: string; password: string | null }) {
  const c = await browserLikeAgent(t.app);
  expect((await c.signIn(person.email, person.password!)).status).toBe(200);
  return c;
}

async function signedIn(clubId: number, roles: Role[], user: { name?: string; email?: string } = {}) {
  const person = await buildMember(t.db, { clubId, roles, user });
  return Object.assign(await signIn(person), { person });
}

async function addSiteWithPlots(c: Agent, clubId: number, name: string, labels: string[]) {
  const site = await c.post(`/api/clubs/${clubId}/sites`, {
    name,
    latitude: 51.5,
    longitude: -0.1,
    timeZone: 'Europe/London',
    width: 40,
    length: 30,
  });
  expect(site.status).toBe(201);
  const plots: number[] = [];
  for (const [i, label] of labels.entries()) {
    const plot = await c.post(`/api/sites/${site.body.id}/plots`, { label, x: i * 4, y: 0, width: 3, length: 6 });
    expect(plot.status).toBe(201);
    plots.push(plot.body.id);
  }
  return { id: site.body.id as number, plots };
}

async function season(clubId: number, year: number) {
  const [row] = await t.db('seasons').insert({ club_id: clubId, year }).returning('id');
  return row.id as number;
}

const allocate = (seasonId: number, plotId: number, userId: number, status = 'active') =>
  t.db('allocations').insert({ season_id: seasonId, plot_id: plotId, user_id: userId, source: 'manual', status });

/**
 * A club with a coordinator, two sites, and 2027 holders: Ana and Ben at North field, Cy at South
 * yard (who turned club news off), Dee's plot released; Ed held a plot only in 2026; Fay volunteers.
 */
async function clubWithHolders() {
  const club = await buildClub(t.db, { name: 'Elm Row Growers' });
  const coordinator = await signedIn(club.id, ['coordinator'], { name: 'Cora Coordinator' });
  const north = await addSiteWithPlots(coordinator, club.id, 'North field', ['N-1', 'N-2', 'N-3']);
  const south = await addSiteWithPlots(coordinator, club.id, 'South yard', ['S-1', 'S-2']);
  const person = (name: string, roles: Role[] = ['plot_holder']) =>
    buildMember(t.db, { clubId: club.id, roles, user: { name, email: `${name.toLowerCase()}@example.org` } });
  const [ana, ben, cy, dee, ed, fay] = [
    await person('Ana'),
    await person('Ben'),
    await person('Cy'),
    await person('Dee'),
    await person('Ed'),
    await person('Fay', ['volunteer']),
  ];
  const y2027 = await season(club.id, 2027);
  const y2026 = await season(club.id, 2026);
  await allocate(y2027, north.plots[0], ana.id);
  await allocate(y2027, north.plots[1], ben.id);
  await allocate(y2027, south.plots[0], cy.id);
  await allocate(y2027, south.plots[1], ana.id); // two plots, still one message
  await allocate(y2027, north.plots[2], dee.id, 'released');
  await allocate(y2026, north.plots[2], ed.id);
  const cyAgent = await signIn(cy);
  expect((await cyAgent.put(`/api/clubs/${club.id}/mail-preferences`, { clubNews: false })).status).toBe(200);
  return { club, coordinator, north, south, people: { ana, ben, cy, dee, ed, fay } };
}

const message = (audience: object, subject = 'Water off on Saturday') => ({
  subject,
  body: 'The mains water is off on Saturday morning.\n\nPlease fill your butts on Friday.',
  audience,
});

describe('club messages', () => {
  it("sends each of a season's holders their own e-mail with a footer, skipping the person who opted out", async () => {
    const { club, coordinator, people } = await clubWithHolders();
    const after = Date.now();
    const res = await coordinator.post(`/api/clubs/${club.id}/mailings`, message({ kind: 'season', year: 2027 }));
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(Number), recipients: 2, sent: 2, skipped: 1 });

    for (const who of [people.ana, people.ben]) {
      const mail = await waitForMail(mailUrl(), { to: who.email, subject: 'Water off on Saturday', after });
      // Their own message: nobody else's address in To or Cc.
      expect(mail.to).toEqual([who.email]);
      expect(mail.text).toContain(`Hello ${who.name},`);
      expect(mail.text).toContain('Please fill your butts on Friday.');
      expect(mail.text).toContain('You got this because you hold a plot at Elm Row Growers in 2027.');
      expect(mail.text).toContain(`http://127.0.0.1:3999/clubs/${club.id}/email-choices`);
      expect(mail.html).toContain(`<a href="http://127.0.0.1:3999/clubs/${club.id}/email-choices"`);
    }
    expect((await listMail(mailUrl(), { subject: 'Water off on Saturday' })).filter((m) => Date.parse(m.receivedAt) >= after)).toHaveLength(2);
    for (const who of [people.cy, people.dee, people.ed, people.fay]) {
      expect(await listMail(mailUrl(), { to: who.email, subject: 'Water off' })).toEqual([]);
    }

    await mailIdle(); // each copy is marked sent just after the inbox takes it
    const row = await t.db('mailings').where({ id: res.body.id }).first();
    expect(row).toMatchObject({ club_id: club.id, recipient_count: 2, sent_count: 2, sent_by_user_id: coordinator.person.id });
    expect(row.audience).toEqual({ kind: 'season', year: 2027 });
    const list = await coordinator.get(`/api/clubs/${club.id}/mailings`);
    expect(list.status).toBe(200);
    expect(list.body.items).toEqual([
      expect.objectContaining({
        subject: 'Water off on Saturday',
        audienceLabel: 'Plot holders in 2027',
        recipientCount: 2,
        sentCount: 2,
        sentByName: 'Cora Coordinator',
      }),
    ]);
  });

  it("sends to one site's holders that season, or to every member", async () => {
    const { club, coordinator, south, people } = await clubWithHolders();
    const site = await coordinator.post(`/api/clubs/${club.id}/mailings`, message({ kind: 'site', siteId: south.id, year: 2027 }, 'South yard gate code'));
    expect(site.body).toMatchObject({ recipients: 1, sent: 1, skipped: 1 }); // Ana; Cy opted out
    const ana = await waitForMail(mailUrl(), { to: people.ana.email, subject: 'South yard gate code' });
    expect(ana.text).toContain('You got this because you hold a plot at South yard (Elm Row Growers) in 2027.');
    expect(await listMail(mailUrl(), { to: people.ben.email, subject: 'South yard gate code' })).toEqual([]);

    const all = await coordinator.post(`/api/clubs/${club.id}/mailings`, message({ kind: 'all_members' }, 'Open day'));
    // Coordinator, Ana, Ben, Dee, Ed and Fay; Cy opted out.
    expect(all.body).toMatchObject({ recipients: 6, sent: 6, skipped: 1 });
    const fay = await waitForMail(mailUrl(), { to: people.fay.email, subject: 'Open day' });
    expect(fay.text).toContain('You got this because you are a member of Elm Row Growers.');
  });

  it('still sends required messages, such as a password reset, to someone who turned club news off', async () => {
    const { coordinator, club, people } = await clubWithHolders();
    await coordinator.post(`/api/clubs/${club.id}/mailings`, message({ kind: 'all_members' }, 'Club news only'));
    expect(await listMail(mailUrl(), { to: people.cy.email, subject: 'Club news only' })).toEqual([]);
    const visitor = await browserLikeAgent(t.app);
    const after = Date.now();
    expect((await visitor.post('/api/password-resets', { email: people.cy.email })).status).toBeLessThan(300);
    const reset = await waitForMail(mailUrl(), { to: people.cy.email, subject: 'Reset', after });
    expect(reset.text).toContain('reset');
  });

  it('checks the message and the audience', async () => {
    const { club, coordinator } = await clubWithHolders();
    const other = await buildClub(t.db);
    const otherCoordinator = await signedIn(other.id, ['coordinator']);
    const farSite = await addSiteWithPlots(otherCoordinator, other.id, 'Far field', []);

    const empty = await coordinator.post(`/api/clubs/${club.id}/mailings`, { subject: ' ', body: '', audience: { kind: 'season' } });
    expect(empty.status).toBe(400);
    // The missing year's message is zod's own for a required number (the schema sets none).
    expect(empty.body.error.fields).toEqual({
      subject: 'Enter a subject',
      body: 'Write the message',
      'audience.year': 'Invalid input: expected number, received undefined',
    });

    const foreign = await coordinator.post(`/api/clubs/${club.id}/mailings`, message({ kind: 'site', siteId: farSite.id, year: 2027 }));
    expect(foreign.status).toBe(400);
    expect(Object.keys(foreign.body.error.fields)).toEqual(['audience.siteId']);
    expect(await t.db('mailings').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('is for coordinators of the club', async () => {
    const { club, people } = await clubWithHolders();
    const holder = await signIn(people.ana);
    expect((await holder.post(`/api/clubs/${club.id}/mailings`, message({ kind: 'all_members' }))).status).toBe(403);
    expect((await holder.get(`/api/clubs/${club.id}/mailings`)).status).toBe(403);
    const outsider = await signedIn((await buildClub(t.db)).id, ['coordinator']);
    expect((await outsider.post(`/api/clubs/${club.id}/mailings`, message({ kind: 'all_members' }))).status).toBe(403);
    expect(await t.db('mailings').count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});

describe('e-mail choices', () => {
  it('lets any member turn club news off and on for themselves, in one club only', async () => {
    const club = await buildClub(t.db);
    const second = await buildClub(t.db);
    const volunteer = await signedIn(club.id, ['volunteer']);
    await t.db('memberships').insert({ club_id: second.id, user_id: volunteer.person.id, role: 'volunteer' });

    expect((await volunteer.get(`/api/clubs/${club.id}/mail-preferences`)).body).toEqual({ clubNews: true });
    const off = await volunteer.put(`/api/clubs/${club.id}/mail-preferences`, { clubNews: false });
    expect(off.status).toBe(200);
    expect(off.body).toEqual({ clubNews: false });
    expect((await volunteer.get(`/api/clubs/${club.id}/mail-preferences`)).body).toEqual({ clubNews: false });
    expect((await volunteer.get(`/api/clubs/${second.id}/mail-preferences`)).body).toEqual({ clubNews: true });
    expect((await volunteer.put(`/api/clubs/${club.id}/mail-preferences`, { clubNews: true })).body).toEqual({ clubNews: true });
    expect(await t.db('mail_preferences').where({ user_id: volunteer.person.id }).count({ n: '*' })).toEqual([{ n: 1 }]);

    const unknown = await volunteer.put(`/api/clubs/${club.id}/mail-preferences`, { clubNews: true, offers: false });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields).toEqual({ offers: 'Unknown field' });

    const outsider = await signedIn((await buildClub(t.db)).id, ['plot_holder']);
    expect((await outsider.get(`/api/clubs/${club.id}/mail-preferences`)).status).toBe(403);
    expect((await (await browserLikeAgent(t.app)).get(`/api/clubs/${club.id}/mail-preferences`)).status).toBe(401);
  });
});
