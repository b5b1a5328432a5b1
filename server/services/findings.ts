import type { Knex } from 'knex';
import { diseaseRotationRules } from '@shared/crops/rotation';
import type { Crop } from '@shared/crops/types';
import {
  affectedPlots,
  checkDraft,
  checkPlots,
  prepare,
  whatFits,
  type CheckContext,
  type CheckPlanting,
  type Finding,
  type PartRect,
} from '@shared/findings';
import { neighbours } from '@shared/geometry';
import type { FindingView } from '@shared/schemas/findings';
import type { Db } from '../db/knex';
import { STORED_LENGTH_EPS } from '../db/mappers';
import { AppError, notFound } from '../errors';
import { withClubOverrides } from './crops';

// The neighbour check on the server: loads what the engine needs for one site in a fixed number of
// queries (whatever the site's size), stores each planting's findings, and after a change re-checks
// only the plots it can affect, in the caller's transaction.

interface SiteRow {
  id: number;
  club_id: number;
  latitude: number;
  path_width_m: number;
  last_spring_frost: string | null;
  first_autumn_frost: string | null;
  soil_temps_c: unknown;
  rotation_gap_years: number;
  seasons: Array<{ id: number; year: number }>;
  notes_stamp: string;
}

const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/** The plots within `rings` rings of neighbours of the given ones (themselves included), from geometry alone. */
function ringsOf(plots: CheckContext['plots'], pathWidthM: number, start: Iterable<number>, rings: 1 | 2): Set<number> {
  const around = new Map<number, number[]>();
  for (const n of neighbours(plots, pathWidthM, STORED_LENGTH_EPS)) {
    around.set(n.a, [...(around.get(n.a) ?? []), n.b]);
    around.set(n.b, [...(around.get(n.b) ?? []), n.a]);
  }
  let ring = new Set(start);
  for (let r = 0; r < rings; r++) {
    const next = new Set(ring);
    for (const id of ring) for (const n of around.get(id) ?? []) next.add(n);
    ring = next;
  }
  return ring;
}

function partOf(r: { part_x_m: unknown; part_y_m: unknown; part_width_m: unknown; part_length_m: unknown }): PartRect | null {
  if (r.part_x_m === null || r.part_y_m === null || r.part_width_m === null || r.part_length_m === null) return null;
  return { x: Number(r.part_x_m), y: Number(r.part_y_m), width: Number(r.part_width_m), length: Number(r.part_length_m) };
}

/**
 * A club's crop notes as the check reads them (its crops with the club's own values in place, and the
 * reference and club relations), kept per process. The site query brings a stamp of every row the notes
 * are made of (id and last change of each crop, override and relation); a different stamp reads them again,
 * so a change made through any server process is seen by the next check in every other.
 */
interface CropNotes {
  stamp: string;
  crops: CheckContext['crops'];
  relations: CheckContext['relations'];
}
const notesCache = new Map<number, CropNotes>();
const NOTES_CACHE_CLUBS = 500;

const stampSql = (table: string, where: string) =>
  `(select md5(coalesce(string_agg(t.id::text || '@' || extract(epoch from t.updated_at)::text, ',' order by t.id), '')) from ${table} t where ${where})`;
const overridesStampSql = `(select md5(coalesce(string_agg(o.crop_id::text || o.field || '@' || extract(epoch from o.updated_at)::text, ',' order by o.crop_id, o.field), '')) from crop_overrides o where o.club_id = s.club_id)`;

async function cropNotes(db: Db, clubId: number, stamp: string): Promise<CropNotes> {
  const hit = notesCache.get(clubId);
  if (hit && hit.stamp === stamp) return hit;
  const [cropRows, relations] = await Promise.all([
    db('crops').where((q) => q.whereNull('club_id').orWhere({ club_id: clubId })).orderBy('id').select('id', 'data'),
    db('crop_relations').where((q) => q.whereNull('club_id').orWhere({ club_id: clubId }))
      // The club's own relation for a pair comes last, so it replaces the reference one.
      .orderByRaw('(club_id is not null), id')
      .select('crop_a_id', 'crop_b_id', 'effect', 'distance_m', 'severity', 'reason', 'evidence', 'source'),
  ]);
  const effective = await withClubOverrides(db, clubId, cropRows as { id: number; data: Record<string, unknown> }[]);
  const notes: CropNotes = {
    stamp,
    crops: new Map(cropRows.map((c: { id: number }) => [c.id, { id: c.id, data: effective.get(c.id) as unknown as Crop }])),
    relations: relations.map((r: Record<string, unknown>) => ({
      cropA: r.crop_a_id as number,
      cropB: r.crop_b_id as number,
      effect: r.effect as 'beneficial' | 'antagonistic',
      distanceM: num(r.distance_m),
      severity: (r.severity as 'clash' | 'watch' | null) ?? null,
      reason: r.reason as string,
      evidence: r.evidence as 'research' | 'common_practice',
      source: r.source as string,
    })),
  };
  if (notesCache.size >= NOTES_CACHE_CLUBS) notesCache.clear();
  notesCache.set(clubId, notes);
  return notes;
}

/** Which plots' plantings a check needs: all of the site, or the plots around some (one or two rings of neighbours). */
export interface CheckScope {
  plotIds: Iterable<number>;
  /** 1: the plots and their neighbours (a dry run); 2: and the neighbours' neighbours (a re-check of the plots and their neighbours). */
  rings: 1 | 2;
}

/**
 * What the check needs for a site and its club, in a fixed number of queries whatever the site's size:
 * the site (with the club's seasons and the stamp of its crop notes), its plots, then the plantings
 * and soil-borne observations (only around the given plots, with a scope), and the crop notes when
 * their stamp has changed since this process last read them.
 */
export async function loadCheckContext(db: Db, siteId: number, scope?: CheckScope): Promise<CheckContext & { clubId: number; seasonIds: Map<number, number> }> {
  const site: SiteRow | undefined = await db('sites as s')
    .join('clubs as c', 'c.id', 's.club_id')
    .where('s.id', siteId)
    .first(
      's.id', 's.club_id', 's.latitude', 's.path_width_m', 's.last_spring_frost', 's.first_autumn_frost', 's.soil_temps_c', 'c.rotation_gap_years',
      db.raw("(select coalesce(json_agg(json_build_object('id', se.id, 'year', se.year)), '[]') from seasons se where se.club_id = s.club_id) as seasons"),
      db.raw(`${stampSql('crops', 't.club_id is null or t.club_id = s.club_id')} || ${stampSql('crop_relations', 't.club_id is null or t.club_id = s.club_id')} || ${overridesStampSql} as notes_stamp`),
    );
  if (!site) throw notFound('The site');
  const plots = await db('plots').where({ site_id: siteId }).whereNull('deleted_at').orderBy('id')
    .select('id', 'label', 'x_m', 'y_m', 'width_m', 'length_m', 'rotation', 'kind', 'soil_depth_m', 'soil_ph');
  const checkPlots = plots.map((p: Record<string, unknown>) => ({
    id: p.id as number,
    label: p.label as string,
    x: Number(p.x_m),
    y: Number(p.y_m),
    width: Number(p.width_m),
    length: Number(p.length_m),
    rotation: (Number(p.rotation) === 90 ? 90 : 0) as 0 | 90,
    kind: p.kind as CheckContext['plots'][number]['kind'],
    soilDepthM: num(p.soil_depth_m),
    soilPh: num(p.soil_ph),
  }));
  const within = scope ? [...ringsOf(checkPlots, Number(site.path_width_m), scope.plotIds, scope.rings)] : null;
  const onPlots = <T extends Knex.QueryBuilder>(q: T, column: string): T => (within ? (q.whereIn(column, within) as T) : q);
  const [plantings, observations, notes] = await Promise.all([
    onPlots(
      db('plantings as pl').join('plots as p', 'p.id', 'pl.plot_id').join('seasons as se', 'se.id', 'pl.season_id')
        .where('p.site_id', siteId).whereNull('p.deleted_at').orderBy('pl.id')
        .select('pl.id', 'pl.plot_id', 'se.year', 'pl.crop_id', 'pl.part_x_m', 'pl.part_y_m', 'pl.part_width_m', 'pl.part_length_m', 'pl.method', 'pl.planted_on', 'pl.status'),
      'pl.plot_id',
    ),
    onPlots(
      db('observations as o').join('plots as p', 'p.id', 'o.plot_id')
        .where({ 'p.site_id': siteId, 'o.is_soil_borne': true }).whereNull('p.deleted_at').orderBy('o.id')
        .select('o.id', 'o.plot_id', 'o.planting_id', 'o.pest_slug', 'o.name', 'o.is_soil_borne', 'o.part_x_m', 'o.part_y_m', 'o.part_width_m', 'o.part_length_m', 'o.observed_on'),
      'o.plot_id',
    ),
    cropNotes(db, site.club_id, site.notes_stamp),
  ]);
  return {
    clubId: site.club_id,
    seasonIds: new Map(site.seasons.map((se) => [se.year, se.id])),
    site: {
      id: site.id,
      latitude: Number(site.latitude),
      pathWidthM: Number(site.path_width_m),
      lastSpringFrost: site.last_spring_frost,
      firstAutumnFrost: site.first_autumn_frost,
      soilTempsC: Array.isArray(site.soil_temps_c) && site.soil_temps_c.length === 12 ? (site.soil_temps_c as number[]) : null,
    },
    plots: checkPlots,
    plantings: plantings.map((r: Record<string, unknown>) => ({
      id: r.id as number,
      plotId: r.plot_id as number,
      seasonYear: r.year as number,
      cropId: r.crop_id as number,
      part: partOf(r as never),
      method: r.method as CheckPlanting['method'],
      plantedOn: r.planted_on as string,
      status: r.status as CheckPlanting['status'],
    })),
    observations: observations.map((o: Record<string, unknown>) => ({
      id: o.id as number,
      plotId: o.plot_id as number,
      plantingId: (o.planting_id as number | null) ?? null,
      pestSlug: (o.pest_slug as string | null) ?? null,
      name: o.name as string,
      isSoilBorne: Boolean(o.is_soil_borne),
      part: partOf(o as never),
      observedOn: o.observed_on as string,
    })),
    crops: notes.crops,
    relations: notes.relations,
    rotationGapYears: site.rotation_gap_years,
    diseaseRules: diseaseRotationRules,
    eps: STORED_LENGTH_EPS,
  };
}

/** First key of the per-site advisory lock taken while its findings are re-checked. */
const FINDINGS_LOCK = 71_840;

interface StoredFinding {
  planting_id: number;
  key: string;
  severity: string;
  kind: string;
  rule: string;
  title: string;
  message: string;
  peers: unknown;
  source: unknown;
  numbers: unknown;
}

const FINDING_COLUMNS = ['planting_id', 'key', 'severity', 'kind', 'rule', 'title', 'message', 'peers', 'source', 'numbers'] as const;

/** The stored form of a finding, compared column by column (jsonb comes back with its keys reordered). */
function sameFinding(a: StoredFinding, b: StoredFinding): boolean {
  return FINDING_COLUMNS.every((c) => (typeof a[c] === 'object' ? canonical(a[c]) === canonical(b[c]) : a[c] === b[c]));
}

function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    return `{${Object.keys(v as object).sort().map((k) => `${JSON.stringify(k)}:${canonical((v as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(v);
}

function toStored(f: Finding): StoredFinding {
  return {
    planting_id: f.plantingId,
    key: f.key,
    severity: f.severity,
    kind: f.kind,
    rule: f.rule,
    title: f.title,
    message: f.message,
    peers: f.peers,
    source: f.source,
    numbers: f.numbers,
  };
}

export interface RecheckResult {
  plots: number;
  inserted: number;
  updated: number;
  deleted: number;
}

/**
 * Re-checks the plantings of `plotIds` and their neighbouring plots (all of the site when omitted) and
 * brings the stored findings in line, writing only what changed. Call it inside the change's
 * transaction; for a moved plot pass its old neighbours too (`neighbourPlotIds` before the move).
 */
export async function recheckSite(trx: Knex.Transaction | Knex, siteId: number, plotIds?: Iterable<number>): Promise<RecheckResult> {
  // One re-check of a site at a time: a second change waits, then reads what the first committed.
  await trx.raw('select pg_advisory_xact_lock(?, ?)', [FINDINGS_LOCK, siteId]);
  const start = plotIds ? [...plotIds] : null;
  // A re-check of some plots reads the plantings two rings out: their neighbours' findings name the neighbours' neighbours.
  const ctx = await loadCheckContext(trx, siteId, start ? { plotIds: start, rings: 2 } : undefined);
  const plots = start ? affectedPlots(ctx, start) : new Set(ctx.plots.map((p) => p.id));
  const fresh = checkPlots(ctx, plots);
  const stored: StoredFinding[] = plots.size
    ? await trx('findings').where({ site_id: siteId }).whereIn('plot_id', [...plots]).select(...FINDING_COLUMNS)
    : [];
  // Findings left on plots that are gone or no longer on this site are dropped with them.
  const storedByKey = new Map(stored.map((s) => [`${s.planting_id}|${s.key}`, s]));
  const keep = new Set<string>();
  const upserts: Array<Record<string, unknown>> = [];
  const plantingOf = new Map(ctx.plantings.map((p) => [p.id, p]));
  for (const f of fresh) {
    const row = toStored(f);
    const k = `${row.planting_id}|${row.key}`;
    keep.add(k);
    const old = storedByKey.get(k);
    if (old && sameFinding(old, row)) continue;
    const planting = plantingOf.get(f.plantingId)!;
    upserts.push({
      ...row,
      peers: JSON.stringify(row.peers),
      source: JSON.stringify(row.source),
      numbers: JSON.stringify(row.numbers),
      club_id: ctx.clubId,
      site_id: siteId,
      plot_id: f.plotId,
      season_id: ctx.seasonIds.get(planting.seasonYear),
    });
  }
  const gone = stored.filter((s) => !keep.has(`${s.planting_id}|${s.key}`));
  if (gone.length) {
    await trx('findings')
      .whereIn(['planting_id', 'key'], gone.map((g) => [g.planting_id, g.key]))
      .delete();
  }
  if (upserts.length) {
    await trx('findings').insert(upserts).onConflict(['planting_id', 'key']).merge();
  }
  const inserted = upserts.filter((u) => !storedByKey.has(`${u.planting_id}|${u.key}`)).length;
  return { plots: plots.size, inserted, updated: upserts.length - inserted, deleted: gone.length };
}

/** Re-checks every live site of a club (after a club setting or the club's crop notes change). */
export async function recheckClub(trx: Knex.Transaction | Knex, clubId: number): Promise<void> {
  const sites: { id: number }[] = await trx('sites').where({ club_id: clubId }).whereNull('archived_at').orderBy('id').select('id');
  for (const s of sites) await recheckSite(trx, s.id);
}

/** Re-checks every live site of every club, site by site in its own transaction (at start, after the reference crops change). */
export async function recheckEverything(db: Knex): Promise<number> {
  const sites: { id: number }[] = await db('sites').whereNull('archived_at').orderBy('id').select('id');
  for (const s of sites) await db.transaction((trx) => recheckSite(trx, s.id));
  return sites.length;
}

/** A plot's neighbours as they stand now (for a plot about to move, so its old neighbours are re-checked too). */
export async function neighbourPlotIds(db: Db, siteId: number, plotId: number): Promise<number[]> {
  const site = await db('sites').where({ id: siteId }).first('path_width_m');
  if (!site) throw notFound('The site');
  const rows = await db('plots').where({ site_id: siteId }).whereNull('deleted_at').select('id', 'x_m', 'y_m', 'width_m', 'length_m', 'rotation');
  const plots = rows.map((p: Record<string, unknown>) => ({
    id: p.id as number, label: '', x: Number(p.x_m), y: Number(p.y_m), width: Number(p.width_m), length: Number(p.length_m),
    rotation: (Number(p.rotation) === 90 ? 90 : 0) as 0 | 90, kind: 'in_ground' as const, soilDepthM: null, soilPh: null,
  }));
  return [...ringsOf(plots, Number(site.path_width_m), [plotId], 1)];
}

/** Clash findings stored for a planting, by key. */
export async function clashKeys(db: Db, plantingId: number): Promise<Set<string>> {
  const rows: { key: string }[] = await db('findings').where({ planting_id: plantingId, severity: 'clash' }).select('key');
  return new Set(rows.map((r) => r.key));
}

/**
 * At start, after the reference crops are loaded: re-check everything when the reference data changed
 * (every finding may cite it) or when plantings exist without any stored finding (a database from before
 * the check). Otherwise the stored findings are current and nothing is written.
 */
export async function bringFindingsUpToDate(db: Knex, reference: { cropsInserted: number; cropsUpdated: number; relationsInserted: number; relationsUpdated: number; relationsDeleted: number }): Promise<number> {
  const changed = Object.values(reference).some((n) => n > 0);
  if (!changed) {
    const planting = await db('plantings').first('id');
    if (!planting || (await db('findings').first('id'))) return 0;
  }
  return recheckEverything(db);
}

/** The site of a live plot, or a 404. */
export async function siteOfPlot(db: Db, plotId: number): Promise<number> {
  const row = await db('plots').where({ id: plotId }).whereNull('deleted_at').first('site_id');
  if (!row) throw notFound('The plot');
  return row.site_id;
}

interface FindingRow extends StoredFinding {
  plot_id: number;
  site_id: number;
  site_name: string;
  plot_label: string;
  crop_name: string;
  season_year: number;
  keep_reason: string | null;
}

function toView(r: FindingRow): FindingView & { siteId: number; siteName: string } {
  return {
    key: r.key,
    severity: r.severity as FindingView['severity'],
    kind: r.kind as FindingView['kind'],
    rule: r.rule,
    title: r.title,
    message: r.message,
    plantingId: r.planting_id,
    plotId: r.plot_id,
    plotLabel: r.plot_label,
    cropName: r.crop_name,
    seasonYear: r.season_year,
    peers: r.peers as FindingView['peers'],
    source: r.source as FindingView['source'],
    numbers: r.numbers as FindingView['numbers'],
    keptReason: r.severity === 'clash' ? r.keep_reason : null,
    siteId: r.site_id,
    siteName: r.site_name,
  };
}

const severityRank = "case f.severity when 'clash' then 0 when 'watch' then 1 else 2 end";

/** Stored findings, joined to what a reader needs, in one query: clashes first, then by site, plot and planting. */
export async function listFindings(
  db: Db,
  where: { clubId: number; seasonId: number; siteId?: number; plotId?: number; severity?: string; kind?: string },
): Promise<Array<FindingView & { siteId: number; siteName: string }>> {
  const q = db('findings as f')
    .join('plots as p', 'p.id', 'f.plot_id')
    .join('sites as s', 's.id', 'f.site_id')
    .join('plantings as pl', 'pl.id', 'f.planting_id')
    .join('crops as c', 'c.id', 'pl.crop_id')
    .join('seasons as se', 'se.id', 'f.season_id')
    .where({ 'f.club_id': where.clubId, 'f.season_id': where.seasonId })
    .whereNull('p.deleted_at')
    .whereNull('s.archived_at')
    .select('f.*', 's.name as site_name', 'p.label as plot_label', 'c.common_name as crop_name', 'se.year as season_year', 'pl.keep_reason')
    .orderByRaw(`${severityRank}, s.name, lower(p.label), f.planting_id, f.key`);
  if (where.siteId !== undefined) q.where('f.site_id', where.siteId);
  if (where.plotId !== undefined) q.where('f.plot_id', where.plotId);
  if (where.severity !== undefined) q.where('f.severity', where.severity);
  if (where.kind !== undefined) q.where('f.kind', where.kind);
  const rows: FindingRow[] = await q;
  return rows.map(toView);
}

/** A draft planting's findings, by the same rules and data as the saved check. */
/**
 * A plot's check context (its site, the plots within one ring, their plantings and the crop notes), kept per
 * process under the database's transaction snapshot read with the session (see AnswerCache): while a holder
 * edits a draft, each dry run re-reads nothing unless something in the database changed meanwhile.
 */
const contextCache = new Map<string, { stamp: string; ctx: Awaited<ReturnType<typeof loadCheckContext>>; prepared: ReturnType<typeof prepare> }>();
const CONTEXT_CACHE_PLOTS = 200;

async function plotContext(db: Db, siteId: number, plotId: number, stamp: string | undefined) {
  const key = `${siteId}:${plotId}`;
  const hit = stamp ? contextCache.get(key) : undefined;
  // The growing-window memo is weak (keyed by planting object): a draft's leaves with its request.
  if (hit && hit.stamp === stamp) return hit;
  const ctx = await loadCheckContext(db, siteId, { plotIds: [plotId], rings: 1 });
  const prepared = prepare(ctx);
  if (stamp) {
    contextCache.delete(key);
    contextCache.set(key, { stamp, ctx, prepared });
    if (contextCache.size > CONTEXT_CACHE_PLOTS) contextCache.delete(contextCache.keys().next().value!);
  }
  return { ctx, prepared };
}

/** `stamp`: the transaction snapshot read before this request's other queries (req.dbStamp), if any. */
export async function dryRun(db: Db, siteId: number, draft: CheckPlanting, stamp?: string): Promise<Finding[]> {
  const { ctx, prepared } = await plotContext(db, siteId, draft.plotId, stamp);
  // The club's crop notes are in the context: a crop outside them is the same 400 as on saving.
  if (!ctx.crops.has(draft.cropId)) throw new AppError('validation_failed', 'That crop is not in the crop notes.', { cropId: 'Choose a crop from the crop notes' });
  return checkDraft(prepared, draft);
}

/** Every crop of the club tried on a plot (or part) on a date, best first. */
export async function fitsFor(db: Db, opts: { siteId: number; plotId: number; seasonYear: number; part: PartRect | null; date: string }) {
  const ctx = await loadCheckContext(db, opts.siteId, { plotIds: [opts.plotId], rings: 1 });
  const ranked = whatFits(ctx, opts);
  return ranked.map((item) => {
    const crop = ctx.crops.get(item.cropId)!.data;
    return {
      crop: { id: item.cropId, slug: crop.slug, commonName: crop.commonName, family: crop.family.value },
      verdict: item.verdict,
      score: item.score,
      findings: item.findings.map((f) => ({ ...f, keptReason: null })),
    };
  });
}
