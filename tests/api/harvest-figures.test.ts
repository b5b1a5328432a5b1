import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { cropBySlug } from '@shared/crops';
import { localToday } from '@shared/dates';
import { computePlanting, GRAMS_PER_POUND } from '@shared/plot-book';
import { HarvestFiguresSchema } from '@shared/schemas/harvest-figures';
import { buildClub, buildCrop } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

// A new club's zone is UTC, so "this season" is the current UTC year.
const YEAR = Number(localToday('UTC').slice(0, 4));
const noClimate = { lastSpringFrost: null, firstAutumnFrost: null, soilTempsC: null };

/** A club with a live site (plots A-1 3 m × 6 m, A-2 4 m × 5 m), an archived site, last season and this one. */
async function club() {
  const c = await buildClub(t.db, { name: 'Willow Lane Growers' });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const elsewhere = await buildClub(t.db, { name: 'Far Meadow' });
  const outsider = await signedInMember(t, elsewhere.id, ['coordinator']);
  const site = { club_id: c.id, latitude: 52, longitude: -1, time_zone: 'UTC', width_m: 30, length_m: 20 };
  const [live] = await t.db('sites').insert({ ...site, name: 'Top field' }).returning('id');
  const [gone] = await t.db('sites').insert({ ...site, name: 'Old orchard', archived_at: new Date() }).returning('id');
  const [a1, a2, old] = await t.db('plots')
    .insert([
      { site_id: live.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 },
      { site_id: live.id, label: 'A-2', x_m: 4, y_m: 0, width_m: 4, length_m: 5 },
      { site_id: gone.id, label: 'Z-1', x_m: 0, y_m: 0, width_m: 3, length_m: 3 },
    ])
    .returning('id');
  const [last] = await t.db('seasons').insert({ club_id: c.id, year: YEAR - 1 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: YEAR }).returning('id');
  return { c, coordinator, volunteer, outsider, a1: a1.id as number, a2: a2.id as number, old: old.id as number, last: last.id as number, season: season.id as number };
}

async function planting(row: Record<string, unknown>): Promise<number> {
  const [p] = await t.db('plantings').insert({ method: 'sown', planted_on: `${YEAR}-04-01`, status: 'sown', ...row }).returning('id');
  return p.id;
}

describe('GET /api/clubs/:clubId/harvest-figures', () => {
  it('answers 401 signed out, 403 outside the club and 400 for a bad year, naming the field', async () => {
    const s = await club();
    const anonymous = await browserLikeAgent(t.app);
    expect((await anonymous.get(`/api/clubs/${s.c.id}/harvest-figures`)).status).toBe(401);
    const outside = await s.outsider.get(`/api/clubs/${s.c.id}/harvest-figures`);
    expect(outside.status).toBe(403);
    expect(outside.body.error.code).toBe('forbidden');
    for (const bad of ['abc', '1999', '2026.5']) {
      const res = await s.coordinator.get(`/api/clubs/${s.c.id}/harvest-figures?year=${bad}`);
      expect(res.status, bad).toBe(400);
      expect(Object.keys(res.body.error.fields), bad).toEqual(['year']);
    }
    const missing = await s.coordinator.get(`/api/clubs/${s.c.id}/harvest-figures?year=${YEAR + 5}`);
    expect(missing.status).toBe(404);
  });

  it('adds up each crop of the season across live sites, from the rows inserted', async () => {
    const s = await club();
    const radish = await buildCrop(t.db, 'radish');
    const lettuce = await buildCrop(t.db, 'lettuce');
    const tomato = await buildCrop(t.db, 'tomato');
    const cabbage = await buildCrop(t.db, 'cabbage');
    // Radish on a 1 m × 2 m part of A-1 (40 plants) and on the whole of A-2 (60 plants).
    const r1 = await planting({ plot_id: s.a1, season_id: s.season, crop_id: radish.id, part_x_m: 0, part_y_m: 0, part_width_m: 1, part_length_m: 2, quantity: 40 });
    const r2 = await planting({ plot_id: s.a2, season_id: s.season, crop_id: radish.id, quantity: 60 });
    // Lettuce with no quantity: its plants are the ones that fit on its 2 m × 3 m part.
    const l1 = await planting({ plot_id: s.a1, season_id: s.season, crop_id: lettuce.id, part_x_m: 1, part_y_m: 0, part_width_m: 2, part_length_m: 3, layout: 'intensive' });
    // Left out: a planned planting (not in the ground), a planting on the archived site, last season's.
    await planting({ plot_id: s.a2, season_id: s.season, crop_id: tomato.id, status: 'planned', quantity: 4 });
    const archived = await planting({ plot_id: s.old, season_id: s.season, crop_id: radish.id, quantity: 10 });
    const lastYear = await planting({ plot_id: s.a1, season_id: s.last, crop_id: cabbage.id, planted_on: `${YEAR - 1}-05-01`, quantity: 6 });
    const today = localToday('UTC');
    await t.db('harvests').insert([
      { planting_id: r1, harvested_on: today, grams: 1200, count: 50 },
      { planting_id: r2, harvested_on: today, grams: 800 },
      { planting_id: archived, harvested_on: today, grams: 9999 },
      { planting_id: lastYear, harvested_on: `${YEAR - 1}-09-01`, grams: 3000, count: 6 },
    ]);
    // One pound entered through the plot book is stored in grams.
    await s.coordinator.post(`/api/plantings/${l1}/harvests`, { harvestedOn: today, weight: { value: 1, unit: 'lb' }, count: 12 }).expect(201);
    const lettuceGrams = Number((await t.db('harvests').where({ planting_id: l1 }).first('grams')).grams);
    // 1 lb = 0.45359237 kg exactly (NIST Handbook 44, Appendix C); computed: 453.59237 g kept to 0.1 g → 453.6
    expect(GRAMS_PER_POUND).toBe(453.59237);
    expect(lettuceGrams).toBe(453.6);

    const res = await s.volunteer.get(`/api/clubs/${s.c.id}/harvest-figures`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const body = HarvestFiguresSchema.parse(res.body);
    expect(body.season).toEqual({ id: s.season, year: YEAR });
    expect(body.years).toEqual([YEAR, YEAR - 1]);
    expect(body.units).toBe('metric');
    expect(body.page).toBe(1);
    expect(body.total).toBe(2);
    expect(body.items.map((i) => i.crop.slug)).toEqual(['radish', 'lettuce']);

    // computed: radish areas 1 × 2 = 2 m² and 4 × 5 = 20 m²; 1200 + 800 = 2000 g; plants 40 + 60 = 100
    const radishArea = 1 * 2 + 4 * 5;
    expect(body.items[0]).toEqual({
      crop: { id: radish.id, slug: 'radish', commonName: radish.commonName },
      plantings: 2,
      areaM2: radishArea,
      plants: 100,
      grams: 2000,
      count: 50,
      gramsPerM2: 2000 / radishArea,
      gramsPerPlant: 2000 / 100,
    });
    const lettuceShape = { width: 2, length: 3, layout: 'intensive' as const, rowCount: null, quantity: null, method: 'sown' as const, plantedOn: `${YEAR}-04-01` };
    const lettucePlants = computePlanting(cropBySlug('lettuce')!, lettuceShape, noClimate).plantsThatFit!.plants;
    expect(lettucePlants).toBeGreaterThan(0);
    expect(body.items[1]).toMatchObject({ plantings: 1, areaM2: 6, plants: lettucePlants, grams: 453.6, count: 12, gramsPerM2: 453.6 / 6 });
    expect(body.items[1].gramsPerPlant).toBeCloseTo(453.6 / lettucePlants, 10);
    expect(body.totals).toMatchObject({ plantings: 3, areaM2: radishArea + 6, plants: 100 + lettucePlants, count: 62 });
    expect(body.totals.grams).toBeCloseTo(2000 + 453.6, 6);
    expect(body.totals.gramsPerM2).toBeCloseTo((2000 + 453.6) / (radishArea + 6), 6);

    const earlier = HarvestFiguresSchema.parse((await s.coordinator.get(`/api/clubs/${s.c.id}/harvest-figures?year=${YEAR - 1}`).expect(200)).body);
    expect(earlier.season).toEqual({ id: s.last, year: YEAR - 1 });
    // computed: the whole of A-1, 3 × 6 = 18 m²; 3000 g over 6 plants
    expect(earlier.items).toEqual([
      { crop: { id: cabbage.id, slug: 'cabbage', commonName: cabbage.commonName }, plantings: 1, areaM2: 18, plants: 6, grams: 3000, count: 6, gramsPerM2: 3000 / 18, gramsPerPlant: 500 },
    ]);
  });

  it('answers an empty season and a club with no season', async () => {
    const s = await club();
    const res = HarvestFiguresSchema.parse((await s.coordinator.get(`/api/clubs/${s.c.id}/harvest-figures`).expect(200)).body);
    expect(res).toMatchObject({ season: { year: YEAR }, units: 'metric', items: [], total: 0, totals: { plantings: 0, grams: 0, gramsPerM2: null, gramsPerPlant: null } });
    // The main site is the oldest live one: 'Top field' going US units changes the answer; the archived site does not count.
    await t.db('sites').where({ club_id: s.c.id, name: 'Top field' }).update({ units: 'us' });
    expect((await s.coordinator.get(`/api/clubs/${s.c.id}/harvest-figures`).expect(200)).body.units).toBe('us');
    await t.db('sites').where({ club_id: s.c.id, name: 'Top field' }).update({ archived_at: new Date() });
    await t.db('sites').where({ club_id: s.c.id, name: 'Old orchard' }).update({ units: 'us' });
    expect((await s.coordinator.get(`/api/clubs/${s.c.id}/harvest-figures`).expect(200)).body.units).toBe('metric');
    const bare = await buildClub(t.db);
    const member = await signedInMember(t, bare.id, ['plot_holder']);
    const none = (await member.get(`/api/clubs/${bare.id}/harvest-figures`).expect(200)).body;
    expect(none).toMatchObject({ season: null, years: [], items: [], total: 0, units: 'metric' });
  });

  it('reads 3 plantings and 30 plantings with the same number of queries', async () => {
    const s = await club();
    const crops = await Promise.all(['radish', 'lettuce', 'carrot'].map((slug) => buildCrop(t.db, slug)));
    const queriesFor = async (n: number) => {
      await t.db('plantings').delete();
      const ids: number[] = [];
      for (let i = 0; i < n; i++) ids.push(await planting({ plot_id: i % 2 ? s.a1 : s.a2, season_id: s.season, crop_id: crops[i % 3].id, quantity: 5 }));
      await t.db('harvests').insert(ids.map((id) => ({ planting_id: id, harvested_on: localToday('UTC'), grams: 100 })));
      let count = 0;
      const listener = () => {
        count += 1;
      };
      t.db.on('query', listener);
      try {
        const body = (await s.coordinator.get(`/api/clubs/${s.c.id}/harvest-figures`).expect(200)).body;
        // computed: n plantings × 100 g
        expect(body.totals.grams).toBe(n * 100);
      } finally {
        t.db.removeListener('query', listener);
      }
      return count;
    };
    const few = await queriesFor(3);
    const many = await queriesFor(30);
    expect(few).toBeGreaterThan(0);
    expect(many).toBe(few);
  });
});
