import { Router } from 'express';
import { PeopleImportBodySchema } from '@shared/schemas/member-imports';
import { sendCsv } from '../csv-download';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { importWaitlist, waitlistTemplateCsv } from '../services/waitlist-imports';

/** Waitlist CSV import and its template (coordinators), mounted at /api/clubs/:clubId/waitlist-imports. */
export function waitlistImportsRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.post('/', async (req, res) => {
    const body = parseInput(PeopleImportBodySchema, req.body);
    const result = await importWaitlist(db, { clubId: req.clubId!, csv: body.csv, commit: body.commit });
    res.status(body.commit ? 201 : 200).json(result);
  });

  router.get('/template.csv', async (_req, res) => {
    sendCsv(res, 'waitlist-template.csv', waitlistTemplateCsv());
  });

  return router;
}
