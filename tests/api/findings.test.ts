import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { localToday } from '@shared/dates';
import { checkPlots } from '@shared/findings';
import { buildClub, buildCrop } from '../factories';
import { signedInMember } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';
import { loadCheckContext } from '../../server/services/findings';

// The neighbour check over HTTP: the dry run, saving against a clash with a reason, stored findings
// kept current by each change, who sees what, and "what fits here".

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const YEAR = Number(localToday('UTC').slice(0, 4));

/**
 * A site at 51.5° N with a 0.9 m path: A-1 (3 m × 5 m) at the top, A-2 across the path to its south,
 * A-3 across another path further south. Hana holds A-1, Ines A-2. Last year A-1 grew potatoes.
 */
async function club() {
  const c = await buildClub(t.db, { name: 'Quarry Bank Growers' });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const hana = await signedInMember(t, c.id, ['plot_holder']);
  const ines = await signedInMember(t, c.id, ['plot_holder']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const other = await buildClub(t.db, { name: 'Elsewhere' });
  const outsider = await signedInMember(t, other.id, ['coordinator']);
  const [site] = await t.db('sites')
    .insert({ club_id: c.id, name: 'Quarry field', latitude: 51.5, longitude: -2, time_zone: 'UTC', width_m: 20, length_m: 20, path_width_m: 0.9 })
    .returning('id');
  const plots: Array<{ id: number; label: string }> = await t.db('plots')
    .insert(['A-1', 'A-2', 'A-3'].map((label, i) => ({ site_id: site.id, label, x_m: 0, y_m: i * 5.9, width_m: 3, length_m: 5 })))
    .returning(['id', 'label']);
  const [last] = await t.db('seasons').insert({ club_id: c.id, year: YEAR - 1 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: YEAR }).returning('id');
  await t.db('allocations').insert([
    { season_id: season.id, plot_id: plots[0].id, user_id: hana.person.id, source: 'manual' },
    { season_id: season.id, plot_id: plots[1].id, user_id: ines.person.id, source: 'manual' },
  ]);
  const crop = Object.fromEntries(
    await Promise.all(['potato', 'tomato', 'radish', 'pea', 'onion'].map(async (slug) => [slug, (await buildCrop(t.db, slug)).id] as const)),
  ) as Record<'potato' | 'tomato' | 'radish' | 'pea' | 'onion', number>;
  await t.db('plantings').insert({ plot_id: plots[0].id, season_id: last.id, crop_id: crop.potato, method: 'sown', planted_on: `${YEAR - 1}-04-15` });
  return { club: c, siteId: site.id as number, a1: plots[0].id, a2: plots[1].id, a3: plots[2].id, seasonId: season.id as number, crop, coordinator, hana, ines, volunteer, outsider };
}
type Setup = Awaited<ReturnType<typeof club>>;

const tomatoBody = (s: Setup, more: Record<string, unknown> = {}) => ({ cropId: s.crop.tomato, method: 'transplanted', plantedOn: `${YEAR}-05-20`, ...more });
const radishBody = (s: Setup, more: Record<string, unknown> = {}) => ({ cropId: s.crop.radish, method: 'sown', plantedOn: `${YEAR}-05-01`, ...more });
const storedFor = (plantingId: number) => t.db('findings').where({ planting_id: plantingId }).orderBy('key').select('key', 'severity', 'kind', 'message');

describe('a planting against last year’s family', () => {
  it('the dry run shows the clash with its reason and saves nothing', async () => {
    const s = await club();
    const res = await s.hana.post(`/api/plots/${s.a1}/plantings/check`, tomatoBody(s)).expect(200);
    const rotation = res.body.findings.filter((f: { kind: string }) => f.kind === 'rotation');
    expect(rotation).toHaveLength(1);
    expect(rotation[0]).toMatchObject({ severity: 'clash', plantingId: 0, plotLabel: 'A-1', peers: [{ seasonYear: YEAR - 1, cropName: 'Potato' }] });
    expect(rotation[0].message).toContain(`Tomato (Solanaceae) here follows potato (Solanaceae) from ${YEAR - 1}`);
    expect(rotation[0].source).toMatchObject({ id: 'wvu-rotation', evidence: 'published' });
    expect(await t.db('plantings').where({ season_id: s.seasonId }).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await t.db('findings').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('a repeated dry run reuses its reading of the plot until the database changes, then sees the change', async () => {
    const s = await club();
    const rotations = async () =>
      (await s.hana.post(`/api/plots/${s.a1}/plantings/check`, tomatoBody(s)).expect(200)).body.findings.filter((f: { kind: string }) => f.kind === 'rotation');
    expect(await rotations()).toHaveLength(1);
    expect(await rotations()).toHaveLength(1);
    // Another server removes last year's potatoes: the next dry run no longer finds the family clash.
    await t.db('plantings').where({ plot_id: s.a1 }).del();
    expect(await rotations()).toEqual([]);
  });

  it('refuses to save the clash without a reason (409 on keepReason, nothing kept), saves it with one, and the saved check equals the dry run', async () => {
    const s = await club();
    const refused = await s.hana.post(`/api/plots/${s.a1}/plantings`, tomatoBody(s)).expect(409);
    expect(refused.body.error.fields).toHaveProperty('keepReason');
    expect(refused.body.error.message).toContain('follows potato');
    expect(await t.db('plantings').where({ season_id: s.seasonId }).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await t.db('findings').count({ n: '*' })).toEqual([{ n: 0 }]);

    const reason = 'Blight-resistant variety in new compost; the potatoes were lifted early.';
    const dry = await s.hana.post(`/api/plots/${s.a1}/plantings/check`, tomatoBody(s, { keepReason: reason })).expect(200);
    const saved = await s.hana.post(`/api/plots/${s.a1}/plantings`, tomatoBody(s, { keepReason: reason })).expect(201);
    expect(saved.body.keepReason).toBe(reason);
    const book = await s.hana.get(`/api/plots/${s.a1}/book`).expect(200);
    const strip = (f: Record<string, unknown>) => ({ ...f, plantingId: 0 });
    expect(book.body.findings.map(strip)).toEqual(dry.body.findings.map(strip));
    expect(book.body.findings.find((f: { kind: string }) => f.kind === 'rotation').keptReason).toBe(reason);

    // The coordinator sees it, with the reason, in the season's table and its CSV.
    const list = await s.coordinator.get(`/api/clubs/${s.club.id}/findings`).expect(200);
    expect(list.body.seasonYear).toBe(YEAR);
    expect(list.body.items).toEqual([expect.objectContaining({ severity: 'clash', siteName: 'Quarry field', plotLabel: 'A-1', keptReason: reason })]);
    const csv = await s.coordinator.get(`/api/clubs/${s.club.id}/findings/export.csv?severity=clash`).expect(200);
    expect(csv.headers['content-type']).toContain('text/csv');
    expect(csv.text).toContain('Clash');
    expect(csv.text).toContain(reason);
  });

  it('an edit that keeps the clash needs no new reason; an edit that brings one does', async () => {
    const s = await club();
    const onion = await s.hana.post(`/api/plots/${s.a1}/plantings`, { cropId: s.crop.onion, method: 'sown', plantedOn: `${YEAR}-04-01` }).expect(201);
    const toTomato = await s.hana.patch(`/api/plantings/${onion.body.id}`, { version: 1, cropId: s.crop.tomato, method: 'transplanted' });
    expect(toTomato.status).toBe(409);
    expect(await t.db('plantings').where({ id: onion.body.id }).first('crop_id', 'version')).toEqual({ crop_id: s.crop.onion, version: 1 });
    await s.hana.patch(`/api/plantings/${onion.body.id}`, { version: 1, cropId: s.crop.tomato, method: 'transplanted', keepReason: 'Trying it' }).expect(200);
    await s.hana.patch(`/api/plantings/${onion.body.id}`, { version: 2, status: 'up' }).expect(200);
    expect((await storedFor(onion.body.id)).map((f) => f.key)).toEqual(['rotation_family']);
  });
});

describe('findings kept current by each change', () => {
  it('a companion across the path appears on both plots, never two plots away, and goes when the neighbour’s planting goes', async () => {
    const s = await club();
    const radish = await s.hana.post(`/api/plots/${s.a1}/plantings`, radishBody(s)).expect(201);
    const far = await s.coordinator.post(`/api/plots/${s.a3}/plantings`, { cropId: s.crop.potato, method: 'sown', plantedOn: `${YEAR}-04-20` }).expect(201);
    expect(await storedFor(radish.body.id)).toEqual([]);
    const near = await s.ines.post(`/api/plots/${s.a2}/plantings`, { cropId: s.crop.potato, method: 'sown', plantedOn: `${YEAR}-04-20` }).expect(201);
    // Radish and potato do badly together (common practice): a watch across the 0.9 m path, on both sides.
    expect(await storedFor(radish.body.id)).toEqual([expect.objectContaining({ key: `companion:${near.body.id}`, severity: 'watch', kind: 'companion' })]);
    expect(await storedFor(near.body.id)).toEqual([expect.objectContaining({ key: `companion:${radish.body.id}`, severity: 'watch' })]);
    expect((await storedFor(far.body.id)).filter((f) => f.kind === 'companion')).toEqual([]);
    await s.ines.delete(`/api/plantings/${near.body.id}`).expect(204);
    expect(await storedFor(radish.body.id)).toEqual([]);
  });

  it('moving a plot away re-checks its old neighbours; moving it back brings the finding back', async () => {
    const s = await club();
    const radish = await s.hana.post(`/api/plots/${s.a1}/plantings`, radishBody(s)).expect(201);
    await s.ines.post(`/api/plots/${s.a2}/plantings`, { cropId: s.crop.potato, method: 'sown', plantedOn: `${YEAR}-04-20` }).expect(201);
    expect(await storedFor(radish.body.id)).toHaveLength(1);
    await s.coordinator.patch(`/api/plots/${s.a2}`, { version: 1, x: 10 }).expect(200);
    expect(await storedFor(radish.body.id)).toEqual([]);
    await s.coordinator.patch(`/api/plots/${s.a2}`, { version: 2, x: 0 }).expect(200);
    expect(await storedFor(radish.body.id)).toHaveLength(1);
  });

  it('a clubroot observation puts radish this season into a 7-year clash (UConn IPM: clubroot 7 years, radish and turnip too)', async () => {
    const s = await club();
    const radish = await s.hana.post(`/api/plots/${s.a1}/plantings`, radishBody(s)).expect(201);
    expect(await storedFor(radish.body.id)).toEqual([]);
    await s.hana.post(`/api/plots/${s.a1}/observations`, { pestSlug: 'clubroot', severity: 'severe', observedOn: `${YEAR - 1}-08-01` }).expect(201);
    const after = await storedFor(radish.body.id);
    expect(after).toEqual([expect.objectContaining({ kind: 'rotation', severity: 'clash' })]);
    expect(after[0].message).toContain('for 7 years');
  });

  it('the club’s rotation gap re-checks every plot', async () => {
    const s = await club();
    const tomato = await s.hana.post(`/api/plots/${s.a1}/plantings`, tomatoBody(s, { keepReason: 'Testing the gap' })).expect(201);
    expect(await storedFor(tomato.body.id)).toHaveLength(1);
    await s.coordinator.patch(`/api/clubs/${s.club.id}`, { rotationGapYears: 1 }).expect(200);
    expect(await storedFor(tomato.body.id)).toEqual([]);
  });

  it('after all of that, the stored findings equal a full check from scratch', async () => {
    const s = await club();
    await s.hana.post(`/api/plots/${s.a1}/plantings`, radishBody(s)).expect(201);
    await s.ines.post(`/api/plots/${s.a2}/plantings`, { cropId: s.crop.potato, method: 'sown', plantedOn: `${YEAR}-04-20` }).expect(201);
    await s.hana.post(`/api/plots/${s.a1}/plantings`, { cropId: s.crop.pea, method: 'sown', plantedOn: `${YEAR}-04-25` }).expect(201);
    await s.coordinator.patch(`/api/plots/${s.a3}`, { version: 1, y: 11.5 }).expect(200);
    const fresh = checkPlots(await loadCheckContext(t.db, s.siteId)).map((f) => `${f.plantingId}|${f.key}|${f.severity}|${f.message}`).sort();
    const stored = (await t.db('findings').select('planting_id', 'key', 'severity', 'message')).map((f) => `${f.planting_id}|${f.key}|${f.severity}|${f.message}`).sort();
    expect(stored).toEqual(fresh);
    expect(stored.length).toBeGreaterThanOrEqual(4);
  });
});

describe('who sees the neighbour check', () => {
  it('gives the season’s findings to coordinators only; a plot’s to its book’s readers', async () => {
    const s = await club();
    await s.hana.post(`/api/plots/${s.a1}/plantings`, radishBody(s)).expect(201);
    await s.ines.post(`/api/plots/${s.a2}/plantings`, { cropId: s.crop.potato, method: 'sown', plantedOn: `${YEAR}-04-20` }).expect(201);
    const site = await s.coordinator.get(`/api/sites/${s.siteId}/findings`).expect(200);
    expect(site.body.items.map((f: { plotLabel: string }) => f.plotLabel).sort()).toEqual(['A-1', 'A-2']);
    for (const who of [s.hana, s.volunteer]) {
      expect((await who.get(`/api/sites/${s.siteId}/findings`)).status).toBe(403);
      expect((await who.get(`/api/clubs/${s.club.id}/findings`)).status).toBe(403);
      expect((await who.get(`/api/clubs/${s.club.id}/findings/export.csv`)).status).toBe(403);
    }
    expect((await s.outsider.get(`/api/sites/${s.siteId}/findings`)).status).toBe(404);
    // Club routes answer 403 to members of other clubs (as every /api/clubs/:clubId route does).
    expect((await s.outsider.get(`/api/clubs/${s.club.id}/findings`)).status).toBe(403);
    // Hana's book shows her finding, naming the neighbouring plot and crop but not Ines.
    const book = await s.hana.get(`/api/plots/${s.a1}/book`).expect(200);
    expect(book.body.findings).toHaveLength(1);
    expect(JSON.stringify(book.body.findings)).not.toContain(s.ines.person.name);
    expect(JSON.stringify(site.body)).not.toContain(s.ines.person.email);
    // Ines may not dry-run or ask what fits on Hana's plot.
    expect((await s.ines.post(`/api/plots/${s.a1}/plantings/check`, radishBody(s))).status).toBe(403);
    expect((await s.ines.get(`/api/plots/${s.a1}/what-fits?date=${YEAR}-05-01`)).status).toBe(403);
  });

  it('refuses bad filters and bad ids with 400 naming the field', async () => {
    const s = await club();
    for (const [url, field] of [
      [`/api/clubs/${s.club.id}/findings?severity=awful`, 'severity'],
      [`/api/clubs/${s.club.id}/findings?seasonId=0`, 'seasonId'],
      [`/api/clubs/${s.club.id}/findings?siteId=99999999999`, 'siteId'],
      [`/api/sites/${s.siteId}/findings?kind=weather`, 'kind'],
      [`/api/plots/${s.a1}/what-fits?date=2026-02-30`, 'date'],
      [`/api/plots/${s.a1}/what-fits?date=${YEAR}-05-01&x=1`, 'width'],
      ['/api/plots/abc/what-fits?date=2026-05-01', 'plotId'],
    ] as const) {
      const res = await s.coordinator.get(url);
      expect(res.status, url).toBe(400);
      expect(res.body.error.fields, url).toHaveProperty(field);
    }
    const bad = await s.hana.post(`/api/plots/${s.a1}/plantings/check`, { ...radishBody(s), cropId: 'x\u0000' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('cropId');
    expect((await s.coordinator.get(`/api/clubs/${s.club.id}/findings?seasonId=999999`)).status).toBe(404);
  });
});

describe('what fits here', () => {
  it('ranks every crop for A-1 on a date: good choices first, the tomato after last year’s potato last with its reason', async () => {
    const s = await club();
    await s.hana.post(`/api/plots/${s.a1}/plantings`, { cropId: s.crop.pea, method: 'sown', plantedOn: `${YEAR}-04-01` }).expect(201);
    const res = await s.hana.get(`/api/plots/${s.a1}/what-fits?date=${YEAR}-04-20`).expect(200);
    const items: Array<{ crop: { slug: string }; verdict: string; findings: Array<{ rule: string }> }> = res.body.items;
    expect(items.length).toBeGreaterThanOrEqual(5);
    const order = { good: 0, fine: 1, watch: 2, clash: 3 } as Record<string, number>;
    for (let i = 1; i < items.length; i++) expect(order[items[i].verdict]).toBeGreaterThanOrEqual(order[items[i - 1].verdict]);
    expect(items.find((i) => i.crop.slug === 'radish')?.verdict).toBe('good');
    const tomato = items.find((i) => i.crop.slug === 'tomato')!;
    expect(tomato.verdict).toBe('clash');
    expect(tomato.findings.map((f) => f.rule)).toContain('rotation_family');
  });
});

describe('queries', () => {
  it('loads a site for the check in the same number of queries for 3 plots and for 40', async () => {
    const s = await club();
    const count = async () => {
      let n = 0;
      const listen = () => void n++;
      t.db.on('query', listen);
      await s.hana.post(`/api/plots/${s.a1}/plantings/check`, radishBody(s)).expect(200);
      t.db.removeListener('query', listen);
      return n;
    };
    // The first check reads the crop data into the process's cache; count from the second. Between checks
    // the snapshot is moved (txid_current() takes a transaction id, as any write does), so each reads the plot afresh.
    const moveSnapshot = () => t.db.raw('select txid_current()');
    await count();
    await moveSnapshot();
    const few = await count();
    // Straight after, with nothing changed, the plot's reading is reused: fewer queries.
    expect(await count()).toBeLessThan(few);
    await t.db('plots').insert(Array.from({ length: 37 }, (_, i) => ({ site_id: s.siteId, label: `B-${i}`, x_m: 4 + (i % 4) * 3.5, y_m: Math.floor(i / 4) * 2, width_m: 3, length_m: 1.5 })));
    expect(await count()).toBe(few);
  });
});
