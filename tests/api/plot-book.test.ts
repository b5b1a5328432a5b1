import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import sharp from 'sharp';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { cropBySlug } from '@shared/crops';
import { localToday } from '@shared/dates';
import { GRAMS_PER_POUND, plantingDates, plantsInRows } from '@shared/plot-book';
import { buildClub, buildCrop } from '../factories';
import { signedInMember, type Agent } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

// Photos go to this file's own folder, so "nothing was left on disk" can be checked by listing it.
const root = fs.mkdtempSync(path.join(os.tmpdir(), 'tillwell-book-'));
const uploadDir = path.join(root, 'uploads');
const photoDir = path.join(uploadDir, 'observation-photos');
const t = setupTestApp({ UPLOAD_DIR: uploadDir });
afterAll(async () => {
  await t.close();
  fs.rmSync(root, { recursive: true, force: true });
});
beforeEach(async () => {
  await truncateAll(t.db);
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

const storedFiles = () => (fs.existsSync(photoDir) ? fs.readdirSync(photoDir).sort() : []);

// "This season" is the newest season whose year has begun in the club's zone (UTC for a new club).
const YEAR = Number(localToday('UTC').slice(0, 4));

/**
 * A club in this season: Hana holds A-1 and Ines holds A-2 (3 m × 6 m each), a coordinator and a
 * volunteer hold nothing, an outsider belongs to another club. Last year Hana's plot grew onions (another family than the radish and tomato the tests plant).
 */
async function club() {
  const c = await buildClub(t.db, { name: 'Willow Lane Growers' });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const hana = await signedInMember(t, c.id, ['plot_holder']);
  const ines = await signedInMember(t, c.id, ['plot_holder']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const elsewhere = await buildClub(t.db, { name: 'Far Meadow' });
  const outsider = await signedInMember(t, elsewhere.id, ['coordinator']);
  // The test site's own frost dates (inputs, not facts of the trade).
  const [site] = await t.db('sites')
    .insert({
      club_id: c.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'UTC', width_m: 30, length_m: 20,
      last_spring_frost: '04-25', first_autumn_frost: '10-15',
    })
    .returning('id');
  const plots: Array<{ id: number; label: string }> = await t.db('plots')
    .insert(['A-1', 'A-2'].map((label, i) => ({ site_id: site.id, label, x_m: i * 4, y_m: 0, width_m: 3, length_m: 6 })))
    .returning(['id', 'label']);
  const [last] = await t.db('seasons').insert({ club_id: c.id, year: YEAR - 1 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: YEAR }).returning('id');
  await t.db('allocations').insert([
    { season_id: last.id, plot_id: plots[0].id, user_id: ines.person.id, source: 'manual' },
    { season_id: season.id, plot_id: plots[0].id, user_id: hana.person.id, source: 'manual' },
    { season_id: season.id, plot_id: plots[1].id, user_id: ines.person.id, source: 'manual' },
  ]);
  const radish = await buildCrop(t.db, 'radish');
  const tomato = await buildCrop(t.db, 'tomato');
  const onion = await buildCrop(t.db, 'onion');
  const [past] = await t.db('plantings')
    .insert({ plot_id: plots[0].id, season_id: last.id, crop_id: onion.id, method: 'transplanted', planted_on: `${YEAR - 1}-05-01` })
    .returning('id');
  return {
    club: c, siteId: site.id as number, plotA: plots[0].id, plotB: plots[1].id, seasonId: season.id as number, lastSeasonId: last.id as number,
    pastPlantingId: past.id as number, coordinator, hana, ines, volunteer, outsider, radish, tomato, onion,
  };
}

type Setup = Awaited<ReturnType<typeof club>>;

/** A 10 ft radish row along the plot's long side: one row, 0.3 m wide, 3.048 m long (1 ft = 0.3048 m exactly, NIST SP 811 App. B). */
const radishRow = (s: Setup, more: Record<string, unknown> = {}) => ({
  cropId: s.radish.id,
  variety: 'French Breakfast',
  part: { x: 0, y: 0, width: 0.3, length: 3.048 },
  method: 'sown',
  plantedOn: `${YEAR}-04-10`,
  layout: 'rows',
  rowCount: 1,
  ...more,
});

const setShared = (s: Setup, on: boolean) => t.db('clubs').where({ id: s.club.id }).update({ shares_plot_books: on });

describe('who may open a plot book', () => {
  it('lets the holder and a coordinator read and write; refuses another member (403), an outsider (404) and a visitor (401)', async () => {
    const s = await club();
    for (const who of [s.hana, s.coordinator]) {
      const res = await who.get(`/api/plots/${s.plotA}/book`);
      expect(res.status).toBe(200);
      expect(res.body.canWrite).toBe(true);
      expect((await who.post(`/api/plots/${s.plotA}/plantings`, radishRow(s))).status).toBe(201);
    }
    expect(await t.db('plantings').where({ plot_id: s.plotA, season_id: s.seasonId }).count({ n: '*' })).toEqual([{ n: 2 }]);

    for (const who of [s.ines, s.volunteer]) {
      const read = await who.get(`/api/plots/${s.plotA}/book`);
      expect(read.status).toBe(403);
      expect(read.body.error.code).toBe('forbidden');
      expect((await who.post(`/api/plots/${s.plotA}/plantings`, radishRow(s))).status).toBe(403);
    }
    const outside = await s.outsider.get(`/api/plots/${s.plotA}/book`);
    expect(outside.status).toBe(404);
    expect((await s.outsider.post(`/api/plots/${s.plotA}/plantings`, radishRow(s))).status).toBe(404);
    const anonymous = await browserLikeAgent(t.app);
    expect((await anonymous.get(`/api/plots/${s.plotA}/book`)).status).toBe(401);
    expect((await anonymous.post(`/api/plots/${s.plotA}/plantings`, radishRow(s))).status).toBe(401);
    expect((await s.hana.get('/api/plots/999999/book')).status).toBe(404);
    for (const bad of ['abc', '0', '2147483648', '1.5']) {
      const res = await s.hana.get(`/api/plots/${bad}/book`);
      expect(res.status, bad).toBe(400);
      expect(res.body.error.fields).toHaveProperty('plotId');
    }
    expect(await t.db('plantings').where({ season_id: s.seasonId }).count({ n: '*' })).toEqual([{ n: 2 }]);
  });

  it('lets other members read, never write, when the club shares plot books', async () => {
    const s = await club();
    const planted = await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s)).expect(201);
    await setShared(s, true);
    const read = await s.ines.get(`/api/plots/${s.plotA}/book`).expect(200);
    expect(read.body.canWrite).toBe(false);
    expect(read.body.plantings.map((p: { id: number }) => p.id)).toEqual([planted.body.id]);
    expect(JSON.stringify(read.body)).not.toContain(s.hana.person.email);
    expect((await s.ines.post(`/api/plots/${s.plotA}/plantings`, radishRow(s))).status).toBe(403);
    expect((await s.ines.patch(`/api/plantings/${planted.body.id}`, { version: 1, notes: 'mine now' })).status).toBe(403);
    expect((await s.ines.delete(`/api/plantings/${planted.body.id}`)).status).toBe(403);
    expect((await s.ines.post(`/api/plantings/${planted.body.id}/harvests`, { harvestedOn: `${YEAR}-05-01`, count: 3 })).status).toBe(403);
    expect((await s.ines.post(`/api/plots/${s.plotA}/observations`, { pestSlug: 'aphids', severity: 'light', observedOn: `${YEAR}-05-01` })).status).toBe(403);
    expect((await s.outsider.get(`/api/plots/${s.plotA}/book`)).status).toBe(404);
    const row = await t.db('plantings').where({ id: planted.body.id }).first('notes', 'version');
    expect(row).toEqual({ notes: '', version: 1 });
    expect(await t.db('harvests').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await t.db('observations').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('shows this season by default and earlier seasons as history, and a past year on request', async () => {
    const s = await club();
    await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s)).expect(201);
    const book = (await s.hana.get(`/api/plots/${s.plotA}/book`).expect(200)).body;
    expect(book.plot).toEqual({ id: s.plotA, label: 'A-1', siteId: s.siteId, siteName: 'Top field', width: 3, length: 6, kind: 'in_ground', units: 'metric' });
    expect(book.season).toEqual({ id: s.seasonId, year: YEAR, isCurrent: true });
    expect(book.plantings.map((p: { crop: { slug: string } }) => p.crop.slug)).toEqual(['radish']);
    expect(book.pastSeasons).toHaveLength(1);
    expect(book.pastSeasons[0].year).toBe(YEAR - 1);
    expect(book.pastSeasons[0].plantings.map((p: { id: number; crop: { family: string } }) => [p.id, p.crop.family])).toEqual([[s.pastPlantingId, 'Amaryllidaceae']]);
    const last = (await s.hana.get(`/api/plots/${s.plotA}/book?year=${YEAR - 1}`).expect(200)).body;
    expect(last.season).toEqual({ id: s.lastSeasonId, year: YEAR - 1, isCurrent: false });
    expect(last.canWrite).toBe(false);
    expect(last.plantings.map((p: { id: number }) => p.id)).toEqual([s.pastPlantingId]);
    expect(last.pastSeasons).toEqual([]);
    expect((await s.hana.get(`/api/plots/${s.plotA}/book?year=1999`)).body.error.fields).toHaveProperty('year');
    expect((await s.hana.get(`/api/plots/${s.plotA}/book?year=2090`)).status).toBe(404);
  });
});

describe('POST /api/plots/:plotId/plantings', () => {
  it('records a radish row and computes 60 plants in 10 ft at 2 in, and the dates from the crop notes', async () => {
    const s = await club();
    const res = await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const radish = cropBySlug('radish')!;
    // Radish is thinned to about 2 in (5.08 cm) in a row (the crop notes, common practice); the wider end of the range is used.
    expect(radish.inRowCm.value.max).toBeCloseTo(5.08, 10);
    const expected = plantsInRows({ rowLengthM: 3.048, rows: 1, inRowCm: radish.inRowCm.value.max });
    // computed: 10 ft / 2 in = 120 in / 2 in = 60 plants, one spacing of row each (common practice, shared/plot-book/spacing.ts)
    expect(expected.plants).toBe(60);
    expect(res.body.computed.plantsThatFit).toEqual({ plants: 60, rows: 1, perRow: 60, inRowCm: radish.inRowCm.value.max, betweenRowCm: radish.betweenRowCm.value.max });
    // computed: 0.3 m × 3.048 m = 0.9144 m²
    expect(res.body.computed.areaM2).toBeCloseTo(0.9144, 10);
    // No soil temperatures for the site: emergence falls back to the crop's range, as shared/plot-book computes it.
    const dates = plantingDates({ crop: radish, method: 'sown', date: `${YEAR}-04-10`, lastSpringFrost: `${YEAR}-04-25`, firstAutumnFrost: `${YEAR}-10-15` });
    expect(res.body.computed.soilTempC).toBeNull();
    expect(res.body.computed.emergence).toEqual({ expected: dates.emergence!.expected, earliest: dates.emergence!.earliest, latest: dates.emergence!.latest, basis: 'range' });
    expect(res.body.computed.thinning).toBe(dates.thinning);
    expect(res.body.computed.sideDressing).toEqual(dates.sideDressing);
    expect(res.body.computed.harvestWindow).toEqual(dates.harvest);
    // Radish is hardy, so a sowing before the last frost carries no warning.
    expect(res.body.computed.warnings).toEqual([]);
    expect(res.body).toMatchObject({
      plotId: s.plotA, seasonId: s.seasonId, seasonYear: YEAR, variety: 'French Breakfast', method: 'sown', plantedOn: `${YEAR}-04-10`,
      layout: 'rows', rowCount: 1, quantity: null, status: 'planned', notes: '', version: 1,
      crop: { id: s.radish.id, slug: 'radish', commonName: 'Radish', family: 'Brassicaceae' },
      part: { x: 0, y: 0, width: 0.3, length: 3.048 },
    });
    const row = await t.db('plantings').where({ id: res.body.id }).first();
    expect(row).toMatchObject({
      plot_id: s.plotA, season_id: s.seasonId, crop_id: s.radish.id, part_x_m: 0, part_y_m: 0, part_width_m: 0.3, part_length_m: 3.048,
      method: 'sown', planted_on: `${YEAR}-04-10`, layout: 'rows', row_count: 1, status: 'planned', created_by_user_id: s.hana.person.id,
    });
  });

  it('uses the site’s soil temperature for the month, and warns of frost for a tender crop set out early', async () => {
    const s = await club();
    // The test site's own monthly soil table (inputs): 15 °C in April.
    await t.db('sites').where({ id: s.siteId }).update({ soil_temps_c: JSON.stringify([2, 3, 8, 15, 18, 20, 22, 21, 18, 12, 7, 3]) });
    const sown = await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s)).expect(201);
    const radish = cropBySlug('radish')!;
    const dates = plantingDates({ crop: radish, method: 'sown', date: `${YEAR}-04-10`, soilC: 15 });
    expect(sown.body.computed.soilTempC).toBe(15);
    expect(sown.body.computed.emergence).toMatchObject({ expected: dates.emergence!.expected, basis: 'table' });

    const tomato = await s.hana.post(`/api/plots/${s.plotA}/plantings`, { cropId: s.tomato.id, method: 'transplanted', plantedOn: `${YEAR}-04-20`, part: null }).expect(201);
    expect(tomato.body.part).toBeNull();
    // computed: the whole plot, 3 m × 6 m = 18 m²
    expect(tomato.body.computed.areaM2).toBe(18);
    expect(tomato.body.computed.warnings.map((w: { kind: string }) => w.kind)).toContain('before_last_frost');
    expect(tomato.body.computed.emergence).toBeNull();
  });

  it('refuses a part outside the plot with 400 on `part`, and bad fields by name, writing nothing', async () => {
    const s = await club();
    const outside = await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s, { part: { x: 2.9, y: 0, width: 0.3, length: 3 } }));
    expect(outside.status).toBe(400);
    expect(outside.body.error.fields).toHaveProperty('part');
    const tooLong = await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s, { part: { x: 0, y: 3.5, width: 1, length: 3 } }));
    expect(tooLong.body.error.fields).toHaveProperty('part');
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ cropId: undefined }, 'cropId'],
      [{ cropId: 2147483648 }, 'cropId'],
      [{ cropId: 999999 }, 'cropId'],
      [{ method: 'broadcast' }, 'method'],
      [{ plantedOn: '2027-02-30' }, 'plantedOn'],
      [{ notes: 'a\u0000b' }, 'notes'],
      [{ rowCount: 0 }, 'rowCount'],
      [{ part: { x: 0, y: 0, width: 1e-9, length: 1 } }, 'part.width'],
      [{ colour: 'red' }, 'colour'],
    ];
    for (const [change, field] of cases) {
      const res = await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s, change));
      expect(res.status, field).toBe(400);
      expect(res.body.error.fields, field).toHaveProperty([field]);
    }
    // A crop of another club is not in this club's crop notes.
    const other = await buildClub(t.db);
    const [own] = await t.db('crops').insert({ club_id: other.id, slug: 'their-bean', common_name: 'Their bean', family: 'Fabaceae', kind: 'legume', data: JSON.stringify(cropBySlug('bush-bean')) }).returning('id');
    expect((await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s, { cropId: own.id }))).body.error.fields).toHaveProperty('cropId');
    expect(await t.db('plantings').where({ season_id: s.seasonId }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});

describe('PATCH and DELETE /api/plantings/:plantingId', () => {
  it('changes a planting by version, refuses a stale one (409), and deletes it with its harvests', async () => {
    const s = await club();
    const created = (await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s)).expect(201)).body;
    expect((await s.hana.get(`/api/plantings/${created.id}`).expect(200)).body).toEqual(created);
    expect((await s.ines.get(`/api/plantings/${created.id}`)).status).toBe(403);
    expect((await s.outsider.get(`/api/plantings/${created.id}`)).status).toBe(404);
    const changed = await s.hana.patch(`/api/plantings/${created.id}`, { version: 1, status: 'up', rowCount: 2 });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    expect(changed.body).toMatchObject({ status: 'up', rowCount: 2, version: 2 });
    // computed: two rows of 60
    expect(changed.body.computed.plantsThatFit.plants).toBe(120);
    expect(await t.db('plantings').where({ id: created.id }).first('status', 'row_count', 'version')).toEqual({ status: 'up', row_count: 2, version: 2 });
    expect((await s.hana.patch(`/api/plantings/${created.id}`, { version: 1, status: 'failed' })).status).toBe(409);
    const outside = await s.hana.patch(`/api/plantings/${created.id}`, { version: 2, part: { x: 0, y: 5, width: 1, length: 2 } });
    expect(outside.status).toBe(400);
    expect(outside.body.error.fields).toHaveProperty('part');
    expect((await s.hana.patch(`/api/plantings/${created.id}`, { status: 'up' })).body.error.fields).toHaveProperty('version');
    expect((await s.coordinator.patch(`/api/plantings/${created.id}`, { version: 2, notes: 'Checked' })).status).toBe(200);
    expect((await s.outsider.patch(`/api/plantings/${created.id}`, { version: 3, notes: 'x' })).status).toBe(404);
    expect((await s.hana.patch('/api/plantings/999999', { version: 1, notes: 'x' })).status).toBe(404);
    expect((await s.hana.patch('/api/plantings/abc', { version: 1 })).body.error.fields).toHaveProperty('plantingId');

    await s.hana.post(`/api/plantings/${created.id}/harvests`, { harvestedOn: localToday('UTC'), count: 12 }).expect(201);
    expect((await s.hana.delete(`/api/plantings/${created.id}`)).status).toBe(204);
    expect(await t.db('plantings').where({ id: created.id }).first()).toBeUndefined();
    expect(await t.db('harvests').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect((await s.hana.delete(`/api/plantings/${created.id}`)).status).toBe(404);
  });

  it('keeps earlier seasons as history: the holder cannot change them, a coordinator can', async () => {
    const s = await club();
    expect((await s.hana.patch(`/api/plantings/${s.pastPlantingId}`, { version: 1, notes: 'not mine' })).status).toBe(403);
    // Last year's holder of A-1 no longer holds it.
    expect((await s.ines.patch(`/api/plantings/${s.pastPlantingId}`, { version: 1, notes: 'mine once' })).status).toBe(403);
    expect((await s.coordinator.patch(`/api/plantings/${s.pastPlantingId}`, { version: 1, notes: 'Corrected' })).status).toBe(200);
    expect(await t.db('plantings').where({ id: s.pastPlantingId }).first('notes')).toEqual({ notes: 'Corrected' });
  });
});

describe('harvests', () => {
  it('stores a weight in pounds as grams and totals it per planting and for the plot', async () => {
    const s = await club();
    const planting = (await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s)).expect(201)).body;
    const today = localToday('UTC');
    const res = await s.hana.post(`/api/plantings/${planting.id}/harvests`, { harvestedOn: today, weight: { value: 2, unit: 'lb' }, count: 30, notes: 'First pull' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // 1 lb = 453.59237 g exactly (NIST Handbook 44, Appendix C); computed: 2 × 453.59237 = 907.18474 g, kept to 0.1 g → 907.2
    expect(GRAMS_PER_POUND).toBe(453.59237);
    expect(res.body).toEqual({ id: res.body.id, plantingId: planting.id, harvestedOn: today, grams: 907.2, count: 30, notes: 'First pull' });
    expect(await t.db('harvests').where({ id: res.body.id }).first('grams', 'count', 'planting_id')).toEqual({ grams: 907.2, count: 30, planting_id: planting.id });
    await s.hana.post(`/api/plantings/${planting.id}/harvests`, { harvestedOn: today, weight: { value: 0.5, unit: 'kg' } }).expect(201);

    const book = (await s.hana.get(`/api/plots/${s.plotA}/book`).expect(200)).body;
    expect(book.harvests).toHaveLength(2);
    // computed: 907.2 + 500 = 1407.2 g; 30 pieces; over 60 plants the row holds
    const totals = book.harvestTotals.byPlanting.find((x: { plantingId: number }) => x.plantingId === planting.id);
    expect(totals.grams).toBeCloseTo(1407.2, 6);
    expect(totals.count).toBe(30);
    expect(totals.gramsPerPlant).toBeCloseTo(1407.2 / 60, 6);
    // computed: per m² of the part, 1407.2 / 0.9144
    expect(totals.gramsPerM2).toBeCloseTo(1407.2 / 0.9144, 6);
    expect(book.harvestTotals.plot.grams).toBeCloseTo(1407.2, 6);
    // computed: the plot is 18 m²
    expect(book.harvestTotals.plot.gramsPerM2).toBeCloseTo(1407.2 / 18, 6);
  });

  it('refuses a harvest with neither weight nor count, a future date or a bad unit, and deletes one', async () => {
    const s = await club();
    const planting = (await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s)).expect(201)).body;
    const today = localToday('UTC');
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ harvestedOn: today }, 'weight'],
      [{ harvestedOn: '2999-01-01', count: 1 }, 'harvestedOn'],
      [{ harvestedOn: today, weight: { value: 1, unit: 'stone' } }, 'weight.unit'],
      [{ harvestedOn: today, weight: { value: -1, unit: 'g' } }, 'weight.value'],
      [{ harvestedOn: today, weight: { value: 0.01, unit: 'g' } }, 'weight'],
      [{ harvestedOn: today, count: 1.5 }, 'count'],
    ];
    for (const [body, field] of cases) {
      const res = await s.hana.post(`/api/plantings/${planting.id}/harvests`, body);
      expect(res.status, field).toBe(400);
      expect(res.body.error.fields, field).toHaveProperty([field]);
    }
    expect(await t.db('harvests').count({ n: '*' })).toEqual([{ n: 0 }]);
    const h = (await s.hana.post(`/api/plantings/${planting.id}/harvests`, { harvestedOn: today, count: 4 }).expect(201)).body;
    await setShared(s, true);
    expect((await s.ines.delete(`/api/harvests/${h.id}`)).status).toBe(403);
    expect((await s.outsider.delete(`/api/harvests/${h.id}`)).status).toBe(404);
    expect((await s.hana.delete(`/api/harvests/${h.id}`)).status).toBe(204);
    expect(await t.db('harvests').where({ id: h.id }).first()).toBeUndefined();
    expect((await s.hana.delete(`/api/harvests/${h.id}`)).status).toBe(404);
  });
});

describe('observations', () => {
  it('keeps a soil-borne disease against the soil and a pest not; a free-text one needs its kind', async () => {
    const s = await club();
    const today = localToday('UTC');
    const planting = (await s.hana.post(`/api/plots/${s.plotA}/plantings`, radishRow(s)).expect(201)).body;
    const clubroot = await s.hana.post(`/api/plots/${s.plotA}/observations`, {
      pestSlug: 'clubroot', severity: 'moderate', observedOn: today, plantingId: planting.id, part: { x: 0, y: 0, width: 0.3, length: 3.048 }, notes: 'Swollen roots',
    });
    expect(clubroot.status, JSON.stringify(clubroot.body)).toBe(201);
    expect(clubroot.body).toEqual({
      id: clubroot.body.id, plotId: s.plotA, plantingId: planting.id, pestSlug: 'clubroot', name: 'Clubroot', kind: 'disease', isSoilBorne: true,
      severity: 'moderate', observedOn: today, notes: 'Swollen roots', part: { x: 0, y: 0, width: 0.3, length: 3.048 }, photos: [],
    });
    // Clubroot is soil-borne (shared/crops/pests.ts, UConn disease rotation source).
    expect(await t.db('observations').where({ id: clubroot.body.id }).first('is_soil_borne', 'kind', 'name')).toEqual({ is_soil_borne: true, kind: 'disease', name: 'Clubroot' });
    const aphids = (await s.hana.post(`/api/plots/${s.plotA}/observations`, { pestSlug: 'aphids', severity: 'light', observedOn: today }).expect(201)).body;
    expect(aphids.isSoilBorne).toBe(false);
    // Seen on a planting that covers part of the plot, with no part given: kept against the soil under that planting.
    const strip = (await s.hana.post(`/api/plots/${s.plotA}/plantings`, { ...radishRow(s), part: { x: 1, y: 0.5, width: 0.6, length: 2 } }).expect(201)).body;
    const onStrip = (await s.hana.post(`/api/plots/${s.plotA}/observations`, { pestSlug: 'clubroot', severity: 'light', observedOn: today, plantingId: strip.id }).expect(201)).body;
    expect(onStrip.part).toEqual({ x: 1, y: 0.5, width: 0.6, length: 2 });
    await t.db('observations').where({ id: onStrip.id }).delete();
    const other = (await s.coordinator.post(`/api/plots/${s.plotA}/observations`, { name: 'Hail damage', kind: 'other', severity: 'severe', observedOn: today }).expect(201)).body;
    expect(other).toMatchObject({ pestSlug: null, name: 'Hail damage', kind: 'other', isSoilBorne: false, part: null });

    const cases: Array<[Record<string, unknown>, string]> = [
      [{ severity: 'light', observedOn: today }, 'name'],
      [{ name: 'Odd spots', severity: 'light', observedOn: today }, 'kind'],
      [{ pestSlug: 'dragons', severity: 'light', observedOn: today }, 'pestSlug'],
      [{ pestSlug: 'clubroot', kind: 'pest', severity: 'light', observedOn: today }, 'kind'],
      [{ pestSlug: 'aphids', severity: 'awful', observedOn: today }, 'severity'],
      [{ pestSlug: 'aphids', severity: 'light', observedOn: today, part: { x: 2, y: 0, width: 2, length: 1 } }, 'part'],
      [{ pestSlug: 'aphids', severity: 'light', observedOn: today, plantingId: s.pastPlantingId + 1000 }, 'plantingId'],
      [{ pestSlug: 'aphids', severity: 'light', observedOn: today, notes: '\u0000' }, 'notes'],
    ];
    for (const [body, field] of cases) {
      const res = await s.hana.post(`/api/plots/${s.plotA}/observations`, body);
      expect(res.status, field).toBe(400);
      expect(res.body.error.fields, field).toHaveProperty([field]);
    }
    // A planting on another plot cannot be named.
    const onB = (await s.ines.post(`/api/plots/${s.plotB}/plantings`, radishRow(s)).expect(201)).body;
    expect((await s.hana.post(`/api/plots/${s.plotA}/observations`, { pestSlug: 'aphids', severity: 'light', observedOn: today, plantingId: onB.id })).body.error.fields).toHaveProperty('plantingId');
    expect(await t.db('observations').count({ n: '*' })).toEqual([{ n: 3 }]);

    const book = (await s.hana.get(`/api/plots/${s.plotA}/book`).expect(200)).body;
    expect(book.observations.map((o: { id: number }) => o.id)).toEqual([other.id, aphids.id, clubroot.body.id]);
  });
});

describe('observation photos', () => {
  const be32 = (n: number) => Buffer.from([(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]);
  const pngChunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    return Buffer.concat([be32(data.length), body, be32(zlib.crc32(body))]);
  };
  /** A PNG signature and IHDR claiming the size, with one tiny IDAT (W3C PNG Specification, 3rd ed., §5.2, §11.2.1). */
  const pngHeader = (width: number, height: number) =>
    Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      pngChunk('IHDR', Buffer.concat([be32(width), be32(height), Buffer.from([8, 2, 0, 0, 0])])),
      pngChunk('IDAT', zlib.deflateSync(Buffer.alloc(16))),
      pngChunk('IEND', Buffer.alloc(0)),
    ]);
  const jpeg = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: '#6a8f3c' } }).jpeg().toBuffer();
  const upload = (c: Agent, observationId: number, file: Buffer, name: string) =>
    c.agent.post(`/api/observations/${observationId}/photos`).set('X-CSRF-Token', c.csrf).attach('photo', file, name);

  async function withObservation() {
    const s = await club();
    const obs = (await s.hana.post(`/api/plots/${s.plotA}/observations`, { pestSlug: 'slugs', severity: 'moderate', observedOn: localToday('UTC') }).expect(201)).body;
    return { ...s, observationId: obs.id as number };
  }

  it('stores a JPEG as WebP of at most 1600 px with a 320 px thumbnail, served only to those who may read the book', async () => {
    const s = await withObservation();
    const res = await upload(s.hana, s.observationId, await jpeg(2000, 1500), 'leaf.jpg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.photos).toHaveLength(1);
    const photo = res.body.photos[0];
    // computed: 2000 × 1500 inside 1600 px → 1600 × 1200
    expect(photo).toEqual({ id: photo.id, url: `/api/observation-photos/${photo.id}`, thumbUrl: `/api/observation-photos/${photo.id}/thumb`, width: 1600, height: 1200 });
    const row = await t.db('observation_photos').where({ id: photo.id }).first();
    expect(row).toMatchObject({ observation_id: s.observationId, mime: 'image/webp', width_px: 1600, height_px: 1200 });
    expect(storedFiles()).toEqual([row.file_name, row.thumb_name].sort());

    const full = await s.hana.agent.get(photo.url).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(full.status).toBe(200);
    expect(full.headers['content-type']).toBe('image/webp');
    expect(await sharp(full.body as Buffer).metadata()).toMatchObject({ format: 'webp', width: 1600, height: 1200 });
    const thumb = await s.coordinator.agent.get(photo.thumbUrl).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect(await sharp(thumb.body as Buffer).metadata()).toMatchObject({ format: 'webp', width: 320, height: 320 });

    expect((await s.ines.get(photo.thumbUrl)).status).toBe(403);
    expect((await s.outsider.get(photo.url)).status).toBe(404);
    expect((await (await browserLikeAgent(t.app)).get(photo.url)).status).toBe(401);
    await setShared(s, true);
    expect((await s.ines.get(photo.thumbUrl)).status).toBe(200);
    expect((await upload(s.ines, s.observationId, await jpeg(20, 20), 'mine.jpg')).status).toBe(403);
    expect((await upload(s.outsider, s.observationId, await jpeg(20, 20), 'theirs.jpg')).status).toBe(404);
    expect((await upload(await browserLikeAgent(t.app), s.observationId, await jpeg(20, 20), 'anon.jpg')).status).toBe(401);
    expect((await upload(s.hana, 999999, await jpeg(20, 20), 'nowhere.jpg')).status).toBe(404);
    expect(await t.db('observation_photos').count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(storedFiles()).toHaveLength(2);
    expect((await s.hana.get('/api/observation-photos/999999')).status).toBe(404);
    const book = (await s.ines.get(`/api/plots/${s.plotA}/book`).expect(200)).body;
    expect(book.observations[0].photos).toEqual([photo]);

    // Deleting the observation takes its photos' rows and files with it; a reader may not.
    expect((await s.ines.delete(`/api/observations/${s.observationId}`)).status).toBe(403);
    expect((await s.outsider.delete(`/api/observations/${s.observationId}`)).status).toBe(404);
    expect((await s.hana.delete(`/api/observations/${s.observationId}`)).status).toBe(204);
    expect(await t.db('observation_photos').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await t.db('observations').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(storedFiles()).toEqual([]);
    expect((await s.hana.get(photo.url)).status).toBe(404);
    expect((await s.hana.delete(`/api/observations/${s.observationId}`)).status).toBe(404);
  });

  it('refuses a text file named .jpg, a 20000 × 20000 PNG header and a fifth photo with 400 on `photo`, leaving no file and no row', async () => {
    const s = await withObservation();
    const refusals: Array<[Buffer, string]> = [
      [Buffer.from('These are not the pixels you are looking for.\n'), 'leaf.jpg'],
      [pngHeader(20000, 20000), 'huge.png'],
    ];
    for (const [file, name] of refusals) {
      const res = await upload(s.hana, s.observationId, file, name);
      expect(res.status, name).toBe(400);
      expect(res.body.error.fields, name).toHaveProperty('photo');
      expect(storedFiles(), name).toEqual([]);
      expect(await t.db('observation_photos').count({ n: '*' })).toEqual([{ n: 0 }]);
    }
    const missing = await s.hana.agent.post(`/api/observations/${s.observationId}/photos`).set('X-CSRF-Token', s.hana.csrf).field('note', 'x');
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('photo');

    for (let i = 0; i < 4; i++) expect((await upload(s.hana, s.observationId, await jpeg(40 + i, 30), `p${i}.jpg`)).status).toBe(201);
    const before = storedFiles();
    // computed: four photos, each a file and a thumbnail
    expect(before).toHaveLength(8);
    const fifth = await upload(s.hana, s.observationId, await jpeg(50, 30), 'p4.jpg');
    expect(fifth.status).toBe(400);
    expect(fifth.body.error.fields).toHaveProperty('photo');
    expect(storedFiles()).toEqual(before);
    expect(await t.db('observation_photos').where({ observation_id: s.observationId }).count({ n: '*' })).toEqual([{ n: 4 }]);
  });
});
