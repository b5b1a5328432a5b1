import { Router } from 'express';
import { FindingListQuerySchema, WhatFitsQuerySchema } from '@shared/schemas/findings';
import { PlantingCheckBodySchema } from '@shared/schemas/plot-book';
import type { Deps } from '../deps';
import { csvText } from '../services/csv-files';
import { sendCsv } from '../csv-download';
import { parseInput } from '../errors';
import { requireClubRole, requireRoleVia, requireUser } from '../middleware/auth';
import { clubOfSite } from '../services/sites';
import { checkPlantingDraft, findingsForCoordinator, whatFitsOnPlot } from '../services/findings-views';
import { idParam } from './params';

/**
 * The neighbour check, mounted at /api: a planting's dry run and "what fits here" for whoever may use
 * the plot book (checked in the services), and the season's findings for coordinators.
 */
export function findingsRouter({ db }: Deps): Router {
  const router = Router();

  router.post('/plots/:plotId/plantings/check', requireUser, async (req, res) => {
    const plotId = idParam(req, 'plotId');
    const body = parseInput(PlantingCheckBodySchema, req.body);
    res.json({ findings: await checkPlantingDraft(db, { plotId, userId: req.session.userId!, body, stamp: req.dbStamp }) });
  });

  router.get('/plots/:plotId/what-fits', requireUser, async (req, res) => {
    const plotId = idParam(req, 'plotId');
    const query = parseInput(WhatFitsQuerySchema, { ...req.query });
    res.json(await whatFitsOnPlot(db, { plotId, userId: req.session.userId!, query }));
  });

  router.get('/sites/:siteId/findings', requireRoleVia(db, 'siteId', clubOfSite, 'The site', 'coordinator'), async (req, res) => {
    const query = parseInput(FindingListQuerySchema, { ...req.query });
    res.json(await findingsForCoordinator(db, { clubId: req.clubId!, query: { ...query, siteId: idParam(req, 'siteId') }, siteChecked: true }));
  });

  const coordinator = requireClubRole(db, 'coordinator');

  router.get('/clubs/:clubId/findings', coordinator, async (req, res) => {
    const query = parseInput(FindingListQuerySchema, { ...req.query });
    res.json(await findingsForCoordinator(db, { clubId: req.clubId!, query }));
  });

  router.get('/clubs/:clubId/findings/export.csv', coordinator, async (req, res) => {
    const query = parseInput(FindingListQuerySchema, { ...req.query });
    const list = await findingsForCoordinator(db, { clubId: req.clubId!, query });
    const header = ['Season', 'Site', 'Plot', 'Crop', 'Severity', 'Kind', 'Finding', 'Explanation', 'Source', 'Evidence', 'Kept because'];
    const words = { clash: 'Clash', watch: 'Watch', good: 'Good pairing' } as const;
    const kinds = { rotation: 'Rotation', companion: 'Companions', shade: 'Shade', site_fit: 'Site fit' } as const;
    const rows = list.items.map((f) => [
      f.seasonYear,
      f.siteName,
      f.plotLabel,
      f.cropName,
      words[f.severity],
      kinds[f.kind],
      f.title,
      f.message,
      f.source.title,
      f.source.evidence.replace('_', ' '),
      f.keptReason ?? '',
    ]);
    sendCsv(res, `neighbour-check-${list.seasonYear ?? 'none'}.csv`, csvText(header, rows));
  });

  return router;
}
