import { Router } from 'express';
import { z } from 'zod';
import { PlotImportBodySchema } from '@shared/schemas/plots';
import { UnitsSchema } from '@shared/schemas/sites';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireRoleVia } from '../middleware/auth';
import { exportPlotsCsv, importPlots, plotImportTemplateCsv } from '../services/plot-imports';
import { clubOfSite, getSite } from '../services/sites';

const UnitsQuerySchema = z.object({ units: UnitsSchema.optional() });

// A byte-order mark makes spreadsheet programs read the file as UTF-8 (common practice); the import drops it.
const BOM = '\uFEFF';

/** A download name from the site's name, without the characters file systems refuse. */
const fileName = (siteName: string, suffix: string) =>
  `${siteName.replace(/[\\/:*?"<>|\p{Cc}]+/gu, '-').trim() || 'site'}-${suffix}`;

/** Plot CSV import, export and template for one site. Mounted at /api/sites. */
export function plotImportsRouter({ db }: Deps): Router {
  const router = Router();
  const member = requireRoleVia(db, 'siteId', clubOfSite, 'The site');
  const coordinator = requireRoleVia(db, 'siteId', clubOfSite, 'The site', 'coordinator');

  router.post('/:siteId/plot-imports', coordinator, async (req, res) => {
    const body = parseInput(PlotImportBodySchema, req.body);
    const result = await importPlots(db, { siteId: Number(req.params.siteId), userId: req.session.userId!, ...body });
    res.status(body.commit ? 201 : 200).json(result);
  });

  router.get('/:siteId/plot-imports/template.csv', coordinator, async (req, res) => {
    const { units } = parseInput(UnitsQuerySchema, req.query);
    const site = await getSite(db, Number(req.params.siteId));
    res.attachment(fileName(site.name, 'plots-template.csv'));
    res.set('Content-Type', 'text/csv; charset=utf-8');
    res.send(BOM + plotImportTemplateCsv(units ?? site.units));
  });

  router.get('/:siteId/plots.csv', member, async (req, res) => {
    const { units } = parseInput(UnitsQuerySchema, req.query);
    const site = await getSite(db, Number(req.params.siteId));
    const csv = await exportPlotsCsv(db, site.id, units ?? site.units);
    res.attachment(fileName(site.name, 'plots.csv'));
    res.set({ 'Content-Type': 'text/csv; charset=utf-8', 'Cache-Control': 'private, no-cache' });
    res.send(BOM + csv);
  });

  return router;
}
