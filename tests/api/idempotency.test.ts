import crypto from 'node:crypto';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { setupTestApp, truncateAll } from '../helpers/app';
import { signedInMember, type Agent } from '../helpers/api';
import { pruneIdempotencyKeys } from '../../server/middleware/idempotency';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

/** A club with a coordinator signed in and one holder's fee of £60.00 (45 + 15 deposit). */
async function feeToPay() {
  const club = await buildClub(t.db);
  const c = await signedInMember(t, club.id, ['coordinator']);
  const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
  const [site] = await t.db('sites').insert({ club_id: club.id, name: 'Field', latitude: 51, longitude: 0, time_zone: 'Europe/London' }).returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
  const [a] = await t.db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.id, source: 'manual' }).returning('id');
  const [fee] = await t.db('fees')
    .insert({ club_id: club.id, season_id: season.id, allocation_id: a.id, user_id: holder.id, plot_id: plot.id, description: 'Plot A-1, 2027 season', plot_fee_minor: 4500, deposit_minor: 1500, currency: 'GBP', due_on: '2027-04-01' })
    .returning('id');
  return { club, c, feeId: fee.id as number, seasonId: season.id as number, plotId: plot.id as number };
}

const pay = (c: Agent, feeId: number, body: object, key?: string) => {
  const req = c.agent.post(`/api/fees/${feeId}/payments`).set('X-CSRF-Token', c.csrf);
  if (key !== undefined) req.set('Idempotency-Key', key);
  return req.send(body);
};
const payments = async (feeId: number) => Number((await t.db('payments').where({ fee_id: feeId }).count({ n: '*' }))[0].n);
const cash = { amountMinor: 2000, method: 'cash', paidOn: '2027-03-14' };

describe('Idempotency-Key on creating requests', () => {
  it('answers a retried payment with the first result and records it once', async () => {
    const { c, feeId } = await feeToPay();
    const first = await pay(c, feeId, cash, 'pay-7f3a');
    expect(first.status).toBe(201);
    const again = await pay(c, feeId, cash, 'pay-7f3a');
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await payments(feeId)).toBe(1);
    // Without a key, the same request is a second payment (the control).
    await pay(c, feeId, cash).expect(201);
    expect(await payments(feeId)).toBe(2);
  });

  it('refuses a reused key with a different body, and keys belong to their sender', async () => {
    const { club, c, feeId } = await feeToPay();
    await pay(c, feeId, cash, 'pay-1').expect(201);
    const other = await pay(c, feeId, { ...cash, amountMinor: 500 }, 'pay-1');
    expect(other.status).toBe(409);
    expect(other.body.error.message).toMatch(/already used for a different request/);
    const second = await signedInMember(t, club.id, ['coordinator']);
    await pay(second, feeId, cash, 'pay-1').expect(201);
    expect(await payments(feeId)).toBe(2);
  });

  it('replays a refusal too, and does not remember a malformed key', async () => {
    const { c, feeId } = await feeToPay();
    const tooMuch = { ...cash, amountMinor: 999_999 };
    expect((await pay(c, feeId, tooMuch, 'pay-big')).status).toBe(400);
    const again = await pay(c, feeId, tooMuch, 'pay-big');
    expect(again.status).toBe(400);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect((await pay(c, feeId, cash, 'with space')).status).toBe(400);
    expect(await payments(feeId)).toBe(0);
  });

  it('lets one of two simultaneous requests with one key write', async () => {
    const { c, feeId } = await feeToPay();
    const results = await Promise.all([1, 2, 3].map(() => pay(c, feeId, cash, 'pay-race')));
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201).length).toBeGreaterThanOrEqual(1);
    expect(statuses.every((s) => s === 201 || s === 409)).toBe(true);
    expect(await payments(feeId)).toBe(1);
  });

  it('makes one offer from a retried offer request', async () => {
    const { club, c, seasonId } = await feeToPay();
    const [plot] = await t.db('plots').insert({ site_id: (await t.db('sites').first('id')).id, label: 'B-1', x_m: 10, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    const [app] = await t.db('applications').insert({ club_id: club.id, name: 'Ivy Waiting', email: 'ivy@example.org' }).returning('id');
    const send = () =>
      c.agent.post(`/api/seasons/${seasonId}/offers`).set('X-CSRF-Token', c.csrf).set('Idempotency-Key', 'offer-b1').send({ plotId: plot.id, applicationId: app.id });
    const first = await send();
    expect(first.status).toBe(201);
    const again = await send();
    expect(again.status).toBe(201);
    expect(again.body.id).toBe(first.body.id);
    expect(await t.db('offers').count({ n: '*' })).toEqual([{ n: 1 }]);
  });
});

describe('Idempotency-Key housekeeping', () => {
  it('lets a retry claim a key whose first request died unanswered, but not one still fresh', async () => {
    const { c, feeId } = await feeToPay();
    const route = `POST /api/fees/${feeId}/payments`;
    // The hash the middleware keeps: SHA-256 of the body as JSON with its keys sorted (computed).
    const hash = crypto.createHash('sha256').update('{"amountMinor":2000,"method":"cash","paidOn":"2027-03-14"}').digest('hex');
    // A claim with no answer, as a crash mid-request leaves it: fresh (1 s old), then abandoned (10 min old).
    const [row] = await t.db('idempotency_keys')
      .insert({ scope: `user:${c.person.id}`, route, key: 'pay-crash', request_hash: hash, created_at: new Date(Date.now() - 1000) })
      .returning('id');
    const fresh = await pay(c, feeId, cash, 'pay-crash');
    expect(fresh.status).toBe(409);
    expect(fresh.body.error.message).toBe('A request with this Idempotency-Key is still being handled. Try again in a moment.');
    await t.db('idempotency_keys').where({ id: row.id }).update({ created_at: new Date(Date.now() - 10 * 60 * 1000) });
    const retried = await pay(c, feeId, cash, 'pay-crash');
    expect(retried.status, JSON.stringify(retried.body)).toBe(201);
    expect(await payments(feeId)).toBe(1);
  });

  it('forgets remembered answers older than a week', async () => {
    const { c, feeId } = await feeToPay();
    expect((await pay(c, feeId, cash, 'pay-old')).status).toBe(201);
    expect((await pay(c, feeId, { ...cash, amountMinor: 1000 }, 'pay-new')).status).toBe(201);
    // computed: a week and an hour = 7 × 24 + 1 = 169 hours old.
    await t.db('idempotency_keys').where({ key: 'pay-old' }).update({ created_at: new Date(Date.now() - 169 * 3600 * 1000) });
    expect(await pruneIdempotencyKeys(t.db, new Date())).toBe(1);
    expect(await t.db('idempotency_keys').pluck('key')).toEqual(['pay-new']);
  });
});
