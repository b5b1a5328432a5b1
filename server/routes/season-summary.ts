import { Router } from 'express';
import type { Deps } from '../deps';
import { requireClubRole } from '../middleware/auth';
import { seasonSummary } from '../services/season-summary';

/** The season at a glance, mounted at /api/clubs/:clubId/season-summary: coordinators only (it adds up fees). */
export function seasonSummaryRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireClubRole(db, 'coordinator'), async (req, res) => {
    const viewer = { userId: req.session.userId!, roles: req.clubRoles! };
    res.json(await seasonSummary(db, { clubId: req.clubId!, viewer }));
  });

  return router;
}
