import type { Knex } from 'knex';
import type { ClubSignupBody, ClubSignupCheck } from '@shared/schemas/club-signups';
import { AppError, notFound } from '../errors';
import type { Mailer } from '../mail/mailer';
import { clubSignupMail } from '../mail/templates';
import { hashPassword } from './auth';
import { grantRoles } from './memberships';
import { enqueueMail, kickMail } from './outbox';
import { hashToken, newToken } from './tokens';

/** A sign-up link works for a day: long enough to find the mail, short enough that a forgotten one dies. */
export const SIGNUP_TTL_MS = 24 * 60 * 60 * 1000;

const USED = 'This link has already been used.';
const EXPIRED = 'This link has expired.';

/** A URL-safe slug from a club's name: lower case ASCII letters and digits joined by dashes. */
export function slugFrom(name: string): string {
  const base = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/g, '');
  return base || 'club';
}

/** The slug, or the slug with the first free number after it (`name-2`, `name-3` …), free in `clubs`. */
async function freeSlug(trx: Knex.Transaction, name: string): Promise<string> {
  const base = slugFrom(name);
  const taken = new Set<string>(
    (await trx('clubs').where('slug', base).orWhere('slug', 'like', `${base}-%`).select('slug')).map((r: { slug: string }) => r.slug),
  );
  if (!taken.has(base)) return base;
  for (let n = 2; ; n += 1) if (!taken.has(`${base}-${n}`)) return `${base}-${n}`;
}

/**
 * Records a sign-up and e-mails its link. The answer and the mail are the same whether or not the address
 * already has an account: what differs is said only to whoever follows the link (which proves the address).
 */
export async function requestClubSignup(
  db: Knex,
  mailer: Mailer,
  opts: { body: ClubSignupBody; publicUrl: string; bcryptCost: number; now?: Date },
): Promise<void> {
  const now = opts.now ?? new Date();
  const { body } = opts;
  const passwordHash = await hashPassword(body.password, opts.bcryptCost);
  const { token, hash } = newToken();
  const expiresAt = new Date(now.getTime() + SIGNUP_TTL_MS);
  const url = `${opts.publicUrl}/start-a-club?token=${encodeURIComponent(token)}`;
  await db.transaction(async (trx) => {
    await trx('club_signups').insert({
      email: body.email,
      name: body.name,
      password_hash: passwordHash,
      club_name: body.clubName,
      time_zone: body.timeZone,
      currency: body.currency,
      units: body.units,
      token_hash: hash,
      expires_at: expiresAt,
    });
    await enqueueMail(
      trx,
      { clubId: null, kind: 'club_signup' },
      clubSignupMail({ to: body.email, name: body.name, clubName: body.clubName, url, expiresAt, timeZone: body.timeZone }),
    );
  });
  kickMail(db, mailer);
}

interface SignupRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  club_name: string;
  time_zone: string;
  currency: string;
  units: string;
  expires_at: Date;
  used_at: Date | null;
}

async function liveSignup(db: Knex | Knex.Transaction, token: string, now: Date, lock = false): Promise<SignupRow> {
  const q = db('club_signups').where({ token_hash: hashToken(token) });
  const row: SignupRow | undefined = await (lock ? q.forUpdate() : q).first();
  if (!row) throw notFound('That sign-up link');
  if (row.used_at) throw new AppError('gone', USED, { token: 'used' });
  if (row.expires_at <= now) throw new AppError('gone', EXPIRED, { token: 'expired' });
  return row;
}

/** What the confirm page shows before anything is made: 404 for a link we never sent, 410 used or expired. */
export async function checkClubSignup(db: Knex, opts: { token: string; now?: Date }): Promise<ClubSignupCheck> {
  const row = await liveSignup(db, opts.token, opts.now ?? new Date());
  return { clubName: row.club_name, email: row.email };
}

/**
 * Uses the link once: in one transaction, makes the club (a free slug from its name), the person (or finds
 * the account the address already has, whose password is never touched) and makes them its coordinator.
 */
export async function confirmClubSignup(
  db: Knex,
  opts: { token: string; now?: Date },
): Promise<{ clubId: number; clubSlug: string; userId: number; existingAccount: boolean }> {
  const now = opts.now ?? new Date();
  return db.transaction(async (trx) => {
    const signup = await liveSignup(trx, opts.token, now, true);
    // Two sign-ups racing for one slug: the club table's lock keeps the free-slug read and the insert together.
    await trx.raw('lock table clubs in share row exclusive mode');
    const slug = await freeSlug(trx, signup.club_name);
    const [club] = await trx('clubs')
      .insert({ name: signup.club_name, slug, currency: signup.currency, time_zone: signup.time_zone, units: signup.units })
      .returning(['id', 'slug']);
    const user = await trx('users').whereRaw('lower(email) = lower(?)', [signup.email]).first('id', 'password_hash');
    let userId: number;
    let existingAccount = false;
    if (user?.password_hash) {
      userId = user.id;
      existingAccount = true;
    } else if (user) {
      // An account made by an import or invitation that never chose a password: the link proves the address.
      await trx('users').where({ id: user.id }).update({ name: signup.name, password_hash: signup.password_hash, updated_at: trx.fn.now() });
      userId = user.id;
    } else {
      const [created] = await trx('users').insert({ email: signup.email, name: signup.name, password_hash: signup.password_hash }).returning('id');
      userId = created.id;
    }
    await grantRoles(trx, club.id, userId, ['coordinator']);
    await trx('users').where({ id: userId }).update({ last_club_id: club.id });
    // The chosen password's hash is not kept once used (nor for an existing account, which keeps its own).
    await trx('club_signups').where({ id: signup.id }).update({ used_at: now, club_id: club.id, password_hash: '' });
    return { clubId: club.id as number, clubSlug: club.slug as string, userId, existingAccount };
  });
}
