import { Router } from 'express';
import { PlotCreateBodySchema } from '@shared/schemas/plots';
import { z } from 'zod';
import { SiteArchiveBodySchema, SiteCreateBodySchema, SiteUpdateBodySchema, UnitsQuerySchema } from '@shared/schemas/sites';
import { siteFileName, sendCsv } from '../csv-download';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { JsonCache, sendCachedJson } from '../cache/json-cache';
import { requireClubRole, requireRoleVia } from '../middleware/auth';
import { exportPlotsCsv } from '../services/plot-imports';
import { createPlot, listPlots, siteNeighbours } from '../services/plots';
import { archiveSite, clubOfSite, createSite, deleteSite, getSite, listSites, updateSite } from '../services/sites';

const DeleteQuerySchema = z.object({ version: z.coerce.number().int().positive() });

/** A club's sites, mounted at /api/clubs/:clubId/sites. */
export function clubSitesRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireClubRole(db), async (req, res) => {
    res.json(await listSites(db, req.clubId!));
  });

  router.post('/', requireClubRole(db, 'coordinator'), async (req, res) => {
    const body = parseInput(SiteCreateBodySchema, req.body);
    res.status(201).json(await createSite(db, req.clubId!, body));
  });

  return router;
}

/** One site and the plots on it, mounted at /api/sites. */
export function sitesRouter({ db, storage }: Deps): Router {
  const router = Router();
  const member = requireRoleVia(db, 'siteId', clubOfSite, 'The site');
  const coordinator = requireRoleVia(db, 'siteId', clubOfSite, 'The site', 'coordinator');
  // About 200 bytes a plot: 32 MB holds the maps of some 300 sites of 500 plots.
  const mapCache = new JsonCache(32 * 1024 * 1024);

  router.get('/:siteId', member, async (req, res) => {
    res.json(await getSite(db, Number(req.params.siteId)));
  });

  router.patch('/:siteId', coordinator, async (req, res) => {
    const body = parseInput(SiteUpdateBodySchema, req.body);
    res.json(await updateSite(db, Number(req.params.siteId), body));
  });

  // Deleting is for a site with no records; one with allocations, fees or payments is archived instead.
  router.delete('/:siteId', coordinator, async (req, res) => {
    const { version } = parseInput(DeleteQuerySchema, req.query);
    await deleteSite(db, { siteId: Number(req.params.siteId), version, storage });
    res.status(204).end();
  });

  router.post('/:siteId/archive', coordinator, async (req, res) => {
    const { version } = parseInput(SiteArchiveBodySchema, req.body);
    await archiveSite(db, { siteId: Number(req.params.siteId), version });
    res.status(204).end();
  });

  // The map's two reads are the same for every member and are kept per server under the site's map stamp.
  router.get('/:siteId/plots', member, async (req, res) => {
    const siteId = Number(req.params.siteId);
    await sendCachedJson(req, res, mapCache, `plots:${siteId}`, req.via!.map_stamp, () => listPlots(db, siteId));
  });

  router.post('/:siteId/plots', coordinator, async (req, res) => {
    const body = parseInput(PlotCreateBodySchema, req.body);
    const plot = await createPlot(db, { siteId: Number(req.params.siteId), userId: req.session.userId!, body });
    res.status(201).json(plot);
  });

  router.get('/:siteId/plots.csv', member, async (req, res) => {
    const { units } = parseInput(UnitsQuerySchema, req.query);
    const site = await getSite(db, Number(req.params.siteId));
    sendCsv(res, siteFileName(site.name, 'plots.csv'), await exportPlotsCsv(db, site.id, units ?? site.units));
  });

  router.get('/:siteId/neighbours', member, async (req, res) => {
    const siteId = Number(req.params.siteId);
    await sendCachedJson(req, res, mapCache, `neighbours:${siteId}`, req.via!.map_stamp, () => siteNeighbours(db, siteId));
  });

  return router;
}
