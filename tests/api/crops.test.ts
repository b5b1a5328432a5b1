import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { cropBySlug, cropRelations, crops, cropSourceById } from '@shared/crops';
import { loadReferenceCrops } from '../../server/services/reference-crops';
import { buildClub } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const base = (clubId: number) => `/api/clubs/${clubId}/crops`;
const idOf = async (slug: string): Promise<number> => (await t.db('crops').whereNull('club_id').where({ slug }).first('id')).id;
const count = async (table: string, where: (q: ReturnType<typeof t.db>) => unknown = () => {}) => {
  const q = t.db(table);
  where(q);
  return Number((await q.count({ n: '*' }))[0].n);
};
/** Each row's id, its row version (xmin changes on any write, even one that stores the same values) and updated_at. */
const versions = async (table: string) =>
  (await t.db.raw(`select id, xmin::text as x, updated_at from ${table} order by id`)).rows as { id: number; x: string; updated_at: Date }[];

// What a coordinator might type for a crop the catalogue lacks; test values, not checked facts of the trade.
const broadBean = {
  commonName: 'Broad bean',
  botanicalName: { value: 'Vicia faba', source: 'from-memory' },
  family: { value: 'Fabaceae', source: 'from-memory' },
  kind: 'legume',
  sowing: { value: 'direct', source: 'common-practice' },
  daysToMaturity: { value: { min: 80, max: 100, from: 'sowing' }, source: 'Club sowing records', note: 'autumn sowings' },
  inRowCm: { value: { min: 15, max: 20 }, source: 'from-memory' },
  watchFor: ['aphids'],
};

describe('reference crops in the database', () => {
  it('are there after truncateAll: every crop and relation of shared/crops, at least 30 and 40', async () => {
    const nCrops = await count('crops', (q) => q.whereNull('club_id'));
    const nRelations = await count('crop_relations', (q) => q.whereNull('club_id'));
    expect(nCrops).toBe(crops.length);
    expect(nRelations).toBe(cropRelations.length);
    expect(nCrops).toBeGreaterThanOrEqual(30);
    expect(nRelations).toBeGreaterThanOrEqual(40);
    const radish = await t.db('crops').whereNull('club_id').where({ slug: 'radish' }).first();
    expect(radish.data).toEqual(JSON.parse(JSON.stringify(cropBySlug('radish'))));
    expect(radish).toMatchObject({ common_name: 'Radish', family: 'Brassicaceae', kind: 'root' });
    // The research-backed tomato–potato relation keeps its scope and severity (shared/crops/relations.ts).
    const tp = await t.db('crop_relations').whereNull('club_id').where({ crop_a_id: await idOf('tomato'), crop_b_id: await idOf('potato') }).first();
    expect(tp).toMatchObject({ effect: 'antagonistic', distance_m: 1.5, severity: 'clash', evidence: 'research', source: 'extension-tomato-potato' });
  });

  it('a second load writes nothing: same rows, same row versions, same updated_at', async () => {
    const club = await buildClub(t.db);
    const [clubCrop] = await t.db('crops')
      .insert({ club_id: club.id, slug: 'broad-bean', common_name: 'Broad bean', family: 'Fabaceae', kind: 'legume', data: JSON.stringify({ slug: 'broad-bean' }) })
      .returning('id');
    const before = { crops: await versions('crops'), relations: await versions('crop_relations') };
    const result = await loadReferenceCrops(t.db);
    expect(result).toEqual({ cropsInserted: 0, cropsUpdated: 0, relationsInserted: 0, relationsUpdated: 0, relationsDeleted: 0 });
    expect({ crops: await versions('crops'), relations: await versions('crop_relations') }).toEqual(before);
    expect(before.crops.map((r) => r.id)).toContain(clubCrop.id);
  });

  it('updates only the rows that changed, removes relations the file dropped, and puts them back from the file', async () => {
    const radishId = await idOf('radish');
    const before = await versions('crops');
    const relBefore = await versions('crop_relations');
    const dropped = cropRelations[cropRelations.length - 1];
    const changed = await loadReferenceCrops(t.db, {
      crops: crops.map((c) => (c.slug === 'radish' ? { ...c, commonName: 'Radish, spring' } : c)),
      relations: cropRelations.slice(0, -1),
    });
    expect(changed).toEqual({ cropsInserted: 0, cropsUpdated: 1, relationsInserted: 0, relationsUpdated: 0, relationsDeleted: 1 });
    const after = await versions('crops');
    // Only the radish row was written.
    expect(after.filter((r, i) => r.x !== before[i].x).map((r) => r.id)).toEqual([radishId]);
    expect((await t.db('crops').where({ id: radishId }).first('common_name')).common_name).toBe('Radish, spring');
    const relAfter = await versions('crop_relations');
    expect(relAfter).toHaveLength(relBefore.length - 1);
    expect(relAfter).toEqual(relBefore.filter((r) => relAfter.some((a) => a.id === r.id)));

    // A hand edit of a reference relation is undone too.
    const [first] = relAfter;
    await t.db('crop_relations').where({ id: first.id }).update({ reason: 'edited by hand' });
    const restored = await loadReferenceCrops(t.db);
    expect(restored).toEqual({ cropsInserted: 0, cropsUpdated: 1, relationsInserted: 1, relationsUpdated: 1, relationsDeleted: 0 });
    expect((await t.db('crop_relations').where({ id: first.id }).first('reason')).reason).toBe(cropRelations[0].reason);
    const back = await t.db('crop_relations').whereNull('club_id').where({ crop_a_id: await idOf(dropped.a), crop_b_id: await idOf(dropped.b) }).first();
    expect(back).toMatchObject({ reason: dropped.reason, effect: dropped.effect });
    expect((await t.db('crops').where({ id: radishId }).first('data')).data).toEqual(JSON.parse(JSON.stringify(cropBySlug('radish'))));
  });
});

describe('who may use the crop notes', () => {
  it('401 signed out, 403 outside the club, members read, plot holders and volunteers may not write', async () => {
    const club = await buildClub(t.db);
    const anon = await browserLikeAgent(t.app);
    expect((await anon.get(base(club.id))).status).toBe(401);
    expect((await anon.post(base(club.id), broadBean)).status).toBe(401);
    const outsider = await signedInMember(t, (await buildClub(t.db)).id, ['coordinator']);
    expect((await outsider.get(base(club.id))).status).toBe(403);

    const holder = await signedInMember(t, club.id, ['plot_holder']);
    const volunteer = await signedInMember(t, club.id, ['volunteer']);
    const tomato = await idOf('tomato');
    expect((await holder.get(base(club.id))).status).toBe(200);
    expect((await volunteer.get(`${base(club.id)}/${tomato}`)).status).toBe(200);
    const override = { value: 'transplant', source: 'from-memory' };
    const writes = [
      holder.post(base(club.id), broadBean),
      holder.put(`${base(club.id)}/${tomato}/overrides/sowing`, override),
      holder.delete(`${base(club.id)}/${tomato}/overrides/sowing`),
      holder.post(`${base(club.id)}/relations`, { cropAId: tomato, cropBId: await idOf('basil') }),
      volunteer.delete(`${base(club.id)}/relations/1`),
    ];
    for (const res of await Promise.all(writes)) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect(await count('crops', (q) => q.whereNotNull('club_id'))).toBe(0);
    expect(await count('crop_overrides')).toBe(0);
  });
});

describe('listing crops', () => {
  it('lists the reference crops by name, paged, with search on common or botanical names, family and kind filters', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['plot_holder']);
    const all = await c.get(`${base(club.id)}?pageSize=100`).expect(200);
    expect(all.body.total).toBe(crops.length);
    // computed: the file's names sorted the same way (lower case).
    const byName = crops.map((x) => x.commonName).sort((a, b) => (a.toLowerCase() < b.toLowerCase() ? -1 : 1));
    expect(all.body.items.map((x: { commonName: string }) => x.commonName)).toEqual(byName);
    const tomato = all.body.items.find((x: { slug: string }) => x.slug === 'tomato');
    const tomatoFile = cropBySlug('tomato')!;
    expect(tomato).toEqual({
      id: await idOf('tomato'),
      slug: 'tomato',
      commonName: tomatoFile.commonName,
      botanicalName: tomatoFile.botanicalName.value,
      family: 'Solanaceae',
      kind: tomatoFile.kind,
      sowing: tomatoFile.sowing.value,
      daysToMaturity: tomatoFile.daysToMaturity.value,
      isClubCrop: false,
      hasOverrides: false,
    });

    const page2 = await c.get(`${base(club.id)}?page=2&pageSize=10`).expect(200);
    expect(page2.body).toMatchObject({ page: 2, total: crops.length });
    expect(page2.body.items.map((x: { id: number }) => x.id)).toEqual(all.body.items.slice(10, 20).map((x: { id: number }) => x.id));

    // Botanical names: "Brassica" appears only there, in any case.
    const brassica = await c.get(`${base(club.id)}?q=BRASSICA&pageSize=100`).expect(200);
    const expected = crops.filter((x) => x.botanicalName.value.toLowerCase().includes('brassica')).map((x) => x.slug).sort();
    expect(expected.length).toBeGreaterThan(2);
    expect(brassica.body.items.map((x: { slug: string }) => x.slug).sort()).toEqual(expected);
    const byCommon = await c.get(`${base(club.id)}?q=sweet`).expect(200);
    expect(byCommon.body.items.map((x: { slug: string }) => x.slug).sort()).toEqual(crops.filter((x) => x.commonName.toLowerCase().includes('sweet')).map((x) => x.slug).sort());
    // A LIKE wildcard is searched for as itself.
    expect((await c.get(`${base(club.id)}?q=%25`).expect(200)).body.total).toBe(0);

    const solanaceae = await c.get(`${base(club.id)}?family=solanaceae`).expect(200);
    expect(solanaceae.body.items.map((x: { slug: string }) => x.slug).sort()).toEqual(crops.filter((x) => x.family.value === 'Solanaceae').map((x) => x.slug).sort());
    const herbs = await c.get(`${base(club.id)}?kind=herb`).expect(200);
    expect(herbs.body.total).toBe(crops.filter((x) => x.kind === 'herb').length);
    expect(herbs.body.items.every((x: { kind: string }) => x.kind === 'herb')).toBe(true);

    const quickest = await c.get(`${base(club.id)}?sort=daysToMaturity&pageSize=100`).expect(200);
    const mins = quickest.body.items.map((x: { daysToMaturity: { min: number } }) => x.daysToMaturity.min);
    expect(mins).toEqual([...mins].sort((a, b) => a - b));
    expect(mins[0]).toBe(Math.min(...crops.map((x) => x.daysToMaturity.value.min)));
    const byFamily = await c.get(`${base(club.id)}?sort=family&pageSize=100`).expect(200);
    const families = byFamily.body.items.map((x: { family: string }) => x.family);
    expect(families).toEqual([...families].sort());

    const bad = await c.get(`${base(club.id)}?kind=tuber&sort=colour&family=cabbages`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['family', 'kind', 'sort']);
  });
});

describe('crop detail', () => {
  it('shows the file’s values with their sources, the relations both ways with resolved sources', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['volunteer']);
    const tomatoId = await idOf('tomato');
    const res = await c.get(`${base(club.id)}/${tomatoId}`).expect(200);
    const file = cropBySlug('tomato')!;
    expect(res.body).toMatchObject({ id: tomatoId, slug: 'tomato', commonName: file.commonName, isClubCrop: false, kind: file.kind });
    expect(res.body.daysToMaturity).toEqual(file.daysToMaturity);
    expect(res.body.germination).toEqual(file.germination);
    expect(res.body.guidance).toEqual(file.guidance);
    expect(res.body.watchFor).toEqual(file.watchFor);
    const mine = cropRelations.filter((r) => r.a === 'tomato' || r.b === 'tomato');
    expect(res.body.relations).toHaveLength(mine.length);
    const potato = res.body.relations.find((r: { otherCrop: { slug: string } }) => r.otherCrop.slug === 'potato');
    expect(potato).toEqual({
      id: expect.any(Number),
      otherCrop: { id: await idOf('potato'), slug: 'potato', commonName: 'Potato' },
      effect: 'antagonistic',
      scope: { kind: 'neighbours', distanceM: 1.5 },
      reason: mine.find((r) => r.b === 'potato')!.reason,
      evidence: 'research',
      severity: 'clash',
      source: { id: 'extension-tomato-potato', title: cropSourceById('extension-tomato-potato')!.title, evidence: 'published' },
      isClubRelation: false,
    });
    // Marigold names tomato as its b side: the relation shows from tomato's side too.
    expect(res.body.relations.map((r: { otherCrop: { slug: string } }) => r.otherCrop.slug)).toContain('french-marigold');
    const sourceIds = res.body.sources.map((s: { id: string }) => s.id);
    expect(sourceIds).toEqual(expect.arrayContaining([file.daysToMaturity.source, 'extension-tomato-potato', 'common-practice']));
    expect(res.body.sources.every((s: { title: string }) => s.title.length > 0)).toBe(true);

    expect((await c.get(`${base(club.id)}/abc`)).body.error.fields).toHaveProperty('cropId');
    expect((await c.get(`${base(club.id)}/999999`)).status).toBe(404);
  });
});

describe('overrides', () => {
  it('shows the club’s value marked with its source, leaves the reference row and other clubs alone, and comes off again', async () => {
    const club = await buildClub(t.db);
    const other = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const o = await signedInMember(t, other.id, ['coordinator']);
    const radishId = await idOf('radish');
    const before = await t.db('crops').where({ id: radishId }).first('data', 'updated_at', 'common_name');
    const value = { value: { min: 21, max: 30, from: 'sowing' }, source: 'Club trial beds 2026', note: 'three sowings in raised beds' };

    const put = await c.put(`${base(club.id)}/${radishId}/overrides/daysToMaturity`, value);
    expect(put.status).toBe(200);
    expect(put.body.daysToMaturity).toEqual({ ...value, overridden: true });
    expect(put.body.sowing.overridden).toBeUndefined();
    expect(put.body.sources).toContainEqual({ id: 'Club trial beds 2026', title: 'Club trial beds 2026', evidence: 'club_cited' });
    // The reference row's data is byte-for-byte what it was.
    expect(await t.db('crops').where({ id: radishId }).first('data', 'updated_at', 'common_name')).toEqual(before);
    expect(await t.db('crop_overrides').where({ club_id: club.id, crop_id: radishId })).toEqual([
      expect.objectContaining({ field: 'daysToMaturity', value, updated_by_user_id: c.person.id }),
    ]);
    // Setting it again replaces the club's value; still one row.
    const again = { value: { min: 22, max: 28, from: 'sowing' }, source: 'common-practice' };
    expect((await c.put(`${base(club.id)}/${radishId}/overrides/daysToMaturity`, again)).body.daysToMaturity).toEqual({ ...again, overridden: true });
    expect(await count('crop_overrides')).toBe(1);

    const listed = (await c.get(`${base(club.id)}?q=radish`)).body.items[0];
    expect(listed).toMatchObject({ slug: 'radish', hasOverrides: true, daysToMaturity: again.value });
    const theirs = (await o.get(`${base(other.id)}?q=radish`)).body.items[0];
    expect(theirs).toMatchObject({ hasOverrides: false, daysToMaturity: cropBySlug('radish')!.daysToMaturity.value });
    expect((await o.get(`${base(other.id)}/${radishId}`)).body.daysToMaturity).toEqual(cropBySlug('radish')!.daysToMaturity);

    expect((await c.delete(`${base(club.id)}/${radishId}/overrides/daysToMaturity`)).status).toBe(204);
    expect(await count('crop_overrides')).toBe(0);
    expect((await c.get(`${base(club.id)}/${radishId}`)).body.daysToMaturity).toEqual(cropBySlug('radish')!.daysToMaturity);
    expect((await c.delete(`${base(club.id)}/${radishId}/overrides/daysToMaturity`)).status).toBe(404);
    expect(await t.db('crops').where({ id: radishId }).first('data', 'updated_at', 'common_name')).toEqual(before);
  });

  it('refuses a bad value, an unknown field, a field that cannot be overridden, naming each; writes nothing', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const id = await idOf('carrot');
    const url = (field: string) => `${base(club.id)}/${id}/overrides/${field}`;
    const backwards = await c.put(url('daysToMaturity'), { value: { min: 90, max: 60, from: 'sowing' }, source: 'from-memory' });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields).toEqual({ 'value.max': 'Must not be below the minimum' });
    expect((await c.put(url('sowing'), { value: 'broadcast', source: 'from-memory' })).body.error.fields).toHaveProperty('value');
    expect((await c.put(url('soilPh'), { value: { min: 6, max: 7 } })).body.error.fields).toHaveProperty('source');
    const extra = await c.put(url('soilPh'), { value: { min: 6, max: 7 }, source: 'from-memory', colour: 'orange' });
    expect(extra.body.error.fields).toEqual({ colour: 'Unknown field' });
    const family = await c.put(url('family'), { value: 'Apiaceae', source: 'from-memory' });
    expect(family.status).toBe(400);
    expect(family.body.error.fields).toHaveProperty('field');
    expect((await c.put(`${base(club.id)}/0/overrides/soilPh`, { value: { min: 6, max: 7 }, source: 'from-memory' })).body.error.fields).toHaveProperty('cropId');
    expect(await count('crop_overrides')).toBe(0);
  });
});

describe('club crops', () => {
  it('creates a crop with a slug from its name, visible to the club only', async () => {
    const club = await buildClub(t.db);
    const other = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const o = await signedInMember(t, other.id, ['coordinator']);
    const res = await c.post(base(club.id), broadBean);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      slug: 'broad-bean',
      commonName: 'Broad bean',
      isClubCrop: true,
      kind: 'legume',
      family: broadBean.family,
      daysToMaturity: broadBean.daysToMaturity,
      inRowCm: broadBean.inRowCm,
      watchFor: ['aphids'],
      relations: [],
    });
    expect(res.body.germination).toBeUndefined();
    expect(res.body.sources).toContainEqual({ id: 'Club sowing records', title: 'Club sowing records', evidence: 'club_cited' });
    const row = await t.db('crops').where({ id: res.body.id }).first();
    expect(row).toMatchObject({ club_id: club.id, slug: 'broad-bean', common_name: 'Broad bean', family: 'Fabaceae', kind: 'legume', created_by_user_id: c.person.id });
    expect(row.data).toMatchObject({ slug: 'broad-bean', ...broadBean });

    const list = await c.get(`${base(club.id)}?family=Fabaceae`).expect(200);
    expect(list.body.items).toContainEqual(expect.objectContaining({ id: res.body.id, isClubCrop: true, hasOverrides: false, sowing: 'direct' }));
    expect(list.body.total).toBe(crops.filter((x) => x.family.value === 'Fabaceae').length + 1);

    // Another club never sees it, by list, detail, override or relation.
    expect((await o.get(`${base(other.id)}?pageSize=100`)).body.total).toBe(crops.length);
    expect((await o.get(`${base(other.id)}/${res.body.id}`)).status).toBe(404);
    expect((await o.put(`${base(other.id)}/${res.body.id}/overrides/soilPh`, { value: { min: 6, max: 7 }, source: 'from-memory' })).status).toBe(404);
    // The club's own crop takes no overrides: they are for reference crops.
    expect((await c.put(`${base(club.id)}/${res.body.id}/overrides/soilPh`, { value: { min: 6, max: 7 }, source: 'from-memory' })).status).toBe(409);

    // The same name in another club is that club's own business.
    expect((await o.post(base(other.id), broadBean)).status).toBe(201);
    const accents = await c.post(base(club.id), { ...broadBean, commonName: 'Fève — Aquadulce!' });
    expect(accents.status).toBe(201);
    expect(accents.body.slug).toBe('feve-aquadulce');
  });

  it('refuses a clash of names, bad family or kind and unknown fields, naming the field', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    await c.post(base(club.id), broadBean).expect(201);
    const twice = await c.post(base(club.id), { ...broadBean, commonName: 'BROAD  bean' });
    expect(twice.status).toBe(409);
    expect(twice.body.error.fields).toEqual({ commonName: 'The club already has a crop with this name' });
    const reference = await c.post(base(club.id), { ...broadBean, commonName: 'Radish' });
    expect(reference.status).toBe(409);
    expect(reference.body.error.fields).toEqual({ commonName: 'Already in the reference crops' });

    const bad = await c.post(base(club.id), { ...broadBean, commonName: 'Fava', family: { value: 'bean family', source: 'from-memory' }, kind: 'tuber', colour: 'green' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toMatchObject({
      'family.value': 'A botanical family name ending in -aceae, such as Brassicaceae',
      kind: expect.stringContaining('One of root'),
      colour: 'Unknown field',
    });
    const { sowing: _sowing, ...noSowing } = broadBean;
    expect((await c.post(base(club.id), { ...noSowing, commonName: 'Fava' })).body.error.fields).toHaveProperty('sowing');
    expect((await c.post(base(club.id), { ...broadBean, commonName: '—!—' })).body.error.fields).toEqual({ commonName: 'Use at least one letter or digit' });
    expect(await count('crops', (q) => q.where({ club_id: club.id }))).toBe(1);
  });
});

describe('club relations', () => {
  it('adds a relation between crops the club sees; it replaces a reference one for that club only; only club ones come off', async () => {
    const club = await buildClub(t.db);
    const other = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const o = await signedInMember(t, other.id, ['coordinator']);
    const bean = (await c.post(base(club.id), broadBean).expect(201)).body;
    const theirBean = (await o.post(base(other.id), broadBean).expect(201)).body;
    const onion = await idOf('onion');
    const tomato = await idOf('tomato');
    const potato = await idOf('potato');

    const body = {
      cropAId: bean.id,
      cropBId: onion,
      effect: 'antagonistic',
      scope: { kind: 'same_plot' },
      reason: 'Our members hold that onions hold broad beans back.',
      evidence: 'common_practice',
      severity: 'watch',
      source: 'common-practice',
    };
    const made = await c.post(`${base(club.id)}/relations`, body);
    expect(made.status).toBe(201);
    expect(made.body).toEqual({
      id: expect.any(Number),
      cropA: { id: bean.id, slug: 'broad-bean', commonName: 'Broad bean' },
      cropB: { id: onion, slug: 'onion', commonName: 'Onion' },
      effect: 'antagonistic',
      scope: { kind: 'same_plot' },
      reason: body.reason,
      evidence: 'common_practice',
      severity: 'watch',
      source: { id: 'common-practice', title: cropSourceById('common-practice')!.title, evidence: 'common_practice' },
    });
    expect(await t.db('crop_relations').where({ id: made.body.id }).first()).toMatchObject({
      club_id: club.id,
      crop_a_id: bean.id,
      crop_b_id: onion,
      distance_m: null,
      created_by_user_id: c.person.id,
    });
    const onionSeen = (await c.get(`${base(club.id)}/${onion}`)).body.relations;
    expect(onionSeen).toContainEqual(expect.objectContaining({ id: made.body.id, otherCrop: expect.objectContaining({ id: bean.id }), isClubRelation: true }));
    expect((await o.get(`${base(other.id)}/${onion}`)).body.relations.map((r: { id: number }) => r.id)).not.toContain(made.body.id);

    // The same pair twice: 409, either way round.
    const twice = await c.post(`${base(club.id)}/relations`, { ...body, cropAId: onion, cropBId: bean.id });
    expect(twice.status).toBe(409);
    expect(twice.body.error.fields).toHaveProperty('cropBId');
    // Another club's crop is no crop of this club.
    const foreign = await c.post(`${base(club.id)}/relations`, { ...body, cropBId: theirBean.id, cropAId: onion });
    expect(foreign.status).toBe(404);
    expect(foreign.body.error.fields).toEqual({ cropBId: 'No such crop in this club' });
    // Folk practice is never a clash (shared/crops/relations.ts keeps the same rule).
    const clash = await c.post(`${base(club.id)}/relations`, { ...body, cropBId: await idOf('garlic'), severity: 'clash' });
    expect(clash.status).toBe(400);
    expect(clash.body.error.fields).toHaveProperty('severity');

    // A club relation for a reference pair replaces the reference one in this club's view.
    const mild = await c.post(`${base(club.id)}/relations`, {
      ...body,
      cropAId: potato,
      cropBId: tomato,
      scope: { kind: 'neighbours', distanceM: 3 },
      reason: 'We keep them 3 m apart on our windy site.',
      severity: undefined,
    });
    expect(mild.status).toBe(201);
    const tomatoMine = (await c.get(`${base(club.id)}/${tomato}`)).body.relations.filter((r: { otherCrop: { id: number } }) => r.otherCrop.id === potato);
    expect(tomatoMine).toEqual([expect.objectContaining({ id: mild.body.id, isClubRelation: true, scope: { kind: 'neighbours', distanceM: 3 }, severity: null })]);
    const tomatoTheirs = (await o.get(`${base(other.id)}/${tomato}`)).body.relations.filter((r: { otherCrop: { id: number } }) => r.otherCrop.id === potato);
    expect(tomatoTheirs).toEqual([expect.objectContaining({ isClubRelation: false, severity: 'clash' })]);

    // Reference relations stay; another club's relation is not found; the club's own comes off.
    const referenceId = tomatoTheirs[0].id;
    const refused = await c.delete(`${base(club.id)}/relations/${referenceId}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/^Reference relations cannot be removed\. Add a club relation/);
    expect(await count('crop_relations', (q) => q.where({ id: referenceId }))).toBe(1);
    expect((await o.delete(`${base(other.id)}/relations/${made.body.id}`)).status).toBe(404);
    expect((await c.delete(`${base(club.id)}/relations/${made.body.id}`)).status).toBe(204);
    expect(await count('crop_relations', (q) => q.where({ id: made.body.id }))).toBe(0);
    expect((await c.delete(`${base(club.id)}/relations/${made.body.id}`)).status).toBe(404);
    expect(await count('crop_relations', (q) => q.whereNull('club_id'))).toBe(cropRelations.length);
  });
});
