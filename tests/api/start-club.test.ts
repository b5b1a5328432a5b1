import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

// A coordinator of "Zinnia Lane" who only volunteers at "Alder Row": the alphabetical first club is
// the one where they have least to do.
async function coordinatorWhoAlsoVolunteers() {
  const alder = await buildClub(t.db, { name: 'Alder Row' });
  const zinnia = await buildClub(t.db, { name: 'Zinnia Lane' });
  const person = await buildMember(t.db, { clubId: zinnia.id, roles: ['coordinator'] });
  await t.db('memberships').insert({ club_id: alder.id, user_id: person.id, role: 'volunteer' });
  const agent = await browserLikeAgent(t.app);
  expect((await agent.signIn(person.email, person.password!)).status).toBe(200);
  return { alder, zinnia, person, agent };
}

describe('the club "/" opens', () => {
  it('is the club the person runs, not the first by name, until they open another one', async () => {
    const { alder, zinnia, agent } = await coordinatorWhoAlsoVolunteers();
    const session = (await agent.get('/api/session')).body.user;
    expect(session.clubs.map((c: { clubName: string }) => c.clubName)).toEqual(['Alder Row', 'Zinnia Lane']);
    expect(session.startClubId).toBe(zinnia.id);

    expect((await agent.put('/api/session/club', { clubId: alder.id })).status).toBe(204);
    expect((await agent.get('/api/session')).body.user.startClubId).toBe(alder.id);
  });

  it('is remembered on the server, so a sign-in from another browser opens the same club', async () => {
    const { alder, person, agent } = await coordinatorWhoAlsoVolunteers();
    expect((await agent.put('/api/session/club', { clubId: alder.id })).status).toBe(204);
    const other = await browserLikeAgent(t.app);
    const signedIn = await other.signIn(person.email, person.password!);
    expect(signedIn.body.user.startClubId).toBe(alder.id);
  });

  it('falls back to the club with most to do once the remembered club is left', async () => {
    const { alder, zinnia, person, agent } = await coordinatorWhoAlsoVolunteers();
    await agent.put('/api/session/club', { clubId: alder.id });
    await t.db('memberships').where({ club_id: alder.id, user_id: person.id }).delete();
    expect((await agent.get('/api/session')).body.user.startClubId).toBe(zinnia.id);
  });

  it('ranks plot holder and volunteer above volunteer alone, and is null with no club', async () => {
    const a = await buildClub(t.db, { name: 'Alder Row' });
    const b = await buildClub(t.db, { name: 'Birch End' });
    const person = await buildMember(t.db, { clubId: a.id, roles: ['volunteer'] });
    await t.db('memberships').insert([
      { club_id: b.id, user_id: person.id, role: 'plot_holder' },
      { club_id: b.id, user_id: person.id, role: 'volunteer' },
    ]);
    const agent = await browserLikeAgent(t.app);
    expect((await agent.signIn(person.email, person.password!)).body.user.startClubId).toBe(b.id);
    await t.db('memberships').where({ user_id: person.id }).delete();
    expect((await agent.get('/api/session')).body.user.startClubId).toBeNull();
  });

  it('refuses a club the person is not in, bad ids and signed-out callers', async () => {
    const { agent } = await coordinatorWhoAlsoVolunteers();
    const stranger = await buildClub(t.db, { name: 'Elsewhere' });
    const refused = await agent.put('/api/session/club', { clubId: stranger.id });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('forbidden');
    for (const body of [{ clubId: 'x' }, { clubId: 2 ** 40 }, {}, { clubId: 1, extra: true }]) {
      const res = await agent.put('/api/session/club', body);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
    }
    const anonymous = await browserLikeAgent(t.app);
    expect((await anonymous.put('/api/session/club', { clubId: stranger.id })).status).toBe(401);
  });
});
