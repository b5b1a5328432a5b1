import type { Knex } from 'knex';
import { recheckSite } from './findings';
import type { Site, SiteCreateBody, SiteUpdateBody } from '@shared/schemas/sites';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import type { Storage } from '../storage';
import { siteColumns, toSite, type SiteRow } from '../db/mappers';
import { removeBackgroundFile } from './site-backgrounds';
import type { ClubLookup } from './memberships';

/** The club a site belongs to, or null. */
// An archived site is gone from the map and its pages; its records stay reachable through fees.
// The map stamp rides along for the map's cached reads (see server/cache/json-cache.ts).
export const clubOfSite: ClubLookup = (db, siteId) => db('sites').where({ id: siteId }).whereNull('archived_at').select('club_id', 'map_stamp');

function withPlotCount(db: Db) {
  return db('sites as s').select(
    's.*',
    db.raw('(select count(*) from plots p where p.site_id = s.id and p.deleted_at is null) as plot_count'),
  );
}

/** The sites of a club, by name. */
export async function listSites(db: Db, clubId: number) {
  const rows: SiteRow[] = await withPlotCount(db).where('s.club_id', clubId).whereNull('s.archived_at').orderBy('s.name');
  return { items: rows.map(toSite), page: 1, total: rows.length };
}

/** One site. */
export async function getSite(db: Db, siteId: number): Promise<Site> {
  const row: SiteRow | undefined = await withPlotCount(db).where('s.id', siteId).whereNull('s.archived_at').first();
  if (!row) throw notFound('The site');
  return toSite(row);
}

/** Adds a site to a club. */
export async function createSite(db: Knex, clubId: number, body: SiteCreateBody): Promise<Site> {
  return db.transaction(async (trx) => {
    const club = await trx('clubs').where({ id: clubId }).forUpdate().first('id');
    if (!club) throw notFound('The club');
    const first = !(await trx('sites').where({ club_id: clubId }).first('id'));
    const [row] = await trx('sites')
      .insert({ club_id: clubId, ...siteColumns(body) })
      .returning('id');
    // Until a club has sites its time zone is only a default; its first site's zone becomes the club's.
    if (first) await trx('clubs').where({ id: clubId }).update({ time_zone: body.timeZone });
    return getSite(trx, row.id);
  });
}

/** Changes a site if nobody else changed it since `version`. */
export async function updateSite(db: Knex, siteId: number, body: SiteUpdateBody): Promise<Site> {
  const { version, ...changes } = body;
  return db.transaction(async (trx) => {
    const current = await trx('sites').where({ id: siteId }).whereNull('archived_at').forUpdate().first('version', 'width_m', 'length_m');
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
    // Latitude, paths, frost dates and soil temperatures all feed the neighbour check.
    const checked = ['latitude', 'pathWidth', 'lastSpringFrost', 'firstAutumnFrost', 'soilTempsC'] as const;
    if (checked.some((k) => changes[k] !== undefined)) await recheckSite(trx, siteId);
    return getSite(trx, siteId);
  });
}

/** Locks a live site and checks the version its editor saw. */
async function lockSiteAt(trx: Knex.Transaction, siteId: number, version: number) {
  const site = await trx('sites').where({ id: siteId }).whereNull('archived_at').forUpdate().first('id', 'name', 'version', 'background_file');
  if (!site) throw notFound('The site');
  if (site.version !== version) {
    throw new AppError('conflict', 'Someone else changed this site since you opened it. Reload to see their change.');
  }
  return site as { id: number; name: string; version: number; background_file: string | null };
}

/**
 * Whether the site has a weather log, or any plot ever drawn on it (removed ones too) has allocations,
 * offers, renewals, fees or payments on record.
 */
async function siteHasRecords(trx: Knex.Transaction, siteId: number): Promise<boolean> {
  if (await trx('weather_days').where({ site_id: siteId }).first('id')) return true;
  const plotIds = trx('plots').where({ site_id: siteId }).select('id');
  for (const table of ['allocations', 'offers', 'renewals', 'fees']) {
    if (await trx(table).whereIn('plot_id', plotIds).first('id')) return true;
  }
  return false;
}

/**
 * Deletes a site for good, with its plots and their history, and then its background file. Refused
 * while any of its plots has allocations, offers, renewals, fees or payments on record, or the site has
 * weather days: those sites are archived instead, so the records keep pointing somewhere.
 */
export async function deleteSite(db: Knex, opts: { siteId: number; version: number; storage: Storage }): Promise<void> {
  const backgroundFile = await db.transaction(async (trx) => {
    const site = await lockSiteAt(trx, opts.siteId, opts.version);
    if (await siteHasRecords(trx, opts.siteId)) {
      throw new AppError(
        'conflict',
        `${site.name} has plots with allocations, fees or payments, or a weather log, on record, so it cannot be deleted. Archive it instead: it leaves the lists and the map, and its records stay.`,
      );
    }
    await trx('sites').where({ id: opts.siteId }).delete();
    return site.background_file;
  });
  // Only after the delete is committed does the file go; a crash in between leaves an orphan file, never a broken site.
  if (backgroundFile) await removeBackgroundFile(opts.storage, backgroundFile);
}

/**
 * Archives a site: it leaves the club's lists and the map; its plots, allocations, fees and payments
 * stay as they are. Refused while an offer or a renewal on one of its plots waits for an answer.
 */
export async function archiveSite(db: Knex, opts: { siteId: number; version: number; now?: Date }): Promise<void> {
  await db.transaction(async (trx) => {
    const site = await lockSiteAt(trx, opts.siteId, opts.version);
    const plotIds = trx('plots').where({ site_id: opts.siteId }).whereNull('deleted_at').select('id');
    const open =
      (await trx('offers').whereIn('plot_id', plotIds).where({ status: 'pending' }).first('id')) ??
      (await trx('renewals').whereIn('plot_id', plotIds).where({ status: 'pending' }).first('id'));
    if (open) {
      throw new AppError('conflict', `${site.name} has an offer or a renewal waiting for an answer; withdraw it or wait for the answer before archiving.`);
    }
    await trx('sites')
      .where({ id: opts.siteId })
      .update({ archived_at: opts.now ?? trx.fn.now(), version: site.version + 1, updated_at: trx.fn.now() });
  });
}
