import { Router } from 'express';
import { z } from 'zod';
import { IdTextSchema } from '@shared/schemas/common';
import { LateRenewalBodySchema, OfferCreateBodySchema, OfferQuoteQuerySchema, SeasonCreateBodySchema, SeasonOpeningQuerySchema } from '@shared/schemas/seasons';
import type { Deps } from '../deps';
import { parseInput } from '../errors';
import { requireClubRole, requireRoleVia } from '../middleware/auth';
import { leftOutHolders, renewLeftOutHolder } from '../services/late-renewals';
import { quoteOffer } from '../services/offer-quotes';
import { idempotent } from '../middleware/idempotency';
import { createOffer } from '../services/offers';
import { listSeasonPlotStates } from '../services/season-plots';
import { clubOfSeason, getSeason, listSeasons, openSeason, previewSeasonOpening } from '../services/seasons';

const PlotStatesQuerySchema = z.object({ siteId: IdTextSchema });

/** A club's seasons (list, open one), mounted at /api/clubs/:clubId/seasons. */
export function clubSeasonsRouter({ db, mailer, config }: Deps): Router {
  const router = Router({ mergeParams: true });
  router.get('/', requireClubRole(db), async (req, res) => {
    res.json(await listSeasons(db, req.clubId!));
  });
  // What opening `year` would send, for the confirm step; sends nothing.
  router.get('/opening-preview', requireClubRole(db, 'coordinator'), async (req, res) => {
    const { year } = parseInput(SeasonOpeningQuerySchema, req.query);
    res.json(await previewSeasonOpening(db, { clubId: req.clubId!, year }));
  });
  router.post('/', requireClubRole(db, 'coordinator'), idempotent(db), async (req, res) => {
    const body = parseInput(SeasonCreateBodySchema, req.body);
    const result = await openSeason(db, mailer, {
      clubId: req.clubId!,
      userId: req.session.userId!,
      year: body.year,
      renewalDeadline: body.renewalDeadline ? new Date(body.renewalDeadline) : undefined,
      publicUrl: config.publicUrl,
    });
    res.status(201).json(result);
  });
  return router;
}

/** One season: its counts, where each plot stands, and making offers. Mounted at /api/seasons. */
export function seasonsRouter({ db, mailer, config }: Deps): Router {
  const router = Router();
  const member = requireRoleVia(db, 'seasonId', clubOfSeason, 'The season');
  const coordinator = requireRoleVia(db, 'seasonId', clubOfSeason, 'The season', 'coordinator');

  router.get('/:seasonId', member, async (req, res) => {
    res.json(await getSeason(db, Number(req.params.seasonId)));
  });

  router.get('/:seasonId/plot-states', member, async (req, res) => {
    const { siteId } = parseInput(PlotStatesQuerySchema, req.query);
    const viewer = { userId: req.session.userId!, roles: req.clubRoles! };
    res.json(await listSeasonPlotStates(db, { seasonId: Number(req.params.seasonId), clubId: req.clubId!, siteId, viewer }));
  });

  // Last season's holders with no renewal this season, and why (arrears are the coordinator's to see).
  router.get('/:seasonId/left-out', coordinator, async (req, res) => {
    const items = await leftOutHolders(db, Number(req.params.seasonId));
    res.json({ items, page: 1, total: items.length });
  });

  router.post('/:seasonId/late-renewals', coordinator, async (req, res) => {
    const body = parseInput(LateRenewalBodySchema, req.body);
    const result = await renewLeftOutHolder(db, mailer, {
      seasonId: Number(req.params.seasonId),
      allocationId: body.allocationId,
      userId: req.session.userId!,
      publicUrl: config.publicUrl,
    });
    res.status(201).json(result);
  });

  // What an offer would say (person, plot, deadline, fee) for the confirm step; sends nothing.
  router.get('/:seasonId/offer-quote', coordinator, async (req, res) => {
    const query = parseInput(OfferQuoteQuerySchema, req.query);
    res.json(await quoteOffer(db, { seasonId: Number(req.params.seasonId), clubId: req.clubId!, ...query }));
  });

  router.post('/:seasonId/offers', coordinator, idempotent(db), async (req, res) => {
    const body = parseInput(OfferCreateBodySchema, req.body);
    const offer = await createOffer(db, mailer, {
      seasonId: Number(req.params.seasonId),
      plotId: body.plotId,
      applicationId: body.applicationId,
      userId: req.session.userId!,
      deadline: body.deadline ? new Date(body.deadline) : undefined,
      publicUrl: config.publicUrl,
    });
    res.status(201).json(offer);
  });

  return router;
}
