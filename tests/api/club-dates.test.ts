import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, endOfLocalDay, localToday } from '@shared/dates';
import { createMailer } from '../../server/mail/mailer';
import { acceptOffer, createOffer } from '../../server/services/offers';
import { openSeason } from '../../server/services/seasons';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
const mailer = createMailer(t.config.smtpUrl, t.config.mailFrom);
afterAll(async () => {
  mailer.close();
  await t.close();
});
beforeEach(() => truncateAll(t.db));

// Zone rules: IANA tz database. UK summer time starts at 01:00 UTC on the last Sunday of March
// (28 March in 2027) — from memory. New Zealand daylight time (UTC+13) runs until the first
// Sunday of April — from memory.

async function clubIn(timeZone: string, settings: { renewal_days?: number; offer_days?: number } = {}) {
  const club = await buildClub(t.db, { name: 'Quince Row Growers' });
  await t.db('clubs').where({ id: club.id }).update({ time_zone: timeZone, ...settings });
  const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
  const [site] = await t.db('sites').insert({ club_id: club.id, name: 'Field', latitude: 51, longitude: 0, time_zone: timeZone }).returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  return { club, coord, plotId: plot.id as number };
}

describe('dates in the club’s time zone', () => {
  it('defaults the renewal deadline to the club’s renewal days, ending 23:59:59 local time across the clock change', async () => {
    const { club, coord } = await clubIn('Europe/London', { renewal_days: 21 });
    const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { email: 'sorrel@example.org' } });
    const [last] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
    await t.db('allocations').insert({ season_id: last.id, plot_id: (await t.db('plots').first('id')).id, user_id: holder.id, source: 'manual' });
    const since = Date.now();
    // 7 March 2027 (GMT) + 21 days = 28 March, already summer time: 23:59:59 BST = 22:59:59Z.
    const opened = await openSeason(t.db, mailer, { clubId: club.id, userId: coord.id, year: 2027, publicUrl: 'http://x', now: new Date('2027-03-07T12:00:00Z') });
    expect(opened.season.renewalDeadline).toBe('2027-03-28T22:59:59.000Z');
    const mail = await waitForMail(mailUrl(), { to: 'sorrel@example.org', after: since });
    expect(mail.subject).toContain('Please answer by 28 Mar 2027');
    expect(mail.text).toContain('If we have no answer by 28 Mar 2027, 23:59 GMT+1,');
  });

  it('opens a season through the API without a deadline, using the club’s renewal days', async () => {
    const { club, coord } = await clubIn('Europe/London', { renewal_days: 30 });
    const c = await browserLikeAgent(t.app);
    await c.signIn(coord.email, coord.password!);
    const before = new Date();
    const res = await c.post(`/api/clubs/${club.id}/seasons`, { year: 2030 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const expected = endOfLocalDay(addCalendarDays(localToday('Europe/London', before), 30), 'Europe/London');
    expect(res.body.season.renewalDeadline).toBe(expected.toISOString());
  });

  it('ends a default offer deadline at the end of the club’s day and shows it in the club’s zone', async () => {
    const { club, coord, plotId } = await clubIn('Europe/London', { offer_days: 7 });
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const [app] = await t.db('applications').insert({ club_id: club.id, name: 'Yarrow', email: 'yarrow@example.org' }).returning('id');
    const since = Date.now();
    // 20 March + 7 days = 27 March, still winter time: 23:59:59 GMT = 23:59:59Z.
    const offer = await createOffer(t.db, mailer, { seasonId: season.id, plotId, applicationId: app.id, userId: coord.id, publicUrl: 'http://x', now: new Date('2027-03-20T10:00:00Z') });
    expect(offer.deadline).toBe('2027-03-27T23:59:59.000Z');
    const mail = await waitForMail(mailUrl(), { to: 'yarrow@example.org', after: since });
    expect(mail.subject).toContain('(answer by 27 Mar 2027)');
    expect(mail.text).toContain('The offer stays open until 27 Mar 2027, 23:59 GMT;');
  });

  it('counts a fee’s 30 days from today where the club is, and says the due date in that calendar', async () => {
    const { club, coord, plotId } = await clubIn('Pacific/Auckland');
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const [app] = await t.db('applications').insert({ club_id: club.id, name: 'Kowhai', email: 'kowhai@example.org' }).returning('id');
    const since = Date.now();
    await createOffer(t.db, mailer, { seasonId: season.id, plotId, applicationId: app.id, userId: coord.id, publicUrl: 'http://x', now: new Date('2027-03-20T10:00:00Z') });
    const token = new URL(extractLink(await waitForMail(mailUrl(), { to: 'kowhai@example.org', after: since }), '/respond/offer')).searchParams.get('token')!;
    // 12:30Z on 20 March is 01:30 on 21 March in Auckland (NZDT, UTC+13); 21 March + 30 days = 20 April.
    await acceptOffer(t.db, mailer, { token, publicUrl: 'http://x', now: new Date('2027-03-20T12:30:00Z') });
    expect((await t.db('fees').first('due_on')).due_on).toBe('2027-04-20');
    const welcome = await waitForMail(mailUrl(), { to: 'kowhai@example.org', subject: 'is yours', after: since });
    expect(welcome.text).toContain('is due by 20 Apr 2027.');
  });

  it('gives the respond page the club’s zone', async () => {
    const { club, coord, plotId } = await clubIn('America/New_York');
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const [app] = await t.db('applications').insert({ club_id: club.id, name: 'Aster', email: 'aster@example.org' }).returning('id');
    const since = Date.now();
    await createOffer(t.db, mailer, { seasonId: season.id, plotId, applicationId: app.id, userId: coord.id, publicUrl: 'http://x', deadline: new Date(Date.now() + 86_400_000) });
    const token = new URL(extractLink(await waitForMail(mailUrl(), { to: 'aster@example.org', after: since }), '/respond/offer')).searchParams.get('token')!;
    const preview = await (await browserLikeAgent(t.app)).get(`/api/offers/preview?token=${encodeURIComponent(token)}`).expect(200);
    expect(preview.body.timeZone).toBe('America/New_York');
  });
  it('lets a coordinator set the club’s zone, and refuses one that does not exist', async () => {
    const { club, coord } = await clubIn('Europe/London');
    const c = await browserLikeAgent(t.app);
    await c.signIn(coord.email, coord.password!);
    const bad = await c.patch(`/api/clubs/${club.id}`, { timeZone: 'Europe/Atlantis' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ timeZone: 'Unknown time zone (use a name like Europe/London)' });
    const ok = await c.patch(`/api/clubs/${club.id}`, { timeZone: 'Europe/Dublin' });
    expect(ok.status).toBe(200);
    expect(ok.body.timeZone).toBe('Europe/Dublin');
    expect((await t.db('clubs').where({ id: club.id }).first('time_zone')).time_zone).toBe('Europe/Dublin');
  });
});
