import { Router } from 'express';
import type { Deps } from '../deps';
import { requireClubRole } from '../middleware/auth';
import { myPlot } from '../services/my-plot';

/** The signed-in member's own plot and pending renewal in one club, mounted at /api/clubs/:clubId/my-plot. */
export function myPlotRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.get('/', requireClubRole(db), async (req, res) => {
    res.json(await myPlot(db, req.clubId!, req.session.userId!));
  });
  return router;
}
