import { Router, type RequestHandler } from 'express';
import { idempotent } from '../middleware/idempotency';
import multer from 'multer';
import {
  HarvestBodySchema,
  ObservationBodySchema,
  PlantingBodySchema,
  PlantingUpdateBodySchema,
  PlotBookQuerySchema,
} from '@shared/schemas/plot-book';
import type { Deps } from '../deps';
import { AppError, parseInput } from '../errors';
import { requireUser } from '../middleware/auth';
import { createHarvest, deleteHarvest } from '../services/harvests';
import { addObservationPhoto, assertCanAddPhoto, createObservation, deleteObservation, findObservationPhoto, MAX_PHOTO_BYTES } from '../services/observations';
import { getPlotBook } from '../services/plot-book';
import { createPlanting, deletePlanting, plantingById, updatePlanting } from '../services/plantings';
import { idParam } from './params';
import { sendStoredFile } from './stored-file';

const multerMessages: Record<string, string> = {
  LIMIT_FILE_SIZE: 'The image is larger than 8 MB',
  LIMIT_FILE_COUNT: 'Send one photo at a time',
  LIMIT_UNEXPECTED_FILE: 'Send the photo in the form field "photo"',
};

/** Parses the multipart form into memory, turning every upload failure into the standard 400 body on `photo`. */
function receivePhoto(): RequestHandler {
  const single = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 0, parts: 1 },
  }).single('photo');
  return (req, res, next) => {
    single(req, res, (err: unknown) => {
      if (!err) return next();
      const message =
        err instanceof multer.MulterError ? (multerMessages[err.code] ?? 'The form could not be read; send one photo only') : 'The upload could not be read; try again';
      next(new AppError('validation_failed', message, { photo: message }));
    });
  };
}

/**
 * The plot book: a plot's book, its plantings and their harvests, observations and their photos.
 * Mounted at /api; who may do what is decided in the services (see services/plot-book.ts).
 */
export function plotBookRouter({ db, storage }: Deps): Router {
  const router = Router();

  router.get('/plots/:plotId/book', requireUser, async (req, res) => {
    const plotId = idParam(req, 'plotId');
    const { year } = parseInput(PlotBookQuerySchema, { ...req.query });
    res.json(await getPlotBook(db, { plotId, userId: req.session.userId!, year }));
  });

  router.post('/plots/:plotId/plantings', requireUser, async (req, res) => {
    const plotId = idParam(req, 'plotId');
    const body = parseInput(PlantingBodySchema, req.body);
    res.status(201).json(await createPlanting(db, { plotId, userId: req.session.userId!, body }));
  });

  router.get('/plantings/:plantingId', requireUser, async (req, res) => {
    res.json(await plantingById(db, { plantingId: idParam(req, 'plantingId'), userId: req.session.userId! }));
  });

  router.patch('/plantings/:plantingId', requireUser, async (req, res) => {
    const plantingId = idParam(req, 'plantingId');
    const body = parseInput(PlantingUpdateBodySchema, req.body);
    res.json(await updatePlanting(db, { plantingId, userId: req.session.userId!, body }));
  });

  router.delete('/plantings/:plantingId', requireUser, async (req, res) => {
    await deletePlanting(db, { plantingId: idParam(req, 'plantingId'), userId: req.session.userId! });
    res.status(204).end();
  });

  router.post('/plantings/:plantingId/harvests', requireUser, idempotent(db), async (req, res) => {
    const plantingId = idParam(req, 'plantingId');
    const body = parseInput(HarvestBodySchema, req.body);
    res.status(201).json(await createHarvest(db, { plantingId, userId: req.session.userId!, body }));
  });

  router.delete('/harvests/:harvestId', requireUser, async (req, res) => {
    await deleteHarvest(db, { harvestId: idParam(req, 'harvestId'), userId: req.session.userId! });
    res.status(204).end();
  });

  router.post('/plots/:plotId/observations', requireUser, idempotent(db), async (req, res) => {
    const plotId = idParam(req, 'plotId');
    const body = parseInput(ObservationBodySchema, req.body);
    res.status(201).json(await createObservation(db, { plotId, userId: req.session.userId!, body }));
  });

  router.delete('/observations/:observationId', requireUser, async (req, res) => {
    await deleteObservation(db, { observationId: idParam(req, 'observationId'), userId: req.session.userId!, storage });
    res.status(204).end();
  });

  // Who may add a photo is settled before the upload is read, so nobody else can make the server hold 8 MB.
  const mayAddPhoto: RequestHandler = async (req, _res, next) => {
    await assertCanAddPhoto(db, { observationId: idParam(req, 'observationId'), userId: req.session.userId! });
    next();
  };
  router.post('/observations/:observationId/photos', requireUser, mayAddPhoto, receivePhoto(), async (req, res) => {
    const observationId = idParam(req, 'observationId');
    if (!req.file) throw new AppError('validation_failed', 'Choose a photo to upload.', { photo: 'Choose a PNG, JPEG or WebP photo' });
    const observation = await addObservationPhoto(db, { observationId, userId: req.session.userId!, storage, bytes: req.file.buffer });
    res.status(201).json(observation);
  });

  for (const [suffix, thumb] of [['', false], ['/thumb', true]] as const) {
    router.get(`/observation-photos/:photoId${suffix}`, requireUser, async (req, res) => {
      const photoId = idParam(req, 'photoId');
      await sendStoredFile(res, storage, await findObservationPhoto(db, { photoId, userId: req.session.userId!, thumb }), 'The photo');
    });
  }

  return router;
}
