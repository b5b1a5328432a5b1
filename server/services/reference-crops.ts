import type { Knex } from 'knex';
import { cropRelations, crops, type Crop, type CropRelation } from '@shared/crops';

/** What one load changed; all zero when the database already held the catalogue. */
export interface ReferenceLoadResult {
  cropsInserted: number;
  cropsUpdated: number;
  relationsInserted: number;
  relationsUpdated: number;
  relationsDeleted: number;
}

export interface ReferenceCatalogue {
  crops: Crop[];
  relations: CropRelation[];
}

// Any fixed number: several servers starting together take turns instead of racing to insert.
const LOAD_LOCK = 732_041_901;

/** JSON with keys sorted at every level, so two equal values compare equal whatever their key order. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

interface CropRow {
  id: number;
  slug: string;
  common_name: string;
  family: string;
  kind: string;
  data: unknown;
}

interface RelationRow {
  id: number;
  crop_a_id: number;
  crop_b_id: number;
  effect: string;
  distance_m: number | null;
  severity: string | null;
  reason: string;
  evidence: string;
  source: string;
}

const cropColumns = (c: Crop) => ({
  common_name: c.commonName,
  family: c.family.value,
  kind: c.kind,
  data: JSON.stringify(c),
});

const pairKey = (a: number, b: number) => (a < b ? `${a}-${b}` : `${b}-${a}`);
const relationFields: (keyof Omit<RelationRow, 'id'>)[] = ['crop_a_id', 'crop_b_id', 'effect', 'distance_m', 'severity', 'reason', 'evidence', 'source'];

/**
 * Brings the reference rows (club_id null) of `crops` and `crop_relations` in line with the typed
 * catalogue in shared/crops: inserts what is new, updates only rows whose values differ and removes
 * reference relations the file no longer has. When nothing differs it writes nothing at all. Crops
 * dropped from the file stay, because plantings may point at them.
 */
export async function loadReferenceCrops(
  db: Knex,
  catalogue: ReferenceCatalogue = { crops, relations: cropRelations },
): Promise<ReferenceLoadResult> {
  const result: ReferenceLoadResult = { cropsInserted: 0, cropsUpdated: 0, relationsInserted: 0, relationsUpdated: 0, relationsDeleted: 0 };
  await db.transaction(async (trx) => {
    await trx.raw('select pg_advisory_xact_lock(?)', [LOAD_LOCK]);

    const existing: CropRow[] = await trx('crops').whereNull('club_id').select('id', 'slug', 'common_name', 'family', 'kind', 'data');
    const bySlug = new Map(existing.map((r) => [r.slug, r]));
    const idOf = new Map(existing.map((r) => [r.slug, r.id]));

    const toInsert: Crop[] = [];
    for (const crop of catalogue.crops) {
      const row = bySlug.get(crop.slug);
      if (!row) {
        toInsert.push(crop);
        continue;
      }
      const want = cropColumns(crop);
      const same =
        row.common_name === want.common_name &&
        row.family === want.family &&
        row.kind === want.kind &&
        canonical(row.data) === canonical(JSON.parse(want.data));
      if (!same) {
        await trx('crops').where({ id: row.id }).update({ ...want, updated_at: trx.fn.now() });
        result.cropsUpdated++;
      }
    }
    if (toInsert.length > 0) {
      const inserted: { id: number; slug: string }[] = await trx('crops')
        .insert(toInsert.map((c) => ({ club_id: null, slug: c.slug, ...cropColumns(c) })))
        .returning(['id', 'slug']);
      for (const r of inserted) idOf.set(r.slug, r.id);
      result.cropsInserted = inserted.length;
    }

    const wanted = new Map<string, Omit<RelationRow, 'id'>>();
    for (const rel of catalogue.relations) {
      const a = idOf.get(rel.a);
      const b = idOf.get(rel.b);
      if (a === undefined || b === undefined) throw new Error(`Reference relation ${rel.a}–${rel.b} names a crop the catalogue does not have.`);
      const key = pairKey(a, b);
      if (wanted.has(key)) throw new Error(`Reference relations list ${rel.a}–${rel.b} twice; one relation per pair.`);
      wanted.set(key, {
        crop_a_id: a,
        crop_b_id: b,
        effect: rel.effect,
        distance_m: rel.scope.kind === 'neighbours' ? rel.scope.distanceM : null,
        severity: rel.severity ?? null,
        reason: rel.reason,
        evidence: rel.evidence,
        source: rel.source,
      });
    }

    const current: RelationRow[] = await trx('crop_relations')
      .whereNull('club_id')
      .select('id', ...relationFields);
    const stale: number[] = [];
    for (const row of current) {
      const key = pairKey(row.crop_a_id, row.crop_b_id);
      const want = wanted.get(key);
      if (!want) {
        stale.push(row.id);
        continue;
      }
      wanted.delete(key);
      if (relationFields.some((f) => row[f] !== want[f])) {
        await trx('crop_relations').where({ id: row.id }).update({ ...want, updated_at: trx.fn.now() });
        result.relationsUpdated++;
      }
    }
    if (stale.length > 0) {
      result.relationsDeleted = await trx('crop_relations').whereIn('id', stale).del();
    }
    if (wanted.size > 0) {
      await trx('crop_relations').insert([...wanted.values()].map((r) => ({ club_id: null, ...r })));
      result.relationsInserted = wanted.size;
    }
  });
  return result;
}
