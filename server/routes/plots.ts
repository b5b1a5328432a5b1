import { Router } from 'express';
import { z } from 'zod';
import { MAX_INT4 } from '@shared/schemas/common';
import { PlotUpdateBodySchema } from '@shared/schemas/plots';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireRoleVia } from '../middleware/auth';
import { clubOfPlot, deletePlot, getPlotDetail, updatePlot } from '../services/plots';

const DeleteQuerySchema = z.object({ version: z.coerce.number().int().positive().max(MAX_INT4) });

/** One plot: its page, edits from the map, removal. Mounted at /api/plots. */
export function plotsRouter({ db }: Deps): Router {
  const router = Router();
  const member = requireRoleVia(db, 'plotId', clubOfPlot, 'The plot');
  const coordinator = requireRoleVia(db, 'plotId', clubOfPlot, 'The plot', 'coordinator');

  router.get('/:plotId', member, async (req, res) => {
    res.json(await getPlotDetail(db, Number(req.params.plotId), { userId: req.session.userId!, roles: req.clubRoles! }));
  });

  router.patch('/:plotId', coordinator, async (req, res) => {
    const body = parseInput(PlotUpdateBodySchema, req.body);
    res.json(await updatePlot(db, { plotId: Number(req.params.plotId), userId: req.session.userId!, body }));
  });

  router.delete('/:plotId', coordinator, async (req, res) => {
    const { version } = parseInput(DeleteQuerySchema, req.query);
    await deletePlot(db, { plotId: Number(req.params.plotId), userId: req.session.userId!, version });
    res.status(204).end();
  });

  return router;
}
