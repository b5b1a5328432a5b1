import type { ClubMembership, Member, Role } from '@shared/schemas/auth';
import type { Db } from '../db/knex';

/** The roles a person holds in one club (empty when they are not a member). */
export async function rolesInClub(db: Db, clubId: number, userId: number): Promise<Role[]> {
  const rows = await db('memberships').where({ club_id: clubId, user_id: userId }).select('role');
  return rows.map((r) => r.role as Role);
}

/** Every club a person belongs to, with their roles there. */
export async function clubsOfUser(db: Db, userId: number): Promise<ClubMembership[]> {
  const rows = await db('memberships as m')
    .join('clubs as c', 'c.id', 'm.club_id')
    .where('m.user_id', userId)
    .groupBy('c.id')
    .orderBy('c.name')
    .select('c.id', 'c.name', 'c.slug', db.raw('array_agg(m.role order by m.role) as roles'));
  return rows.map((r) => ({ clubId: r.id, clubName: r.name, clubSlug: r.slug, roles: r.roles as Role[] }));
}

/** Adds roles to a person in a club, keeping roles they already hold. */
export async function grantRoles(db: Db, clubId: number, userId: number, roles: Role[]): Promise<void> {
  if (roles.length === 0) return;
  await db('memberships')
    .insert(roles.map((role) => ({ club_id: clubId, user_id: userId, role })))
    .onConflict(['club_id', 'user_id', 'role'])
    .ignore();
}

/** One page of a club's members with their roles, by name. */
export async function listMembers(
  db: Db,
  clubId: number,
  opts: { page: number; pageSize: number },
): Promise<{ items: Member[]; page: number; total: number }> {
  const base = db('memberships as m').join('users as u', 'u.id', 'm.user_id').where('m.club_id', clubId);
  const [{ count }] = await base.clone().countDistinct({ count: 'u.id' });
  const rows = await base
    .clone()
    .groupBy('u.id')
    .orderBy('u.name')
    .limit(opts.pageSize)
    .offset((opts.page - 1) * opts.pageSize)
    .select(
      'u.id',
      'u.name',
      'u.email',
      db.raw('array_agg(m.role order by m.role) as roles'),
      db.raw('min(m.created_at) as joined_at'),
    );
  return {
    items: rows.map((r) => ({
      userId: r.id,
      name: r.name,
      email: r.email,
      roles: r.roles,
      joinedAt: new Date(r.joined_at).toISOString(),
    })),
    page: opts.page,
    total: Number(count),
  };
}
