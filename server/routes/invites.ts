import { Router } from 'express';
import { z } from 'zod';
import { IdTextSchema } from '@shared/schemas/common';
import { InviteAcceptBodySchema, InviteCreateBodySchema, type SessionInfo } from '@shared/schemas/auth';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { idempotent } from '../middleware/idempotency';
import { csrfToken } from '../middleware/csrf';
import { authRateLimit } from '../middleware/rate-limit';
import { signIn } from '../middleware/session';
import { loadSessionUser } from '../services/auth';
import { acceptInvite, cancelInvite, createInvite, listPendingInvites, previewInvite, resendInvite } from '../services/invites';

const PreviewQuerySchema = z.object({ token: z.string().min(20).max(200) });
const InviteParamsSchema = z.object({ inviteId: IdTextSchema });

/** A club's invitations (coordinators), mounted at /api/clubs/:clubId/invites. */
export function clubInvitesRouter({ db, mailer, config }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.get('/', async (req, res) => {
    res.json(await listPendingInvites(db, req.clubId!));
  });

  router.post('/', idempotent(db), async (req, res) => {
    const body = parseInput(InviteCreateBodySchema, req.body);
    const invite = await createInvite(db, mailer, {
      clubId: req.clubId!,
      invitedBy: req.session.userId!,
      body,
      publicUrl: config.publicUrl,
    });
    res.status(201).json(invite);
  });

  // A new link (the old one stops working) and 14 more days, for an invite that was lost or expired.
  router.post('/:inviteId/resend', async (req, res) => {
    const { inviteId } = parseInput(InviteParamsSchema, req.params);
    res.json(await resendInvite(db, mailer, { clubId: req.clubId!, inviteId, publicUrl: config.publicUrl }));
  });

  router.delete('/:inviteId', async (req, res) => {
    const { inviteId } = parseInput(InviteParamsSchema, req.params);
    await cancelInvite(db, req.clubId!, inviteId);
    res.status(204).end();
  });

  return router;
}

/** Following an invitation link (public), mounted at /api/invites. */
export function inviteLinksRouter({ db, config }: Deps): Router {
  const router = Router();

  router.get('/preview', async (req, res) => {
    const { token } = parseInput(PreviewQuerySchema, req.query);
    res.json(await previewInvite(db, token));
  });

  router.post('/accept', authRateLimit(db, 'invite-accept', config.authRateLimit), async (req, res) => {
    const input = parseInput(InviteAcceptBodySchema, req.body);
    const userId = await acceptInvite(db, { ...input, bcryptCost: config.bcryptCost });
    await signIn(req, userId);
    const body: SessionInfo = { user: await loadSessionUser(db, userId), csrfToken: csrfToken(req, res, config) };
    res.json(body);
  });

  return router;
}
