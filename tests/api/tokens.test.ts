import { execFileSync } from 'node:child_process';
import crypto from 'node:crypto';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { buildApplication, buildClub, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail, type Message } from '../helpers/inbox';
import { decodeEntities, findUrls } from '../../fake-mail/links';
import { AppError } from '../../server/errors';
import { previewInvite } from '../../server/services/invites';
import { acceptOffer } from '../../server/services/offers';
import { checkPasswordReset, completePasswordReset, createPasswordLink } from '../../server/services/password-resets';
import { keepPlot } from '../../server/services/renewals';
import { claimByLink, doneByLink, releaseByLink } from '../../server/services/shift-claims';
import { hashToken } from '../../server/services/tokens';

// Every kind of link token the product makes (grep newToken / token_hash in server/), issued through
// the real routes, read back from the fake inbox or the route's answer, then looked for in the database.
// OWASP ASVS 4.0.3 is the yardstick: V2.5.x / V3.x (reset and invitation secrets), V2.9 / V6.3
// (random values of at least 128 bits), V3.2.x (refused once used or expired).

const t = setupTestApp();
afterAll(() => t.close());

const DAY = 86_400_000;
const ZONE = 'Europe/London';
const tokenOf = (url: string) => new URL(url).searchParams.get('token')!;

/** Every `/shift-link?token=` link in a message (text first, then the HTML with its entities decoded). */
const shiftLinks = (m: Message) =>
  [...new Set([...findUrls(m.text), ...findUrls(decodeEntities(m.html ?? ''))].filter((u) => u.includes('/shift-link?token=')).map(tokenOf))];

/** What a service threw: its status (AppError) so it reads like the route's answer. */
async function statusOf(p: Promise<unknown>): Promise<number> {
  try {
    await p;
    return 200;
  } catch (err) {
    if (err instanceof AppError) return err.status;
    throw err;
  }
}

interface Issued {
  kind: string;
  token: string;
}

/**
 * One of each token, made the way the product makes them. Returns the tokens and what the later
 * checks need (the shift's times, the second volunteer's agent).
 */
async function issueEveryToken() {
  await truncateAll(t.db);
  const club = await buildClub(t.db, { name: 'Quillet Growers' });
  await t.db('clubs').where({ id: club.id }).update({ time_zone: ZONE });
  await t.db('fee_schedules').insert({ club_id: club.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'Long field', latitude: 51.5, longitude: -0.1, time_zone: ZONE, width_m: 40, length_m: 20 })
    .returning('id');
  const plots: Array<{ id: number }> = await t.db('plots')
    .insert(['C-1', 'C-2', 'C-3', 'C-4'].map((label, i) => ({ site_id: site.id, label, x_m: i * 4, y_m: 0, width_m: 3, length_m: 6 })))
    .returning('id');
  const issued: Issued[] = [];
  const since = Date.now();
  // With an Idempotency-Key, so the stored answers (idempotency_keys) are scanned too.
  const keyed = (url: string, body: object) =>
    coordinator.agent.post(url).set('X-CSRF-Token', coordinator.csrf).set('Idempotency-Key', crypto.randomUUID()).send(body);

  // Renewal: last season's holder of C-1, paid up, gets a link when the next season opens.
  const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { name: 'Holly Holder' } });
  const [last] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
  const [alloc] = await t.db('allocations').insert({ season_id: last.id, plot_id: plots[0].id, user_id: holder.id, source: 'offer' }).returning('id');
  const [fee] = await t.db('fees')
    .insert({ club_id: club.id, season_id: last.id, allocation_id: alloc.id, user_id: holder.id, plot_id: plots[0].id, description: 'x', plot_fee_minor: 4000, deposit_minor: 0, currency: 'GBP', due_on: '2026-04-01' })
    .returning('id');
  await t.db('payments').insert({ fee_id: fee.id, amount_minor: 4000, method: 'cash', paid_on: '2026-03-01' });
  const opened = await keyed(`/api/clubs/${club.id}/seasons`, { year: 2027, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
  expect(opened.status, JSON.stringify(opened.body)).toBe(201);
  const seasonId = opened.body.season.id as number;
  issued.push({ kind: 'renewal', token: tokenOf(extractLink(await waitForMail(mailUrl(), { to: holder.email, after: since }), '/respond/renewal')) });

  // Two offers (one to accept through the route, one to let expire).
  for (const [i, who] of (['Olive Offered', 'Otto Offered'] as const).entries()) {
    const app = await buildApplication(t.db, { clubId: club.id, name: who, email: `offer${i}@example.org` });
    const res = await keyed(`/api/seasons/${seasonId}/offers`, { plotId: plots[i + 1].id, applicationId: app.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    issued.push({ kind: `offer ${i}`, token: tokenOf(extractLink(await waitForMail(mailUrl(), { to: app.email, after: since }), '/respond/offer')) });
  }

  // Invitation.
  const invited = await keyed(`/api/clubs/${club.id}/invites`, { email: 'ivy@example.org', name: 'Ivy Invited', roles: ['volunteer'] });
  expect(invited.status, JSON.stringify(invited.body)).toBe(201);
  issued.push({ kind: 'invite', token: tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'ivy@example.org', after: since }), '/invite')) });

  // Password reset (asked for by the person) and a first-password link (made by the service offers use).
  const anon = await browserLikeAgent(t.app);
  await anon.post('/api/password-resets', { email: holder.email }).expect(202);
  issued.push({ kind: 'password reset', token: tokenOf(extractLink(await waitForMail(mailUrl(), { to: holder.email, subject: 'password', after: since }), '/reset-password')) });
  const noPassword = await buildMember(t.db, { clubId: club.id, roles: ['volunteer'], user: { name: 'Nell Nopass' } });
  issued.push({ kind: 'first password', token: tokenOf(await createPasswordLink(t.db, { userId: noPassword.id, publicUrl: t.config.publicUrl })) });

  // Shift links: a call for help (claim), its confirmation (release, done); a second volunteer takes a place on the board.
  const volunteer = await signedInMember(t, club.id, ['volunteer']);
  const other = await signedInMember(t, club.id, ['volunteer']);
  const day = addCalendarDays(localToday(ZONE), 3);
  const shift = await coordinator.post(`/api/clubs/${club.id}/shifts`, {
    siteId: site.id, title: 'Morning weeding', kind: 'weed', date: day, startTime: '09:00', endTime: '10:00', capacity: 3, estHours: 1, instructions: 'Gloves by the shed.', taskIds: [],
  });
  expect(shift.status, JSON.stringify(shift.body)).toBe(201);
  const asked = await keyed(`/api/shifts/${shift.body.id}/ask-for-help`, { note: 'Two more pairs of hands, please.' });
  expect(asked.status, JSON.stringify(asked.body)).toBe(200);
  const help = await waitForMail(mailUrl(), { to: volunteer.person.email, after: since });
  const [claim] = shiftLinks(help);
  issued.push({ kind: 'shift claim', token: claim });
  issued.push({ kind: 'shift claim 2', token: shiftLinks(await waitForMail(mailUrl(), { to: other.person.email, after: since }))[0] }); // left unused
  const claimed = await anon.post('/api/shift-links/claim', { token: claim });
  expect(claimed.status, JSON.stringify(claimed.body)).toBe(200);
  const byPurpose = async (m: Message) => {
    const out: Record<string, string> = {};
    for (const tok of shiftLinks(m)) out[(await anon.get(`/api/shift-links/preview?token=${tok}`)).body.purpose] = tok;
    return out;
  };
  const taken = await byPurpose(await waitForMail(mailUrl(), { to: volunteer.person.email, after: since, subject: 'You have a place' }));
  issued.push({ kind: 'shift release', token: taken.release }, { kind: 'shift done', token: taken.done });
  const since2 = Date.now();
  expect((await other.post(`/api/shifts/${shift.body.id}/claim`)).status).toBe(200);
  const otherLinks = await byPurpose(await waitForMail(mailUrl(), { to: other.person.email, after: since2, subject: 'You have a place' }));
  issued.push({ kind: 'shift release (board)', token: otherLinks.release });

  // Calendar feeds: a volunteer's own, a coordinator's club feed.
  const personal = await volunteer.post(`/api/clubs/${club.id}/feeds/personal`);
  const clubFeed = await coordinator.post(`/api/clubs/${club.id}/feeds/club`);
  const feedToken = (url: string) => /\/api\/feeds\/([A-Za-z0-9_-]+)\.ics$/.exec(url)![1];
  issued.push({ kind: 'personal feed', token: feedToken(personal.body.url) }, { kind: 'club feed', token: feedToken(clubFeed.body.url) });

  return { issued, club, coordinator, volunteer, shift: shift.body as { id: number; startsAt: string; endsAt: string } };
}

type Setup = Awaited<ReturnType<typeof issueEveryToken>>;
let s: Setup;
const tok = (kind: string) => s.issued.find((i) => i.kind === kind)!.token;

/** Every column of every table in every schema the app's database holds (not PostgreSQL's own), as the catalogue lists it. */
async function everyColumn() {
  const { rows } = await t.db.raw(`
    select c.table_schema, c.table_name, c.column_name, c.data_type
      from information_schema.columns c
      join information_schema.tables tb on tb.table_schema = c.table_schema and tb.table_name = c.table_name and tb.table_type = 'BASE TABLE'
     where c.table_schema not in ('pg_catalog', 'information_schema') and c.table_schema not like 'pg_toast%'
  `);
  return rows as Array<{ table_schema: string; table_name: string; column_name: string; data_type: string }>;
}

const TEXTUAL = new Set(['text', 'character varying', 'character', 'json', 'jsonb', 'ARRAY', 'USER-DEFINED', 'xml', 'bytea']);

/** Where any of the needles occurs in a text-like or bytea column: "schema.table.column holds kind". */
async function findInDatabase(needles: Issued[]): Promise<string[]> {
  const found: string[] = [];
  const values = needles.map((n) => n.token);
  for (const col of (await everyColumn()).filter((c) => TEXTUAL.has(c.data_type))) {
    const ident = `"${col.table_schema}"."${col.table_name}"`;
    const column = `"${col.column_name}"`;
    // bytea: the needle's own bytes inside the value; everything else: the value's text form.
    const test = col.data_type === 'bytea' ? `position(convert_to(n, 'UTF8') in x.${column}) > 0` : `strpos(x.${column}::text, n) > 0`;
    const { rows } = await t.db.raw(`select distinct n from ${ident} x, unnest(?::text[]) n where ${test}`, [values]);
    for (const r of rows as Array<{ n: string }>) found.push(`${col.table_schema}.${col.table_name}.${col.column_name} holds the ${needles.find((x) => x.token === r.n)!.kind} token`);
  }
  return found;
}

describe('link tokens', () => {
  beforeAll(async () => {
    s = await issueEveryToken();
  });

  it('are never stored: no text, json, array or bytea column of any table holds one, while their hashes are found', async () => {
    // The kinds grep finds: renewals, offers, invites, password_resets (reset and first password), shift_links (3 purposes), calendar_feeds (2 kinds).
    expect(s.issued.map((i) => i.kind)).toEqual([
      'renewal', 'offer 0', 'offer 1', 'invite', 'password reset', 'first password',
      'shift claim', 'shift claim 2', 'shift release', 'shift done', 'shift release (board)', 'personal feed', 'club feed',
    ]);
    for (const i of s.issued) expect(i.token, i.kind).toBeTruthy();
    expect(await findInDatabase(s.issued)).toEqual([]);
    expect(Number((await t.db('idempotency_keys').count({ n: '*' }))[0].n)).toBe(5); // computed: 1 season + 2 offers + 1 invite + 1 call for help = 5
    // The scan does find what is there: each token's SHA-256 sits in a token_hash column.
    const hashes = await findInDatabase(s.issued.map((i) => ({ kind: i.kind, token: hashToken(i.token) })));
    expect(hashes.filter((h) => /\.token_hash holds/.test(h))).toHaveLength(s.issued.length);
  });

  it('carry at least 128 random bits each, and no two are alike', () => {
    for (const { kind, token } of s.issued) {
      expect(token, kind).toMatch(/^[A-Za-z0-9_-]+$/);
      // ASVS 4.0.3 V3.2.2 / V2.9: at least 128 bits of entropy; base64url carries 6 bits a character.
      expect(Buffer.from(token, 'base64url').length * 8, kind).toBeGreaterThanOrEqual(128);
    }
    expect(new Set(s.issued.map((i) => i.token)).size).toBe(s.issued.length);
  });

  it('expire: the same token with the clock past its end is refused with 410', async () => {
    const later = new Date(Date.now() + 400 * DAY);
    // Invitations live 14 days, reset links an hour, first-password links 7 days (server/services/*).
    expect(await statusOf(previewInvite(t.db, tok('invite'), later))).toBe(410);
    expect(await statusOf(checkPasswordReset(t.db, { token: tok('password reset'), now: new Date(Date.now() + 61 * 60_000) }))).toBe(410);
    expect(await statusOf(completePasswordReset(t.db, { token: tok('first password'), password: 'a-new-long-password', bcryptCost: 10, now: new Date(Date.now() + 8 * DAY) }))).toBe(410);
    expect(await statusOf(acceptOffer(t.db, t.mailer, { token: tok('offer 1'), publicUrl: t.config.publicUrl, now: later }))).toBe(410);
    expect(await statusOf(keepPlot(t.db, { token: tok('renewal'), now: later }))).toBe(410);
    // Claim and release links end when the shift starts; done links 7 days after it ends.
    const ctx = (now: Date) => ({ db: t.db, mailer: t.mailer, publicUrl: t.config.publicUrl, uploadDir: t.config.uploadDir, now });
    const starts = new Date(s.shift.startsAt);
    expect(await statusOf(claimByLink(ctx(starts), { token: tok('shift claim 2') }))).toBe(410);
    expect(await statusOf(releaseByLink(ctx(starts), { token: tok('shift release') }))).toBe(410);
    expect(await statusOf(doneByLink(ctx(new Date(new Date(s.shift.endsAt).getTime() + 7 * DAY + 1000)), { token: tok('shift done'), body: { note: '', hours: null } }))).toBe(410);
    // Nothing above used a link up: each still works now.
    expect((await request(t.app).get(`/api/invites/preview?token=${tok('invite')}`)).status).toBe(200);
    expect((await request(t.app).get(`/api/password-resets/check?token=${tok('password reset')}`)).status).toBe(200);
    expect((await request(t.app).get(`/api/renewals/preview?token=${tok('renewal')}`)).body.status).toBe('pending');
  });

  it('work once: a second use is refused (410, or 409 for shift links), and so is every use after', async () => {
    const anon = await browserLikeAgent(t.app);
    // Invitation.
    expect((await anon.post('/api/invites/accept', { token: tok('invite'), name: 'Ivy Invited', password: 'ivy-grows-kale-daily' })).status).toBe(200);
    const anon2 = await browserLikeAgent(t.app);
    expect((await anon2.post('/api/invites/accept', { token: tok('invite'), name: 'Ivy Invited', password: 'ivy-grows-kale-daily' })).status).toBe(410);
    expect((await anon2.get(`/api/invites/preview?token=${tok('invite')}`)).status).toBe(410);
    // Password reset and first-password links.
    for (const kind of ['password reset', 'first password']) {
      expect((await anon2.post('/api/password-resets/complete', { token: tok(kind), password: 'a-long-new-password' })).status, kind).toBe(204);
      expect((await anon2.post('/api/password-resets/complete', { token: tok(kind), password: 'another-long-password' })).status, kind).toBe(410);
      expect((await anon2.get(`/api/password-resets/check?token=${tok(kind)}`)).status, kind).toBe(410);
    }
    // Offer and renewal.
    expect((await anon2.post('/api/offers/accept', { token: tok('offer 0') })).status).toBe(200);
    expect((await anon2.post('/api/offers/accept', { token: tok('offer 0') })).status).toBe(410);
    expect((await anon2.post('/api/offers/decline', { token: tok('offer 0') })).status).toBe(410);
    expect((await anon2.post('/api/renewals/keep', { token: tok('renewal') })).status).toBe(200);
    expect((await anon2.post('/api/renewals/keep', { token: tok('renewal') })).status).toBe(410);
    expect((await anon2.post('/api/renewals/release', { token: tok('renewal') })).status).toBe(410);
    // Shift links: the claim was used while issuing; done (on the day) and release once each.
    expect((await anon2.post('/api/shift-links/claim', { token: tok('shift claim') })).status).toBe(409);
    const during = { db: t.db, mailer: t.mailer, publicUrl: t.config.publicUrl, uploadDir: t.config.uploadDir, now: new Date(new Date(s.shift.startsAt).getTime() + 30 * 60_000) };
    expect(await statusOf(doneByLink(during, { token: tok('shift done'), body: { note: 'Weeded the paths.', hours: 1 } }))).toBe(200);
    expect(await statusOf(doneByLink(during, { token: tok('shift done'), body: { note: 'Again.', hours: 1 } }))).toBe(409);
    expect((await anon2.post('/api/shift-links/release', { token: tok('shift release (board)') })).status).toBe(200);
    expect((await anon2.post('/api/shift-links/release', { token: tok('shift release (board)') })).status).toBe(409);
    expect((await anon2.get(`/api/shift-links/preview?token=${tok('shift release (board)')}`)).body.state).toBe('used');
  });

  it('a calendar feed address works until it is replaced, and then never again', async () => {
    const old = tok('personal feed');
    expect((await request(t.app).get(`/api/feeds/${old}.ics`)).status).toBe(200);
    const renewed = await s.volunteer.post(`/api/clubs/${s.club.id}/feeds/personal`);
    const fresh = /\/api\/feeds\/([A-Za-z0-9_-]+)\.ics$/.exec(renewed.body.url)![1];
    expect(fresh).not.toBe(old);
    expect((await request(t.app).get(`/api/feeds/${old}.ics`)).status).toBe(404);
    expect((await request(t.app).get(`/api/feeds/${fresh}.ics`)).status).toBe(200);
  });
});

describe('secrets compared in code', () => {
  it('a CSRF header as long as the token but with other UTF-8 bytes is a 403, not a 500', async () => {
    const person = await buildMember(t.db, { clubId: (await buildClub(t.db)).id, roles: ['coordinator'] });
    const c = await browserLikeAgent(t.app);
    expect((await c.signIn(person.email, person.password!)).status).toBe(200);
    // Node reads header bytes as latin1, so "é" (0xE9) is one character that is two bytes in UTF-8.
    const twin = 'é' + c.csrf.slice(1);
    expect(twin.length).toBe(c.csrf.length);
    const signedIn = await c.agent.delete('/api/session').set('X-CSRF-Token', Buffer.from(twin, 'latin1').toString('latin1'));
    expect(signedIn.status).toBe(403);
    expect(signedIn.body.error.code).toBe('csrf_failed');
    const a = await browserLikeAgent(t.app);
    const anonymous = await a.agent.post('/api/password-resets').set('X-CSRF-Token', 'é' + a.csrf.slice(1)).send({ email: person.email });
    expect(anonymous.status).toBe(403);
  });

  it('no token, hash or CSRF value in server/ is compared with === or !==', async () => {
    // A grep of the server code for equality tests whose either side names a token, hash, CSRF value, MAC or signature.
    let out = '';
    try {
      out = execFileSync('grep', ['-rniE', '--include=*.ts', String.raw`(token|hash|csrf|mac|signature|secret)\w*\s*[!=]==|[!=]==\s*\w*(token|hash|csrf|mac|signature|secret)`, 'server'], {
        cwd: fileURLToPath(new URL('../..', import.meta.url)),
        encoding: 'utf8',
      });
    } catch (err) {
      if ((err as { status?: number }).status !== 1) throw err; // 1: grep found nothing
    }
    // The one left is idempotency's request_hash (a hash of a request body, not a secret).
    const lines = out.split('\n').filter(Boolean).filter((l) => !l.includes('.test.ts'));
    expect(lines.filter((l) => !/row\.request_hash !== requestHash/.test(l))).toEqual([]);
  });
});
