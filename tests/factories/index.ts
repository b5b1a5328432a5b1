import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { cropBySlug } from '@shared/crops';
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

/** Puts someone on a club's waitlist; appliedAt (default now) also sets their place in the queue. */
export async function buildApplication(
  db: Knex,
  opts: {
    clubId: number;
    name?: string;
    email?: string;
    appliedAt?: Date;
    status?: 'waiting' | 'offered' | 'allocated' | 'removed' | 'withdrawn';
    needsAccessible?: boolean;
    needsRaised?: boolean;
    preferredSiteId?: number | null;
    preferredSize?: 'small' | 'medium' | 'large' | 'any';
  },
): Promise<{ id: number; name: string; email: string }> {
  const at = opts.appliedAt ?? new Date();
  const [row] = await db('applications')
    .insert({
      club_id: opts.clubId,
      name: opts.name ?? 'Waiting Person',
      email: opts.email ?? `applicant-${next()}@example.org`,
      status: opts.status ?? 'waiting',
      needs_accessible: opts.needsAccessible ?? false,
      needs_raised: opts.needsRaised ?? false,
      preferred_site_id: opts.preferredSiteId ?? null,
      preferred_size: opts.preferredSize ?? 'any',
      applied_at: at,
      queue_at: at,
    })
    .returning(['id', 'name', 'email']);
  return row;
}

/**
 * Puts a reference crop (club_id null, `data` the whole crop from shared/crops) into the crops table,
 * or returns the row already there, so tests work before and after the catalogue loader has run.
 */
export async function buildCrop(db: Knex, slug: string): Promise<{ id: number; slug: string; commonName: string; family: string }> {
  const crop = cropBySlug(slug);
  if (!crop) throw new Error(`No crop ${slug} in shared/crops`);
  await db.raw(
    `insert into crops (club_id, slug, common_name, family, kind, data) values (null, ?, ?, ?, ?, ?::jsonb)
     on conflict ((coalesce(club_id, 0)), slug) do nothing`,
    [crop.slug, crop.commonName, crop.family.value, crop.kind, JSON.stringify(crop)],
  );
  const row = await db('crops').whereNull('club_id').where({ slug }).first('id', 'slug', 'common_name', 'family');
  return { id: row.id, slug: row.slug, commonName: row.common_name, family: row.family };
}
