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
