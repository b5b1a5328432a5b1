import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { buildClub } from '../factories';
import { addSite, signedInMember, type Agent } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';
import { KEEP_ANSWERS_MS } from '../../server/middleware/idempotency';

// The offline queue (src/lib/offline/queue.ts) sends a rain-gauge reading as PUT /api/sites/:id/weather/:day
// with the Idempotency-Key made on save; these check the server side of that promise on that route.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const ZONE = 'Europe/London';

/** A club with a site and two holders of plots on it this season, both signed in. */
async function gaugeSite() {
  const club = await buildClub(t.db);
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  const site = await addSite(coordinator, club.id, 'North field', { timeZone: ZONE });
  const year = Number(localToday(ZONE).slice(0, 4));
  const [season] = await t.db('seasons').insert({ club_id: club.id, year }).returning('id');
  const holders: Agent[] = [];
  for (const [label, x] of [['A-1', 0], ['A-2', 5]] as const) {
    const holder = await signedInMember(t, club.id, ['plot_holder']);
    const [plot] = await t.db('plots').insert({ site_id: site.id, label, x_m: x, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    await t.db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.person.id, source: 'manual' });
    holders.push(holder);
  }
  return { siteId: site.id, holder: holders[0], neighbour: holders[1], day: addCalendarDays(localToday(ZONE), -1) };
}

const put = (a: Agent, siteId: number, day: string, body: object, key?: string) => {
  const req = a.agent.put(`/api/sites/${siteId}/weather/${day}`).set('X-CSRF-Token', a.csrf);
  if (key !== undefined) req.set('Idempotency-Key', key);
  return req.send(body);
};
const dayRows = async (siteId: number) => Number((await t.db('weather_days').where({ site_id: siteId }).count({ n: '*' }))[0].n);
/** The row's xmin: the id of the transaction that last wrote it, so an unchanged xmin means no second write. */
const writer = async (siteId: number, day: string) =>
  (await t.db('weather_days').where({ site_id: siteId, day }).first(t.db.raw('xmin::text as x'))).x as string;

// A key as the client makes it: crypto.randomUUID() (RFC 9562 version 4 form).
const KEY = '3f0e8b8e-6c2a-4f6d-9a51-2b7c1d0e9f44';
const reading = { rainMm: 4, source: 'gauge' };

describe('a rain-gauge reading sent again with its Idempotency-Key', () => {
  it('answers the replay with the first answer and writes nothing more', async () => {
    const { siteId, holder, day } = await gaugeSite();
    const first = await put(holder, siteId, day, reading, KEY);
    expect(first.status).toBe(201);
    const xmin = await writer(siteId, day);
    const again = await put(holder, siteId, day, reading, KEY);
    expect(again.status).toBe(201); // the first answer, not the 200 a second merge would give
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await dayRows(siteId)).toBe(1);
    expect(await writer(siteId, day)).toBe(xmin);
    // The control: without a key the same reading is written again (a new xmin, answer 200).
    expect((await put(holder, siteId, day, reading)).status).toBe(200);
    expect(await writer(siteId, day)).not.toBe(xmin);
  });

  it('refuses the same key with a different reading and keeps the first', async () => {
    const { siteId, holder, day } = await gaugeSite();
    await put(holder, siteId, day, reading, KEY).expect(201);
    const other = await put(holder, siteId, day, { ...reading, rainMm: 9 }, KEY);
    expect(other.status).toBe(409);
    expect(other.body.error.message).toMatch(/already used for a different request/);
    expect(Number((await t.db('weather_days').where({ site_id: siteId, day }).first()).rain_mm)).toBe(4);
  });

  it('lets only one of several simultaneous sends with one key write', async () => {
    const { siteId, holder, day } = await gaugeSite();
    const results = await Promise.all([1, 2, 3, 4].map(() => put(holder, siteId, day, reading, KEY)));
    const statuses = results.map((r) => r.status);
    // One 201 at least (the writer); the others either replay it (201) or hear it is still being handled (409).
    expect(statuses.filter((s) => s === 201).length).toBeGreaterThanOrEqual(1);
    expect(statuses.every((s) => s === 201 || s === 409), statuses.join()).toBe(true);
    expect(await dayRows(siteId)).toBe(1);
    expect(await t.db('idempotency_keys').where({ key: KEY }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('refuses a malformed key with 400 and writes nothing', async () => {
    const { siteId, holder, day } = await gaugeSite();
    // Visible ASCII, 1 to 200 characters (server/middleware/idempotency.ts): a space, a non-ASCII letter and 201 characters are out.
    for (const bad of ['with space', 'clé-1', 'k'.repeat(201)]) {
      const res = await put(holder, siteId, day, reading, bad);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
    }
    expect(await dayRows(siteId)).toBe(0);
    expect(await t.db('idempotency_keys').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it("does not give one person's key to another: the neighbour's request with it is their own", async () => {
    const { siteId, holder, neighbour, day } = await gaugeSite();
    await put(holder, siteId, day, reading, KEY).expect(201);
    const xmin = await writer(siteId, day);
    const theirs = await put(neighbour, siteId, day, { ...reading, rainMm: 5 }, KEY);
    // Not a 409 and not the holder's stored answer: a write of their own (200, the day already existed).
    expect(theirs.status).toBe(200);
    expect(theirs.headers['idempotent-replayed']).toBeUndefined();
    expect(Number(theirs.body.rainMm)).toBe(5);
    expect(await writer(siteId, day)).not.toBe(xmin);
    expect(await t.db('idempotency_keys').where({ key: KEY }).count({ n: '*' })).toEqual([{ n: 2 }]);
  });

  it('keeps answers for a week, long enough for a phone that was offline for days', () => {
    // Our own figure (DEVELOPERS.md, "entries made offline"): computed: 7 × 24 × 3,600,000 = 604,800,000 ms.
    expect(KEEP_ANSWERS_MS).toBe(604_800_000);
  });
});
