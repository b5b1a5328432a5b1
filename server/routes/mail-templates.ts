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
  // The HTML part as a page of its own, for the preview's iframe: e-mail HTML carries its styles inline,
  // which the app's policy (style-src 'self') refuses, so this answer has its own policy: inline styles
  // and data: images only, no scripts, no requests, sandboxed.
  router.get('/:name/preview.html', async (req, res) => {
    const preview = await previewMailTemplate(db, { clubId: req.clubId!, name: String(req.params.name) });
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; img-src data:; frame-ancestors 'self'; sandbox");
    res.type('html').send(preview.html);
  });
  return router;
}
