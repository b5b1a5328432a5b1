import fs from 'node:fs';
import path from 'node:path';
import ical from 'node-ical';
import sharp from 'sharp';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { buildClub, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, listMail, waitForMail } from '../helpers/inbox';
import { markMissedShifts, sendShiftDigests, sendShiftReminders } from '../../server/services/shift-claims';
import { siteInstant } from '../../server/services/shifts';
import { newToken } from '../../server/services/tokens';
import { openText } from '../../server/mail/seal';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const ZONE = 'Europe/London';

/** The events of an iCalendar text, parsed by node-ical (a general-purpose parser). */
const vevents = (text: string) => Object.values(ical.sync.parseICS(text)).filter((e): e is ical.VEvent => e?.type === 'VEVENT');
const DAY = 86_400_000;

/** A club with one site in London, a coordinator, a volunteer, a plot holder, and open tasks a holder handed over. */
async function club() {
  const c = await buildClub(t.db, { name: 'Ferndale Growers' });
  await t.db('clubs').where({ id: c.id }).update({ time_zone: ZONE, volunteer_hours_required: 6 });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const holder = await signedInMember(t, c.id, ['plot_holder']);
  const outsider = await signedInMember(t, (await buildClub(t.db, { name: 'Other club' })).id, ['coordinator', 'volunteer']);
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Ferndale field', latitude: 51.5, longitude: -0.1, time_zone: ZONE, width_m: 30, length_m: 20 })
    .returning('id');
  const plots: Array<{ id: number }> = await t.db('plots')
    .insert([
      { site_id: site.id, label: 'B-1', x_m: 0, y_m: 0, width_m: 3, length_m: 2 },
      { site_id: site.id, label: 'B-2', x_m: 4, y_m: 0, width_m: 3, length_m: 2 },
    ])
    .returning('id');
  const today = localToday(ZONE);
  const day = addCalendarDays(today, 3);
  const task = async (over: Record<string, unknown> = {}) =>
    (
      await t.db('tasks')
        .insert({
          club_id: c.id,
          site_id: site.id,
          plot_id: plots[0].id,
          origin: 'coordinator',
          kind: 'water',
          title: 'Water the beans',
          due_on: day,
          window_from: day,
          window_to: day,
          amount_l: 40,
          for_volunteers: true,
          ...over,
        })
        .returning('id')
    )[0].id as number;
  return { club: c, siteId: site.id as number, plots, coordinator, volunteer, holder, outsider, today, day, task };
}

type Club = Awaited<ReturnType<typeof club>>;

async function makeShift(s: Club, over: Record<string, unknown> = {}) {
  const res = await s.coordinator.post(`/api/clubs/${s.club.id}/shifts`, {
    siteId: s.siteId,
    title: 'Evening watering',
    kind: 'water',
    date: s.day,
    startTime: '18:00',
    endTime: '19:30',
    capacity: 3,
    estHours: 1.5,
    instructions: 'Fill the cans at the trough by the gate.',
    taskIds: [],
    ...over,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: number; version: number; startsAt: string; endsAt: string };
}

/** A claim link for one person, as the digest or a call for help makes them (its hash stored). */
async function claimLink(shiftId: number, userId: number, expiresAt = new Date(Date.now() + 3 * DAY)) {
  const { token, hash } = newToken();
  await t.db('shift_links').insert({ shift_id: shiftId, user_id: userId, purpose: 'claim', token_hash: hash, expires_at: expiresAt });
  return token;
}

describe('making shifts from open tasks', () => {
  it('suggests a grouping by site, date and kind, makes a shift of it, and shows who took places only to coordinators', async () => {
    const s = await club();
    const a = await s.task();
    const b = await s.task({ plot_id: s.plots[1].id, amount_l: 60 });
    await s.task({ for_volunteers: false, origin: 'generated', gen_key: 'water:x' }); // the holder's own: not for volunteers
    const sug = await s.coordinator.get(`/api/clubs/${s.club.id}/shift-suggestions`);
    expect(sug.status).toBe(200);
    expect(sug.body.items).toHaveLength(1);
    const first = sug.body.items[0];
    expect(first.taskIds).toEqual([a, b]);
    expect(first.title).toMatch(/evening watering, plots B-1 and B-2, about 100 L$/);
    expect((await s.volunteer.get(`/api/clubs/${s.club.id}/shift-suggestions`)).status).toBe(403);

    const shift = await makeShift(s, { title: first.title, taskIds: first.taskIds, capacity: first.capacity, estHours: first.estHours });
    expect((await s.coordinator.get(`/api/clubs/${s.club.id}/shift-suggestions`)).body.items).toEqual([]);
    // A task is in one shift only.
    const again = await s.coordinator.post(`/api/clubs/${s.club.id}/shifts`, { siteId: s.siteId, title: 'x', kind: 'water', date: s.day, startTime: '08:00', endTime: '09:00', capacity: 1, estHours: 1, instructions: '', taskIds: [a] });
    expect(again.status).toBe(409);

    expect((await s.volunteer.post(`/api/shifts/${shift.id}/claim`)).status).toBe(200);
    const asCoordinator = await s.coordinator.get(`/api/shifts/${shift.id}`);
    expect(asCoordinator.body.people.map((p: { name: string }) => p.name)).toEqual([s.volunteer.person.name]);
    expect(asCoordinator.body.tasks.map((x: { id: number }) => x.id)).toEqual([a, b]);
    expect(asCoordinator.body.amountL).toBe(100);
    const asVolunteer = await s.volunteer.get(`/api/shifts/${shift.id}`);
    expect(asVolunteer.body.people).toBeNull();
    expect(asVolunteer.body.taken).toBe(1);
    expect(asVolunteer.body.myClaim.status).toBe('taken');
    expect(asVolunteer.body.caution).toMatch(/10 kg/);
    const board = await s.holder.get(`/api/clubs/${s.club.id}/shifts`);
    expect(board.body.items.map((x: { id: number; people: unknown }) => [x.id, x.people])).toEqual([[shift.id, null]]);
    expect((await s.outsider.get(`/api/shifts/${shift.id}`)).status).toBe(404);
    expect((await s.holder.post(`/api/shifts/${shift.id}/claim`)).status).toBe(403);
  });

  it('keeps the wall-clock time in the site’s zone on both sides of the clocks changing', async () => {
    const s = await club();
    // UK clocks go forward on the last Sunday of March and back on the last Sunday of October; BST is
    // UTC+1, GMT is UTC+0 (UK Government, "When do the clocks change?"). The next such change after today:
    const lastSunday = (y: number, month: number) => {
      const d = new Date(Date.UTC(y, month + 1, 0));
      while (d.getUTCDay() !== 0) d.setUTCDate(d.getUTCDate() - 1);
      return d.toISOString().slice(0, 10);
    };
    const y = Number(s.today.slice(0, 4));
    const changes = [lastSunday(y, 2), lastSunday(y, 9), lastSunday(y + 1, 2), lastSunday(y + 1, 9)].filter((d) => addCalendarDays(d, -7) > s.today);
    const change = changes[0];
    const backInOctober = change.slice(5, 7) === '10';
    const before = await makeShift(s, { date: addCalendarDays(change, -7) });
    const after = await makeShift(s, { date: addCalendarDays(change, 1) });
    // 18:00 local is 17:00Z in summer time and 18:00Z in winter time.
    const [early, late] = backInOctober ? ['17', '18'] : ['18', '17'];
    expect(before.startsAt).toBe(`${addCalendarDays(change, -7)}T${early}:00:00.000Z`);
    expect(after.startsAt).toBe(`${addCalendarDays(change, 1)}T${late}:00:00.000Z`);
    // The calendar feed places both at 18:00 in London.
    await s.volunteer.post(`/api/shifts/${before.id}/claim`);
    await s.volunteer.post(`/api/shifts/${after.id}/claim`);
    const feed = await s.volunteer.post(`/api/clubs/${s.club.id}/feeds/personal`);
    const text = (await (await browserLikeAgent(t.app)).get(new URL(feed.body.url).pathname)).text;
    const events = vevents(text).sort((p, q) => p.start.getTime() - q.start.getTime());
    expect(events.map((e) => e.start.toISOString())).toEqual([before.startsAt, after.startsAt]);
    const london = new Intl.DateTimeFormat('en-GB', { timeZone: ZONE, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
    expect(events.map((e) => london.format(e.start))).toEqual(['18:00', '18:00']);
  });

  it('refuses bad shifts with the field at fault', async () => {
    const s = await club();
    const post = (over: Record<string, unknown>) =>
      s.coordinator.post(`/api/clubs/${s.club.id}/shifts`, { siteId: s.siteId, title: 'x', kind: 'water', date: s.day, startTime: '18:00', endTime: '19:00', capacity: 2, estHours: 1, instructions: '', taskIds: [], ...over });
    expect((await post({ endTime: '17:00' })).body.error.fields).toHaveProperty('endTime');
    expect((await post({ capacity: 0 })).body.error.fields).toHaveProperty('capacity');
    expect((await post({ date: addCalendarDays(s.today, -1) })).body.error.fields).toHaveProperty('date');
    expect((await post({ startTime: '25:00' })).body.error.fields).toHaveProperty('startTime');
    expect((await post({ title: 'a\u0000b' })).body.error.fields).toHaveProperty('title');
    expect((await post({ taskIds: [2147483648] })).status).toBe(400);
    const other = await s.task({ site_id: s.siteId });
    await t.db('tasks').where({ id: other }).update({ status: 'done' });
    expect((await post({ taskIds: [other] })).status).toBe(409);
  });
});

describe('taking places', () => {
  it('with capacity 3 and 50 claims at once from 50 links, exactly 3 succeed and the rest hear it is covered', async () => {
    const s = await club();
    const shift = await makeShift(s, { capacity: 3 });
    const people = await Promise.all(Array.from({ length: 50 }, () => buildMember(t.db, { clubId: s.club.id, roles: ['volunteer'] })));
    const tokens = await Promise.all(people.map((p) => claimLink(shift.id, p.id)));
    const agent = await browserLikeAgent(t.app);
    const answers = await Promise.all(tokens.map((token) => agent.post('/api/shift-links/claim', { token })));
    const codes = answers.map((r) => r.status);
    expect(codes.filter((c) => c === 200)).toHaveLength(3);
    expect(codes.filter((c) => c === 409)).toHaveLength(47);
    expect(codes.filter((c) => c >= 500)).toEqual([]);
    expect(answers.find((r) => r.status === 409)!.body.error.message).toMatch(/Already covered/);
    const [{ n }] = await t.db('shift_claims').where({ shift_id: shift.id, status: 'taken' }).count({ n: '*' });
    expect(Number(n)).toBe(3);
    // A refused person's preview says it is covered and offers other shifts (none here).
    const refused = tokens[codes.indexOf(409)];
    const preview = await agent.get(`/api/shift-links/preview?token=${refused}`);
    expect([preview.body.state, preview.body.otherShifts]).toEqual(['full', []]);
  });

  it('does nothing when a link is only opened, claims for the link’s person only, and refuses a reused or expired link', async () => {
    const s = await club();
    const shift = await makeShift(s);
    const anna = await buildMember(t.db, { clubId: s.club.id, roles: ['volunteer'], user: { name: 'Anna Berg', email: 'anna@example.org' } });
    const token = await claimLink(shift.id, anna.id);
    const agent = await browserLikeAgent(t.app);
    const preview = await agent.get(`/api/shift-links/preview?token=${token}`);
    expect(preview.status).toBe(200);
    expect([preview.body.state, preview.body.forName, preview.body.purpose]).toEqual(['ready', 'Anna', 'claim']);
    expect(Number((await t.db('shift_claims').count({ n: '*' }).first())!.n)).toBe(0);

    // Someone else signed in opens Anna's link: confirming still claims for Anna, never for them.
    const since = Date.now();
    const claimed = await s.volunteer.post('/api/shift-links/claim', { token });
    expect(claimed.status).toBe(200);
    expect(claimed.body.state).toBe('yours');
    const claims = await t.db('shift_claims').where({ shift_id: shift.id }).select('user_id', 'via');
    expect(claims).toEqual([{ user_id: anna.id, via: 'link' }]);
    expect((await agent.post('/api/shift-links/claim', { token })).status).toBe(409);

    // The confirmation carries release and done links and the shift as a calendar file at 18:00 London time.
    const mail = await waitForMail(mailUrl(), { to: 'anna@example.org', subject: 'You have a place', after: since });
    expect(mail.text).toMatch(/Take care: .*10 kg/);
    const ics = mail.attachments.find((a) => a.contentType.startsWith('text/calendar'))!;
    const events = vevents(ics.text!);
    expect(events).toHaveLength(1);
    expect(events[0].start.toISOString()).toBe(siteInstant(s.day, '18:00', ZONE).toISOString());
    expect(events[0].end!.toISOString()).toBe(siteInstant(s.day, '19:30', ZONE).toISOString());
    expect(String(events[0].summary)).toBe('Evening watering');

    // Releasing from the e-mail reopens the place and tells the coordinator.
    const releaseUrl = new URL(extractLink(mail, '/shift-link?token='));
    const releaseToken = releaseUrl.searchParams.get('token')!;
    const releasePreview = await agent.get(`/api/shift-links/preview?token=${releaseToken}`);
    expect([releasePreview.body.purpose, releasePreview.body.state]).toEqual(['release', 'ready']);
    const since2 = Date.now();
    expect((await agent.post('/api/shift-links/release', { token: releaseToken })).status).toBe(200);
    expect((await t.db('shift_claims').where({ user_id: anna.id }).first()).status).toBe('released');
    await waitForMail(mailUrl(), { to: s.coordinator.person.email, subject: 'A place is free again', after: since2 });
    expect((await s.volunteer.get(`/api/shifts/${shift.id}`)).body.taken).toBe(0);

    // An expired link is refused and says so.
    const old = await claimLink(shift.id, anna.id, new Date(Date.now() - 1000));
    expect((await agent.get(`/api/shift-links/preview?token=${old}`)).body.state).toBe('expired');
    expect((await agent.post('/api/shift-links/claim', { token: old })).status).toBe(410);
    expect((await agent.post('/api/shift-links/claim', { token: 'x'.repeat(43) })).status).toBe(404);
    expect((await agent.post('/api/shift-links/claim', { token: 'bad token' })).status).toBe(400);
  });
});

describe('the jobs, with an injected time', () => {
  it('reminds once a day before, marks places of ended shifts missed, and a done link still records them', async () => {
    const s = await club();
    const task = await s.task();
    const shift = await makeShift(s, { taskIds: [task] });
    expect((await s.volunteer.post(`/api/shifts/${shift.id}/claim`)).status).toBe(200);
    const starts = new Date(shift.startsAt);
    const ctx = { publicUrl: t.config.publicUrl };
    expect(await sendShiftReminders(t.db, t.mailer, { ...ctx, now: new Date(starts.getTime() - 2 * DAY) })).toBe(0);
    expect(await sendShiftReminders(t.db, t.mailer, { ...ctx, now: new Date(starts.getTime() - DAY + 60_000) })).toBe(1);
    expect(await sendShiftReminders(t.db, t.mailer, { ...ctx, now: new Date(starts.getTime() - 3_600_000) })).toBe(0);
    const reminder = await t.db('mail_outbox').where({ kind: 'shift_reminder' }).first('to_address', 'text');
    expect(reminder.to_address).toBe(s.volunteer.person.email);
    const doneToken = new URL(/I did this shift: (\S+)/.exec(openText(reminder.text))![1]).searchParams.get('token')!;

    const ends = new Date(shift.endsAt);
    expect(await markMissedShifts(t.db, { now: new Date(ends.getTime() - 60_000) })).toBe(0);
    expect(await markMissedShifts(t.db, { now: ends })).toBe(1);
    expect((await t.db('shift_claims').where({ shift_id: shift.id }).first('status')).status).toBe('missed');

    // Over HTTP the clock is the real one: put the shift's day at today so "done" is allowed (from the shift's day).
    await t.db('shifts').where({ id: shift.id }).update({ on_date: s.today });
    const agent = await browserLikeAgent(t.app);
    const done = await agent.post('/api/shift-links/done', { token: doneToken, note: 'All beds watered', hours: 2 });
    expect(done.status).toBe(200);
    const claim = await t.db('shift_claims').where({ shift_id: shift.id }).first('status', 'hours', 'note');
    expect([claim.status, Number(claim.hours), claim.note]).toEqual(['done', 2, 'All beds watered']);
    expect((await t.db('tasks').where({ id: task }).first('status')).status).toBe('done');
    expect((await agent.post('/api/shift-links/done', { token: doneToken, note: '' })).status).toBe(409);
  });

  it('sends the weekly digest once on the volunteer’s day, with a claim link per open shift, and not to those who said no', async () => {
    const s = await club();
    const shift = await makeShift(s);
    const quiet = await signedInMember(t, s.club.id, ['volunteer']);
    expect((await quiet.put(`/api/clubs/${s.club.id}/volunteer-settings`, { digestDay: null })).body).toEqual({ digestDay: null, helpMail: true, reminders: true });
    expect((await s.volunteer.put(`/api/clubs/${s.club.id}/volunteer-settings`, { digestDay: 7 })).status).toBe(400);
    // The shift is 3 days ahead; send on the volunteer's (default Monday) day from 07:00 London time before it.
    const start = new Date(shift.startsAt);
    let monday = new Date(start.getTime() - DAY);
    while (new Intl.DateTimeFormat('en-GB', { timeZone: ZONE, weekday: 'short' }).format(monday) !== 'Mon') monday = new Date(monday.getTime() - DAY);
    const at = (hh: number) => siteInstant(monday.toISOString().slice(0, 10), `${String(hh).padStart(2, '0')}:30`, ZONE);
    expect(await sendShiftDigests(t.db, t.mailer, { publicUrl: t.config.publicUrl, now: at(6) })).toBe(0);
    const sent = await sendShiftDigests(t.db, t.mailer, { publicUrl: t.config.publicUrl, now: at(8) });
    expect(sent).toBe(1);
    expect(await sendShiftDigests(t.db, t.mailer, { publicUrl: t.config.publicUrl, now: at(9) })).toBe(0);
    const rows = await t.db('mail_outbox').where({ kind: 'shift_digest' }).select('to_address', 'text');
    expect(rows.map((r: { to_address: string }) => r.to_address)).toEqual([s.volunteer.person.email]);
    // Bodies are sealed in the outbox (server/mail/seal.ts); opened with the app's key.
    const digest = openText(rows[0].text);
    expect(digest).toMatch(/Evening watering/);
    expect(digest).toMatch(/my-shifts/);
    expect(Number((await t.db('shift_links').where({ shift_id: shift.id, purpose: 'claim' }).count({ n: '*' }).first())!.n)).toBe(1);
  });
});

describe('hours and calendar feeds', () => {
  it('counts only done places, per person and season, against the club’s ask', async () => {
    const s = await club();
    const shift = await makeShift(s, { estHours: 1.5 });
    const other = await makeShift(s, { startTime: '10:00', endTime: '11:00', estHours: 1 });
    await s.volunteer.post(`/api/shifts/${shift.id}/claim`);
    await s.volunteer.post(`/api/shifts/${other.id}/claim`);
    // Done on the day: move both shifts' day to today so "done" is allowed (the rule: from the shift's day).
    await t.db('shifts').whereIn('id', [shift.id, other.id]).update({ on_date: s.today });
    const done = await s.volunteer.post(`/api/shifts/${shift.id}/done`, { note: 'Done', hours: null });
    expect(done.status).toBe(200);
    const table = await s.coordinator.get(`/api/clubs/${s.club.id}/hours`);
    expect(table.status).toBe(200);
    const me = table.body.items.find((r: { userId: number }) => r.userId === s.volunteer.person.id);
    // computed: one done shift of 1.5 h; the other is only taken; the club asks 6 h, so 4.5 h remain
    expect(me).toMatchObject({ shiftsDone: 1, hours: 1.5, required: 6, remaining: 4.5 });
    const mine = await s.volunteer.get(`/api/clubs/${s.club.id}/my-shifts`);
    expect(mine.body.hours).toMatchObject({ hours: 1.5, remaining: 4.5 });
    expect((await s.volunteer.get(`/api/clubs/${s.club.id}/hours`)).status).toBe(403);
    const csv = await s.coordinator.get(`/api/clubs/${s.club.id}/hours.csv`);
    expect(csv.text.replace(/^\uFEFF/, '').split('\r\n')[0]).toBe('Name,Season,Shifts done,Hours,Hours asked,Hours still to do');
    expect(csv.text).toContain(`${s.volunteer.person.name},${s.today.slice(0, 4)},1,1.5,6,4.5`);
  });

  it('keeps a done photo in the upload store under shift-photos/ and shows it to its sender and the coordinators only', async () => {
    const s = await club();
    const shift = await makeShift(s);
    await s.volunteer.post(`/api/shifts/${shift.id}/claim`).expect(200);
    await t.db('shifts').where({ id: shift.id }).update({ on_date: s.today });
    const photo = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#4a7a2c' } }).jpeg().toBuffer();
    const done = await s.volunteer.agent
      .post(`/api/shifts/${shift.id}/done`)
      .set('X-CSRF-Token', s.volunteer.csrf)
      .field('note', 'Beds watered')
      .attach('photo', photo, 'beds.jpg');
    expect(done.status).toBe(200);
    const claim = await t.db('shift_claims').where({ shift_id: shift.id }).first('id', 'photo_path');
    expect(claim.photo_path).toMatch(/^[0-9a-f]{32}\.webp$/);
    // The local store keeps the layout it always had: <UPLOAD_DIR>/shift-photos/<name>.
    const onDisk = fs.readFileSync(path.join(t.config.uploadDir, 'shift-photos', claim.photo_path));
    const url = `/api/shifts/${shift.id}/claims/${claim.id}/photo`;
    for (const viewer of [s.volunteer, s.coordinator]) {
      const res = await viewer.get(url).buffer(true);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('image/webp');
      expect(Buffer.compare(res.body as Buffer, onDisk)).toBe(0);
    }
    const other = await signedInMember(t, s.club.id, ['volunteer']);
    expect((await other.get(url)).status).toBe(404);
    expect((await s.outsider.get(url)).status).toBe(404);
  });

  it('serves a personal feed of the shifts a person holds at a secret address, and a reset address stops the old one', async () => {
    const s = await club();
    const mineShift = await makeShift(s, { title: 'Mine' });
    await makeShift(s, { title: 'Not mine', startTime: '08:00', endTime: '09:00' });
    await s.volunteer.post(`/api/shifts/${mineShift.id}/claim`);
    const made = await s.volunteer.post(`/api/clubs/${s.club.id}/feeds/personal`);
    expect(made.status).toBe(200);
    const path = new URL(made.body.url).pathname;
    const anon = await browserLikeAgent(t.app);
    const feed = await anon.get(path);
    expect(feed.status).toBe(200);
    expect(feed.headers['content-type']).toMatch(/text\/calendar/);
    expect(feed.text).toContain('BEGIN:VTIMEZONE');
    expect(feed.text).toContain('TZID:Europe/London');
    const events = vevents(feed.text);
    expect(events.map((e) => String(e.summary))).toEqual(['Mine']);
    expect(events[0].start.toISOString()).toBe(mineShift.startsAt);
    const reset = await s.volunteer.post(`/api/clubs/${s.club.id}/feeds/personal`);
    expect(new URL(reset.body.url).pathname).not.toBe(path);
    expect((await anon.get(path)).status).toBe(404);
    expect((await anon.get(new URL(reset.body.url).pathname)).status).toBe(200);
    expect((await s.volunteer.post(`/api/clubs/${s.club.id}/feeds/club`)).status).toBe(403);
    const clubFeed = await s.coordinator.post(`/api/clubs/${s.club.id}/feeds/club`);
    const all = vevents((await anon.get(new URL(clubFeed.body.url).pathname)).text);
    expect(all.map((e) => String(e.summary)).sort()).toEqual(['Mine', 'Not mine']);
  });

  it('calls a shift off: the people holding places are told and its tasks are free again', async () => {
    const s = await club();
    const task = await s.task();
    const shift = await makeShift(s, { taskIds: [task] });
    await s.volunteer.post(`/api/shifts/${shift.id}/claim`);
    const since = Date.now();
    const off = await s.coordinator.post(`/api/shifts/${shift.id}/call-off`, { version: shift.version });
    expect(off.status).toBe(200);
    expect(off.body.state).toBe('called_off');
    await waitForMail(mailUrl(), { to: s.volunteer.person.email, subject: 'Called off', after: since });
    expect((await s.coordinator.get(`/api/clubs/${s.club.id}/shift-suggestions`)).body.items[0].taskIds).toEqual([task]);
    expect((await s.volunteer.post(`/api/shifts/${shift.id}/claim`)).status).toBe(409);
    expect(await listMail(mailUrl(), { to: s.holder.person.email })).toEqual([]);
  });
});
