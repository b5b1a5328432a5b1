import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

// Response headers against OWASP ASVS 4.0.3 V14.4 (HTTP security headers), V3.4 (cookie
// attributes) and V8.2.1 (no caching of sensitive answers). Both apps serve a one-file client from a
// temporary folder, so the HTML page's headers are checked without a build.
const staticDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-headers-'));
fs.writeFileSync(path.join(staticDir, 'index.html'), '<!doctype html><title>Tillwell</title><div id="root"></div>');
const plain = setupTestApp({ STATIC_DIR: staticDir });
// An https public address means TLS ends at a proxy, which says so in X-Forwarded-Proto (server/config.ts).
const https = setupTestApp({ STATIC_DIR: staticDir, PUBLIC_URL: 'https://tillwell.example.org', TRUST_PROXY: 'true' });
afterAll(async () => {
  await plain.close();
  await https.close();
  fs.rmSync(staticDir, { recursive: true, force: true });
});
beforeEach(() => truncateAll(plain.db));

/** The directives of a Content-Security-Policy header, by name. */
function directives(header: string | undefined): Record<string, string[]> {
  expect(header, 'Content-Security-Policy header').toBeTruthy();
  const out: Record<string, string[]> = {};
  for (const part of header!.split(';')) {
    const [name, ...values] = part.trim().split(/\s+/);
    if (name) out[name.toLowerCase()] = values;
  }
  return out;
}

const cookiesOf = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []);
const cookieNamed = (res: request.Response, name: string) => cookiesOf(res).find((c) => c.startsWith(`${name}=`));

describe('Content-Security-Policy', () => {
  for (const [what, url] of [['the HTML page', '/'], ['a client route', '/clubs/1/map'], ['the API', '/api/session'], ['an API 404', '/api/nothing-here']] as const) {
    it(`on ${what}: scripts and styles only from our origin, nothing inline, no eval, no framing by others`, async () => {
      const res = await request(plain.app).get(url);
      expect(res.status).toBeLessThan(500);
      const d = directives(res.headers['content-security-policy']);
      // script-src falls back to default-src when absent (CSP Level 3, §6.1.1); helmet writes both.
      const scripts = d['script-src'] ?? d['default-src'];
      expect(scripts).toEqual(["'self'"]);
      expect(d['script-src-attr']).toEqual(["'none'"]);
      expect(d['style-src']).toEqual(["'self'"]);
      for (const [name, values] of Object.entries(d)) {
        expect(values, name).not.toContain("'unsafe-inline'");
        expect(values, name).not.toContain("'unsafe-eval'");
      }
      expect(d['object-src']).toEqual(["'none'"]);
      expect(d['base-uri']).toEqual(["'self'"]);
      expect(d['frame-ancestors']).toEqual(["'self'"]);
      // The older header for browsers without frame-ancestors (RFC 7034).
      expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['x-powered-by']).toBeUndefined();
    });
  }

  it('asks browsers to upgrade insecure requests only when the site is served over https', async () => {
    expect(directives((await request(plain.app).get('/')).headers['content-security-policy'])['upgrade-insecure-requests']).toBeUndefined();
    expect(directives((await request(https.app).get('/').set('X-Forwarded-Proto', 'https')).headers['content-security-policy'])).toHaveProperty('upgrade-insecure-requests');
  });
});

describe('Strict-Transport-Security', () => {
  it('is sent when cookies are Secure (an https public address) and not over plain http', async () => {
    const secure = await request(https.app).get('/api/session').set('X-Forwarded-Proto', 'https');
    // helmet's default: 365 days (31536000 s) with subdomains.
    expect(secure.headers['strict-transport-security']).toMatch(/^max-age=(\d+); includeSubDomains$/);
    expect(Number(/max-age=(\d+)/.exec(secure.headers['strict-transport-security'])![1])).toBeGreaterThanOrEqual(31_536_000);
    expect(https.config.cookieSecure).toBe(true);
    expect(plain.config.cookieSecure).toBe(false);
    expect((await request(plain.app).get('/api/session')).headers['strict-transport-security']).toBeUndefined();
    expect((await request(plain.app).get('/')).headers['strict-transport-security']).toBeUndefined();
  });
});

describe('cookies', () => {
  /** Signs in by hand (a cookie jar would not send a Secure cookie over the test's plain http). */
  async function signInOn(t: typeof plain, proto: 'http' | 'https') {
    const club = await buildClub(t.db);
    const person = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const session = await request(t.app).get('/api/session').set('X-Forwarded-Proto', proto);
    const csrfCookie = cookieNamed(session, 'tillwell.csrf');
    expect(csrfCookie).toBeTruthy();
    const signedIn = await request(t.app)
      .post('/api/session')
      .set('X-Forwarded-Proto', proto)
      .set('Cookie', csrfCookie!.split(';')[0])
      .set('X-CSRF-Token', session.body.csrfToken)
      .send({ email: person.email, password: person.password });
    expect(signedIn.status).toBe(200);
    return { csrfCookie, sid: cookieNamed(signedIn, 'tillwell.sid') };
  }

  it('the session and CSRF cookies are HttpOnly and SameSite=Lax, and not Secure over plain http', async () => {
    const { csrfCookie, sid } = await signInOn(plain, 'http');
    for (const c of [csrfCookie, sid]) {
      expect(c).toBeTruthy();
      expect(c).toMatch(/; HttpOnly(;|$)/);
      expect(c).toMatch(/; SameSite=(Lax|Strict)(;|$)/);
      expect(c).not.toMatch(/; Secure(;|$)/);
      expect(c).toMatch(/; Path=\/(;|$)/);
    }
  });

  it('under https both are Secure as well', async () => {
    await truncateAll(https.db);
    const { csrfCookie, sid } = await signInOn(https, 'https');
    for (const c of [csrfCookie, sid]) {
      expect(c).toMatch(/; HttpOnly(;|$)/);
      expect(c).toMatch(/; SameSite=(Lax|Strict)(;|$)/);
      expect(c).toMatch(/; Secure(;|$)/);
    }
  });

  it('an anonymous visitor gets no cookie from any API GET but the CSRF one from /api/session, and no session row', async () => {
    const club = await buildClub(plain.db);
    const token = 'A'.repeat(43);
    for (const url of [
      `/api/clubs/${club.id}/members`,
      `/api/clubs/${club.id}`,
      `/api/invites/preview?token=${token}`,
      `/api/password-resets/check?token=${token}`,
      `/api/offers/preview?token=${token}`,
      `/api/renewals/preview?token=${token}`,
      `/api/shift-links/preview?token=${token}`,
      `/api/feeds/${token}.ics`,
      '/api/nothing-here',
      '/',
    ]) {
      const res = await request(plain.app).get(url);
      expect(res.status, url).toBeLessThan(500);
      expect(cookiesOf(res), url).toEqual([]);
    }
    const session = await request(plain.app).get('/api/session');
    expect(cookiesOf(session).map((c) => c.split('=')[0])).toEqual(['tillwell.csrf']);
    expect(Number((await plain.db('session').count({ n: '*' }))[0].n)).toBe(0);
  });
});

describe('caching', () => {
  it('API answers are not stored by caches; the HTML page may be', async () => {
    const club = await buildClub(plain.db);
    const person = await buildMember(plain.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await browserLikeAgent(plain.app);
    await c.signIn(person.email, person.password!);
    for (const url of ['/api/session', `/api/clubs/${club.id}/members`, '/api/nothing-here']) {
      expect((await c.get(url)).headers['cache-control'], url).toBe('no-store');
    }
    // An address with no account: the answer is the same and no mail is sent after the file's end.
    expect((await c.post('/api/password-resets', { email: 'nobody-here@example.org' })).headers['cache-control']).toBe('no-store');
    expect((await request(plain.app).get('/')).headers['cache-control']).not.toBe('no-store');
  });
});
