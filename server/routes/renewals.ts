import { Router } from 'express';
import { TokenBodySchema } from '@shared/schemas/seasons';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { authRateLimit } from '../middleware/rate-limit';
import { keepPlot, previewRenewal, releasePlot } from '../services/renewals';

/** Answering a renewal from its e-mailed link (public). Mounted at /api/renewals. */
export function renewalsRouter({ db, config }: Deps): Router {
  const router = Router();
  const limit = authRateLimit(config.authRateLimit * 3);
  router.get('/preview', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.query);
    res.json(await previewRenewal(db, token));
  });
  router.post('/keep', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.body);
    res.json(await keepPlot(db, { token }));
  });
  router.post('/release', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.body);
    res.json(await releasePlot(db, { token }));
  });
  return router;
}
