import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import type { WaitlistEntry } from '@shared/schemas/applications';
import { buildApplication, buildClub } from '../factories';
import { addSite, signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { listMail, waitForMail } from '../helpers/inbox';

// A generous limit here; the rate-limit test builds its own app with a small one.
const t = setupTestApp({ APPLY_RATE_LIMIT: '1000' });
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 60 * 60 * 1000;

const signedIn = (clubId: number, roles: Role[]) => signedInMember(t, clubId, roles);

const application = (overrides: Record<string, unknown> = {}) => ({
  name: 'Hana Okoro',
  email: 'hana@example.org',
  phone: '01632 960001',
  preferredSize: 'medium',
  needsAccessible: false,
  needsRaised: true,
  preferredSiteId: null,
  notes: 'Evenings and weekends',
  website: '',
  ...overrides,
});

const waitlist = async (c: Agent, clubId: number, query = '') => {
  const res = await c.get(`/api/clubs/${clubId}/waitlist${query}`);
  expect(res.status).toBe(200);
  return res.body as { items: WaitlistEntry[]; page: number; total: number };
};

/** Four people waiting, applied 40, 30, 20 and 10 days ago, plus one already offered a plot. */
async function queueOfFour(clubId: number) {
  const now = Date.now();
  const a = await buildApplication(t.db, { clubId, name: 'Ada', appliedAt: new Date(now - 40 * DAY) });
  const offered = await buildApplication(t.db, { clubId, name: 'Olu', appliedAt: new Date(now - 35 * DAY), status: 'offered' });
  const b = await buildApplication(t.db, { clubId, name: 'Bea', appliedAt: new Date(now - 30 * DAY), needsAccessible: true });
  const c = await buildApplication(t.db, { clubId, name: 'Cai', appliedAt: new Date(now - 20 * DAY), needsRaised: true });
  const d = await buildApplication(t.db, { clubId, name: 'Dev', appliedAt: new Date(now - 10 * DAY), needsAccessible: true });
  return { a, b, c, d, offered };
}

describe('the public application form', () => {
  it('shows the club and its sites without signing in, and 404s an unknown club', async () => {
    const club = await buildClub(t.db, { name: 'Elm Row Growers', slug: 'elm-row' });
    const coordinator = await signedIn(club.id, ['coordinator']);
    await addSite(coordinator, club.id, 'West allotments');
    await addSite(coordinator, club.id, 'East beds');
    const visitor = await browserLikeAgent(t.app);
    const res = await visitor.get('/api/apply/elm-row');
    expect(res.status).toBe(200);
    expect(res.body.clubName).toBe('Elm Row Growers');
    expect(res.body.sites.map((s: { name: string }) => s.name)).toEqual(['East beds', 'West allotments']);
    expect(res.body).toMatchObject({ feeNote: null, typicalWait: null });
    // The club's own notes for applicants (club settings) are on the public form.
    await coordinator.patch(`/api/clubs/${club.id}`, { feeNote: 'From £25 a year', typicalWait: 'About a year' }).expect(200);
    expect((await visitor.get('/api/apply/elm-row')).body).toMatchObject({ feeNote: 'From £25 a year', typicalWait: 'About a year' });
    expect((await visitor.get('/api/apply/no-such-club')).status).toBe(404);
  });

  it('puts the applicant on the list, answers 201 with their place, and e-mails them what happens next', async () => {
    const club = await buildClub(t.db, { name: 'Elm Row Growers', slug: 'elm-row' });
    await buildApplication(t.db, { clubId: club.id, appliedAt: new Date(Date.now() - 5 * DAY) });
    const visitor = await browserLikeAgent(t.app);
    const after = Date.now();
    const res = await visitor.post('/api/apply/elm-row', application({ email: 'Hana@Example.org' }));
    expect(res.status).toBe(201);
    expect(res.body.position).toBe(2);
    expect(res.body.message).toContain('number 2 on the waiting list of Elm Row Growers');

    const row = await t.db('applications').where({ club_id: club.id, name: 'Hana Okoro' }).first();
    expect(row).toMatchObject({
      email: 'hana@example.org',
      phone: '01632 960001',
      preferred_size: 'medium',
      needs_raised: true,
      needs_accessible: false,
      status: 'waiting',
      notes: 'Evenings and weekends',
    });

    const mail = await waitForMail(mailUrl(), { to: 'hana@example.org', subject: 'Elm Row Growers waiting list', after });
    expect(mail.subject).toBe("You're on the Elm Row Growers waiting list: number 2");
    expect(mail.text).toContain('You are number 2 on the waiting list');
    expect(mail.text).toContain('a medium plot, a raised bed');
    expect(mail.text).toContain('What happens next');
    expect(mail.text).toContain('You have 7 days to answer an offer'); // the club's default offer_days
    expect(mail.text).toContain('You got this because this address was entered on the plot application form of Elm Row Growers');
  });

  it('needs the CSRF token like every other write', async () => {
    await buildClub(t.db, { slug: 'elm-row' });
    const visitor = await browserLikeAgent(t.app);
    const res = await visitor.agent.post('/api/apply/elm-row').send(application());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_failed');
  });

  it('answers a filled honeypot with a plausible receipt but stores and sends nothing', async () => {
    const club = await buildClub(t.db, { slug: 'elm-row' });
    await buildApplication(t.db, { clubId: club.id });
    const bot = await browserLikeAgent(t.app);
    const res = await bot.post('/api/apply/elm-row', application({ email: 'bot@example.org', website: 'http://spam.example' }));
    expect(res.status).toBe(201);
    expect(res.body.position).toBe(2);
    expect(res.body.message).toContain('number 2');
    expect(await t.db('applications').where({ email: 'bot@example.org' }).count({ n: '*' })).toEqual([{ n: 0 }]);
    // A real confirmation is in the outbox before the 201, so none there means none will be sent.
    expect(await t.db('mail_outbox').where({ to_address: 'bot@example.org' })).toEqual([]);
    expect(await listMail(mailUrl(), { to: 'bot@example.org' })).toEqual([]);
  });

  it('answers a second live application with the same address (any case) exactly as a new one, and tells the address by e-mail', async () => {
    const club = await buildClub(t.db, { name: 'Elm Row Growers', slug: 'elm-row' });
    const visitor = await browserLikeAgent(t.app);
    await buildApplication(t.db, { clubId: club.id, appliedAt: new Date(Date.now() - 9 * DAY) });
    expect((await visitor.post('/api/apply/elm-row', application())).status).toBe(201);
    await buildApplication(t.db, { clubId: club.id });

    // A stranger's address and Hana's, each sent now: the answers must not tell them apart.
    const since = Date.now();
    const fresh = await visitor.post('/api/apply/elm-row', application({ email: 'someone.new@example.org', name: 'Sam New' }));
    await t.db('applications').where({ email: 'someone.new@example.org' }).delete();
    const again = await visitor.post('/api/apply/elm-row', application({ email: 'HANA@example.org', name: 'Sam New' }));
    expect(again.status).toBe(fresh.status);
    expect(again.status).toBe(201);
    expect(again.body).toEqual({ ...fresh.body, message: fresh.body.message.replace('someone.new@example.org', 'hana@example.org') });
    expect(await t.db('applications').where({ club_id: club.id }).count({ n: '*' })).toEqual([{ n: 3 }]);

    const mail = await waitForMail(mailUrl(), { to: 'hana@example.org', subject: 'already on the', after: since });
    expect(mail.subject).toBe("You're already on the Elm Row Growers waiting list: number 2");
    expect(mail.text).toContain('Hello Hana Okoro,');
    expect(mail.text).toContain('your earlier application and its date stand');

    // Once removed, the same person may apply again: only live applications count.
    await t.db('applications').where({ club_id: club.id, email: 'hana@example.org' }).update({ status: 'removed' });
    expect((await visitor.post('/api/apply/elm-row', application())).status).toBe(201);
    expect(await t.db('applications').where({ club_id: club.id, status: 'waiting' }).count({ n: '*' })).toEqual([{ n: 3 }]);
  });

  it('answers bad input with 400 naming each field, including unknown fields and another club\'s site', async () => {
    await buildClub(t.db, { slug: 'elm-row' });
    const other = await buildClub(t.db);
    const otherSite = await addSite(await signedIn(other.id, ['coordinator']), other.id, 'Far field');
    const visitor = await browserLikeAgent(t.app);

    const bad = await visitor.post('/api/apply/elm-row', application({ name: '  ', email: 'not-an-address', preferredSize: 'huge' }));
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('validation_failed');
    // The size message is zod's own for an enum (the schema sets none).
    expect(bad.body.error.fields).toEqual({
      name: 'Enter your name',
      email: 'Enter a valid e-mail address',
      preferredSize: 'Invalid option: expected one of "small"|"medium"|"large"|"any"',
    });

    const extra = await visitor.post('/api/apply/elm-row', { ...application(), isCoordinator: true });
    expect(extra.status).toBe(400);
    expect(extra.body.error.fields).toEqual({ isCoordinator: 'Unknown field' });

    const site = await visitor.post('/api/apply/elm-row', application({ preferredSiteId: otherSite.id }));
    expect(site.status).toBe(400);
    expect(Object.keys(site.body.error.fields)).toEqual(['preferredSiteId']);
    expect(await t.db('applications').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('limits applications per address per hour', async () => {
    const limited = setupTestApp({ APPLY_RATE_LIMIT: '2' });
    try {
      await buildClub(limited.db, { slug: 'elm-row' });
      const visitor = await browserLikeAgent(limited.app);
      const codes = [];
      for (const email of ['a@example.org', 'b@example.org', 'c@example.org']) {
        codes.push((await visitor.post('/api/apply/elm-row', application({ email }))).status);
      }
      expect(codes).toEqual([201, 201, 429]);
      expect(await limited.db('applications').count({ n: '*' })).toEqual([{ n: 2 }]);
    } finally {
      await limited.close();
    }
  });
});

describe('the coordinator\'s waitlist', () => {
  it('lists people in queue order with 1-based positions among those waiting and days waited', async () => {
    const club = await buildClub(t.db);
    const { a, b, c, d, offered } = await queueOfFour(club.id);
    const coordinator = await signedIn(club.id, ['coordinator']);

    const waiting = await waitlist(coordinator, club.id);
    expect(waiting.items.map((e) => [e.id, e.position])).toEqual([
      [a.id, 1],
      [b.id, 2],
      [c.id, 3],
      [d.id, 4],
    ]);
    expect(waiting.total).toBe(4);
    expect(waiting.page).toBe(1);
    expect(waiting.items.map((e) => e.waitedDays)).toEqual([40, 30, 20, 10]);

    const all = await waitlist(coordinator, club.id, '?status=all');
    expect(all.items.map((e) => [e.name, e.position, e.status])).toEqual([
      ['Ada', 1, 'waiting'],
      ['Olu', null, 'offered'],
      ['Bea', 2, 'waiting'],
      ['Cai', 3, 'waiting'],
      ['Dev', 4, 'waiting'],
    ]);
    expect(all.items[1].id).toBe(offered.id);

    // Filters narrow the list but positions stay the real places in the queue.
    const accessible = await waitlist(coordinator, club.id, '?needs=accessible');
    expect(accessible.items.map((e) => [e.name, e.position])).toEqual([
      ['Bea', 2],
      ['Dev', 4],
    ]);
    const raised = await waitlist(coordinator, club.id, '?needs=raised');
    expect(raised.items.map((e) => e.name)).toEqual(['Cai']);
  });

  it('filters by preferred site and shows the site name', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedIn(club.id, ['coordinator']);
    const north = await addSite(coordinator, club.id, 'North field');
    const now = Date.now();
    await buildApplication(t.db, { clubId: club.id, name: 'Any', appliedAt: new Date(now - 3 * DAY) });
    await buildApplication(t.db, { clubId: club.id, name: 'Nia', appliedAt: new Date(now - 2 * DAY), preferredSiteId: north.id });
    const list = await waitlist(coordinator, club.id, `?siteId=${north.id}`);
    expect(list.items.map((e) => [e.name, e.position, e.preferredSiteName])).toEqual([['Nia', 2, 'North field']]);
  });

  it('moves someone to a new place with a reason, records it, and shows it in the history', async () => {
    const club = await buildClub(t.db);
    const { a, b, c, d } = await queueOfFour(club.id);
    const coordinator = await signedIn(club.id, ['coordinator']);

    const res = await coordinator.post(`/api/applications/${d.id}/move`, {
      toPosition: 2,
      reason: 'Needs the accessible bed that came free',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: d.id, position: 2 });
    expect((await waitlist(coordinator, club.id)).items.map((e) => e.id)).toEqual([a.id, d.id, b.id, c.id]);

    const moves = await t.db('waitlist_moves').where({ application_id: d.id });
    expect(moves).toHaveLength(1);
    expect(moves[0]).toMatchObject({
      from_position: 4,
      to_position: 2,
      kind: 'reordered',
      reason: 'Needs the accessible bed that came free',
      user_id: coordinator.person.id,
    });

    // To the front and to the back: no neighbour on one side.
    expect((await coordinator.post(`/api/applications/${c.id}/move`, { toPosition: 1, reason: 'Committee decision' })).status).toBe(200);
    expect((await coordinator.post(`/api/applications/${a.id}/move`, { toPosition: 4, reason: 'Asked to wait a year' })).status).toBe(200);
    expect((await waitlist(coordinator, club.id)).items.map((e) => e.id)).toEqual([c.id, d.id, b.id, a.id]);
    // The move changes the place in the queue, never the date they applied.
    const moved = (await waitlist(coordinator, club.id)).items.find((e) => e.id === a.id)!;
    expect(moved.waitedDays).toBe(40);

    const history = await coordinator.get(`/api/applications/${a.id}/history`);
    expect(history.status).toBe(200);
    expect(history.body.items).toEqual([
      expect.objectContaining({
        kind: 'reordered',
        fromPosition: 2, // Cai had just gone ahead of Ada
        toPosition: 4,
        reason: 'Asked to wait a year',
        byName: coordinator.person.name,
      }),
    ]);
  });

  it('moves correctly when everyone joined at the same instant (ties broken by id)', async () => {
    const club = await buildClub(t.db);
    const at = new Date(Date.now() - DAY);
    const ids = [];
    for (const name of ['P1', 'P2', 'P3', 'P4']) ids.push((await buildApplication(t.db, { clubId: club.id, name, appliedAt: at })).id);
    const coordinator = await signedIn(club.id, ['coordinator']);
    const res = await coordinator.post(`/api/applications/${ids[3]}/move`, { toPosition: 2, reason: 'Tie test reason' });
    expect(res.status).toBe(200);
    expect((await waitlist(coordinator, club.id)).items.map((e) => e.name)).toEqual(['P1', 'P4', 'P2', 'P3']);
  });

  it('refuses a move without a reason, to a place past the end, or of someone not waiting', async () => {
    const club = await buildClub(t.db);
    const { a, b, offered } = await queueOfFour(club.id);
    const coordinator = await signedIn(club.id, ['coordinator']);

    const noReason = await coordinator.post(`/api/applications/${b.id}/move`, { toPosition: 1 });
    expect(noReason.status).toBe(400);
    expect(Object.keys(noReason.body.error.fields)).toEqual(['reason']);
    const blank = await coordinator.post(`/api/applications/${b.id}/move`, { toPosition: 1, reason: '  ' });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields.reason).toBe('Give a reason (it is kept in the record)');

    const past = await coordinator.post(`/api/applications/${b.id}/move`, { toPosition: 9, reason: 'Too far back' });
    expect(past.status).toBe(400);
    expect(past.body.error.fields.toPosition).toBe('4 people are waiting; choose 1 to 4');

    const same = await coordinator.post(`/api/applications/${a.id}/move`, { toPosition: 1, reason: 'Already there' });
    expect(same.status).toBe(400);

    const notWaiting = await coordinator.post(`/api/applications/${offered.id}/move`, { toPosition: 1, reason: 'Offered already' });
    expect(notWaiting.status).toBe(409);

    expect(await t.db('waitlist_moves').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect((await waitlist(coordinator, club.id)).items[0].id).toBe(a.id);
  });

  it('removes someone with a reason: they leave the queue, the rest move up, and the history says why', async () => {
    const club = await buildClub(t.db);
    const { a, b, c, d } = await queueOfFour(club.id);
    const coordinator = await signedIn(club.id, ['coordinator']);

    const noReason = await coordinator.post(`/api/applications/${b.id}/remove`, {});
    expect(noReason.status).toBe(400);
    expect(Object.keys(noReason.body.error.fields)).toEqual(['reason']);

    const res = await coordinator.post(`/api/applications/${b.id}/remove`, { reason: 'Moved out of the area' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'removed', position: null });
    expect(await t.db('applications').where({ id: b.id }).first('status', 'removed_reason')).toEqual({
      status: 'removed',
      removed_reason: 'Moved out of the area',
    });
    expect((await waitlist(coordinator, club.id)).items.map((e) => [e.id, e.position])).toEqual([
      [a.id, 1],
      [c.id, 2],
      [d.id, 3],
    ]);
    const history = await coordinator.get(`/api/applications/${b.id}/history`);
    expect(history.body.items).toEqual([
      expect.objectContaining({ kind: 'removed', fromPosition: 2, toPosition: null, reason: 'Moved out of the area' }),
    ]);
    expect((await coordinator.post(`/api/applications/${b.id}/remove`, { reason: 'Twice over' })).status).toBe(409);
  });

  it('is for coordinators: a plot holder gets 403, another club\'s coordinator 403 or 404, a visitor 401', async () => {
    const club = await buildClub(t.db);
    const { b } = await queueOfFour(club.id);
    const holder = await signedIn(club.id, ['plot_holder', 'volunteer']);
    expect((await holder.get(`/api/clubs/${club.id}/waitlist`)).status).toBe(403);
    expect((await holder.post(`/api/applications/${b.id}/move`, { toPosition: 1, reason: 'Let me in first' })).status).toBe(403);
    expect((await holder.post(`/api/applications/${b.id}/remove`, { reason: 'Not a coordinator' })).status).toBe(403);
    expect((await holder.get(`/api/applications/${b.id}/history`)).status).toBe(403);

    const other = await buildClub(t.db);
    const outsider = await signedIn(other.id, ['coordinator']);
    expect((await outsider.get(`/api/clubs/${club.id}/waitlist`)).status).toBe(403);
    expect((await outsider.post(`/api/applications/${b.id}/move`, { toPosition: 1, reason: 'Not my club' })).status).toBe(404);
    expect((await outsider.get(`/api/applications/${b.id}/history`)).status).toBe(404);

    const visitor = await browserLikeAgent(t.app);
    expect((await visitor.get(`/api/clubs/${club.id}/waitlist`)).status).toBe(401);
    expect(await t.db('waitlist_moves').count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});
