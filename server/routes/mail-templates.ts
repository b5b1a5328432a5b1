import { Router } from 'express';
import type { Deps } from '../deps';
import { requireClubRole } from '../middleware/auth';
import { listMailTemplates, previewMailTemplate } from '../services/mail-templates';

/** The club's e-mail templates and their previews with sample data (coordinators), mounted at /api/clubs/:clubId/mail-templates. */
export function mailTemplatesRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));
  router.get('/', (_req, res) => {
    res.json(listMailTemplates());
  });
  router.get('/:name/preview', async (req, res) => {
    res.json(await previewMailTemplate(db, { clubId: req.clubId!, name: String(req.params.name) }));
  });
  return router;
}
