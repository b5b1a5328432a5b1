import { Router } from 'express';
import { HarvestFiguresQuerySchema } from '@shared/schemas/harvest-figures';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { getHarvestFigures } from '../services/harvest-figures';

/** The club's harvest figures per crop, mounted at /api/clubs/:clubId/harvest-figures: any member reads (aggregated, it names nobody). */
export function harvestFiguresRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireClubRole(db), async (req, res) => {
    const query = parseInput(HarvestFiguresQuerySchema, req.query);
    res.json(await getHarvestFigures(db, { clubId: req.clubId!, query }));
  });

  return router;
}
