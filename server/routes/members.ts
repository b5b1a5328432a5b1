import { Router } from 'express';
import { z } from 'zod';
import { MAX_INT4 } from '@shared/schemas/common';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { listMembers } from '../services/memberships';

const ListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(MAX_INT4).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(100),
});

/** A club's members and their roles (coordinators), mounted at /api/clubs/:clubId/members. */
export function membersRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.get('/', async (req, res) => {
    const q = parseInput(ListQuerySchema, req.query);
    res.json(await listMembers(db, req.clubId!, q));
  });

  return router;
}
