import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { createDb } from '../../server/db/knex';
import { enqueueMail } from '../../server/services/outbox';
import { newToken } from '../../server/services/tokens';
import { buildApplication, buildClub, buildMember } from '../factories';
import { mailUrl, truncateAll } from '../helpers/app';
import { extractLink, listMail, waitForMail } from '../helpers/inbox';
import { CookieClient, runningServerPids, SHARED_SESSION_SECRET, startServerProcess, stopAllServerProcesses, type ServerProcess } from '../helpers/server-process';
import { useMailSealSecret } from '../../server/mail/seal';

// Mail this test puts in the outbox is sealed under the servers' key, as their own requests would seal it.
useMailSealSecret(SHARED_SESSION_SECRET);

// Two real server processes (server/index.ts) on one database and one session secret, as behind a
// load balancer. Everything a person does may land on either; the jobs run in both.

const db = createDb(inject('databaseUrl'));
// AUTH_RATE_LIMIT=10 makes the e-mailed-link limit 30 per address per 15 minutes (server/routes/shifts.ts: × 3).
const ENV = { AUTH_RATE_LIMIT: '10', TRUST_PROXY: 'true' };
const LINK_LIMIT = 30; // computed: AUTH_RATE_LIMIT 10 × 3
const ZONE = 'Europe/London';
const STARTUP_MAILS = 20;

let s1: ServerProcess;
let s2: ServerProcess;
/** The database's clock just before the servers started (pg-boss stamps its jobs with it). */
let startedAt: Date;
const before = { recipients: [] as string[], offerId: 0, plotId: 0 };
/** Both servers in turn: request i goes to server (i mod 2) + 1. */
const either = (i: number) => (i % 2 === 0 ? s1.url : s2.url);

beforeAll(async () => {
  await truncateAll(db);
  // Waiting before either server runs, so both servers' start-up jobs (a mail run and a deadline sweep each) meet them.
  for (let i = 0; i < STARTUP_MAILS; i++) {
    const to = `startup-${i}@example.org`;
    before.recipients.push(to);
    await enqueueMail(db, { clubId: null, kind: 'password_reset' }, { to, subject: `Waiting before start ${i}`, text: 'Sent once.', html: '<p>Sent once.</p>' });
  }
  const club = await buildClub(db, { name: 'Overdue Growers' });
  const [season] = await db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
  const [site] = await db('sites').insert({ club_id: club.id, name: 'Low field', latitude: 52, longitude: -1, time_zone: ZONE, width_m: 20, length_m: 20 }).returning('id');
  const [plot] = await db('plots').insert({ site_id: site.id, label: 'L-1', x_m: 0, y_m: 0, width_m: 3, length_m: 3 }).returning('id');
  const app = await buildApplication(db, { clubId: club.id, status: 'offered' });
  const [offer] = await db('offers')
    .insert({ season_id: season.id, plot_id: plot.id, application_id: app.id, token_hash: newToken().hash, deadline: new Date(Date.now() - 60_000) })
    .returning('id');
  before.offerId = offer.id;
  before.plotId = plot.id;
  startedAt = (await db.raw('select now() as now')).rows[0].now;
  [s1, s2] = await Promise.all([startServerProcess(ENV), startServerProcess(ENV)]);
}, 200_000);

afterAll(async () => {
  await stopAllServerProcesses();
  await db.destroy();
  expect(runningServerPids()).toEqual([]);
}, 60_000);

async function until<T>(what: string, read: () => Promise<T>, ok: (v: T) => boolean, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (ok(v)) return v;
    if (Date.now() > deadline) throw new Error(`${what}: still ${JSON.stringify(v)} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

describe('sessions across two servers', () => {
  it('a sign-in on server 1 is the same session on server 2, and signing out on 2 ends it on 1', async () => {
    const club = await buildClub(db);
    const person = await buildMember(db, { clubId: club.id, roles: ['plot_holder'] });
    const c = new CookieClient('198.51.100.10');
    // The anonymous CSRF token (a signed cookie) comes from server 2 and is accepted by server 1.
    expect(await c.session(s2.url)).toBeNull();
    const signedIn = await c.signIn(s1.url, person.email, person.password!);
    expect(signedIn.status, JSON.stringify(signedIn.body)).toBe(200);
    expect((await c.session(s2.url))?.id).toBe(person.id);
    // A state-changing request on server 2 with the session's token.
    const chosen = await c.request(s2.url, 'PUT', '/api/session/club', { clubId: club.id });
    expect(chosen.status, JSON.stringify(chosen.body)).toBeLessThan(300);
    expect((await db('users').where({ id: person.id }).first('last_club_id')).last_club_id).toBe(club.id);

    const oldCookie = c.cookieHeader();
    expect((await c.delete(s2.url, '/api/session')).status).toBe(204);
    const afterOut = await fetch(`${s1.url}/api/session`, { headers: { Cookie: oldCookie } });
    expect(afterOut.status).toBe(200);
    expect((await afterOut.json()).user).toBeNull();
    expect(await db('session').whereRaw("sess->>'userId' = ?", [String(person.id)]).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});

describe('jobs with two servers running', () => {
  it('send each outbox e-mail waiting at start once, and lapse the overdue offer once', async () => {
    const rows = await until(
      'outbox rows waiting at start',
      () => db('mail_outbox').whereIn('to_address', before.recipients).select('status', 'attempts'),
      (r) => r.length === STARTUP_MAILS && r.every((x) => x.status === 'sent'),
      60_000,
    );
    expect(rows.map((r) => r.attempts)).toEqual(Array(STARTUP_MAILS).fill(1));
    const copies = await Promise.all(before.recipients.map(async (to) => (await listMail(mailUrl(), { to })).length));
    expect(copies).toEqual(Array(STARTUP_MAILS).fill(1));

    expect((await db('offers').where({ id: before.offerId }).first('status')).status).toBe('lapsed');
    const lapsedEvents = await db('plot_events').where({ plot_id: before.plotId, kind: 'offer_lapsed' }).count({ n: '*' });
    expect(lapsedEvents).toEqual([{ n: 1 }]);
    console.info(`[faults] startup: ${STARTUP_MAILS} outbox rows sent, inbox copies per recipient ${[...new Set(copies)].join(',')}, offer_lapsed events ${lapsedEvents[0].n}`);
  });

  it('the minute job sends a mail put in the outbox while both run once; each schedule slot makes one job', async () => {
    const to = 'cron-once@example.org';
    // Written straight to the outbox, with no kick after it: only the minute job (pg-boss cron) sends it.
    const id = await enqueueMail(db, { clubId: null, kind: 'password_reset' }, { to, subject: 'Sent by the minute job', text: 'Once.', html: '<p>Once.</p>' });
    const row = await until('the cron-sent row', () => db('mail_outbox').where({ id }).first('status', 'attempts'), (r) => r.status === 'sent', 150_000);
    expect(row.attempts).toBe(1);
    // Give a second sender the chance to send it again before counting.
    await new Promise((r) => setTimeout(r, 3_000));
    expect((await listMail(mailUrl(), { to })).length).toBe(1);

    const jobs = (name: string) =>
      db.raw(
        `select singleton_key, singleton_on, state, created_on, completed_on from pgboss.job where name = ?
         union all select singleton_key, singleton_on, state, created_on, completed_on from pgboss.archive where name = ?`,
        [name, name],
      );
    // pg-boss turns each cron slot into one "__pgboss__send-it" job (singleton per schedule name and minute), whose worker sends the real job.
    const slots = await until(
      'completed schedule slots of mail-send',
      async () => {
        const sendIt = (await jobs('__pgboss__send-it')).rows.filter((j: { singleton_key: string; completed_on: Date | null }) => j.singleton_key === 'mail-send' && j.completed_on && j.completed_on >= startedAt);
        const made = (await jobs('mail-send')).rows.filter((j: { created_on: Date }) => j.created_on >= startedAt);
        return { slots: sendIt.length, mailJobs: made.length, perSlot: countBy(sendIt.map((j: { singleton_on: Date }) => j.singleton_on.toISOString())) };
      },
      // computed: one job per slot plus one start-up run per server (server/jobs/index.ts sends one at start) = slots + 2
      (v) => v.slots >= 1 && v.mailJobs === v.slots + 2,
      30_000,
    );
    expect(Object.values(slots.perSlot).every((n) => n === 1)).toBe(true);
    const sweeps = (await jobs('__pgboss__send-it')).rows.filter((j: { singleton_key: string; created_on: Date }) => j.singleton_key === 'deadline-sweep' && j.created_on >= startedAt);
    const sweepSlots = countBy(sweeps.map((j: { singleton_on: Date }) => j.singleton_on.toISOString()));
    expect(Object.values(sweepSlots).every((n) => n === 1)).toBe(true);
    console.info(`[faults] cron: mail sent with attempts ${row.attempts}, inbox copies 1; mail-send slots ${slots.slots}, mail-send jobs ${slots.mailJobs}, deadline-sweep slots ${Object.keys(sweepSlots).length} (max jobs per slot ${Math.max(0, ...Object.values(sweepSlots))})`);
  }, 200_000);
});

function countBy(keys: string[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const k of keys) out[k] = (out[k] ?? 0) + 1;
  return out;
}

describe('races across both servers', () => {
  it('40 claim links for a shift of 3 places, split across the servers: exactly 3 taken, 37 refused with 409, no 5xx', async () => {
    const club = await buildClub(db, { name: 'Two Server Growers' });
    await db('clubs').where({ id: club.id }).update({ time_zone: ZONE });
    const [site] = await db('sites').insert({ club_id: club.id, name: 'Race field', latitude: 51.5, longitude: -0.1, time_zone: ZONE, width_m: 30, length_m: 20 }).returning('id');
    const coordinator = await buildMember(db, { clubId: club.id, roles: ['coordinator'] });
    const co = new CookieClient('198.51.100.20');
    expect((await co.signIn(s1.url, coordinator.email, coordinator.password!)).status).toBe(200);
    const day = addCalendarDays(localToday(ZONE), 3);
    const made = await co.post(s1.url, `/api/clubs/${club.id}/shifts`, {
      siteId: site.id, title: 'Race watering', kind: 'water', date: day, startTime: '18:00', endTime: '19:00', capacity: 3, estHours: 1, instructions: '', taskIds: [],
    });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const shiftId = made.body.id as number;
    const N = 40;
    const tokens: string[] = [];
    for (let i = 0; i < N; i++) {
      const v = await buildMember(db, { clubId: club.id, roles: ['volunteer'] });
      const { token, hash } = newToken();
      await db('shift_links').insert({ shift_id: shiftId, user_id: v.id, purpose: 'claim', token_hash: hash, expires_at: new Date(Date.now() + 3 * 86_400_000) });
      tokens.push(token);
    }
    // One phone each (its own address), each with the anonymous token from the server it will post to.
    const clients = tokens.map((_, i) => new CookieClient(`203.0.113.${i + 1}`));
    await Promise.all(clients.map((c, i) => c.session(either(i))));
    const answers = await Promise.all(clients.map((c, i) => c.post(either(i), '/api/shift-links/claim', { token: tokens[i] })));
    const codes = answers.map((a) => a.status);
    expect(codes.filter((c) => c >= 500)).toEqual([]);
    expect([...codes].sort()).toEqual([...Array(3).fill(200), ...Array(N - 3).fill(409)]);
    for (const refused of answers.filter((a) => a.status === 409)) expect(refused.body.error?.message).toMatch(/Already covered/);
    const taken = await db('shift_claims').where({ shift_id: shiftId, status: 'taken' }).count({ n: '*' });
    expect(taken).toEqual([{ n: 3 }]);
    expect(await db('mail_outbox').where({ kind: 'shift_taken', club_id: club.id }).count({ n: '*' })).toEqual([{ n: 3 }]);
    const okOn = [0, 1].map((k) => codes.filter((c, i) => c === 200 && i % 2 === k).length);
    console.info(`[faults] claim race: ${codes.filter((c) => c === 200).length}×200 (server 1: ${okOn[0]}, server 2: ${okOn[1]}), ${codes.filter((c) => c === 409).length}×409, 5xx ${codes.filter((c) => c >= 500).length}; taken rows ${taken[0].n}`);
  });

  it('10 offers of one plot and then 10 accepts of its link, split across the servers: one winner each, the rest refused', async () => {
    const club = await buildClub(db, { name: 'Offer Race Growers' });
    await db('fee_schedules').insert({ club_id: club.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
    const coordinator = await buildMember(db, { clubId: club.id, roles: ['coordinator'] });
    const co = new CookieClient('198.51.100.30');
    expect((await co.signIn(s1.url, coordinator.email, coordinator.password!)).status).toBe(200);
    const [site] = await db('sites').insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: ZONE, width_m: 30, length_m: 20 }).returning('id');
    const [plot] = await db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    const opened = await co.post(s2.url, `/api/clubs/${club.id}/seasons`, { year: 2027 });
    expect(opened.status, JSON.stringify(opened.body)).toBe(201);
    const seasonId = opened.body.season?.id as number;
    const N = 10;
    const people = [];
    for (let i = 0; i < N; i++) people.push(await buildApplication(db, { clubId: club.id, name: `Racer ${i}`, email: `two-servers-racer-${i}@example.org` }));
    const since = Date.now();
    const offers = await Promise.all(people.map((p, i) => co.post(either(i), `/api/seasons/${seasonId}/offers`, { plotId: plot.id, applicationId: p.id })));
    const offerCodes = offers.map((o) => o.status);
    expect([...offerCodes].sort()).toEqual([201, ...Array(N - 1).fill(409)]);
    for (const refused of offers.filter((o) => o.status === 409)) expect(refused.body.error?.message).toMatch(/already offered|Someone else has just offered/);
    const winner = people[offers.findIndex((o) => o.status === 201)];
    const mail = await waitForMail(mailUrl(), { to: winner.email, after: since, timeoutMs: 30_000 });
    const token = new URL(extractLink(mail, '/respond/offer')).searchParams.get('token')!;
    const anon = new CookieClient('198.51.100.31');
    await anon.session(s1.url);
    const accepts = await Promise.all(Array.from({ length: N }, (_, i) => anon.post(either(i), '/api/offers/accept', { token })));
    const acceptCodes = accepts.map((a) => a.status);
    expect([...acceptCodes].sort()).toEqual([200, ...Array(N - 1).fill(410)]);
    expect(await db('allocations').where({ season_id: seasonId, plot_id: plot.id, status: 'active' }).count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(await db('fees').where({ season_id: seasonId, plot_id: plot.id }).count({ n: '*' })).toEqual([{ n: 1 }]);
    console.info(`[faults] offer race: offers ${JSON.stringify(countBy(offerCodes.map(String)))}, accepts ${JSON.stringify(countBy(acceptCodes.map(String)))}`);
  });
});

describe('rate limits shared by the servers', () => {
  it('the link route answers 429 at the combined limit when the hits alternate between the servers', async () => {
    const club = await buildClub(db);
    const [site] = await db('sites').insert({ club_id: club.id, name: 'Limit field', latitude: 51.5, longitude: -0.1, time_zone: ZONE, width_m: 30, length_m: 20 }).returning('id');
    const v = await buildMember(db, { clubId: club.id, roles: ['volunteer'] });
    const day = addCalendarDays(localToday(ZONE), 3);
    const [shift] = await db('shifts')
      .insert({ club_id: club.id, site_id: site.id, title: 'Limit shift', kind: 'water', on_date: day, start_time: '18:00', end_time: '19:00', starts_at: new Date(Date.now() + 3 * 86_400_000), ends_at: new Date(Date.now() + 3 * 86_400_000 + 3_600_000), capacity: 2, est_hours: 1, instructions: '', created_by_user_id: v.id })
      .returning('id');
    const { token, hash } = newToken();
    await db('shift_links').insert({ shift_id: shift.id, user_id: v.id, purpose: 'claim', token_hash: hash, expires_at: new Date(Date.now() + 86_400_000) });
    const extra = 6;
    const answers = [];
    for (let i = 0; i < LINK_LIMIT + extra; i++) {
      answers.push(await fetch(`${either(i)}/api/shift-links/preview?token=${token}`, { headers: { 'X-Forwarded-For': '192.0.2.77' } }));
    }
    const codes = answers.map((a) => a.status);
    expect(codes).toEqual([...Array(LINK_LIMIT).fill(200), ...Array(extra).fill(429)]);
    const refused = answers[LINK_LIMIT];
    expect(await refused.json()).toEqual({ error: { code: 'rate_limited', message: 'Too many attempts. Wait a few minutes and try again.' } });
    // IETF draft-8 RateLimit headers (express-rate-limit's standardHeaders: 'draft-8'): q is the limit, r what remains.
    expect(refused.headers.get('ratelimit-policy')).toMatch(new RegExp(`q=${LINK_LIMIT}; w=900`)); // computed: 15 min × 60 = 900 s
    expect(refused.headers.get('ratelimit')).toMatch(/r=0/);
    expect(answers[0].headers.get('ratelimit')).toMatch(new RegExp(`r=${LINK_LIMIT - 1}`));
    // Another address is not held back by it, on either server.
    expect((await fetch(`${s2.url}/api/shift-links/preview?token=${token}`, { headers: { 'X-Forwarded-For': '192.0.2.78' } })).status).toBe(200);
    console.info(`[faults] shared limit: ${codes.filter((c) => c === 200).length}×200 then ${codes.filter((c) => c === 429).length}×429 (429s on server 1: ${codes.filter((c, i) => c === 429 && i % 2 === 0).length}, server 2: ${codes.filter((c, i) => c === 429 && i % 2 === 1).length})`);
  });
});
