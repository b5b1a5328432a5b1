import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import type { Role } from '@shared/schemas/auth';
import type { WaitlistEntry } from '@shared/schemas/applications';
import { memberCsvColumns, waitlistCsvColumns } from '@shared/schemas/member-imports';
import { buildApplication, buildClub, buildMember, buildUser } from '../factories';
import { addSite, signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { extractLink, waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const WAITLIST_HEADER = waitlistCsvColumns.join(',');

const signedIn = (clubId: number, roles: Role[]) => signedInMember(t, clubId, roles);

const importCsv = (c: Agent, clubId: number, kind: 'members' | 'waitlist', csv: string, commit = false) =>
  c.post(`/api/clubs/${clubId}/${kind === 'members' ? 'member' : 'waitlist'}-imports`, { csv, commit });

const count = async (table: string, where: Record<string, unknown> = {}) =>
  Number((await t.db(table).where(where).count({ n: '*' }))[0].n);

const waitlist = async (c: Agent, clubId: number) =>
  (await c.get(`/api/clubs/${clubId}/waitlist`)).body.items as WaitlistEntry[];

/** A CSV download's text without the byte-order mark that helps spreadsheets. */
const download = async (c: Agent, url: string) => {
  const res = await c.get(url).buffer(true).parse((r, done) => {
    let text = '';
    r.setEncoding('utf8');
    r.on('data', (chunk: string) => (text += chunk));
    r.on('end', () => done(null, text));
  });
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
  expect(res.headers['content-disposition']).toMatch(/^attachment; filename=/);
  expect((res.body as string).startsWith('\uFEFF')).toBe(true);
  return (res.body as string).slice(1);
};

describe('members import', () => {
  it('reports a bad row by its line in the file and, on commit, imports nothing', async () => {
    const club = await buildClub(t.db);
    const c = await signedIn(club.id, ['coordinator']);
    const people = await count('users');
    const csv = [
      'Name,E-mail,Roles',
      'Rosa Field,rosa@example.org,plot_holder',
      '',
      'Idris Vale,not-an-address,Plot holder; Volunteer',
      'Mo Tan,mo@example.org,gardener',
      'Rosa Again,ROSA@example.org,volunteer',
    ].join('\r\n');
    const preview = await importCsv(c, club.id, 'members', csv);
    expect(preview.status).toBe(200);
    expect(preview.body.kind).toBe('members');
    expect(preview.body.committed).toBe(false);
    expect(preview.body.errors).toEqual([
      { row: 4, field: 'email', message: 'Enter a valid e-mail address' },
      { row: 5, field: 'roles', message: 'Unknown role "gardener"; use coordinator, plot_holder, volunteer (separate several with ;)' },
      { row: 6, field: 'email', message: 'The address rosa@example.org is also on row 2' },
    ]);
    expect(preview.body.rows.map((r: { row: number }) => r.row)).toEqual([2, 4, 5, 6]);
    expect(preview.body.rows[0].member).toEqual({
      name: 'Rosa Field',
      email: 'rosa@example.org',
      roles: ['plot_holder'],
      sendInvite: false,
      hasPassword: false,
      outcome: 'joins',
    });

    const commit = await importCsv(c, club.id, 'members', csv, true);
    expect(commit.status).toBe(400);
    expect(commit.body.error.code).toBe('validation_failed');
    expect(commit.body.error.message).toBe('3 rows have problems; nothing was imported.');
    expect(commit.body.error.fields).toMatchObject({ 'row 4.email': 'Enter a valid e-mail address' });
    expect(await count('users')).toBe(people);
    expect(await count('memberships', { club_id: club.id })).toBe(1);
  });

  it('lists the first 100 problems of a 2,000-row file and counts the rest, for members and the waitlist alike', async () => {
    const club = await buildClub(t.db);
    const c = await signedIn(club.id, ['coordinator']);
    for (const kind of ['members', 'waitlist'] as const) {
      const header = kind === 'members' ? 'Name,E-mail,Roles' : 'Name,E-mail';
      const rows = Array.from({ length: 2000 }, (_, i) => (kind === 'members' ? `P ${i},not-an-address-${i},volunteer` : `P ${i},not-an-address-${i}`));
      const res = await importCsv(c, club.id, kind, [header, ...rows].join('\n'));
      expect(res.status, kind).toBe(200);
      // Computed: 2,000 rows with one bad address each; 100 listed (rows 2–101), 1,900 counted.
      expect(res.body.errors, kind).toHaveLength(101);
      expect(res.body.errors[99].row, kind).toBe(101);
      expect(res.body.errors[100], kind).toEqual({
        row: 0,
        field: '',
        message: '…and 1900 more problems on 1900 rows not listed here. Fix these first, then check again.',
      });
    }
  });

  it('reports missing and unknown columns on line 1', async () => {
    const club = await buildClub(t.db);
    const c = await signedIn(club.id, ['coordinator']);
    const res = await importCsv(c, club.id, 'members', 'name,email,colour\nA,a@example.org,red\n');
    expect(res.body.errors).toEqual([
      { row: 1, field: 'colour', message: `Unknown column "colour"; the columns are ${memberCsvColumns.join(', ')}` },
      { row: 1, field: 'roles', message: 'The required column "roles" is missing' },
    ]);
  });

  it('gives roles only to accounts it creates: an existing account or a member given new roles gets an invitation to accept', async () => {
    const club = await buildClub(t.db, { name: 'Elm Row Growers' });
    const c = await signedIn(club.id, ['coordinator']);
    const member = await buildMember(t.db, { clubId: club.id, roles: ['volunteer'], user: { email: 'kit@example.org' } });
    const elsewhere = await buildUser(t.db, { email: 'lee@example.org' });
    const csv = [
      'name,email,roles,send_invite',
      'Rosa Field,rosa@example.org,plot_holder,yes',
      'Kit Member,kit@example.org,plot_holder;volunteer,no',
      'Lee Account,lee@example.org,coordinator;volunteer,yes',
      'Noor New,noor@example.org,coordinator;volunteer,yes',
    ].join('\n');
    const preview = await importCsv(c, club.id, 'members', csv);
    expect(preview.body.errors).toEqual([]);
    const shown = preview.body.rows.map((r: { member: { outcome: string; sendInvite: boolean } }) => [r.member.outcome, r.member.sendInvite]);
    expect(shown).toEqual([
      ['joins', true],
      ['member', true], // Kit is given a new role: only by an invitation
      ['joins', true],
      ['joins', true],
    ]);
    // An address with an account and one without read the same, apart from the name and address.
    const strip = (m: Record<string, unknown>) => ({ ...m, name: '', email: '' });
    expect(strip(preview.body.rows[2].member)).toEqual(strip(preview.body.rows[3].member));

    const after = Date.now();
    const res = await importCsv(c, club.id, 'members', csv, true);
    expect(res.status).toBe(201);
    expect(res.body.committed).toBe(true);
    expect(res.body.counts).toEqual({ imported: 4, newAccounts: 2, invitesSent: 4, invitesFailed: 0 });

    const rosa = await t.db('users').where({ email: 'rosa@example.org' }).first();
    const noor = await t.db('users').where({ email: 'noor@example.org' }).first();
    expect(rosa).toMatchObject({ name: 'Rosa Field', password_hash: null });
    const rolesOf = async (userId: number) =>
      (await t.db('memberships').where({ club_id: club.id, user_id: userId }).orderBy('role').pluck('role')) as string[];
    expect(await rolesOf(rosa.id)).toEqual(['plot_holder']);
    expect(await rolesOf(noor.id)).toEqual(['coordinator', 'volunteer']);
    expect(await rolesOf(member.id)).toEqual(['volunteer']);
    expect(await rolesOf(elsewhere.id)).toEqual([]);
    expect(await t.db('users').where({ id: elsewhere.id }).first('name')).toEqual({ name: 'Test Person' });

    // The invitation works: Rosa sets a password and signs in.
    const mail = await waitForMail(mailUrl(), { to: 'rosa@example.org', subject: 'invited', after });
    expect(mail.text).toContain('You got this because a coordinator of Elm Row Growers entered your address');
    const token = new URL(extractLink(mail, '/invite')).searchParams.get('token')!;
    const rosaAgent = await browserLikeAgent(t.app);
    const accepted = await rosaAgent.post('/api/invites/accept', { token, name: 'Rosa Field', password: 'a-long-garden-password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user.clubs[0]).toMatchObject({ clubId: club.id, roles: ['plot_holder'] });

    // Lee holds the roles only after accepting with his own password; Kit's invitation is for the new role.
    const leeMail = await waitForMail(mailUrl(), { to: 'lee@example.org', subject: 'invited', after });
    const leeToken = new URL(extractLink(leeMail, '/invite')).searchParams.get('token')!;
    const lee = await browserLikeAgent(t.app);
    expect((await lee.post('/api/invites/accept', { token: leeToken, name: 'Lee', password: elsewhere.password })).status).toBe(200);
    expect(await rolesOf(elsewhere.id)).toEqual(['coordinator', 'volunteer']);
    expect(await t.db('invites').where({ email: 'kit@example.org' }).pluck('roles')).toEqual([['plot_holder']]);
  });
});

describe('waitlist import', () => {
  it('keeps the original queue order from applied_on, reads sites by name, and puts undated rows last', async () => {
    const club = await buildClub(t.db);
    const c = await signedIn(club.id, ['coordinator']);
    const north = await addSite(c, club.id, 'North field');
    await buildApplication(t.db, { clubId: club.id, name: 'Already Waiting', appliedAt: new Date('2024-06-01T09:00:00Z') });
    const csv = [
      WAITLIST_HEADER,
      'Cara Late,cara@example.org,,small,no,no,,2025-02-01,',
      'Abe Early,abe@example.org,01632 960002,Large,yes,no,north field,2023-04-10,Uses a wheelchair',
      'Undated One,undated@example.org,,,,,,,',
      'Bo Same Day,bo@example.org,,any,no,yes,,2025-02-01,Second on that day',
    ].join('\n');
    const preview = await importCsv(c, club.id, 'waitlist', csv);
    expect(preview.status).toBe(200);
    expect(preview.body.errors).toEqual([]);
    expect(preview.body.rows[1].entry).toEqual({
      name: 'Abe Early',
      email: 'abe@example.org',
      phone: '01632 960002',
      preferredSize: 'large',
      needsAccessible: true,
      needsRaised: false,
      preferredSiteId: north.id,
      preferredSiteName: 'North field',
      appliedOn: '2023-04-10',
      notes: 'Uses a wheelchair',
    });
    expect(await count('applications')).toBe(1);

    const res = await importCsv(c, club.id, 'waitlist', csv, true);
    expect(res.status).toBe(201);
    expect(res.body.counts).toEqual({ imported: 4 });
    const list = await waitlist(c, club.id);
    expect(list.map((e) => [e.position, e.name])).toEqual([
      [1, 'Abe Early'],
      [2, 'Already Waiting'],
      [3, 'Cara Late'],
      [4, 'Bo Same Day'],
      [5, 'Undated One'],
    ]);
    expect(list[0].appliedAt.slice(0, 10)).toBe('2023-04-10');
  });

  it('refuses the whole file when one row is wrong, naming each row and column', async () => {
    const club = await buildClub(t.db);
    const c = await signedIn(club.id, ['coordinator']);
    await addSite(c, club.id, 'North field');
    await buildApplication(t.db, { clubId: club.id, email: 'taken@example.org' });
    const csv = [
      WAITLIST_HEADER,
      'Good Row,good@example.org,,,,,,2024-01-01,',
      'Bad Site,site@example.org,,,,,South field,,',
      'Bad Date,date@example.org,,,maybe,,,2024-02-30,',
      'Future,future@example.org,,huge,,,,2999-01-01,',
      'Taken,TAKEN@example.org,,,,,,,',
      ',noname@example.org,,,,,,,',
    ].join('\n');
    const preview = await importCsv(c, club.id, 'waitlist', csv);
    expect(preview.body.errors).toEqual([
      { row: 3, field: 'preferred_site', message: 'No site is called "South field"; use North field or leave it blank' },
      { row: 4, field: 'needs_accessible', message: 'Use yes or no' },
      { row: 4, field: 'applied_on', message: 'Enter a date like 2024-03-15' },
      { row: 5, field: 'preferred_size', message: 'Use one of: small, medium, large, any' },
      { row: 5, field: 'applied_on', message: 'Cannot be in the future' },
      { row: 6, field: 'email', message: "taken@example.org is already on this club's waiting list" },
      { row: 7, field: 'name', message: 'Enter your name' },
    ]);
    const commit = await importCsv(c, club.id, 'waitlist', csv, true);
    expect(commit.status).toBe(400);
    expect(commit.body.error.message).toBe('5 rows have problems; nothing was imported.');
    expect(commit.body.error.fields['row 4.applied_on']).toBe('Enter a date like 2024-03-15');
    expect(await count('applications')).toBe(1);
  });

  it('gives templates that import cleanly', async () => {
    const club = await buildClub(t.db);
    const c = await signedIn(club.id, ['coordinator']);
    for (const kind of ['members', 'waitlist'] as const) {
      const csv = await download(c, `/api/clubs/${club.id}/${kind === 'members' ? 'member' : 'waitlist'}-imports/template.csv`);
      const res = await importCsv(c, club.id, kind, csv);
      expect(res.body.errors).toEqual([]);
      expect(res.body.rows).toHaveLength(2);
    }
  });
});

describe('exports', () => {
  it('round-trips the waitlist and the members through export and import into another club', async () => {
    const from = await buildClub(t.db);
    const to = await buildClub(t.db);
    const c = await signedIn(from.id, ['coordinator']);
    await addSite(c, from.id, 'North field');
    const csv = [
      WAITLIST_HEADER,
      'Abe Early,abe@example.org,01632 960002,large,yes,no,North field,2023-04-10,"Notes, with a comma"',
      'Cara Late,cara@example.org,,small,no,yes,,2025-02-01,=SUM(A1)',
      'Bo Same Day,bo@example.org,,medium,no,no,,2025-02-01,',
    ].join('\n');
    expect((await importCsv(c, from.id, 'waitlist', csv, true)).status).toBe(201);
    const exported = await download(c, `/api/clubs/${from.id}/exports/waitlist.csv`);
    const parsed = Papa.parse<string[]>(exported.trim()).data;
    expect(parsed[0]).toEqual([...waitlistCsvColumns]);
    expect(parsed.slice(1).map((r) => r[0])).toEqual(['Abe Early', 'Cara Late', 'Bo Same Day']);
    // A cell a spreadsheet would run as a formula gets a leading quote (OWASP "CSV injection").
    expect(parsed[2][8]).toBe("'=SUM(A1)");

    await t.db('memberships').insert({ club_id: to.id, user_id: c.person.id, role: 'coordinator' });
    await addSite(c, to.id, 'North field');
    expect((await importCsv(c, to.id, 'waitlist', exported, true)).status).toBe(201);
    const strip = (e: WaitlistEntry) => ({ ...e, id: 0, preferredSiteId: null });
    const a = (await waitlist(c, from.id)).map(strip);
    const b = (await waitlist(c, to.id)).map(strip);
    expect(b).toEqual(a);
    expect(b.find((e) => e.name === 'Cara Late')!.notes).toBe('=SUM(A1)');

    await buildMember(t.db, { clubId: from.id, roles: ['plot_holder', 'volunteer'], user: { name: 'Pat Holder', email: 'pat@example.org' } });
    const members = await download(c, `/api/clubs/${from.id}/exports/members.csv`);
    expect(members.split('\r\n')[0]).toBe('name,email,roles');
    expect(members).toContain('Pat Holder,pat@example.org,plot_holder;volunteer');
    const imported = await importCsv(c, to.id, 'members', members, true);
    expect(imported.status).toBe(201);
    const roles = await t.db('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.club_id': to.id, 'u.email': 'pat@example.org' }).orderBy('role').pluck('role');
    // Pat has an account (in the first club), so the second club invites Pat rather than granting roles.
    expect(roles).toEqual([]);
    expect(await t.db('invites').where({ club_id: to.id, email: 'pat@example.org' }).pluck('roles')).toEqual([['plot_holder', 'volunteer']]);
  });

  it('exports allocations by year, with just the header when there are none', async () => {
    const club = await buildClub(t.db);
    const c = await signedIn(club.id, ['coordinator']);
    expect((await download(c, `/api/clubs/${club.id}/exports/allocations.csv?year=2027`)).trim()).toBe(
      'year,site,plot,holder_name,holder_email,status',
    );
    const site = await addSite(c, club.id, 'North field');
    const plot = await c.post(`/api/sites/${site.id}/plots`, { label: 'A-1', x: 0, y: 0, width: 3, length: 6 });
    const holder = await buildMember(t.db, { clubId: club.id, user: { name: 'Pat Holder', email: 'pat@example.org' } });
    for (const year of [2026, 2027]) {
      const [season] = await t.db('seasons').insert({ club_id: club.id, year }).returning('id');
      await t.db('allocations').insert({ season_id: season.id, plot_id: plot.body.id, user_id: holder.id, source: 'manual' });
    }
    const csv = await download(c, `/api/clubs/${club.id}/exports/allocations.csv?year=2027`);
    expect(csv.trim().split('\r\n')).toEqual([
      'year,site,plot,holder_name,holder_email,status',
      '2027,North field,A-1,Pat Holder,pat@example.org,active',
    ]);
    expect((await download(c, `/api/clubs/${club.id}/exports/allocations.csv`)).trim().split('\r\n')).toHaveLength(3);
    expect((await c.get(`/api/clubs/${club.id}/exports/allocations.csv?year=soon`)).status).toBe(400);
  });

  it('keeps imports and exports to coordinators of the club', async () => {
    const club = await buildClub(t.db);
    const holder = await signedIn(club.id, ['plot_holder']);
    expect((await importCsv(holder, club.id, 'waitlist', `${WAITLIST_HEADER}\nA,a@example.org`)).status).toBe(403);
    expect((await importCsv(holder, club.id, 'members', 'name,email,roles\nA,a@example.org,volunteer')).status).toBe(403);
    for (const file of ['members.csv', 'waitlist.csv', 'allocations.csv']) {
      expect((await holder.get(`/api/clubs/${club.id}/exports/${file}`)).status).toBe(403);
    }
    const outsider = await signedIn((await buildClub(t.db)).id, ['coordinator']);
    expect((await outsider.get(`/api/clubs/${club.id}/exports/members.csv`)).status).toBe(403);
    const coordinator = await signedIn(club.id, ['coordinator']);
    const bad = await coordinator.post(`/api/clubs/${club.id}/member-imports`, { kind: 'plots', csv: 'x', commit: false });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['kind']);
  });
});
