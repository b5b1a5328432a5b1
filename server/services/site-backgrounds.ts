import crypto from 'node:crypto';
import type { Knex } from 'knex';
import type { Site } from '@shared/schemas/sites';
import { notFound } from '../errors';
import type { Db } from '../db/knex';
import { storageKey, type Storage } from '../storage';
import {
  type EncodedImage,
  type ImageLimits,
  type ImageMime,
  type ImageSize,
  imageMimes,
  type InspectedImage,
  inspectImage,
  type OutputFormat,
  readImageSize,
  reencodeImage,
} from './images';
import { getSite } from './sites';

/** The largest background image accepted, in bytes. */
export const MAX_BACKGROUND_BYTES = 5 * 1024 * 1024;
/** Longest side accepted, in pixels: browsers refuse to paint much larger images on a canvas. */
export const MAX_BACKGROUND_SIDE_PX = 16384;
/**
 * Most pixels accepted: a header may claim any size in a few bytes, and a browser decodes the whole
 * picture (4 bytes a pixel, so 40 megapixels is 160 MB) before painting it (common practice).
 */
export const MAX_BACKGROUND_PIXELS = 40_000_000;

/**
 * Longest side of the stored copy, in pixels: 4096² is about 16.8 megapixels, the canvas area some phone
 * browsers will paint (from memory), and still 1 cm a pixel across a 40 m ground.
 */
export const STORED_BACKGROUND_SIDE_PX = 4096;
// Lossy formats are re-encoded at this quality; PNG stays lossless so plan lines and lettering stay crisp.
const BACKGROUND_QUALITY = 85;

export const backgroundMimes = imageMimes;
export type BackgroundMime = ImageMime;
export type { ImageSize };
export { readImageSize };

/** What a map-background upload accepts, named by its form field `image`. */
export const backgroundLimits: ImageLimits = {
  field: 'image',
  maxBytes: MAX_BACKGROUND_BYTES,
  maxSidePx: MAX_BACKGROUND_SIDE_PX,
  maxPixels: MAX_BACKGROUND_PIXELS,
};

const extensionFor: Record<BackgroundMime, string> = { 'image/png': 'png', 'image/jpeg': 'jpg', 'image/webp': 'webp' };
const formatFor: Record<BackgroundMime, OutputFormat> = { 'image/png': 'png', 'image/jpeg': 'jpeg', 'image/webp': 'webp' };
// Names are ours (random hex), so anything else in the column is refused rather than joined into a path.
const STORED_NAME = /^[0-9a-f]{32}\.(png|jpg|webp)$/;
const FOLDER = 'site-backgrounds';

/** Checks an uploaded background by its content and returns its type and size, or throws a 400 naming the image field. */
export function inspectBackground(bytes: Uint8Array): Promise<InspectedImage> {
  return inspectImage(bytes, backgroundLimits);
}

/**
 * Turns an upload into the file we store: upright, at most 4096 px a side, in its own format, without
 * metadata; the scale is the measured width over the stored width, since the measured width spans the
 * whole picture whatever its pixel count.
 */
export async function prepareBackground(
  bytes: Uint8Array,
  widthMetres?: number,
): Promise<EncodedImage & { metresPerPixel: number | null }> {
  const { mime } = await inspectBackground(bytes);
  const stored = await reencodeImage(bytes, {
    limits: backgroundLimits,
    maxSidePx: STORED_BACKGROUND_SIDE_PX,
    format: formatFor[mime],
    quality: BACKGROUND_QUALITY,
  });
  return { ...stored, metresPerPixel: widthMetres === undefined ? null : widthMetres / stored.width };
}

const keyOf = (name: string) => storageKey(FOLDER, name);

/** Deletes a stored background file by its stored name (names that are not ours are left alone). */
export async function removeBackgroundFile(storage: Storage, name: string): Promise<void> {
  if (STORED_NAME.test(name)) await storage.delete(keyOf(name));
}

/** Stores a new map background for a site, replacing (and deleting) the previous one; returns the site. */
export async function setSiteBackground(
  db: Knex,
  opts: { siteId: number; storage: Storage; bytes: Uint8Array; widthMetres?: number },
): Promise<Site> {
  const image = await prepareBackground(opts.bytes, opts.widthMetres);
  const name = `${crypto.randomBytes(16).toString('hex')}.${extensionFor[image.mime]}`;
  await opts.storage.put(keyOf(name), image.bytes, image.mime);
  let previous: string | null;
  try {
    previous = await db.transaction(async (trx) => {
      const site = await trx('sites').where({ id: opts.siteId }).forUpdate().first('version', 'background_file');
      if (!site) throw notFound('The site');
      await trx('sites')
        .where({ id: opts.siteId })
        .update({
          background_file: name,
          background_mime: image.mime,
          background_width_px: image.width,
          background_height_px: image.height,
          background_m_per_px: image.metresPerPixel,
          version: site.version + 1,
          updated_at: trx.fn.now(),
        });
      return site.background_file as string | null;
    });
  } catch (err) {
    await opts.storage.delete(keyOf(name));
    throw err;
  }
  // Only after the new name is committed can the old file go; a crash here leaves an orphan, never a broken map.
  if (previous) await removeBackgroundFile(opts.storage, previous);
  return getSite(db, opts.siteId);
}

/** Where a site's background image is stored and its type; 404 when the site has none. */
export async function findSiteBackground(db: Db, opts: { siteId: number }): Promise<{ key: string; mime: string }> {
  const row = await db('sites').where({ id: opts.siteId }).first('background_file', 'background_mime');
  if (!row) throw notFound('The site');
  if (!row.background_file || !row.background_mime || !STORED_NAME.test(row.background_file)) {
    throw notFound('The background image');
  }
  return { key: keyOf(row.background_file), mime: row.background_mime };
}

/** Takes the background image off a site and deletes its file; 404 when there is none. */
export async function deleteSiteBackground(db: Knex, opts: { siteId: number; storage: Storage }): Promise<void> {
  const previous = await db.transaction(async (trx) => {
    const site = await trx('sites').where({ id: opts.siteId }).forUpdate().first('version', 'background_file');
    if (!site) throw notFound('The site');
    if (!site.background_file) throw notFound('The background image');
    await trx('sites').where({ id: opts.siteId }).update({
      background_file: null,
      background_mime: null,
      background_width_px: null,
      background_height_px: null,
      background_m_per_px: null,
      version: site.version + 1,
      updated_at: trx.fn.now(),
    });
    return site.background_file as string;
  });
  await removeBackgroundFile(opts.storage, previous);
}
