import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { sweepDeadlines } from '../../server/jobs/deadlines';
import { startJobs } from '../../server/jobs';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;

/** A club with a coordinator signed in, one metric site with four 3 × 6 m plots and a fee schedule. */
async function club(opts: { policy?: 'end_of_list' | 'remove'; multiple?: boolean } = {}) {
  const c = await buildClub(t.db, { name: 'Hazel Bank Growers' });
  await t.db('clubs').where({ id: c.id }).update({ declined_offer_policy: opts.policy ?? 'end_of_list', allow_multiple_offers: opts.multiple ?? false });
  await t.db('fee_schedules').insert({ club_id: c.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coord = await buildMember(t.db, { clubId: c.id, roles: ['coordinator'] });
  const agent = await browserLikeAgent(t.app);
  await agent.signIn(coord.email, coord.password!);
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const plots = await t.db('plots')
    .insert(['A-1', 'A-2', 'A-3', 'A-4'].map((label, i) => ({ site_id: site.id, label, x_m: i * 3.9, y_m: 0, width_m: 3, length_m: 6 })))
    .returning(['id', 'label']);
  return { club: c, coord, agent, siteId: site.id as number, plots: plots as Array<{ id: number; label: string }> };
}

async function apply(clubId: number, name: string, email: string, appliedDaysAgo: number) {
  const at = new Date(Date.now() - appliedDaysAgo * DAY);
  const [row] = await t.db('applications').insert({ club_id: clubId, name, email, applied_at: at, queue_at: at }).returning('id');
  return row.id as number;
}

async function openSeason(agent: Awaited<ReturnType<typeof browserLikeAgent>>, clubId: number, year: number) {
  const res = await agent.post(`/api/clubs/${clubId}/seasons`, { year, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

const tokenOf = (url: string) => new URL(url).searchParams.get('token')!;

describe('opening a season and renewals', () => {
  it('sends renewals to holders in good standing only; keeping creates the fee; the link works once', async () => {
    const { club: c, agent, plots } = await club();
    const paid = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'], user: { name: 'Paid Up', email: 'paid@example.org' } });
    const owing = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'], user: { name: 'Still Owing', email: 'owing@example.org' } });
    const [last] = await t.db('seasons').insert({ club_id: c.id, year: 2026 }).returning('id');
    const [a1, a2] = await t.db('allocations')
      .insert([
        { season_id: last.id, plot_id: plots[0].id, user_id: paid.id, source: 'offer' },
        { season_id: last.id, plot_id: plots[1].id, user_id: owing.id, source: 'offer' },
      ])
      .returning('id');
    const [f1, f2] = await t.db('fees')
      .insert([
        { club_id: c.id, season_id: last.id, allocation_id: a1.id, user_id: paid.id, plot_id: plots[0].id, description: 'x', plot_fee_minor: 4500, deposit_minor: 1500, currency: 'GBP', due_on: '2026-04-01' },
        { club_id: c.id, season_id: last.id, allocation_id: a2.id, user_id: owing.id, plot_id: plots[1].id, description: 'y', plot_fee_minor: 4500, deposit_minor: 1500, currency: 'GBP', due_on: '2026-04-01' },
      ])
      .returning('id');
    await t.db('payments').insert([
      { fee_id: f1.id, amount_minor: 6000, method: 'cash', paid_on: '2026-03-01' },
      { fee_id: f2.id, amount_minor: 1000, method: 'cash', paid_on: '2026-03-01' },
    ]);

    const since = Date.now();
    const opened = await openSeason(agent, c.id, 2027);
    expect(opened.renewalsSent).toBe(1);
    expect(opened.notRenewed).toEqual([{ name: 'Still Owing', plotLabel: 'A-2', reason: 'Last season’s fee is not fully paid' }]);
    expect(opened.season.counts).toMatchObject({ renewalsPending: 1, taken: 0 });
    expect((await agent.post(`/api/clubs/${c.id}/seasons`, { year: 2027, renewalDeadline: new Date(Date.now() + DAY).toISOString() })).status).toBe(409);

    const mail = await waitForMail(mailUrl(), { to: 'paid@example.org', after: since });
    expect(mail.subject).toMatch(/^Keep plot A-1 for 2027\?/);
    const token = tokenOf(extractLink(mail, '/respond/renewal'));
    const anon = await browserLikeAgent(t.app);
    const preview = await anon.get(`/api/renewals/preview?token=${encodeURIComponent(token)}`).expect(200);
    expect(preview.body).toMatchObject({ kind: 'renewal', status: 'pending', name: 'Paid Up', year: 2027, plot: { label: 'A-1', size: '3 m × 6 m', area: '18 m²' } });
    // 18 m² at 2.50 a m² (computed); the £15 deposit paid in 2026 is still held, so none is asked again.
    expect(preview.body.fee).toEqual({ plotFeeMinor: 4500, depositMinor: 0, currency: 'GBP' });

    expect((await anon.post('/api/renewals/keep', { token })).status).toBe(200);
    expect((await anon.post('/api/renewals/release', { token })).status).toBe(410);
    const season = await t.db('seasons').where({ club_id: c.id, year: 2027 }).first('id');
    const states = (await agent.get(`/api/seasons/${season.id}/plot-states?siteId=${(await t.db('plots').where({ id: plots[0].id }).first()).site_id}`)).body.items;
    expect(states.find((s: { plotId: number }) => s.plotId === plots[0].id)).toMatchObject({ status: 'taken', holder: { name: 'Paid Up' } });
    expect(states.find((s: { plotId: number }) => s.plotId === plots[1].id).status).toBe('free');
    const fee = await t.db('fees').where({ season_id: season.id }).first();
    expect(fee).toMatchObject({ user_id: paid.id, plot_fee_minor: 4500, deposit_minor: 0 });
    const history = (await agent.get(`/api/plots/${plots[0].id}`)).body.history.map((e: { kind: string }) => e.kind);
    expect(history.slice(0, 2)).toEqual(['renewed', 'renewal_sent']);
  });
});

describe('offers', () => {
  it('offers a free plot by e-mail; accepting makes a plot holder with a fee and a password link; the link works once', async () => {
    const { club: c, agent, plots, siteId } = await club();
    const appId = await apply(c.id, 'Wren Applicant', 'wren@example.org', 100);
    const season = (await openSeason(agent, c.id, 2027)).season;
    const since = Date.now();
    const offered = await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[2].id, applicationId: appId });
    expect(offered.status).toBe(201);
    expect(offered.body).toMatchObject({ status: 'pending', plotId: plots[2].id });
    expect(new Date(offered.body.deadline).getTime() - Date.now()).toBeGreaterThan(6.9 * DAY); // the club's 7 days
    const states = (await agent.get(`/api/seasons/${season.id}/plot-states?siteId=${siteId}`)).body.items;
    expect(states.find((s: { plotId: number }) => s.plotId === plots[2].id)).toMatchObject({ status: 'offered', offer: { name: 'Wren Applicant' } });

    const mail = await waitForMail(mailUrl(), { to: 'wren@example.org', after: since });
    expect(mail.subject).toMatch(/^A plot for you at Hazel Bank Growers: A-3/);
    expect(mail.text).toContain('£45.00 plus a refundable deposit of £15.00');
    const token = tokenOf(extractLink(mail, '/respond/offer'));

    const anon = await browserLikeAgent(t.app);
    expect((await anon.get(`/api/offers/preview?token=${encodeURIComponent(token)}`)).body).toMatchObject({ kind: 'offer', status: 'pending', name: 'Wren Applicant' });
    const accepted = await anon.post('/api/offers/accept', { token });
    expect(accepted.status).toBe(200);
    expect(accepted.body.status).toBe('accepted');
    expect((await anon.post('/api/offers/accept', { token })).status).toBe(410);
    expect((await anon.post('/api/offers/decline', { token })).status).toBe(410);

    const user = await t.db('users').where({ email: 'wren@example.org' }).first();
    expect(user.password_hash).toBeNull();
    expect(await t.db('memberships').where({ club_id: c.id, user_id: user.id }).pluck('role')).toEqual(['plot_holder']);
    expect(await t.db('allocations').where({ season_id: season.id, plot_id: plots[2].id, status: 'active' }).pluck('user_id')).toEqual([user.id]);
    expect(await t.db('fees').where({ user_id: user.id }).first('plot_fee_minor', 'deposit_minor')).toEqual({ plot_fee_minor: 4500, deposit_minor: 1500 });
    expect((await t.db('applications').where({ id: appId }).first()).status).toBe('allocated');

    const welcome = await waitForMail(mailUrl(), { to: 'wren@example.org', subject: 'is yours for 2027', after: since });
    const pw = tokenOf(extractLink(welcome, '/reset-password'));
    await anon.post('/api/password-resets/complete', { token: pw, password: 'wren-grows-beans' }).expect(204);
    expect((await (await browserLikeAgent(t.app)).signIn('wren@example.org', 'wren-grows-beans')).status).toBe(200);

    const kinds = (await agent.get(`/api/plots/${plots[2].id}`)).body;
    expect(kinds.holder).toEqual({ userId: user.id, name: 'Wren Applicant', season: 2027 });
    expect(kinds.history.map((e: { kind: string }) => e.kind).slice(0, 2)).toEqual(['accepted', 'offered']);
  });

  it('gives one of two parallel offers of the same plot a 201 and the other a 409', async () => {
    const { club: c, agent, plots } = await club();
    const second = await buildMember(t.db, { clubId: c.id, roles: ['coordinator'] });
    const other = await browserLikeAgent(t.app);
    await other.signIn(second.email, second.password!);
    const a = await apply(c.id, 'First Person', 'first@example.org', 30);
    const b = await apply(c.id, 'Second Person', 'second@example.org', 20);
    const season = (await openSeason(agent, c.id, 2027)).season;
    const [r1, r2] = await Promise.all([
      agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: a }),
      other.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: b }),
    ]);
    expect([r1.status, r2.status].sort()).toEqual([201, 409]);
    const loser = r1.status === 409 ? r1 : r2;
    expect(loser.body.error.message).toMatch(/Plot A-1 cannot be offered: it is already offered to|Someone else has just offered/);
    expect(await t.db('offers').where({ plot_id: plots[0].id, status: 'pending' }).count()).toEqual([{ count: 1 }]);
  });

  it('refuses a second open offer to one person unless the club allows it', async () => {
    const strict = await club();
    const app = await apply(strict.club.id, 'Keen Grower', 'keen@example.org', 10);
    const s1 = (await openSeason(strict.agent, strict.club.id, 2027)).season;
    await strict.agent.post(`/api/seasons/${s1.id}/offers`, { plotId: strict.plots[0].id, applicationId: app }).expect(201);
    const again = await strict.agent.post(`/api/seasons/${s1.id}/offers`, { plotId: strict.plots[1].id, applicationId: app });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe('Keen Grower already has an open offer; the club allows one at a time.');
    // Taken, offered and renewing plots cannot be offered either.
    const other = await apply(strict.club.id, 'Other Grower', 'other@example.org', 5);
    const taken = await strict.agent.post(`/api/seasons/${s1.id}/offers`, { plotId: strict.plots[0].id, applicationId: other });
    expect(taken.status).toBe(409);

    await truncateAll(t.db);
    const loose = await club({ multiple: true });
    const app2 = await apply(loose.club.id, 'Keen Grower', 'keen@example.org', 10);
    const s2 = (await openSeason(loose.agent, loose.club.id, 2027)).season;
    await loose.agent.post(`/api/seasons/${s2.id}/offers`, { plotId: loose.plots[0].id, applicationId: app2 }).expect(201);
    await loose.agent.post(`/api/seasons/${s2.id}/offers`, { plotId: loose.plots[1].id, applicationId: app2 }).expect(201);
  });

  it('moves a person who declines to the end of the list, or removes them, as the club decides', async () => {
    for (const policy of ['end_of_list', 'remove'] as const) {
      await truncateAll(t.db);
      const { club: c, agent, plots } = await club({ policy });
      const app = await apply(c.id, 'Maybe Later', 'maybe@example.org', 400);
      const season = (await openSeason(agent, c.id, 2027)).season;
      const since = Date.now();
      await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: app }).expect(201);
      const token = tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'maybe@example.org', after: since }), '/respond/offer'));
      const res = await (await browserLikeAgent(t.app)).post('/api/offers/decline', { token });
      expect(res.status).toBe(200);
      const row = await t.db('applications').where({ id: app }).first();
      if (policy === 'remove') {
        expect(row).toMatchObject({ status: 'removed', removed_reason: 'Declined an offer' });
      } else {
        expect(row.status).toBe('waiting');
        expect(row.queue_at.getTime()).toBeGreaterThan(since - 1000);
        expect(row.applied_at.getTime()).toBeLessThan(since - 399 * DAY);
      }
      expect((await t.db('waitlist_moves').where({ application_id: app }).first()).reason).toMatch(/^Offer declined/);
      expect(await t.db('offers').where({ status: 'pending' }).count()).toEqual([{ count: 0 }]);
    }
  });

  it('lapses offers and renewals at their deadline (time injected), freeing the plot', async () => {
    const { club: c, agent, plots, siteId } = await club();
    const holder = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'], user: { email: 'quiet@example.org', name: 'Quiet Holder' } });
    const [last] = await t.db('seasons').insert({ club_id: c.id, year: 2026 }).returning('id');
    await t.db('allocations').insert({ season_id: last.id, plot_id: plots[3].id, user_id: holder.id, source: 'offer' });
    const app = await apply(c.id, 'Slow Reader', 'slow@example.org', 50);
    const season = (await openSeason(agent, c.id, 2027)).season;
    const deadline = new Date(Date.now() + 3 * DAY);
    const since = Date.now();
    await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: app, deadline: deadline.toISOString() }).expect(201);
    const token = tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'slow@example.org', after: since }), '/respond/offer'));

    expect(await sweepDeadlines(t.db, new Date(deadline.getTime() - 1000))).toEqual({ offersLapsed: 0, renewalsLapsed: 0 });
    expect(await sweepDeadlines(t.db, new Date(Date.now() + 15 * DAY))).toEqual({ offersLapsed: 1, renewalsLapsed: 1 });
    expect(await sweepDeadlines(t.db, new Date(Date.now() + 16 * DAY))).toEqual({ offersLapsed: 0, renewalsLapsed: 0 });

    const states = (await agent.get(`/api/seasons/${season.id}/plot-states?siteId=${siteId}`)).body.items;
    expect(states.filter((s: { status: string }) => s.status !== 'free')).toEqual([]);
    expect((await t.db('applications').where({ id: app }).first()).status).toBe('waiting');
    const late = await (await browserLikeAgent(t.app)).post('/api/offers/accept', { token });
    expect(late.status).toBe(410);
    const history = (await agent.get(`/api/plots/${plots[0].id}`)).body.history;
    // The sweep did it, not the coordinator who is signed in: the product is credited.
    expect(history[0]).toMatchObject({ kind: 'offer_lapsed', summary: 'Offer to Slow Reader lapsed at its deadline; the plot is free', byName: 'Tillwell' });
  });

  it('refuses an offer accepted after its deadline even before the sweep runs', async () => {
    const { club: c, agent, plots } = await club();
    const app = await apply(c.id, 'Just Late', 'late@example.org', 5);
    const season = (await openSeason(agent, c.id, 2027)).season;
    const since = Date.now();
    await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[1].id, applicationId: app }).expect(201);
    const token = tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'late@example.org', after: since }), '/respond/offer'));
    await t.db('offers').update({ deadline: new Date(Date.now() - 1000) });
    const res = await (await browserLikeAgent(t.app)).post('/api/offers/accept', { token });
    expect(res.status).toBe(410);
    expect(res.body.error.message).toBe('This offer has expired; the plot has gone to the next person.');
    expect(await t.db('allocations').count()).toEqual([{ count: 0 }]);
  });

  it('runs the deadline sweep from the job queue, so a deadline passed while the server was down is still kept', async () => {
    const { club: c, agent, plots } = await club();
    const app = await apply(c.id, 'Away Person', 'away@example.org', 5);
    const season = (await openSeason(agent, c.id, 2027)).season;
    await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: app }).expect(201);
    await t.db('offers').update({ deadline: new Date(Date.now() - 60_000) });
    const jobs = await startJobs(t.config.databaseUrl, t.db, t.mailer, { info: () => {}, error: () => {} });
    try {
      const until = Date.now() + 20_000;
      let status = 'pending';
      while (status === 'pending' && Date.now() < until) {
        await new Promise((r) => setTimeout(r, 200));
        status = (await t.db('offers').first('status')).status;
      }
      expect(status).toBe('lapsed');
    } finally {
      await jobs.stop();
    }
  });
});

describe('withdrawing an offer', () => {
  it('takes back an open offer: the plot is free, the person keeps their place, the e-mailed link no longer works', async () => {
    const { club: c, agent, plots, siteId } = await club();
    const first = await apply(c.id, 'Fern Early', 'fern@example.org', 300);
    const second = await apply(c.id, 'Gus Later', 'gus@example.org', 10);
    const season = (await openSeason(agent, c.id, 2027)).season;
    const since = Date.now();
    const offer = (await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: first }).expect(201)).body;
    const token = tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'fern@example.org', after: since }), '/respond/offer'));
    const before = await t.db('applications').where({ id: first }).first('queue_at');

    // Only the club's coordinators may withdraw: a plot holder is refused, another club sees nothing.
    const holder = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'] });
    const h = await browserLikeAgent(t.app);
    await h.signIn(holder.email, holder.password!);
    const refused = await h.post(`/api/offers/${offer.id}/withdraw`);
    expect(refused.status).toBe(403);
    expect(refused.body.error).toEqual({ code: 'forbidden', message: 'Your role in this club does not allow that.' });
    const stranger = await buildMember(t.db, { roles: ['coordinator'] });
    const s = await browserLikeAgent(t.app);
    await s.signIn(stranger.email, stranger.password!);
    const hidden = await s.post(`/api/offers/${offer.id}/withdraw`);
    expect(hidden.status).toBe(404);
    expect(hidden.body.error).toEqual({ code: 'not_found', message: 'The offer was not found.' });
    expect((await t.db('offers').where({ id: offer.id }).first()).status).toBe('pending');

    await agent.post(`/api/offers/${offer.id}/withdraw`).expect(204);

    expect(await t.db('offers').where({ id: offer.id }).first('status')).toEqual({ status: 'withdrawn' });
    const row = await t.db('applications').where({ id: first }).first('status', 'queue_at');
    expect(row.status).toBe('waiting');
    // Withdrawing is the club's doing, so the person keeps their place (unlike declining).
    expect(row.queue_at.getTime()).toBe(before.queue_at.getTime());
    const waitlist = (await agent.get(`/api/clubs/${c.id}/waitlist`).expect(200)).body.items;
    expect(waitlist.map((w: { id: number }) => w.id)).toEqual([first, second]);

    const states = (await agent.get(`/api/seasons/${season.id}/plot-states?siteId=${siteId}`)).body.items;
    expect(states.find((p: { plotId: number }) => p.plotId === plots[0].id)).toMatchObject({ status: 'free' });
    const history = (await agent.get(`/api/plots/${plots[0].id}`)).body.history;
    expect(history[0]).toMatchObject({ kind: 'offer_withdrawn', summary: 'Offer to Fern Early withdrawn' });

    // The link in the e-mail is dead: the page says so and accepting is refused.
    const anon = await browserLikeAgent(t.app);
    expect((await anon.get(`/api/offers/preview?token=${encodeURIComponent(token)}`)).body).toMatchObject({ kind: 'offer', status: 'withdrawn' });
    const late = await anon.post('/api/offers/accept', { token });
    expect(late.status).toBe(410);
    expect(late.body.error.message).toBe('This offer has been closed by the club.');
    expect(await t.db('allocations').count()).toEqual([{ count: 0 }]);

    // A second withdrawal is a conflict; the plot can be offered to someone else at once.
    const again = await agent.post(`/api/offers/${offer.id}/withdraw`);
    expect(again.status).toBe(409);
    expect(again.body.error).toEqual({ code: 'conflict', message: 'This offer has already been withdrawn.' });
    await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: second }).expect(201);
  });
});

describe('guarantees and guards', () => {
  it('lets the database hold only one active holder per plot per season', async () => {
    const { club: c, plots } = await club();
    const [s] = await t.db('seasons').insert({ club_id: c.id, year: 2027 }).returning('id');
    const p1 = await buildMember(t.db, { clubId: c.id });
    const p2 = await buildMember(t.db, { clubId: c.id });
    await t.db('allocations').insert({ season_id: s.id, plot_id: plots[0].id, user_id: p1.id, source: 'manual' });
    await expect(t.db('allocations').insert({ season_id: s.id, plot_id: plots[0].id, user_id: p2.id, source: 'manual' })).rejects.toMatchObject({
      code: '23505',
      constraint: 'allocations_one_holder',
    });
  });

  it('refuses plot holders (403) and other clubs (404) on the coordinator’s season routes', async () => {
    const { club: c, agent, plots } = await club();
    const app = await apply(c.id, 'Some One', 'some@example.org', 5);
    const season = (await openSeason(agent, c.id, 2027)).season;
    const holder = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'] });
    const h = await browserLikeAgent(t.app);
    await h.signIn(holder.email, holder.password!);
    expect((await h.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: app })).status).toBe(403);
    expect((await h.post(`/api/clubs/${c.id}/seasons`, { year: 2028, renewalDeadline: new Date(Date.now() + DAY).toISOString() })).status).toBe(403);
    const stranger = await buildMember(t.db, { roles: ['coordinator'] });
    const s = await browserLikeAgent(t.app);
    await s.signIn(stranger.email, stranger.password!);
    expect((await s.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: app })).status).toBe(404);
    expect((await s.get(`/api/seasons/${season.id}`)).status).toBe(404);
    const [shared] = await t.db('plots').insert({ site_id: (await t.db('plots').where({ id: plots[0].id }).first()).site_id, label: 'Herbs', x_m: 0, y_m: 10, width_m: 6, length_m: 2, kind: 'shared_bed' }).returning('id');
    const sharedOffer = await agent.post(`/api/seasons/${season.id}/offers`, { plotId: shared.id, applicationId: app });
    expect(sharedOffer.status).toBe(400);
    expect(sharedOffer.body.error.fields).toEqual({ plotId: 'Shared beds are not offered' });
    const bad = await agent.post(`/api/seasons/${season.id}/offers`, { plotId: 'A-1', applicationId: app });
    expect(bad.status).toBe(400);
    // zod's own message for a number given as text (the schema sets none).
    expect(bad.body.error.fields).toEqual({ plotId: 'Must be a whole number from 1 to 2147483647' });
    expect(await t.db('offers').count()).toEqual([{ count: 0 }]);
  });
});
