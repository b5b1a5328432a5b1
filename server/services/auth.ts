import bcrypt from 'bcryptjs';
import type { SessionUser } from '@shared/schemas/auth';
import type { Db } from '../db/knex';
import { clubsOfUser, startClub } from './memberships';

// Compared against when the address is unknown, so a wrong address costs as long as a wrong password.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password-for-timing', 10);

/** Hashes a password with bcrypt at the configured cost. */
export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

/** Returns the user id when e-mail and password match an account with a password set. */
export async function verifyCredentials(db: Db, email: string, password: string): Promise<number | null> {
  const user = await db('users').whereRaw('lower(email) = lower(?)', [email]).first('id', 'password_hash');
  const ok = await bcrypt.compare(password, user?.password_hash ?? DUMMY_HASH);
  return ok && user?.password_hash ? (user.id as number) : null;
}

/** The signed-in person as the client sees them, or null when the account is gone. */
export async function loadSessionUser(db: Db, userId: number): Promise<SessionUser | null> {
  const user = await db('users').where({ id: userId }).first('id', 'email', 'name', 'last_club_id');
  if (!user) return null;
  const clubs = await clubsOfUser(db, userId);
  return { id: user.id, email: user.email, name: user.name, clubs, startClubId: startClub(clubs, user.last_club_id) };
}

/** Finds a user id by e-mail, case-insensitively. */
export async function findUserIdByEmail(db: Db, email: string): Promise<number | null> {
  const row = await db('users').whereRaw('lower(email) = lower(?)', [email]).first('id');
  return row ? (row.id as number) : null;
}
