import { Router } from 'express';
import { PeopleImportBodySchema } from '@shared/schemas/member-imports';
import { sendCsv } from '../csv-download';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { importMembers, membersTemplateCsv } from '../services/member-imports';

/** Members CSV import and its template (coordinators), mounted at /api/clubs/:clubId/member-imports. */
export function memberImportsRouter({ db, mailer, config }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.post('/', async (req, res) => {
    const body = parseInput(PeopleImportBodySchema, req.body);
    const result = await importMembers(db, mailer, {
      clubId: req.clubId!,
      userId: req.session.userId!,
      csv: body.csv,
      commit: body.commit,
      publicUrl: config.publicUrl,
    });
    res.status(body.commit ? 201 : 200).json(result);
  });

  router.get('/template.csv', async (_req, res) => {
    sendCsv(res, 'members-template.csv', membersTemplateCsv());
  });

  return router;
}
