import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const DAY = 24 * 3600 * 1000;
const tokenOf = (link: string) => new URL(link).searchParams.get('token')!;

async function invited() {
  const club = await buildClub(t.db, { name: 'Elm Row Growers' });
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  const after = Date.now();
  const made = await coordinator.post(`/api/clubs/${club.id}/invites`, { name: 'Ivy New', email: 'ivy@example.org', roles: ['volunteer'] });
  expect(made.status).toBe(201);
  const first = tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'ivy@example.org', subject: 'invited', after }), '/invite'));
  return { club, coordinator, inviteId: made.body.id as number, first };
}

describe('sending an invitation again', () => {
  it('mails a new link with 14 more days; the old link stops working and the new one lets them in', async () => {
    const { club, coordinator, inviteId, first } = await invited();
    // The invitation ran out: it is still listed so it can be sent again.
    await t.db('invites').where({ id: inviteId }).update({ expires_at: new Date(Date.now() - DAY) });
    expect((await coordinator.get(`/api/clubs/${club.id}/invites`)).body.items.map((i: { id: number }) => i.id)).toEqual([inviteId]);

    const after = Date.now();
    const resent = await coordinator.post(`/api/clubs/${club.id}/invites/${inviteId}/resend`);
    expect(resent.status).toBe(200);
    // Invitations last 14 days (server/services/invites.ts INVITE_TTL_MS), counted from the resend.
    expect(Date.parse(resent.body.expiresAt) - after).toBeGreaterThan(14 * DAY - 60_000);
    const second = tokenOf(extractLink(await waitForMail(mailUrl(), { to: 'ivy@example.org', subject: 'invited', after }), '/invite'));
    expect(second).not.toBe(first);

    const ivy = await browserLikeAgent(t.app);
    const old = await ivy.get(`/api/invites/preview?token=${encodeURIComponent(first)}`);
    expect(old.status).toBe(410);
    expect(old.body.error.message).toBe('This link was replaced by a newer invitation e-mail. Use the link in the latest one.');
    expect((await ivy.get(`/api/invites/preview?token=${encodeURIComponent(second)}`)).status).toBe(200);
    const accepted = await ivy.post('/api/invites/accept', { token: second, name: 'Ivy New', password: 'a-long-garden-password' });
    expect(accepted.status).toBe(200);

    const again = await coordinator.post(`/api/clubs/${club.id}/invites/${inviteId}/resend`);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe('This invitation has already been accepted.');
  });

  it('refuses a cancelled invitation, another club’s, non-coordinators and bad ids', async () => {
    const { club, coordinator, inviteId } = await invited();
    const other = await buildClub(t.db);
    const otherCoordinator = await signedInMember(t, other.id, ['coordinator']);
    expect((await otherCoordinator.post(`/api/clubs/${other.id}/invites/${inviteId}/resend`)).status).toBe(404);
    const volunteer = await signedInMember(t, club.id, ['volunteer', 'plot_holder']);
    expect((await volunteer.post(`/api/clubs/${club.id}/invites/${inviteId}/resend`)).status).toBe(403);
    for (const bad of ['0', 'x', String(2 ** 31), '-1']) {
      expect((await coordinator.post(`/api/clubs/${club.id}/invites/${bad}/resend`)).status, bad).toBe(400);
    }
    expect((await coordinator.delete(`/api/clubs/${club.id}/invites/${inviteId}`)).status).toBe(204);
    const cancelled = await coordinator.post(`/api/clubs/${club.id}/invites/${inviteId}/resend`);
    expect(cancelled.status).toBe(409);
    expect(cancelled.body.error.message).toBe('This invitation is cancelled. Invite them again instead.');
  });
});
