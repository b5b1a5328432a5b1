import { Router } from 'express';
import { z } from 'zod';
import { IdTextSchema, MAX_INT4 } from '@shared/schemas/common';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { MemberUpdateBodySchema, roles } from '@shared/schemas/auth';
import { listMembers, removeMembership, updateMember } from '../services/memberships';

const ListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(MAX_INT4).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(100),
});

const MemberParamsSchema = z.object({ userId: IdTextSchema });
const RoleParamsSchema = MemberParamsSchema.extend({ role: z.enum(roles, { message: `One of ${roles.join(', ')}` }) });

/** A club's members, their roles and concession (coordinators), mounted at /api/clubs/:clubId/members. */
export function membersRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.get('/', async (req, res) => {
    const q = parseInput(ListQuerySchema, req.query);
    res.json(await listMembers(db, req.clubId!, q));
  });

  // Sets the member's roles (the whole set) and or their concession.
  router.patch('/:userId', async (req, res) => {
    const { userId } = parseInput(MemberParamsSchema, req.params);
    const body = parseInput(MemberUpdateBodySchema, req.body);
    res.json(await updateMember(db, { clubId: req.clubId!, userId, ...body, actorId: req.session.userId! }));
  });

  // Removes the member from the club (every role).
  router.delete('/:userId', async (req, res) => {
    const { userId } = parseInput(MemberParamsSchema, req.params);
    await removeMembership(db, { clubId: req.clubId!, userId, actorId: req.session.userId! });
    res.status(204).end();
  });

  // Takes one role from the member.
  router.delete('/:userId/roles/:role', async (req, res) => {
    const { userId, role } = parseInput(RoleParamsSchema, req.params);
    await removeMembership(db, { clubId: req.clubId!, userId, role, actorId: req.session.userId! });
    res.status(204).end();
  });

  return router;
}
