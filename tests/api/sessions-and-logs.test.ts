import crypto from 'node:crypto';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { buildClub, buildMember, buildUser } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

// Every line the request logger writes in this file lands here.
const captured: string[] = [];
const t = setupTestApp({ LOG_LEVEL: 'info' }, { logDestination: { write: (line: string) => void captured.push(line) } });
afterAll(() => t.close());
beforeEach(async () => {
  await truncateAll(t.db);
  captured.length = 0;
});

const sessionRows = async () => Number((await t.db('session').count({ n: '*' }))[0].n);
const sidOf = (cookies: string[] | string | undefined) =>
  ([] as string[]).concat(cookies ?? []).map((c) => /tillwell\.sid=([^;]+)/.exec(c)?.[1]).find(Boolean);

describe('the request log', () => {
  it('holds no session cookie, CSRF token or password, and one short line per request', async () => {
    const club = await buildClub(t.db);
    const person = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await browserLikeAgent(t.app);
    const anonymousCsrf = c.csrf;
    const signedIn = await c.signIn(person.email, person.password!);
    expect(signedIn.status).toBe(200);
    const sid = sidOf(signedIn.headers['set-cookie']);
    expect(sid).toBeTruthy();
    await c.get(`/api/clubs/${club.id}/members`).expect(200);
    await c.get('/api/session').expect(200);
    await c.patch(`/api/clubs/${club.id}`, { name: 'Renamed Growers' });
    await c.signIn(person.email, 'a-wrong-password-typed');

    const log = captured.join('');
    expect(captured.length).toBeGreaterThanOrEqual(6); // one line per request above
    const sidValue = decodeURIComponent(sid!);
    for (const secret of [sid!, sidValue, sidValue.replace(/^s:/, '').split('.')[0], anonymousCsrf, c.csrf, person.password!, 'a-wrong-password-typed']) {
      expect(log, `log holds ${secret}`).not.toContain(secret);
    }
    expect(log).not.toMatch(/set-cookie|"cookie"|x-csrf-token/i);
    const lines = captured.map((l) => JSON.parse(l));
    const done = lines.filter((l) => l.msg === 'request completed');
    expect(done.length).toBeGreaterThanOrEqual(6);
    for (const l of done) {
      expect(Object.keys(l.res)).toEqual(['statusCode']);
      expect(Object.keys(l.req).sort()).toEqual(['id', 'method', 'url']);
    }
  });
});

describe('the request log, on the token routes', () => {
  it('holds no raw link token (query, body or path), password, cookie, session id or CSRF token', async () => {
    const club = await buildClub(t.db);
    const coordinator = await buildMember(t.db, { clubId: club.id, roles: ['coordinator', 'volunteer'] });
    const c = await browserLikeAgent(t.app);
    await c.signIn(coordinator.email, coordinator.password!);
    const since = Date.now();
    const tokenOf = (url: string) => new URL(url).searchParams.get('token')!;

    const feed = (await c.post(`/api/clubs/${club.id}/feeds/personal`)).body.url as string;
    // A token in a query (preview), then in a body (accept), with a password.
    expect((await c.post(`/api/clubs/${club.id}/invites`, { email: 'wren@example.org', name: 'Wren', roles: ['volunteer'] })).status).toBe(201);
    const invite = tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'wren@example.org', after: since }), '/invite'));
    const wren = await browserLikeAgent(t.app);
    expect((await wren.get(`/api/invites/preview?token=${invite}`)).status).toBe(200);
    const accepted = await wren.post('/api/invites/accept', { token: invite, name: 'Wren', password: 'wren-secret-password-1' });
    expect(accepted.status).toBe(200);
    const wrenSid = sidOf(accepted.headers['set-cookie']);

    // A password reset: asked for, checked, used.
    const anon = await browserLikeAgent(t.app);
    await anon.post('/api/password-resets', { email: coordinator.email }).expect(202);
    const reset = tokenOf(extractLink(await waitForMail(mailUrl(), { to: coordinator.email, subject: 'password', after: since }), '/reset-password'));
    expect((await anon.get(`/api/password-resets/check?token=${reset}`)).status).toBe(200);
    expect((await anon.post('/api/password-resets/complete', { token: reset, password: 'a-brand-new-password-2' })).status).toBe(204);

    // A token in a path (a calendar feed's secret address), and tokens that match nothing.
    const feedToken = /\/feeds\/([A-Za-z0-9_-]+)\.ics$/.exec(feed)![1];
    expect((await request(t.app).get(`/api/feeds/${feedToken}.ics`)).status).toBe(200);
    const unknown = 'Zz9'.repeat(14) + 'x';
    expect((await request(t.app).get(`/api/shift-links/preview?token=${unknown}`)).status).toBe(404);
    expect((await request(t.app).get(`/api/feeds/${unknown}.ics`)).status).toBe(404);
    expect((await anon.post('/api/offers/accept', { token: unknown })).status).toBe(404);

    // A CSRF'd POST with the session cookie, and one with a wrong token.
    expect((await c.patch(`/api/clubs/${club.id}`, { name: 'Renamed Growers' })).status).toBe(403); // the reset signed everyone out
    const again = await browserLikeAgent(t.app);
    const signedIn = await again.signIn(coordinator.email, 'a-brand-new-password-2');
    expect(signedIn.status).toBe(200);
    const sid = sidOf(signedIn.headers['set-cookie'])!;
    expect((await again.patch(`/api/clubs/${club.id}`, { name: 'Renamed Growers' })).status).toBe(200);
    expect((await again.agent.patch(`/api/clubs/${club.id}`).set('X-CSRF-Token', 'not-the-token-but-a-guess').send({ name: 'x' })).status).toBe(403);

    const log = captured.join('');
    const sidParts = (v: string) => {
      const value = decodeURIComponent(v);
      return [v, value, value.replace(/^s:/, '').split('.')[0]];
    };
    const secrets = {
      invite, reset, feedToken, unknown,
      'coordinator password': coordinator.password!, 'new password': 'a-brand-new-password-2', 'wren password': 'wren-secret-password-1',
      'csrf (signed in)': again.csrf, 'csrf (anonymous)': anon.csrf, 'csrf guess': 'not-the-token-but-a-guess',
      ...Object.fromEntries(sidParts(sid).map((v, i) => [`sid ${i}`, v])),
      ...Object.fromEntries(sidParts(wrenSid!).map((v, i) => [`wren sid ${i}`, v])),
    };
    for (const [name, secret] of Object.entries(secrets)) expect(log, `log holds the ${name}`).not.toContain(secret);
    // The lines are there, with the paths cut where a secret was.
    const urls = captured.map((l) => JSON.parse(l)).filter((l) => l.msg === 'request completed').map((l) => l.req.url as string);
    expect(urls).toContain('/api/invites/preview?token=…');
    expect(urls).toContain('/api/feeds/…');
    expect(urls.filter((u) => u === '/api/feeds/…')).toHaveLength(2);
  });
});

describe('sessions', () => {
  it('keeps only a hash of the session id in the session table', async () => {
    const club = await buildClub(t.db);
    const person = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await browserLikeAgent(t.app);
    const signedIn = await c.signIn(person.email, person.password!);
    // express-session's cookie is "s:<id>.<signature>"; the id is the secret a copied table must not give away.
    const id = decodeURIComponent(sidOf(signedIn.headers['set-cookie'])!).replace(/^s:/, '').split('.')[0];
    const rows: Array<{ sid: string; sess: unknown }> = await t.db('session').select('sid', 'sess');
    expect(rows).toHaveLength(1);
    expect(JSON.stringify(rows)).not.toContain(id);
    expect(rows[0].sid).toBe(crypto.createHash('sha256').update(id).digest('base64url'));
    await c.get(`/api/clubs/${club.id}/members`).expect(200); // the hashed row still signs the cookie in
  });

  it('stores nothing for 50 anonymous visits to GET /api/session', async () => {
    const before = await sessionRows();
    for (let i = 0; i < 50; i++) {
      const res = await request(t.app).get('/api/session').expect(200);
      expect(sidOf(res.headers['set-cookie'])).toBeUndefined();
    }
    expect(await sessionRows()).toBe(before);
  });

  it('still signs in with the token, and refuses sign-in without it, with another visitor’s, or with a forged one', async () => {
    const person = await buildUser(t.db);
    const c = await browserLikeAgent(t.app);
    const other = await browserLikeAgent(t.app);

    const none = await c.agent.post('/api/session').send({ email: person.email, password: person.password });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('csrf_failed');
    // Another visitor's token does not match this browser's cookie.
    const foreign = await c.agent.post('/api/session').set('X-CSRF-Token', other.csrf).send({ email: person.email, password: person.password });
    expect(foreign.status).toBe(403);
    // A cookie and header that agree but were not signed with the server's secret.
    const forged = 'a'.repeat(43) + '.' + 'b'.repeat(43);
    const made = await request(t.app)
      .post('/api/session')
      .set('Cookie', `tillwell.csrf=${forged}`)
      .set('X-CSRF-Token', forged)
      .send({ email: person.email, password: person.password });
    expect(made.status).toBe(403);
    expect(await sessionRows()).toBe(0);

    const ok = await c.signIn(person.email, person.password!);
    expect(ok.status).toBe(200);
    expect(await sessionRows()).toBe(1);
    expect((await c.get('/api/session')).body.user.id).toBe(person.id);
    // Signed in, the session's own token is required: the anonymous cookie's token no longer does.
    const stale = await c.agent.delete('/api/session').set('X-CSRF-Token', other.csrf);
    expect(stale.status).toBe(403);
    await c.delete('/api/session').expect(204);
  });

  it('does not rewrite a signed-in session on every request', async () => {
    const person = await buildUser(t.db);
    const c = await browserLikeAgent(t.app);
    await c.signIn(person.email, person.password!);
    const [row] = await t.db('session').select('sid', 'expire', 'sess');
    for (let i = 0; i < 5; i++) {
      const res = await c.get('/api/session').expect(200);
      expect(sidOf(res.headers['set-cookie'])).toBeUndefined();
    }
    const [after] = await t.db('session').select('sid', 'expire', 'sess');
    expect(after.sid).toBe(row.sid);
    expect(after.expire.getTime()).toBe(row.expire.getTime());
  });

  it('refreshes a signed-in session last written a day or more ago, keeping 14 days from then', async () => {
    const person = await buildUser(t.db);
    const c = await browserLikeAgent(t.app);
    await c.signIn(person.email, person.password!);
    const [row] = await t.db('session').select('sid', 'sess');
    const dayAndMinute = (24 * 60 + 1) * 60 * 1000;
    await t.db('session').where({ sid: row.sid }).update({ sess: { ...row.sess, refreshedAt: row.sess.refreshedAt - dayAndMinute } });
    const res = await c.get('/api/session').expect(200);
    expect(sidOf(res.headers['set-cookie'])).toBeTruthy();
    const [after] = await t.db('session').select('expire', 'sess');
    expect(after.sess.refreshedAt).toBeGreaterThan(row.sess.refreshedAt);
    // 14 days is the session lifetime the app sets (server/app.ts cookie maxAge).
    expect(after.expire.getTime() - Date.now()).toBeGreaterThan(14 * 24 * 3600 * 1000 - 60_000);
  });
});
