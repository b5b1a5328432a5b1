import type { Knex } from 'knex';
import { addCalendarDays, localToday } from '@shared/dates';
import { waterWeek, weekStartOf } from '@shared/tasks/generate';
import { et0ForDay } from '@shared/water';
import type { HandoverBody, PlotTasks, SiteTaskList, SiteTaskQuery, TaskCreateBody, TaskView, WaterSummary } from '@shared/schemas/tasks';
import type { Db } from '../db/knex';
import { AppError, notFound } from '../errors';
import { plotBookAccess } from './plot-book';
import { loadSiteTaskSetup, loadTaskPlantings, weatherBetween } from './tasks';

// What people see of the tasks and what they do with them: a plot's tasks in its plot book, a site's
// list for coordinators, marking done, handing a plot's tasks to the volunteers while away, tasks
// coordinators add, and the site's water summary.

export interface TaskRow {
  id: number;
  site_id: number;
  plot_id: number | null;
  plot_label: string | null;
  planting_id: number | null;
  crop_name: string | null;
  kind: TaskView['kind'];
  origin: TaskView['origin'];
  title: string;
  details: string;
  source: string;
  caution: string | null;
  due_on: string;
  window_from: string;
  window_to: string;
  amount_mm: string | null;
  amount_l: string | null;
  status: TaskView['status'];
  for_volunteers: boolean;
  done_on: string | null;
  version: number;
}

export const toTaskView = (r: TaskRow): TaskView => ({
  id: Number(r.id),
  siteId: r.site_id,
  plotId: r.plot_id,
  plotLabel: r.plot_label,
  plantingId: r.planting_id,
  cropName: r.crop_name,
  kind: r.kind,
  origin: r.origin,
  title: r.title,
  details: r.details,
  source: r.source,
  caution: r.caution,
  dueOn: r.due_on,
  windowFrom: r.window_from,
  windowTo: r.window_to,
  amountMm: r.amount_mm === null ? null : Number(r.amount_mm),
  amountL: r.amount_l === null ? null : Number(r.amount_l),
  status: r.status,
  forVolunteers: r.for_volunteers,
  doneOn: r.done_on,
  version: r.version,
});

export const taskRows = (db: Db) => db('tasks as t').leftJoin('plots as p', 'p.id', 't.plot_id').select('t.*', 'p.label as plot_label');

/** A plot's tasks for its plot book: open ones by when they are due (this week is Monday to Sunday), and the last done. */
export async function plotTasks(db: Db, opts: { plotId: number; userId: number; now?: Date }): Promise<PlotTasks> {
  const access = await plotBookAccess(db, { plotId: opts.plotId, userId: opts.userId, write: false, now: opts.now });
  const zone = (await db('sites').where({ id: access.plot.siteId }).first('time_zone'))?.time_zone ?? 'UTC';
  const today = localToday(zone, opts.now);
  const weekStart = weekStartOf(today);
  const nextWeek = addCalendarDays(weekStart, 7);
  const afterNext = addCalendarDays(weekStart, 14);
  const [open, done, handovers] = await Promise.all([
    taskRows(db).where({ 't.plot_id': access.plot.id, 't.status': 'open' }).orderBy([{ column: 't.due_on' }, { column: 't.id' }]),
    taskRows(db).where({ 't.plot_id': access.plot.id }).whereIn('t.status', ['done', 'skipped']).orderBy([{ column: 't.updated_at', order: 'desc' }]).limit(10),
    db('task_handovers').where({ plot_id: access.plot.id }).whereNull('cancelled_at').where('to_on', '>=', today).orderBy('from_on').select('id', 'from_on', 'to_on', 'kinds', 'note'),
  ]);
  const views = (open as TaskRow[]).map(toTaskView);
  return {
    today,
    units: access.plot.units,
    overdue: views.filter((t) => t.windowTo < today),
    thisWeek: views.filter((t) => t.windowTo >= today && t.dueOn < nextWeek),
    nextWeek: views.filter((t) => t.windowTo >= today && t.dueOn >= nextWeek && t.dueOn < afterNext),
    later: views.filter((t) => t.windowTo >= today && t.dueOn >= afterNext),
    recentlyDone: (done as TaskRow[]).map(toTaskView),
    handovers: handovers.map((h: { id: number; from_on: string; to_on: string; kinds: string[]; note: string }) => ({
      id: h.id,
      fromOn: h.from_on,
      toOn: h.to_on,
      kinds: h.kinds as TaskView['kind'][],
      note: h.note,
    })),
    canWrite: access.canWrite,
  };
}

/**
 * Who may change a task: for a plot's task, whoever may write its plot book; a site task, the club's
 * coordinators; anyone else in the club may do a task handed to the volunteers. Outside the club: 404.
 */
async function lockTaskForChange(trx: Knex.Transaction, opts: { taskId: number; userId: number; now?: Date }) {
  const row = await trx('tasks').where({ id: opts.taskId }).forUpdate().first();
  if (!row) throw notFound('The task');
  const roles: string[] = (await trx('memberships').where({ club_id: row.club_id, user_id: opts.userId }).select('role')).map((r: { role: string }) => r.role);
  if (!roles.length) throw notFound('The task');
  const isCoordinator = roles.includes('coordinator');
  if (!isCoordinator) {
    let may = false;
    if (row.plot_id !== null) {
      const access = await plotBookAccess(trx, { plotId: row.plot_id, userId: opts.userId, write: false, now: opts.now }).catch(() => null);
      may = Boolean(access?.canWrite);
    }
    if (!may && row.for_volunteers && roles.includes('volunteer')) may = true;
    if (!may) throw new AppError('forbidden', 'Only the plot’s holder, the volunteers it was handed to and the coordinators can change this task.');
  }
  return { row, isCoordinator };
}

export async function setTaskStatus(
  db: Knex,
  opts: { taskId: number; userId: number; to: 'done' | 'open' | 'skipped'; version: number; note: string; now?: Date },
): Promise<TaskView> {
  await db.transaction(async (trx) => {
    const { row } = await lockTaskForChange(trx, opts);
    if (row.version !== opts.version) throw new AppError('conflict', 'Someone changed this task since you opened it; here it is now.');
    const zone = (await trx('sites').where({ id: row.site_id }).first('time_zone'))?.time_zone ?? 'UTC';
    const today = localToday(zone, opts.now);
    if (opts.to === 'open' && row.status === 'open') throw new AppError('conflict', 'This task is open already.');
    if (opts.to !== 'open' && row.status !== 'open') throw new AppError('conflict', `This task was marked ${row.status} already.`);
    await trx('tasks')
      .where({ id: row.id })
      .update({
        status: opts.to,
        done_on: opts.to === 'open' ? null : today,
        done_by_user_id: opts.to === 'open' ? null : opts.userId,
        done_note: opts.to === 'open' ? '' : opts.note,
        version: row.version + 1,
        updated_at: trx.fn.now(),
      });
  });
  const row = await taskRows(db).where('t.id', opts.taskId).first();
  return toTaskView(row);
}

/** A coordinator's task for a shared bed or the site: once, or every so many days until a date (at most 200). */
export async function createCoordinatorTasks(db: Knex, opts: { clubId: number; siteId: number; userId: number; body: TaskCreateBody }): Promise<{ created: number }> {
  const b = opts.body;
  return db.transaction(async (trx) => {
    if (b.plotId !== null) {
      const plot = await trx('plots').where({ id: b.plotId, site_id: opts.siteId }).whereNull('deleted_at').first('id');
      if (!plot) throw new AppError('validation_failed', 'That plot is not on this site.', { plotId: 'Choose a plot of this site' });
    }
    const dates: string[] = [];
    if (b.repeatEveryDays === null || b.repeatUntil === null) dates.push(b.dueOn);
    else for (let on = b.dueOn; on <= b.repeatUntil && dates.length <= 200; on = addCalendarDays(on, b.repeatEveryDays)) dates.push(on);
    if (dates.length > 200) throw new AppError('validation_failed', 'That repeats more than 200 times.', { repeatUntil: 'At most 200 repeats: choose an earlier end or a longer gap' });
    let seriesId: number | null = null;
    if (b.repeatEveryDays !== null && b.repeatUntil !== null) {
      const [s] = await trx('task_series')
        .insert({
          club_id: opts.clubId,
          site_id: opts.siteId,
          plot_id: b.plotId,
          kind: b.kind,
          title: b.title,
          details: b.details,
          starts_on: b.dueOn,
          ends_on: b.repeatUntil,
          every_days: b.repeatEveryDays,
          window_days: b.windowDays,
          created_by_user_id: opts.userId,
        })
        .returning('id');
      seriesId = s.id;
    }
    await trx('tasks').insert(
      dates.map((on) => ({
        club_id: opts.clubId,
        site_id: opts.siteId,
        plot_id: b.plotId,
        series_id: seriesId,
        origin: 'coordinator',
        gen_key: seriesId ? `series:${on}` : null,
        kind: b.kind,
        title: b.title,
        details: b.details,
        source: 'Added by a coordinator',
        due_on: on,
        window_from: on,
        window_to: addCalendarDays(on, b.windowDays - 1),
        created_by_user_id: opts.userId,
      })),
    );
    return { created: dates.length };
  });
}

/**
 * Deletes a task a coordinator added, for a coordinator of its club (generated tasks follow their
 * planting and cannot be deleted by hand). Outside the club, or no such task: 404; another member: 403.
 */
export async function deleteCoordinatorTask(db: Knex, opts: { taskId: number; userId: number }): Promise<void> {
  const row = await db('tasks').where({ id: opts.taskId }).first('id', 'origin', 'club_id');
  const roles: string[] = row ? await db('memberships').where({ club_id: row.club_id, user_id: opts.userId }).pluck('role') : [];
  if (!row || roles.length === 0) throw notFound('The task');
  if (!roles.includes('coordinator')) throw new AppError('forbidden', 'Only the club’s coordinators can delete a task.');
  if (row.origin !== 'coordinator') throw new AppError('conflict', 'Tasks worked out from a planting follow the planting; mark it not needed instead.');
  await db('tasks').where({ id: row.id }).delete();
}

/** A site's tasks for its coordinators, filtered; the window defaults to four weeks back and eight ahead. */
export async function siteTasks(db: Db, opts: { siteId: number; query: SiteTaskQuery; now?: Date }): Promise<SiteTaskList> {
  const site = await db('sites').where({ id: opts.siteId }).first('time_zone', 'units');
  if (!site) throw notFound('The site');
  const today = localToday(site.time_zone, opts.now);
  const q = opts.query;
  const from = q.from ?? addCalendarDays(today, -28);
  const to = q.to ?? addCalendarDays(today, 56);
  if (from > to) throw new AppError('validation_failed', 'The dates are the wrong way round.', { to: 'Must be on or after the first date' });
  let rows = taskRows(db).where('t.site_id', opts.siteId).where('t.window_to', '>=', from).where('t.due_on', '<=', to);
  if (q.kind) rows = rows.where('t.kind', q.kind);
  if (q.plotId) rows = rows.where('t.plot_id', q.plotId);
  if (q.status) rows = rows.where('t.status', q.status);
  const items = ((await rows.orderBy([{ column: 't.due_on' }, { column: 'p.label' }, { column: 't.id' }]).limit(5000)) as TaskRow[]).map(toTaskView);
  return { today, units: site.units, items };
}

/** "Away from … to …": the plot's open tasks of those kinds due then go to the volunteers; new ones follow. */
export async function createHandover(db: Knex, opts: { plotId: number; userId: number; body: HandoverBody; now?: Date }) {
  return db.transaction(async (trx) => {
    const access = await plotBookAccess(trx, { plotId: opts.plotId, userId: opts.userId, write: true, now: opts.now });
    const b = opts.body;
    const [h] = await trx('task_handovers')
      .insert({ club_id: access.plot.clubId, plot_id: access.plot.id, user_id: opts.userId, from_on: b.fromOn, to_on: b.toOn, kinds: b.kinds, note: b.note })
      .returning(['id', 'from_on', 'to_on', 'kinds', 'note']);
    const handed = await trx('tasks')
      .where({ plot_id: access.plot.id, status: 'open', for_volunteers: false })
      .whereIn('kind', b.kinds)
      .whereBetween('due_on', [b.fromOn, b.toOn])
      .update({ for_volunteers: true, version: trx.raw('version + 1'), updated_at: trx.fn.now() });
    return { id: h.id, fromOn: h.from_on, toOn: h.to_on, kinds: h.kinds, note: h.note, tasksHanded: handed };
  });
}

/** Cancels a handover: its plot's open tasks in the period come back to the holder unless another handover still covers them. */
export async function cancelHandover(db: Knex, opts: { handoverId: number; userId: number; now?: Date }): Promise<void> {
  await db.transaction(async (trx) => {
    const h = await trx('task_handovers').where({ id: opts.handoverId }).whereNull('cancelled_at').forUpdate().first();
    if (!h) throw notFound('The handover');
    await plotBookAccess(trx, { plotId: h.plot_id, userId: opts.userId, write: true, now: opts.now });
    await trx('task_handovers').where({ id: h.id }).update({ cancelled_at: trx.fn.now() });
    await trx('tasks')
      .where({ plot_id: h.plot_id, status: 'open', for_volunteers: true })
      .whereIn('kind', h.kinds)
      .whereBetween('due_on', [h.from_on, h.to_on])
      .whereNotExists(
        trx('task_handovers as o')
          .whereRaw('o.plot_id = tasks.plot_id')
          .whereNull('o.cancelled_at')
          .whereRaw('tasks.kind = any(o.kinds)')
          .whereRaw('tasks.due_on between o.from_on and o.to_on'),
      )
      .update({ for_volunteers: false, version: trx.raw('version + 1'), updated_at: trx.fn.now() });
  });
}

/**
 * The site's water: for each of the past weeks and this one, the need of every planting in the ground
 * (FAO-56 Kc × ET0, the bed factor), the rain logged and the deficit, in litres for the area planted;
 * and this week per plot.
 */
export async function waterSummary(db: Db, opts: { siteId: number; weeks: number; now?: Date }): Promise<WaterSummary> {
  const setup = await loadSiteTaskSetup(db, opts.siteId, opts.now);
  if (!setup) throw notFound('The site');
  const today = setup.ctx.today;
  const thisWeek = weekStartOf(today);
  const first = addCalendarDays(thisWeek, -7 * (opts.weeks - 1));
  const weather = await weatherBetween(db, opts.siteId, addCalendarDays(first, -7), addCalendarDays(thisWeek, 6));
  const ctx = { ...setup.ctx, weather };
  const plantings = (await loadTaskPlantings(db, setup)).filter((p) => p.status !== 'failed');
  const weeks: WaterSummary['weeks'] = [];
  for (let k = 0; k < opts.weeks; k++) {
    const weekStart = addCalendarDays(first, 7 * k);
    let area = 0;
    let need = 0;
    let deficit = 0;
    let litres = 0;
    for (const p of plantings) {
      const w = waterWeek(p, ctx, weekStart);
      if (!w) continue;
      area += p.areaM2;
      need += w.needMm * p.areaM2;
      deficit += w.deficitMm * p.areaM2;
      litres += w.deficitMm * p.areaM2;
    }
    let rain = 0;
    const methods: Record<string, number> = {};
    for (let on = weekStart; on <= addCalendarDays(weekStart, 6) && on <= today; on = addCalendarDays(on, 1)) {
      const day = weather.get(on) ?? null;
      rain += day?.rainMm ?? 0;
      const m = et0ForDay(day, ctx.site).method;
      methods[m] = (methods[m] ?? 0) + 1;
    }
    weeks.push({
      weekStart,
      needMm: area ? round1(need / area) : 0,
      rainMm: round1(rain),
      deficitMm: area ? round1(deficit / area) : 0,
      litres: Math.round(litres),
      methods,
    });
  }
  const byPlot = new Map<number, WaterSummary['plots'][number]>();
  for (const p of plantings) {
    const w = waterWeek(p, ctx, thisWeek);
    if (!w) continue;
    const row = byPlot.get(p.plotId) ?? { plotId: p.plotId, plotLabel: p.plotLabel, areaM2: 0, needMm: 0, rainMm: 0, deficitMm: 0, litres: 0, crops: [] };
    row.needMm += w.needMm * p.areaM2;
    row.deficitMm += w.deficitMm * p.areaM2;
    row.rainMm = Math.max(row.rainMm, w.rainMm);
    row.litres += w.deficitMm * p.areaM2;
    row.areaM2 += p.areaM2;
    if (!row.crops.includes(p.cropName)) row.crops.push(p.cropName);
    byPlot.set(p.plotId, row);
  }
  const plots = [...byPlot.values()]
    .map((r) => ({ ...r, areaM2: round1(r.areaM2), needMm: round1(r.needMm / r.areaM2), deficitMm: round1(r.deficitMm / r.areaM2), rainMm: round1(r.rainMm), litres: Math.round(r.litres) }))
    .sort((a, b) => a.plotLabel.localeCompare(b.plotLabel, 'en', { numeric: true }));
  return { today, units: setup.site.units, weeks, plots };
}

const round1 = (v: number) => Math.round(v * 10) / 10;
