import { Router } from 'express';
import type { Deps } from '../deps';
import { previewStop, useStop } from '../services/mail-stops';

/**
 * Stop links of optional mail, mounted at /api/mail-stops before the CSRF check: the token is the
 * only key, no sign-in is asked, and mail providers POST the one-click (RFC 8058) with no session or
 * CSRF token. GET changes nothing (a browser asking for HTML is sent to the confirm page).
 */
export function mailStopsRouter({ db }: Deps): Router {
  const router = Router();
  router.get('/:token', async (req, res) => {
    // A person's browser gets the confirm page, which also explains a link that is not valid.
    if (req.accepts(['json', 'html']) === 'html') {
      res.redirect(303, `/stop-mail?token=${encodeURIComponent(req.params.token)}`);
      return;
    }
    res.json(await previewStop(db, req.params.token));
  });
  router.post('/:token', async (req, res) => {
    res.json(await useStop(db, req.params.token));
  });
  return router;
}
