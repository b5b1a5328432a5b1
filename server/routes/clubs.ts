import { Router } from 'express';
import { ClubSettingsUpdateBodySchema } from '@shared/schemas/clubs';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { getClubSettings, updateClubSettings } from '../services/clubs';

/**
 * One club's settings, mounted at /api/clubs/:clubId. Each route checks roles itself: a router-wide
 * check here would also run for every other /api/clubs/:clubId/... path passing through.
 */
export function clubsRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireClubRole(db), async (req, res) => {
    res.json(await getClubSettings(db, req.clubId!));
  });

  router.patch('/', requireClubRole(db, 'coordinator'), async (req, res) => {
    const body = parseInput(ClubSettingsUpdateBodySchema, req.body);
    res.json(await updateClubSettings(db, req.clubId!, body, { userId: req.session.userId! }));
  });

  return router;
}
