import { Router } from 'express';
import { PlotImportBodySchema } from '@shared/schemas/plots';
import { UnitsQuerySchema } from '@shared/schemas/sites';
import { siteFileName, sendCsv } from '../csv-download';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireRoleVia } from '../middleware/auth';
import { importPlots, plotImportTemplateCsv } from '../services/plot-imports';
import { clubOfSite, getSite } from '../services/sites';

/** Plot CSV import and its template for one site, mounted at /api/sites/:siteId/plot-imports. */
export function plotImportsRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  const coordinator = requireRoleVia(db, 'siteId', clubOfSite, 'The site', 'coordinator');

  router.post('/', coordinator, async (req, res) => {
    const body = parseInput(PlotImportBodySchema, req.body);
    const result = await importPlots(db, { siteId: Number(req.params.siteId), userId: req.session.userId!, ...body });
    res.status(body.commit ? 201 : 200).json(result);
  });

  router.get('/template.csv', coordinator, async (req, res) => {
    const { units } = parseInput(UnitsQuerySchema, req.query);
    const site = await getSite(db, Number(req.params.siteId));
    sendCsv(res, siteFileName(site.name, 'plots-template.csv'), plotImportTemplateCsv(units ?? site.units));
  });

  return router;
}
