import { Router } from 'express';
import {
  cropOverrideBodySchema,
  CropCreateBodySchema,
  CropListQuerySchema,
  CropOverrideParamsSchema,
  CropParamsSchema,
  CropRelationCreateBodySchema,
  CropRelationParamsSchema,
} from '@shared/schemas/crops';
import type { Deps } from '../deps';
import { recheckClub } from '../services/findings';
import { parseInput } from '../errors';
import { requireClubRole } from '../middleware/auth';
import {
  createClubCrop,
  createClubRelation,
  getCropDetail,
  listCrops,
  removeClubRelation,
  removeCropOverride,
  setCropOverride,
} from '../services/crops';

/**
 * The crop notes a club sees, mounted at /api/clubs/:clubId/crops: any member reads; coordinators add
 * club crops and relations and set the club's own values on reference crops.
 */
export function cropsRouter({ db }: Deps): Router {
  const router = Router({ mergeParams: true });
  const member = requireClubRole(db);
  const coordinator = requireClubRole(db, 'coordinator');

  router.get('/', member, async (req, res) => {
    const q = parseInput(CropListQuerySchema, req.query);
    res.json(await listCrops(db, req.clubId!, q));
  });

  router.post('/', coordinator, async (req, res) => {
    const body = parseInput(CropCreateBodySchema, req.body);
    res.status(201).json(await createClubCrop(db, { clubId: req.clubId!, userId: req.session.userId!, body }));
  });

  router.post('/relations', coordinator, async (req, res) => {
    const body = parseInput(CropRelationCreateBodySchema, req.body);
    // The club's crop notes feed the neighbour check: re-check the club in the same transaction.
    const relation = await db.transaction(async (trx) => {
      const made = await createClubRelation(trx, { clubId: req.clubId!, userId: req.session.userId!, body });
      await recheckClub(trx, req.clubId!);
      return made;
    });
    res.status(201).json(relation);
  });

  router.delete('/relations/:relationId', coordinator, async (req, res) => {
    const { relationId } = parseInput(CropRelationParamsSchema, req.params);
    await db.transaction(async (trx) => {
      await removeClubRelation(trx, { clubId: req.clubId!, relationId });
      await recheckClub(trx, req.clubId!);
    });
    res.status(204).end();
  });

  router.get('/:cropId', member, async (req, res) => {
    const { cropId } = parseInput(CropParamsSchema, req.params);
    res.json(await getCropDetail(db, req.clubId!, cropId));
  });

  router.put('/:cropId/overrides/:field', coordinator, async (req, res) => {
    const { cropId, field } = parseInput(CropOverrideParamsSchema, req.params);
    const body = parseInput(cropOverrideBodySchema(field), req.body);
    const crop = await db.transaction(async (trx) => {
      const changed = await setCropOverride(trx, { clubId: req.clubId!, cropId, field, body, userId: req.session.userId! });
      await recheckClub(trx, req.clubId!);
      return changed;
    });
    res.json(crop);
  });

  router.delete('/:cropId/overrides/:field', coordinator, async (req, res) => {
    const { cropId, field } = parseInput(CropOverrideParamsSchema, req.params);
    await db.transaction(async (trx) => {
      await removeCropOverride(trx, { clubId: req.clubId!, cropId, field });
      await recheckClub(trx, req.clubId!);
    });
    res.status(204).end();
  });

  return router;
}
