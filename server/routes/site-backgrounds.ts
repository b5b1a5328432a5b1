import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { MAX_SITE_SIDE_M, MIN_SITE_SIDE_M } from '@shared/schemas/sites';
import type { Deps } from '../deps';
import { AppError, parseInput } from '../errors';
import { requireRoleVia } from '../middleware/auth';
import {
  deleteSiteBackground,
  findSiteBackground,
  MAX_BACKGROUND_BYTES,
  setSiteBackground,
} from '../services/site-backgrounds';
import { clubOfSite } from '../services/sites';
import { sendStoredFile } from './stored-file';

const UploadFieldsSchema = z.strictObject({
  widthMetres: z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? undefined : v),
    z.coerce
      .number({ message: 'Enter the width in metres, e.g. 40' })
      .positive('Must be more than 0')
      .min(MIN_SITE_SIDE_M, `At least ${MIN_SITE_SIDE_M} m`)
      .max(MAX_SITE_SIDE_M, 'At most 2 km')
      .optional(),
  ),
});

const multerMessages: Record<string, { field: string; message: string }> = {
  LIMIT_FILE_SIZE: { field: 'image', message: 'The image is larger than 5 MB' },
  LIMIT_FILE_COUNT: { field: 'image', message: 'Send one image at a time' },
  LIMIT_UNEXPECTED_FILE: { field: 'image', message: 'Send the image in the form field "image"' },
};

/** Parses the multipart form into memory, turning every upload failure into the standard 400 body. */
function receiveImage(): RequestHandler {
  const single = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_BACKGROUND_BYTES, files: 1, fields: 5, fieldSize: 1024, parts: 6 },
  }).single('image');
  return (req, res, next) => {
    single(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        const known = multerMessages[err.code];
        const field = known?.field ?? err.field ?? 'image';
        const message = known?.message ?? 'The form could not be read; send one image and at most a width';
        return next(new AppError('validation_failed', message, { [field]: message }));
      }
      // Anything else here is a malformed or cut-off multipart body, never a server fault.
      const message = 'The upload could not be read; try again';
      next(new AppError('validation_failed', message, { image: message }));
    });
  };
}

/** A site's map background image: upload, fetch, remove. Mounted at /api/sites/:siteId/background. */
export function siteBackgroundsRouter({ db, storage }: Deps): Router {
  const router = Router({ mergeParams: true });
  const member = requireRoleVia(db, 'siteId', clubOfSite, 'The site');
  const coordinator = requireRoleVia(db, 'siteId', clubOfSite, 'The site', 'coordinator');

  router.post('/', coordinator, receiveImage(), async (req, res) => {
    const { widthMetres } = parseInput(UploadFieldsSchema, { ...req.body });
    if (!req.file) {
      throw new AppError('validation_failed', 'Choose an image to upload.', { image: 'Choose a PNG, JPEG or WebP image' });
    }
    const site = await setSiteBackground(db, {
      siteId: Number(req.params.siteId),
      storage,
      bytes: req.file.buffer,
      widthMetres,
    });
    res.json(site);
  });

  router.get('/', member, async (req, res) => {
    const found = await findSiteBackground(db, { siteId: Number(req.params.siteId) });
    await sendStoredFile(res, storage, found, 'The background image');
  });

  router.delete('/', coordinator, async (req, res) => {
    await deleteSiteBackground(db, { siteId: Number(req.params.siteId), storage });
    res.status(204).end();
  });

  return router;
}
