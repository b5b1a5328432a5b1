import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { buildClub, buildMember, buildUser } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

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

describe('sessions', () => {
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
