import { harvestTotals } from '@shared/plot-book';
import type { HarvestFigure, HarvestFigures, HarvestFiguresQuery } from '@shared/schemas/harvest-figures';
import { notFound } from '../errors';
import type { Db } from '../db/knex';
import { loadSeasonPlantings } from './plantings';
import { currentSeason } from './plot-book';

// Planned plantings are not in the ground yet, so they are left out of "grown"; failed ones took up
// their ground and count. The query count is fixed: seasons, main site, plantings, harvest sums
// (plus currentSeason's own when no year is asked).

interface Sum {
  plantings: number;
  areaM2: number;
  plants: number;
  grams: number;
  count: number;
  /** Grams and plants of the plantings whose plants are known, for a per-plant figure that is not diluted. */
  gramsWithPlants: number;
}

const empty = (): Sum => ({ plantings: 0, areaM2: 0, plants: 0, grams: 0, count: 0, gramsWithPlants: 0 });

function figuresOf(s: Sum) {
  const overArea = harvestTotals([{ grams: s.grams, count: s.count }], { areaM2: s.areaM2 });
  const perPlant = harvestTotals([{ grams: s.gramsWithPlants }], { plants: s.plants });
  return {
    plantings: s.plantings,
    areaM2: s.areaM2,
    plants: s.plants,
    grams: overArea.grams,
    count: overArea.count,
    gramsPerM2: overArea.gramsPerM2,
    gramsPerPlant: perPlant.gramsPerPlant,
  };
}

/** A club's harvest figures per crop for one season (this season by default), with club totals; any member may read them. */
export async function getHarvestFigures(db: Db, opts: { clubId: number; query: HarvestFiguresQuery; now?: Date }): Promise<HarvestFigures> {
  const seasons: Array<{ id: number; year: number }> = await db('seasons').where({ club_id: opts.clubId }).orderBy('year', 'desc').select('id', 'year');
  let season: { id: number; year: number } | null;
  if (opts.query.year !== undefined) {
    season = seasons.find((s) => s.year === opts.query.year) ?? null;
    if (!season) throw notFound(`The ${opts.query.year} season`);
  } else {
    season = seasons.length ? await currentSeason(db, opts.clubId, opts.now) : null;
  }
  const mainSite = await db('sites').where({ club_id: opts.clubId }).whereNull('archived_at').orderBy('id').first('units');
  const base = { years: seasons.map((s) => s.year), units: mainSite?.units ?? 'metric', page: 1 };
  if (!season) return { ...base, season: null, items: [], total: 0, totals: figuresOf(empty()) };

  const plantings = (await loadSeasonPlantings(db, { clubId: opts.clubId, seasonId: season.id })).filter((p) => p.status !== 'planned');
  const sums: Array<{ planting_id: number; grams: string | null; count: string | null }> = await db('harvests as h')
    .join('plantings as pl', 'pl.id', 'h.planting_id')
    .where('pl.season_id', season.id)
    .groupBy('h.planting_id')
    .select('h.planting_id', db.raw('sum(h.grams) as grams'), db.raw('sum(h.count) as count'));
  const harvested = new Map(sums.map((r) => [r.planting_id, { grams: Number(r.grams ?? 0), count: Number(r.count ?? 0) }]));

  const byCrop = new Map<number, { crop: HarvestFigure['crop']; sum: Sum }>();
  const club = empty();
  for (const p of plantings) {
    const h = harvested.get(p.id) ?? { grams: 0, count: 0 };
    const plants = p.quantity ?? p.computed.plantsThatFit?.plants ?? 0;
    const entry = byCrop.get(p.crop.id) ?? { crop: { id: p.crop.id, slug: p.crop.slug, commonName: p.crop.commonName }, sum: empty() };
    byCrop.set(p.crop.id, entry);
    for (const s of [entry.sum, club]) {
      s.plantings += 1;
      s.areaM2 += p.computed.areaM2;
      s.plants += plants;
      s.grams += h.grams;
      s.count += h.count;
      if (plants > 0) s.gramsWithPlants += h.grams;
    }
  }
  const items = [...byCrop.values()]
    .map(({ crop, sum }) => ({ crop, ...figuresOf(sum) }))
    .sort((a, b) => b.grams - a.grams || a.crop.commonName.localeCompare(b.crop.commonName));
  return { ...base, season, items, total: items.length, totals: figuresOf(club) };
}
