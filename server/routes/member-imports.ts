import type { Response } from 'express';
import { Router } from 'express';
import {
  AllocationsExportQuerySchema,
  ImportTemplateQuerySchema,
  MemberImportBodySchema,
} from '@shared/schemas/member-imports';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { allocationsCsv, membersCsv, waitlistCsv } from '../services/club-exports';
import { importMembers, importWaitlist, membersTemplateCsv, waitlistTemplateCsv } from '../services/member-imports';

// A byte-order mark makes spreadsheet programs read the file as UTF-8 (common practice); imports drop it.
const BOM = '\uFEFF';

function sendCsv(res: Response, name: string, csv: string) {
  res.attachment(name);
  res.set({ 'Content-Type': 'text/csv; charset=utf-8', 'Cache-Control': 'private, no-cache' });
  res.send(BOM + csv);
}

/** Members and waiting list CSV imports and their templates (coordinators), mounted at /api/clubs/:clubId/member-imports. */
export function memberImportsRouter({ db, mailer, config }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.post('/', async (req, res) => {
    const body = parseInput(MemberImportBodySchema, req.body);
    const result =
      body.kind === 'members'
        ? await importMembers(db, mailer, {
            clubId: req.clubId!,
            userId: req.session.userId!,
            csv: body.csv,
            commit: body.commit,
            publicUrl: config.publicUrl,
          })
        : await importWaitlist(db, { clubId: req.clubId!, csv: body.csv, commit: body.commit });
    res.status(body.commit ? 201 : 200).json(result);
  });

  router.get('/template.csv', async (req, res) => {
    const { kind } = parseInput(ImportTemplateQuerySchema, req.query);
    sendCsv(res, `${kind}-template.csv`, kind === 'members' ? membersTemplateCsv() : waitlistTemplateCsv());
  });

  return router;
}

/** The club's members, waiting list and allocations as CSV downloads (coordinators), mounted at /api/clubs/:clubId/exports. */
export function clubExportsRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireClubRole(db, 'coordinator'));

  router.get('/members.csv', async (req, res) => {
    sendCsv(res, 'members.csv', await membersCsv(db, req.clubId!));
  });

  router.get('/waitlist.csv', async (req, res) => {
    sendCsv(res, 'waitlist.csv', await waitlistCsv(db, req.clubId!));
  });

  router.get('/allocations.csv', async (req, res) => {
    const { year } = parseInput(AllocationsExportQuerySchema, req.query);
    sendCsv(res, year ? `allocations-${year}.csv` : 'allocations.csv', await allocationsCsv(db, req.clubId!, year));
  });

  return router;
}
