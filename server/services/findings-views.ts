import type { FindingList, FindingListQuery, FindingView, WhatFitsQuery, WhatFitsResult } from '@shared/schemas/findings';
import type { PlantingCheckBody } from '@shared/schemas/plot-book';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import { dryRun, fitsFor, listFindings } from './findings';
import { assertPartInside, currentSeason, plotBookAccess } from './plot-book';

// Who sees the neighbour check: a plot's findings, its dry run and "what fits here" go to those who
// may read (or, for the dry run, write) its plot book; a season's findings across plots and sites go to
// coordinators only. A finding names the neighbouring plot and crop, never the person who holds it.

/** The findings a planting would have as the form now holds it, by the same rules as the saved check. */
export async function checkPlantingDraft(db: Db, opts: { plotId: number; userId: number; body: PlantingCheckBody; now?: Date; stamp?: string }): Promise<FindingView[]> {
  const access = await plotBookAccess(db, { plotId: opts.plotId, userId: opts.userId, write: true, now: opts.now });
  if (!access.season) throw new AppError('conflict', 'The club has no season yet; plantings belong to a season.');
  const b = opts.body;
  assertPartInside(access.plot, b.part);
  let seasonYear = access.season.year;
  if (b.plantingId !== null) {
    const saved = await db('plantings as pl').join('seasons as se', 'se.id', 'pl.season_id').where({ 'pl.id': b.plantingId, 'pl.plot_id': access.plot.id }).first('se.year');
    if (!saved) throw new AppError('validation_failed', 'That planting is not on this plot.', { plantingId: 'Choose a planting on this plot' });
    seasonYear = saved.year;
  }
  const findings = await dryRun(db, access.plot.siteId, {
    id: b.plantingId ?? 0,
    plotId: access.plot.id,
    seasonYear,
    cropId: b.cropId,
    part: b.part,
    method: b.method,
    plantedOn: b.plantedOn,
    status: b.status,
  }, opts.stamp);
  return findings.map((f) => ({ ...f, keptReason: f.severity === 'clash' ? (b.keepReason ?? null) : null }));
}

/** Every crop of the club tried on this plot (or part) on a date, best first. */
export async function whatFitsOnPlot(db: Db, opts: { plotId: number; userId: number; query: WhatFitsQuery; now?: Date }): Promise<WhatFitsResult> {
  const access = await plotBookAccess(db, { plotId: opts.plotId, userId: opts.userId, write: false, now: opts.now });
  const q = opts.query;
  const part = q.x !== undefined && q.y !== undefined && q.width !== undefined && q.length !== undefined ? { x: q.x, y: q.y, width: q.width, length: q.length } : null;
  assertPartInside(access.plot, part);
  const seasonYear = access.season?.year ?? Number(q.date.slice(0, 4));
  const items = await fitsFor(db, { siteId: access.plot.siteId, plotId: access.plot.id, seasonYear, part, date: q.date });
  return { date: q.date, items };
}

/** A season's stored findings for coordinators, filtered; the season defaults to the club's current one. */
export async function findingsForCoordinator(
  db: Db,
  opts: { clubId: number; query: FindingListQuery; now?: Date; /** The site is known to be the club's (the route checked it). */ siteChecked?: boolean },
): Promise<FindingList> {
  const q = opts.query;
  let season: { id: number; year: number } | null;
  if (q.seasonId !== undefined) {
    season = (await db('seasons').where({ id: q.seasonId, club_id: opts.clubId }).first('id', 'year')) ?? null;
    if (!season) throw notFound('The season');
  } else {
    season = await currentSeason(db, opts.clubId, opts.now);
  }
  if (!season) return { seasonId: null, seasonYear: null, items: [] };
  if (q.siteId !== undefined && !opts.siteChecked) {
    const site = await db('sites').where({ id: q.siteId, club_id: opts.clubId }).first('id');
    if (!site) throw notFound('The site');
  }
  const items = await listFindings(db, { clubId: opts.clubId, seasonId: season.id, siteId: q.siteId, severity: q.severity, kind: q.kind });
  return { seasonId: season.id, seasonYear: season.year, items };
}
