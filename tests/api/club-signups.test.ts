import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { addSite, signedInMember } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';
import { hashToken } from '../../server/services/tokens';
import { confirmClubSignup, SIGNUP_TTL_MS, slugFrom } from '../../server/services/club-signups';
import { AppError } from '../../server/errors';

// A generous limit here; the rate-limit test builds its own app with a small one.
const t = setupTestApp({ APPLY_RATE_LIMIT: '1000' });
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const tokenOf = (link: string) => new URL(link).searchParams.get('token')!;

const signup = (over: Record<string, unknown> = {}) => ({
  name: 'Rowan First',
  email: 'rowan@example.org',
  password: 'a long enough password',
  clubName: 'Quince Street Growers',
  timeZone: 'Europe/Dublin',
  currency: 'EUR',
  units: 'metric',
  ...over,
});

/** Signs up on a fresh agent and returns the token from the e-mail. */
async function signUpAndRead(over: Record<string, unknown> = {}) {
  const visitor = await browserLikeAgent(t.app);
  const after = Date.now();
  const res = await visitor.post('/api/club-signups', signup(over));
  expect(res.status).toBe(202);
  const to = (over.email as string | undefined) ?? 'rowan@example.org';
  const mail = await waitForMail(mailUrl(), { to, subject: 'Confirm your address', after });
  return { visitor, res, mail, token: tokenOf(extractLink(mail, '/start-a-club?token=')) };
}

describe('starting a club', () => {
  it('mails a link; following it makes the club and its coordinator in one go and signs them in', async () => {
    const { visitor, token } = await signUpAndRead();
    // Nothing is made before the link is followed.
    expect(await t.db('clubs').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await t.db('users').count({ n: '*' })).toEqual([{ n: 0 }]);

    const check = await visitor.get(`/api/club-signups/check?token=${encodeURIComponent(token)}`);
    expect(check.status).toBe(200);
    expect(check.body).toEqual({ clubName: 'Quince Street Growers', email: 'rowan@example.org' });

    const made = await visitor.post('/api/club-signups/confirm', { token });
    expect(made.status).toBe(201);
    expect(made.body.existingAccount).toBe(false);
    const club = await t.db('clubs').where({ id: made.body.clubId }).first();
    // computed: "Quince Street Growers" lower-cased, spaces to dashes.
    expect(club).toMatchObject({ name: 'Quince Street Growers', slug: 'quince-street-growers', time_zone: 'Europe/Dublin', currency: 'EUR', units: 'metric' });
    const user = await t.db('users').where({ email: 'rowan@example.org' }).first();
    expect(await t.db('memberships').where({ user_id: user.id }).select('club_id', 'role')).toEqual([{ club_id: club.id, role: 'coordinator' }]);

    // Signed in: the session names them, and coordinator routes of the new club answer.
    const session = await visitor.get('/api/session');
    expect(session.body.user.email).toBe('rowan@example.org');
    expect(session.body.user.startClubId).toBe(club.id);
    await visitor.refresh();
    expect((await visitor.get(`/api/clubs/${club.id}/checklist`)).status).toBe(200);
    // The password chosen on the form signs in too.
    const other = await browserLikeAgent(t.app);
    expect((await other.signIn('rowan@example.org', 'a long enough password')).status).toBe(200);
  });

  it('keeps only the token hash, and the link works once (410 the second time)', async () => {
    const { visitor, token } = await signUpAndRead();
    const row = await t.db('club_signups').first();
    expect(row.token_hash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    // The password is kept only as a bcrypt hash ($2a$/$2b$ prefix: bcrypt's own format).
    expect(row.password_hash).toMatch(/^\$2[ab]\$/);

    expect((await visitor.post('/api/club-signups/confirm', { token })).status).toBe(201);
    expect((await t.db('club_signups').first()).password_hash).toBe('');
    // Signed in now: the session's own CSRF token replaces the visitor's.
    await visitor.refresh();
    const again = await visitor.post('/api/club-signups/confirm', { token });
    expect(again.status).toBe(410);
    expect(again.body.error.fields).toEqual({ token: 'used' });
    expect((await visitor.get(`/api/club-signups/check?token=${encodeURIComponent(token)}`)).status).toBe(410);
    expect(await t.db('clubs').count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('refuses an expired link, with the time injected', async () => {
    const { visitor, token } = await signUpAndRead();
    const row = await t.db('club_signups').first();
    const justAfter = new Date(row.expires_at.getTime() + 1);
    await expect(confirmClubSignup(t.db, { token, now: justAfter })).rejects.toMatchObject({ code: 'gone', fields: { token: 'expired' } });
    await expect(confirmClubSignup(t.db, { token, now: justAfter })).rejects.toBeInstanceOf(AppError);
    // The link lasts SIGNUP_TTL_MS (a day) from the sign-up.
    expect(row.expires_at.getTime() - new Date(row.created_at).getTime()).toBeGreaterThan(SIGNUP_TTL_MS - 60_000);
    // Over the API: an expiry in the past reads 410 "expired", and nothing is made.
    await t.db('club_signups').update({ expires_at: new Date(Date.now() - 1000) });
    const res = await visitor.post('/api/club-signups/confirm', { token });
    expect(res.status).toBe(410);
    expect(res.body.error.fields).toEqual({ token: 'expired' });
    expect(await t.db('clubs').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('answers an address with an account as any other, and adds the club without touching its password', async () => {
    const old = await buildClub(t.db, { name: 'Old Club' });
    const existing = await buildMember(t.db, { clubId: old.id, roles: ['plot_holder'], user: { email: 'rowan@example.org' } });
    const before = (await t.db('users').where({ id: existing.id }).first('password_hash')).password_hash;

    const fresh = await signUpAndRead({ email: 'new.person@example.org' });
    const { visitor, res, mail, token } = await signUpAndRead({ password: 'a different password here' });
    // Same status and body as for a new address, and the same mail (subject and wording).
    expect(res.body).toEqual(fresh.res.body);
    expect(mail.subject).toBe(fresh.mail.subject);

    const made = await visitor.post('/api/club-signups/confirm', { token });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({ existingAccount: true, user: null });
    expect((await visitor.get('/api/session')).body.user).toBeNull();
    expect((await t.db('users').where({ id: existing.id }).first('password_hash')).password_hash).toBe(before);
    expect(await t.db('users').where({ email: 'rowan@example.org' }).count({ n: '*' })).toEqual([{ n: 1 }]);
    const roles = await t.db('memberships').where({ user_id: existing.id }).orderBy('club_id').select('club_id', 'role');
    expect(roles).toEqual([{ club_id: old.id, role: 'plot_holder' }, { club_id: made.body.clubId, role: 'coordinator' }]);
    // Their own password still signs in; the one typed on the form does not.
    const agent = await browserLikeAgent(t.app);
    expect((await agent.signIn('rowan@example.org', 'a different password here')).status).toBe(401);
    expect((await agent.signIn('rowan@example.org', existing.password!)).status).toBe(200);
  });

  it('gives a second club of the same name the next free slug', async () => {
    await buildClub(t.db, { name: 'Quince', slug: 'quince-street-growers' });
    const { visitor, token } = await signUpAndRead();
    const made = await visitor.post('/api/club-signups/confirm', { token });
    // computed: the base slug is taken, so the first free number after it.
    expect(made.body.clubSlug).toBe('quince-street-growers-2');
    // computed by hand from slugFrom's rules: accents dropped, runs of other characters become one dash.
    expect(slugFrom('  Les Jardins d’Été !! ')).toBe('les-jardins-d-ete');
    expect(slugFrom('***')).toBe('club');
  });

  it('refuses bad input with the field named, and makes nothing', async () => {
    const visitor = await browserLikeAgent(t.app);
    const cases: [Record<string, unknown>, string][] = [
      [{ password: 'short' }, 'password'],
      [{ email: 'not-an-address' }, 'email'],
      [{ timeZone: 'Mars/Olympus' }, 'timeZone'],
      [{ currency: 'XYZ' }, 'currency'],
      [{ units: 'imperial' }, 'units'],
      [{ clubName: '' }, 'clubName'],
      [{ isCoordinator: true }, 'isCoordinator'],
    ];
    for (const [over, field] of cases) {
      const res = await visitor.post('/api/club-signups', signup(over));
      expect(res.status, field).toBe(400);
      expect(Object.keys(res.body.error.fields), field).toEqual([field]);
    }
    expect(await t.db('club_signups').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await t.db('mail_outbox').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('limits sign-ups per address per hour', async () => {
    const limited = setupTestApp({ APPLY_RATE_LIMIT: '2' });
    try {
      const visitor = await browserLikeAgent(limited.app);
      const codes = [];
      for (const email of ['a@example.org', 'b@example.org', 'c@example.org']) {
        codes.push((await visitor.post('/api/club-signups', signup({ email }))).status);
      }
      expect(codes).toEqual([202, 202, 429]);
      expect(await limited.db('club_signups').count({ n: '*' })).toEqual([{ n: 2 }]);
    } finally {
      await limited.close();
    }
  });
});

describe('the first-run checklist', () => {
  it('is computed from the club’s data, can be hidden and brought back, and is for coordinators only', async () => {
    const club = await buildClub(t.db, { name: 'Elm Row' });
    const coordinator = await signedInMember(t, club.id, ['coordinator']);
    const done = async () => {
      const res = await coordinator.get(`/api/clubs/${club.id}/checklist`);
      expect(res.status).toBe(200);
      return Object.fromEntries(res.body.steps.map((s: { key: string; done: boolean }) => [s.key, s.done]));
    };
    expect(await done()).toEqual({ site: false, plots: false, members: false, waitlist: false, fees: false, season: false });
    const site = await addSite(coordinator, club.id, 'North Field');
    expect((await done()).site).toBe(true);
    // An archived site no longer counts.
    await t.db('sites').where({ id: site.id }).update({ archived_at: new Date() });
    expect((await done()).site).toBe(false);

    const hidden = await coordinator.patch(`/api/clubs/${club.id}/checklist`, { hidden: true });
    expect(hidden.status).toBe(200);
    expect(hidden.body.hidden).toBe(true);
    expect((await coordinator.get(`/api/clubs/${club.id}/checklist`)).body.hidden).toBe(true);
    expect((await coordinator.patch(`/api/clubs/${club.id}/checklist`, { hidden: false })).body.hidden).toBe(false);
    expect((await coordinator.patch(`/api/clubs/${club.id}/checklist`, { hidden: 'yes' })).body.error.fields).toHaveProperty('hidden');

    for (const role of ['plot_holder', 'volunteer'] as const) {
      const member = await signedInMember(t, club.id, [role]);
      expect((await member.get(`/api/clubs/${club.id}/checklist`)).status, role).toBe(403);
      expect((await member.patch(`/api/clubs/${club.id}/checklist`, { hidden: true })).status, role).toBe(403);
    }
    // Joining a member ticks "members" (the coordinator alone does not).
    await signedInMember(t, club.id, ['volunteer']);
    expect((await done()).members).toBe(true);
  });
});
