import { Router } from 'express';
import { parseIdText } from '@shared/schemas/common';
import { TokenBodySchema } from '@shared/schemas/seasons';
import type { Deps } from '../deps';
import { AppError, parseInput } from '../errors';
import { requireUser } from '../middleware/auth';
import { authRateLimit } from '../middleware/rate-limit';
import { keepPlot, previewRenewal, releasePlot, type RenewalRef } from '../services/renewals';

/**
 * Answering a renewal, mounted at /api/renewals: from its e-mailed link (public, by token), or by
 * its id when its holder is signed in (the link on the club home); another person's id is 404.
 */
export function renewalsRouter({ db, config }: Deps): Router {
  const router = Router();
  const limit = authRateLimit(db, 'renewal-links', config.authRateLimit * 3);
  router.get('/preview', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.query);
    res.json(await previewRenewal(db, { token }));
  });
  router.post('/keep', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.body);
    res.json(await keepPlot(db, { token }));
  });
  router.post('/release', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.body);
    res.json(await releasePlot(db, { token }));
  });

  const own = (param: unknown, userId: number): RenewalRef => {
    const renewalId = parseIdText(param);
    if (renewalId === null) throw new AppError('validation_failed', 'Invalid renewal.', { renewalId: 'Must be a whole number from 1 to 2147483647' });
    return { renewalId, userId };
  };
  router.get('/:renewalId', requireUser, async (req, res) => {
    res.json(await previewRenewal(db, own(req.params.renewalId, req.session.userId!)));
  });
  router.post('/:renewalId/keep', requireUser, async (req, res) => {
    res.json(await keepPlot(db, own(req.params.renewalId, req.session.userId!)));
  });
  router.post('/:renewalId/release', requireUser, async (req, res) => {
    res.json(await releasePlot(db, own(req.params.renewalId, req.session.userId!)));
  });
  return router;
}
