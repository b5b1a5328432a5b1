import type { Knex } from 'knex';
import type { PasswordResetCheck } from '@shared/schemas/auth';
import { AppError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { passwordResetMail } from '../mail/templates';
import { hashPassword } from './auth';
import { enqueueMail, kickMail } from './outbox';
import { hashToken, newToken } from './tokens';

const RESET_TTL_MS = 60 * 60 * 1000;

/** Sends a reset link when the address has an account; says nothing either way. */
export async function requestPasswordReset(
  db: Knex,
  mailer: Mailer,
  opts: { email: string; publicUrl: string; now?: Date },
): Promise<void> {
  const user = await db('users').whereRaw('lower(email) = lower(?)', [opts.email]).first('id', 'name', 'email');
  if (!user) return;
  const now = opts.now ?? new Date();
  const { token, hash } = newToken();
  const expiresAt = new Date(now.getTime() + RESET_TTL_MS);
  const url = `${opts.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
  // A person belongs to clubs, not to a zone: the time is shown in their first club's zone.
  const club = await db('memberships as m').join('clubs as c', 'c.id', 'm.club_id').where('m.user_id', user.id).orderBy('m.club_id').first('c.time_zone');
  await db.transaction(async (trx) => {
    await trx('password_resets').insert({ user_id: user.id, token_hash: hash, expires_at: expiresAt });
    await enqueueMail(
      trx,
      { clubId: null, kind: 'password_reset' },
      passwordResetMail({ to: user.email, name: user.name, url, expiresAt, timeZone: club?.time_zone ?? 'UTC' }),
    );
  });
  kickMail(db, mailer);
}

/**
 * Says whether a reset link still works, without using it: 404 for a link we never made, 410 for one
 * used or expired; a working one says whether the account has no password yet (its first).
 */
export async function checkPasswordReset(db: Knex, opts: { token: string; now?: Date }): Promise<PasswordResetCheck> {
  const row = await db('password_resets as r')
    .join('users as u', 'u.id', 'r.user_id')
    .where('r.token_hash', hashToken(opts.token))
    .first('r.used_at', 'r.expires_at', 'u.password_hash');
  if (!row) throw notFound('That reset link');
  if (row.used_at || row.expires_at <= (opts.now ?? new Date())) {
    throw new AppError('gone', 'This reset link has been used or has expired. Ask for a new one.');
  }
  return { firstPassword: !row.password_hash };
}

/** Sets a new password from a reset link; the link works once and only before it expires. */
export async function completePasswordReset(
  db: Knex,
  opts: { token: string; password: string; bcryptCost: number; now?: Date },
): Promise<number> {
  const passwordHash = await hashPassword(opts.password, opts.bcryptCost);
  return db.transaction(async (trx) => {
    const used = await trx('password_resets')
      .where({ token_hash: hashToken(opts.token) })
      .whereNull('used_at')
      .where('expires_at', '>', opts.now ?? new Date())
      .update({ used_at: trx.fn.now() })
      .returning('user_id');
    if (used.length === 0) {
      throw new AppError('gone', 'This reset link has been used or has expired. Ask for a new one.');
    }
    const userId = used[0].user_id as number;
    await trx('users').where({ id: userId }).update({ password_hash: passwordHash, updated_at: trx.fn.now() });
    // Any other outstanding links for this person stop working too.
    await trx('password_resets').where({ user_id: userId }).whereNull('used_at').update({ used_at: trx.fn.now() });
    await trx('session').whereRaw(`(sess->>'userId')::int = ?`, [userId]).delete();
    return userId;
  });
}

/** A single-use link for a person who has no password yet to choose one (valid for a week). */
export async function createPasswordLink(
  db: Knex | Knex.Transaction,
  opts: { userId: number; publicUrl: string; now?: Date },
): Promise<string> {
  const { token, hash } = newToken();
  const expiresAt = new Date((opts.now ?? new Date()).getTime() + 7 * 24 * 60 * 60 * 1000);
  await db('password_resets').insert({ user_id: opts.userId, token_hash: hash, expires_at: expiresAt });
  return `${opts.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
}
