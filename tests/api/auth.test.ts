import { Writable } from 'node:stream';
import knexFactory from 'knex';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { knexConfig } from '../../server/db/knex';
import { buildClub, buildMember, buildUser } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, testConfig, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

describe('sign-in and sessions', () => {
  it('signs in with the right password, keeps the session across requests, and signs out', async () => {
    const club = await buildClub(t.db, { name: 'Elm Row Growers' });
    const person = await buildMember(t.db, { clubId: club.id, roles: ['coordinator', 'volunteer'] });
    const c = await browserLikeAgent(t.app);

    const res = await c.signIn(person.email.toUpperCase(), person.password!);
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: person.id, email: person.email });
    expect(res.body.user.clubs).toEqual([
      { clubId: club.id, clubName: 'Elm Row Growers', clubSlug: club.slug, roles: ['coordinator', 'volunteer'] },
    ]);
    expect(res.headers['set-cookie']?.[0]).toMatch(/tillwell\.sid=.*HttpOnly.*SameSite=Lax/i);

    const again = await c.get('/api/session');
    expect(again.body.user.id).toBe(person.id);

    await c.delete('/api/session').expect(204);
    const after = await c.get('/api/session');
    expect(after.body.user).toBeNull();
    expect(await t.db('session').whereRaw(`(sess->>'userId')::int = ?`, [person.id]).count()).toEqual([{ count: 0 }]);
  });

  it('gives a new session id at sign-in (no fixation)', async () => {
    const person = await buildUser(t.db);
    const other = await buildUser(t.db);
    const c = await browserLikeAgent(t.app);
    // Anonymous visitors have no stored session; the first sign-in makes one.
    expect(await t.db('session').pluck('sid')).toHaveLength(0);
    await c.signIn(person.email, person.password!);
    const before = await t.db('session').pluck('sid');
    expect(before).toHaveLength(1);
    await c.signIn(other.email, other.password!);
    const after = await t.db('session').pluck('sid');
    expect(after).toHaveLength(1);
    expect(after[0]).not.toBe(before[0]);
  });

  it('refuses a wrong password and an unknown address with the same 401', async () => {
    const person = await buildUser(t.db);
    const c = await browserLikeAgent(t.app);
    const wrong = await c.signIn(person.email, 'not-the-password');
    const unknown = await c.signIn('nobody@example.org', 'not-the-password');
    for (const r of [wrong, unknown]) {
      expect(r.status).toBe(401);
      expect(r.body).toEqual({ error: { code: 'unauthenticated', message: 'E-mail or password is wrong.' } });
    }
    expect((await c.get('/api/session')).body.user).toBeNull();
  });

  it('answers bad input with 400 and the field at fault, and refuses unknown fields', async () => {
    const c = await browserLikeAgent(t.app);
    const res = await c.post('/api/session', { email: 'not-an-address', password: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields).toEqual({ email: 'Enter a valid e-mail address', password: 'Enter your password' });

    const extra = await c.post('/api/session', { email: 'a@example.org', password: 'x', isAdmin: true });
    expect(extra.status).toBe(400);
    expect(extra.body.error.fields).toEqual({ isAdmin: 'Unknown field' });
  });

  it('refuses a state-changing request without the CSRF token', async () => {
    const person = await buildUser(t.db);
    const c = await browserLikeAgent(t.app);
    const noToken = await c.agent.post('/api/session').send({ email: person.email, password: person.password });
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe('csrf_failed');
    const badToken = await c.agent
      .post('/api/session')
      .set('X-CSRF-Token', 'x'.repeat(43))
      .send({ email: person.email, password: person.password });
    expect(badToken.status).toBe(403);
    expect((await c.get('/api/session')).body.user).toBeNull();
  });

  it('rate-limits repeated sign-in attempts with 429', async () => {
    const limited = setupTestApp({ SIGNIN_MAX_FAILURES_PER_ADDRESS: '3' });
    try {
      const c = await browserLikeAgent(limited.app);
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++) statuses.push((await c.signIn('someone@example.org', 'wrong-password')).status);
      expect(statuses).toEqual([401, 401, 401, 429]);
    } finally {
      await limited.close();
    }
  });

  it('sends security headers and a request id, and never a stack trace', async () => {
    const res = await (await browserLikeAgent(t.app)).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(res.headers['x-request-id']).toMatch(/^[\w-]+$/);
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();

    // A route that really fails: the public form's query on `sites` throws an internal error
    // (a db handle whose identifier hook throws), so the error handler's 500 path runs.
    const secret = 'connection to 10.9.8.7:5432 reset by peer (injected failure)';
    const config = testConfig();
    const failingDb = knexFactory({
      ...knexConfig(config.databaseUrl),
      wrapIdentifier: (value, origImpl) => {
        if (value === 'sites') throw new Error(secret);
        return origImpl(value);
      },
    });
    const logLines: string[] = [];
    const logDestination = new Writable({
      write(chunk, _encoding, done) {
        logLines.push(...String(chunk).split('\n').filter(Boolean));
        done();
      },
    });
    const failing = setupTestApp({ LOG_LEVEL: 'error' }, { db: failingDb, logDestination });
    try {
      const club = await buildClub(t.db, { slug: 'broken-pipe' });
      const boom = await (await browserLikeAgent(failing.app)).get(`/api/apply/${club.slug}`);
      expect(boom.status).toBe(500);
      const requestId = boom.headers['x-request-id'];
      expect(requestId).toMatch(/^[\w-]+$/);
      // Only the error shape and the request id: no stack, no message of the internal error.
      expect(boom.body).toEqual({
        error: { code: 'internal', message: 'Something went wrong on our side. Please try again.', requestId },
      });
      expect(boom.text).not.toContain('injected failure');
      expect(boom.text).not.toMatch(/\bat .*\.[cm]?[jt]s:\d+/);
      expect(boom.headers['content-security-policy']).toContain("default-src 'self'");
      expect(boom.headers['x-content-type-options']).toBe('nosniff');

      // The log line keeps what the body leaves out: the message and the stack, under the request id.
      type LogEntry = { msg?: string; requestId?: string; req?: { id?: string }; err?: { message?: string; stack?: string } };
      const entries = logLines.map((l) => JSON.parse(l) as LogEntry);
      const logged = entries.find((e) => e.msg === 'unhandled error');
      expect(logged, `log lines: ${logLines.join('\n')}`).toBeDefined();
      expect(logged!.requestId).toBe(requestId);
      expect(logged!.req?.id).toBe(requestId);
      expect(logged!.err?.message).toBe(secret);
      expect(logged!.err?.stack).toContain(`Error: ${secret}\n    at `);
      expect(logged!.err?.stack).toContain('wrapIdentifier');
    } finally {
      await failing.close();
    }
  });
});

describe('roles and clubs', () => {
  it('lets a coordinator list members, refuses a plot holder (403) and another club’s coordinator (403)', async () => {
    const clubA = await buildClub(t.db);
    const clubB = await buildClub(t.db);
    const coordA = await buildMember(t.db, { clubId: clubA.id, roles: ['coordinator'], user: { name: 'Ada Coord' } });
    const holderA = await buildMember(t.db, { clubId: clubA.id, roles: ['plot_holder'], user: { name: 'Ben Holder' } });
    const coordB = await buildMember(t.db, { clubId: clubB.id, roles: ['coordinator'] });

    const a = await browserLikeAgent(t.app);
    await a.signIn(coordA.email, coordA.password!);
    const list = await a.get(`/api/clubs/${clubA.id}/members`).expect(200);
    expect(list.body.total).toBe(2);
    expect(list.body.page).toBe(1);
    expect(list.body.items.map((m: { name: string; roles: string[] }) => [m.name, m.roles])).toEqual([
      ['Ada Coord', ['coordinator']],
      ['Ben Holder', ['plot_holder']],
    ]);

    const h = await browserLikeAgent(t.app);
    await h.signIn(holderA.email, holderA.password!);
    const refused = await h.get(`/api/clubs/${clubA.id}/members`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('forbidden');
    const inviteRefused = await h.post(`/api/clubs/${clubA.id}/invites`, {
      email: 'x@example.org',
      name: 'X',
      roles: ['coordinator'],
    });
    expect(inviteRefused.status).toBe(403);

    const b = await browserLikeAgent(t.app);
    await b.signIn(coordB.email, coordB.password!);
    expect((await b.get(`/api/clubs/${clubA.id}/members`)).status).toBe(403);
    expect(
      (await b.post(`/api/clubs/${clubA.id}/invites`, { email: 'y@example.org', name: 'Y', roles: ['volunteer'] })).status,
    ).toBe(403);
    expect(await t.db('invites').count()).toEqual([{ count: 0 }]);
  });

  it('answers 401 to a signed-out request on a club route', async () => {
    const club = await buildClub(t.db);
    const res = await (await browserLikeAgent(t.app)).get(`/api/clubs/${club.id}/members`);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('invitations', () => {
  it('invites by e-mail; the link sets a password, signs the person in and works only once', async () => {
    const club = await buildClub(t.db, { name: 'Quarry Gardens' });
    const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await browserLikeAgent(t.app);
    await c.signIn(coord.email, coord.password!);

    const since = Date.now();
    const created = await c.post(`/api/clubs/${club.id}/invites`, {
      email: 'New.Grower@Example.org',
      name: 'New Grower',
      roles: ['plot_holder', 'volunteer'],
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ email: 'new.grower@example.org', roles: ['plot_holder', 'volunteer'] });
    expect((await c.get(`/api/clubs/${club.id}/invites`)).body.total).toBe(1);

    const mail = await waitForMail(mailUrl(), { to: 'new.grower@example.org', after: since });
    expect(mail.subject).toBe("You're invited to Quarry Gardens on Tillwell");
    const link = new URL(extractLink(mail, '/invite'));
    const token = link.searchParams.get('token')!;
    expect(token.length).toBeGreaterThan(20);
    // Only a hash of the token is stored.
    expect(await t.db('invites').where({ token_hash: token }).count()).toEqual([{ count: 0 }]);

    const n = await browserLikeAgent(t.app);
    const preview = await n.get(`/api/invites/preview?token=${encodeURIComponent(token)}`).expect(200);
    expect(preview.body).toEqual({
      email: 'new.grower@example.org',
      name: 'New Grower',
      clubName: 'Quarry Gardens',
      roles: ['plot_holder', 'volunteer'],
      hasAccount: false,
    });
    const short = await n.post('/api/invites/accept', { token, name: 'New Grower', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBe('Use at least 10 characters');

    const accepted = await n.post('/api/invites/accept', { token, name: 'Nell Grower', password: 'sunflower-seeds-42' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user).toMatchObject({ name: 'Nell Grower', email: 'new.grower@example.org' });
    expect(accepted.body.user.clubs[0].roles).toEqual(['plot_holder', 'volunteer']);
    const hash = await t.db('users').where({ email: 'new.grower@example.org' }).first('password_hash');
    expect(hash.password_hash).toMatch(/^\$2[aby]\$1\d\$/); // bcrypt, cost 10 or more

    const reuse = await (await browserLikeAgent(t.app)).post('/api/invites/accept', {
      token,
      name: 'Someone Else',
      password: 'another-password-1',
    });
    expect(reuse.status).toBe(410);
    expect(reuse.body.error.code).toBe('gone');

    const fresh = await browserLikeAgent(t.app);
    expect((await fresh.signIn('new.grower@example.org', 'sunflower-seeds-42')).status).toBe(200);
  });

  it('refuses an expired invitation', async () => {
    const club = await buildClub(t.db);
    const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await browserLikeAgent(t.app);
    await c.signIn(coord.email, coord.password!);
    const since = Date.now();
    await c.post(`/api/clubs/${club.id}/invites`, { email: 'late@example.org', name: 'Late', roles: ['volunteer'] }).expect(201);
    const token = new URL(extractLink(await waitForMail(mailUrl(), { to: 'late@example.org', after: since }), '/invite'))
      .searchParams.get('token')!;
    await t.db('invites').update({ expires_at: new Date(Date.now() - 1000) });
    const res = await (await browserLikeAgent(t.app)).get(`/api/invites/preview?token=${encodeURIComponent(token)}`);
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/expired/);
  });

  it('invites someone an import added without a password, even though they hold the roles', async () => {
    const club = await buildClub(t.db);
    const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const imported = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { password: null } });
    const c = await browserLikeAgent(t.app);
    await c.signIn(coord.email, coord.password!);
    const res = await c.post(`/api/clubs/${club.id}/invites`, { email: imported.email, name: 'Imported', roles: ['plot_holder'] });
    expect(res.status).toBe(201);
  });

  it('refuses to invite someone who already holds those roles (409 with the field)', async () => {
    const club = await buildClub(t.db);
    const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
    const c = await browserLikeAgent(t.app);
    await c.signIn(coord.email, coord.password!);
    const res = await c.post(`/api/clubs/${club.id}/invites`, { email: holder.email, name: 'Again', roles: ['plot_holder'] });
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual({ email: 'Already a member with these roles' });
  });
});

describe('password reset', () => {
  it('e-mails a single-use link; the new password works, the old one and the reused link do not', async () => {
    const person = await buildUser(t.db, { email: 'forgetful@example.org', password: 'old-password-123' });
    const c = await browserLikeAgent(t.app);
    const since = Date.now();
    const asked = await c.post('/api/password-resets', { email: 'Forgetful@example.org' });
    expect(asked.status).toBe(202);
    const unknown = await c.post('/api/password-resets', { email: 'nobody-here@example.org' });
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(asked.body); // the reply never tells whether an account exists

    const mail = await waitForMail(mailUrl(), { to: person.email, after: since });
    expect(mail.subject).toBe('Reset your Tillwell password');
    const token = new URL(extractLink(mail, '/reset-password')).searchParams.get('token')!;

    const weak = await c.post('/api/password-resets/complete', { token, password: 'short' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields).toEqual({ password: 'Use at least 10 characters' });

    await c.post('/api/password-resets/complete', { token, password: 'brand-new-password-9' }).expect(204);
    const reuse = await c.post('/api/password-resets/complete', { token, password: 'yet-another-pass-1' });
    expect(reuse.status).toBe(410);

    const s = await browserLikeAgent(t.app);
    expect((await s.signIn(person.email, 'old-password-123')).status).toBe(401);
    expect((await s.signIn(person.email, 'brand-new-password-9')).status).toBe(200);
  });

  it('refuses an expired reset link', async () => {
    const person = await buildUser(t.db, { email: 'slow@example.org' });
    const c = await browserLikeAgent(t.app);
    const since = Date.now();
    await c.post('/api/password-resets', { email: person.email }).expect(202);
    const token = new URL(extractLink(await waitForMail(mailUrl(), { to: person.email, after: since }), '/reset-password'))
      .searchParams.get('token')!;
    await t.db('password_resets').update({ expires_at: new Date(Date.now() - 1000) });
    const res = await c.post('/api/password-resets/complete', { token, password: 'brand-new-password-9' });
    expect(res.status).toBe(410);
    expect((await (await browserLikeAgent(t.app)).signIn(person.email, person.password!)).status).toBe(200);
  });
});
