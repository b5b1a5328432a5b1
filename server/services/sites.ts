import type { Knex } from 'knex';
import type { Site, SiteCreateBody, SiteUpdateBody } from '@shared/schemas/sites';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { siteColumns, toSite, type SiteRow } from '../db/mappers';

/** The club a site belongs to, or null. */
export async function clubOfSite(db: Db, siteId: number): Promise<number | null> {
  const row = await db('sites').where({ id: siteId }).first('club_id');
  return row ? row.club_id : null;
}

function withPlotCount(db: Db) {
  return db('sites as s').select(
    's.*',
    db.raw('(select count(*) from plots p where p.site_id = s.id and p.deleted_at is null) as plot_count'),
  );
}

/** The sites of a club, by name. */
export async function listSites(db: Db, clubId: number) {
  const rows: SiteRow[] = await withPlotCount(db).where('s.club_id', clubId).orderBy('s.name');
  return { items: rows.map(toSite), page: 1, total: rows.length };
}

/** One site. */
export async function getSite(db: Db, siteId: number): Promise<Site> {
  const row: SiteRow | undefined = await withPlotCount(db).where('s.id', siteId).first();
  if (!row) throw notFound('The site');
  return toSite(row);
}

/** Adds a site to a club. */
export async function createSite(db: Knex, clubId: number, body: SiteCreateBody): Promise<Site> {
  const [row] = await db('sites')
    .insert({ club_id: clubId, ...siteColumns(body) })
    .returning('id');
  return getSite(db, row.id);
}

/** Changes a site if nobody else changed it since `version`. */
export async function updateSite(db: Knex, siteId: number, body: SiteUpdateBody): Promise<Site> {
  const { version, ...changes } = body;
  return db.transaction(async (trx) => {
    const current = await trx('sites').where({ id: siteId }).forUpdate().first('version', 'width_m', 'length_m');
    if (!current) throw notFound('The site');
    if (current.version !== version) {
      throw new AppError('conflict', 'Someone else changed this site since you opened it. Reload to see their change.');
    }
    if (changes.width !== undefined || changes.length !== undefined) {
      const ext = await trx('plots')
        .where({ site_id: siteId })
        .whereNull('deleted_at')
        .first(
          trx.raw('max(x_m + case when rotation = 90 then length_m else width_m end) as max_x'),
          trx.raw('max(y_m + case when rotation = 90 then width_m else length_m end) as max_y'),
        );
      const fields: Record<string, string> = {};
      if (changes.width !== undefined && ext?.max_x != null && Number(ext.max_x) > changes.width + 1e-6)
        fields.width = `Plots reach ${Number(ext.max_x)} m east; make the site at least that wide`;
      if (changes.length !== undefined && ext?.max_y != null && Number(ext.max_y) > changes.length + 1e-6)
        fields.length = `Plots reach ${Number(ext.max_y)} m south; make the site at least that long`;
      if (Object.keys(fields).length) throw new AppError('validation_failed', 'The site would cut through plots.', fields);
    }
    await trx('sites')
      .where({ id: siteId })
      .update({ ...siteColumns(changes), version: version + 1, updated_at: trx.fn.now() });
    return getSite(trx, siteId);
  });
}

/** Removes a site and its plots. */
export async function deleteSite(db: Knex, siteId: number): Promise<void> {
  const n = await db('sites').where({ id: siteId }).delete();
  if (!n) throw notFound('The site');
}
