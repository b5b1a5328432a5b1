import { Router } from 'express';
import { MailingAudienceQuerySchema, MailingCreateBodySchema, MailPreferencesBodySchema } from '@shared/schemas/mailings';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { idempotent } from '../middleware/idempotency';
import { countAudience, getMailPreferences, listMailings, sendMailing, setMailPreferences } from '../services/mailings';

/** Messages from the coordinator to the club (coordinators), mounted at /api/clubs/:clubId/mailings. */
export function mailingsRouter({ db, mailer, config }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.get('/', async (req, res) => {
    res.json(await listMailings(db, req.clubId!));
  });

  router.get('/audience', async (req, res) => {
    res.json(await countAudience(db, req.clubId!, parseInput(MailingAudienceQuerySchema, req.query)));
  });

  router.post('/', idempotent(db), async (req, res) => {
    const body = parseInput(MailingCreateBodySchema, req.body);
    const result = await sendMailing(db, mailer, {
      clubId: req.clubId!,
      userId: req.session.userId!,
      body,
      publicUrl: config.publicUrl,
    });
    res.status(201).json(result);
  });

  return router;
}

/** The signed-in person's own optional e-mail choices in a club (any member), mounted at /api/clubs/:clubId/mail-preferences. */
export function mailPreferencesRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db));

  router.get('/', async (req, res) => {
    res.json(await getMailPreferences(db, req.clubId!, req.session.userId!));
  });

  router.put('/', async (req, res) => {
    const body = parseInput(MailPreferencesBodySchema, req.body);
    res.json(await setMailPreferences(db, req.clubId!, req.session.userId!, body));
  });

  return router;
}
