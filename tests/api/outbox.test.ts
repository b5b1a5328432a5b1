import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createDb } from '../../server/db/knex';
import { startJobs } from '../../server/jobs';
import { createMailer, type Mailer } from '../../server/mail/mailer';
import { enqueueMail, mailIdle, MAX_ATTEMPTS, retryDelayMs, sendDueMail } from '../../server/services/outbox';
import { freePort } from '../../scripts/lib/postgres';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, mailUrl, testConfig, truncateAll } from '../helpers/app';
import { signedInMember } from '../helpers/api';
import { extractLink, listMail, waitForMail } from '../helpers/inbox';

// The app's mailer is switched between the test inbox and a closed port, as a mail server going
// down and coming back would; everything else is the real app on the throwaway database.
const config = testConfig();
const db = createDb(config.databaseUrl);
const reachable = createMailer(config.smtpUrl, config.mailFrom);
const unreachable = createMailer(`smtp://127.0.0.1:${await freePort()}`, config.mailFrom);
let smtpUp = true;
const mailer: Mailer = {
  send: (mail) => (smtpUp ? reachable : unreachable).send(mail),
  close() {
    reachable.close();
    unreachable.close();
  },
};
const built = createApp({ db, mailer, config });
const t = { db, app: built.app };

afterAll(async () => {
  await built.close();
  await mailIdle();
  mailer.close();
  await db.destroy();
});
beforeEach(async () => {
  smtpUp = true;
  await truncateAll(db);
});

const DAY = 24 * 3600 * 1000;
const MINUTE = 60 * 1000;

/** A club with a signed-in coordinator, a fee schedule and one site with four plots. */
async function club() {
  const c = await buildClub(db, { name: 'Rowan Lane Growers' });
  await db('fee_schedules').insert({ club_id: c.id, basis: 'area', area_unit: 'm2', rate_minor_per_area: 250, deposit_minor: 1500 });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const [site] = await db('sites')
    .insert({ club_id: c.id, name: 'Lower field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
    .returning('id');
  const plots: Array<{ id: number; label: string }> = await db('plots')
    .insert(['B-1', 'B-2', 'B-3', 'B-4'].map((label, i) => ({ site_id: site.id, label, x_m: i * 3.9, y_m: 0, width_m: 3, length_m: 6 })))
    .returning(['id', 'label']);
  return { club: c, coordinator, plots };
}

const outboxRows = () => db('mail_outbox').orderBy('id').select();

describe('mail written to the outbox with the change that causes it', () => {
  it('opens a season while the mail server is down, keeps all three renewal e-mails and sends them once it is back', async () => {
    const { club: c, coordinator, plots } = await club();
    const [last] = await db('seasons').insert({ club_id: c.id, year: 2026 }).returning('id');
    const holders = [];
    for (const [i, name] of ['Ada', 'Bo', 'Cai'].entries()) {
      const h = await buildMember(db, { clubId: c.id, roles: ['plot_holder'], user: { name, email: `${name.toLowerCase()}@renew.example.org` } });
      await db('allocations').insert({ season_id: last.id, plot_id: plots[i].id, user_id: h.id, source: 'offer' });
      holders.push(h);
    }

    smtpUp = false;
    const since = Date.now();
    const res = await coordinator.post(`/api/clubs/${c.id}/seasons`, { year: 2027, renewalDeadline: new Date(Date.now() + 14 * DAY).toISOString() });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.renewalsSent).toBe(3);
    expect(await db('renewals').count({ n: '*' })).toEqual([{ n: 3 }]);
    await mailIdle(); // the try right after the commit has failed by now

    const waiting = await outboxRows();
    expect(waiting.map((r) => r.to_address).sort()).toEqual(holders.map((h) => h.email).sort());
    for (const r of waiting) {
      expect(r).toMatchObject({ club_id: c.id, kind: 'renewal', status: 'waiting', attempts: 1, sent_at: null });
      expect(r.last_error).toMatch(/ECONNREFUSED/);
      expect(r.next_attempt_at.getTime()).toBeGreaterThan(Date.now() + 50_000); // one minute after the failed try
    }

    smtpUp = true;
    // Not due yet: the sender keeps to the wait.
    expect(await sendDueMail(db, mailer, new Date())).toEqual({ sent: 0, retrying: 0, failed: 0 });
    expect(await sendDueMail(db, mailer, new Date(Date.now() + 2 * MINUTE))).toEqual({ sent: 3, retrying: 0, failed: 0 });
    for (const h of holders) {
      const mail = await waitForMail(mailUrl(), { to: h.email, after: since });
      expect(mail.subject).toContain('2027');
      expect(extractLink(mail, '/respond/renewal')).toContain('token=');
    }
    expect((await outboxRows()).map((r) => [r.status, r.attempts])).toEqual([
      ['sent', 2],
      ['sent', 2],
      ['sent', 2],
    ]);
    // Sent once: a later run sends nothing again.
    expect(await sendDueMail(db, mailer, new Date(Date.now() + DAY))).toEqual({ sent: 0, retrying: 0, failed: 0 });
  });

  it('keeps an offer e-mail made while the mail server is down, shows it failed after the last try, and resends it', async () => {
    const { club: c, coordinator, plots } = await club();
    const [season] = await db('seasons').insert({ club_id: c.id, year: 2027 }).returning('id');
    const [app] = await db('applications').insert({ club_id: c.id, name: 'Dana Waiting', email: 'dana@offer.example.org' }).returning('id');

    smtpUp = false;
    const res = await coordinator.post(`/api/seasons/${season.id}/offers`, { plotId: plots[0].id, applicationId: app.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    await mailIdle();
    const [row] = await outboxRows();
    expect(row).toMatchObject({ club_id: c.id, kind: 'offer', to_address: 'dana@offer.example.org', status: 'waiting', attempts: 1 });

    // Each further try waits twice as long as the one before: 1, 2, 4 … 64 minutes (our own rule).
    expect(Array.from({ length: MAX_ATTEMPTS - 1 }, (_, i) => retryDelayMs(i + 1) / MINUTE)).toEqual([1, 2, 4, 8, 16, 32, 64]);
    for (let attempt = 2; attempt <= MAX_ATTEMPTS; attempt++) {
      const due = (await db('mail_outbox').where({ id: row.id }).first('next_attempt_at')).next_attempt_at as Date;
      expect(await sendDueMail(db, mailer, new Date(due.getTime() - 1000))).toEqual({ sent: 0, retrying: 0, failed: 0 });
      const done = await sendDueMail(db, mailer, due);
      expect(done).toEqual(attempt < MAX_ATTEMPTS ? { sent: 0, retrying: 1, failed: 0 } : { sent: 0, retrying: 0, failed: 1 });
    }
    expect(await db('mail_outbox').where({ id: row.id }).first()).toMatchObject({ status: 'failed', attempts: MAX_ATTEMPTS });
    // A failed message is left alone by the sender.
    expect(await sendDueMail(db, mailer, new Date(Date.now() + 30 * DAY))).toEqual({ sent: 0, retrying: 0, failed: 0 });

    // Account mail (a password link) has no club: no coordinator lists it.
    const visitor = await browserLikeAgent(t.app);
    expect((await visitor.post('/api/password-resets', { email: coordinator.person.email })).status).toBe(202);
    // The reset request answers before its row is written (same reply whether or not the account exists): poll for it.
    const until = Date.now() + 5000;
    while ((await db('mail_outbox').where({ kind: 'password_reset' })).length === 0 && Date.now() < until) {
      await new Promise((r) => setTimeout(r, 50));
    }
    await mailIdle();
    expect(await db('mail_outbox').where({ kind: 'password_reset' }).first()).toMatchObject({ club_id: null });

    const list = await coordinator.get(`/api/clubs/${c.id}/outbox`);
    expect(list.status).toBe(200);
    expect(list.body).toMatchObject({ page: 1, total: 1, failed: 1 });
    expect(list.body.items).toEqual([
      expect.objectContaining({ id: row.id, kind: 'offer', to: 'dana@offer.example.org', status: 'failed', attempts: MAX_ATTEMPTS, sentAt: null }),
    ]);
    expect(list.body.items[0].lastError).toMatch(/ECONNREFUSED/);
    expect(list.body.items[0].subject).toBe(row.subject);
    expect((await coordinator.get(`/api/clubs/${c.id}/outbox?status=sent`)).body).toMatchObject({ items: [], total: 0, failed: 1 });
    expect((await coordinator.get(`/api/clubs/${c.id}/outbox?status=nonsense`)).body.error).toMatchObject({
      code: 'validation_failed',
      fields: { status: expect.any(String) },
    });

    // Only this club's coordinators see it or resend it.
    const holder = await signedInMember(t, c.id, ['plot_holder']);
    expect((await holder.get(`/api/clubs/${c.id}/outbox`)).status).toBe(403);
    expect((await holder.post(`/api/clubs/${c.id}/outbox/${row.id}/resend`)).status).toBe(403);
    const other = await buildClub(db);
    const otherCoordinator = await signedInMember(t, other.id, ['coordinator']);
    expect((await otherCoordinator.get(`/api/clubs/${c.id}/outbox`)).status).toBe(403);
    expect((await otherCoordinator.get(`/api/clubs/${other.id}/outbox`)).body).toMatchObject({ items: [], total: 0 });
    expect((await otherCoordinator.post(`/api/clubs/${other.id}/outbox/${row.id}/resend`)).status).toBe(404);

    smtpUp = true;
    const since = Date.now();
    const resent = await coordinator.post(`/api/clubs/${c.id}/outbox/${row.id}/resend`);
    expect(resent.status, JSON.stringify(resent.body)).toBe(200);
    expect(resent.body).toMatchObject({ id: row.id, status: 'waiting', attempts: 0 });
    const mail = await waitForMail(mailUrl(), { to: 'dana@offer.example.org', after: since });
    expect(mail.subject).toBe(row.subject);
    expect(extractLink(mail, '/respond/offer')).toContain('token=');
    await mailIdle();
    expect(await db('mail_outbox').where({ id: row.id }).first()).toMatchObject({ status: 'sent', attempts: 1, last_error: null });
    expect((await listMail(mailUrl(), { to: 'dana@offer.example.org' })).filter((m) => Date.parse(m.receivedAt) >= since)).toHaveLength(1);
    // Only a failed message can be sent again.
    expect((await coordinator.post(`/api/clubs/${c.id}/outbox/${row.id}/resend`)).status).toBe(409);
  });

  it("counts a club message's copies as delivered only once the mail server has taken them", async () => {
    const { club: c, coordinator } = await club();
    for (const name of ['Eve', 'Fen']) {
      await buildMember(db, { clubId: c.id, roles: ['volunteer'], user: { name, email: `${name.toLowerCase()}@news.example.org` } });
    }
    smtpUp = false;
    const since = Date.now();
    const res = await coordinator.post(`/api/clubs/${c.id}/mailings`, { subject: 'Seed swap', body: 'Bring spare seeds on Sunday.', audience: { kind: 'all_members' } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ recipients: 3, sent: 3, skipped: 0 }); // the coordinator, Eve and Fen
    await mailIdle();
    const listed = async () => (await coordinator.get(`/api/clubs/${c.id}/mailings`)).body.items[0];
    expect(await listed()).toMatchObject({ subject: 'Seed swap', recipientCount: 3, sentCount: 0 });
    expect(await db('mail_outbox').where({ mailing_id: res.body.id, status: 'waiting' }).count({ n: '*' })).toEqual([{ n: 3 }]);

    smtpUp = true;
    expect(await sendDueMail(db, mailer, new Date(Date.now() + 2 * MINUTE))).toMatchObject({ sent: 3 });
    await waitForMail(mailUrl(), { to: 'fen@news.example.org', subject: 'Seed swap', after: since });
    expect(await listed()).toMatchObject({ recipientCount: 3, sentCount: 3 });
  });

  it('sends each message once when two senders run at the same time', async () => {
    const c = await buildClub(db);
    for (let i = 0; i < 6; i++) {
      await enqueueMail(db, { clubId: c.id, kind: 'club_news' }, { to: `p${i}@race.example.org`, subject: `Copy ${i}`, text: 'Hi', html: '<p>Hi</p>' });
    }
    const handed: string[] = [];
    // A transport that takes a moment, as a real SMTP exchange does, so the two senders overlap.
    const slow: Mailer = {
      async send(mail) {
        handed.push(mail.to);
        await new Promise((r) => setTimeout(r, 30));
      },
      close() {},
    };
    const later = new Date(Date.now() + MINUTE);
    const [a, b] = await Promise.all([sendDueMail(db, slow, later), sendDueMail(db, slow, later)]);
    expect(a.sent + b.sent).toBe(6);
    expect(a.sent).toBeGreaterThan(0);
    expect(b.sent).toBeGreaterThan(0);
    expect(handed.sort()).toEqual(Array.from({ length: 6 }, (_, i) => `p${i}@race.example.org`).sort());
  });

  it('sends waiting mail from the job queue, so mail left when a server stopped still goes', async () => {
    const c = await buildClub(db);
    const since = Date.now();
    await enqueueMail(db, { clubId: c.id, kind: 'club_news' }, { to: 'left@queue.example.org', subject: 'Left in the outbox', text: 'Hello', html: '<p>Hello</p>' });
    const jobs = await startJobs(config.databaseUrl, db, mailer, { info: () => {}, error: () => {} });
    try {
      const mail = await waitForMail(mailUrl(), { to: 'left@queue.example.org', after: since, timeoutMs: 20_000 });
      expect(mail.subject).toBe('Left in the outbox');
    } finally {
      await jobs.stop();
    }
  });
});
