import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { createMailer } from '../../server/mail/mailer';
import { acceptOffer, createOffer } from '../../server/services/offers';
import { requestPasswordReset } from '../../server/services/password-resets';
import { openSeason } from '../../server/services/seasons';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail, type Message } from '../helpers/inbox';

const t = setupTestApp();
const mailer = createMailer(t.config.smtpUrl, t.config.mailFrom);
afterAll(async () => {
  mailer.close();
  await t.close();
});
beforeEach(() => truncateAll(t.db));

// New York is on EST (UTC−5) in January and February (IANA tz database), so no date here can
// honestly read "GMT", and the club's zone is not the machine's.
const ZONE = 'America/New_York';
const NOW = new Date('2027-01-20T15:00:00Z');

async function club() {
  const row = await buildClub(t.db, { name: 'Quince Row Growers' });
  await t.db('clubs').where({ id: row.id }).update({ time_zone: ZONE, contact_email: 'hello@quince.example.org' });
  const coord = await buildMember(t.db, { clubId: row.id, roles: ['coordinator'], user: { name: 'Maren Okafor' } });
  const [site] = await t.db('sites').insert({ club_id: row.id, name: 'Field', latitude: 40.7, longitude: -74, time_zone: ZONE }).returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const c = await browserLikeAgent(t.app);
  expect((await c.signIn(coord.email, coord.password!)).status).toBe(200);
  return { club: row, coord, plotId: plot.id as number, c };
}

const MONTH = '(?:Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)';
// The one date format and the one date-time format of shared/dates (formatDate, formatDateTime).
const DATE = new RegExp(`\\b\\d{1,2} ${MONTH} \\d{4}\\b`, 'g');
const DATE_TIME = new RegExp(`\\b\\d{1,2} ${MONTH} \\d{4}, \\d{2}:\\d{2} E[SD]T\\b`, 'g');

/** The dates a message shows, after checking none is in another format; links are left out (tokens are random). */
function datesIn(m: Message): string[] {
  const words = `${m.subject}\n${m.text}`.replace(/https?:\/\/\S+/g, '');
  expect(words, m.subject).not.toMatch(/\d{4}-\d{2}-\d{2}/); // ISO dates and instants
  expect(words, m.subject).not.toMatch(/\bGMT\b|\bUTC\b/);
  expect(words, m.subject).not.toMatch(/\b(?:Mon|Tue|Wed|Thu|Fri|Sat|Sun)\b/); // toUTCString and toDateString
  expect(words, m.subject).not.toMatch(/\d{1,2}\/\d{1,2}\/\d{2,4}/); // toLocaleDateString
  // Every time of day shown is part of a full date-time in the club's zone.
  expect(words.match(/\d{2}:\d{2}/g)?.length ?? 0, m.subject).toBe(words.match(DATE_TIME)?.length ?? 0);
  return words.match(DATE) ?? [];
}

describe('dates in e-mails', () => {
  it('every e-mail shows dates as "20 Jan 2027" and times with the club’s zone, never ISO or GMT', async () => {
    const { club: row, coord, plotId, c } = await club();
    const since = Date.now();
    // Invitation (date-time of expiry).
    expect((await c.post(`/api/clubs/${row.id}/invites`, { email: 'ivy@example.org', name: 'Ivy Ash', roles: ['volunteer'] })).status).toBe(201);
    const invite = await waitForMail(mailUrl(), { to: 'ivy@example.org', after: since });
    expect(datesIn(invite).length).toBeGreaterThan(0);
    // Application receipt (no dates), then an offer to that application, then its welcome with the fee's due date.
    const visitor = await browserLikeAgent(t.app);
    expect((await visitor.post(`/api/apply/${row.slug}`, { name: 'Yarrow Bell', email: 'yarrow@example.org' })).status).toBe(201);
    datesIn(await waitForMail(mailUrl(), { to: 'yarrow@example.org', subject: 'waiting list', after: since }));
    const app = await t.db('applications').where({ email: 'yarrow@example.org' }).first('id');
    const [season] = await t.db('seasons').insert({ club_id: row.id, year: 2027 }).returning('id');
    await createOffer(t.db, mailer, { seasonId: season.id, plotId, applicationId: app.id, userId: coord.id, publicUrl: 'http://x', now: NOW });
    const offer = await waitForMail(mailUrl(), { to: 'yarrow@example.org', subject: 'A plot for you', after: since });
    // computed: offer_days defaults to 7 (migration); 20 Jan + 7 = 27 Jan, ending 23:59 EST.
    expect(datesIn(offer)).toEqual(['27 Jan 2027', '27 Jan 2027']);
    expect(offer.text).toContain('27 Jan 2027, 23:59 EST');
    const token = new URL(extractLink(offer, '/respond/offer')).searchParams.get('token')!;
    await acceptOffer(t.db, mailer, { token, publicUrl: 'http://x', now: NOW });
    const welcome = await waitForMail(mailUrl(), { to: 'yarrow@example.org', subject: 'is yours', after: since });
    // computed: the fee is due 30 days from 20 Jan (club-dates.test.ts): 19 Feb 2027.
    expect(datesIn(welcome)).toContain('19 Feb 2027');
    // Renewal for the next season, to the holder of 2027.
    const holder = await t.db('users').where({ email: 'yarrow@example.org' }).first('id');
    await t.db('fees').where({ user_id: holder.id }).update({ plot_fee_minor: 0, deposit_minor: 0 });
    await openSeason(t.db, mailer, { clubId: row.id, userId: coord.id, year: 2028, publicUrl: 'http://x', now: new Date('2028-01-10T15:00:00Z') });
    const renewal = await waitForMail(mailUrl(), { to: 'yarrow@example.org', subject: 'Keep plot', after: since });
    expect(datesIn(renewal).length).toBeGreaterThan(0);
    // Password reset, shown in the person's club's zone.
    await requestPasswordReset(t.db, mailer, { email: 'yarrow@example.org', publicUrl: 'http://x', now: NOW });
    const reset = await waitForMail(mailUrl(), { to: 'yarrow@example.org', subject: 'Reset', after: since });
    // computed: a reset link lasts an hour: 15:00Z + 1 h = 11:00 EST on 20 Jan.
    expect(reset.text).toContain('20 Jan 2027, 11:00 EST');
    datesIn(reset);
  });
});

describe('club messages are signed and can be answered', () => {
  it('a club message comes under the coordinator’s name, is signed by them and answers to the club’s contact address', async () => {
    const { club: row, c } = await club();
    await buildMember(t.db, { clubId: row.id, roles: ['plot_holder'], user: { email: 'sorrel@example.org' } });
    const since = Date.now();
    const sent = await c.post(`/api/clubs/${row.id}/mailings`, { subject: 'Open day', body: 'Bring a cake.', audience: { kind: 'all_members' } });
    expect(sent.status, JSON.stringify(sent.body)).toBe(201);
    const mail = await waitForMail(mailUrl(), { to: 'sorrel@example.org', subject: 'Open day', after: since });
    expect(mail.fromName).toBe('Maren Okafor (Quince Row Growers)');
    expect(mail.headers['reply-to']).toBe('hello@quince.example.org');
    expect(mail.text).toContain('Bring a cake.\n\nMaren Okafor, coordinator of Quince Row Growers');
    expect(mail.text).not.toContain('From the coordinator of');
  });

  it('other club e-mails come under the club’s name and answer to its contact address; without one there is no Reply-To', async () => {
    const { club: row, c } = await club();
    let since = Date.now();
    await c.post(`/api/clubs/${row.id}/invites`, { email: 'ivy@example.org', name: 'Ivy Ash', roles: ['volunteer'] }).expect(201);
    const invite = await waitForMail(mailUrl(), { to: 'ivy@example.org', after: since });
    expect(invite.fromName).toBe('Quince Row Growers');
    expect(invite.headers['reply-to']).toBe('hello@quince.example.org');

    await c.patch(`/api/clubs/${row.id}`, { contactEmail: null }).expect(200);
    since = Date.now();
    await c.post(`/api/clubs/${row.id}/invites`, { email: 'rowan@example.org', name: 'Rowan Ash', roles: ['volunteer'] }).expect(201);
    const second = await waitForMail(mailUrl(), { to: 'rowan@example.org', after: since });
    expect(second.headers['reply-to']).toBeUndefined();
  });

  it('says how many people a message would reach before it is sent, coordinators only', async () => {
    const { club: row, c } = await club();
    await buildMember(t.db, { clubId: row.id, roles: ['plot_holder'] });
    const quiet = await buildMember(t.db, { clubId: row.id, roles: ['volunteer'] });
    await t.db('mail_preferences').insert({ user_id: quiet.id, club_id: row.id, topic: 'club_news', is_subscribed: false });
    // computed: coordinator + holder + volunteer = 3 members, the volunteer turned club news off.
    const all = await c.get(`/api/clubs/${row.id}/mailings/audience?kind=all_members`);
    expect(all.status, JSON.stringify(all.body)).toBe(200);
    expect(all.body).toEqual({ recipients: 2, skipped: 1 });
    // Nobody holds a plot in 2027.
    expect((await c.get(`/api/clubs/${row.id}/mailings/audience?kind=season&year=2027`)).body).toEqual({ recipients: 0, skipped: 0 });
    const bad = await c.get(`/api/clubs/${row.id}/mailings/audience?kind=season&year=soon`);
    expect(bad.status).toBe(400);
    expect((await c.get(`/api/clubs/${row.id}/mailings/audience?kind=site&year=2027&siteId=999999`)).status).toBe(400);
    const holder = await browserLikeAgent(t.app);
    const h = await buildMember(t.db, { clubId: row.id, roles: ['plot_holder'] });
    await holder.signIn(h.email, h.password!);
    expect((await holder.get(`/api/clubs/${row.id}/mailings/audience?kind=all_members`)).status).toBe(403);
  });
});

describe('the offer e-mail', () => {
  it('has two links, one to accept and one to decline, each opening the offer’s page with that answer', async () => {
    const { club: row, coord, plotId } = await club();
    const [season] = await t.db('seasons').insert({ club_id: row.id, year: 2027 }).returning('id');
    const [app] = await t.db('applications').insert({ club_id: row.id, name: 'Yarrow', email: 'yarrow@example.org' }).returning('id');
    const since = Date.now();
    await createOffer(t.db, mailer, { seasonId: season.id, plotId, applicationId: app.id, userId: coord.id, publicUrl: 'http://x', now: NOW });
    const mail = await waitForMail(mailUrl(), { to: 'yarrow@example.org', after: since });
    const links = [...new Set(mail.text.match(/http:\/\/x\/respond\/offer\S+/g) ?? [])];
    expect(links).toHaveLength(2);
    const [accept, decline] = links.map((l) => new URL(l));
    expect(accept.searchParams.get('answer')).toBe('accept');
    expect(decline.searchParams.get('answer')).toBe('decline');
    expect(accept.searchParams.get('token')).toBe(decline.searchParams.get('token'));
    expect(mail.text).toContain(`Accept the plot: ${accept.href}`);
    expect(mail.text).toContain(`Decline the plot: ${decline.href}`);
    // The same two links in the HTML part.
    expect(mail.html).toContain(`href="${accept.href.replace(/&/g, '&amp;')}"`);
    expect(mail.html).toContain(`href="${decline.href.replace(/&/g, '&amp;')}"`);
  });
});

describe('checking a password link without using it', () => {
  it('answers whether a link works and whether it sets a first password, and leaves it usable', async () => {
    const { coord } = await club();
    const since = Date.now();
    await requestPasswordReset(t.db, mailer, { email: coord.email, publicUrl: 'http://x' });
    const token = new URL(extractLink(await waitForMail(mailUrl(), { to: coord.email, after: since }), '/reset-password')).searchParams.get('token')!;
    const v = await browserLikeAgent(t.app);
    expect((await v.get(`/api/password-resets/check?token=${token}`)).body).toEqual({ firstPassword: false });
    expect((await v.get(`/api/password-resets/check?token=${token}`)).status).toBe(200);
    expect((await v.get(`/api/password-resets/check?token=${'x'.repeat(40)}`)).status).toBe(404);
    expect((await v.get('/api/password-resets/check?token=short')).status).toBe(400);
    expect((await v.post('/api/password-resets/complete', { token, password: 'a new long password' })).status).toBe(204);
    expect((await v.get(`/api/password-resets/check?token=${token}`)).status).toBe(410);

    await t.db('users').where({ id: coord.id }).update({ password_hash: null });
    const since2 = Date.now();
    await requestPasswordReset(t.db, mailer, { email: coord.email, publicUrl: 'http://x' });
    const first = new URL(extractLink(await waitForMail(mailUrl(), { to: coord.email, after: since2 }), '/reset-password')).searchParams.get('token')!;
    expect((await v.get(`/api/password-resets/check?token=${first}`)).body).toEqual({ firstPassword: true });
  });
});
