import type { Knex } from 'knex';
import { roleLabels, roles as allRoles, type Role } from '@shared/schemas/auth';
import {
  MAX_MEMBER_IMPORT_ROWS,
  memberCsvColumns,
  type ImportedMember,
  type MembersImportResult,
} from '@shared/schemas/member-imports';
import { notFound } from '../errors';
import type { Db } from '../db/knex';
import type { Mailer } from '../mail/mailer';
import { recordInvite } from './invites';
import { kickMail } from './outbox';
import { grantRoles } from './memberships';
import {
  csvText,
  duplicateRows,
  emailAliases,
  importRefusal,
  readCsvTable,
  readEmail,
  readYesNo,
  sortProblems,
  squash,
  unguard,
} from './csv-files';

type MemberColumn = (typeof memberCsvColumns)[number];

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

/** A starting members file: the header and two example people. */
export function membersTemplateCsv(): string {
  return csvText(memberCsvColumns, [
    ['Rosa Example', 'rosa@example.org', 'plot_holder', 'yes'],
    ['Idris Example', 'idris@example.org', 'plot_holder;volunteer', 'no'],
  ]);
}
