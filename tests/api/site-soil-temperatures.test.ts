import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub } from '../factories';
import { addSite, signedInMember, type Agent } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

// Demo figures for a temperate site, °C, January first; the ends of the allowed range are in on purpose.
const temps = [-30, 1.5, 4, 8, 12.5, 16, 18, 17.5, 14, 10, 5, 50];

async function coordinatorWithSite() {
  const club = await buildClub(t.db);
  const c = await signedInMember(t, club.id, ['coordinator']);
  const site = await addSite(c, club.id, 'North field');
  return { c, siteId: site.id };
}

async function current(c: Agent, siteId: number) {
  const res = await c.get(`/api/sites/${siteId}`).expect(200);
  return res.body as { soilTempsC: number[] | null; version: number };
}

describe('site soil temperatures', () => {
  it('starts empty, stores twelve monthly temperatures, answers them on GET and clears them with null', async () => {
    const { c, siteId } = await coordinatorWithSite();
    const before = await current(c, siteId);
    expect(before.soilTempsC).toBeNull();

    const saved = await c.patch(`/api/sites/${siteId}`, { version: before.version, soilTempsC: temps });
    expect(saved.status).toBe(200);
    expect(saved.body.soilTempsC).toEqual(temps);
    expect(saved.body.version).toBe(before.version + 1);

    const read = await current(c, siteId);
    expect(read.soilTempsC).toEqual(temps);
    const row = await t.db('sites').where({ id: siteId }).first();
    expect(row.soil_temps_c).toEqual(temps);

    const cleared = await c.patch(`/api/sites/${siteId}`, { version: read.version, soilTempsC: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body.soilTempsC).toBeNull();
    expect((await current(c, siteId)).soilTempsC).toBeNull();
    expect((await t.db('sites').where({ id: siteId }).first()).soil_temps_c).toBeNull();
  });

  it('refuses a bad table with 400 naming the field under soilTempsC, and keeps the stored one', async () => {
    const { c, siteId } = await coordinatorWithSite();
    const first = await current(c, siteId);
    await c.patch(`/api/sites/${siteId}`, { version: first.version, soilTempsC: temps }).expect(200);
    const stored = await current(c, siteId);

    const withAt = (i: number, value: unknown) => temps.map((v, j) => (j === i ? value : v));
    const cases: { what: string; value: unknown; field: string }[] = [
      { what: 'eleven months', value: temps.slice(0, 11), field: 'soilTempsC' },
      { what: 'thirteen months', value: [...temps, 3], field: 'soilTempsC' },
      { what: 'a number as a string', value: withAt(3, '12'), field: 'soilTempsC.3' },
      { what: 'above 50 °C', value: withAt(5, 51), field: 'soilTempsC.5' },
      { what: 'below −30 °C', value: withAt(1, -30.1), field: 'soilTempsC.1' },
      { what: 'null in the table', value: withAt(0, null), field: 'soilTempsC.0' },
      { what: '"NaN" as a month', value: withAt(7, 'NaN'), field: 'soilTempsC.7' },
      { what: '"NaN" as the whole table', value: 'NaN', field: 'soilTempsC' },
      { what: 'an object', value: { january: 3 }, field: 'soilTempsC' },
    ];
    for (const { what, value, field } of cases) {
      const res = await c.patch(`/api/sites/${siteId}`, { version: stored.version, soilTempsC: value });
      expect(res.status, what).toBe(400);
      expect(res.body.error.code, what).toBe('validation_failed');
      expect(Object.keys(res.body.error.fields), what).toEqual([field]);
      const after = await current(c, siteId);
      expect(after.soilTempsC, what).toEqual(temps);
      expect(after.version, what).toBe(stored.version);
    }
    expect((await t.db('sites').where({ id: siteId }).first()).soil_temps_c).toEqual(temps);
  });

  it('takes the table when a site is created and refuses a short one there too', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const site = await addSite(c, club.id, 'South field', { soilTempsC: temps });
    expect((await current(c, site.id)).soilTempsC).toEqual(temps);
    const short = await c.post(`/api/clubs/${club.id}/sites`, {
      name: 'East field',
      latitude: 51.5,
      longitude: -0.1,
      timeZone: 'Europe/London',
      width: 40,
      length: 30,
      soilTempsC: temps.slice(1),
    });
    expect(short.status).toBe(400);
    expect(Object.keys(short.body.error.fields)).toEqual(['soilTempsC']);
    expect(await t.db('sites').where({ name: 'East field' }).first()).toBeUndefined();
  });
});
