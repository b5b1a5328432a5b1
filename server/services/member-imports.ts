import type { Knex } from 'knex';
import { ApplicationBodySchema, preferredSizes, type ApplicationBody } from '@shared/schemas/applications';
import { roleLabels, roles as allRoles, type Role } from '@shared/schemas/auth';
import { EmailSchema } from '@shared/schemas/common';
import {
  MAX_MEMBER_IMPORT_ROWS,
  memberCsvColumns,
  waitlistCsvColumns,
  type ImportedMember,
  type ImportedWaitlistEntry,
  type ImportProblem,
  type MembersImportResult,
  type WaitlistImportResult,
} from '@shared/schemas/member-imports';
import { notFound } from '../errors';
import type { Db } from '../db/knex';
import type { Mailer } from '../mail/mailer';
import { recordInvite } from './invites';
import { kickMail } from './outbox';
import { grantRoles } from './memberships';
import { csvText, importRefusal, readCsvTable, readYesNo, sortProblems, squash, unguard } from './csv-files';

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

type MemberColumn = (typeof memberCsvColumns)[number];
type WaitlistColumn = (typeof waitlistCsvColumns)[number];

const emailAliases = { e_mail: 'email', email_address: 'email', e_mail_address: 'email' } as const;

const roleWords = new Map<string, Role>([
  ...allRoles.map((r) => [squash(r), r] as const),
  ...allRoles.map((r) => [squash(roleLabels[r]), r] as const),
  ['holder', 'plot_holder'],
]);

/** Roles from a cell such as "plot_holder;volunteer" or "Plot holder, Volunteer". */
function readRoles(text: string): Role[] | string {
  const words = text
    .split(/[;,|/+&]/)
    .map((w) => w.trim())
    .filter((w) => w !== '');
  if (words.length === 0) return `Enter at least one role: ${allRoles.join(', ')}`;
  const found = new Set<Role>();
  for (const w of words) {
    const role = roleWords.get(squash(w));
    if (!role) return `Unknown role "${w}"; use ${allRoles.join(', ')} (separate several with ;)`;
    found.add(role);
  }
  return allRoles.filter((r) => found.has(r));
}

function readEmail(text: string): { email: string } | { problem: string } {
  if (text === '') return { problem: 'Enter an e-mail address' };
  const parsed = EmailSchema.safeParse(text);
  return parsed.success ? { email: parsed.data } : { problem: parsed.error.issues[0].message };
}

/** Marks the later rows of an address used twice in the file. */
function duplicateRows(rows: Array<{ row: number; email: string }>): ImportProblem[] {
  const first = new Map<string, number>();
  const problems: ImportProblem[] = [];
  for (const r of rows) {
    if (!r.email) continue;
    const at = first.get(r.email);
    if (at !== undefined) problems.push({ row: r.row, field: 'email', message: `The address ${r.email} is also on row ${at}` });
    else first.set(r.email, r.row);
  }
  return problems;
}

interface ParsedMember {
  row: number;
  name: string;
  email: string;
  roles: Role[] | null;
  sendInvite: boolean;
}

function parseMembersCsv(csv: string) {
  const table = readCsvTable<MemberColumn>(csv, {
    columns: memberCsvColumns,
    required: ['name', 'email', 'roles'],
    noun: 'member',
    maxRows: MAX_MEMBER_IMPORT_ROWS,
    aliases: { ...emailAliases, role: 'roles', invite: 'send_invite' },
  });
  const errors = [...table.errors];
  const rows: Array<ParsedMember & { ok: boolean }> = [];
  for (const r of table.rows) {
    const row = r.line;
    const name = unguard(r.get('name'));
    const emailText = r.get('email');
    if (table.unreadable) {
      rows.push({ row, name, email: emailText.toLowerCase(), roles: null, sendInvite: false, ok: false });
      continue;
    }
    const before = errors.length;
    if (name === '') errors.push({ row, field: 'name', message: 'Enter a name' });
    else if (name.length > 120) errors.push({ row, field: 'name', message: 'At most 120 characters' });
    const email = readEmail(emailText);
    if ('problem' in email) errors.push({ row, field: 'email', message: email.problem });
    const roles = readRoles(r.get('roles'));
    if (typeof roles === 'string') errors.push({ row, field: 'roles', message: roles });
    const sendInvite = readYesNo(r.get('send_invite'));
    if (sendInvite === null) errors.push({ row, field: 'send_invite', message: 'Use yes or no' });
    if (r.strays) errors.push({ row, field: '', message: 'This row has a value in a column without a name' });
    rows.push({
      row,
      name,
      email: 'email' in email ? email.email : emailText.toLowerCase(),
      roles: typeof roles === 'string' ? null : roles,
      sendInvite: sendInvite ?? false,
      ok: errors.length === before,
    });
  }
  errors.push(...duplicateRows(rows));
  return { rows, errors };
}

async function accountsByEmail(db: Db, clubId: number, emails: string[]) {
  const found = new Map<string, { id: number; hasPassword: boolean; isMember: boolean; held: Role[] }>();
  for (let i = 0; i < emails.length; i += 500) {
    const rows = await db('users as u')
      .whereRaw('lower(u.email) = any(?)', [emails.slice(i, i + 500)])
      .select(
        'u.id',
        db.raw('lower(u.email) as email'),
        db.raw('u.password_hash is not null as has_password'),
        db.raw('array(select m.role from memberships m where m.user_id = u.id and m.club_id = ? order by m.role) as held', [clubId]),
      );
    for (const r of rows) {
      const held = (r.held ?? []) as Role[];
      found.set(r.email, { id: r.id, hasPassword: r.has_password, isMember: held.length > 0, held });
    }
  }
  return found;
}

/**
 * Checks a members CSV and, with commit, adds every row or none. Roles are granted only to accounts
 * the import itself creates (addresses new to Tillwell); anyone whose address already has an
 * account, and a member given new roles, gets an invitation and holds the roles only once they
 * accept it. Rows asking for it get an invitation to choose a password. The preview words a new
 * address and an existing account the same way.
 */
export async function importMembers(
  db: Knex,
  mailer: Mailer,
  opts: { clubId: number; userId: number; csv: string; commit: boolean; publicUrl: string },
): Promise<MembersImportResult> {
  const club = await db('clubs').where({ id: opts.clubId }).first('id', 'name');
  if (!club) throw notFound('The club');
  const parsed = parseMembersCsv(opts.csv);
  const describe = async (trx: Db) => {
    const accounts = await accountsByEmail(trx, opts.clubId, parsed.rows.map((r) => r.email).filter(Boolean));
    const rows = parsed.rows.map((r) => {
      const account = accounts.get(r.email);
      const member = account?.isMember ? account : null;
      const newRoles = r.roles && member ? r.roles.filter((role) => !member.held.includes(role)) : [];
      const shown: ImportedMember | null =
        r.ok && r.roles
          ? {
              name: r.name,
              email: r.email,
              roles: r.roles,
              sendInvite: member ? newRoles.length > 0 || (r.sendInvite && !member.hasPassword) : r.sendInvite,
              hasPassword: member?.hasPassword ?? false,
              outcome: member ? 'member' : 'joins',
            }
          : null;
      // What the commit does, kept out of the answer.
      const plan = !r.roles
        ? null
        : !account
          ? ({ kind: 'create', invite: r.sendInvite, inviteRoles: r.roles } as const)
          : member
            ? ({ kind: 'none', invite: shown?.sendInvite ?? false, inviteRoles: newRoles.length > 0 ? newRoles : r.roles } as const)
            : ({ kind: 'none', invite: true, inviteRoles: r.roles } as const);
      return { row: { row: r.row, name: r.name, email: r.email, member: shown }, plan };
    });
    return { rows, errors: sortProblems(parsed.errors, memberCsvColumns) };
  };
  const noCounts = { imported: 0, newAccounts: 0, invitesSent: 0, invitesFailed: 0 };

  if (!opts.commit) {
    const described = await describe(db);
    return { kind: 'members', rows: described.rows.map((r) => r.row), errors: described.errors, committed: false, counts: noCounts };
  }
  if (parsed.errors.length > 0) throw importRefusal(sortProblems(parsed.errors, memberCsvColumns));

  // Accounts, roles and invitations (with their e-mails, in the outbox) are one transaction:
  // nobody is invited to an import that did not happen, and no import loses its invitations.
  const { rows, newAccounts, invitesSent } = await db.transaction(async (trx) => {
    const described = await describe(trx);
    let created = 0;
    let invited = 0;
    for (const r of described.rows) {
      const m = r.row.member!;
      if (r.plan?.kind !== 'create') continue;
      const [user] = await trx('users').insert({ email: m.email, name: m.name, password_hash: null }).returning('id');
      created++;
      await grantRoles(trx, opts.clubId, user.id, m.roles);
    }
    for (const r of described.rows) {
      const m = r.row.member!;
      if (!r.plan?.invite) continue;
      await recordInvite(trx, {
        clubId: opts.clubId,
        clubName: club.name,
        invitedBy: opts.userId,
        name: m.name,
        email: m.email,
        roles: r.plan.inviteRoles,
        publicUrl: opts.publicUrl,
      });
      invited++;
    }
    return { rows: described.rows, newAccounts: created, invitesSent: invited };
  });
  kickMail(db, mailer);
  const invitesFailed = 0; // kept in the answer's shape: an invitation can no longer fail apart from its import
  return {
    kind: 'members',
    rows: rows.map((r) => r.row),
    errors: [],
    committed: true,
    counts: { imported: rows.length, newAccounts, invitesSent, invitesFailed },
  };
}

const sizeWords = new Map<string, ApplicationBody['preferredSize']>([
  ...preferredSizes.map((s) => [s, s] as const),
  ['anysize', 'any'],
  ['', 'any'],
]);

const columnOfKey: Partial<Record<keyof ApplicationBody, WaitlistColumn>> = {
  name: 'name',
  email: 'email',
  phone: 'phone',
  notes: 'notes',
};

const EARLIEST_APPLIED_ON = '1900-01-01';

function readDate(text: string, today: string): string | { problem: string } {
  const m = DATE.exec(text);
  const valid = m && new Date(`${text}T00:00:00Z`).toISOString().slice(0, 10) === text;
  if (!valid) return { problem: 'Enter a date like 2024-03-15' };
  // The database has no year 0, and nobody on a list today applied before this.
  if (text < EARLIEST_APPLIED_ON) return { problem: `On or after ${EARLIEST_APPLIED_ON}` };
  if (text > today) return { problem: 'Cannot be in the future' };
  return text;
}

interface ParsedEntry {
  row: number;
  name: string;
  email: string;
  entry: ImportedWaitlistEntry | null;
}

function parseWaitlistCsv(csv: string, sites: Array<{ id: number; name: string }>, today: string) {
  const table = readCsvTable<WaitlistColumn>(csv, {
    columns: waitlistCsvColumns,
    required: ['name', 'email'],
    noun: 'waiting list',
    maxRows: MAX_MEMBER_IMPORT_ROWS,
    aliases: { ...emailAliases, telephone: 'phone', phone_number: 'phone', site: 'preferred_site', size: 'preferred_size' },
  });
  const errors = [...table.errors];
  const siteByName = new Map(sites.map((s) => [s.name.trim().toLowerCase(), s]));
  const rows: ParsedEntry[] = [];
  for (const r of table.rows) {
    const row = r.line;
    const name = unguard(r.get('name'));
    const emailText = r.get('email');
    if (table.unreadable) {
      rows.push({ row, name, email: emailText.toLowerCase(), entry: null });
      continue;
    }
    const bad = (field: WaitlistColumn | '', message: string) => errors.push({ row, field, message });
    const before = errors.length;
    const size = sizeWords.get(squash(r.get('preferred_size')));
    if (!size) bad('preferred_size', `Use one of: ${preferredSizes.join(', ')}`);
    const needsAccessible = readYesNo(r.get('needs_accessible'));
    if (needsAccessible === null) bad('needs_accessible', 'Use yes or no');
    const needsRaised = readYesNo(r.get('needs_raised'));
    if (needsRaised === null) bad('needs_raised', 'Use yes or no');
    const siteText = r.get('preferred_site');
    const site = siteText === '' ? null : (siteByName.get(siteText.toLowerCase()) ?? undefined);
    if (site === undefined) {
      bad(
        'preferred_site',
        sites.length === 0
          ? 'The club has no sites yet; leave this blank'
          : `No site is called "${siteText}"; use ${sites.map((s) => s.name).join(', ')} or leave it blank`,
      );
    }
    const dateText = r.get('applied_on');
    const appliedOn = dateText === '' ? null : readDate(dateText, today);
    if (appliedOn !== null && typeof appliedOn !== 'string') bad('applied_on', appliedOn.problem);
    if (emailText === '') bad('email', 'Enter an e-mail address');
    const input = {
      name,
      email: emailText,
      phone: unguard(r.get('phone')),
      notes: unguard(r.get('notes')),
    };
    const checked = ApplicationBodySchema.pick({ name: true, email: true, phone: true, notes: true }).safeParse(input);
    if (!checked.success) {
      const seen = new Set<string>(errors.slice(before).map((e) => e.field));
      for (const issue of checked.error.issues) {
        const field = columnOfKey[issue.path[0] as keyof ApplicationBody] ?? '';
        if (seen.has(field)) continue;
        seen.add(field);
        bad(field, issue.message);
      }
    }
    if (r.strays) bad('', 'This row has a value in a column without a name');
    const ok = errors.length === before && checked.success;
    rows.push({
      row,
      name,
      email: checked.success ? checked.data.email : emailText.toLowerCase(),
      entry: ok
        ? {
            name: checked.data.name,
            email: checked.data.email,
            phone: checked.data.phone,
            preferredSize: size!,
            needsAccessible: needsAccessible!,
            needsRaised: needsRaised!,
            preferredSiteId: site?.id ?? null,
            preferredSiteName: site?.name ?? null,
            appliedOn: appliedOn as string | null,
            notes: checked.data.notes,
          }
        : null,
    });
  }
  errors.push(...duplicateRows(rows));
  return { rows, errors };
}

async function liveWaitlistClashes(db: Db, clubId: number, rows: ParsedEntry[]): Promise<ImportProblem[]> {
  const emails = rows.map((r) => r.email).filter(Boolean);
  const live = new Set<string>();
  for (let i = 0; i < emails.length; i += 500) {
    const found: Array<{ email: string }> = await db('applications')
      .where({ club_id: clubId })
      .whereIn('status', ['waiting', 'offered'])
      .whereRaw('lower(email) = any(?)', [emails.slice(i, i + 500)])
      .select(db.raw('lower(email) as email'));
    for (const e of found) live.add(e.email);
  }
  return rows
    .filter((r) => live.has(r.email))
    .map((r) => ({ row: r.row, field: 'email', message: `${r.email} is already on this club's waiting list` }));
}

/**
 * Checks a waiting list CSV and, with commit, adds every row or none. applied_on keeps people's original
 * place: the queue orders by it, and rows with the same date (or none) keep the file's order.
 */
export async function importWaitlist(
  db: Knex,
  opts: { clubId: number; csv: string; commit: boolean; now?: Date },
): Promise<WaitlistImportResult> {
  const now = opts.now ?? new Date();
  const sites = await db('sites').where({ club_id: opts.clubId }).orderBy('name').select('id', 'name');
  const parsed = parseWaitlistCsv(opts.csv, sites, now.toISOString().slice(0, 10));
  const check = async (trx: Db) =>
    sortProblems([...parsed.errors, ...(await liveWaitlistClashes(trx, opts.clubId, parsed.rows))], waitlistCsvColumns);

  if (!opts.commit) {
    return { kind: 'waitlist', rows: parsed.rows, errors: await check(db), committed: false, counts: { imported: 0 } };
  }
  return db.transaction(async (trx) => {
    const errors = await check(trx);
    if (errors.length > 0) throw importRefusal(errors);
    const inserts = parsed.rows.map((r, i) => {
      const e = r.entry!;
      // Noon UTC is the same calendar day from UTC-11 to UTC+11; seconds keep the file's order within a day.
      const base = e.appliedOn ? Date.parse(`${e.appliedOn}T12:00:00Z`) + i * 1000 : now.getTime() + i;
      const at = new Date(base);
      return {
        club_id: opts.clubId,
        name: e.name,
        email: e.email,
        phone: e.phone,
        preferred_size: e.preferredSize,
        needs_accessible: e.needsAccessible,
        needs_raised: e.needsRaised,
        preferred_site_id: e.preferredSiteId,
        notes: e.notes,
        applied_at: at,
        queue_at: at,
      };
    });
    for (let i = 0; i < inserts.length; i += 500) await trx('applications').insert(inserts.slice(i, i + 500));
    return { kind: 'waitlist' as const, rows: parsed.rows, errors: [], committed: true, counts: { imported: inserts.length } };
  });
}

/** A starting members file: the header and two example people. */
export function membersTemplateCsv(): string {
  return csvText(memberCsvColumns, [
    ['Rosa Example', 'rosa@example.org', 'plot_holder', 'yes'],
    ['Idris Example', 'idris@example.org', 'plot_holder;volunteer', 'no'],
  ]);
}

/** A starting waiting list file: the header and two example applications, oldest first. */
export function waitlistTemplateCsv(): string {
  return csvText(waitlistCsvColumns, [
    ['Nell Example', 'nell@example.org', '07700 900123', 'medium', 'no', 'no', '', '2024-02-11', 'Happy to share'],
    ['Omar Example', 'omar@example.org', '', 'small', 'yes', 'yes', '', '2025-01-06', 'Uses a wheelchair'],
  ]);
}
