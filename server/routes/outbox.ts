import { Router } from 'express';
import { z } from 'zod';
import { OutboxQuerySchema } from '@shared/schemas/outbox';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { listOutbox, resendMail } from '../services/outbox';

const MessageParamsSchema = z.object({ messageId: z.coerce.number().int().positive('A message id') });

/** A club's outgoing e-mail and resending a failed one (coordinators), mounted at /api/clubs/:clubId/outbox. */
export function outboxRouter({ db, mailer }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.get('/', async (req, res) => {
    const query = parseInput(OutboxQuerySchema, req.query);
    res.json(await listOutbox(db, req.clubId!, query));
  });

  router.post('/:messageId/resend', async (req, res) => {
    const { messageId } = parseInput(MessageParamsSchema, req.params);
    res.json(await resendMail(db, mailer, { clubId: req.clubId!, messageId }));
  });

  return router;
}
