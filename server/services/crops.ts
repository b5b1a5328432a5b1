import type { Knex } from 'knex';
import { cropSourceById } from '@shared/crops';
import type {
  ClubCropRelation,
  CropCreateBody,
  CropDetail,
  CropListQuery,
  CropOverrideBody,
  CropRelationCreateBody,
  CropRelationView,
  CropSourceView,
  CropSummary,
  OverridableCropField,
} from '@shared/schemas/crops';
import { overridableCropFields } from '@shared/schemas/crops';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';

// Reference crops (club_id null) are the same for every club; a club sees them with its own
// overrides applied, plus its own crops and relations. Another club's crops answer 404.

interface SourcedJson {
  value: unknown;
  source: string;
  note?: string;
}

interface CropRow {
  id: number;
  club_id: number | null;
  slug: string;
  common_name: string;
  family: string;
  kind: CropDetail['kind'];
  data: Record<string, unknown>;
}

interface RelationRow {
  id: number;
  club_id: number | null;
  crop_a_id: number;
  crop_b_id: number;
  effect: CropRelationView['effect'];
  distance_m: number | null;
  severity: CropRelationView['severity'];
  reason: string;
  evidence: CropRelationView['evidence'];
  source: string;
}

// Every sourced value of a crop: its names, which no club overrides, and the overridable fields.
const SOURCED_FIELDS = ['botanicalName', 'family', ...overridableCropFields] as const;

/** Crops a club can see: the reference catalogue and its own. */
function visible(db: Db, clubId: number) {
  return db('crops as c').where((w) => w.whereNull('c.club_id').orWhere('c.club_id', clubId));
}

/** A source key or a club's words, resolved for display. */
function resolveSource(id: string): CropSourceView {
  const known = cropSourceById(id);
  if (known) return known.url ? { id: known.id, title: known.title, evidence: known.evidence, url: known.url } : { id: known.id, title: known.title, evidence: known.evidence };
  return { id, title: id, evidence: 'club_cited' };
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (ch) => `\\${ch}`);

/** The crops a club sees (reference and its own), searched, filtered, sorted and paged. */
export async function listCrops(db: Db, clubId: number, q: CropListQuery): Promise<{ items: CropSummary[]; page: number; total: number }> {
  const filtered = () => {
    const query = visible(db, clubId);
    if (q.q) {
      const like = `%${escapeLike(q.q)}%`;
      query.where((w) =>
        w.whereRaw("c.common_name ilike ? escape '\\'", [like]).orWhereRaw("c.data->'botanicalName'->>'value' ilike ? escape '\\'", [like]),
      );
    }
    if (q.family) query.whereRaw('lower(c.family) = lower(?)', [q.family]);
    if (q.kind) query.where('c.kind', q.kind);
    return query;
  };
  const [{ count }] = await filtered().count({ count: '*' });

  const overrideJoin = (alias: string, field: OverridableCropField) => (j: Knex.JoinClause) =>
    j.on(`${alias}.crop_id`, 'c.id').andOnVal(`${alias}.club_id`, clubId).andOnVal(`${alias}.field`, field);
  const dtm = "coalesce(od.value, c.data->'daysToMaturity')";
  const rows = await filtered()
    .leftJoin('crop_overrides as os', overrideJoin('os', 'sowing'))
    .leftJoin('crop_overrides as od', overrideJoin('od', 'daysToMaturity'))
    .select(
      'c.id',
      'c.club_id',
      'c.slug',
      'c.common_name',
      'c.family',
      'c.kind',
      db.raw("c.data->'botanicalName'->>'value' as botanical_name"),
      db.raw("coalesce(os.value, c.data->'sowing')->'value' as sowing"),
      db.raw(`${dtm}->'value' as days_to_maturity`),
      db.raw('exists (select 1 from crop_overrides o where o.club_id = ? and o.crop_id = c.id) as has_overrides', [clubId]),
    )
    .modify((b) => {
      if (q.sort === 'family') b.orderBy('c.family');
      if (q.sort === 'kind') b.orderBy('c.kind');
      if (q.sort === 'daysToMaturity') {
        b.orderByRaw(`(${dtm}->'value'->>'min')::numeric`).orderByRaw(`(${dtm}->'value'->>'max')::numeric`);
      }
      b.orderByRaw('lower(c.common_name)').orderBy('c.id');
    })
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);

  return {
    items: rows.map(
      (r: CropRow & { botanical_name: string; sowing: CropSummary['sowing']; days_to_maturity: CropSummary['daysToMaturity']; has_overrides: boolean }) => ({
        id: r.id,
        slug: r.slug,
        commonName: r.common_name,
        botanicalName: r.botanical_name,
        family: r.family,
        kind: r.kind,
        sowing: r.sowing,
        daysToMaturity: r.days_to_maturity,
        isClubCrop: r.club_id !== null,
        hasOverrides: r.has_overrides,
      }),
    ),
    page: q.page,
    total: Number(count),
  };
}

async function visibleCrop(db: Db, clubId: number, cropId: number): Promise<CropRow> {
  const row: CropRow | undefined = await visible(db, clubId).where('c.id', cropId).first('c.id', 'c.club_id', 'c.slug', 'c.common_name', 'c.family', 'c.kind', 'c.data');
  if (!row) throw notFound('That crop');
  return row;
}

/** One crop as the club sees it: its overrides applied and marked, its relations, the sources used. */
export async function getCropDetail(db: Db, clubId: number, cropId: number): Promise<CropDetail> {
  const crop = await visibleCrop(db, clubId, cropId);
  const overrides: { field: string; value: SourcedJson }[] =
    crop.club_id === null ? await db('crop_overrides').where({ club_id: clubId, crop_id: cropId }).select('field', 'value') : [];
  const data = crop.data;
  const sources: string[] = [];
  const used = (s: string) => {
    if (!sources.includes(s)) sources.push(s);
  };

  const values: Record<string, SourcedJson & { overridden?: true }> = {};
  for (const field of SOURCED_FIELDS) {
    const v = data[field] as SourcedJson | undefined;
    if (v) values[field] = v.note === undefined ? { value: v.value, source: v.source } : { value: v.value, source: v.source, note: v.note };
  }
  for (const o of overrides) {
    values[o.field] = { ...(o.value.note === undefined ? { value: o.value.value, source: o.value.source } : o.value), overridden: true };
  }
  for (const field of SOURCED_FIELDS) if (values[field]) used(values[field].source);

  const rels: (RelationRow & { other_id: number; other_slug: string; other_name: string })[] = await db('crop_relations as r')
    .join('crops as o', (j) => j.on(db.raw('o.id = case when r.crop_a_id = ? then r.crop_b_id else r.crop_a_id end', [cropId])))
    .where((w) => w.where('r.crop_a_id', cropId).orWhere('r.crop_b_id', cropId))
    .where((w) => w.whereNull('r.club_id').orWhere('r.club_id', clubId))
    .select('r.*', 'o.id as other_id', 'o.slug as other_slug', 'o.common_name as other_name')
    .orderByRaw('lower(o.common_name), r.club_id nulls last');
  // The club's own relation for a pair replaces the reference one, as an override replaces a value.
  const clubPairs = new Set(rels.filter((r) => r.club_id !== null).map((r) => r.other_id));
  const relations: CropRelationView[] = rels
    .filter((r) => r.club_id !== null || !clubPairs.has(r.other_id))
    .map((r) => {
      used(r.source);
      return {
        id: r.id,
        otherCrop: { id: r.other_id, slug: r.other_slug, commonName: r.other_name },
        effect: r.effect,
        scope: r.distance_m === null ? { kind: 'same_plot' as const } : { kind: 'neighbours' as const, distanceM: Number(r.distance_m) },
        reason: r.reason,
        evidence: r.evidence,
        severity: r.severity,
        source: resolveSource(r.source),
        isClubRelation: r.club_id !== null,
      };
    });

  return {
    id: crop.id,
    slug: crop.slug,
    commonName: crop.common_name,
    kind: crop.kind,
    isClubCrop: crop.club_id !== null,
    ...(values as Pick<CropDetail, 'botanicalName' | 'family' | 'sowing' | 'daysToMaturity'>),
    watchFor: (data.watchFor as string[] | undefined) ?? [],
    guidance: (data.guidance as CropDetail['guidance'] | undefined) ?? {},
    relations,
    sources: sources.map(resolveSource),
  };
}

/**
 * Each crop's data as a club sees it (the club's overrides put in place of the reference values),
 * for many crops in one query; crops without overrides come back as given.
 */
export async function withClubOverrides<T extends Record<string, unknown>>(db: Db, clubId: number, crops: { id: number; data: T }[]): Promise<Map<number, T>> {
  const ids = [...new Set(crops.map((c) => c.id))];
  const rows: { crop_id: number; field: string; value: SourcedJson }[] = ids.length
    ? await db('crop_overrides').where({ club_id: clubId }).whereIn('crop_id', ids).select('crop_id', 'field', 'value')
    : [];
  const result = new Map<number, T>();
  for (const c of crops) {
    if (result.has(c.id)) continue;
    const own = rows.filter((r) => r.crop_id === c.id);
    result.set(c.id, own.length ? { ...c.data, ...Object.fromEntries(own.map((r) => [r.field, r.value])) } : c.data);
  }
  return result;
}

/** The slug a crop name gives: lower case letters and digits of any script, joined by hyphens. */
export function cropSlug(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    .toLowerCase()
    .replace(/[^\p{L}\p{N}]+/gu, '-')
    .replace(/^-+/, '')
    .slice(0, 60)
    .replace(/-+$/, '');
}

const isUniqueViolation = (err: unknown, constraint: string) =>
  (err as { code?: string; constraint?: string })?.code === '23505' && (err as { constraint?: string }).constraint === constraint;

/** Adds a crop of the club's own; its slug comes from the name and is unique within the club and the catalogue. */
export async function createClubCrop(db: Db, input: { clubId: number; userId: number; body: CropCreateBody }): Promise<CropDetail> {
  const { clubId, userId, body } = input;
  const slug = cropSlug(body.commonName);
  if (!slug) throw new AppError('validation_failed', 'Some fields need attention.', { commonName: 'Use at least one letter or digit' });
  const taken: { club_id: number | null } | undefined = await visible(db, clubId).where('c.slug', slug).first('c.club_id');
  if (taken) {
    throw new AppError(
      'conflict',
      taken.club_id === null
        ? `“${body.commonName}” is already in the reference crops; set the club’s own values on it instead.`
        : `The club already has a crop called “${body.commonName}”.`,
      { commonName: taken.club_id === null ? 'Already in the reference crops' : 'The club already has a crop with this name' },
    );
  }
  const data = { slug, ...body, watchFor: body.watchFor ?? [], guidance: body.guidance ?? {} };
  let id: number;
  try {
    [{ id }] = await db('crops')
      .insert({
        club_id: clubId,
        slug,
        common_name: body.commonName,
        family: body.family.value,
        kind: body.kind,
        data: JSON.stringify(data),
        created_by_user_id: userId,
      })
      .returning('id');
  } catch (err) {
    if (isUniqueViolation(err, 'crops_slug_unique')) {
      throw new AppError('conflict', `The club already has a crop called “${body.commonName}”.`, { commonName: 'The club already has a crop with this name' });
    }
    throw err;
  }
  return getCropDetail(db, clubId, id);
}

async function referenceCrop(db: Db, clubId: number, cropId: number): Promise<CropRow> {
  const crop = await visibleCrop(db, clubId, cropId);
  if (crop.club_id !== null) {
    throw new AppError('conflict', 'This is one of the club’s own crops; overrides are for reference crops.');
  }
  return crop;
}

/** Sets the club's own value (with its source) for one field of a reference crop; the reference row stays as it is. */
export async function setCropOverride(
  db: Db,
  input: { clubId: number; cropId: number; field: OverridableCropField; body: CropOverrideBody; userId: number },
): Promise<CropDetail> {
  const { clubId, cropId, field, body, userId } = input;
  await referenceCrop(db, clubId, cropId);
  await db('crop_overrides')
    .insert({ club_id: clubId, crop_id: cropId, field, value: JSON.stringify(body), updated_by_user_id: userId, updated_at: db.fn.now() })
    .onConflict(['club_id', 'crop_id', 'field'])
    .merge(['value', 'updated_by_user_id', 'updated_at']);
  return getCropDetail(db, clubId, cropId);
}

/** Removes the club's value for one field, so the reference value shows again. */
export async function removeCropOverride(db: Db, input: { clubId: number; cropId: number; field: OverridableCropField }): Promise<void> {
  const { clubId, cropId, field } = input;
  await referenceCrop(db, clubId, cropId);
  const n = await db('crop_overrides').where({ club_id: clubId, crop_id: cropId, field }).del();
  if (n === 0) throw notFound('That override');
}

/** Adds the club's own relation between two crops it can see; it replaces a reference relation for the pair. */
export async function createClubRelation(db: Db, input: { clubId: number; userId: number; body: CropRelationCreateBody }): Promise<ClubCropRelation> {
  const { clubId, userId, body } = input;
  const found: { id: number; slug: string; common_name: string }[] = await visible(db, clubId)
    .whereIn('c.id', [body.cropAId, body.cropBId])
    .select('c.id', 'c.slug', 'c.common_name');
  const a = found.find((c) => c.id === body.cropAId);
  const b = found.find((c) => c.id === body.cropBId);
  if (!a || !b) {
    const fields: Record<string, string> = {};
    if (!a) fields.cropAId = 'No such crop in this club';
    if (!b) fields.cropBId = 'No such crop in this club';
    throw new AppError('not_found', 'That crop was not found.', fields);
  }
  const clash = () =>
    new AppError('conflict', 'The club already has a relation between these two crops; remove it first.', {
      cropBId: 'The club already has a relation with this crop',
    });
  const existing = await db('crop_relations')
    .where({ club_id: clubId })
    .where((w) =>
      w.where({ crop_a_id: a.id, crop_b_id: b.id }).orWhere({ crop_a_id: b.id, crop_b_id: a.id }),
    )
    .first('id');
  if (existing) throw clash();
  let row: RelationRow;
  try {
    [row] = await db('crop_relations')
      .insert({
        club_id: clubId,
        crop_a_id: a.id,
        crop_b_id: b.id,
        effect: body.effect,
        distance_m: body.scope.kind === 'neighbours' ? body.scope.distanceM : null,
        severity: body.severity ?? null,
        reason: body.reason,
        evidence: body.evidence,
        source: body.source,
        created_by_user_id: userId,
      })
      .returning('*');
  } catch (err) {
    if (isUniqueViolation(err, 'crop_relations_pair_unique')) throw clash();
    throw err;
  }
  const ref = (c: { id: number; slug: string; common_name: string }) => ({ id: c.id, slug: c.slug, commonName: c.common_name });
  return {
    id: row.id,
    cropA: ref(a),
    cropB: ref(b),
    effect: row.effect,
    scope: row.distance_m === null ? { kind: 'same_plot' } : { kind: 'neighbours', distanceM: Number(row.distance_m) },
    reason: row.reason,
    evidence: row.evidence,
    severity: row.severity,
    source: resolveSource(row.source),
  };
}

/** Removes one of the club's own relations; reference relations stay (a club relation replaces one instead). */
export async function removeClubRelation(db: Db, input: { clubId: number; relationId: number }): Promise<void> {
  const row: { id: number; club_id: number | null } | undefined = await db('crop_relations').where({ id: input.relationId }).first('id', 'club_id');
  if (!row || (row.club_id !== null && row.club_id !== input.clubId)) throw notFound('That relation');
  if (row.club_id === null) {
    throw new AppError(
      'conflict',
      'Reference relations cannot be removed. Add a club relation for the same two crops instead; it replaces the reference one for your club.',
    );
  }
  await db('crop_relations').where({ id: row.id, club_id: input.clubId }).del();
}
