import { Router } from 'express';
import { TokenBodySchema } from '@shared/schemas/seasons';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireRoleVia } from '../middleware/auth';
import { authRateLimit } from '../middleware/rate-limit';
import { acceptOffer, clubOfOffer, declineOffer, previewOffer, withdrawOffer } from '../services/offers';

/** Answering an offer from its e-mailed link (public), and withdrawing one (coordinator). Mounted at /api/offers. */
export function offersRouter({ db, mailer, config }: Deps): Router {
  const router = Router();
  const limit = authRateLimit(db, 'offer-links', config.authRateLimit * 3);

  router.get('/preview', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.query);
    res.json(await previewOffer(db, token));
  });
  router.post('/accept', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.body);
    res.json(await acceptOffer(db, mailer, { token, publicUrl: config.publicUrl }));
  });
  router.post('/decline', limit, async (req, res) => {
    const { token } = parseInput(TokenBodySchema, req.body);
    res.json(await declineOffer(db, { token }));
  });
  router.post('/:offerId/withdraw', requireRoleVia(db, 'offerId', clubOfOffer, 'The offer', 'coordinator'), async (req, res) => {
    await withdrawOffer(db, { offerId: Number(req.params.offerId), userId: req.session.userId! });
    res.status(204).end();
  });
  return router;
}
