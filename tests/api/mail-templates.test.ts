import request from 'supertest';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { optionalMailKinds } from '@shared/schemas/mail-templates';
import { findHrefs, findUrls } from '../../fake-mail/links';
import { mailTemplateNames } from '../../server/services/mail-templates';
import { sendShiftDigests, sendShiftReminders } from '../../server/services/shift-claims';
import { siteInstant } from '../../server/services/shifts';
import { buildClub } from '../factories';
import { signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { waitForMail } from '../helpers/inbox';
import { openedMail } from '../../server/services/outbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const ZONE = 'Europe/London';
const DAY = 86_400_000;
// RFC 8058 section 3.1: the one-click POST's body, sent as a form.
const ONE_CLICK = 'List-Unsubscribe=One-Click';

/** The address inside the angle brackets of a List-Unsubscribe header (RFC 2369 section 2). */
const oneClickUrl = (header: string) => /^<([^>]+)>$/.exec(header.trim())![1];

/** The one-click POST as a mail provider sends it: no cookie, no CSRF token, only the address. */
const oneClick = (url: string) => request(t.app).post(new URL(url).pathname).type('form').send(ONE_CLICK);

async function outboxHeaders(kind: string, to: string): Promise<Record<string, string>> {
  const rows = await t.db('mail_outbox').where({ kind, to_address: to }).orderBy('id', 'desc').select('*');
  expect(rows.length, `no ${kind} mail to ${to}`).toBeGreaterThan(0);
  // Stored sealed (server/mail/seal.ts): the stop link's token is not kept in the clear.
  expect(JSON.stringify(rows[0].headers)).not.toMatch(/mail-stops/);
  return openedMail(rows[0]).headers ?? {};
}

async function clubWithSite(name = 'Elm Row Growers') {
  const club = await buildClub(t.db, { name });
  await t.db('clubs').where({ id: club.id }).update({ time_zone: ZONE });
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'North field', latitude: 51.5, longitude: -0.1, time_zone: ZONE, width_m: 30, length_m: 20 })
    .returning('id');
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  return { club, siteId: site.id as number, coordinator };
}

async function makeShift(c: Agent, clubId: number, siteId: number, date: string, startTime = '18:00', endTime = '19:30') {
  const res = await c.post(`/api/clubs/${clubId}/shifts`, {
    siteId,
    title: 'Evening watering',
    kind: 'water',
    date,
    startTime,
    endTime,
    capacity: 3,
    estHours: 1.5,
    instructions: 'Fill the cans at the trough by the gate.',
    taskIds: [],
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: number; startsAt: string };
}

describe('every template', () => {
  it('renders an HTML and a text part from one component; the text has every link of the HTML; previews carry only fake links', async () => {
    const { club, coordinator } = await clubWithSite();
    const list = await coordinator.get(`/api/clubs/${club.id}/mail-templates`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((i: { name: string }) => i.name)).toEqual(mailTemplateNames);
    expect(list.body.total).toBe(mailTemplateNames.length);
    const optionalNames = list.body.items.filter((i: { optional: boolean }) => i.optional).map((i: { name: string }) => i.name).sort();
    // The decision in DEVELOPERS.md: digests, reminders, club news and calls for help are optional.
    expect(optionalNames).toEqual([...optionalMailKinds].sort());

    for (const { name, optional } of list.body.items as { name: string; optional: boolean }[]) {
      const res = await coordinator.get(`/api/clubs/${club.id}/mail-templates/${name}/preview`);
      expect(res.status, name).toBe(200);
      const { subject, html, text, headers } = res.body as { subject: string; html: string; text: string; headers: Record<string, string> };
      expect(subject.length, name).toBeGreaterThan(0);
      expect(html, name).toMatch(/^<!DOCTYPE html/);
      expect(html, name).toContain('Tillwell');
      // The sample data is the club's (a password link belongs to an account, not a club).
      if (name !== 'password_reset') expect(text, name).toContain('Elm Row Growers');
      expect(text, name).toMatch(/^Tillwell\n/);
      expect(text, name).toContain('You got this because');
      expect(text, name).not.toMatch(/<[a-z][^>]*>/i); // no markup in the text part
      const hrefs = findHrefs(html);
      const textUrls = findUrls(text);
      for (const href of hrefs) expect(textUrls, `${name}: ${href}`).toContain(href);
      // RFC 2606 section 2: .invalid names never resolve, so nothing in a preview is a live link.
      for (const url of [...hrefs, ...textUrls]) expect(new URL(url).hostname, `${name}: ${url}`).toBe('preview.invalid');
      if (optional) {
        expect(headers['List-Unsubscribe'], name).toMatch(/^<https:\/\/preview\.invalid\/api\/mail-stops\/[^>]+>$/);
        expect(headers['List-Unsubscribe-Post'], name).toBe(ONE_CLICK);
        expect(text, name).toContain('(no sign-in needed): https://preview.invalid/stop-mail?token=');
      } else {
        expect(headers, name).toEqual({});
      }
    }
    // A preview writes no stop links.
    expect(Number((await t.db('mail_stop_links').count({ n: '*' }).first())!.n)).toBe(0);
    expect((await coordinator.get(`/api/clubs/${club.id}/mail-templates/no_such_template/preview`)).status).toBe(404);
  });

  it('is for the club’s coordinators only', async () => {
    const { club, coordinator } = await clubWithSite();
    const holder = await signedInMember(t, club.id, ['plot_holder']);
    const volunteer = await signedInMember(t, club.id, ['volunteer']);
    const other = await clubWithSite('Other Growers');
    const anon = await browserLikeAgent(t.app);
    const paths = ['', '/offer/preview', '/offer/preview.html'].map((p) => `/api/clubs/${club.id}/mail-templates${p}`);
    for (const path of paths) {
      expect((await coordinator.get(path)).status, path).toBe(200);
      expect((await holder.get(path)).status, path).toBe(403);
      expect((await volunteer.get(path)).status, path).toBe(403);
      // DEVELOPERS.md: someone who is not a member of a club gets 403 on that club's routes.
      expect((await other.coordinator.get(path)).status, path).toBe(403);
      expect((await anon.get(path)).status, path).toBe(401);
    }
  });
});

describe('the preview page', () => {
  it('serves the HTML part with a policy of its own: inline styles apply, no script or request may run', async () => {
    const { club, coordinator } = await clubWithSite();
    const json = await coordinator.get(`/api/clubs/${club.id}/mail-templates/club_news/preview`).expect(200);
    const page = await coordinator.get(`/api/clubs/${club.id}/mail-templates/club_news/preview.html`).expect(200);
    expect(page.headers['content-type']).toMatch(/^text\/html/);
    expect(page.text).toBe(json.body.html);
    const csp = String(page.headers['content-security-policy']);
    expect(csp).toContain("default-src 'none'");
    expect(csp).toContain("style-src 'unsafe-inline'");
    expect(csp).toContain('sandbox');
    expect(csp).not.toMatch(/script-src/); // falls back to default-src 'none'
  });
});

describe('optional and transactional mail', () => {
  it('puts both List-Unsubscribe headers on club news and none on a password link or an invitation', async () => {
    const { club, coordinator } = await clubWithSite();
    const ana = await signedInMember(t, club.id, ['plot_holder']);
    const after = Date.now();
    const sent = await coordinator.post(`/api/clubs/${club.id}/mailings`, { subject: 'Paths on Saturday', body: 'We clear the paths at 10:00.', audience: { kind: 'all_members' } });
    expect(sent.status).toBe(201);
    const news = await waitForMail(mailUrl(), { to: ana.person.email, subject: 'Paths on Saturday', after });
    expect(news.headers['list-unsubscribe']).toMatch(/^<http:\/\/127\.0\.0\.1:3999\/api\/mail-stops\/[A-Za-z0-9_-]{43}>$/);
    expect(news.headers['list-unsubscribe-post']).toBe(ONE_CLICK);
    // The footer's stop link (a page that asks first) is the same token as the header's.
    const token = oneClickUrl(news.headers['list-unsubscribe']).split('/').pop()!;
    expect(news.text).toContain(`http://127.0.0.1:3999/stop-mail?token=${token}`);
    expect(findHrefs(news.html ?? '')).toContain(`http://127.0.0.1:3999/stop-mail?token=${token}`);

    const visitor = await browserLikeAgent(t.app);
    expect((await visitor.post('/api/password-resets', { email: ana.person.email })).status).toBeLessThan(300);
    const reset = await waitForMail(mailUrl(), { to: ana.person.email, subject: 'Reset your Tillwell password', after });
    expect(reset.headers['list-unsubscribe']).toBeUndefined();
    expect(reset.headers['list-unsubscribe-post']).toBeUndefined();
    expect(reset.text).not.toContain('stop-mail');

    const invited = await coordinator.post(`/api/clubs/${club.id}/invites`, { name: 'Bo New', email: 'bo.new@example.org', roles: ['plot_holder'] });
    expect(invited.status, JSON.stringify(invited.body)).toBe(201);
    const invite = await waitForMail(mailUrl(), { to: 'bo.new@example.org', after });
    expect(invite.headers['list-unsubscribe']).toBeUndefined();
    expect(await outboxHeaders('invite', 'bo.new@example.org')).not.toHaveProperty('List-Unsubscribe');
  });

  it('the one-click POST turns club news off without a session; a second POST is refused (410); unknown links are 404', async () => {
    const { club, coordinator } = await clubWithSite();
    const ana = await signedInMember(t, club.id, ['plot_holder']);
    await coordinator.post(`/api/clubs/${club.id}/mailings`, { subject: 'First', body: 'One.', audience: { kind: 'all_members' } });
    const url = oneClickUrl((await outboxHeaders('club_news', ana.person.email))['List-Unsubscribe']);

    // Opening it changes nothing (scanners fetch links): a JSON preview, or a browser is sent to the confirm page.
    const peek = await request(t.app).get(new URL(url).pathname).set('Accept', 'application/json');
    expect(peek.status).toBe(200);
    expect(peek.body).toMatchObject({ kind: 'club_news', clubName: 'Elm Row Growers', state: 'ready' });
    const page = await request(t.app).get(new URL(url).pathname).set('Accept', 'text/html');
    expect(page.status).toBe(303);
    expect(page.headers.location).toBe(`/stop-mail?token=${url.split('/').pop()}`);
    expect((await ana.get(`/api/clubs/${club.id}/mail-preferences`)).body).toEqual({ clubNews: true });

    const first = await oneClick(url);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ kind: 'club_news', state: 'used' });
    expect((await ana.get(`/api/clubs/${club.id}/mail-preferences`)).body).toEqual({ clubNews: false });
    // The choice is the same one the e-mail choices page shows, so the next message skips Ana.
    const next = await coordinator.post(`/api/clubs/${club.id}/mailings`, { subject: 'Second', body: 'Two.', audience: { kind: 'all_members' } });
    expect(next.body).toMatchObject({ recipients: 1, skipped: 1 }); // computed: coordinator and Ana are members; Ana is off
    expect(await t.db('mail_outbox').where({ kind: 'club_news', to_address: ana.person.email, subject: 'Second' }).first()).toBeUndefined();

    const again = await oneClick(url);
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('gone');
    expect((await request(t.app).post(`/api/mail-stops/${'x'.repeat(43)}`).type('form').send(ONE_CLICK)).status).toBe(404);
    expect((await request(t.app).post('/api/mail-stops/not-a-token').type('form').send(ONE_CLICK)).status).toBe(404);
    expect((await request(t.app).get(`/api/mail-stops/${'x'.repeat(43)}`)).status).toBe(404);
  });

  it('after a one-click stop from a digest, the next week’s digest is not sent to that person (injected now)', async () => {
    const { club, siteId, coordinator } = await clubWithSite();
    const ana = await signedInMember(t, club.id, ['volunteer']);
    const ben = await signedInMember(t, club.id, ['volunteer']);
    // computed: a shift 20 days ahead; the 14 days before it (days 7 to 19) hold exactly two Mondays, both within the digest's 14-day look-ahead.
    const shift = await makeShift(coordinator, club.id, siteId, addCalendarDays(localToday(ZONE), 20));
    const starts = new Date(shift.startsAt).getTime();
    const mondays: string[] = [];
    for (let d = 1; d <= 13; d++) {
      const day = new Date(starts - d * DAY);
      if (new Intl.DateTimeFormat('en-GB', { timeZone: ZONE, weekday: 'short' }).format(day) === 'Mon') mondays.unshift(day.toISOString().slice(0, 10));
    }
    expect(mondays).toHaveLength(2);
    // 08:30 London time, after the digests' 07:00 start (DIGEST_HOUR in shift-claims.ts); the default day is Monday.
    const at = (date: string) => siteInstant(date, '08:30', ZONE);
    const ctx = { publicUrl: t.config.publicUrl };
    expect(await sendShiftDigests(t.db, t.mailer, { ...ctx, now: at(mondays[0]) })).toBe(2);
    const headers = await outboxHeaders('shift_digest', ana.person.email);
    expect(headers['List-Unsubscribe-Post']).toBe(ONE_CLICK);
    expect((await oneClick(oneClickUrl(headers['List-Unsubscribe']))).status).toBe(200);
    expect((await ana.get(`/api/clubs/${club.id}/volunteer-settings`)).body).toEqual({ digestDay: null, helpMail: true, reminders: true });

    expect(await sendShiftDigests(t.db, t.mailer, { ...ctx, now: at(mondays[1]) })).toBe(1);
    const rows = await t.db('mail_outbox').where({ kind: 'shift_digest' }).orderBy('id').pluck('to_address');
    expect(rows.sort()).toEqual([ana.person.email, ben.person.email, ben.person.email].sort());
  });

  it('after a one-click stop from a reminder, the next shift’s reminder is not sent; the place itself is kept', async () => {
    const { club, siteId, coordinator } = await clubWithSite();
    const ana = await signedInMember(t, club.id, ['volunteer']);
    const day = addCalendarDays(localToday(ZONE), 5);
    const one = await makeShift(coordinator, club.id, siteId, day, '08:00', '09:00');
    const two = await makeShift(coordinator, club.id, siteId, addCalendarDays(day, 2), '08:00', '09:00');
    for (const s of [one, two]) expect((await ana.post(`/api/shifts/${s.id}/claim`)).status).toBe(200);
    // The confirmation of a place is transactional: no stop headers.
    expect(await outboxHeaders('shift_taken', ana.person.email)).not.toHaveProperty('List-Unsubscribe');
    const ctx = { publicUrl: t.config.publicUrl };
    // One minute inside the 24 hours before each shift (sendShiftReminders' window).
    const before = (s: { startsAt: string }) => new Date(new Date(s.startsAt).getTime() - DAY + 60_000);
    expect(await sendShiftReminders(t.db, t.mailer, { ...ctx, now: before(one) })).toBe(1);
    const headers = await outboxHeaders('shift_reminder', ana.person.email);
    expect(headers['List-Unsubscribe-Post']).toBe(ONE_CLICK);
    expect((await oneClick(oneClickUrl(headers['List-Unsubscribe']))).status).toBe(200);
    // The volunteer's own choices show it, and can turn it back on.
    expect((await ana.get(`/api/clubs/${club.id}/volunteer-settings`)).body).toEqual({ digestDay: 1, helpMail: true, reminders: false });

    expect(await sendShiftReminders(t.db, t.mailer, { ...ctx, now: before(two) })).toBe(0);
    expect(Number((await t.db('mail_outbox').where({ kind: 'shift_reminder' }).count({ n: '*' }).first())!.n)).toBe(1);
    expect((await t.db('shift_claims').where({ shift_id: two.id }).first('status', 'reminded_at')).status).toBe('taken');
    // Another person's reminders are not touched.
    const ben = await signedInMember(t, club.id, ['volunteer']);
    const three = await makeShift(coordinator, club.id, siteId, addCalendarDays(day, 4), '08:00', '09:00');
    expect((await ben.post(`/api/shifts/${three.id}/claim`)).status).toBe(200);
    expect((await ana.post(`/api/shifts/${three.id}/claim`)).status).toBe(200);
    expect(await sendShiftReminders(t.db, t.mailer, { ...ctx, now: before(three) })).toBe(1);
    expect(await t.db('mail_outbox').where({ kind: 'shift_reminder' }).orderBy('id').pluck('to_address')).toEqual([ana.person.email, ben.person.email]);
  });

  it('a call for help carries a stop link that turns help e-mails off only', async () => {
    const { club, siteId, coordinator } = await clubWithSite();
    const ana = await signedInMember(t, club.id, ['volunteer']);
    const shift = await makeShift(coordinator, club.id, siteId, addCalendarDays(localToday(ZONE), 5));
    const asked = await coordinator.post(`/api/shifts/${shift.id}/ask-for-help`, { note: 'Two more, please.' });
    expect(asked.status, JSON.stringify(asked.body)).toBe(200);
    const headers = await outboxHeaders('shift_help', ana.person.email);
    expect(headers['List-Unsubscribe-Post']).toBe(ONE_CLICK);
    expect((await oneClick(oneClickUrl(headers['List-Unsubscribe']))).status).toBe(200);
    expect((await ana.get(`/api/clubs/${club.id}/volunteer-settings`)).body).toEqual({ digestDay: 1, helpMail: false, reminders: true });
    const again = await coordinator.post(`/api/shifts/${shift.id}/ask-for-help`, { note: 'Still two.' });
    expect(again.body).toEqual({ sent: 0, skipped: 1 });
  });
});
