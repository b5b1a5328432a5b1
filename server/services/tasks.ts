import type { Knex } from 'knex';
import type { Crop } from '@shared/crops/types';
import { localToday, addCalendarDays } from '@shared/dates';
import { plantingDatesFor } from '@shared/plot-book';
import { tasksForPlanting, weekStartOf, type DesiredTask, type TaskContext, type TaskPlantingInput } from '@shared/tasks/generate';
import type { WeatherDay } from '@shared/water';
import type { Db } from '../db/knex';
import { withClubOverrides } from './crops';
import { currentSeason } from './plot-book';

// Generating a site's tasks: load the season's plantings with the same dates as the plot book, ask the
// pure generator what each should have, and write only the difference. Done and skipped tasks are never
// touched, and neither is an open task whose window has closed (it is history: overdue). A second run
// with nothing changed writes nothing.

/** First key of the per-site advisory lock held while a site's tasks are written. */
const TASKS_LOCK = 7_301;
/** Plantings generated per transaction in a whole-site run (the progress bar moves per chunk). */
export const TASK_CHUNK = 200;

interface SiteRow {
  id: number;
  club_id: number;
  latitude: number;
  elevation_m: number | null;
  units: 'metric' | 'us';
  time_zone: string;
  last_spring_frost: string | null;
  first_autumn_frost: string | null;
  soil_temps_c: unknown;
  raised_bed_water_factor: string;
  container_water_factor: string;
}

export interface SiteTaskSetup {
  site: SiteRow;
  seasonId: number | null;
  ctx: TaskContext;
}

const num = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));

export function weatherDayOf(r: Record<string, unknown>): WeatherDay {
  return {
    date: String(r.day),
    tMinC: num(r.t_min_c),
    tMaxC: num(r.t_max_c),
    rainMm: num(r.rain_mm),
    rhMinPct: num(r.rh_min_pct),
    rhMaxPct: num(r.rh_max_pct),
    rhMeanPct: num(r.rh_mean_pct),
    windMs: num(r.wind_ms),
    windHeightM: num(r.wind_height_m),
    sunshineH: num(r.sunshine_h),
    solarMjM2: num(r.solar_mj_m2),
  };
}

/** The weather log of a site between two dates, by date. */
export async function weatherBetween(db: Db, siteId: number, from: string, to: string): Promise<Map<string, WeatherDay>> {
  const rows = await db('weather_days').where({ site_id: siteId }).whereBetween('day', [from, to]).select('*');
  return new Map(rows.map((r: Record<string, unknown>) => [String(r.day), weatherDayOf(r)]));
}

/** The site, its club's water factors, this season and the weather the generator needs (three queries). */
export async function loadSiteTaskSetup(db: Db, siteId: number, now: Date = new Date()): Promise<SiteTaskSetup | null> {
  const site: SiteRow | undefined = await db('sites as s')
    .join('clubs as c', 'c.id', 's.club_id')
    .where('s.id', siteId)
    .whereNull('s.archived_at')
    .first(
      's.id',
      's.club_id',
      's.latitude',
      's.elevation_m',
      's.units',
      's.time_zone',
      's.last_spring_frost',
      's.first_autumn_frost',
      's.soil_temps_c',
      'c.raised_bed_water_factor',
      'c.container_water_factor',
    );
  if (!site) return null;
  const season = await currentSeason(db, site.club_id, now);
  const today = localToday(site.time_zone, now);
  const weekStart = weekStartOf(today);
  // The week before this one feeds the estimate of days still to come; the next week is the last planned.
  const weather = await weatherBetween(db, siteId, addCalendarDays(weekStart, -7), addCalendarDays(weekStart, 13));
  return {
    site,
    seasonId: season?.id ?? null,
    ctx: {
      site: { latitude: Number(site.latitude), elevationM: site.elevation_m === null ? null : Number(site.elevation_m), units: site.units },
      weather,
      factors: { raisedBed: Number(site.raised_bed_water_factor), container: Number(site.container_water_factor) },
      today,
    },
  };
}

interface PlantingTaskRow {
  id: number;
  plot_id: number;
  plot_label: string;
  plot_kind: TaskPlantingInput['plotKind'];
  plot_width_m: string;
  plot_length_m: string;
  part_width_m: string | null;
  part_length_m: string | null;
  crop_id: number;
  crop_name: string;
  crop_data: Crop;
  method: TaskPlantingInput['method'];
  planted_on: string;
  status: TaskPlantingInput['status'];
}

/** The season's plantings on a site (or the given ones), with the club's crop values and the plot book's dates. */
export async function loadTaskPlantings(
  db: Db,
  setup: SiteTaskSetup,
  opts: { plantingIds?: number[]; plotIds?: number[]; afterId?: number; limit?: number } = {},
): Promise<Array<TaskPlantingInput & { plotId: number }>> {
  if (setup.seasonId === null) return [];
  let q = db('plantings as pl')
    .join('plots as p', 'p.id', 'pl.plot_id')
    .join('crops as c', 'c.id', 'pl.crop_id')
    .where({ 'p.site_id': setup.site.id, 'pl.season_id': setup.seasonId })
    .whereNull('p.deleted_at')
    .select(
      'pl.id',
      'pl.plot_id',
      'p.label as plot_label',
      'p.kind as plot_kind',
      'p.width_m as plot_width_m',
      'p.length_m as plot_length_m',
      'pl.part_width_m',
      'pl.part_length_m',
      'pl.crop_id',
      'c.common_name as crop_name',
      'c.data as crop_data',
      'pl.method',
      'pl.planted_on',
      'pl.status',
    )
    .orderBy('pl.id');
  if (opts.plantingIds) q = q.whereIn('pl.id', opts.plantingIds);
  if (opts.plotIds) q = q.whereIn('pl.plot_id', opts.plotIds);
  if (opts.afterId !== undefined) q = q.where('pl.id', '>', opts.afterId);
  if (opts.limit !== undefined) q = q.limit(opts.limit);
  const rows: PlantingTaskRow[] = await q;
  const crops = await withClubOverrides(db, setup.site.club_id, rows.map((r) => ({ id: r.crop_id, data: r.crop_data as unknown as Record<string, unknown> })));
  const climate = {
    lastSpringFrost: setup.site.last_spring_frost,
    firstAutumnFrost: setup.site.first_autumn_frost,
    soilTempsC: Array.isArray(setup.site.soil_temps_c) && setup.site.soil_temps_c.length === 12 ? (setup.site.soil_temps_c as number[]) : null,
  };
  return rows.map((r) => {
    const crop = (crops.get(r.crop_id) ?? r.crop_data) as unknown as Crop;
    const width = r.part_width_m !== null ? Number(r.part_width_m) : Number(r.plot_width_m);
    const length = r.part_length_m !== null ? Number(r.part_length_m) : Number(r.plot_length_m);
    return {
      id: r.id,
      plotId: r.plot_id,
      cropName: r.crop_name,
      crop,
      method: r.method,
      plantedOn: r.planted_on,
      status: r.status,
      dates: plantingDatesFor(crop, { method: r.method, plantedOn: r.planted_on }, climate).dates,
      areaM2: width * length,
      plotLabel: r.plot_label,
      plotKind: r.plot_kind,
    };
  });
}

export interface SyncCounts {
  created: number;
  updated: number;
  removed: number;
}

interface StoredTask {
  id: number;
  planting_id: number;
  gen_key: string;
  status: string;
  window_to: string;
  kind: string;
  title: string;
  details: string;
  source: string;
  caution: string | null;
  due_on: string;
  window_from: string;
  amount_mm: string | null;
  amount_l: string | null;
  crop_name: string | null;
  plot_id: number | null;
  version: number;
}

const sameNumber = (stored: string | null, wanted: number | null) => (stored === null ? wanted === null : wanted !== null && Number(stored) === wanted);

function differs(s: StoredTask, d: DesiredTask, cropName: string, plotId: number): boolean {
  return (
    s.kind !== d.kind ||
    s.title !== d.title ||
    s.details !== d.details ||
    s.source !== d.source ||
    s.caution !== d.caution ||
    s.due_on !== d.dueOn ||
    s.window_from !== d.windowFrom ||
    s.window_to !== d.windowTo ||
    !sameNumber(s.amount_mm, d.amountMm) ||
    !sameNumber(s.amount_l, d.amountL) ||
    s.crop_name !== cropName ||
    s.plot_id !== plotId
  );
}

const columnsOf = (d: DesiredTask) => ({
  kind: d.kind,
  title: d.title,
  details: d.details,
  source: d.source,
  caution: d.caution,
  due_on: d.dueOn,
  window_from: d.windowFrom,
  window_to: d.windowTo,
  amount_mm: d.amountMm,
  amount_l: d.amountL,
});

interface Handover {
  plot_id: number;
  from_on: string;
  to_on: string;
  kinds: string[];
}

const handedOver = (handovers: Handover[], plotId: number, d: Pick<DesiredTask, 'kind' | 'dueOn'>) =>
  handovers.some((h) => h.plot_id === plotId && h.kinds.includes(d.kind) && h.from_on <= d.dueOn && d.dueOn <= h.to_on);

/**
 * Brings the generated tasks of some plantings in line with what the generator wants, in the caller's
 * transaction: inserts the missing, updates open ones that changed, removes open ones no longer wanted
 * (for a finished or failed planting, every open one). Returns what it wrote.
 */
export async function syncPlantingTasks(trx: Knex.Transaction, setup: SiteTaskSetup, plantings: Array<TaskPlantingInput & { plotId: number }>): Promise<SyncCounts> {
  const counts: SyncCounts = { created: 0, updated: 0, removed: 0 };
  if (!plantings.length) return counts;
  const today = setup.ctx.today;
  const ids = plantings.map((p) => p.id);
  const stored: StoredTask[] = await trx('tasks')
    .whereIn('planting_id', ids)
    .where({ origin: 'generated' })
    .select('id', 'planting_id', 'gen_key', 'status', 'window_to', 'kind', 'title', 'details', 'source', 'caution', 'due_on', 'window_from', 'amount_mm', 'amount_l', 'crop_name', 'plot_id', 'version');
  const handovers: Handover[] = await trx('task_handovers')
    .whereIn('plot_id', [...new Set(plantings.map((p) => p.plotId))])
    .whereNull('cancelled_at')
    .where('to_on', '>=', today)
    .select('plot_id', 'from_on', 'to_on', 'kinds');
  const byPlanting = new Map<number, StoredTask[]>();
  for (const s of stored) {
    const list = byPlanting.get(s.planting_id);
    if (list) list.push(s);
    else byPlanting.set(s.planting_id, [s]);
  }
  const inserts: Record<string, unknown>[] = [];
  const removeIds: number[] = [];
  for (const p of plantings) {
    const wanted = tasksForPlanting(p, setup.ctx);
    const have = new Map((byPlanting.get(p.id) ?? []).map((s) => [s.gen_key, s]));
    const ended = p.status === 'finished' || p.status === 'failed';
    for (const d of wanted) {
      const s = have.get(d.genKey);
      if (!s) {
        inserts.push({
          club_id: setup.site.club_id,
          site_id: setup.site.id,
          plot_id: p.plotId,
          planting_id: p.id,
          origin: 'generated',
          gen_key: d.genKey,
          crop_name: p.cropName,
          for_volunteers: handedOver(handovers, p.plotId, d),
          ...columnsOf(d),
        });
      } else if (s.status === 'open' && s.window_to >= today && differs(s, d, p.cropName, p.plotId)) {
        await trx('tasks')
          .where({ id: s.id })
          .update({ ...columnsOf(d), crop_name: p.cropName, plot_id: p.plotId, version: s.version + 1, updated_at: trx.fn.now() });
        counts.updated++;
      }
    }
    const wantedKeys = new Set(wanted.map((d) => d.genKey));
    for (const s of have.values()) {
      if (s.status !== 'open' || wantedKeys.has(s.gen_key)) continue;
      if (ended || s.window_to >= today) removeIds.push(s.id);
    }
  }
  if (inserts.length) {
    for (let i = 0; i < inserts.length; i += 500) await trx('tasks').insert(inserts.slice(i, i + 500));
    counts.created = inserts.length;
  }
  if (removeIds.length) counts.removed = await trx('tasks').whereIn('id', removeIds).delete();
  return counts;
}

/** Re-plans some plantings of a site (a planting saved, the weather logged) in the caller's transaction. */
export async function regenerateTasks(trx: Knex.Transaction, siteId: number, opts: { plantingIds?: number[]; plotIds?: number[]; now?: Date } = {}): Promise<SyncCounts> {
  const setup = await loadSiteTaskSetup(trx, siteId, opts.now);
  if (!setup) return { created: 0, updated: 0, removed: 0 };
  await trx.raw('select pg_advisory_xact_lock(?, ?)', [TASKS_LOCK, siteId]);
  const plantings = await loadTaskPlantings(trx, setup, { plantingIds: opts.plantingIds, plotIds: opts.plotIds });
  return syncPlantingTasks(trx, setup, plantings);
}

/** Before a planting is deleted: its open generated tasks go with it (done ones stay, without it). */
export async function removeOpenTasksOfPlanting(trx: Knex.Transaction, plantingId: number): Promise<number> {
  return trx('tasks').where({ planting_id: plantingId, origin: 'generated', status: 'open' }).delete();
}

/**
 * A whole site, chunk by chunk (one transaction each), reporting progress after each chunk. The
 * generated tasks of plantings no longer on the site this season are left to their own changes.
 */
export async function generateSiteTasks(
  db: Knex,
  siteId: number,
  opts: { now?: Date; onProgress?: (p: { total: number; done: number } & SyncCounts) => Promise<void> | void } = {},
): Promise<SyncCounts & { total: number }> {
  const setup = await loadSiteTaskSetup(db, siteId, opts.now);
  const totals = { created: 0, updated: 0, removed: 0, total: 0 };
  if (!setup || setup.seasonId === null) return totals;
  const [{ n }] = await db('plantings as pl')
    .join('plots as p', 'p.id', 'pl.plot_id')
    .where({ 'p.site_id': siteId, 'pl.season_id': setup.seasonId })
    .whereNull('p.deleted_at')
    .count({ n: '*' });
  totals.total = Number(n);
  let afterId = 0;
  let done = 0;
  await opts.onProgress?.({ total: totals.total, done, created: 0, updated: 0, removed: 0 });
  for (;;) {
    const counts = await db.transaction(async (trx) => {
      await trx.raw('select pg_advisory_xact_lock(?, ?)', [TASKS_LOCK, siteId]);
      const chunk = await loadTaskPlantings(trx, setup, { afterId, limit: TASK_CHUNK });
      if (!chunk.length) return null;
      afterId = chunk[chunk.length - 1].id;
      done += chunk.length;
      return syncPlantingTasks(trx, setup, chunk);
    });
    if (!counts) break;
    totals.created += counts.created;
    totals.updated += counts.updated;
    totals.removed += counts.removed;
    await opts.onProgress?.({ total: totals.total, done: Math.min(done, totals.total), created: totals.created, updated: totals.updated, removed: totals.removed });
  }
  return totals;
}

/**
 * After the weather log changed on some days, in the same transaction: re-plan the site's tasks when
 * a day falls in the weeks the watering is worked out from (the week before this one onwards).
 */
export async function replanAfterWeather(trx: Knex.Transaction, siteId: number, changedDays: string[], now?: Date): Promise<SyncCounts | null> {
  const site = await trx('sites').where({ id: siteId }).first('time_zone');
  if (!site) return null;
  const from = addCalendarDays(weekStartOf(localToday(site.time_zone, now)), -7);
  if (!changedDays.some((d) => d >= from)) return null;
  return regenerateTasks(trx, siteId, { now });
}
