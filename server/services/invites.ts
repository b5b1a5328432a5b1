import type { Knex } from 'knex';
import bcrypt from 'bcryptjs';
import { type Invite, type InviteCreateBody, type InvitePreview, type Role } from '@shared/schemas/auth';
import { AppError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { inviteMail } from '../mail/templates';
import { hashPassword } from './auth';
import { clubTimeZone } from './clubs';
import { grantRoles, rolesInClub } from './memberships';
import { enqueueMail, kickMail } from './outbox';
import { hashToken, newToken } from './tokens';

const INVITE_TTL_MS = 14 * 24 * 60 * 60 * 1000;

interface InviteRow {
  id: number;
  token_hash: string;
  club_id: number;
  email: string;
  name: string;
  roles: Role[];
  expires_at: Date;
  accepted_at: Date | null;
  cancelled_at: Date | null;
  created_at: Date;
}

function toInvite(r: InviteRow): Invite {
  return {
    id: r.id,
    clubId: r.club_id,
    email: r.email,
    name: r.name,
    roles: r.roles,
    expiresAt: r.expires_at.toISOString(),
    acceptedAt: r.accepted_at ? r.accepted_at.toISOString() : null,
    createdAt: r.created_at.toISOString(),
  };
}

/** Records an invitation and e-mails its single-use link. */
export async function createInvite(
  db: Knex,
  mailer: Mailer,
  opts: { clubId: number; invitedBy: number; body: InviteCreateBody; publicUrl: string; now?: Date },
): Promise<Invite> {
  const { clubId, body } = opts;
  const club = await db('clubs').where({ id: clubId }).first('name');
  if (!club) throw notFound('The club');
  const existing = await db('users').whereRaw('lower(email) = lower(?)', [body.email]).first('id', 'password_hash');
  // Someone added by an import has roles but no password yet: inviting them is how they get in.
  if (existing?.password_hash) {
    const held = await rolesInClub(db, clubId, existing.id);
    if (body.roles.every((r) => held.includes(r))) {
      throw new AppError('conflict', 'That person already holds those roles in this club.', {
        email: 'Already a member with these roles',
      });
    }
  }
  const row = await issueInvite(db, mailer, {
    clubId,
    clubName: club.name,
    invitedBy: opts.invitedBy,
    name: body.name,
    email: body.email,
    roles: body.roles,
    publicUrl: opts.publicUrl,
    now: opts.now,
  });
  return toInvite(row);
}

export interface InviteToIssue {
  clubId: number;
  clubName: string;
  invitedBy: number;
  name: string;
  email: string;
  roles: Role[];
  publicUrl: string;
  now?: Date;
}

/** Records an invitation and e-mails its link; the members page and a members import both invite this way. */
export async function issueInvite(db: Knex, mailer: Mailer, p: InviteToIssue): Promise<InviteRow> {
  const row = await db.transaction((trx) => recordInvite(trx, p));
  kickMail(db, mailer);
  return row;
}

/**
 * Records an invitation and writes its e-mail to the outbox inside the caller's transaction, so
 * an import's invitations exist exactly when its rows do. Call `kickMail` after the commit.
 */
export async function recordInvite(trx: Knex.Transaction, p: InviteToIssue): Promise<InviteRow> {
  const now = p.now ?? new Date();
  const { token, hash } = newToken();
  const expiresAt = new Date(now.getTime() + INVITE_TTL_MS);
  const [inserted] = await trx('invites')
    .insert({
      club_id: p.clubId,
      email: p.email,
      name: p.name,
      roles: p.roles,
      token_hash: hash,
      expires_at: expiresAt,
      invited_by_user_id: p.invitedBy,
    })
    .returning('*');
  await queueInviteMail(trx, inserted, p.clubName, token, p.publicUrl);
  return inserted;
}

/** Writes the invitation e-mail for `row` and its link token to the outbox, in the caller's transaction. */
async function queueInviteMail(trx: Knex.Transaction, row: InviteRow, clubName: string, token: string, publicUrl: string) {
  await enqueueMail(trx, { clubId: row.club_id, kind: 'invite' }, inviteMail({
    to: row.email,
    name: row.name,
    clubName,
    roles: row.roles,
    url: `${publicUrl}/invite?token=${encodeURIComponent(token)}`,
    expiresAt: row.expires_at,
    timeZone: await clubTimeZone(trx, row.club_id),
  }));
}

// Expired invitations stay listed this long, so the coordinator can send them again.
const EXPIRED_SHOWN_MS = 60 * 24 * 60 * 60 * 1000;

/** The club's invitations not yet accepted or cancelled (those expired in the last 60 days too), newest first. */
export async function listPendingInvites(db: Knex, clubId: number, now = new Date()) {
  const rows: InviteRow[] = await db('invites')
    .where({ club_id: clubId })
    .whereNull('accepted_at')
    .whereNull('cancelled_at')
    .where('expires_at', '>', new Date(now.getTime() - EXPIRED_SHOWN_MS))
    .orderBy('created_at', 'desc');
  return { items: rows.map(toInvite), page: 1, total: rows.length };
}

async function liveInvite(db: Knex | Knex.Transaction, token: string, now: Date, lock = false) {
  const q = db('invites as i')
    .join('clubs as c', 'c.id', 'i.club_id')
    .where('i.token_hash', hashToken(token))
    .first('i.*', 'c.name as club_name');
  if (lock) q.forUpdate();
  const row = await q;
  if (!row) {
    const replaced = await db('invites').whereRaw('? = any(replaced_token_hashes)', [hashToken(token)]).first('id');
    if (replaced) throw new AppError('gone', 'This link was replaced by a newer invitation e-mail. Use the link in the latest one.');
    throw notFound('That invitation');
  }
  if (row.accepted_at) throw new AppError('gone', 'This invitation has already been used.');
  if (row.cancelled_at) throw new AppError('gone', 'This invitation is no longer valid. Ask the coordinator for a new one.');
  if (row.expires_at <= now) throw new AppError('gone', 'This invitation has expired. Ask the coordinator for a new one.');
  return row as InviteRow & { club_name: string };
}

/** What the accept page shows: who is invited, to which club, as what. */
export async function previewInvite(db: Knex, token: string, now = new Date()): Promise<InvitePreview> {
  const row = await liveInvite(db, token, now);
  const user = await db('users').whereRaw('lower(email) = lower(?)', [row.email]).first('password_hash');
  return {
    email: row.email,
    name: row.name,
    clubName: row.club_name,
    roles: row.roles,
    hasAccount: Boolean(user?.password_hash),
  };
}

/**
 * Accepts an invitation once: creates the account (or checks the existing account's
 * password), grants the roles, and returns the user id to sign in.
 */
export async function acceptInvite(
  db: Knex,
  opts: { token: string; name: string; password: string; bcryptCost: number; now?: Date },
): Promise<number> {
  const now = opts.now ?? new Date();
  const newHash = await hashPassword(opts.password, opts.bcryptCost);
  return db.transaction(async (trx) => {
    const invite = await liveInvite(trx, opts.token, now, true);
    const user = await trx('users').whereRaw('lower(email) = lower(?)', [invite.email]).first('id', 'password_hash');
    let userId: number;
    if (user?.password_hash) {
      // An existing account proves itself with its own password; the invite never changes it.
      if (!(await bcrypt.compare(opts.password, user.password_hash))) {
        throw new AppError('validation_failed', 'That is not the password of the existing account.', {
          password: 'Enter the password you already use for Tillwell',
        });
      }
      userId = user.id;
    } else if (user) {
      await trx('users').where({ id: user.id }).update({ name: opts.name, password_hash: newHash, updated_at: trx.fn.now() });
      userId = user.id;
    } else {
      const [created] = await trx('users')
        .insert({ email: invite.email, name: opts.name, password_hash: newHash })
        .returning('id');
      userId = created.id;
    }
    await grantRoles(trx, invite.club_id, userId, invite.roles);
    await trx('invites').where({ id: invite.id }).update({ accepted_at: now, accepted_by_user_id: userId });
    return userId;
  });
}

/** Cancels a pending invitation of the club: its link then answers that it is no longer valid. */
export async function cancelInvite(db: Knex, clubId: number, inviteId: number, now = new Date()): Promise<void> {
  const updated = await db('invites')
    .where({ id: inviteId, club_id: clubId })
    .whereNull('accepted_at')
    .whereNull('cancelled_at')
    .update({ cancelled_at: now });
  if (updated === 0) {
    const row = await db('invites').where({ id: inviteId, club_id: clubId }).first('accepted_at');
    if (!row) throw notFound('That invitation');
    throw new AppError('conflict', row.accepted_at ? 'This invitation has already been accepted.' : 'This invitation is already cancelled.');
  }
}

/**
 * Sends a pending or expired invitation again with a new link, valid 14 days from now; the
 * earlier link stops working. Refused once the invitation is accepted or cancelled.
 */
export async function resendInvite(
  db: Knex,
  mailer: Mailer,
  opts: { clubId: number; inviteId: number; publicUrl: string; now?: Date },
): Promise<Invite> {
  const now = opts.now ?? new Date();
  const row = await db.transaction(async (trx) => {
    const current: InviteRow | undefined = await trx('invites').where({ id: opts.inviteId, club_id: opts.clubId }).forUpdate().first();
    if (!current) throw notFound('That invitation');
    if (current.accepted_at) throw new AppError('conflict', 'This invitation has already been accepted.');
    if (current.cancelled_at) throw new AppError('conflict', 'This invitation is cancelled. Invite them again instead.');
    const { token, hash } = newToken();
    const [updated]: InviteRow[] = await trx('invites')
      .where({ id: current.id })
      .update({
        token_hash: hash,
        expires_at: new Date(now.getTime() + INVITE_TTL_MS),
        replaced_token_hashes: trx.raw('array_append(replaced_token_hashes, ?)', [current.token_hash]),
      })
      .returning('*');
    const club = await trx('clubs').where({ id: opts.clubId }).first('name');
    await queueInviteMail(trx, updated, club.name, token, opts.publicUrl);
    return updated;
  });
  kickMail(db, mailer);
  return toInvite(row);
}
