import type { Knex } from 'knex';
import { toGrams } from '@shared/plot-book';
import { type Harvest, type HarvestBody, MAX_HARVEST_GRAMS } from '@shared/schemas/plot-book';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { lockPlantingForWrite } from './plantings';

export interface HarvestRow {
  id: number;
  planting_id: number;
  harvested_on: string;
  grams: number | null;
  count: number | null;
  notes: string;
}

/** A harvest row as the API answers it. */
export function toHarvest(r: HarvestRow): Harvest {
  return {
    id: r.id,
    plantingId: r.planting_id,
    harvestedOn: r.harvested_on,
    grams: r.grams === null ? null : Number(r.grams),
    count: r.count,
    notes: r.notes,
  };
}

/** The harvests of some plantings, by date. */
export async function listHarvestRows(db: Db, plantingIds: number[]): Promise<HarvestRow[]> {
  if (plantingIds.length === 0) return [];
  return db('harvests').whereIn('planting_id', plantingIds).orderBy(['harvested_on', 'id']).select('id', 'planting_id', 'harvested_on', 'grams', 'count', 'notes');
}

/** Records a harvest of a planting; a weight in any unit is stored in grams (to a tenth of a gram, as the column keeps). */
export async function createHarvest(db: Knex, opts: { plantingId: number; userId: number; body: HarvestBody; now?: Date }): Promise<Harvest> {
  return db.transaction(async (trx) => {
    const { row } = await lockPlantingForWrite(trx, opts);
    const b = opts.body;
    const grams = b.weight ? Math.round(toGrams(b.weight.value, b.weight.unit) * 10) / 10 : null;
    // Grams are kept to a tenth, so a weight that rounds to 0 g there is refused rather than stored as nothing.
    if (grams !== null && (grams <= 0 || grams > MAX_HARVEST_GRAMS)) {
      const message = grams <= 0 ? 'Too light to record (at least 0.1 g)' : 'Too heavy (at most 10 t)';
      throw new AppError('validation_failed', message, { weight: message });
    }
    const [created] = await trx('harvests')
      .insert({ planting_id: row.id, harvested_on: b.harvestedOn, grams, count: b.count, notes: b.notes, created_by_user_id: opts.userId })
      .returning(['id', 'planting_id', 'harvested_on', 'grams', 'count', 'notes']);
    return toHarvest(created);
  });
}

/** The planting a harvest belongs to, or null. */
export async function plantingOfHarvest(db: Db, harvestId: number): Promise<number | null> {
  const row = await db('harvests').where({ id: harvestId }).first('planting_id');
  return row ? row.planting_id : null;
}

/** Deletes a harvest record (by whoever may change its planting). */
export async function deleteHarvest(db: Knex, opts: { harvestId: number; userId: number; now?: Date }): Promise<void> {
  await db.transaction(async (trx) => {
    const plantingId = await plantingOfHarvest(trx, opts.harvestId);
    if (plantingId === null) throw notFound('The harvest');
    await lockPlantingForWrite(trx, { plantingId, userId: opts.userId, now: opts.now });
    await trx('harvests').where({ id: opts.harvestId }).delete();
  });
}
