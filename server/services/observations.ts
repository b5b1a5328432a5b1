import crypto from 'node:crypto';
import type { Knex } from 'knex';
import { pestBySlug } from '@shared/crops/pests';
import { MAX_PHOTOS_PER_OBSERVATION, type Observation, type ObservationBody, type ObservationPhoto } from '@shared/schemas/plot-book';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { storageKey, type Storage } from '../storage';
import { type ImageLimits, inspectImage, makeThumbnail, reencodeImage } from './images';
import { assertPartInside, plotBookAccess } from './plot-book';
import { recheckSite } from './findings';

/** The largest photo accepted, in bytes (8 MB: a phone camera's full-size JPEG fits). */
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
/** What a plot-book photo upload accepts, named by its form field `photo`. */
export const photoLimits: ImageLimits = { field: 'photo', maxBytes: MAX_PHOTO_BYTES, maxSidePx: 8000, maxPixels: 40_000_000 };
/** Longest side of the stored photo, in pixels: enough to see a leaf spot on a phone, small on disk. */
export const STORED_PHOTO_SIDE_PX = 1600;
/** Side of the square thumbnail, in pixels. */
export const PHOTO_THUMB_SIDE_PX = 320;
const PHOTO_QUALITY = 80;

const FOLDER = 'observation-photos';
// Names are ours (random hex), so anything else in the column is refused rather than joined into a path.
const STORED_NAME = /^[0-9a-f]{32}(-thumb)?\.webp$/;

/** A photo's storage key (`observation-photos/<name>`, a private folder under the upload folder on disk). */
const keyOf = (name: string) => storageKey(FOLDER, name);

interface ObservationRow {
  id: number;
  plot_id: number;
  planting_id: number | null;
  pest_slug: string | null;
  name: string;
  kind: Observation['kind'];
  is_soil_borne: boolean;
  part_x_m: number | null;
  part_y_m: number | null;
  part_width_m: number | null;
  part_length_m: number | null;
  severity: Observation['severity'];
  observed_on: string;
  notes: string;
}

const photoOf = (p: { id: number; width_px: number; height_px: number }): ObservationPhoto => ({
  id: p.id,
  url: `/api/observation-photos/${p.id}`,
  thumbUrl: `/api/observation-photos/${p.id}/thumb`,
  width: p.width_px,
  height: p.height_px,
});

function toObservation(r: ObservationRow, photos: ObservationPhoto[]): Observation {
  const hasPart = r.part_x_m !== null && r.part_y_m !== null && r.part_width_m !== null && r.part_length_m !== null;
  return {
    id: r.id,
    plotId: r.plot_id,
    plantingId: r.planting_id,
    pestSlug: r.pest_slug,
    name: r.name,
    kind: r.kind,
    isSoilBorne: r.is_soil_borne,
    severity: r.severity,
    observedOn: r.observed_on,
    notes: r.notes,
    part: hasPart ? { x: Number(r.part_x_m), y: Number(r.part_y_m), width: Number(r.part_width_m), length: Number(r.part_length_m) } : null,
    photos,
  };
}

async function withPhotos(db: Db, rows: ObservationRow[]): Promise<Observation[]> {
  const photos = rows.length
    ? await db('observation_photos').whereIn('observation_id', rows.map((r) => r.id)).orderBy('id').select('id', 'observation_id', 'width_px', 'height_px')
    : [];
  return rows.map((r) => toObservation(r, photos.filter((p) => p.observation_id === r.id).map(photoOf)));
}

/** A plot's observations, newest first, each with its photos. */
export async function listObservations(db: Db, plotId: number): Promise<Observation[]> {
  const rows: ObservationRow[] = await db('observations').where({ plot_id: plotId }).orderBy([{ column: 'observed_on', order: 'desc' }, { column: 'id', order: 'desc' }]);
  return withPhotos(db, rows);
}

/** One observation with its photos. */
async function getObservation(db: Db, observationId: number): Promise<Observation> {
  const row: ObservationRow | undefined = await db('observations').where({ id: observationId }).first();
  if (!row) throw notFound('The observation');
  return (await withPhotos(db, [row]))[0];
}

/**
 * Records a pest, disease or other observation on a plot. A pest or disease from the list brings its
 * name and kind, and a soil-borne one is kept with `is_soil_borne` so the rotation rules read it. One
 * seen on a planting with no part of its own is kept against the soil under that planting.
 */
export async function createObservation(db: Knex, opts: { plotId: number; userId: number; body: ObservationBody; now?: Date }): Promise<Observation> {
  const id = await db.transaction(async (trx) => {
    const access = await plotBookAccess(trx, { plotId: opts.plotId, userId: opts.userId, write: true, now: opts.now });
    const b = opts.body;
    assertPartInside(access.plot, b.part);
    let part = b.part;
    if (b.plantingId !== null) {
      const planting = await trx('plantings')
        .where({ id: b.plantingId, plot_id: access.plot.id })
        .first('id', 'part_x_m', 'part_y_m', 'part_width_m', 'part_length_m');
      if (!planting) throw new AppError('validation_failed', 'That planting is not on this plot.', { plantingId: 'Choose a planting on this plot' });
      // Seen on a planting and no part given: it was in the soil under that planting.
      if (!part && planting.part_x_m !== null) {
        part = { x: Number(planting.part_x_m), y: Number(planting.part_y_m), width: Number(planting.part_width_m), length: Number(planting.part_length_m) };
      }
    }
    const pest = b.pestSlug ? pestBySlug(b.pestSlug) : undefined;
    const [row] = await trx('observations')
      .insert({
        plot_id: access.plot.id,
        planting_id: b.plantingId,
        pest_slug: pest?.slug ?? null,
        name: b.name ?? pest?.name ?? '',
        kind: b.kind ?? pest?.kind ?? 'other',
        is_soil_borne: pest?.soilBorne ?? false,
        part_x_m: part?.x ?? null,
        part_y_m: part?.y ?? null,
        part_width_m: part?.width ?? null,
        part_length_m: part?.length ?? null,
        severity: b.severity,
        observed_on: b.observedOn,
        notes: b.notes,
        created_by_user_id: opts.userId,
      })
      .returning('id');
    // A soil-borne disease lengthens the rotation gap on this soil: re-check the plot.
    if (pest?.soilBorne) await recheckSite(trx, access.plot.siteId, [access.plot.id]);
    return row.id as number;
  });
  return getObservation(db, id);
}

/** The plot an observation is on, or null. */
export async function plotOfObservation(db: Db, observationId: number): Promise<number | null> {
  const row = await db('observations').where({ id: observationId }).first('plot_id');
  return row ? row.plot_id : null;
}

const tooMany = () => {
  const message = `An observation holds at most ${MAX_PHOTOS_PER_OBSERVATION} photos`;
  return new AppError('validation_failed', message, { photo: message });
};

/** Checks that a person may add photos to an observation (before its upload is read), returning its plot id. */
export async function assertCanAddPhoto(db: Db, opts: { observationId: number; userId: number; now?: Date }): Promise<number> {
  const plotId = await plotOfObservation(db, opts.observationId);
  if (plotId === null) throw notFound('The observation');
  await plotBookAccess(db, { plotId, userId: opts.userId, write: true, now: opts.now });
  return plotId;
}

/**
 * Adds a photo to an observation: checked by its header, re-encoded as WebP (at most 1600 px a side, no
 * metadata) with a 320 px square thumbnail, stored privately under random names. A refused upload
 * (not an image, too large, a fifth photo) leaves no file and no row.
 */
export async function addObservationPhoto(
  db: Knex,
  opts: { observationId: number; userId: number; storage: Storage; bytes: Uint8Array; now?: Date },
): Promise<Observation> {
  await assertCanAddPhoto(db, opts);
  // Cheap refusals first, so a fifth photo is not decoded at all; the count is checked again under the lock.
  const [{ n }] = await db('observation_photos').where({ observation_id: opts.observationId }).count({ n: '*' });
  if (Number(n) >= MAX_PHOTOS_PER_OBSERVATION) throw tooMany();
  await inspectImage(opts.bytes, photoLimits);
  const stored = await reencodeImage(opts.bytes, { limits: photoLimits, maxSidePx: STORED_PHOTO_SIDE_PX, format: 'webp', quality: PHOTO_QUALITY });
  const thumb = await makeThumbnail(opts.bytes, PHOTO_THUMB_SIDE_PX, photoLimits);

  const base = crypto.randomBytes(16).toString('hex');
  const fileName = `${base}.webp`;
  const thumbName = `${base}-thumb.webp`;
  const written: string[] = [];
  try {
    for (const [name, bytes] of [[fileName, stored.bytes], [thumbName, thumb.bytes]] as const) {
      await opts.storage.put(keyOf(name), bytes, 'image/webp');
      written.push(keyOf(name));
    }
    await db.transaction(async (trx) => {
      const observation = await trx('observations').where({ id: opts.observationId }).forUpdate().first('id', 'plot_id');
      if (!observation) throw notFound('The observation');
      await plotBookAccess(trx, { plotId: observation.plot_id, userId: opts.userId, write: true, now: opts.now });
      const [{ n: held }] = await trx('observation_photos').where({ observation_id: opts.observationId }).count({ n: '*' });
      if (Number(held) >= MAX_PHOTOS_PER_OBSERVATION) throw tooMany();
      await trx('observation_photos').insert({
        observation_id: opts.observationId,
        file_name: fileName,
        thumb_name: thumbName,
        mime: stored.mime,
        width_px: stored.width,
        height_px: stored.height,
      });
    });
  } catch (err) {
    for (const key of written) await opts.storage.delete(key);
    throw err;
  }
  return getObservation(db, opts.observationId);
}

/** Where a photo (or its thumbnail) is stored and its type, for those who may read its plot's book; 404 otherwise. */
export async function findObservationPhoto(
  db: Db,
  opts: { photoId: number; userId: number; thumb: boolean; now?: Date },
): Promise<{ key: string; mime: string }> {
  const row = await db('observation_photos as ph')
    .join('observations as o', 'o.id', 'ph.observation_id')
    .where('ph.id', opts.photoId)
    .first('ph.file_name', 'ph.thumb_name', 'ph.mime', 'o.plot_id');
  if (!row) throw notFound('The photo');
  await plotBookAccess(db, { plotId: row.plot_id, userId: opts.userId, write: false, now: opts.now });
  const name: string = opts.thumb ? row.thumb_name : row.file_name;
  if (!STORED_NAME.test(name)) throw notFound('The photo');
  // Thumbnails are always WebP; the full photo keeps the type it was stored with.
  return { key: keyOf(name), mime: opts.thumb ? 'image/webp' : row.mime };
}

/** Deletes an observation with its photos (by whoever may change its plot's book); the files go once the rows are gone. */
export async function deleteObservation(db: Knex, opts: { observationId: number; userId: number; storage: Storage; now?: Date }): Promise<void> {
  const names = await db.transaction(async (trx) => {
    const row = await trx('observations').where({ id: opts.observationId }).forUpdate().first('id', 'plot_id', 'is_soil_borne');
    if (!row) throw notFound('The observation');
    const access = await plotBookAccess(trx, { plotId: row.plot_id, userId: opts.userId, write: true, now: opts.now });
    const photos: Array<{ file_name: string; thumb_name: string }> = await trx('observation_photos').where({ observation_id: row.id }).select('file_name', 'thumb_name');
    await trx('observations').where({ id: row.id }).delete();
    if (row.is_soil_borne) await recheckSite(trx, access.plot.siteId, [access.plot.id]);
    return photos.flatMap((p) => [p.file_name, p.thumb_name]);
  });
  // After the commit: a crash here leaves an unreferenced file, never a row pointing at nothing.
  for (const name of names) if (STORED_NAME.test(name)) await opts.storage.delete(keyOf(name));
}
