import type { Knex } from 'knex';
import type { Crop } from '@shared/crops/types';
import { computePlanting, type SiteClimate } from '@shared/plot-book';
import type { Planting, PlantingBody, PlantingUpdateBody } from '@shared/schemas/plot-book';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { withClubOverrides } from './crops';
import { assertPartInside, plotBookAccess } from './plot-book';
import { clashKeys, recheckSite } from './findings';
import { regenerateTasks, removeOpenTasksOfPlanting } from './tasks';

export type { SiteClimate };

interface PlantingRow {
  id: number;
  plot_id: number;
  season_id: number;
  season_year: number;
  crop_id: number;
  crop_slug: string;
  crop_name: string;
  crop_family: string;
  crop_data: Crop;
  variety: string;
  part_x_m: number | null;
  part_y_m: number | null;
  part_width_m: number | null;
  part_length_m: number | null;
  method: Planting['method'];
  planted_on: string;
  layout: Planting['layout'];
  row_count: number | null;
  quantity: number | null;
  status: Planting['status'];
  notes: string;
  keep_reason: string | null;
  version: number;
}

const plantingRows = (db: Db) =>
  db('plantings as pl')
    .join('crops as c', 'c.id', 'pl.crop_id')
    .join('seasons as se', 'se.id', 'pl.season_id')
    .select(
      'pl.*',
      'se.year as season_year',
      'c.slug as crop_slug',
      'c.common_name as crop_name',
      'c.family as crop_family',
      'c.data as crop_data',
    );

function partOf(r: Pick<PlantingRow, 'part_x_m' | 'part_y_m' | 'part_width_m' | 'part_length_m'>): Planting['part'] {
  if (r.part_x_m === null || r.part_y_m === null || r.part_width_m === null || r.part_length_m === null) return null;
  return { x: Number(r.part_x_m), y: Number(r.part_y_m), width: Number(r.part_width_m), length: Number(r.part_length_m) };
}

function toPlanting(r: PlantingRow, plot: { width: number; length: number }, climate: SiteClimate): Planting {
  const part = partOf(r);
  return {
    id: r.id,
    plotId: r.plot_id,
    seasonId: r.season_id,
    seasonYear: r.season_year,
    crop: { id: r.crop_id, slug: r.crop_slug, commonName: r.crop_name, family: r.crop_family },
    variety: r.variety,
    part,
    method: r.method,
    plantedOn: r.planted_on,
    layout: r.layout,
    rowCount: r.row_count,
    quantity: r.quantity,
    status: r.status,
    notes: r.notes,
    keepReason: r.keep_reason,
    version: r.version,
    computed: computePlanting(
      r.crop_data,
      {
        width: part?.width ?? plot.width,
        length: part?.length ?? plot.length,
        layout: r.layout,
        rowCount: r.row_count,
        quantity: r.quantity,
        method: r.method,
        plantedOn: r.planted_on,
      },
      climate,
    ),
  };
}

/** The rows with each crop's data as the plot's club sees it, so the dates follow the club's own values. */
async function withClubCrops(db: Db, clubId: number, rows: PlantingRow[]): Promise<PlantingRow[]> {
  const effective = await withClubOverrides(db, clubId, rows.map((r) => ({ id: r.crop_id, data: r.crop_data as unknown as Record<string, unknown> })));
  return rows.map((r) => ({ ...r, crop_data: (effective.get(r.crop_id) ?? r.crop_data) as unknown as Crop }));
}

/** Every planting of a plot, newest season first and by date within one, with their computed facts from the club's crop values. */
export async function loadPlantings(
  db: Db,
  opts: { plotId: number; plot: { clubId: number; width: number; length: number }; climate: SiteClimate },
): Promise<Planting[]> {
  const rows: PlantingRow[] = await plantingRows(db).where('pl.plot_id', opts.plotId).orderBy([{ column: 'se.year', order: 'desc' }, 'pl.planted_on', 'pl.id']);
  return (await withClubCrops(db, opts.plot.clubId, rows)).map((r) => toPlanting(r, opts.plot, opts.climate));
}

/**
 * Every planting of one season on a club's live sites with its computed facts, in one query (each with
 * its own plot's size and site's climate), for figures that add plantings up across plots.
 */
export async function loadSeasonPlantings(db: Db, opts: { clubId: number; seasonId: number }): Promise<Planting[]> {
  const rows: Array<PlantingRow & { plot_width_m: number; plot_length_m: number; last_spring_frost: string | null; first_autumn_frost: string | null; soil_temps_c: unknown }> =
    await plantingRows(db)
      .join('plots as p', 'p.id', 'pl.plot_id')
      .join('sites as s', 's.id', 'p.site_id')
      .where({ 'pl.season_id': opts.seasonId, 's.club_id': opts.clubId })
      .whereNull('s.archived_at')
      .select('p.width_m as plot_width_m', 'p.length_m as plot_length_m', 's.last_spring_frost', 's.first_autumn_frost', 's.soil_temps_c')
      .orderBy('pl.id');
  return rows.map((r) =>
    toPlanting(r, { width: Number(r.plot_width_m), length: Number(r.plot_length_m) }, {
      lastSpringFrost: r.last_spring_frost,
      firstAutumnFrost: r.first_autumn_frost,
      soilTempsC: Array.isArray(r.soil_temps_c) && r.soil_temps_c.length === 12 ? (r.soil_temps_c as number[]) : null,
    }),
  );
}

/** The plot a planting is on, or null when there is no such planting. */
export async function plotOfPlanting(db: Db, plantingId: number): Promise<number | null> {
  const row = await db('plantings').where({ id: plantingId }).first('plot_id');
  return row ? row.plot_id : null;
}

/** A crop a club's plot book may use: one from the reference catalogue or the club's own; otherwise a 400 on `cropId`. */
async function assertCrop(db: Db, clubId: number, cropId: number) {
  const crop = await db('crops').where({ id: cropId }).where((q) => q.whereNull('club_id').orWhere({ club_id: clubId })).first('id');
  if (!crop) throw new AppError('validation_failed', 'That crop is not in the crop notes.', { cropId: 'Choose a crop from the crop notes' });
}

async function getPlanting(db: Db, plantingId: number, plot: { clubId: number; width: number; length: number; climate: SiteClimate }): Promise<Planting> {
  const row: PlantingRow | undefined = await plantingRows(db).where('pl.id', plantingId).first();
  if (!row) throw notFound('The planting');
  const [effective] = await withClubCrops(db, plot.clubId, [row]);
  return toPlanting(effective, plot, plot.climate);
}

const partColumns = (part: PlantingBody['part']) => ({
  part_x_m: part?.x ?? null,
  part_y_m: part?.y ?? null,
  part_width_m: part?.width ?? null,
  part_length_m: part?.length ?? null,
});

/**
 * A planting may be kept despite a clash only with a reason: a change that brings a clash the planting
 * did not have before, with no reason kept, is refused (409 on `keepReason`) and rolls back.
 */
async function assertReasonForNewClash(trx: Knex.Transaction, opts: { plantingId: number; before: Set<string>; reason: string | null | undefined }) {
  if (opts.reason) return;
  const rows: { key: string; title: string; message: string }[] = await trx('findings')
    .where({ planting_id: opts.plantingId, severity: 'clash' })
    .orderBy('key')
    .select('key', 'title', 'message');
  const fresh = rows.filter((r) => !opts.before.has(r.key));
  if (fresh.length === 0) return;
  throw new AppError('conflict', `This planting clashes: ${fresh[0].message} Say why you keep it, or change the crop or place.`, {
    keepReason: 'Say why you keep this planting despite the clash',
  });
}

/** Adds a planting to a plot's book in this season (the holder this season or a coordinator). */
export async function createPlanting(db: Knex, opts: { plotId: number; userId: number; body: PlantingBody; now?: Date }): Promise<Planting> {
  const id = await db.transaction(async (trx) => {
    const access = await plotBookAccess(trx, { plotId: opts.plotId, userId: opts.userId, write: true, now: opts.now });
    if (!access.season) throw new AppError('conflict', 'The club has no season yet; plantings belong to a season.');
    const b = opts.body;
    assertPartInside(access.plot, b.part);
    await assertCrop(trx, access.plot.clubId, b.cropId);
    const [row] = await trx('plantings')
      .insert({
        plot_id: access.plot.id,
        season_id: access.season.id,
        crop_id: b.cropId,
        variety: b.variety,
        ...partColumns(b.part),
        method: b.method,
        planted_on: b.plantedOn,
        layout: b.layout,
        row_count: b.rowCount,
        quantity: b.quantity,
        status: b.status,
        notes: b.notes,
        keep_reason: b.keepReason || null,
        created_by_user_id: opts.userId,
      })
      .returning('id');
    await recheckSite(trx, access.plot.siteId, [access.plot.id]);
    await assertReasonForNewClash(trx, { plantingId: row.id, before: new Set(), reason: b.keepReason });
    await regenerateTasks(trx, access.plot.siteId, { plantingIds: [row.id], now: opts.now });
    return row.id as number;
  });
  return plantingById(db, { plantingId: id, userId: opts.userId, now: opts.now });
}

/** One planting, to those who may read its plot's book. */
export async function plantingById(db: Db, opts: { plantingId: number; userId: number; now?: Date }): Promise<Planting> {
  const plotId = await plotOfPlanting(db, opts.plantingId);
  if (plotId === null) throw notFound('The planting');
  const access = await plotBookAccess(db, { plotId, userId: opts.userId, write: false, now: opts.now });
  return getPlanting(db, opts.plantingId, access.plot);
}

/**
 * Opens a planting for a change, in a transaction: the row is locked, the person must be allowed to
 * write its plot's book, and a holder may only change this season's plantings (earlier ones are the
 * plot's history; a coordinator may correct them).
 */
export async function lockPlantingForWrite(trx: Knex.Transaction, opts: { plantingId: number; userId: number; now?: Date }) {
  const row = await trx('plantings').where({ id: opts.plantingId }).forUpdate().first('id', 'plot_id', 'season_id', 'version');
  if (!row) throw notFound('The planting');
  const access = await plotBookAccess(trx, { plotId: row.plot_id, userId: opts.userId, write: true, now: opts.now });
  if (!access.isCoordinator && row.season_id !== access.season?.id) {
    throw new AppError('forbidden', 'Plantings of earlier seasons are the plot’s history; ask a coordinator to correct them.');
  }
  return { row: row as { id: number; plot_id: number; season_id: number; version: number }, access };
}

/** Changes a planting, refusing a stale version with 409. */
export async function updatePlanting(db: Knex, opts: { plantingId: number; userId: number; body: PlantingUpdateBody; now?: Date }): Promise<Planting> {
  await db.transaction(async (trx) => {
    const { row, access } = await lockPlantingForWrite(trx, opts);
    const b = opts.body;
    if (b.version !== row.version) throw new AppError('conflict', 'This planting was changed since you opened it; reload and try again.');
    if (b.part !== undefined) assertPartInside(access.plot, b.part);
    if (b.cropId !== undefined) await assertCrop(trx, access.plot.clubId, b.cropId);
    const changes: Record<string, unknown> = {};
    if (b.cropId !== undefined) changes.crop_id = b.cropId;
    if (b.variety !== undefined) changes.variety = b.variety;
    if (b.part !== undefined) Object.assign(changes, partColumns(b.part));
    if (b.method !== undefined) changes.method = b.method;
    if (b.plantedOn !== undefined) changes.planted_on = b.plantedOn;
    if (b.layout !== undefined) changes.layout = b.layout;
    if (b.rowCount !== undefined) changes.row_count = b.rowCount;
    if (b.quantity !== undefined) changes.quantity = b.quantity;
    if (b.status !== undefined) changes.status = b.status;
    if (b.notes !== undefined) changes.notes = b.notes;
    if (b.keepReason !== undefined) changes.keep_reason = b.keepReason || null;
    const before = await clashKeys(trx, row.id);
    await trx('plantings').where({ id: row.id }).update({ ...changes, version: row.version + 1, updated_at: trx.fn.now() });
    await recheckSite(trx, access.plot.siteId, [access.plot.id]);
    const kept = await trx('plantings').where({ id: row.id }).first('keep_reason');
    await assertReasonForNewClash(trx, { plantingId: row.id, before, reason: kept?.keep_reason ?? null });
    await regenerateTasks(trx, access.plot.siteId, { plantingIds: [row.id], now: opts.now });
  });
  return plantingById(db, { plantingId: opts.plantingId, userId: opts.userId, now: opts.now });
}

/** Deletes a planting with its harvests; observations that named it keep their place on the plot. */
export async function deletePlanting(db: Knex, opts: { plantingId: number; userId: number; now?: Date }): Promise<void> {
  await db.transaction(async (trx) => {
    const { row, access } = await lockPlantingForWrite(trx, opts);
    await removeOpenTasksOfPlanting(trx, row.id);
    await trx('plantings').where({ id: row.id }).delete();
    await recheckSite(trx, access.plot.siteId, [access.plot.id]);
  });
}
