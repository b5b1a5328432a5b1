import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import type { WeatherDay, WeatherLog } from '@shared/schemas/weather';
import { buildClub } from '../factories';
import { addSite, signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const ZONE = 'Europe/London';

async function plotOn(siteId: number, label: string, x = 0) {
  const [plot] = await t.db('plots').insert({ site_id: siteId, label, x_m: x, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  return plot.id as number;
}

async function holds(seasonId: number, plotId: number, userId: number) {
  await t.db('allocations').insert({ season_id: seasonId, plot_id: plotId, user_id: userId, source: 'manual' });
}

/**
 * A club with two sites (North field, South field) and everyone the rules tell apart: the coordinator,
 * a holder at North field this season, a holder at South field only, last season's holder at North
 * field, a volunteer, and a coordinator of another club.
 */
async function club() {
  const c = await buildClub(t.db);
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const north = await addSite(coordinator, c.id, 'North field', { timeZone: ZONE });
  const south = await addSite(coordinator, c.id, 'South field', { timeZone: ZONE });
  const year = Number(localToday(ZONE).slice(0, 4));
  const [season] = await t.db('seasons').insert({ club_id: c.id, year }).returning('id');
  const [lastSeason] = await t.db('seasons').insert({ club_id: c.id, year: year - 1 }).returning('id');
  const holder = await signedInMember(t, c.id, ['plot_holder']);
  await holds(season.id, await plotOn(north.id, 'A-1'), holder.person.id);
  const southHolder = await signedInMember(t, c.id, ['plot_holder']);
  await holds(season.id, await plotOn(south.id, 'S-1'), southHolder.person.id);
  const former = await signedInMember(t, c.id, ['plot_holder']);
  await holds(lastSeason.id, await plotOn(north.id, 'A-2', 5), former.person.id);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const otherClub = await buildClub(t.db);
  const outsider = await signedInMember(t, otherClub.id, ['coordinator']);
  return { clubId: c.id, coordinator, holder, southHolder, former, volunteer, outsider, north, south };
}

const today = () => localToday(ZONE);
const put = (a: Agent, siteId: number, day: string, body: object) => a.put(`/api/sites/${siteId}/weather/${day}`, body);
const stored = (siteId: number, day: string) => t.db('weather_days').where({ site_id: siteId, day }).first();
const dayCount = async () => Number((await t.db('weather_days').count({ n: '*' }))[0].n);

describe('who may read and write the weather log', () => {
  it('lets every member of the club read it, names who entered a day to coordinators only, and hides it from everyone else', async () => {
    const x = await club();
    const day = addCalendarDays(today(), -1);
    expect((await put(x.holder, x.north.id, day, { rainMm: 4.2, source: 'gauge' })).status).toBe(201);

    for (const [who, agent] of [
      ['coordinator', x.coordinator],
      ['holder here', x.holder],
      ['holder elsewhere', x.southHolder],
      ['last season’s holder', x.former],
      ['volunteer', x.volunteer],
    ] as const) {
      const res = await agent.get(`/api/sites/${x.north.id}/weather`);
      expect(res.status, who).toBe(200);
      const log = res.body as WeatherLog;
      expect(log.units, who).toBe('metric');
      expect(log.timeZone, who).toBe(ZONE);
      expect(log.days.map((d) => [d.day, d.rainMm, d.source]), who).toEqual([[day, 4.2, 'gauge']]);
      if (who === 'coordinator') expect(log.days[0].enteredByName).toBe(x.holder.person.name);
      else expect(log.days[0], who).not.toHaveProperty('enteredByName');
      expect(JSON.stringify(res.body), who).not.toContain(x.holder.person.email);
      expect(log.canDelete, who).toBe(who === 'coordinator');
      expect(log.canWrite, who).toBe(who === 'coordinator' || who === 'holder here');
    }

    // Another club's coordinator learns nothing, not even that the site exists; signed out is 401.
    for (const path of [`/api/sites/${x.north.id}/weather`, `/api/sites/${x.north.id}/weather.csv`, `/api/sites/${x.north.id}/weather-imports/template.csv`]) {
      const res = await x.outsider.get(path);
      expect(res.status, path).toBe(404);
      expect(res.text, path).not.toContain('4.2');
    }
    expect((await put(x.outsider, x.north.id, day, { rainMm: 1 })).status).toBe(404);
    expect((await x.outsider.delete(`/api/sites/${x.north.id}/weather/${day}`)).status).toBe(404);
    expect((await x.outsider.get(`/api/clubs/${x.clubId}/weather-sites`)).status).toBe(403);
    const anonymous = await browserLikeAgent(t.app);
    expect((await anonymous.get(`/api/sites/${x.north.id}/weather`)).status).toBe(401);
    expect((await stored(x.north.id, day)).rain_mm).toBe(4.2);
  });

  it('lets the coordinators and this season’s holders at the site write; a holder elsewhere, last season’s holder and a volunteer get 403', async () => {
    const x = await club();
    const day = today();
    expect((await put(x.coordinator, x.north.id, day, { tMaxC: 14 })).status).toBe(201);
    expect((await put(x.holder, x.north.id, day, { rainMm: 2 })).status).toBe(200);
    for (const [who, agent] of [
      ['holder elsewhere', x.southHolder],
      ['last season’s holder', x.former],
      ['volunteer', x.volunteer],
    ] as const) {
      const res = await put(agent, x.north.id, day, { rainMm: 99 });
      expect(res.status, who).toBe(403);
      expect(res.body.error.code, who).toBe('forbidden');
      const imported = await agent.post(`/api/sites/${x.north.id}/weather-imports`, { csv: `date,rain\n${day},99\n`, units: 'metric', duplicates: 'replace', commit: true });
      expect(imported.status, who).toBe(403);
    }
    // The South field holder writes at South field.
    expect((await put(x.southHolder, x.south.id, day, { rainMm: 7 })).status).toBe(201);
    expect((await stored(x.north.id, day)).rain_mm).toBe(2);

    // The rain gauge's list of sites says where each person may write.
    const sites = (await x.holder.get(`/api/clubs/${x.clubId}/weather-sites`).expect(200)).body.items;
    expect(sites.map((s: { name: string; canWrite: boolean; today: string }) => [s.name, s.canWrite, s.today])).toEqual([
      ['North field', true, today()],
      ['South field', false, today()],
    ]);
  });

  it('lets only coordinators delete a day, and answers 404 for a day the log does not hold', async () => {
    const x = await club();
    const day = addCalendarDays(today(), -3);
    await put(x.holder, x.north.id, day, { rainMm: 6 }).expect(201);
    const refused = await x.holder.delete(`/api/sites/${x.north.id}/weather/${day}`);
    expect(refused.status).toBe(403);
    expect(await stored(x.north.id, day)).toBeTruthy();
    expect((await x.coordinator.delete(`/api/sites/${x.north.id}/weather/${day}`)).status).toBe(204);
    expect(await stored(x.north.id, day)).toBeUndefined();
    expect((await x.coordinator.delete(`/api/sites/${x.north.id}/weather/${day}`)).status).toBe(404);
  });

  it('refuses to delete a site that has a weather log, and keeps the log of an archived site while answering 404 for it', async () => {
    const x = await club();
    const day = addCalendarDays(today(), -1);
    const spare = await addSite(x.coordinator, x.clubId, 'Spare bed');
    await put(x.coordinator, spare.id, day, { rainMm: 0.4 }).expect(201);
    const versionOf = async (id: number) => (await t.db('sites').where({ id }).first('version')).version as number;
    const refused = await x.coordinator.delete(`/api/sites/${spare.id}?version=${await versionOf(spare.id)}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/weather log, on record, so it cannot be deleted\. Archive it instead/);
    // With its one day gone the spare site has no records and goes for good.
    await x.coordinator.delete(`/api/sites/${spare.id}/weather/${day}`).expect(204);
    await x.coordinator.delete(`/api/sites/${spare.id}?version=${await versionOf(spare.id)}`).expect(204);

    await put(x.coordinator, x.south.id, day, { rainMm: 1.5 }).expect(201);
    await x.coordinator.post(`/api/sites/${x.south.id}/archive`, { version: await versionOf(x.south.id) }).expect(204);
    expect((await x.coordinator.get(`/api/sites/${x.south.id}/weather`)).status).toBe(404);
    expect((await put(x.coordinator, x.south.id, day, { rainMm: 3 })).status).toBe(404);
    expect((await stored(x.south.id, day)).rain_mm).toBe(1.5);
    const sites = (await x.coordinator.get(`/api/clubs/${x.clubId}/weather-sites`).expect(200)).body.items;
    expect(sites.map((s: { name: string }) => s.name)).toEqual(['North field']);
  });
});

describe('writing a day', () => {
  it('merges a rain-gauge entry into the day: the rain changes, the temperatures and humidity stay, null clears one value', async () => {
    const x = await club();
    const day = addCalendarDays(today(), -2);
    const full = { tMinC: 8.5, tMaxC: 17.25, rhMinPct: 52, rhMaxPct: 96, windMs: 2.4, windHeightM: 2, sunshineH: 6.5 };
    const first = await put(x.coordinator, x.north.id, day, full);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ day, ...full, rainMm: null, source: 'form' });

    const gauge = await put(x.holder, x.north.id, day, { rainMm: 12, source: 'gauge' });
    expect(gauge.status).toBe(200);
    const merged = gauge.body as WeatherDay;
    expect(merged).toMatchObject({ day, ...full, rainMm: 12, source: 'gauge' });
    expect(merged).not.toHaveProperty('enteredByName');
    const row = await stored(x.north.id, day);
    expect([row.t_min_c, row.t_max_c, row.rain_mm, row.rh_max_pct, row.wind_height_m, row.source, row.entered_by_user_id]).toEqual([
      8.5, 17.25, 12, 96, 2, 'gauge', x.holder.person.id,
    ]);

    const cleared = await put(x.holder, x.north.id, day, { sunshineH: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body).toMatchObject({ sunshineH: null, rainMm: 12, tMaxC: 17.25 });
    expect(await dayCount()).toBe(1);
  });

  it('refuses a day after today in the site’s own time zone, and one before 2000, naming the day', async () => {
    const x = await club();
    const tomorrow = addCalendarDays(today(), 1);
    const res = await put(x.coordinator, x.north.id, tomorrow, { rainMm: 1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['day']);
    expect(res.body.error.fields.day).toMatch(/^Not after today at North field/);
    for (const bad of ['1999-12-31', '2026-02-30', '03-06-2026', 'today']) {
      const r = await put(x.coordinator, x.north.id, bad, { rainMm: 1 });
      expect(r.status, bad).toBe(400);
      expect(Object.keys(r.body.error.fields), bad).toEqual(['day']);
    }
    expect((await put(x.coordinator, x.north.id, '2000-01-01', { rainMm: 1 })).status).toBe(201);

    // Kiritimati (UTC+14) is always a calendar day or two ahead of Pago Pago (UTC−11): 25 hours apart
    // (IANA time zone database offsets, from memory). Its today is the future at a Pago Pago site.
    const ahead = await addSite(x.coordinator, x.clubId, 'Line Islands bed', { timeZone: 'Pacific/Kiritimati' });
    const behind = await addSite(x.coordinator, x.clubId, 'Samoa bed', { timeZone: 'Pacific/Pago_Pago' });
    const kiritimatiToday = localToday('Pacific/Kiritimati');
    expect((await put(x.coordinator, ahead.id, kiritimatiToday, { rainMm: 2 })).status).toBe(201);
    const early = await put(x.coordinator, behind.id, kiritimatiToday, { rainMm: 2 });
    expect(early.status).toBe(400);
    expect(early.body.error.fields.day).toMatch(/^Not after today at Samoa bed/);
    expect(await dayCount()).toBe(2);
  });

  it('answers 400 naming the field for bad values, and writes nothing', async () => {
    const x = await club();
    const day = addCalendarDays(today(), -1);
    await put(x.coordinator, x.north.id, day, { tMaxC: 10, rainMm: 3 }).expect(201);
    const before = await stored(x.north.id, day);
    const cases: Array<[string, object, string]> = [
      ['negative rain', { rainMm: -1 }, 'rainMm'],
      ['rain past 1000 mm', { rainMm: 1000.5 }, 'rainMm'],
      ['humidity over 100 %', { rhMaxPct: 101 }, 'rhMaxPct'],
      ['a temperature as words', { tMinC: 'mild' }, 'tMinC'],
      ['"NaN" for a temperature', { tMaxC: 'NaN' }, 'tMaxC'],
      ['a huge number', { windMs: 1e308 }, 'windMs'],
      ['a sensor 20 cm up', { windHeightM: 0.2 }, 'windHeightM'],
      ['25 hours of sunshine', { sunshineH: 25 }, 'sunshineH'],
      ['solar over 50 MJ/m²', { solarMjM2: 51 }, 'solarMjM2'],
      ['an unknown field', { snowMm: 3 }, 'snowMm'],
      ['an import claimed by hand', { rainMm: 1, source: 'import' }, 'source'],
      ['nothing at all', {}, 'rainMm'],
      ['lowest above highest in one body', { tMinC: 12, tMaxC: 9 }, 'tMinC'],
      // The stored day says 10 °C at most; a lowest of 11 °C sent alone is the one named.
      ['lowest above the stored highest', { tMinC: 11 }, 'tMinC'],
      ['mean humidity outside its range', { rhMinPct: 60, rhMaxPct: 90, rhMeanPct: 95 }, 'rhMeanPct'],
      ['clearing the last values', { tMaxC: null, rainMm: null }, 'tMaxC'],
    ];
    for (const [what, body, field] of cases) {
      const res = await put(x.holder, x.north.id, day, body);
      expect(res.status, what).toBe(400);
      expect(res.body.error.code, what).toBe('validation_failed');
      expect(Object.keys(res.body.error.fields), what).toEqual([field]);
    }
    // A highest sent alone under a stored lowest is the one named too.
    await put(x.coordinator, x.north.id, day, { tMinC: 4 }).expect(200);
    const lowHigh = await put(x.holder, x.north.id, day, { tMaxC: 3 });
    expect(lowHigh.status).toBe(400);
    expect(Object.keys(lowHigh.body.error.fields)).toEqual(['tMaxC']);
    const after = await stored(x.north.id, day);
    expect([after.t_max_c, after.rain_mm, after.rh_max_pct]).toEqual([before.t_max_c, before.rain_mm, null]);
    expect(await dayCount()).toBe(1);
  });
});

describe('reading a range of days', () => {
  it('answers the last eight weeks newest first by default, a range when asked, and refuses more than 400 days naming from', async () => {
    const x = await club();
    const end = today();
    // computed: the default is today and the 55 days before it (56 days, eight weeks)
    const days = [0, 1, 55, 56, 120].map((n) => addCalendarDays(end, -n));
    for (const [i, d] of days.entries()) await put(x.coordinator, x.north.id, d, { rainMm: i + 1 }).expect(201);

    const recent = (await x.volunteer.get(`/api/sites/${x.north.id}/weather`).expect(200)).body as WeatherLog;
    expect(recent.days.map((d) => d.day)).toEqual(days.slice(0, 3));
    expect([recent.from, recent.to, recent.today]).toEqual([addCalendarDays(end, -55), end, end]);

    const older = (await x.volunteer.get(`/api/sites/${x.north.id}/weather?from=${days[4]}&to=${days[3]}`).expect(200)).body as WeatherLog;
    expect(older.days.map((d) => [d.day, d.rainMm])).toEqual([
      [days[3], 4],
      [days[4], 5],
    ]);

    const long = await x.volunteer.get(`/api/sites/${x.north.id}/weather?from=${addCalendarDays(end, -400)}&to=${end}`);
    expect(long.status).toBe(400);
    expect(long.body.error.fields).toEqual({ from: 'At most 400 days at a time' });
    // computed: 399 days back to today is 400 days, the most one read answers
    expect((await x.volunteer.get(`/api/sites/${x.north.id}/weather?from=${addCalendarDays(end, -399)}&to=${end}`)).status).toBe(200);
    const backwards = await x.volunteer.get(`/api/sites/${x.north.id}/weather?from=${end}&to=${days[1]}`);
    expect(backwards.status).toBe(400);
    expect(Object.keys(backwards.body.error.fields)).toEqual(['from']);
    const badDate = await x.volunteer.get(`/api/sites/${x.north.id}/weather?to=2026-13-01`);
    expect(badDate.status).toBe(400);
    expect(Object.keys(badDate.body.error.fields)).toEqual(['to']);
  });
});
