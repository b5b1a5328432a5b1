import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;
type Agent = Awaited<ReturnType<typeof browserLikeAgent>>;

/** A club with a coordinator signed in and one London site with four 3 × 6 m plots. */
async function club(opts: { policy?: 'end_of_list' | 'remove'; multiple?: boolean } = {}) {
  const c = await buildClub(t.db, { name: 'Sloe Lane Growers' });
  await t.db('clubs').where({ id: c.id }).update({ declined_offer_policy: opts.policy ?? 'end_of_list', allow_multiple_offers: opts.multiple ?? false, time_zone: 'Europe/London' });
  const coord = await buildMember(t.db, { clubId: c.id, roles: ['coordinator'] });
  const agent = await browserLikeAgent(t.app);
  await agent.signIn(coord.email, coord.password!);
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Long field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const plots = await t.db('plots')
    .insert(['A-1', 'A-2', 'A-3', 'A-4'].map((label, i) => ({ site_id: site.id, label, x_m: i * 3.9, y_m: 0, width_m: 3, length_m: 6 })))
    .returning(['id', 'label', 'version']);
  return { club: c, agent, siteId: site.id as number, plots: plots as Array<{ id: number; label: string; version: number }> };
}

async function apply(clubId: number, name: string, email: string, appliedDaysAgo: number) {
  const at = new Date(Date.now() - appliedDaysAgo * DAY);
  const [row] = await t.db('applications').insert({ club_id: clubId, name, email, applied_at: at, queue_at: at }).returning('id');
  return row.id as number;
}

async function openSeason(agent: Agent, clubId: number, year: number) {
  const res = await agent.post(`/api/clubs/${clubId}/seasons`, { year, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

/** Offers a plot through the API and returns the token from the e-mail. */
async function offer(agent: Agent, seasonId: number, plot: { id: number; label: string }, applicationId: number, email: string) {
  const since = Date.now();
  const res = await agent.post(`/api/seasons/${seasonId}/offers`, { plotId: plot.id, applicationId });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const mail = await waitForMail(mailUrl(), { to: email, subject: `: ${plot.label} (`, after: since });
  return { id: res.body.id as number, token: new URL(extractLink(mail, '/respond/offer')).searchParams.get('token')! };
}

async function holdLastSeason(clubId: number, plotId: number, name: string, email: string, paid = true) {
  const holder = await buildMember(t.db, { clubId, roles: ['plot_holder'], user: { name, email } });
  const [last] = await t.db('seasons').insert({ club_id: clubId, year: 2026 }).onConflict(['club_id', 'year']).merge().returning('id');
  const [a] = await t.db('allocations').insert({ season_id: last.id, plot_id: plotId, user_id: holder.id, source: 'manual' }).returning('id');
  const [f] = await t.db('fees')
    .insert({ club_id: clubId, season_id: last.id, allocation_id: a.id, user_id: holder.id, plot_id: plotId, description: 'last', plot_fee_minor: 1000, deposit_minor: 0, currency: 'GBP', due_on: '2026-04-01' })
    .returning('id');
  if (paid) await t.db('payments').insert({ fee_id: f.id, amount_minor: 1000, method: 'cash', paid_on: '2026-03-01' });
  return holder;
}

describe('removing a plot that is in use', () => {
  it('refuses to delete a held plot, naming the holder to the coordinator only', async () => {
    const { club: c, agent, plots } = await club();
    await holdLastSeason(c.id, plots[0].id, 'Hazel Holder', 'hazel@example.org');
    const res = await agent.delete(`/api/plots/${plots[0].id}?version=${plots[0].version}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Plot A-1 is held by Hazel Holder for 2026. It can be removed once nobody holds it.');
    const other = await buildMember(t.db, { clubId: c.id, roles: ['plot_holder'] });
    const h = await browserLikeAgent(t.app);
    await h.signIn(other.email, other.password!);
    const refused = await h.delete(`/api/plots/${plots[0].id}?version=${plots[0].version}`);
    expect(refused.status).toBe(403);
    expect(JSON.stringify(refused.body)).not.toContain('Hazel');
    expect((await t.db('plots').where({ id: plots[0].id }).first('deleted_at')).deleted_at).toBeNull();
    // A free plot still goes.
    await agent.delete(`/api/plots/${plots[1].id}?version=${plots[1].version}`).expect(204);
  });

  it('refuses to delete an offered plot and a plot waiting for a renewal answer', async () => {
    const { club: c, agent, plots } = await club();
    await holdLastSeason(c.id, plots[0].id, 'Hazel Holder', 'hazel@example.org');
    const season = (await openSeason(agent, c.id, 2027)).season;
    const appId = await apply(c.id, 'Ivy Waiting', 'ivy@example.org', 30);
    await offer(agent, season.id, plots[2], appId, 'ivy@example.org');

    const offered = await agent.delete(`/api/plots/${plots[2].id}?version=${plots[2].version}`);
    expect(offered.status).toBe(409);
    expect(offered.body.error.message).toMatch(/^Plot A-3 is offered to Ivy Waiting, who has not answered yet/);
    const renewing = await agent.delete(`/api/plots/${plots[0].id}?version=${plots[0].version}`);
    expect(renewing.status).toBe(409);
    expect(renewing.body.error.message).toMatch(/^Plot A-1 waits for Hazel Holder to keep it or give it up/);
  });

  it('refuses to accept an offer or keep a plot that was removed, and keeps the person’s place', async () => {
    const { club: c, agent, plots } = await club();
    await holdLastSeason(c.id, plots[0].id, 'Hazel Holder', 'hazel@example.org');
    const since = Date.now();
    const season = (await openSeason(agent, c.id, 2027)).season;
    const renewalMail = await waitForMail(mailUrl(), { to: 'hazel@example.org', after: since });
    const renewalToken = new URL(extractLink(renewalMail, '/respond/renewal')).searchParams.get('token')!;
    const appId = await apply(c.id, 'Ivy Waiting', 'ivy@example.org', 30);
    const { token } = await offer(agent, season.id, plots[2], appId, 'ivy@example.org');
    // Removed behind the service's back (an older record, or a change made before this check existed).
    await t.db('plots').whereIn('id', [plots[0].id, plots[2].id]).update({ deleted_at: new Date() });

    const anon = await browserLikeAgent(t.app);
    const accepted = await anon.post('/api/offers/accept', { token });
    expect(accepted.status).toBe(410);
    expect(accepted.body.error.message).toMatch(/taken this plot off its map.*Your place on the waiting list is kept/);
    expect(await t.db('allocations').where({ season_id: season.id }).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect((await t.db('applications').where({ id: appId }).first('status')).status).toBe('waiting');
    expect((await t.db('offers').where({ application_id: appId }).first('status')).status).toBe('withdrawn');

    const kept = await anon.post('/api/renewals/keep', { token: renewalToken });
    expect(kept.status).toBe(410);
    expect(kept.body.error.message).toMatch(/taken this plot off its map/);
    expect(await t.db('fees').where({ season_id: season.id }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('lists a removed plot’s holder among those left out when the next season opens', async () => {
    const { club: c, agent, plots } = await club();
    await holdLastSeason(c.id, plots[0].id, 'Hazel Holder', 'hazel@example.org');
    await holdLastSeason(c.id, plots[1].id, 'Moss Holder', 'moss@example.org');
    await t.db('plots').where({ id: plots[0].id }).update({ deleted_at: new Date() });
    const opened = await openSeason(agent, c.id, 2027);
    expect(opened.renewalsSent).toBe(1);
    expect(opened.notRenewed).toEqual([{ name: 'Hazel Holder', plotLabel: 'A-1', reason: 'The plot was removed from the map' }]);
  });
});

describe('several offers at once', () => {
  it('accepting one closes the person’s other open offers; the other cannot be accepted; they stay off the waitlist', async () => {
    const { club: c, agent, plots, siteId } = await club({ multiple: true });
    const season = (await openSeason(agent, c.id, 2027)).season;
    const appId = await apply(c.id, 'Ivy Twice', 'ivy@example.org', 30);
    const first = await offer(agent, season.id, plots[0], appId, 'ivy@example.org');
    const second = await offer(agent, season.id, plots[1], appId, 'ivy@example.org');

    const anon = await browserLikeAgent(t.app);
    expect((await anon.post('/api/offers/accept', { token: first.token })).status).toBe(200);
    expect((await t.db('offers').where({ id: second.id }).first('status')).status).toBe('withdrawn');
    const states = (await agent.get(`/api/seasons/${season.id}/plot-states?siteId=${siteId}`)).body.items;
    expect(states.find((s: { plotId: number }) => s.plotId === plots[1].id)).toMatchObject({ status: 'free', offer: null });

    const again = await anon.post('/api/offers/accept', { token: second.token });
    expect(again.status).toBe(410);
    expect((await anon.post('/api/offers/decline', { token: second.token })).status).toBe(410);
    expect(await t.db('allocations').where({ season_id: season.id }).count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(await t.db('fees').where({ season_id: season.id }).count({ n: '*' })).toEqual([{ n: 1 }]);
    expect((await t.db('applications').where({ id: appId }).first('status')).status).toBe('allocated');
    // The closed plot can be offered to the next person straight away.
    const next = await apply(c.id, 'Rue Next', 'rue@example.org', 10);
    await offer(agent, season.id, plots[1], next, 'rue@example.org');
  });

  it('refuses to accept an offer once the person is no longer waiting', async () => {
    const { club: c, agent, plots } = await club({ multiple: true });
    const season = (await openSeason(agent, c.id, 2027)).season;
    const appId = await apply(c.id, 'Ivy Gone', 'ivy@example.org', 30);
    const { token } = await offer(agent, season.id, plots[0], appId, 'ivy@example.org');
    await t.db('applications').where({ id: appId }).update({ status: 'withdrawn' });
    const res = await (await browserLikeAgent(t.app)).post('/api/offers/accept', { token });
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/not on the waiting list any more/);
    expect(await t.db('allocations').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('declining one of two open offers leaves the person offered, not back at the end of the list', async () => {
    const { club: c, agent, plots } = await club({ multiple: true });
    const season = (await openSeason(agent, c.id, 2027)).season;
    const appId = await apply(c.id, 'Ivy Twice', 'ivy@example.org', 30);
    const before = (await t.db('applications').where({ id: appId }).first('queue_at')).queue_at;
    const first = await offer(agent, season.id, plots[0], appId, 'ivy@example.org');
    await offer(agent, season.id, plots[1], appId, 'ivy@example.org');
    expect((await (await browserLikeAgent(t.app)).post('/api/offers/decline', { token: first.token })).status).toBe(200);
    expect(await t.db('applications').where({ id: appId }).first('status', 'queue_at')).toEqual({ status: 'offered', queue_at: before });
  });
});

describe('deadlines decide, not the sweep', () => {
  it('an offer past its deadline reads as lapsed and does not block a new offer of the plot', async () => {
    const { club: c, agent, plots, siteId } = await club({ policy: 'end_of_list' });
    const season = (await openSeason(agent, c.id, 2027)).season;
    const late = await apply(c.id, 'Late Answer', 'late@example.org', 60);
    const next = await apply(c.id, 'Next Person', 'next@example.org', 30);
    await offer(agent, season.id, plots[0], late, 'late@example.org');
    // The deadline passed a moment ago and the sweep has not run.
    await t.db('offers').where({ application_id: late }).update({ deadline: new Date(Date.now() - 1000) });

    const states = (await agent.get(`/api/seasons/${season.id}/plot-states?siteId=${siteId}`)).body.items;
    expect(states.find((s: { plotId: number }) => s.plotId === plots[0].id)).toMatchObject({ status: 'free', offer: null });
    expect((await agent.get(`/api/seasons/${season.id}`)).body.counts.offersPending).toBe(0);

    await offer(agent, season.id, plots[0], next, 'next@example.org');
    expect((await t.db('offers').where({ application_id: late }).first('status')).status).toBe('lapsed');
    // The club's rule: to the end of the list.
    const moved = await t.db('applications').where({ id: late }).first('status', 'queue_at');
    expect(moved.status).toBe('waiting');
    expect(moved.queue_at.getTime()).toBeGreaterThan(Date.now() - 60_000);
    expect(await t.db('waitlist_moves').where({ application_id: late }).pluck('kind')).toEqual(['lapsed_moved']);
  });

  it('a renewal past its deadline counts as lapsed and frees the plot for an offer', async () => {
    const { club: c, agent, plots, siteId } = await club({ policy: 'remove' });
    await holdLastSeason(c.id, plots[0].id, 'Hazel Holder', 'hazel@example.org');
    const season = (await openSeason(agent, c.id, 2027)).season;
    await t.db('renewals').update({ deadline: new Date(Date.now() - 1000) });
    expect((await agent.get(`/api/seasons/${season.id}`)).body.counts).toMatchObject({ renewalsPending: 0, renewalsLapsed: 1 });
    const states = (await agent.get(`/api/seasons/${season.id}/plot-states?siteId=${siteId}`)).body.items;
    expect(states.find((s: { plotId: number }) => s.plotId === plots[0].id)).toMatchObject({ status: 'free', renewal: null });
    const appId = await apply(c.id, 'Ivy Waiting', 'ivy@example.org', 30);
    await offer(agent, season.id, plots[0], appId, 'ivy@example.org');
    expect((await t.db('renewals').first('status')).status).toBe('lapsed');
  });

  it('a person whose only offer is overdue follows the club rule before a new offer: moved back, or removed', async () => {
    const { club: c, agent, plots } = await club({ policy: 'end_of_list' });
    const season = (await openSeason(agent, c.id, 2027)).season;
    const appId = await apply(c.id, 'Late Answer', 'late@example.org', 60);
    await offer(agent, season.id, plots[0], appId, 'late@example.org');
    await t.db('offers').update({ deadline: new Date(Date.now() - 1000) });
    await offer(agent, season.id, plots[1], appId, 'late@example.org');
    expect(await t.db('offers').orderBy('id').pluck('status')).toEqual(['lapsed', 'pending']);

    await t.db('clubs').where({ id: c.id }).update({ declined_offer_policy: 'remove' });
    await t.db('offers').where({ status: 'pending' }).update({ deadline: new Date(Date.now() - 1000) });
    const res = await agent.post(`/api/seasons/${season.id}/offers`, { plotId: plots[2].id, applicationId: appId });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Late Answer is no longer waiting (removed).');
  });
  it('an overdue offer cannot be withdrawn as if it were still open', async () => {
    const { club: c, agent, plots } = await club();
    const season = (await openSeason(agent, c.id, 2027)).season;
    const appId = await apply(c.id, 'Late Answer', 'late@example.org', 60);
    const { id } = await offer(agent, season.id, plots[0], appId, 'late@example.org');
    await t.db('offers').update({ deadline: new Date(Date.now() - 1000) });
    const res = await agent.post(`/api/offers/${id}/withdraw`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('This offer has already lapsed at its deadline.');
    expect((await t.db('offers').where({ id }).first('status')).status).toBe('pending');
  });
});
