import { Router } from 'express';
import { ClubSettingsUpdateBodySchema } from '@shared/schemas/clubs';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { getClubSettings, updateClubSettings } from '../services/clubs';
import { getClubChecklist, setChecklistHidden } from '../services/club-checklist';
import { ClubChecklistBodySchema } from '@shared/schemas/club-signups';

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

  // The first-run checklist on the coordinators' home: each step's state from the club's data.
  router.get('/checklist', requireClubRole(db, 'coordinator'), async (req, res) => {
    res.json(await getClubChecklist(db, req.clubId!));
  });

  router.patch('/checklist', requireClubRole(db, 'coordinator'), async (req, res) => {
    const { hidden } = parseInput(ClubChecklistBodySchema, req.body);
    res.json(await setChecklistHidden(db, req.clubId!, hidden));
  });

  return router;
}
