import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { newToken } from '../../server/services/tokens';
import { buildClub, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;
const rolesOf = async (clubId: number, userId: number) =>
  (await t.db('memberships').where({ club_id: clubId, user_id: userId }).orderBy('role').pluck('role')) as string[];

describe('removing members and roles', () => {
  it('takes one role, then the whole member; their open session loses the club at once', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const member = await signedInMember(t, club.id, ['plot_holder', 'volunteer']);
    expect((await member.get(`/api/clubs/${club.id}`)).status).toBe(200);

    expect((await coordinator.delete(`/api/clubs/${club.id}/members/${member.person.id}/roles/volunteer`)).status).toBe(204);
    expect(await rolesOf(club.id, member.person.id)).toEqual(['plot_holder']);
    expect((await coordinator.delete(`/api/clubs/${club.id}/members/${member.person.id}/roles/volunteer`)).status).toBe(404);
    const badRole = await coordinator.delete(`/api/clubs/${club.id}/members/${member.person.id}/roles/gardener`);
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.fields).toHaveProperty('role');

    expect((await coordinator.delete(`/api/clubs/${club.id}/members/${member.person.id}`)).status).toBe(204);
    expect(await rolesOf(club.id, member.person.id)).toEqual([]);
    // Same session, no new sign-in: the club is gone from it.
    expect((await member.get(`/api/clubs/${club.id}`)).status).toBe(403);
    expect((await member.get('/api/session')).body.user.clubs).toEqual([]);
    const list = await coordinator.get(`/api/clubs/${club.id}/members`);
    expect(list.body.items.map((m: { userId: number }) => m.userId)).toEqual([coordinator.person.id]);
  });

  it('keeps the last coordinator: they cannot remove themselves or their coordinator role', async () => {
    const club = await buildClub(t.db);
    const only = await signedInMember(t, club.id, ['coordinator', 'plot_holder']);
    for (const url of [`/api/clubs/${club.id}/members/${only.person.id}`, `/api/clubs/${club.id}/members/${only.person.id}/roles/coordinator`]) {
      const res = await only.delete(url);
      expect(res.status).toBe(409);
      expect(res.body.error).toEqual({ code: 'conflict', message: 'A club needs at least one coordinator. Make someone else coordinator first.' });
    }
    expect(await rolesOf(club.id, only.person.id)).toEqual(['coordinator', 'plot_holder']);
    // Another role is fine; so is stepping down once there is a second coordinator.
    expect((await only.delete(`/api/clubs/${club.id}/members/${only.person.id}/roles/plot_holder`)).status).toBe(204);
    const second = await signedInMember(t, club.id, ['coordinator']);
    expect((await only.delete(`/api/clubs/${club.id}/members/${only.person.id}`)).status).toBe(204);
    // Two coordinators removing each other at once: one wins, the club keeps a coordinator.
    const third = await signedInMember(t, club.id, ['coordinator']);
    const both = await Promise.all([
      second.delete(`/api/clubs/${club.id}/members/${third.person.id}`),
      third.delete(`/api/clubs/${club.id}/members/${second.person.id}`),
    ]);
    // The loser is refused either at the door (no longer a member: 403) or by the last-coordinator rule (409).
    const statuses = both.map((r) => r.status).sort();
    expect(statuses[0]).toBe(204);
    expect([403, 409]).toContain(statuses[1]);
    expect(Number((await t.db('memberships').where({ club_id: club.id, role: 'coordinator' }).count({ n: '*' }))[0].n)).toBe(1);
  });

  it('is for coordinators of the club only', async () => {
    const club = await buildClub(t.db);
    const holder = await signedInMember(t, club.id, ['plot_holder']);
    const volunteer = await signedInMember(t, club.id, ['volunteer']);
    expect((await holder.delete(`/api/clubs/${club.id}/members/${volunteer.person.id}`)).status).toBe(403);
    expect((await volunteer.delete(`/api/clubs/${club.id}/members/${volunteer.person.id}/roles/volunteer`)).status).toBe(403);
    expect(await rolesOf(club.id, volunteer.person.id)).toEqual(['volunteer']);
  });

  it('releases a removed plot holder’s pending renewal and frees their plot in the newest season', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
    const [site] = await t.db('sites')
      .insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'Europe/London', width_m: 30, length_m: 20 })
      .returning('id');
    const [p1, p2] = await t.db('plots')
      .insert([{ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }, { site_id: site.id, label: 'A-2', x_m: 4, y_m: 0, width_m: 3, length_m: 6 }])
      .returning('id');
    const [last] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const [prev] = await t.db('allocations').insert({ season_id: last.id, plot_id: p1.id, user_id: holder.id, source: 'offer' }).returning('id');
    await t.db('allocations').insert({ season_id: season.id, plot_id: p2.id, user_id: holder.id, source: 'offer' });
    const { token, hash } = newToken();
    await t.db('renewals').insert({ season_id: season.id, previous_allocation_id: prev.id, plot_id: p1.id, user_id: holder.id, token_hash: hash, deadline: new Date(Date.now() + 14 * DAY) });

    expect((await coordinator.delete(`/api/clubs/${club.id}/members/${holder.id}/roles/plot_holder`)).status).toBe(204);
    const states = await coordinator.get(`/api/seasons/${season.id}/plot-states?siteId=${site.id}`);
    expect(states.body.items.map((i: { status: string }) => i.status)).toEqual(['free', 'free']);
    expect(await t.db('allocations').where({ season_id: last.id }).pluck('status')).toEqual(['active']); // last season's history stays
    const anon = await browserLikeAgent(t.app);
    expect((await anon.post('/api/renewals/keep', { token })).status).toBe(410);
    const detail = await coordinator.get(`/api/plots/${p1.id}`);
    expect(detail.body.history[0].summary).toBe('Renewal for 2027 withdrawn: the holder was removed from the club');
  });
});

describe('cancelling an invitation', () => {
  it('drops it from the pending list; its link answers that it is no longer valid', async () => {
    const club = await buildClub(t.db, { name: 'Elm Row Growers' });
    const other = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const after = Date.now();
    const made = await coordinator.post(`/api/clubs/${club.id}/invites`, { name: 'Ivy New', email: 'ivy@example.org', roles: ['volunteer'] });
    expect(made.status).toBe(201);
    // Invitations last 14 days (server/services/invites.ts INVITE_TTL_MS).
    expect(Date.parse(made.body.expiresAt) - Date.parse(made.body.createdAt)).toBeGreaterThan(14 * DAY - 60_000);
    const mail = await waitForMail(mailUrl(), { to: 'ivy@example.org', subject: 'invited', after });
    const token = new URL(extractLink(mail, '/invite')).searchParams.get('token')!;

    const otherCoordinator = await signedInMember(t, other.id, ['coordinator']);
    expect((await otherCoordinator.delete(`/api/clubs/${other.id}/invites/${made.body.id}`)).status).toBe(404);
    expect((await coordinator.delete(`/api/clubs/${club.id}/invites/${made.body.id}`)).status).toBe(204);
    expect((await coordinator.delete(`/api/clubs/${club.id}/invites/${made.body.id}`)).status).toBe(409);
    expect((await coordinator.get(`/api/clubs/${club.id}/invites`)).body.items).toEqual([]);

    const ivy = await browserLikeAgent(t.app);
    const preview = await ivy.get(`/api/invites/preview?token=${encodeURIComponent(token)}`);
    expect(preview.status).toBe(410);
    expect(preview.body.error.message).toBe('This invitation is no longer valid. Ask the coordinator for a new one.');
    const accept = await ivy.post('/api/invites/accept', { token, name: 'Ivy New', password: 'a-long-garden-password' });
    expect(accept.status).toBe(410);
    expect(await t.db('users').where({ email: 'ivy@example.org' }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('is cancelled when the person is removed from the club', async () => {
    const club = await buildClub(t.db);
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const member = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
    expect((await coordinator.post(`/api/clubs/${club.id}/invites`, { name: 'X', email: member.email, roles: ['volunteer'] })).status).toBe(201);
    expect((await coordinator.delete(`/api/clubs/${club.id}/members/${member.id}`)).status).toBe(204);
    expect((await coordinator.get(`/api/clubs/${club.id}/invites`)).body.items).toEqual([]);
  });
});
