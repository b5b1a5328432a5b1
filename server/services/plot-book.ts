import { localToday } from '@shared/dates';
import { harvestTotals } from '@shared/plot-book';
import type { PlotBook } from '@shared/schemas/plot-book';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { listFindings } from './findings';
import { listHarvestRows, toHarvest } from './harvests';
import { listObservations } from './observations';
import { loadPlantings, type SiteClimate } from './plantings';

// Who may open a plot book (see DEVELOPERS.md, "Plot books are the holder's"): the plot's holder this
// season and the club's coordinators read and write; other members of the club read only when the club
// shares plot books, otherwise 403; anyone outside the club gets 404, as for every record by id.

export interface PlotBookPlot {
  id: number;
  clubId: number;
  label: string;
  siteId: number;
  siteName: string;
  width: number;
  length: number;
  kind: PlotBook['plot']['kind'];
  units: PlotBook['plot']['units'];
  climate: SiteClimate;
}

export interface PlotBookAccess {
  plot: PlotBookPlot;
  /** The club's season this is: newest started, else the first one coming (null for a club with none). */
  season: { id: number; year: number } | null;
  isCoordinator: boolean;
  canWrite: boolean;
}

/**
 * The club's season "this season" means: the newest one whose year has begun in the club's time zone,
 * or, while every season is still ahead (a club's first spring round), the earliest of them.
 */
export async function currentSeason(db: Db, clubId: number, now: Date = new Date()): Promise<{ id: number; year: number } | null> {
  // The club's zone and its seasons in one query (a club with no season still answers its zone).
  const rows: Array<{ id: number | null; year: number | null; time_zone: string }> = await db('clubs as c')
    .leftJoin('seasons as s', 's.club_id', 'c.id')
    .where('c.id', clubId)
    .select('s.id', 's.year', 'c.time_zone');
  const seasons = rows.filter((r) => r.id !== null).map((r) => ({ id: r.id!, year: r.year! }));
  return pickCurrentSeason(seasons, rows[0]?.time_zone ?? 'UTC', now);
}

/** The season "this season" means among a club's seasons (see currentSeason), without a query. */
export function pickCurrentSeason(seasons: Array<{ id: number; year: number }>, timeZone: string, now: Date = new Date()) {
  const year = Number(localToday(timeZone, now).slice(0, 4));
  const byYear = [...seasons].sort((a, b) => a.year - b.year);
  const started = byYear.filter((s) => s.year <= year);
  return started.length ? started[started.length - 1] : (byYear[0] ?? null);
}

/**
 * Decides whether a person may read (or, with `write`, change) a plot's book, throwing 404 for a plot
 * that is gone or in a club they are not part of and 403 for a member the rule leaves out. One query
 * reads the plot on a live site, the person's roles, the club's seasons and the seasons they hold it.
 */
export async function plotBookAccess(
  db: Db,
  opts: { plotId: number; userId: number; write: boolean; now?: Date },
): Promise<PlotBookAccess> {
  const row = await db('plots as p')
    .join('sites as s', 's.id', 'p.site_id')
    .join('clubs as c', 'c.id', 's.club_id')
    .where('p.id', opts.plotId)
    .whereNull('p.deleted_at')
    .whereNull('s.archived_at')
    .first(
      'p.id', 'p.label', 'p.width_m', 'p.length_m', 'p.kind', 's.id as site_id', 's.club_id', 's.name as site_name', 's.units',
      's.last_spring_frost', 's.first_autumn_frost', 's.soil_temps_c', 'c.time_zone', 'c.shares_plot_books',
      db.raw("(select coalesce(array_agg(m.role::text), '{}') from memberships m where m.club_id = s.club_id and m.user_id = ?) as roles", [opts.userId]),
      db.raw("(select coalesce(json_agg(json_build_object('id', se.id, 'year', se.year)), '[]') from seasons se where se.club_id = s.club_id) as seasons"),
      db.raw("(select coalesce(array_agg(a.season_id), '{}') from allocations a where a.plot_id = p.id and a.user_id = ? and a.status = 'active') as held", [opts.userId]),
    );
  const roles: string[] = row?.roles ?? [];
  if (!row || roles.length === 0) throw notFound('The plot');
  const plot: PlotBookPlot = {
    id: row.id,
    clubId: row.club_id,
    label: row.label,
    siteId: row.site_id,
    siteName: row.site_name,
    width: Number(row.width_m),
    length: Number(row.length_m),
    kind: row.kind,
    units: row.units,
    climate: {
      lastSpringFrost: row.last_spring_frost,
      firstAutumnFrost: row.first_autumn_frost,
      soilTempsC: Array.isArray(row.soil_temps_c) && row.soil_temps_c.length === 12 ? (row.soil_temps_c as number[]) : null,
    },
  };
  const season = pickCurrentSeason(row.seasons as Array<{ id: number; year: number }>, row.time_zone ?? 'UTC', opts.now);
  const isCoordinator = roles.includes('coordinator');
  const holds = season !== null && (row.held as number[]).includes(season.id);
  const canWrite = isCoordinator || holds;
  if (!canWrite) {
    if (opts.write) throw new AppError('forbidden', 'Only the plot’s holder this season and the coordinators can change its plot book.');
    if (!row.shares_plot_books) throw new AppError('forbidden', 'This club keeps each plot book to the plot’s holder and the coordinators.');
  }
  return { plot, season, isCoordinator, canWrite };
}

/** Refuses a part of the plot that does not lie inside it, naming the field `part` (lengths kept to the millimetre). */
export function assertPartInside(plot: { width: number; length: number }, part: { x: number; y: number; width: number; length: number } | null) {
  if (!part) return;
  const mm = (v: number) => Math.round(v * 1000);
  if (mm(part.x) + mm(part.width) > mm(plot.width) || mm(part.y) + mm(part.length) > mm(plot.length)) {
    const message = `The part must lie inside the plot (${plot.width} m × ${plot.length} m)`;
    throw new AppError('validation_failed', message, { part: message });
  }
}

/** A plot's book: the season asked for (this season by default) with its plantings and harvests, earlier seasons, observations and harvest totals. */
export async function getPlotBook(db: Db, opts: { plotId: number; userId: number; year?: number; now?: Date }): Promise<PlotBook> {
  const access = await plotBookAccess(db, { plotId: opts.plotId, userId: opts.userId, write: false, now: opts.now });
  const { plot } = access;
  let season: PlotBook['season'] = null;
  if (opts.year !== undefined) {
    const row = await db('seasons').where({ club_id: plot.clubId, year: opts.year }).first('id', 'year');
    if (!row) throw notFound(`The ${opts.year} season`);
    season = { id: row.id, year: row.year, isCurrent: row.id === access.season?.id };
  } else if (access.season) {
    season = { ...access.season, isCurrent: true };
  }

  const all = await loadPlantings(db, { plotId: plot.id, climate: plot.climate, plot });
  const shown = season ? all.filter((p) => p.seasonId === season.id) : [];
  const earlier = season ? all.filter((p) => p.seasonYear < season.year) : [];
  const pastYears = [...new Set(earlier.map((p) => p.seasonYear))].sort((a, b) => b - a);

  const harvestRows = await listHarvestRows(db, shown.map((p) => p.id));
  const byPlanting = shown.map((p) => {
    const entries = harvestRows
      .filter((h) => h.planting_id === p.id)
      .map((h) => ({ grams: h.grams === null ? undefined : Number(h.grams), count: h.count ?? undefined }));
    const plants = p.quantity ?? p.computed.plantsThatFit?.plants;
    return { plantingId: p.id, ...harvestTotals(entries, { areaM2: p.computed.areaM2, plants: plants || undefined }) };
  });
  const plotTotals = harvestTotals(
    harvestRows.map((h) => ({ grams: h.grams === null ? undefined : Number(h.grams), count: h.count ?? undefined })),
    { areaM2: plot.width * plot.length },
  );

  return {
    plot: { id: plot.id, label: plot.label, siteId: plot.siteId, siteName: plot.siteName, width: plot.width, length: plot.length, kind: plot.kind, units: plot.units },
    season,
    canWrite: access.canWrite && (season?.isCurrent ?? false),
    plantings: shown,
    harvests: harvestRows.map(toHarvest),
    pastSeasons: pastYears.map((year) => ({ year, plantings: earlier.filter((p) => p.seasonYear === year) })),
    observations: await listObservations(db, plot.id),
    // The neighbour check's stored findings for the season shown (names the neighbouring plot and crop, never a person).
    findings: season ? (await listFindings(db, { clubId: plot.clubId, seasonId: season.id, plotId: plot.id })).map(({ siteId: _s, siteName: _n, ...f }) => f) : [],
    harvestTotals: { byPlanting, plot: plotTotals },
  };
}
