import { Router } from 'express';
import { AllocationsExportQuerySchema } from '@shared/schemas/member-imports';
import { sendCsv } from '../csv-download';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import { allocationsCsv, membersCsv, waitlistCsv } from '../services/club-exports';

/** The club's members, waitlist and allocations as CSV downloads (coordinators), mounted at /api/clubs/:clubId/exports. */
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
