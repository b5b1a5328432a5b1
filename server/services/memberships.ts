import type { Knex } from 'knex';
import type { ClubMembership, Member, Role } from '@shared/schemas/auth';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { recordPlotEvent } from './plot-events';
import { repriceUnpaidFees } from './fee-charges';

/**
 * How a record names its club: a query over the record (by its id) selecting one `club_id`,
 * for an archived or removed record none. requireRoleVia folds it into its role check; any other
 * column the lookup selects (a cache stamp) is left on req.via.
 */
export type ClubLookup = (db: Db, id: number) => Knex.QueryBuilder;

/** The record's club id, or null when the lookup finds nothing. */
export async function clubIdVia(db: Db, lookup: ClubLookup, id: number): Promise<number | null> {
  const row = await lookup(db, id).first();
  return row ? (row.club_id as number) : null;
}

/**
 * The record's club and the person's roles there in one query (the role check runs on every
 * request, so it costs one round trip); null when the record is not found.
 */
/** Like clubAndRolesVia, with the person's roles already known (read with the session). */
export async function clubVia(
  db: Db,
  lookup: ClubLookup,
  id: number,
  memberships: Record<string, Role[]>,
): Promise<{ clubId: number; roles: Role[]; row: Record<string, unknown> } | null> {
  const row = await lookup(db, id).first();
  return row ? { clubId: row.club_id as number, roles: memberships[row.club_id] ?? [], row } : null;
}

export async function clubAndRolesVia(
  db: Db,
  lookup: ClubLookup,
  id: number,
  userId: number,
): Promise<{ clubId: number; roles: Role[]; row: Record<string, unknown> } | null> {
  const row = await db
    .from(lookup(db, id).limit(1).as('x'))
    .first(
      'x.*',
      db.raw("coalesce((select array_agg(m.role::text) from memberships m where m.club_id = x.club_id and m.user_id = ?), '{}') as roles", [userId]),
    );
  return row ? { clubId: row.club_id as number, roles: row.roles as Role[], row } : null;
}

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

// How much a role gives a person to do in a club; a coordinator runs it, so that club comes first.
const roleWeight: Record<Role, number> = { coordinator: 4, plot_holder: 2, volunteer: 1 };

/**
 * The club "/" opens: the one the person last worked in while they still belong to it, else the
 * one where their roles give them the most to do (ties by name, the order of `clubs`).
 */
export function startClub(clubs: ClubMembership[], lastClubId: number | null): number | null {
  if (lastClubId !== null && clubs.some((c) => c.clubId === lastClubId)) return lastClubId;
  let best: ClubMembership | null = null;
  let bestScore = -1;
  for (const club of clubs) {
    const score = club.roles.reduce((sum, role) => sum + roleWeight[role], 0);
    if (score > bestScore) [best, bestScore] = [club, score];
  }
  return best ? best.clubId : null;
}

/** Remembers the club the person is working in; refuses a club they do not belong to. */
export async function rememberCurrentClub(db: Db, userId: number, clubId: number): Promise<void> {
  const member = await db('memberships').where({ user_id: userId, club_id: clubId }).first('club_id');
  if (!member) throw new AppError('forbidden', 'You are not a member of this club.');
  await db('users').where({ id: userId }).update({ last_club_id: clubId });
}

/** Adds roles to a person in a club, keeping roles they already hold. */
export async function grantRoles(db: Db, clubId: number, userId: number, roles: Role[]): Promise<void> {
  if (roles.length === 0) return;
  await db('memberships')
    .insert(roles.map((role) => ({ club_id: clubId, user_id: userId, role })))
    .onConflict(['club_id', 'user_id', 'role'])
    .ignore();
}

/** One page of a club's members with their roles and concession, by name. */
export async function listMembers(
  db: Db,
  clubId: number,
  opts: { page: number; pageSize: number },
): Promise<{ items: Member[]; page: number; total: number }> {
  const [{ count }] = await db('memberships').where({ club_id: clubId }).countDistinct({ count: 'user_id' });
  const rows = await memberRows(db, clubId)
    .orderBy('u.name')
    .limit(opts.pageSize)
    .offset((opts.page - 1) * opts.pageSize);
  return { items: rows.map(toMember), page: opts.page, total: Number(count) };
}

function memberRows(db: Db, clubId: number) {
  return db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .leftJoin('member_settings as ms', (j) => j.on('ms.club_id', 'm.club_id').andOn('ms.user_id', 'm.user_id'))
    .where('m.club_id', clubId)
    .groupBy('u.id', 'ms.has_concession')
    .select(
      'u.id',
      'u.name',
      'u.email',
      db.raw('array_agg(m.role order by m.role) as roles'),
      db.raw('min(m.created_at) as joined_at'),
      db.raw('coalesce(ms.has_concession, false) as has_concession'),
    );
}

function toMember(r: { id: number; name: string; email: string; roles: Role[]; joined_at: Date; has_concession: boolean }): Member {
  return {
    userId: r.id,
    name: r.name,
    email: r.email,
    roles: r.roles,
    concession: r.has_concession,
    joinedAt: new Date(r.joined_at).toISOString(),
  };
}

/**
 * Takes one role (or, without role, every role) from a member of a club, in one transaction.
 * A club keeps at least one coordinator. Someone who stops being a plot holder gives up what they
 * hold in the club's newest season: their pending renewals are released and their plots there freed
 * (history and fees stay). Removing the whole member also cancels their pending invitations to the
 * club. Roles are read on every request, so their open sessions lose the club at once.
 */
export async function removeMembership(
  db: Knex,
  opts: { clubId: number; userId: number; role?: Role; actorId: number; now?: Date },
): Promise<void> {
  const now = opts.now ?? new Date();
  await db.transaction(async (trx) => {
    // Serialises membership changes in a club, so two coordinators removing each other leave one.
    await trx('clubs').where({ id: opts.clubId }).forUpdate().first('id');
    const held = await rolesInClub(trx, opts.clubId, opts.userId);
    if (held.length === 0 || (opts.role && !held.includes(opts.role))) throw notFound(opts.role ? 'That role of the member' : 'The member');
    await takeRoles(trx, { ...opts, removing: opts.role ? [opts.role] : held, now });
    if (!opts.role) {
      const user = await trx('users').where({ id: opts.userId }).first('email');
      await trx('invites')
        .where({ club_id: opts.clubId })
        .whereRaw('lower(email) = lower(?)', [user.email])
        .whereNull('accepted_at')
        .whereNull('cancelled_at')
        .update({ cancelled_at: now });
    }
  });
}

/**
 * A coordinator's change to a member, in one transaction: the new set of roles (taking a role away
 * has the same effects as removing it, and the club keeps a coordinator) and the concession, which
 * also re-prices the member's fees that have nothing paid yet. Returns the member as listed.
 */
export async function updateMember(
  db: Knex,
  opts: { clubId: number; userId: number; roles?: Role[]; concession?: boolean; actorId: number; now?: Date },
): Promise<Member> {
  const now = opts.now ?? new Date();
  await db.transaction(async (trx) => {
    await trx('clubs').where({ id: opts.clubId }).forUpdate().first('id');
    const held = await rolesInClub(trx, opts.clubId, opts.userId);
    if (held.length === 0) throw notFound('The member');
    if (opts.roles) {
      const wanted = opts.roles;
      const removing = held.filter((r) => !wanted.includes(r));
      if (removing.length > 0) await takeRoles(trx, { ...opts, removing, now });
      await grantRoles(trx, opts.clubId, opts.userId, wanted.filter((r) => !held.includes(r)));
    }
    if (opts.concession !== undefined) {
      await trx('member_settings')
        .insert({ club_id: opts.clubId, user_id: opts.userId, has_concession: opts.concession, updated_by_user_id: opts.actorId, updated_at: now })
        .onConflict(['club_id', 'user_id'])
        .merge(['has_concession', 'updated_by_user_id', 'updated_at']);
      await repriceUnpaidFees(trx, { clubId: opts.clubId, userId: opts.userId, concession: opts.concession });
    }
  });
  return getMember(db, opts.clubId, opts.userId);
}

async function getMember(db: Db, clubId: number, userId: number): Promise<Member> {
  const [row] = await memberRows(db, clubId).where('u.id', userId);
  if (!row) throw notFound('The member');
  return toMember(row);
}

/** Takes roles from a member inside the caller's transaction, with what losing each role means. */
async function takeRoles(
  trx: Knex.Transaction,
  opts: { clubId: number; userId: number; removing: Role[]; actorId: number; now: Date },
): Promise<void> {
  const { removing, now } = opts;
  if (removing.includes('coordinator')) {
    const [{ n }] = await trx('memberships').where({ club_id: opts.clubId, role: 'coordinator' }).count({ n: '*' });
    if (Number(n) <= 1) {
      throw new AppError('conflict', 'A club needs at least one coordinator. Make someone else coordinator first.');
    }
  }
  await trx('memberships').where({ club_id: opts.clubId, user_id: opts.userId }).whereIn('role', removing).delete();

  if (removing.includes('plot_holder')) {
    const renewals = await trx('renewals as r')
      .join('seasons as s', 's.id', 'r.season_id')
      .where({ 's.club_id': opts.clubId, 'r.user_id': opts.userId, 'r.status': 'pending' })
      .select('r.id', 'r.plot_id', 's.year');
    for (const r of renewals) {
      await trx('renewals').where({ id: r.id }).update({ status: 'released', answered_at: now });
      await recordPlotEvent(trx, {
        plotId: r.plot_id,
        userId: opts.actorId,
        kind: 'renewal_withdrawn',
        details: { summary: `Renewal for ${r.year} withdrawn: the holder was removed from the club` },
      });
    }
    const newest = await trx('seasons').where({ club_id: opts.clubId }).orderBy('year', 'desc').first('id', 'year');
    if (newest) {
      const held = await trx('allocations')
        .where({ season_id: newest.id, user_id: opts.userId, status: 'active' })
        .select('id', 'plot_id');
      for (const a of held) {
        await trx('allocations').where({ id: a.id }).update({ status: 'released', released_at: now });
        await recordPlotEvent(trx, {
          plotId: a.plot_id,
          userId: opts.actorId,
          kind: 'allocation_released',
          details: { summary: `Freed for ${newest.year}: the holder was removed from the club` },
        });
      }
    }
  }
}
