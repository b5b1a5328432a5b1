import { Router } from 'express';
import { FeeScheduleSchema, FeesQuerySchema, PaymentBodySchema } from '@shared/schemas/fees';
import { sendCsv } from '../csv-download';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole, requireRoleVia, requireUser } from '../middleware/auth';
import { idempotent } from '../middleware/idempotency';
import { getClubSettings } from '../services/clubs';
import { exportFeesCsv } from '../services/fee-csv';
import { clubOfFee, listFees, listMyFees } from '../services/fee-ledger';
import { getFeeSchedule, saveFeeSchedule } from '../services/fee-schedules';
import { recordPayment } from '../services/payments';

/**
 * A club's fee schedule and fees (coordinators), mounted at /api/clubs/:clubId. Roles are checked per
 * route so other /api/clubs/:clubId/... paths pass through untouched.
 */
export function clubFeesRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  const coordinator = requireClubRole(db, 'coordinator');

  router.get('/fee-schedule', coordinator, async (req, res) => {
    res.json(await getFeeSchedule(db, req.clubId!));
  });

  router.put('/fee-schedule', coordinator, async (req, res) => {
    const body = parseInput(FeeScheduleSchema, req.body);
    res.json(await saveFeeSchedule(db, req.clubId!, body));
  });

  router.get('/fees', coordinator, async (req, res) => {
    const query = parseInput(FeesQuerySchema, req.query);
    res.json(await listFees(db, req.clubId!, query));
  });

  router.get('/fees.csv', coordinator, async (req, res) => {
    const query = parseInput(FeesQuerySchema, req.query);
    const club = await getClubSettings(db, req.clubId!);
    const csv = await exportFeesCsv(db, req.clubId!, query);
    sendCsv(res, `${club.slug}-fees${query.year ? `-${query.year}` : ''}.csv`, csv);
  });

  return router;
}

/** Payments against one fee, mounted at /api/fees. */
export function feesRouter({ db, mailer }: Deps): Router {
  const router = Router();
  const coordinator = requireRoleVia(db, 'feeId', clubOfFee, 'The fee', 'coordinator');

  router.post('/:feeId/payments', coordinator, idempotent(db), async (req, res) => {
    const body = parseInput(PaymentBodySchema, req.body);
    const fee = await recordPayment(db, mailer, {
      feeId: Number(req.params.feeId),
      userId: req.session.userId!,
      body,
    });
    res.status(201).json(fee);
  });

  return router;
}

/** The signed-in person's own fees, mounted at /api/me/fees. */
export function myFeesRouter({ db }: Deps): Router {
  const router = Router();

  router.get('/', requireUser, async (req, res) => {
    res.json(await listMyFees(db, req.session.userId!));
  });

  return router;
}
