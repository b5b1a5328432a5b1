import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import type { Role } from '@shared/schemas/auth';

let counter = 0;
const next = () => `${Date.now().toString(36)}${(counter++).toString(36)}`;

// Hashing is the slow part of making people; one hash per distinct password is enough.
const hashCache = new Map<string, string>();
function hashOnce(password: string): string {
  let h = hashCache.get(password);
  if (!h) {
    h = bcrypt.hashSync(password, 10);
    hashCache.set(password, h);
  }
  return h;
}

export interface UserRow {
  id: number;
  email: string;
  name: string;
}

/** Inserts a person with a password (default "correct-horse-battery"). */
export async function buildUser(
  db: Knex,
  overrides: Partial<{ email: string; name: string; password: string | null }> = {},
): Promise<UserRow & { password: string | null }> {
  const password = overrides.password === undefined ? 'correct-horse-battery' : overrides.password;
  const [row] = await db('users')
    .insert({
      email: overrides.email ?? `person-${next()}@example.org`,
      name: overrides.name ?? 'Test Person',
      password_hash: password ? hashOnce(password) : null,
    })
    .returning(['id', 'email', 'name']);
  return { ...row, password };
}

/** Inserts a club. */
export async function buildClub(
  db: Knex,
  overrides: Partial<{ name: string; slug: string }> = {},
): Promise<{ id: number; name: string; slug: string }> {
  const slug = overrides.slug ?? `club-${next()}`;
  const [row] = await db('clubs')
    .insert({ name: overrides.name ?? `Test Club ${slug}`, slug })
    .returning(['id', 'name', 'slug']);
  return row;
}

/** Gives a person roles in a club, creating the person and the club when not given. */
export async function buildMember(
  db: Knex,
  opts: { clubId?: number; roles?: Role[]; user?: Parameters<typeof buildUser>[1] } = {},
) {
  const clubId = opts.clubId ?? (await buildClub(db)).id;
  const user = await buildUser(db, opts.user);
  const roles = opts.roles ?? ['plot_holder'];
  await db('memberships').insert(roles.map((role) => ({ club_id: clubId, user_id: user.id, role })));
  return { ...user, clubId, roles };
}
