import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildApplication, buildClub } from '../factories';
import { signedInMember } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

// What an attacker would send to the spring round's newer routes: every answer a 4xx in the error shape.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

describe('offer quote, left-out list and late renewals under hostile input', () => {
  it('answers 4xx with the error shape, never 5xx', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const other = await buildClub(t.db);
    const [otherSeason] = await t.db('seasons').insert({ club_id: other.id, year: 2027 }).returning('id');
    const stranger = await buildApplication(t.db, { clubId: other.id });
    const volunteer = await signedInMember(t, club.id, ['volunteer']);
    const s = season.id;
    const probes: Array<[string, () => Promise<{ status: number; body: { error?: { code: string; message: string } } }>]> = [
      ['quote, id 2^31', () => coordinator.get(`/api/seasons/${s}/offer-quote?plotId=2147483648&applicationId=1`)],
      ['quote, id 2^53', () => coordinator.get(`/api/seasons/${s}/offer-quote?plotId=9007199254740993&applicationId=1`)],
      ['quote, season 2^31', () => coordinator.get('/api/seasons/2147483648/offer-quote?plotId=1&applicationId=1')],
      ['quote, NUL', () => coordinator.get(`/api/seasons/${s}/offer-quote?plotId=1%00&applicationId=1`)],
      ['quote, wrong type', () => coordinator.get(`/api/seasons/${s}/offer-quote?plotId=abc&applicationId=[]`)],
      ['quote, array', () => coordinator.get(`/api/seasons/${s}/offer-quote?plotId=1&plotId=2&applicationId=1`)],
      ['quote, missing', () => coordinator.get(`/api/seasons/${s}/offer-quote`)],
      ['quote, other club’s person', () => coordinator.get(`/api/seasons/${s}/offer-quote?plotId=1&applicationId=${stranger.id}`)],
      ['quote, other club’s season', () => coordinator.get(`/api/seasons/${otherSeason.id}/offer-quote?plotId=1&applicationId=1`)],
      ['quote, volunteer', () => volunteer.get(`/api/seasons/${s}/offer-quote?plotId=1&applicationId=1`)],
      ['left-out, bad path', () => coordinator.get('/api/seasons/%E0%A4%A/left-out')],
      ['left-out, other club', () => coordinator.get(`/api/seasons/${otherSeason.id}/left-out`)],
      ['left-out, volunteer', () => volunteer.get(`/api/seasons/${s}/left-out`)],
      ['late, id 2^31', () => coordinator.post(`/api/seasons/${s}/late-renewals`, { allocationId: 2147483648 })],
      ['late, string id', () => coordinator.post(`/api/seasons/${s}/late-renewals`, { allocationId: '1\u0000' })],
      ['late, unknown field', () => coordinator.post(`/api/seasons/${s}/late-renewals`, { allocationId: 1, extra: true })],
      ['late, no such holder', () => coordinator.post(`/api/seasons/${s}/late-renewals`, { allocationId: 999999 })],
      ['late, other club', () => coordinator.post(`/api/seasons/${otherSeason.id}/late-renewals`, { allocationId: 1 })],
      ['late, volunteer', () => volunteer.post(`/api/seasons/${s}/late-renewals`, { allocationId: 1 })],
    ];
    const answers: Array<[string, number, string]> = [];
    for (const [name, send] of probes) {
      const res = await send();
      answers.push([name, res.status, res.body.error?.code ?? '']);
    }
    for (const [name, status, code] of answers) {
      expect(status, name).toBeGreaterThanOrEqual(400);
      expect(status, name).toBeLessThan(500);
      expect(code, name).not.toBe('');
    }
    // Another club's records are not found, another role is forbidden.
    expect(answers.find((a) => a[0] === 'quote, other club’s season')?.[1]).toBe(404);
    expect(answers.find((a) => a[0] === 'late, volunteer')?.[1]).toBe(403);
    expect(await t.db('renewals').count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});

describe('the weather log’s routes under hostile input', () => {
  it('answers 4xx with the error shape, never 5xx, and writes nothing', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const volunteer = await signedInMember(t, club.id, ['volunteer']);
    const site = (await coordinator.post(`/api/clubs/${club.id}/sites`, { name: 'North field', latitude: 51.5, longitude: -0.1, timeZone: 'Europe/London', width: 40, length: 30 }).expect(201)).body;
    const other = await buildClub(t.db);
    const otherCoordinator = await signedInMember(t, other.id, ['coordinator']);
    const otherSite = (await otherCoordinator.post(`/api/clubs/${other.id}/sites`, { name: 'Far field', latitude: 40, longitude: -105, timeZone: 'America/Denver', width: 40, length: 30 }).expect(201)).body;
    const w = `/api/sites/${site.id}`;
    const file = (csv: unknown, more: object = {}) => ({ csv, units: 'metric', duplicates: 'skip', commit: true, ...more });
    const probes: Array<[string, () => Promise<{ status: number; body: { error?: { code: string; message: string; fields?: Record<string, string> } } }>]> = [
      ['log, year 0', () => coordinator.get(`${w}/weather?from=0000-01-01`)],
      ['log, ends before it starts', () => coordinator.get(`${w}/weather?from=2026-06-02&to=2026-06-01`)],
      ['log, year 0 to 9999', () => coordinator.get(`${w}/weather?from=0001-01-01&to=9999-12-31`)],
      ['log, 30 February', () => coordinator.get(`${w}/weather?from=2026-02-30`)],
      ['log, two froms', () => coordinator.get(`${w}/weather?from=2026-01-01&from=2026-02-01`)],
      ['log, NUL', () => coordinator.get(`${w}/weather?to=2026-01-01%00`)],
      ['log, site 2^31', () => coordinator.get('/api/sites/2147483648/weather')],
      ['log, broken encoding', () => coordinator.get('/api/sites/%E0%A4%A/weather')],
      ['log, other club', () => coordinator.get(`/api/sites/${otherSite.id}/weather`)],
      ['put, year 0', () => coordinator.put(`${w}/weather/0000-01-01`, { rainMm: 1 })],
      ['put, year 9999', () => coordinator.put(`${w}/weather/9999-12-31`, { rainMm: 1 })],
      ['put, 30 February', () => coordinator.put(`${w}/weather/2026-02-30`, { rainMm: 1 })],
      ['put, NUL day', () => coordinator.put(`${w}/weather/2026-06-01%00`, { rainMm: 1 })],
      ['put, NUL value', () => coordinator.put(`${w}/weather/2026-06-01`, { rainMm: '\u0000' })],
      ['put, array value', () => coordinator.put(`${w}/weather/2026-06-01`, { rainMm: [1, 2] })],
      ['put, past 2^31', () => coordinator.put(`${w}/weather/2026-06-01`, { rainMm: 2147483648 })],
      ['put, minus zero wind height', () => coordinator.put(`${w}/weather/2026-06-01`, { windHeightM: -0 })],
      ['put, body is a list', () => coordinator.agent.put(`${w}/weather/2026-06-01`).set('X-CSRF-Token', coordinator.csrf).send([1, 2])],
      ['put, volunteer', () => volunteer.put(`${w}/weather/2026-06-01`, { rainMm: 1 })],
      ['put, other club', () => coordinator.put(`/api/sites/${otherSite.id}/weather/2026-06-01`, { rainMm: 1 })],
      ['delete, year 0', () => coordinator.delete(`${w}/weather/0000-01-01`)],
      ['delete, no such day', () => coordinator.delete(`${w}/weather/2026-06-01`)],
      ['delete, volunteer', () => volunteer.delete(`${w}/weather/2026-06-01`)],
      ['csv, kelvin', () => coordinator.get(`${w}/weather.csv?units=kelvin`)],
      ['csv, year 0', () => coordinator.get(`${w}/weather.csv?from=0000-01-01`)],
      ['template, kelvin', () => coordinator.get(`${w}/weather-imports/template.csv?units=kelvin`)],
      ['import, NUL', () => coordinator.post(`${w}/weather-imports`, file('date,rain\n2026-06-01,1\u0000\n'))],
      ['import, not text', () => coordinator.post(`${w}/weather-imports`, file(42))],
      ['import, too big', () => coordinator.post(`${w}/weather-imports`, file(`date,rain\n${'2026-06-01,1\n'.repeat(170_000)}`))],
      ['import, bad units', () => coordinator.post(`${w}/weather-imports`, file('date,rain\n2026-06-01,1\n', { units: 'imperial' }))],
      ['import, bad choice', () => coordinator.post(`${w}/weather-imports`, file('date,rain\n2026-06-01,1\n', { duplicates: 'merge' }))],
      ['import, commit as text', () => coordinator.post(`${w}/weather-imports`, file('date,rain\n2026-06-01,1\n', { commit: 'yes' }))],
      ['import, formula in a number', () => coordinator.post(`${w}/weather-imports`, file('date,rain\n2026-06-01,=1+1\n'))],
      ['import, denormal rain', () => coordinator.post(`${w}/weather-imports`, file('date,rain\n2026-06-01,1e-320\n'))],
      ['import, year 0 and 9999', () => coordinator.post(`${w}/weather-imports`, file('date,rain\n0000-01-01,1\n9999-12-31,1\n'))],
      ['import, volunteer', () => volunteer.post(`${w}/weather-imports`, file('date,rain\n2026-06-01,1\n'))],
      ['sites, club 2^31', () => coordinator.get('/api/clubs/2147483648/weather-sites')],
      ['sites, other club', () => coordinator.get(`/api/clubs/${other.id}/weather-sites`)],
    ];
    const answers: Array<[string, number, string, string[]]> = [];
    for (const [name, send] of probes) {
      const res = await send();
      answers.push([name, res.status, res.body.error?.code ?? '', Object.keys(res.body.error?.fields ?? {})]);
    }
    for (const [name, status, code] of answers) {
      expect(status, name).toBeGreaterThanOrEqual(400);
      expect(status, name).toBeLessThan(500);
      expect(code, name).not.toBe('');
    }
    const of = (name: string) => answers.find((a) => a[0] === name)!;
    expect(of('put, year 9999').slice(1)).toEqual([400, 'validation_failed', ['day']]);
    expect(of('put, NUL value').slice(1)).toEqual([400, 'validation_failed', ['rainMm']]);
    expect(of('put, minus zero wind height').slice(1)).toEqual([400, 'validation_failed', ['windHeightM']]);
    expect(of('log, two froms').slice(1)).toEqual([400, 'validation_failed', ['from']]);
    expect(of('import, bad choice').slice(1)).toEqual([400, 'validation_failed', ['duplicates']]);
    expect(of('import, formula in a number')[3]).toEqual(['row 2.rain']);
    expect(of('put, other club')[1]).toBe(404);
    expect(of('put, volunteer')[1]).toBe(403);
    expect(of('delete, no such day')[1]).toBe(404);
    expect(await t.db('weather_days').count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});
