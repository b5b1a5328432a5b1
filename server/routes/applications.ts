import { Router } from 'express';
import { z } from 'zod';
import { textSchema } from '@shared/schemas/common';
import {
  ApplicationBodySchema,
  ApplicationRemoveBodySchema,
  WaitlistMoveBodySchema,
  WaitlistQuerySchema,
} from '@shared/schemas/applications';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole, requireRoleVia } from '../middleware/auth';
import { publicFormRateLimit } from '../middleware/rate-limit';
import {
  applicationHistory,
  applyInfo,
  clubOfApplication,
  listWaitlist,
  moveApplication,
  removeApplication,
  submitApplication,
} from '../services/applications';

const SlugParamSchema = z.object({ clubSlug: textSchema({ min: 1, max: 80 }) });

/** The public application form (no sign-in), mounted at /api/apply. */
export function applyRouter({ db, mailer, config }: Deps): Router {
  const router = Router();

  router.get('/:clubSlug', async (req, res) => {
    const { clubSlug } = parseInput(SlugParamSchema, req.params);
    res.json(await applyInfo(db, clubSlug));
  });

  router.post('/:clubSlug', publicFormRateLimit(db, config.applyRateLimit), async (req, res) => {
    const { clubSlug } = parseInput(SlugParamSchema, req.params);
    const body = parseInput(ApplicationBodySchema, req.body);
    res.status(201).json(await submitApplication(db, mailer, { slug: clubSlug, body }));
  });

  return router;
}

/** A club's waiting list (coordinators), mounted at /api/clubs/:clubId/waitlist. */
export function clubWaitlistRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireClubRole(db, 'coordinator'), async (req, res) => {
    const query = parseInput(WaitlistQuerySchema, req.query);
    res.json(await listWaitlist(db, req.clubId!, query));
  });

  return router;
}

/** Changing one person's place on the waiting list (coordinators of their club), mounted at /api/applications. */
export function applicationsRouter({ db }: Deps): Router {
  const router = Router();
  const coordinator = requireRoleVia(db, 'applicationId', clubOfApplication, 'The application', 'coordinator');

  router.post('/:applicationId/move', coordinator, async (req, res) => {
    const body = parseInput(WaitlistMoveBodySchema, req.body);
    const entry = await moveApplication(db, {
      applicationId: Number(req.params.applicationId),
      userId: req.session.userId!,
      ...body,
    });
    res.json(entry);
  });

  router.post('/:applicationId/remove', coordinator, async (req, res) => {
    const { reason } = parseInput(ApplicationRemoveBodySchema, req.body);
    const entry = await removeApplication(db, {
      applicationId: Number(req.params.applicationId),
      userId: req.session.userId!,
      reason,
    });
    res.json(entry);
  });

  router.get('/:applicationId/history', coordinator, async (req, res) => {
    res.json(await applicationHistory(db, Number(req.params.applicationId)));
  });

  return router;
}
