import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember, buildUser } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

// The shipped defaults (README configuration table); AUTH_RATE_LIMIT=10 is the old per-address limit.
const defaults = {
  TRUST_PROXY: 'true',
  AUTH_RATE_LIMIT: '10',
  SIGNIN_MAX_FAILURES_PER_ACCOUNT: '10',
  SIGNIN_MAX_FAILURES_PER_ADDRESS: '100',
  SIGNIN_LOCK_MINUTES: '15',
};
const t = setupTestApp(defaults);
const second = setupTestApp(defaults); // another server on the same database
afterAll(async () => {
  await t.close();
  await second.close();
});
beforeEach(() => truncateAll(t.db));

type App = typeof t.app;

async function attempt(app: App, from: string, email: string, password: string) {
  const c = await browserLikeAgent(app);
  return c.agent.post('/api/session').set('X-CSRF-Token', c.csrf).set('X-Forwarded-For', from).send({ email, password });
}

describe('sign-in limits', () => {
  it('lets 11 members sign in from one hall network', async () => {
    const club = await buildClub(t.db);
    const statuses: number[] = [];
    for (let i = 0; i < 11; i++) {
      const m = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
      statuses.push((await attempt(t.app, '203.0.113.7', m.email, m.password!)).status);
    }
    expect(statuses).toEqual(Array(11).fill(200));
  });

  it('locks an account after 10 wrong passwords from 10 addresses: the right one then gets 429 with Retry-After', async () => {
    const person = await buildUser(t.db);
    const statuses: number[] = [];
    for (let i = 1; i <= 12; i++) statuses.push((await attempt(t.app, `198.51.100.${i}`, person.email, `wrong-password-${i}`)).status);
    expect(statuses).toEqual([...Array(10).fill(401), 429, 429]);
    const right = await attempt(t.app, '198.51.100.200', person.email.toUpperCase(), person.password!);
    expect(right.status).toBe(429);
    expect(right.body).toEqual({ error: { code: 'rate_limited', message: 'Too many failed sign-ins. Wait a few minutes and try again.' } });
    const wait = Number(right.headers['retry-after']);
    expect(wait).toBeGreaterThan(14 * 60);
    expect(wait).toBeLessThanOrEqual(15 * 60);
    // Someone else is not locked out by it, from any of those addresses.
    const other = await buildUser(t.db);
    expect((await attempt(t.app, '198.51.100.1', other.email, other.password!)).status).toBe(200);
  });

  it('starts an account’s count again after a successful sign-in', async () => {
    const person = await buildUser(t.db);
    for (let round = 0; round < 2; round++) {
      for (let i = 0; i < 9; i++) expect((await attempt(t.app, `192.0.2.${i}`, person.email, 'not-it')).status).toBe(401);
      expect((await attempt(t.app, '192.0.2.99', person.email, person.password!)).status).toBe(200);
    }
  });

  it('shares the counts between servers', async () => {
    const person = await buildUser(t.db);
    for (let i = 0; i < 5; i++) expect((await attempt(t.app, `192.0.2.${i}`, person.email, 'not-it')).status).toBe(401);
    for (let i = 5; i < 10; i++) expect((await attempt(second.app, `192.0.2.${i}`, person.email, 'not-it')).status).toBe(401);
    expect((await attempt(t.app, '192.0.2.50', person.email, person.password!)).status).toBe(429);
  });
});
