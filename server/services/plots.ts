import type { Knex } from 'knex';
import { footprint, neighbours, overlaps, type Rect } from '@shared/geometry';
import type { NeighbourPair, Plot, PlotCreateBody, PlotDetail, PlotUpdateBody } from '@shared/schemas/plots';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { plotColumns, plotRect, STORED_LENGTH_EPS, toPlot, type PlotRow } from '../db/mappers';
import { lapseOverdue } from './offers';
import { neighbourPlotIds, recheckSite, siteOfPlot } from './findings';
import { listPlotEvents, recordPlotEvent } from './plot-events';
import { seasonPlotStates } from './season-plots';
import { regenerateTasks } from './tasks';
import { physicalPlotEvents, seesPeople, type Viewer } from './visibility';
import type { ClubLookup } from './memberships';

const EPS = STORED_LENGTH_EPS;

/** The club a (live) plot belongs to, or null. */
export const clubOfPlot: ClubLookup = (db, plotId) =>
  db('plots as p').join('sites as s', 's.id', 'p.site_id').where('p.id', plotId).whereNull('p.deleted_at').whereNull('s.archived_at').select('s.club_id');

const livePlots = (db: Db, siteId: number) => db('plots').where({ site_id: siteId }).whereNull('deleted_at');

/** The live plots of a site, by label. */
export async function listPlots(db: Db, siteId: number) {
  const rows: PlotRow[] = await livePlots(db, siteId).orderByRaw('lower(label)');
  return { items: rows.map(toPlot), page: 1, total: rows.length };
}

/** Locks the site so plot writes on one site happen one after another (no two overlapping plots slip in). */
async function lockSite(trx: Knex.Transaction, siteId: number) {
  const site = await trx('sites').where({ id: siteId }).forUpdate().first('id', 'width_m', 'length_m');
  if (!site) throw notFound('The site');
  return site as { id: number; width_m: number; length_m: number };
}

/** Refuses a rectangle that leaves the site or overlaps another live plot, naming the plot in the way. */
export async function assertPlacement(
  trx: Db,
  site: { id: number; width_m: number; length_m: number },
  rect: Rect,
  exceptPlotId?: number,
) {
  const fp = footprint(rect);
  const fields: Record<string, string> = {};
  if (fp.maxX > site.width_m + EPS) fields.x = `The plot goes past the east edge of the site (${site.width_m} m wide)`;
  if (fp.maxY > site.length_m + EPS) fields.y = `The plot goes past the south edge of the site (${site.length_m} m long)`;
  if (Object.keys(fields).length) throw new AppError('validation_failed', 'The plot does not fit on the site.', fields);
  const others: PlotRow[] = await livePlots(trx, site.id).modify((q) => {
    if (exceptPlotId) q.whereNot({ id: exceptPlotId });
  });
  const hit = others.find((o) => overlaps(rect, plotRect(o), STORED_LENGTH_EPS));
  if (hit) {
    throw new AppError('conflict', `That would overlap plot ${hit.label}. Plots may touch but not overlap.`, {
      x: `Overlaps plot ${hit.label}`,
    });
  }
}

/** Draws a new plot on a site. */
export async function createPlot(db: Knex, opts: { siteId: number; userId: number; body: PlotCreateBody }): Promise<Plot> {
  return db.transaction(async (trx) => {
    const site = await lockSite(trx, opts.siteId);
    await assertPlacement(trx, site, opts.body);
    const [row]: PlotRow[] = await trx('plots')
      .insert({ site_id: opts.siteId, ...plotColumns(opts.body) })
      .returning('*');
    await recordPlotEvent(trx, { plotId: row.id, userId: opts.userId, kind: 'created', details: { label: row.label } });
    await recheckSite(trx, opts.siteId, [row.id]);
    return toPlot(row);
  });
}

const GEOMETRY = ['x', 'y'] as const;
const SIZE = ['width', 'length', 'rotation'] as const;

/** Changes a plot if its version is still the one the editor saw; records what changed. */
export async function updatePlot(db: Knex, opts: { plotId: number; userId: number; body: PlotUpdateBody }): Promise<Plot> {
  const { version, ...changes } = opts.body;
  return db.transaction(async (trx) => {
    const before0: PlotRow | undefined = await trx('plots').where({ id: opts.plotId }).whereNull('deleted_at').first();
    if (!before0) throw notFound('The plot');
    const site = await lockSite(trx, before0.site_id);
    const before: PlotRow = await trx('plots').where({ id: opts.plotId }).first();
    if (before.deleted_at) throw notFound('The plot');
    if (before.version !== version) {
      throw new AppError(
        'conflict',
        `Plot ${before.label} was changed by someone else since you loaded the map. The map has been reloaded; make your change again.`,
      );
    }
    const current = toPlot(before);
    const next = { ...current, ...changes };
    if ([...GEOMETRY, ...SIZE].some((k) => changes[k] !== undefined)) {
      await assertPlacement(trx, site, next, opts.plotId);
    }
    // A plot that moves or changes size leaves its old neighbours: note them before the change.
    const moves = [...GEOMETRY, ...SIZE].some((k) => changes[k] !== undefined);
    const oldNeighbours = moves ? await neighbourPlotIds(trx, before.site_id, opts.plotId) : [opts.plotId];
    const diff: Record<string, { from: unknown; to: unknown }> = {};
    for (const [k, v] of Object.entries(changes)) {
      const old = (current as Record<string, unknown>)[k];
      if (v !== undefined && v !== old) diff[k] = { from: old, to: v };
    }
    const [row]: PlotRow[] = await trx('plots')
      .where({ id: opts.plotId })
      .update({ ...plotColumns(changes), version: version + 1, updated_at: trx.fn.now() })
      .returning('*');
    if (Object.keys(diff).length > 0) {
      const kind = SIZE.some((k) => k in diff)
        ? 'resized'
        : GEOMETRY.some((k) => k in diff) && Object.keys(diff).every((k) => (GEOMETRY as readonly string[]).includes(k))
          ? 'moved'
          : 'edited';
      await recordPlotEvent(trx, { plotId: row.id, userId: opts.userId, kind, details: { changes: diff } });
      // Place, size, kind and soil all feed the neighbour check.
      await recheckSite(trx, row.site_id, [opts.plotId, ...oldNeighbours]);
      // Size and kind set the litres to water (area, raised bed or container): re-plan its plantings' tasks.
      if (SIZE.some((k) => k in diff) || 'kind' in diff) await regenerateTasks(trx, row.site_id, { plotIds: [row.id] });
    }
    return toPlot(row);
  });
}

/**
 * Why a plot cannot leave the map now, for a coordinator's eyes only (it names people): someone
 * holds it in the club's latest season, or an offer or renewal of it waits for an answer.
 */
async function plotInUse(trx: Knex.Transaction, plotId: number, label: string, now: Date): Promise<string | null> {
  // Anything past its deadline lapses first, as the sweep would.
  await lapseOverdue(trx, { plotId }, now);
  const offer = await trx('offers as o')
    .join('applications as a', 'a.id', 'o.application_id')
    .where({ 'o.plot_id': plotId, 'o.status': 'pending' })
    .first('a.name');
  if (offer) return `Plot ${label} is offered to ${offer.name}, who has not answered yet. Withdraw the offer before removing the plot.`;
  const renewal = await trx('renewals as r')
    .join('users as u', 'u.id', 'r.user_id')
    .where({ 'r.plot_id': plotId, 'r.status': 'pending' })
    .first('u.name');
  if (renewal) return `Plot ${label} waits for ${renewal.name} to keep it or give it up. Remove it after they answer or the renewal lapses.`;
  const held = await trx('allocations as a')
    .join('seasons as se', 'se.id', 'a.season_id')
    .join('users as u', 'u.id', 'a.user_id')
    .where({ 'a.plot_id': plotId, 'a.status': 'active' })
    .whereRaw('se.year = (select max(year) from seasons where club_id = se.club_id)')
    .first('u.name', 'se.year');
  if (held) return `Plot ${label} is held by ${held.name} for ${held.year}. It can be removed once nobody holds it.`;
  return null;
}

/** Takes a plot off the map (its history stays); refused while it is held, offered or up for renewal. */
export async function deletePlot(db: Knex, opts: { plotId: number; userId: number; version: number; now?: Date }): Promise<void> {
  const now = opts.now ?? new Date();
  await db.transaction(async (trx) => {
    const row = await trx('plots').where({ id: opts.plotId }).whereNull('deleted_at').forUpdate().first('version', 'label');
    if (!row) throw notFound('The plot');
    if (row.version !== opts.version) {
      throw new AppError('conflict', `Plot ${row.label} was changed by someone else since you loaded the map.`);
    }
    const inUse = await plotInUse(trx, opts.plotId, row.label, now);
    if (inUse) throw new AppError('conflict', inUse);
    const siteId = await siteOfPlot(trx, opts.plotId);
    const oldNeighbours = await neighbourPlotIds(trx, siteId, opts.plotId);
    await trx('plots').where({ id: opts.plotId }).update({ deleted_at: trx.fn.now(), version: row.version + 1 });
    // Its findings go with it; its old neighbours lose whatever it caused them.
    await trx('findings').where({ plot_id: opts.plotId }).delete();
    await recheckSite(trx, siteId, oldNeighbours);
    await recordPlotEvent(trx, { plotId: opts.plotId, userId: opts.userId, kind: 'deleted', details: { label: row.label } });
  });
}

/** Neighbouring plot pairs on a site, from geometry and the site's path width. */
export async function siteNeighbours(db: Db, siteId: number): Promise<{ items: NeighbourPair[]; pathWidth: number }> {
  const site = await db('sites').where({ id: siteId }).first('path_width_m');
  if (!site) throw notFound('The site');
  const rows: PlotRow[] = await livePlots(db, siteId).orderBy('id');
  const pairs = neighbours(rows.map(plotRect), site.path_width_m, STORED_LENGTH_EPS);
  return { items: pairs as NeighbourPair[], pathWidth: site.path_width_m };
}

/** A plot with its site, neighbours and history, for its own page. */
/**
 * One plot with its neighbours and history. A coordinator sees the holder and the whole history; anyone
 * else sees the holder only when it is them, and only the history of the plot itself, without names.
 */
export async function getPlotDetail(db: Db, plotId: number, viewer: Viewer): Promise<PlotDetail> {
  const row: (PlotRow & { club_id: number; site_name: string; units: 'metric' | 'us'; path_width_m_site: number }) | undefined = await db(
    'plots as p',
  )
    .join('sites as s', 's.id', 'p.site_id')
    .where('p.id', plotId)
    .whereNull('p.deleted_at')
    .first('p.*', 's.club_id', 's.name as site_name', 's.units', 's.path_width_m as path_width_m_site');
  if (!row) throw notFound('The plot');
  // "This season" is the club's newest season, even while last season's holder has not yet renewed.
  const newest = await db('seasons').where({ club_id: row.club_id }).orderBy('year', 'desc').first('id', 'year');
  const state = newest ? (await seasonPlotStates(db, newest.id, row.site_id, viewer)).find((st) => st.plotId === plotId)! : null;
  const siblings: PlotRow[] = await livePlots(db, row.site_id);
  const byId = new Map(siblings.map((s) => [s.id, s]));
  const pairs = neighbours(siblings.map(plotRect), row.path_width_m_site, STORED_LENGTH_EPS).filter((n) => n.a === plotId || n.b === plotId);
  const opposite = { north: 'south', south: 'north', east: 'west', west: 'east' } as const;
  const full = seesPeople(viewer);
  const history = await listPlotEvents(db, plotId);
  return {
    ...toPlot(row),
    siteName: row.site_name,
    units: row.units,
    holder: state?.holder ? { ...state.holder, season: newest!.year } : null,
    season: newest && state ? { year: newest.year, state } : null,
    neighbours: pairs.map((n) => {
      const otherId = (n.a === plotId ? n.b : n.a) as number;
      const other = byId.get(otherId)!;
      return { plotId: otherId, label: other.label, kind: n.kind, side: n.a === plotId ? n.side : opposite[n.side], gap: n.gap };
    }),
    history: full ? history : history.filter((e) => physicalPlotEvents.has(e.kind)).map((e) => ({ ...e, byName: null })),
  };
}
